/**
 * What the pins-and-rolls page sends to the engine for each kind of measurement, and how it puts
 * the answers together: the reading to cut to, or (from a measured reading) the width or depth
 * the work has now and how much is left to cut. The engine (shared/calc/over-pins) does the
 * trigonometry; this file only picks fields, renames them for the form and subtracts readings.
 */
import { type OverPinsResult, calculateOverPins } from '../../../shared/calc/over-pins';
import { Dec } from '../../../shared/calc/decimal-math';
import { type CalcFailure, type CalcResult, type Step, invalid, step, succeed } from '../../../shared/calc/step';
import { formatLength } from '../../../shared/units/length-unit';
import { type PinsRollsForm, checkReadingRequest, overPinsRequest } from '../../../shared/forms/pins-rolls-form';

export type { DiscGiven, DovetailSide, PinsRollsForm, RollKind, RollMode } from '../../../shared/forms/pins-rolls-form';

/**
 * Default set-up: the 60° dovetail slide checked over 0.375 in rolls, and a worked example for every
 * other kind. The dovetail's measured reading starts empty: a made-up reading would be taken for
 * the work's, and one over male rolls means nothing between female ones.
 */
export const PINS_DEFAULTS: PinsRollsForm = {
  unit: 'in',
  kind: 'dovetail',
  mode: 'cut',
  side: 'male',
  angle: '60',
  rollDiameter: '0.375',
  width: '1.250',
  depth: '0.375',
  reading: '',
  includedAngle: '90',
  pinDiameter: '0.500',
  grooveWidth: '1.000',
  pinHeight: '0.1200',
  rollDiameter1: '0.375',
  measurement1: '2.2745',
  rollDiameter2: '0.500',
  measurement2: '2.6160',
  lowerReading: '1.2500',
  upperReading: '1.1500',
  heightDifference: '2.000',
  largeDisc: '1.000',
  smallDisc: '0.500',
  discGiven: 'centreDistance',
  centreDistance: '3.000',
  discTaperPerFoot: '2.000',
  discAngle: '9',
  reference: 'axis',
  largeBall: '1.000',
  smallBall: '0.500',
  largeBallDepth: '0.250',
  smallBallDepth: '2.000',
};

/** Every control holding a length (converted by the unit toggle). */
export const LENGTH_CONTROLS = [
  'rollDiameter', 'width', 'depth', 'reading', 'pinDiameter', 'grooveWidth', 'pinHeight', 'rollDiameter1', 'measurement1', 'rollDiameter2',
  'measurement2', 'lowerReading', 'upperReading', 'heightDifference', 'largeDisc', 'smallDisc', 'centreDistance', 'largeBall', 'smallBall',
  'largeBallDepth', 'smallBallDepth',
] as const;

/** The page's answer: the engine's result and, from a measured reading, what is left to cut. */
export interface PinsOutcome {
  /** The engine's answer for the typed values (in check mode: worked back from the reading). */
  readonly main: OverPinsResult;
  /** Check mode with a drawing size: the engine's answer for that size (the reading to stop at). */
  readonly target?: OverPinsResult;
  /** Check mode with a drawing size: how much is left, as text at the unit's resolution (negative: cut past it). */
  readonly left?: string;
  /** Every step, in order. */
  readonly steps: readonly Step[];
  /** Every warning, in order. */
  readonly warnings: readonly string[];
}

/** Renames a failure's engine field names to the form's control names. */
function renamed(result: CalcFailure, names: Readonly<Record<string, string>>): CalcFailure {
  const fields: Record<string, string> = {};
  for (const [key, message] of Object.entries(result.fields)) fields[names[key] ?? key] = message;
  return { ...result, fields };
}

/** Runs the engine and renames the fields of a refusal. */
function run(request: Record<string, unknown>, names: Readonly<Record<string, string>> = {}): CalcResult<OverPinsResult> {
  const result = calculateOverPins(request);
  return result.ok ? result : renamed(result, names);
}

function single(result: CalcResult<OverPinsResult>): CalcResult<PinsOutcome> {
  return result.ok ? succeed({ main: result.value, steps: result.value.steps, warnings: result.value.warnings }) : result;
}

/**
 * From a measured reading back to the work as it is now, and (with the drawing size) the reading to
 * stop at and what is left: for a male dovetail x falls as the width does, for a female one y rises;
 * a pin in a V sits lower as the V is cut deeper, by the depth cut (derived from REFERENCE.md §5).
 */
function check(v: PinsRollsForm): CalcResult<PinsOutcome> {
  const dovetail = v.kind === 'dovetail';
  const readingControl = dovetail ? 'reading' : 'pinHeight';
  const sizeControl = dovetail ? 'width' : 'grooveWidth';
  if (!(dovetail ? v.reading : v.pinHeight).trim()) return invalid('Over pins', readingControl, 'is required: type the reading you measured');
  const reading = checkReadingRequest(v);
  const now = run(reading, { measurement: readingControl, width: readingControl, grooveWidth: readingControl });
  if (!now.ok) return now;
  const size = dovetail ? v.width : v.grooveWidth;
  if (!size.trim()) return single(now);
  const { measurement: _reading, ...base } = reading;
  const target = run({ ...base, [sizeControl]: size }, { measurement: sizeControl, rollDiameter: 'rollDiameter' });
  if (!target.ok) return target;
  const unit = now.value.unit;
  const m = new Dec(now.value.exact['measurement']);
  const t = new Dec(target.value.exact['measurement']);
  // Male dovetail and V-groove: the reading falls as metal comes off; female dovetail: it rises.
  const falls = !dovetail || v.side === 'male';
  const left = falls ? m.minus(t) : t.minus(m);
  const leftText = formatLength(left, unit);
  const what = dovetail ? 'Left to cut on the width' : 'Left to cut on the depth';
  const formula = falls ? 'left = now − stop' : 'left = stop − now';
  const substituted = falls ? `${now.value.values['measurement']} − ${target.value.values['measurement']}` : `${target.value.values['measurement']} − ${now.value.values['measurement']}`;
  const warnings = [...now.value.warnings, ...target.value.warnings.filter((w) => !now.value.warnings.includes(w))];
  if (left.isNeg()) warnings.unshift(`The work is already ${formatLength(left.abs(), unit)} ${unit} past the drawing size: check the reading and the roll size before going on.`);
  return succeed({
    main: now.value,
    target: target.value,
    left: leftText,
    steps: [...now.value.steps, ...target.value.steps, step(what, formula, substituted, leftText, unit)],
    warnings,
  });
}

/** Runs the engine on the form's values, sending only the fields of the chosen kind and mode. */
export function pinsCalc(v: PinsRollsForm): CalcResult<PinsOutcome> {
  if ((v.kind === 'dovetail' || v.kind === 'v-groove') && v.mode === 'check') return check(v);
  if (v.kind === 'dovetail' && !v.width.trim()) return invalid('Over pins', 'width', 'is required: the corner width the drawing asks for');
  if (v.kind === 'v-groove' && !v.grooveWidth.trim()) return invalid('Over pins', 'grooveWidth', 'is required: the groove width the drawing asks for');
  const { request, names } = overPinsRequest(v);
  return single(run(request, names));
}
