import { DestroyRef, type Signal, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { FormGroup } from '@angular/forms';
import { ActivatedRoute, type Params, Router } from '@angular/router';
import { debounceTime, distinctUntilChanged, map } from 'rxjs';

import type { SetupKind } from '../../../shared/api/setup';
import { apiErrorMessage } from '../core/api-error';
import { SetupsApi } from './setups-api';
import { savedFormFields } from '../../../shared/library/saved-request';

/** The query parameter that names a saved set-up to open into the page. */
export const SETUP_PARAM = 'setup';

/** How long the URL waits after the last change before it is rewritten, in milliseconds. */
const URL_DEBOUNCE_MS = 300;

/** Longest text a query parameter may put into a control (longer values are ignored). */
const MAX_PARAM_LENGTH = 2_000;

/** The set-up a page was opened with. */
export interface OpenedSetup {
  /** Set-up id. */
  readonly id: number;
  /** Its name. */
  readonly name: string;
}

/** What {@link bindQueryState} exposes to the page. */
export interface QueryState {
  /** The saved set-up loaded through `?setup=<id>`, once loaded. */
  readonly openedSetup: Signal<OpenedSetup | null>;
  /** Why `?setup=<id>` could not be opened, or null. */
  readonly setupError: Signal<string | null>;
}

/**
 * The values of `params` that name controls of the form, as text: numbers and booleans become
 * text, anything else (arrays, objects, over-long text) is left out.
 */
export function pickControlValues(params: Readonly<Record<string, unknown>>, controlNames: readonly string[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const name of controlNames) {
    const value = params[name];
    if (typeof value === 'string' && value.length <= MAX_PARAM_LENGTH) out[name] = value;
    else if (typeof value === 'number' && Number.isFinite(value)) out[name] = String(value);
    else if (typeof value === 'boolean') out[name] = String(value);
  }
  return out;
}

/** The form's values as query parameters: empty controls are left out (null removes them). */
export function toQueryParams(values: Readonly<Record<string, unknown>>): Params {
  const params: Params = {};
  for (const [name, value] of Object.entries(values)) {
    params[name] = value === '' || value === null || value === undefined ? null : String(value);
  }
  return params;
}

/**
 * Keeps a form's values in the URL query so a set-up can be bookmarked or shared: restores them
 * on load, then rewrites the query (replacing the history entry) after each pause in editing.
 * With `?setup=<id>` the saved set-up is loaded into the form instead; the parameter stays in
 * the URL until the values are edited. Call in an injection context, before `liveCalc`.
 */
export function bindQueryState(form: FormGroup, kind: SetupKind): QueryState {
  const router = inject(Router);
  const route = inject(ActivatedRoute);
  const setups = inject(SetupsApi);
  const destroyRef = inject(DestroyRef);
  const names = Object.keys(form.controls);
  const openedSetup = signal<OpenedSetup | null>(null);
  const setupError = signal<string | null>(null);

  const query = route.snapshot.queryParamMap;
  const fromUrl: Record<string, unknown> = {};
  for (const key of query.keys) fromUrl[key] = query.get(key);
  form.patchValue(pickControlValues(fromUrl, names));

  let loadedJson: string | null = null;
  let currentSetupParam: string | null = null;
  const openSetup = (setupId: string): void => {
    setupError.set(null);
    if (!/^[1-9]\d{0,9}$/.test(setupId)) {
      setupError.set(`"${setupId}" is not a set-up number.`);
      return;
    }
    setups
      .get(Number(setupId))
      .pipe(takeUntilDestroyed(destroyRef))
      .subscribe({
        next: (setup) => {
          if (setup.kind !== kind) {
            setupError.set(`Set-up “${setup.name}” belongs to another area (${setup.kind}); open it from its own page.`);
            return;
          }
          // A form saved from this page as it is; engine-shaped inputs (API, import) in the page's fields.
          form.patchValue(pickControlValues(savedFormFields(kind, setup.inputs), names));
          loadedJson = JSON.stringify(form.getRawValue());
          openedSetup.set({ id: setup.id, name: setup.name });
        },
        error: (err: unknown) => setupError.set(`Set-up ${setupId} could not be opened: ${apiErrorMessage(err)}`),
      });
  };
  // The same page stays on screen when only the query changes ("Open" after saving), so listen.
  route.queryParamMap
    .pipe(map((params) => params.get(SETUP_PARAM)), distinctUntilChanged(), takeUntilDestroyed(destroyRef))
    .subscribe((setupId) => {
      if (setupId !== null && setupId !== currentSetupParam) openSetup(setupId);
      currentSetupParam = setupId;
    });

  form.valueChanges.pipe(debounceTime(URL_DEBOUNCE_MS), takeUntilDestroyed(destroyRef)).subscribe(() => {
    const values = form.getRawValue() as Record<string, unknown>;
    const keepSetup = loadedJson !== null && JSON.stringify(values) === loadedJson;
    if (!keepSetup && loadedJson !== null) {
      loadedJson = null;
      openedSetup.set(null);
    }
    const params = toQueryParams(values);
    params[SETUP_PARAM] = keepSetup ? currentSetupParam : null;
    void router.navigate([], { relativeTo: route, queryParams: params, queryParamsHandling: 'merge', replaceUrl: true });
  });

  return { openedSetup: openedSetup.asReadonly(), setupError: setupError.asReadonly() };
}
