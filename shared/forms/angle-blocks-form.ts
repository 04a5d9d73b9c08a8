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
