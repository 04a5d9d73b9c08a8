/**
 * The sine-bar page's form and the engine request of its single-bar modes (shared/calc/sine-bar).
 * A set-up saved from that page keeps the form as its inputs; its results and sheet make the same
 * request from it.
 */
import type { CompoundSineRequest, SineBarRequest } from '../api/calc';
import { resolveBox } from '../calc/gauge-stack';
import { Dec } from '../calc/decimal-math';
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
 * The compound plate's engine request: two angles (or two stacks), the upper plate's own roll
 * distance when given; with a standard set each stack is rounded to the set's finest step so its
 * blocks can make it. (A team box's step is the unit's, as the page rounds it.)
 */
export function toCompoundSineRequest(v: SineBarFormValues): CompoundSineRequest {
  let resolution: string | undefined;
  if (v.set && !v.set.startsWith('box:')) {
    const boxed = resolveBox('Compound sine plate', { set: v.set, missing: sizeList(v.missing)?.map((s) => new Dec(s)), unit: v.unit === 'mm' ? 'mm' : 'in' });
    if (boxed.ok) resolution = boxed.value.step.toString();
  }
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
