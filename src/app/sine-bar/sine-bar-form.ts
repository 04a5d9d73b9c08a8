import { type SineBarResult, unmakeableStack } from '../../../shared/calc/sine-bar';
import { GAUGE_BLOCK_SETS } from '../../../shared/data/gauge-sets';
import type { LengthUnit } from '../../../shared/units/length-unit';
import type { ResultItem } from '../workbench/result-list';
import type { SineBarSceneInput } from './sine-bar-scene';
import type { SineBarFormValues } from '../../../shared/forms/sine-bar-form';

export { sizeList } from '../../../shared/forms/form-text';
export { compoundFormBox, toCompoundSineRequest, toSineBarRequest, type SineBarFormValues } from '../../../shared/forms/sine-bar-form';

/** Defaults from the demo scenario: a 14°30' face inspected on a 5 in sine plate with the 81-piece set. */
export const SINE_BAR_DEFAULTS: SineBarFormValues = {
  unit: 'in',
  mode: 'angle',
  barLength: '5',
  angle: "14°30'",
  stackHeight: '',
  set: 'inch-81',
  missing: '',
  tableFrom: '10',
  tableTo: '20',
  tableStep: "0°30'",
  compoundBy: 'angles',
  angleB: '10',
  stackB: '',
  lengthB: '',
};

/** Length controls, converted when the unit changes (the block list is not: a set has one unit). */
export const SINE_BAR_LENGTH_FIELDS = ['barLength', 'stackHeight', 'stackB', 'lengthB'] as const;

/** Common bar lengths per unit, offered as one-tap choices. */
export const BAR_LENGTHS: Readonly<Record<LengthUnit, readonly string[]>> = { in: ['2.5', '5', '10'], mm: ['100', '200'] };

/** The standard sets in a unit, for the set picker. */
export function setsInUnit(unit: LengthUnit): { id: string; name: string }[] {
  return GAUGE_BLOCK_SETS.filter((s) => s.unit === unit).map((s) => ({ id: s.id, name: s.name }));
}

/** The default set of a unit (the first listed), for a unit change. */
export function defaultSet(unit: LengthUnit): string {
  return setsInUnit(unit)[0]?.id ?? '';
}

/** The numbers of a sine-bar answer for the result list. */
export function sineBarResultItems(r: SineBarResult, byAngle: boolean): ResultItem[] {
  const u = r.unit;
  const items: ResultItem[] = byAngle
    ? [
        { label: 'Stack height', value: r.stackHeight, unit: u, emphasis: true, note: `Under the high roll, to ${r.resolution} ${u}` },
        { label: 'Angle achieved', value: r.achievedAngleDms, unit: '', note: `${r.achievedAngleDeg}°` },
        { label: 'Angle error', value: r.errorArcSec, unit: '″', note: 'Achieved minus wanted' },
      ]
    : [{ label: 'Angle', value: r.angleDms, unit: '', emphasis: true, note: `${r.angleDeg}°` }];
  if (r.blocks) items.push({ label: 'Blocks', value: r.blocks.join(' + ') || 'none', unit: '', emphasis: byAngle, note: `${r.blockCount} in wringing order, largest first` });
  items.push(
    { label: 'Sensitivity', value: r.sensitivityArcSec, unit: '″', note: `Angle change for ${r.resolution} ${u} of stack` },
    { label: 'Complement', value: r.complementDeg, unit: '°', note: '90° − angle, for setting from the other side' },
  );
  return items;
}

/**
 * The complement set-up's stack in words: with its blocks; or, when the box cannot make it, what
 * to do instead (the engine's "cannot make" wording); or the stack alone without a box, or while
 * the team's box is still being read (`blocks` undefined).
 */
export function complementStackText(c: SineBarResult, blocks: readonly string[] | null | undefined): string {
  const stack = `Stack ${c.stackHeight} ${c.unit}`;
  if (blocks === undefined) return `${stack}.`;
  if (blocks === null) return `${stack}. ${unmakeableStack(c.stackHeight, c.unit, true)}`;
  return `${stack}: ${blocks.join(' + ') || 'no blocks'}.`;
}

/** The drawing's model from an answer. */
export function sineBarSceneInput(r: SineBarResult): SineBarSceneInput {
  const u = r.unit;
  return {
    barLength: Number(r.barLength),
    angleDeg: Number(r.achievedAngleDeg),
    stackHeight: Number(r.stackHeight),
    blocks: (r.blocks ?? []).map((b) => ({ size: Number(b), label: b })),
    labels: { barLength: `L ${r.barLength} ${u}`, stackHeight: `H ${r.stackHeight} ${u}`, angle: r.achievedAngleDms },
  };
}
