/**
 * The angle-block page's form and the engine request it makes (shared/calc/angle-blocks). A set-up
 * saved from that page keeps the form as its inputs; its results and sheet make the same request.
 */
import { type CalcResult, invalid, succeed } from '../calc/step';
import { parseCombination } from './combination-text';

/** What the page works out: the blocks for an angle, or the angle of some blocks. */
export type AngleBlocksMode = 'find' | 'total';

/** The form's values, all as typed. */
export interface AngleBlocksForm {
  /** 'find' the fewest blocks for an angle, or 'total' a combination. */
  mode: AngleBlocksMode;
  /** Standard set id. */
  set: string;
  /** The wanted angle (decimal degrees or DMS). */
  angle: string;
  /** A combination typed as a sum, reversed blocks with a minus. */
  combination: string;
}

/** The engine request for the form: the set with the wanted angle, or with a typed combination. */
export function toAngleBlocksRequest(values: AngleBlocksForm): CalcResult<Record<string, unknown>> {
  if (values.mode === 'total') {
    const typed = parseCombination(values.combination);
    if (!typed.ok) return invalid('Angle blocks', 'combination', typed.error);
    return succeed({ set: values.set, combination: typed.blocks.map((b) => ({ angle: b.angle, reversed: b.reversed })) });
  }
  return succeed({ set: values.set, angle: values.angle });
}

/** The most blocks the engine combines (its search is exhaustive over the blocks given). */
export const MAX_BOX_ANGLE_BLOCKS = 24;

/** DMS text the engine reads for an angle block of a team's box, whose size is kept in seconds of arc ("0°27'0\""). */
export function boxBlockAngle(arcSeconds: number): string {
  const d = Math.floor(arcSeconds / 3600);
  const m = Math.floor((arcSeconds % 3600) / 60);
  return `${d}°${m}'${arcSeconds % 60}"`;
}

/**
 * The blocks of a team's angle-block box the engine may use: each block in it (count less missing
 * and damaged) as DMS text, at most {@link MAX_BOX_ANGLE_BLOCKS}. The inventory route and the
 * angle-block page both solve with this list, so they give the same combination.
 */
export function boxBlockAngles(blocks: ReadonlyArray<{ size: string; available: number }>): string[] {
  return blocks.flatMap((b) => Array.from({ length: Math.max(0, b.available) }, () => boxBlockAngle(Number(b.size)))).slice(0, MAX_BOX_ANGLE_BLOCKS);
}

