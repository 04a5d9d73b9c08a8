/** One line of a derivation: what is computed, the formula, the numbers put in, and the result. */
export interface Step {
  /** What this step finds, in trade words (e.g. "Depth to stop"). */
  label: string;
  /** The formula in symbols (e.g. "h = L · sin α"). */
  formula: string;
  /** The formula with the numbers substituted (e.g. "h = 3.0000 · sin 5°"). */
  substituted: string;
  /** The result as decimal text at the reported resolution. */
  value: string;
  /** Unit of the value: "in", "mm", "°", "″", "in/ft", "blocks", or "" for pure numbers. */
  unit: string;
}

/** Why a calculation gave no answer: bad input (HTTP 400) or valid input that cannot be done (HTTP 422). */
export type FailureKind = 'invalid' | 'impossible';

/** A calculation that gave no answer, with a message per offending field. */
export interface CalcFailure {
  /** Always false. */
  ok: false;
  /** 'invalid' for malformed or out-of-range input, 'impossible' for valid input with no answer. */
  kind: FailureKind;
  /** One sentence naming the calculation, the first field and the reason. */
  error: string;
  /** Message per field path (e.g. `{"thickness": "must be greater than 0"}`); "body" for the whole request. */
  fields: Record<string, string>;
}

/** A calculation that gave an answer. */
export interface CalcSuccess<T> {
  /** Always true. */
  ok: true;
  /** The answer. */
  value: T;
}

/** What every calculation function returns: never throws on user input. */
export type CalcResult<T> = CalcSuccess<T> | CalcFailure;

/** Wraps an answer. */
export function succeed<T>(value: T): CalcSuccess<T> {
  return { ok: true, value };
}

/** Builds a failure whose `error` names the calculation, the first field and its message. */
export function fail(kind: FailureKind, area: string, fields: Record<string, string>): CalcFailure {
  const [first] = Object.entries(fields);
  const error = first ? `${area}: ${first[0] === 'body' ? '' : `${first[0]} `}${first[1]}` : `${area}: no answer`;
  return { ok: false, kind, error, fields };
}

/** A failure for bad input on one field. */
export function invalid(area: string, field: string, message: string): CalcFailure {
  return fail('invalid', area, { [field]: message });
}

/** A failure for valid input that has no answer, on one field. */
export function impossible(area: string, field: string, message: string): CalcFailure {
  return fail('impossible', area, { [field]: message });
}

/** Builds a step. */
export function step(label: string, formula: string, substituted: string, value: string, unit: string): Step {
  return { label, formula, substituted, value, unit };
}

/** True when any number or decimal text inside `value` is NaN or infinite. */
function hasNonFinite(value: unknown): boolean {
  if (typeof value === 'number') return !Number.isFinite(value);
  if (typeof value === 'string') return /^-?(NaN|Infinity)$/.test(value);
  if (Array.isArray(value)) return value.some(hasNonFinite);
  if (value && typeof value === 'object') return Object.values(value).some(hasNonFinite);
  return false;
}

/**
 * Runs a calculation so that it can never throw or leak NaN/Infinity: an unexpected exception or a
 * non-finite number anywhere in the answer becomes an 'impossible' failure naming the calculation.
 */
export function guarded<T>(area: string, run: () => CalcResult<T>): CalcResult<T> {
  try {
    const result = run();
    if (result.ok && hasNonFinite(result.value)) {
      return impossible(area, 'body', 'has no finite answer for these values');
    }
    return result;
  } catch (err) {
    const reason = err instanceof Error ? err.message : String(err);
    return impossible(area, 'body', `could not be calculated for these values (${reason})`);
  }
}

/** The step that counts a stack's blocks ("n = count of (0.850 + 0.132 + 0.1002)" = 3 blocks): a count, not a sum. */
export function blockCountStep(blocks: readonly string[], count = blocks.length): Step {
  return step('Fewest blocks', 'n = number of blocks in the stack', `n = count of (${blocks.join(' + ')})`, String(count), count === 1 ? 'block' : 'blocks');
}
