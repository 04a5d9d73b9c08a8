import { formatDegrees, formatDms } from '../angle/angle-text';
import {
  compoundSineRequestSchema,
  parseRequest,
  sineBarRequestSchema,
  sineTableRequestSchema,
  type CompoundSineRequest,
  type SineBarRequest,
  type SineTableRequest,
} from '../api/calc';
import { formatLength, roundToStep, unitResolution, type LengthUnit } from '../units/length-unit';
import { Dec, acosDeg, asinDeg, cosDeg, exactText, fixedText, sinDeg, toRadians } from './decimal-math';
import { fewestBlocks, formatBlock, formatStack, resolveBox, type GaugeBox } from './gauge-stack';
import { blockCountStep, guarded, impossible, invalid, step, succeed, type CalcResult, type Step } from './step';

/**
 * Sine bar and sine plate: H = L·sin θ and θ = asin(H / L), with L the roll centre distance and H
 * the gauge stack under one roll (US Army OD1642; TC 9-524 App. C; Machinery's Handbook 31 p. 695;
 * REFERENCE.md §2.1). The stack is rounded to the box's (or the unit's) resolution and the angle
 * it actually makes is reported with its error; the sensitivity dθ = dH / (L·cos θ) (REFERENCE.md
 * §2.4) tells how much one resolution step moves the angle.
 */

/** Answer of {@link calculateSineBar}; lengths are decimal text, angles decimal degrees (0.0001°). */
export interface SineBarResult {
  /** Unit of every length. */
  unit: LengthUnit;
  /** Roll centre distance L. */
  barLength: string;
  /** Stack height H to put under the roll, at the resolution. */
  stackHeight: string;
  /** The angle asked for (or, from a stack, the angle it makes). */
  angleDeg: string;
  /** angleDeg as DMS. */
  angleDms: string;
  /** The angle the rounded stack actually makes. */
  achievedAngleDeg: string;
  /** achievedAngleDeg as DMS (0.1″). */
  achievedAngleDms: string;
  /** achieved − wanted, arc-seconds (2 decimals). */
  errorArcSec: string;
  /** Angle change for one resolution step of the stack at the angle the stack makes, arc-seconds. */
  sensitivityArcSec: string;
  /** The step the stack is rounded to. */
  resolution: string;
  /** 90° − angle, for setting steep angles from the other side. */
  complementDeg: string;
  /** Fewest blocks for the stack in wringing order (largest first); null without a box or when unreachable. */
  blocks: string[] | null;
  /** Number of blocks, or null. */
  blockCount: number | null;
  /** Notes: steep angles, unreachable stacks. */
  warnings: string[];
  /** Published cautions for sine-bar work. */
  cautions: string[];
  /** The derivation. */
  steps: Step[];
  /** Full precision values. */
  exact: { stackHeight: string; angleDeg: string; achievedAngleDeg: string };
}

/** Published sine-bar cautions (REFERENCE.md §7.6). */
export const SINE_BAR_CAUTIONS: readonly string[] = [
  'Repair scratches, nicks or other damage before the sine bar is used (US Army OD1642).',
  'Keep every contact surface clean: swarf between the blocks or under a roll changes the angle (Sparber, "The Theory and Practice of Using a Sine Bar").',
];

const AREA = 'Sine bar';

/** One setting: the stack for an angle, rounded, and what it really makes. */
interface Setting {
  wanted: Dec;
  exactStack: Dec;
  stack: Dec;
  achieved: Dec;
  errorArcSec: Dec;
}

/** Stack for angle θ on a bar of length L rounded to `resolution`, or null when it reaches L. */
function settingForAngle(L: Dec, theta: Dec, resolution: Dec): Setting | null {
  const exactStack = L.mul(sinDeg(theta));
  const stack = roundToStep(exactStack, resolution);
  if (stack.gte(L)) return null;
  const achieved = stack.isZero() ? new Dec(0) : asinDeg(stack.div(L));
  return { wanted: theta, exactStack, stack, achieved, errorArcSec: achieved.minus(theta).mul(3600) };
}

/** Angle change (arc-seconds) for one resolution step at θ: step / (L·cos θ) in radians. */
function sensitivity(L: Dec, theta: Dec, resolution: Dec): Dec {
  return resolution.div(L.mul(cosDeg(theta))).mul(new Dec(180).div(toRadians(new Dec(180)))).mul(3600);
}

