/**
 * The sine-bar page's form and the engine request of its single-bar modes (shared/calc/sine-bar).
 * A set-up saved from that page keeps the form as its inputs; its results and sheet make the same
 * request from it.
 */
import { type CompoundSineRequest, type SineBarRequest, parseRequest, sineBarRequestSchema } from '../api/calc';
import { type GaugeBox, resolveBox } from '../calc/gauge-stack';
import { type CalcResult, succeed } from '../calc/step';
import { sizeList } from './form-text';

/** The sine-bar form's values: all text, as typed. */
export type SineBarFormValues = {
  unit: string;
  mode: string;
  barLength: string;
  angle: string;
  stackHeight: string;
  set: string;
  missing: string;
  /** Table of stacks: first angle, last angle and step. */
  tableFrom: string;
  tableTo: string;
  tableStep: string;
  /** Compound plate: 'angles' (two angles → two stacks) or 'stacks' (two stacks → two angles). */
  compoundBy: string;
  /** Compound plate: the upper plate's angle, stack and roll distance (blank: as the lower plate). */
  angleB: string;
  stackB: string;
  lengthB: string;
};

/** The engine request: the angle or the stack, the set (or none) and the missing blocks. */
export function toSineBarRequest(values: SineBarFormValues): SineBarRequest {
  const byAngle = values.mode !== 'stack';
  return {
    unit: values.unit as SineBarRequest['unit'],
    barLength: values.barLength,
    angle: byAngle ? values.angle : undefined,
    stackHeight: byAngle ? undefined : values.stackHeight,
    set: values.set || undefined,
    missing: values.set ? sizeList(values.missing) : undefined,
  };
}

/**
 * The standard set a compound plate's form names, less the blocks marked missing, as the stack
 * solver sees it: null without a set or for the team's own box (its blocks are in the inventory).
 * A missing list that does not read, or names a block the set lacks, fails on that field.
 */
export function compoundFormBox(v: SineBarFormValues): CalcResult<GaugeBox | null> {
  if (!v.set || v.set.startsWith('box:')) return succeed(null);
  const area = 'Compound sine plate';
  const missing = parseRequest(area, sineBarRequestSchema.pick({ missing: true }), { missing: sizeList(v.missing) });
  if (!missing.ok) return missing;
  return resolveBox(area, { set: v.set, missing: missing.value.missing, unit: v.unit === 'mm' ? 'mm' : 'in' });
}

/**
 * The compound plate's engine request: two angles (or two stacks), the upper plate's own roll
 * distance when given; with a standard set each stack is rounded to the set's finest step so its
 * blocks can make it. (A team box's step is the unit's, as the page rounds it.)
 */
export function toCompoundSineRequest(v: SineBarFormValues): CompoundSineRequest {
  const boxed = compoundFormBox(v);
  const resolution = boxed.ok && boxed.value ? boxed.value.step.toString() : undefined;
  const byAngles = v.compoundBy !== 'stacks';
  return {
    unit: v.unit as 'in' | 'mm',
    lengthA: v.barLength,
    lengthB: v.lengthB,
    angleA: byAngles ? v.angle : undefined,
    angleB: byAngles ? v.angleB : undefined,
    stackA: byAngles ? undefined : v.stackHeight,
    stackB: byAngles ? undefined : v.stackB,
    resolution,
  };
}
