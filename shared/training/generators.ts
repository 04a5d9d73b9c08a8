/**
 * Exercise generators. Each exercise type is a recipe: `draw` picks realistic shop values from a
 * seeded PRNG, `build` asks the calculation engine for the answer and its derivation and states
 * the tolerance the answer is checked to. The same type and seed always give the same problem, in
 * the browser and on the server; `buildExercise` also takes hand-picked values (published examples).
 */
import { formatDms } from '../angle/angle-text';
import { Dec, sqrt, tanDeg } from '../calc/decimal-math';
import { calculateGaugeStack, GAUGE_BLOCK_CAUTIONS } from '../calc/gauge-stack';
import { calculateLatheTaper, LATHE_TAPER_CAUTIONS } from '../calc/lathe-taper';
import { calculateOverPins } from '../calc/over-pins';
import { calculateSineBar, SINE_BAR_CAUTIONS } from '../calc/sine-bar';
import { calculateTaper, MILLING_CAUTIONS } from '../calc/taper';
import type { Step } from '../calc/step';
import { UNIT_DECIMALS, type LengthUnit } from '../units/length-unit';
import { engineValue, stepsUpTo } from './engine';
import type { Exercise } from './exercise';
import { EXERCISE_INFO, isExerciseType, type ExerciseType } from './exercise-types';
import { mulberry32, pick, randomStep, type Random } from './prng';

/** Accepted error of a length answer: half a thousandth of an inch, a hundredth of a millimetre (common practice for hand work). */
export const LENGTH_TOLERANCE: Readonly<Record<LengthUnit, string>> = { in: '0.0005', mm: '0.01' };
/** Accepted error of a stack height: one step of the finest gauge block, 0.0001 in / 0.001 mm (REFERENCE.md rounding conventions). */
export const STACK_TOLERANCE: Readonly<Record<LengthUnit, string>> = { in: '0.0001', mm: '0.001' };
/** Accepted error of an angle answer in degrees: 0.01° (36″), inside a sine bar's "within 1 minute" (Army OD1642). */
export const ANGLE_TOLERANCE = '0.01';

/** The values each exercise type is built from, all as decimal text. */
export interface ExerciseInputs {
  'taper-depth': { unit: LengthUnit; thickness: string; taperLength: string; angle: string };
  'taper-end-thickness': { unit: LengthUnit; thickness: string; taperLength: string; angle: string };
  'taper-angle': { unit: LengthUnit; thickness: string; endThickness: string; taperLength: string };
  'sine-stack': { unit: LengthUnit; barLength: string; angle: string };
  'sine-angle': { unit: LengthUnit; barLength: string; stackHeight: string };
  'gauge-fewest': { target: string };
  'lathe-half-angle': { taperPerFoot: string };
  'lathe-offset': { largeDiameter: string; smallDiameter: string; length: string; workLength: string };
  'dovetail-pins': { unit: LengthUnit; angle: string; rollDiameter: string; width: string };
}

type Draft = Omit<Exercise, 'type' | 'seed' | 'title'>;

interface Recipe<K extends ExerciseType> {
  draw(random: Random): ExerciseInputs[K];
  build(inputs: ExerciseInputs[K]): Draft;
}

const unitOf = (random: Random): LengthUnit => (random() < 0.7 ? 'in' : 'mm');
/** A drawing dimension as printed: three places in inches, as few as needed in millimetres. */
/** "a" or "an" before a number as it is read aloud: an 8, an 18°, an 80 mm; a 5, a 1.5. */
export function article(numberText: string): 'a' | 'an' {
  const whole = /^\d+/.exec(numberText)?.[0] ?? '';
  return whole.startsWith('8') || whole === '11' || whole === '18' ? 'an' : 'a';
}
const capital = (word: string) => word[0]!.toUpperCase() + word.slice(1);

const show = (value: string, unit: LengthUnit) => (unit === 'in' ? new Dec(value).toFixed(3) : new Dec(value).toString());
/** An angle as a drawing gives it: whole degrees plainly, others in DMS with the decimal beside. */
const angleText = (value: string) => (new Dec(value).isInteger() ? `${value}°` : `${formatDms(new Dec(value))} (${new Dec(value).toString()}°)`);

/** Angle-block angles met on drawings, including the demo's 7°30'. */
const TAPER_ANGLES = ['2', '3', '4', '5', '6', '7.5', '8', '10', '12', '12.5', '14.5', '15', '18', '20'];

