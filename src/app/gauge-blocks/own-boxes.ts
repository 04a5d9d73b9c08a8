import { HttpClient, HttpErrorResponse, HttpParams } from '@angular/common/http';
import { DestroyRef, type Signal, type WritableSignal, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { FormControl } from '@angular/forms';
import { ActivatedRoute } from '@angular/router';
import { type Observable, catchError, combineLatest, distinctUntilChanged, map, of, startWith, switchMap } from 'rxjs';

import type { InventoryListDto, InventorySetDto } from '../../../shared/api/inventory';
import type { GaugeStackResult } from '../../../shared/calc/gauge-stack';
import type { LengthUnit } from '../../../shared/units/length-unit';
import { apiErrorMessage, apiFieldErrors, quietErrors } from '../core/api-error';
import { Auth } from '../core/auth';
import { boxIdOf } from '../../../shared/forms/gauge-blocks-form';
import { findGaugeSet } from '../../../shared/data/gauge-sets';

/**
 * The set picker's value for one of the team's own gauge-block sets: `box:<id>`. Standard sets
 * keep their id (`inch-81`), so a bookmarked URL or saved set-up says which kind it is.
 */
export const BOX_PREFIX = 'box:';

export { boxIdOf };

/** The picker value of a team's set. */
export function boxValue(id: number): string {
  return `${BOX_PREFIX}${id}`;
}

/** A team's set as the picker lists it. */
export interface OwnBox {
  readonly id: number;
  /** Picker value, `box:<id>`. */
  readonly value: string;
  /** "Our box: <name>". */
  readonly label: string;
  readonly name: string;
  readonly unit: LengthUnit;
  /** Standard composition it started from, or null. */
  readonly standardSet: string | null;
  readonly grade: string | null;
  /** Wear-block size when the box keeps a pair, else null. */
  readonly wearBlockSize: string | null;
  /** "79 of 81 blocks usable (1 missing, 1 damaged)". */
  readonly notes: string;
  /** Whether no block of the box is marked missing or damaged. */
  readonly allUsable: boolean;
}

/** A team's gauge-block set (list summary) → picker entry; null for a set not in inch or mm. */
export function toOwnBox(s: InventorySetDto): OwnBox | null {
  if (s.unit !== 'in' && s.unit !== 'mm') return null;
  const t = s.totals;
  const out = [t.missing ? `${t.missing} missing` : '', t.damaged ? `${t.damaged} damaged` : ''].filter((x) => x !== '').join(', ');
  return {
    id: s.id,
    value: boxValue(s.id),
    label: `Our box: ${s.name}`,
    name: s.name,
    unit: s.unit,
    standardSet: s.standardSet,
    grade: s.grade,
    wearBlockSize: s.wearBlockSize && s.wearBlockCount >= 2 ? s.wearBlockSize : null,
    notes: `${t.available} of ${t.blocks} blocks usable${out ? ` (${out})` : ''}`,
    allUsable: t.missing + t.damaged === 0,
  };
}

/** Why a named team box is not used, and what is shown instead. */
export function replacedBoxText(boxId: number, signedIn: boolean, instead: string | null, what: 'gauge-block' | 'angle-block' = 'gauge-block'): string {
  const other = what === 'gauge-block' ? ', or is in the other unit' : '';
  const why = signedIn
    ? `The ${what} box this page was opened with (no. ${boxId}) is not in your team's inventory: it was deleted${other ? ',' : ' or'} belongs to another team${other}.`
    : `This page was opened with a team's ${what} box (no. ${boxId}): sign in to use it.`;
  const result = what === 'gauge-block' ? 'The stack below is' : 'The blocks below are';
  return instead ? `${why} ${result} worked out from the ${instead} instead.` : `${why} No set is chosen instead: pick one.`;
}

/** A block size the inventory leaves out of the solve. */
export interface ExcludedBlock {
  readonly size: string;
  readonly missing: number;
  readonly damaged: number;
}

/** Answer of GET /api/inventories/gauge-sets/:id/stack: the engine's answer plus the box and what was left out. */
export interface BoxStackAnswer extends GaugeStackResult {
  readonly inventory: { readonly id: number; readonly name: string; readonly version: number };
  readonly excluded: readonly ExcludedBlock[];
}

/** What to ask the inventory route. */
export interface BoxStackQuery {
  readonly setId: number;
  /** Target length as typed (already checked). */
  readonly target: string;
  /** Wring the box's wear-block pair to both ends. */
  readonly wear: boolean;
  /** Grade for the tolerance; absent: the box's own grade. */
  readonly grade?: string;
}

/** Where a stack from the box stands. `answer` while loading is the previous one, so the drawing does not flicker. */
export type BoxStackState =
  | { readonly status: 'idle' }
  | { readonly status: 'loading'; readonly query: BoxStackQuery; readonly answer: BoxStackAnswer | null }
  | { readonly status: 'done'; readonly query: BoxStackQuery; readonly answer: BoxStackAnswer }
  | {
      readonly status: 'failed';
      readonly query: BoxStackQuery;
      readonly message: string;
      readonly excluded: readonly ExcludedBlock[];
      /** The query field the route refused (target, wearBlocks, grade), or null. */
      readonly field: string | null;
    };

/** Readable names of the route's query fields, for its messages. */
const FIELD_NAMES: Readonly<Record<string, string>> = { target: 'Stack length', wearBlocks: 'Wear blocks', grade: 'Grade', angle: 'Angle', blocks: 'Blocks' };

/** A failed stack request as one sentence naming the field (the route answers 400/422 with `fields`). */
export function boxFailureMessage(err: unknown): string {
  const fields = Object.entries(apiFieldErrors(err));
  if (fields.length > 0) {
    const [name, message] = fields[0];
    const text = `${FIELD_NAMES[name] ?? name} ${message}`;
    return text.endsWith('.') ? text : `${text}.`;
  }
  return apiErrorMessage(err);
}

/** The blocks left out, as a note: "0.1007 in (1 missing), 0.137 in (1 damaged)". */
export function excludedNote(excluded: readonly ExcludedBlock[], unit: string): string {
  return excluded
    .map((b) => {
      const why = [b.missing ? `${b.missing} missing` : '', b.damaged ? `${b.damaged} damaged` : ''].filter((x) => x !== '').join(', ');
      return `${b.size} ${unit} (${why})`;
    })
    .join('; ');
}

/** GET /api/inventories/gauge-sets/:id/stack for a query. */
export function requestBoxStack(http: HttpClient, q: BoxStackQuery): Observable<BoxStackAnswer> {
  let params = new HttpParams().set('target', q.target).set('wear', q.wear ? 'yes' : 'no');
  if (q.grade) params = params.set('grade', q.grade);
  return http.get<BoxStackAnswer>(`/api/inventories/gauge-sets/${q.setId}/stack`, { params, context: quietErrors() });
}

/**
 * The stack from the box for a query signal: each new query (the query comes from the page's
 * debounced recompute) asks the inventory route, and switchMap drops the answer of a request a
 * newer query has overtaken. Call in an injection context.
 */
export function boxStackState(query: Signal<BoxStackQuery | null>): Signal<BoxStackState> {
  const http = inject(HttpClient);
  let last: BoxStackAnswer | null = null;
  const state$ = toObservable(query).pipe(
    distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
    switchMap((q): Observable<BoxStackState> => {
      if (!q) return of({ status: 'idle' });
      return requestBoxStack(http, q).pipe(
        map((answer): BoxStackState => {
          last = answer;
          return { status: 'done', query: q, answer };
        }),
        catchError((err: unknown) =>
          of<BoxStackState>({ status: 'failed', query: q, message: boxFailureMessage(err), excluded: excludedOf(err), field: Object.keys(apiFieldErrors(err))[0] ?? null }),
        ),
        startWith<BoxStackState>({ status: 'loading', query: q, answer: last }),
      );
    }),
  );
  return toSignal(state$, { initialValue: { status: 'idle' } });
}

/** The `excluded` list a failed stack answer still carries. */
function excludedOf(err: unknown): readonly ExcludedBlock[] {
  if (!(err instanceof HttpErrorResponse)) return [];
  const body: unknown = err.error;
  const list = typeof body === 'object' && body !== null ? (body as { excluded?: unknown }).excluded : undefined;
  return Array.isArray(list) ? (list as ExcludedBlock[]) : [];
}

/**
 * The signed-in team's gauge-block sets for a set picker, kept in step with the set control:
 * - signed in: GET /api/inventories, and the team's first set in the unit becomes the choice,
 *   unless the URL or a saved set-up named a set or the user already picked one;
 * - a `box:<id>` choice that is not (or no longer) the team's — signed out, another team's
 *   link — falls back to `fallback(unit)`, a standard set.
 *   `replaced` then says so, naming the set shown instead, so a set-up or link that named a box is
 *   never silently answered from another set.
 * Anonymous visitors never cause a request. Call in an injection context, after bindQueryState.
 */
export function bindOwnBoxes(
  setControl: FormControl<string>,
  unit: Signal<LengthUnit>,
  fallback: (unit: LengthUnit) => string,
  replaced?: WritableSignal<string | null>,
): Signal<readonly OwnBox[]> {
  const auth = inject(Auth);
  const http = inject(HttpClient);
  const route = inject(ActivatedRoute);
  const destroyRef = inject(DestroyRef);
  const named = route.snapshot.queryParamMap.has('set') || route.snapshot.queryParamMap.has('setup');
  let defaulted = false;

  // null: not known yet (auth still loading, or the list on its way).
  const list$ = combineLatest([toObservable(auth.user), toObservable(auth.loaded)]).pipe(
    map(([user, loaded]) => (user ? user.id : loaded ? 0 : null)),
    distinctUntilChanged(),
    switchMap((who): Observable<readonly OwnBox[] | null> => {
      if (who === null) return of(null);
      if (who === 0) return of([]);
      return http.get<InventoryListDto>('/api/inventories', { context: quietErrors() }).pipe(
        map((l) => l.gaugeSets.map(toOwnBox).filter((b): b is OwnBox => b !== null)),
        catchError(() => of<readonly OwnBox[]>([])),
        startWith(null),
      );
    }),
  );
  const boxes = signal<readonly OwnBox[] | null>(null);
  // The set shown in place of a box that could not be used; choosing any other set ends the note.
  let shownInstead: string | null = null;
  if (replaced) {
    setControl.valueChanges.pipe(takeUntilDestroyed(destroyRef)).subscribe((value) => {
      if (shownInstead !== null && value !== shownInstead) {
        shownInstead = null;
        replaced.set(null);
      }
    });
  }

  list$.pipe(takeUntilDestroyed(destroyRef)).subscribe((list) => {
    boxes.set(list);
    if (list === null) return;
    const chosen = boxIdOf(setControl.value);
    if (chosen !== null && !list.some((b) => b.id === chosen && b.unit === unit())) {
      const instead = fallback(unit());
      shownInstead = instead;
      setControl.setValue(instead);
      replaced?.set(replacedBoxText(chosen, auth.user() !== null, findGaugeSet(instead)?.name ?? null));
      return;
    }
    if (!defaulted && !named && !setControl.dirty && chosen === null) {
      const first = list.find((b) => b.unit === unit());
      if (first) setControl.setValue(first.value);
    }
    defaulted = true;
  });

  return computed(() => boxes() ?? []);
}
