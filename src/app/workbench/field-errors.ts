import type { AbstractControl } from '@angular/forms';
import type { z } from 'zod';

import type { CalcFailure } from '../../../shared/calc/step';
import { labelOf } from '../../../shared/forms/form-text';

/** The error key a control carries when the shared schema or engine refused its value. */
export const CALC_ERROR_KEY = 'calc';

/** Messages of a failed calculation sorted into per-control messages and whole-form messages. */
export interface SortedMessages {
  /** Message per control name, first letter capitalised ("Must be greater than 0"). */
  readonly controls: Readonly<Record<string, string>>;
  /** Messages about the form as a whole, or about fields the form has no control for. */
  readonly general: readonly string[];
}

/** Capitalises the first letter of a message for showing on its own under a field. */
export function sentence(message: string): string {
  return message ? message[0].toUpperCase() + message.slice(1) : message;
}

/** An engine field path in words: "wearBlocks" → "Wear blocks", "missing.0" → "Missing 1". */
export function fieldWords(path: string): string {
  return labelOf(path.replace(/\.(\d+)/g, (_m, n: string) => ` ${Number(n) + 1}`).replace(/\./g, ' '));
}

/**
 * Sorts the `fields` of a calculation failure into messages per control. `aliases` maps an engine
 * field path (e.g. "removedAtEnd") onto the control that holds it (e.g. "endThickness"); paths
 * with no control become general messages naming the field.
 */
export function sortFieldMessages(
  fields: Readonly<Record<string, string>>,
  controlNames: readonly string[],
  aliases: Readonly<Record<string, string>> = {},
): SortedMessages {
  const controls: Record<string, string> = {};
  const general: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const name = aliases[path] ?? path;
    const top = name.split('.')[0];
    if (controlNames.includes(name)) controls[name] ??= sentence(message);
    else if (controlNames.includes(top)) controls[top] ??= sentence(message);
    else general.push(path === 'body' || path === '_' ? sentence(message) : `${fieldWords(path)} ${message}`);
  }
  return { controls, general };
}

/** Per-field messages of a zod error from one of the shared schemas ({path: first message}). */
export function zodFieldMessages(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : 'body';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** The messages of a failure (or none for a success), sorted for a form's controls. */
export function failureMessages(
  failure: CalcFailure | null,
  controlNames: readonly string[],
  aliases: Readonly<Record<string, string>> = {},
): SortedMessages {
  if (!failure) return { controls: {}, general: [] };
  const sorted = sortFieldMessages(failure.fields, controlNames, aliases);
  // An answer refused with no field named still needs a visible reason.
  if (!Object.keys(sorted.controls).length && !sorted.general.length) return { controls: {}, general: [failure.error] };
  return sorted;
}

/** Whether a control message only says the field is still empty ("Is required: type …"). */
export function isEmptyFieldMessage(message: string): boolean {
  return /^Is required\b/.test(message);
}

/**
 * The line the results show while the only thing missing is a field not typed in yet (one a
 * mode switch has just shown): what to type, not a red mark. Null when an input is wrong.
 */
export function waitingText(messages: SortedMessages, controls: Readonly<Record<string, AbstractControl>>): string | null {
  const entries = Object.entries(messages.controls);
  if (messages.general.length > 0 || entries.length === 0) return null;
  if (!entries.every(([name, message]) => isEmptyFieldMessage(message) && controls[name]?.pristine)) return null;
  const [, first] = entries[0]!;
  const what = /^Is required: (type .+)$/.exec(first)?.[1];
  return what ? `${sentence(what)} to see the results.` : 'Fill in the empty inputs to see the results.';
}

/**
 * Puts each message on its control as the `calc` error (so `<mat-error>` shows it) and clears
 * the `calc` error of every other control. Status changes only: no value change is emitted. A
 * field only empty and never typed in is not marked touched, so it is not shown red before the
 * machinist has had a chance to fill it.
 */
export function applyControlErrors(
  controls: Readonly<Record<string, AbstractControl>>,
  messages: Readonly<Record<string, string>>,
): void {
  for (const [name, control] of Object.entries(controls)) {
    const message = messages[name];
    const others = { ...(control.errors ?? {}) };
    delete others[CALC_ERROR_KEY];
    const next = message ? { ...others, [CALC_ERROR_KEY]: message } : others;
    control.setErrors(Object.keys(next).length ? next : null);
    if (message && !(isEmptyFieldMessage(message) && control.pristine)) control.markAsTouched();
  }
}

/** The `calc` message on a control, or null. */
export function controlMessage(control: AbstractControl): string | null {
  const message: unknown = control.getError(CALC_ERROR_KEY);
  return typeof message === 'string' ? message : null;
}