/** A taper that stays inside the stock: at least 1/8 in (3 mm) is left at the end. */
function drawTaper(random: Random): ExerciseInputs['taper-depth'] {
  const unit = unitOf(random);
  const angle = new Dec(pick(random, TAPER_ANGLES));
  const L = unit === 'in' ? randomStep(random, '0.500', '2.500', '0.125') : randomStep(random, '10', '60', '5');
  const minT = L.mul(tanDeg(angle)).plus(unit === 'in' ? '0.125' : '3');
  const T = unit === 'in'
    ? Dec.max(randomStep(random, '0.375', '1.500', '0.125'), minT.div('0.125').ceil().mul('0.125'))
    : Dec.max(randomStep(random, '8', '40', '1'), minT.ceil());
  return { unit, thickness: T.toString(), taperLength: L.toString(), angle: angle.toString() };
}

function taperGivens(i: ExerciseInputs['taper-depth']) {
  return [
    { label: 'Thickness T', value: show(i.thickness, i.unit), unit: i.unit },
    { label: 'Taper length L', value: show(i.taperLength, i.unit), unit: i.unit },
    { label: 'Angle α', value: i.angle, unit: '°' },
  ];
}

/** Places beyond the answer's that a worked solution carries in its intermediate values. */
export const EXTRA_PLACES = 2;

/**
 * The milled-taper derivation as an apprentice redoes it on a calculator, line by line: the
 * engine's labels and formulas, each intermediate value to two more places than the answer (more
 * only in the rare case where the last line would otherwise round to another last digit), every
 * line worked from the numbers printed before it, and the last line giving the answer as graded.
 * The depth to stop goes d → F → h = L · d / F; the end thickness d → t = T − d.
 */
function taperSteps(goal: 'depth' | 'end', i: ExerciseInputs['taper-depth'], engine: readonly Step[], exactRemoved: string, answer: string): Step[] {
  const places = UNIT_DECIMALS[i.unit];
  const fixed = (x: Dec, n = places) => x.toFixed(n);
  const L = new Dec(i.taperLength);
  const T = new Dec(i.thickness);
  const byLabel = (label: string): Step => {
    const found = engine.find((st) => st.label.startsWith(label));
    if (!found) throw new Error(`Training taper-${goal}: the engine's derivation has no step "${label}"`);
    return found;
  };
  for (let extra = EXTRA_PLACES; extra <= EXTRA_PLACES + 6; extra++) {
    const q = places + extra;
    const d = new Dec(exactRemoved).toDecimalPlaces(q);
    const removed = { ...byLabel('Stock removed at the end'), substituted: `d = ${fixed(L)} · tan ${formatDms(new Dec(i.angle))}`, value: fixed(d, q) };
    if (goal === 'end') {
      if (fixed(T.minus(d)) !== answer) continue;
      return [removed, { ...byLabel('End thickness'), substituted: `t = ${fixed(T)} − ${fixed(d, q)}`, value: answer }];
    }
    const F = sqrt(L.mul(L).plus(d.mul(d))).toDecimalPlaces(q);
    if (fixed(L.mul(d).div(F)) !== answer) continue;
    return [
      removed,
      { ...byLabel('Face length'), substituted: `F = √(${fixed(L)}² + ${fixed(d, q)}²)`, value: fixed(F, q) },
      { ...byLabel('Depth to stop'), substituted: `h = ${fixed(L)} · ${fixed(d, q)} / ${fixed(F, q)}`, value: answer },
    ];
  }
  throw new Error(`Training taper-${goal}: no worked solution checks out to ${answer}`);
}

