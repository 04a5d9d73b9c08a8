/**
 * The sine-bar page's form and the engine request of its single-bar modes (shared/calc/sine-bar).
 * A set-up saved from that page keeps the form as its inputs; its results and sheet make the same
 * request from it.
 */
import type { SineBarRequest } from '../api/calc';
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
