import { parseAngle } from '../angle/angle-text';
import { Dec } from '../calc/decimal-math';
import type { Step } from '../calc/step';
import type { ExerciseType } from './exercise-types';

/** What kind of number an answer is, which decides how typed text is read. */
export type AnswerKind = 'length' | 'angle' | 'count';

/** A value given in a problem. */
export interface Given {
  /** Trade name of the value, e.g. "Taper length L". */
  label: string;
  /** The value as printed (decimal text or DMS). */
  value: string;
  /** Unit ("in", "mm", "°", "in/ft", or ""). */
  unit: string;
}

/** A generated problem with its answer, worked solution and tolerance. Pure data, reproducible from type + seed. */
export interface Exercise {
  type: ExerciseType;
  seed: number;
  /** Short name of the exercise type. */
  title: string;
  /** The question, in shop words. */
  prompt: string;
  givens: Given[];
  /** What to type, e.g. "Depth to stop h". */
  answerLabel: string;
  answerKind: AnswerKind;
  /** Unit of the answer ("in", "mm", "°", "blocks"). */
  unit: string;
  /** The answer at the unit's resolution, as the engine reports it. */
  answer: string;
  /** The answer to full precision, which typed answers are checked against. */
  exact: string;
  /** Accepted distance from `exact`, in `unit`. */
  tolerance: string;
  /** The engine's derivation up to and including the step that gives the answer. */
  steps: Step[];
  /** Safety cautions for the set-up, when the work can hurt someone. */
  cautions: string[];
}

/** The outcome of checking typed text against an exercise. */
export type CheckResult =
  | { ok: true; correct: boolean; given: string; difference: string }
  | { ok: false; error: string };

const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

/** The units an answer may be typed with, by the problem's unit. */
const UNIT_NAMES: Readonly<Record<string, readonly string[]>> = { in: ['in', 'inch', 'inches', '"'], mm: ['mm'], blocks: ['block', 'blocks'] };
/** A unit typed after the number, with the abbreviation's period if any ("0.2615 in."). */
const TYPED_UNIT = /^(.*?)\s*(in|inch(?:es)?|mm|blocks?|")\.?$/i;
/** What to say when an answer comes in another unit, by the problem's unit. */
const ANSWER_IN: Readonly<Record<string, string>> = {
  in: 'Answer in inches (in), or as a plain number.',
  mm: 'Answer in millimetres (mm), or as a plain number.',
  blocks: 'Answer with the number of blocks, e.g. 4.',
};

/**
 * Reads typed text as a number of the answer's kind (angles also as DMS, e.g. 7°30'). A unit typed
 * after a length or count must be the problem's own (`unit`): "0.2993 mm" is no answer to a
 * problem in inches, and costs no attempt. `number` is the answer without its unit.
 */
export function readAnswer(kind: AnswerKind, text: string, unit = ''): { ok: true; value: Dec; number: string } | { ok: false; error: string } {
  // A comma as the decimal mark, and the typographic minus (−) as a plain one.
  const trimmed = text.trim().replace(/,/g, '.').replace(/\u2212/g, '-');
  if (trimmed === '') return { ok: false, error: 'Type your answer.' };
  if (kind === 'angle') {
    const parsed = parseAngle(trimmed);
    return parsed.ok ? { ok: true, value: parsed.degrees, number: text.trim() } : { ok: false, error: `The angle ${parsed.error}.` };
  }
  const typed = TYPED_UNIT.exec(trimmed);
  const number = typed && typed[1] !== '' ? typed[1]! : trimmed;
  if (typed && typed[1] !== '' && unit !== '' && !(UNIT_NAMES[unit] ?? [unit]).includes(typed[2]!.toLowerCase())) {
    return { ok: false, error: ANSWER_IN[unit] ?? `Answer in ${unit}, or as a plain number.` };
  }
  if (!DECIMAL.test(number)) return { ok: false, error: `Type a number such as ${kind === 'count' ? '4' : '0.2615'}.` };
  return { ok: true, value: new Dec(number), number };
}

/** The note for a minus sign on an answer that is never negative (no try is spent on it). */
const NEVER_NEGATIVE: Readonly<Record<AnswerKind, string>> = {
  length: 'A length is never negative: type it without the minus sign.',
  count: 'A count is never negative: type it without the minus sign.',
  angle: 'This angle is never negative: type it without the minus sign.',
};

/**
 * Checks an answer: correct when it lies within the stated tolerance of the exact answer.
 * Unreadable text — or a unit other than the problem's — is not an answer at all (ok: false),
 * so it never costs an attempt. `given` is the answer as typed, without its unit.
 */
export function checkAnswer(exercise: Exercise, text: string): CheckResult {
  const read = readAnswer(exercise.answerKind, text, exercise.unit);
  if (!read.ok) return read;
  const exact = new Dec(exercise.exact);
  const difference = read.value.minus(exact).abs();
  const correct = difference.lte(new Dec(exercise.tolerance));
  // Slips a patient teacher points out rather than marks: a minus sign on a size or an angle whose
  // answer cannot be negative, or the right answer rounded too soon.
  if (!correct && read.value.isNegative() && !exact.isNegative()) return { ok: false, error: NEVER_NEGATIVE[exercise.answerKind] };
  if (!correct && exercise.answerKind !== 'angle') {
    const typedPlaces = (read.number.split('.')[1] ?? '').length;
    const answerPlaces = (exercise.answer.split('.')[1] ?? '').length;
    if (exercise.answerKind === 'length' && typedPlaces >= 1 && typedPlaces < answerPlaces && exact.toDecimalPlaces(typedPlaces).eq(read.value)) {
      return {
        ok: false,
        error: `Close: that is the answer rounded to ${typedPlaces} decimal${typedPlaces === 1 ? '' : 's'}. Carry it to ${answerPlaces} decimals; it is checked to ±${exercise.tolerance} ${exercise.unit}.`,
      };
    }
  }
  return { ok: true, correct, given: read.number, difference: difference.toSignificantDigits(6).toString() };
}

/**
 * The hints of an exercise: the derivation one step at a time. The last step (the one that gives
 * the answer) keeps its formula and substitution but hides its value.
 */
export function hintsOf(exercise: Exercise): Step[] {
  return exercise.steps.map((s, i) => (i === exercise.steps.length - 1 ? { ...s, value: '?' } : s));
}