const RECIPES: { readonly [K in ExerciseType]: Recipe<K> } = {
  'taper-depth': {
    draw: drawTaper,
    build(i) {
      const r = engineValue('taper-depth', calculateTaper(i));
      return {
        prompt: `A part ${show(i.thickness, i.unit)} ${i.unit} thick is tilted on ${article(angleText(i.angle))} ${angleText(i.angle)} angle block so the taper face lies level. The taper starts ${show(i.taperLength, i.unit)} ${i.unit} from the end. You touch off on the highest corner. How far down do you feed to finish the face?`,
        givens: taperGivens(i),
        answerLabel: 'Depth to stop h',
        answerKind: 'length',
        unit: i.unit,
        answer: r.depthToStop,
        exact: r.exact.depthToStop,
        tolerance: LENGTH_TOLERANCE[i.unit],
        steps: taperSteps('depth', i, r.steps, r.exact.removedAtEnd, r.depthToStop),
        cautions: [...MILLING_CAUTIONS],
      };
    },
  },
  'taper-end-thickness': {
    draw: drawTaper,
    build(i) {
      const r = engineValue('taper-end-thickness', calculateTaper(i));
      return {
        prompt: `${capital(article(angleText(i.angle)))} ${angleText(i.angle)} taper is milled on a part ${show(i.thickness, i.unit)} ${i.unit} thick, starting ${show(i.taperLength, i.unit)} ${i.unit} from the end. What should the micrometer read across the end when the taper is done?`,
        givens: taperGivens(i),
        answerLabel: 'End thickness t',
        answerKind: 'length',
        unit: i.unit,
        answer: r.endThickness ?? '',
        exact: r.exact.endThickness ?? '',
        tolerance: LENGTH_TOLERANCE[i.unit],
        steps: taperSteps('end', i, r.steps, r.exact.removedAtEnd, r.endThickness ?? ''),
        cautions: [],
      };
    },
  },
  'taper-angle': {
    draw(random) {
      const unit = unitOf(random);
      const L = unit === 'in' ? randomStep(random, '1.000', '4.000', '0.250') : randomStep(random, '25', '100', '5');
      const T = unit === 'in' ? randomStep(random, '0.500', '1.250', '0.125') : randomStep(random, '12', '30', '1');
      // Remove between a little and two thirds of the stock: a taper, not a sliver or a knife edge.
      const most = T.mul(2).div(3);
      const d = unit === 'in' ? randomStep(random, '0.050', most.toFixed(3), '0.005') : randomStep(random, '1', most.floor().toString(), '0.5');
      return { unit, thickness: T.toString(), endThickness: T.minus(d).toString(), taperLength: L.toString() };
    },
    build(i) {
      const r = engineValue('taper-angle', calculateTaper(i));
      return {
        prompt: `The drawing shows a block ${show(i.thickness, i.unit)} ${i.unit} thick tapering to ${show(i.endThickness, i.unit)} ${i.unit} at the end over the last ${show(i.taperLength, i.unit)} ${i.unit}. At what angle must the work be tilted (angle block or sine plate) to cut the taper face level?`,
        givens: [
          { label: 'Thickness T', value: show(i.thickness, i.unit), unit: i.unit },
          { label: 'End thickness t', value: show(i.endThickness, i.unit), unit: i.unit },
          { label: 'Taper length L', value: show(i.taperLength, i.unit), unit: i.unit },
        ],
        answerLabel: 'Angle α (decimal degrees or DMS)',
        answerKind: 'angle',
        unit: '°',
        answer: `${r.angleDeg}° (${r.angleDms})`,
        exact: r.exact.angleDeg,
        tolerance: ANGLE_TOLERANCE,
        steps: stepsUpTo('taper-angle', r.steps, 'Angle'),
        cautions: [],
      };
    },
  },
  'sine-stack': {
    draw(random) {
      const unit = unitOf(random);
      // Whole minutes from 1° to 45°, where a sine bar is at its best.
      const minutes = randomStep(random, '60', '2700', '1');
      return { unit, barLength: unit === 'in' ? pick(random, ['5', '10']) : pick(random, ['100', '200']), angle: formatDms(minutes.div(60)) };
    },
    build(i) {
      const r = engineValue('sine-stack', calculateSineBar(i));
      return {
        prompt: `Set ${article(i.barLength)} ${i.barLength} ${i.unit} sine bar to ${i.angle}. What gauge-block stack goes under the raised roll?`,
        givens: [
          { label: 'Bar length L (roll centres)', value: i.barLength, unit: i.unit },
          { label: 'Angle θ', value: i.angle, unit: '' },
        ],
        answerLabel: 'Stack height H',
        answerKind: 'length',
        unit: i.unit,
        answer: r.stackHeight,
        exact: r.exact.stackHeight,
        tolerance: STACK_TOLERANCE[i.unit],
        steps: stepsUpTo('sine-stack', r.steps, 'Stack height'),
        cautions: [...SINE_BAR_CAUTIONS],
      };
    },
  },
  'sine-angle': {
    draw(random) {
      const unit = unitOf(random);
      const barLength = unit === 'in' ? pick(random, ['5', '10']) : pick(random, ['100', '200']);
      const L = new Dec(barLength);
      const places = unit === 'in' ? 4 : 3;
      // A stack a set can build, for roughly 1° to 44° on the bar.
      const H = randomStep(random, L.mul('0.02').toFixed(places), L.mul('0.7').toFixed(places), unit === 'in' ? '0.0001' : '0.001');
      return { unit, barLength, stackHeight: H.toFixed(places) };
    },
    build(i) {
      const r = engineValue('sine-angle', calculateSineBar(i));
      return {
        prompt: `${capital(article(i.barLength))} ${i.barLength} ${i.unit} sine bar stands on ${article(i.stackHeight)} ${i.stackHeight} ${i.unit} gauge-block stack. What angle does its top face make with the surface plate?`,
        givens: [
          { label: 'Bar length L (roll centres)', value: i.barLength, unit: i.unit },
          { label: 'Stack height H', value: i.stackHeight, unit: i.unit },
        ],
        answerLabel: 'Angle θ (decimal degrees or DMS)',
        answerKind: 'angle',
        unit: '°',
        answer: `${r.angleDeg}° (${r.angleDms})`,
        exact: r.exact.angleDeg,
        tolerance: ANGLE_TOLERANCE,
        steps: stepsUpTo('sine-angle', r.steps, 'Angle'),
        cautions: [...SINE_BAR_CAUTIONS],
      };
    },
  },
  'gauge-fewest': {
    // Four-decimal lengths between 0.3 and 6 in, as a sine-bar stack or a height setting needs.
    draw: (random) => ({ target: randomStep(random, '0.3000', '6.0000', '0.0001').toFixed(4) }),
    build(i) {
      const r = engineValue('gauge-fewest', calculateGaugeStack({ target: i.target, unit: 'in', set: 'inch-81' }));
      return {
        prompt: `Build ${article(i.target)} ${i.target} in stack from the 81-piece inch set. What is the fewest number of blocks that makes it exactly?`,
        givens: [
          { label: 'Stack length', value: i.target, unit: 'in' },
          { label: 'Set', value: '81-piece inch set', unit: '' },
        ],
        answerLabel: 'Fewest blocks',
        answerKind: 'count',
        unit: 'blocks',
        answer: String(r.count),
        exact: String(r.count),
        tolerance: '0',
        steps: stepsUpTo('gauge-fewest', r.steps, 'Fewest blocks'),
        cautions: [...GAUGE_BLOCK_CAUTIONS],
      };
    },
  },
  'lathe-half-angle': {
    // Tapers per foot met in practice: 1/16 to 1-1/2 in/ft in sixteenths, and the 0.600 of a Jarno taper.
    draw: (random) => ({ taperPerFoot: (random() < 0.15 ? new Dec('0.6') : randomStep(random, '0.0625', '1.5', '0.0625')).toFixed(4) }),
    build(i) {
      const r = engineValue('lathe-half-angle', calculateLatheTaper({ unit: 'in', taperPerFoot: i.taperPerFoot }));
      return {
        prompt: `A shaft needs a taper of ${i.taperPerFoot} in per foot on the diameter, turned with the compound rest. To what angle from the lathe's axis do you set the compound?`,
        givens: [{ label: 'Taper per foot', value: i.taperPerFoot, unit: 'in/ft' }],
        answerLabel: 'Half angle α/2 (decimal degrees or DMS)',
        answerKind: 'angle',
        unit: '°',
        answer: `${r.halfAngleDeg}° (${r.halfAngleDms})`,
        exact: r.exact.halfAngleDeg,
        tolerance: ANGLE_TOLERANCE,
        steps: stepsUpTo('lathe-half-angle', r.steps, 'Half angle'),
        cautions: [...LATHE_TAPER_CAUTIONS],
      };
    },
  },
  'lathe-offset': {
    draw(random) {
      const D = randomStep(random, '0.750', '2.500', '0.125');
      const l = randomStep(random, '2.0', '6.0', '0.5');
      const k = randomStep(random, '0.005', '0.050', '0.005');
      const work = l.plus(randomStep(random, '1.0', '8.0', '0.5'));
      // Both diameters to the same four places, as a drawing would give them.
      return { largeDiameter: D.toFixed(4), smallDiameter: D.minus(k.mul(l)).toFixed(4), length: l.toFixed(3), workLength: work.toFixed(3) };
    },
    build(i) {
      const r = engineValue('lathe-offset', calculateLatheTaper({ unit: 'in', ...i }));
      return {
        prompt: `Turn a taper from ${i.largeDiameter} in down to ${i.smallDiameter} in over ${i.length} in, on a piece ${i.workLength} in long between centres, by setting the tail stock over. How far do you offset the tail stock?`,
        givens: [
          { label: 'Large diameter D', value: i.largeDiameter, unit: 'in' },
          { label: 'Small diameter d', value: i.smallDiameter, unit: 'in' },
          { label: 'Taper length l', value: i.length, unit: 'in' },
          { label: 'Work length between centres', value: i.workLength, unit: 'in' },
        ],
        answerLabel: 'Tail-stock offset',
        answerKind: 'length',
        unit: 'in',
        answer: r.tailstockOffset ?? '',
        exact: r.exact.tailstockOffset ?? '',
        tolerance: LENGTH_TOLERANCE.in,
        // The offset method needs the taper per inch, not the compound's angles.
        steps: stepsUpTo('lathe-offset', r.steps, 'Tail-stock offset').filter((st) => !/^(Half angle|Included angle)/.test(st.label)),
        cautions: [...LATHE_TAPER_CAUTIONS],
      };
    },
  },
  'dovetail-pins': {
    draw(random) {
      const unit = unitOf(random);
      const angle = pick(random, ['45', '55', '60', '60', '60']);
      if (unit === 'in') {
        return { unit, angle, rollDiameter: pick(random, ['0.1875', '0.250', '0.3125', '0.375', '0.500']), width: randomStep(random, '0.750', '3.000', '0.125').toFixed(3) };
      }
      return { unit, angle, rollDiameter: pick(random, ['4', '5', '6', '8', '10']), width: randomStep(random, '20', '80', '1').toString() };
    },
    build(i) {
      const r = engineValue('dovetail-pins', calculateOverPins({ kind: 'dovetail', side: 'male', ...i }));
      return {
        prompt: `A male ${i.angle}° dovetail is ${show(i.width, i.unit)} ${i.unit} across its sharp corners at the base. What should the micrometer read over two ${i.rollDiameter} ${i.unit} pins laid in its corners?`,
        givens: [
          { label: 'Dovetail angle α', value: i.angle, unit: '°' },
          { label: 'Sharp-corner width a', value: show(i.width, i.unit), unit: i.unit },
          { label: 'Pin diameter D', value: i.rollDiameter, unit: i.unit },
        ],
        answerLabel: 'Reading over the pins x',
        answerKind: 'length',
        unit: i.unit,
        answer: r.values['measurement'] ?? '',
        exact: r.exact['measurement'] ?? '',
        tolerance: LENGTH_TOLERANCE[i.unit],
        steps: stepsUpTo('dovetail-pins', r.steps, 'Over the rolls'),
        cautions: [],
      };
    },
  },
};

