import { type Signal, computed } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import type { FormGroup, ValidatorFn } from '@angular/forms';
import { debounceTime, map } from 'rxjs';

import type { CalcResult } from '../../../shared/calc/step';
import { CALC_ERROR_KEY, type SortedMessages, applyControlErrors, failureMessages, waitingText } from './field-errors';

/** How long typing must pause before the page recomputes, in milliseconds. */
export const RECOMPUTE_DEBOUNCE_MS = 100;

/** A calculation kept up to date with a form. */
export interface LiveCalc<T, V = Record<string, unknown>> {
  /** The engine's latest answer or failure. */
  readonly result: Signal<CalcResult<T>>;
  /** The latest answer, or null while the inputs have a problem. */
  readonly value: Signal<T | null>;
  /** The latest failure's messages, sorted per control and for the whole form. */
  readonly messages: Signal<SortedMessages>;
  /** The form values the latest result was worked from. */
  readonly values: Signal<V>;
  /** What the results panel says while there is no answer: what to type, or to fix the marked inputs. */
  readonly emptyText: Signal<string>;
}

/** The results panel's line while an input is wrong. */
export const FIX_INPUTS_TEXT = 'Fix the highlighted inputs to see the results.';

/** Options of {@link liveCalc}. */
export interface LiveCalcOptions {
  /** Engine field path → control name, for fields the form holds under another name. */
  readonly aliases?: Readonly<Record<string, string>>;
  /** Pause after typing before recomputing (default {@link RECOMPUTE_DEBOUNCE_MS}). */
  readonly debounceMs?: number;
}

/**
 * Runs `run` on the form's raw value now and again after each pause in typing, puts the engine's
 * field messages on the controls (as the `calc` error) and exposes the outcome as signals.
 * The engine runs in the browser: no round trip. Call in an injection context (a field initializer).
 */
export function liveCalc<V, T>(form: FormGroup, run: (values: V) => CalcResult<T>, options: LiveCalcOptions = {}): LiveCalc<T, V> {
  const names = Object.keys(form.controls);
  // The latest messages also act as a validator, so a control that (re)validates later keeps its
  // message: a field shown by @if, or bound after the first answer, validates on binding.
  let latest: Readonly<Record<string, string>> = {};
  for (const name of names) {
    const keepMessage: ValidatorFn = () => (latest[name] ? { [CALC_ERROR_KEY]: latest[name] } : null);
    form.controls[name].addValidators(keepMessage);
  }
  const evaluate = (): { result: CalcResult<T>; messages: SortedMessages; values: V } => {
    markRecompute('start');
    const values = form.getRawValue() as V;
    const result = run(values);
    const messages = failureMessages(result.ok ? null : result, names, options.aliases);
    latest = messages.controls;
    applyControlErrors(form.controls, messages.controls);
    markRecompute('end');
    return { result, messages, values };
  };
  const outcome = toSignal(
    form.valueChanges.pipe(
      debounceTime(options.debounceMs ?? RECOMPUTE_DEBOUNCE_MS),
      map(() => evaluate()),
    ),
    { initialValue: evaluate() },
  );
  const result = computed(() => outcome().result);
  return {
    result,
    value: computed(() => {
      const r = result();
      return r.ok ? r.value : null;
    }),
    messages: computed(() => outcome().messages),
    values: computed(() => outcome().values),
    emptyText: computed(() => waitingText(outcome().messages, form.controls) ?? FIX_INPUTS_TEXT),
  };
}

/**
 * Marks the start and end of a recompute with the Performance API ("sw-recompute" measure), so
 * the time from keystroke to answer can be read in the browser; a no-op where it is missing.
 */
function markRecompute(at: 'start' | 'end'): void {
  if (typeof performance === 'undefined' || typeof performance.mark !== 'function' || typeof performance.measure !== 'function') return;
  if (at === 'start') performance.mark('sw-recompute-start');
  else performance.measure('sw-recompute', 'sw-recompute-start');
}