/** Resolves an optional box and the rounding step for a sine-bar request. */
function boxAndResolution(
  area: string,
  p: { unit: LengthUnit; set?: string | undefined; blocks?: Parameters<typeof resolveBox>[1]['blocks']; missing?: Dec[] | undefined; resolution?: Dec | undefined },
): CalcResult<{ box: GaugeBox | null; resolution: Dec }> {
  let box: GaugeBox | null = null;
  if (p.set || p.blocks) {
    const boxed = resolveBox(area, { set: p.set, blocks: p.blocks, missing: p.missing, unit: p.unit });
    if (!boxed.ok) return boxed;
    box = boxed.value;
  }
  return succeed({ box, resolution: p.resolution ?? box?.step ?? unitResolution(p.unit) });
}

/** Above 45°: set the complement instead. `axis` names the plate's axis (A or B) on a compound plate. */
function steepWarnings(theta: Dec, axis?: 'A' | 'B'): string[] {
  const out: string[] = [];
  if (theta.gt(45)) {
    const complement = formatDms(new Dec(90).minus(theta));
    out.push(
      axis
        ? `Angle ${axis} is above 45°: a stack error moves the angle more and more (dθ = dH / (L·cos θ)); published practice limits sine plates to about 45°. Consider setting the complement of angle ${axis}, ${complement}, against an angle plate or square (common practice).`
        : `Above 45° a stack error moves the angle more and more (dθ = dH / (L·cos θ)); published practice limits sine bars to about 45°. Consider setting the complement, ${complement}, against an angle plate or square (common practice).`,
    );
  }
  return out;
}

/**
 * An angle asked for that is smaller than the angle one step of the stack makes, asin(step / L):
 * the stack rounds to nothing or to one step, so the bar lies flat or on the smallest stack. `what`
 * names the angle and its stack ("Stack A" on a compound plate).
 */
function tinyAngleWarnings(L: Dec, theta: Dec, resolution: Dec, unit: LengthUnit, what = { angle: 'The angle asked for', stack: 'the stack', bar: 'bar' }): string[] {
  if (theta.lte(0) || resolution.gte(L)) return [];
  const stepAngle = asinDeg(resolution.div(L));
  if (!theta.lt(stepAngle)) return [];
  const step = `${resolution.toString()} ${unit}`;
  return [
    `${what.angle} (${formatDms(theta, 1)}) is smaller than one step of ${what.stack}: ${step} on this ${formatLength(L, unit)} ${unit} ${what.bar} makes ${fixedText(stepAngle.mul(3600), 2)}″, so the ${what.bar} lies flat or on the smallest stack (${step}) and the angle made is out by up to half that step.`,
  ];
}

/** Between these lengths (in inches) a bar or plate is of a usual size; outside, a unit or typing slip is likely. */
const USUAL_BAR_INCHES = { min: new Dec(2), max: new Dec(20) };

/**
 * A roll distance far from the usual sizes (a 125 typed with the unit left at inches, a 0.5 meant
 * as 5): still answered, with a warning to check the unit and the length.
 */
function barLengthWarnings(L: Dec, unit: LengthUnit, what = 'bar'): string[] {
  const inches = unit === 'mm' ? L.div(25.4) : L;
  if (inches.gte(USUAL_BAR_INCHES.min) && inches.lte(USUAL_BAR_INCHES.max)) return [];
  return [
    `${/^[aeiou]/.test(what) ? 'An' : 'A'} ${what} with ${formatLength(L, unit)} ${unit} between the roll centres is unusual: sine bars and plates are commonly 2.5, 5 or 10 in, or 100, 200 or 250 mm (common practice). Check the unit and the length.`,
  ];
}

/**
 * Sine bar or sine plate: the stack for an angle (rounded to the box's or the unit's resolution,
 * with the angle it really makes and the error), or the angle a stack makes; with a box (`set` or
 * `blocks`), the fewest blocks for the stack.
 */