/**
 * The steps with the last one giving a length answer as it is graded and shown ("= 1.8095 in"
 * rather than the engine's "= 1.8094788 in"): one format for the answer wherever it is printed.
 */
function answerLast(draft: Draft): Step[] {
  const last = draft.steps[draft.steps.length - 1];
  if (!last || draft.answerKind !== 'length' || last.value === draft.answer) return draft.steps;
  return [...draft.steps.slice(0, -1), { ...last, value: draft.answer }];
}

/** The problem of `type` built from given values (e.g. a published worked example); `seed` is recorded as given. */
export function buildExercise<K extends ExerciseType>(type: K, inputs: ExerciseInputs[K], seed = 0): Exercise {
  if (!isExerciseType(type)) throw new Error(`Training: unknown exercise type "${String(type)}"`);
  const draft = (RECIPES[type] as Recipe<K>).build(inputs);
  return { type, seed: seed >>> 0, title: EXERCISE_INFO[type].title, ...draft, steps: answerLast(draft) };
}

/** The values the problem of `type` with `seed` is built from. */
export function drawInputs<K extends ExerciseType>(type: K, seed: number): ExerciseInputs[K] {
  if (!isExerciseType(type)) throw new Error(`Training: unknown exercise type "${String(type)}"`);
  return (RECIPES[type] as Recipe<K>).draw(mulberry32(seed));
}

/** The problem of `type` made from `seed` (an unsigned 32-bit integer); throws on an unknown type. */
export function generateExercise(type: ExerciseType, seed: number): Exercise {
  return buildExercise(type, drawInputs(type, seed), seed);
}
