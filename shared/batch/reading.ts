import { Dec } from '../calc/decimal-math';
import type { SetupCheck } from '../api/setup';

/** Most digits a reading may have before and after the decimal point. */
export const READING_DIGITS = 6;

/** A reading as typed, read as a decimal: the normalised text, or why it cannot be one. */
export type ReadingText = { ok: true; text: string } | { ok: false; problem: 'not-a-number' | 'too-long' };

/** A number as written at the bench: an optional sign, then "0.585", ".585", "5." or "5". */
const WRITTEN = /^([+-]?)(\d*)(?:\.(\d*))?$/;

/**
 * Reads a typed reading the way the calculators do: a leading "+" and a missing leading zero are
 * accepted (".585" → "0.585", "+0.5854" → "0.5854", "5." → "5"). Digits are kept as written, so
 * "0.5850" stays "0.5850"; "-0" stays "-0" (the plausibility check then names it). At most
 * {@link READING_DIGITS} digits before and after the point: a longer number is "too long".
 */
export function readReading(raw: string): ReadingText {
  const match = WRITTEN.exec(raw.trim());
  const whole = match?.[2] ?? '';
  const fraction = match?.[3] ?? '';
  if (!match || (whole === '' && fraction === '')) return { ok: false, problem: 'not-a-number' };
  if (whole.length > READING_DIGITS || fraction.length > READING_DIGITS) return { ok: false, problem: 'too-long' };
  const sign = match[1] === '-' ? '-' : '';
  return { ok: true, text: `${sign}${whole === '' ? '0' : whole}${fraction === '' ? '' : `.${fraction}`}` };
}

/** The message for a reading that {@link readReading} refused, naming the field in words. */
export function readingProblem(what: string, problem: 'not-a-number' | 'too-long', example: string): string {
  return problem === 'too-long'
    ? `${what} is too long: a reading has at most ${READING_DIGITS} digits before and ${READING_DIGITS} after the decimal point.`
    : `${what} must be a decimal number such as ${example}.`;
}

/**
 * How far from the nominal a reading may lie before it is taken for a slip (a missing or misplaced
 * decimal point, a reading of another check): half the nominal, or ten times the tolerance band
 * (plus + minus) when that is wider. 0 means the check has no such limit (nominal 0 and no band).
 * Common practice, not a standard: a part half its nominal off is no longer the same part, and a
 * decimal-point slip is at least ten times off.
 */
export function plausibleDistance(check: SetupCheck): Dec {
  const half = new Dec(check.nominal).abs().div(2);
  const bands = new Dec(check.plus).plus(check.minus).abs().times(10);
  return Dec.max(half, bands);
}

/** Whether a (normalised) reading lies implausibly far from its check's nominal: see {@link plausibleDistance}. */
export function farFromNominal(check: SetupCheck, text: string): boolean {
  const limit = plausibleDistance(check);
  return limit.gt(0) && new Dec(text).minus(check.nominal).abs().gt(limit);
}

/** The message for a reading far from its nominal. */
export function farMessage(check: SetupCheck, text: string): string {
  return `${check.label} ${text} is far from the nominal ${check.nominal} ${check.unit}: check the decimal point. If the reading is right, confirm it to record it anyway.`;
}