export function calculateSineBar(input: SineBarRequest | unknown): CalcResult<SineBarResult> {
  return guarded<SineBarResult>(AREA, () => {
    const parsed = parseRequest(AREA, sineBarRequestSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    const unit = p.unit;
    const L = p.barLength;
    const len = (x: Dec) => formatLength(x, unit);
    if ((p.angle === undefined) === (p.stackHeight === undefined)) {
      return invalid(AREA, p.angle === undefined ? 'angle' : 'stackHeight', 'give either angle or stackHeight, not both');
    }
    const chosen = boxAndResolution(AREA, p);
    if (!chosen.ok) return chosen;
    const { box, resolution } = chosen.value;
    const res = (x: Dec) => (box ? formatStack(x, box) : formatLength(x, unit, resolution));
    const steps: Step[] = [];
    let setting: Setting;
    if (p.angle !== undefined) {
      const s = settingForAngle(L, p.angle, resolution);
      if (!s) return impossible(AREA, 'angle', `needs a stack as tall as the bar (${len(L)} ${unit}); use a smaller angle or set the complement`);
      setting = s;
      // The unrounded stack to three places past the resolution (the exact figure stays in `exact`).
      const fine = fixedText(s.exactStack, resolution.decimalPlaces() + 3);
      steps.push(step('Stack height', 'H = L · sin θ', `H = ${len(L)} · sin ${formatDms(p.angle)}`, fine, unit));
      steps.push(step('Stack at the resolution', `H rounded to ${resolution.toString()}`, fine, res(s.stack), unit));
      steps.push(step('Angle the stack makes', 'θ′ = asin(H / L)', `θ′ = asin(${res(s.stack)} / ${len(L)})`, formatDegrees(s.achieved), '°'));
      steps.push(step('Angle error', 'e = (θ′ − θ) · 3600', `e = (${formatDegrees(s.achieved, 6)} − ${formatDegrees(p.angle, 6)}) · 3600`, fixedText(s.errorArcSec, 2), '″'));
    } else {
      const H = p.stackHeight as Dec;
      if (H.gt(L)) return impossible(AREA, 'stackHeight', `is taller than the bar (${len(L)} ${unit}): no angle fits`);
      if (H.eq(L)) return impossible(AREA, 'stackHeight', 'equals the bar length: that stands the bar on end (90°)');
      const theta = H.isZero() ? new Dec(0) : asinDeg(H.div(L));
      setting = { wanted: theta, exactStack: H, stack: H, achieved: theta, errorArcSec: new Dec(0) };
      steps.push(step('Angle', 'θ = asin(H / L)', `θ = asin(${res(H)} / ${len(L)})`, formatDegrees(theta), '°'));
      steps.push(step('Angle (DMS)', 'θ', formatDegrees(theta) + '°', formatDms(theta, 1), ''));
    }
    // At the angle the stack makes (θ′ from a wanted angle; from a typed stack that is θ itself).
    const sens = sensitivity(L, setting.achieved, resolution);
    const at = p.angle !== undefined ? 'θ′' : 'θ';
    steps.push(step('Sensitivity', `Δθ = ΔH / (L · cos ${at})`, `Δθ = ${resolution.toString()} / (${len(L)} · cos ${formatDms(setting.achieved)})`, fixedText(sens, 2), '″'));

    const warnings = [
      ...barLengthWarnings(L, unit),
      ...steepWarnings(setting.wanted),
      ...(p.angle !== undefined ? tinyAngleWarnings(L, p.angle, resolution, unit) : []),
    ];
    // A typed stack finer than the blocks step cannot have been built from them.
    if (p.stackHeight !== undefined && !p.stackHeight.mod(resolution).isZero()) {
      warnings.push(`A ${p.stackHeight.toString()} ${unit} stack is finer than the gauge-block step (${resolution.toString()} ${unit}): check the stack as built.`);
    }
    let blocks: string[] | null = null;
    if (box) {
      if (setting.stack.isZero()) {
        blocks = [];
      } else {
        const found = fewestBlocks(box, setting.stack);
        if (found) {
          blocks = found.map((b) => formatBlock(b, box));
          steps.push(blockCountStep(blocks));
        } else {
          warnings.push(unmakeableStack(res(setting.stack), unit, p.angle !== undefined));
        }
      }
    }
    return succeed({
      unit,
      barLength: len(L),
      stackHeight: res(setting.stack),
      angleDeg: formatDegrees(setting.wanted),
      angleDms: formatDms(setting.wanted),
      achievedAngleDeg: formatDegrees(setting.achieved),
      achievedAngleDms: formatDms(setting.achieved, 1),
      errorArcSec: fixedText(setting.errorArcSec, 2),
      sensitivityArcSec: fixedText(sens, 2),
      resolution: resolution.toString(),
      complementDeg: formatDegrees(new Dec(90).minus(setting.wanted)),
      blocks,
      blockCount: blocks ? blocks.length : null,
      warnings,
      cautions: [...SINE_BAR_CAUTIONS],
      steps,
      exact: { stackHeight: exactText(setting.exactStack), angleDeg: exactText(setting.wanted), achievedAngleDeg: exactText(setting.achieved) },
    });
  });
}

/** One row of a sine-bar table. */
export interface SineTableRow {
  /** The angle, decimal degrees. */
  angleDeg: string;
  /** The angle as DMS. */
  angleDms: string;
  /** Stack at the resolution. */
  stackHeight: string;
  /** Angle the rounded stack makes. */
  achievedAngleDeg: string;
  /** achieved − wanted, arc-seconds. */
  errorArcSec: string;
  /** Fewest blocks, largest first; null without a box or when the box cannot make the stack. */
  blocks: string[] | null;
  /** Number of blocks, or null. */
  count: number | null;
}

/** Answer of {@link calculateSineTable}. */
export interface SineTableResult {
  /** Unit of every length. */
  unit: LengthUnit;
  /** Roll centre distance. */
  barLength: string;
  /** Rounding step of the stacks. */
  resolution: string;
  /** The rows, from `from` to `to`. */
  rows: SineTableRow[];
  /** Rows whose stack the box cannot make. */
  unreachable: number;
  /** The formula used for every row. */
  steps: Step[];
}

/** Most rows a table may have. */
export const MAX_TABLE_ROWS = 20_000;

/** A table of sine-bar stacks (and fewest blocks, with a box) from one angle to another in equal steps. */
export function calculateSineTable(input: SineTableRequest | unknown): CalcResult<SineTableResult> {
  const area = 'Sine table';
  return guarded<SineTableResult>(area, () => {
    const parsed = parseRequest(area, sineTableRequestSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    if (p.to.lt(p.from)) return invalid(area, 'to', 'must not be below from');
    // The epsilon absorbs the last-digit rounding of steps such as 1′ = 0.01666…7°.
    const count = p.to.minus(p.from).div(p.step).plus('1e-20').floor().toNumber() + 1;
    if (count > MAX_TABLE_ROWS) return invalid(area, 'step', `gives ${count} rows; at most ${MAX_TABLE_ROWS}`);
    const chosen = boxAndResolution(area, p);
    if (!chosen.ok) return chosen;
    const { box, resolution } = chosen.value;
    const L = p.barLength;
    const res = (x: Dec) => (box ? formatStack(x, box) : formatLength(x, p.unit, resolution));
    const rows: SineTableRow[] = [];
    let unreachable = 0;
    for (let i = 0; i < count; i++) {
      const theta = p.from.plus(p.step.mul(i)).toDecimalPlaces(30);
      const s = settingForAngle(L, theta, resolution);
      if (!s) return impossible(area, 'to', `${formatDms(theta)} needs a stack as tall as the bar`);
      let blocks: string[] | null = null;
      if (box) {
        const found = s.stack.isZero() ? [] : fewestBlocks(box, s.stack);
        if (found) blocks = found.map((b) => formatBlock(b, box));
        else unreachable++;
      }
      rows.push({
        angleDeg: formatDegrees(theta),
        angleDms: formatDms(theta),
        stackHeight: res(s.stack),
        achievedAngleDeg: formatDegrees(s.achieved),
        errorArcSec: fixedText(s.errorArcSec, 2),
        blocks,
        count: blocks ? blocks.length : null,
      });
    }
    const steps = [
      step('Stack height', 'H = L · sin θ', `H = ${formatLength(L, p.unit)} · sin θ`, `rounded to ${resolution.toString()}`, p.unit),
      step('Angle the stack makes', 'θ′ = asin(H / L)', 'per row', '', '°'),
    ];
    return succeed({ unit: p.unit, barLength: formatLength(L, p.unit), resolution: resolution.toString(), rows, unreachable, steps });
  });
}

/** One axis of a compound sine plate. */
export interface CompoundAxis {
  /** Roll centre distance of this plate. */
  length: string;
  /** The angle about this axis, decimal degrees. */
  angleDeg: string;
  /** The angle as DMS. */
  angleDms: string;
  /** The stack for this axis at the resolution. */
  stackHeight: string;
  /** Angle the rounded stack makes. */
  achievedAngleDeg: string;
  /** achieved − wanted, arc-seconds. */
  errorArcSec: string;
}

/** Answer of {@link calculateCompoundSinePlate}. */
export interface CompoundSineResult {
  /** Unit of every length. */
  unit: LengthUnit;
  /** Lower plate (first tilt). */
  axisA: CompoundAxis;
  /** Upper plate (second tilt, about the perpendicular axis). */
  axisB: CompoundAxis;
  /** Tilt of the top face from horizontal: cos φ = cos θA · cos θB. */
  resultantTiltDeg: string;
  /** The resultant tilt as DMS. */
  resultantTiltDms: string;
  /** Notes on steep settings. */
  warnings: string[];
  /** The derivation. */
  steps: Step[];
}

/**
 * Compound (two-axis) sine plate: each axis is an independent sine bar (H = L·sin θ) — two angles
 * give two stacks, two stacks give two angles; also the resulting tilt of the top face,
 * cos φ = cos θA · cos θB (derived: the two rotations are about perpendicular axes).
 */
export function calculateCompoundSinePlate(input: CompoundSineRequest | unknown): CalcResult<CompoundSineResult> {
  const area = 'Compound sine plate';
  return guarded<CompoundSineResult>(area, () => {
    const parsed = parseRequest(area, compoundSineRequestSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    const unit = p.unit;
    const resolution = p.resolution ?? unitResolution(unit);
    const steps: Step[] = [];
    const axis = (name: 'A' | 'B', L: Dec, angle: Dec | undefined, stack: Dec | undefined): CalcResult<{ axis: CompoundAxis; achieved: Dec; wanted: Dec }> => {
      if ((angle === undefined) === (stack === undefined)) {
        return invalid(area, `angle${name}`, `give either angle${name} or stack${name}`);
      }
      let s: Setting;
      if (angle !== undefined) {
        const found = settingForAngle(L, angle, resolution);
        if (!found) return impossible(area, `angle${name}`, 'needs a stack as tall as the plate');
        s = found;
        steps.push(step(`Stack ${name}`, `H${name} = L${name} · sin θ${name}`, `H${name} = ${formatLength(L, unit)} · sin ${formatDms(angle)}`, formatLength(s.stack, unit, resolution), unit));
      } else {
        const H = stack as Dec;
        if (H.gte(L)) return impossible(area, `stack${name}`, `must be shorter than the plate's roll distance (${formatLength(L, unit)} ${unit})`);
        const theta = H.isZero() ? new Dec(0) : asinDeg(H.div(L));
        s = { wanted: theta, exactStack: H, stack: H, achieved: theta, errorArcSec: new Dec(0) };
        steps.push(step(`Angle ${name}`, `θ${name} = asin(H${name} / L${name})`, `θ${name} = asin(${formatLength(H, unit, resolution)} / ${formatLength(L, unit)})`, formatDegrees(theta), '°'));
      }
      return succeed({
        wanted: s.wanted,
        achieved: s.achieved,
        axis: {
          length: formatLength(L, unit),
          angleDeg: formatDegrees(s.wanted),
          angleDms: formatDms(s.wanted),
          stackHeight: formatLength(s.stack, unit, resolution),
          achievedAngleDeg: formatDegrees(s.achieved),
          errorArcSec: fixedText(s.errorArcSec, 2),
        },
      });
    };
    const a = axis('A', p.lengthA, p.angleA, p.stackA);
    if (!a.ok) return a;
    const b = axis('B', p.lengthB ?? p.lengthA, p.angleB, p.stackB);
    if (!b.ok) return b;
    const cosPhi = cosDeg(a.value.achieved).mul(cosDeg(b.value.achieved));
    const phi = acosDeg(Dec.min(cosPhi, 1));
    steps.push(step('Resultant tilt of the top face', 'cos φ = cos θA · cos θB', `cos φ = cos ${formatDms(a.value.achieved)} · cos ${formatDms(b.value.achieved)}`, formatDegrees(phi), '°'));
    return succeed({
      unit,
      axisA: a.value.axis,
      axisB: b.value.axis,
      resultantTiltDeg: formatDegrees(phi),
      resultantTiltDms: formatDms(phi),
      warnings: [
        ...barLengthWarnings(p.lengthA, unit, 'lower plate'),
        ...(p.lengthB && !p.lengthB.eq(p.lengthA) ? barLengthWarnings(p.lengthB, unit, 'upper plate') : []),
        ...steepWarnings(a.value.wanted, 'A'),
        ...steepWarnings(b.value.wanted, 'B'),
        ...(p.angleA !== undefined ? tinyAngleWarnings(p.lengthA, p.angleA, resolution, unit, { angle: 'Angle A', stack: 'stack A', bar: 'plate' }) : []),
        ...(p.angleB !== undefined ? tinyAngleWarnings(p.lengthB ?? p.lengthA, p.angleB, resolution, unit, { angle: 'Angle B', stack: 'stack B', bar: 'plate' }) : []),
      ],
      steps,
    });
  });
}

/** The warning for the rows of a table of stacks whose stack the box cannot make. */
export function unmakeableRows(count: number): string {
  return `The box cannot make the stack of ${count} ${count === 1 ? 'row' : 'rows'} (no blocks listed): check the missing blocks or change the range.`;
}

/** The warning for a compound plate's stack (axis A or B) the box cannot make. */
export function unmakeableAxis(axis: 'A' | 'B', stack: string, unit: string): string {
  return `The box cannot make stack ${axis} (${stack} ${unit}).`;
}

/**
 * The box cannot give a sine bar's stack: what to do instead (for a stack typed in, changing the
 * angle is no answer). Said by the engine for a standard set, and for a team's box by its page
 * and the set-up's results.
 */
export function unmakeableStack(stack: string, unit: string, forAngle: boolean): string {
  const fix = forAngle ? 'raise both rolls on equal stacks and build the difference, or change the angle slightly' : 'raise both rolls on equal stacks and build the difference';
  return `The box cannot make a ${stack} ${unit} stack; ${fix}.`;
}

/** The blocks for both stacks of a compound plate (largest first), and what the box cannot give. */
export interface CompoundBlocks {
  /** Blocks of stack A; null when the box cannot make it. */
  blocksA: string[] | null;
  /** Blocks of stack B; null when the box cannot make it (or not beside stack A). */
  blocksB: string[] | null;
  /** Why a stack has no blocks. */
  warnings: string[];
}

/** The box less the blocks one stack takes, or null when nothing is left. */
function boxWithout(box: GaugeBox, used: readonly Dec[]): GaugeBox | null {
  if (used.length === 0) return box;
  const left = resolveBox('Compound sine plate', { blocks: box.pieces, missing: [...used], unit: box.unit });
  return left.ok ? left.value : null;
}

/**
 * Both stacks of a compound plate stand under it at the same time, so they take different blocks
 * of the one box: stack B is built from what stack A leaves in it; failing that, stack A from what
 * stack B leaves. When the box can make each stack alone but not both at once, stack A keeps its
 * blocks, stack B gets none and a warning says so. `box` is the standard set (less its missing
 * blocks) or the team's box as the solver sees it; null for a box with no usable block. The
 * compound plate's page and a saved compound set-up's results both pick their blocks here.
 */
export function compoundStackBlocks(box: GaugeBox | null, stackA: string, stackB: string, unit: LengthUnit): CompoundBlocks {
  const make = (from: GaugeBox | null, stack: string): Dec[] | null => {
    const H = new Dec(stack);
    if (H.isZero()) return [];
    return from ? fewestBlocks(from, H) : null;
  };
  const text = (blocks: Dec[] | null): string[] | null => (blocks ? blocks.map((b) => formatBlock(b, { unit })) : null);
  const alone = { a: make(box, stackA), b: make(box, stackB) };
  if (!alone.a || !alone.b || !box) {
    const warnings = [...(alone.a ? [] : [unmakeableAxis('A', stackA, unit)]), ...(alone.b ? [] : [unmakeableAxis('B', stackB, unit)])];
    return { blocksA: text(alone.a), blocksB: text(alone.b), warnings };
  }
  const bAfterA = make(boxWithout(box, alone.a), stackB);
  if (bAfterA) return { blocksA: text(alone.a), blocksB: text(bAfterA), warnings: [] };
  const aAfterB = make(boxWithout(box, alone.b), stackA);
  if (aAfterB) return { blocksA: text(aAfterB), blocksB: text(alone.b), warnings: [] };
  return { blocksA: text(alone.a), blocksB: null, warnings: [unmakeableBothStacks(stackA, stackB, unit, text(alone.a) ?? [])] };
}

/** The warning for a compound plate whose box can make each stack alone but not both at once. */
export function unmakeableBothStacks(stackA: string, stackB: string, unit: string, blocksA: readonly string[]): string {
  return `The box cannot make both stacks at once: with stack A (${stackA} ${unit}) built from ${blocksA.join(' + ')}, the blocks left cannot make stack B (${stackB} ${unit}), and building stack B first does not help either. Take the blocks for one of the stacks from a second set.`;
}
