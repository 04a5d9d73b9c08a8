import { type TeamBoxes, namedBox, teamBoxOf } from '../../shared/library/team-boxes';
import { InventoryBlock, InventorySet } from '../models/inventory';

/**
 * The team box a set-up names (`box:<id>` in its set), loaded with what is in it now — only a box
 * of the set-up's own team and of the kind the set-up needs. Empty when it names none or the box
 * is gone; the set-up is then answered on its calculator page only.
 */
export async function teamBoxesFor(teamId: number, kind: string, inputs: Record<string, unknown>): Promise<TeamBoxes> {
  const named = namedBox(kind, inputs);
  if (!named) return new Map();
  const set = await InventorySet.findOne({ where: { id: named.id, teamId, type: named.type }, include: [{ model: InventoryBlock, as: 'blocks' }] });
  if (!set) return new Map();
  const box = teamBoxOf(set);
  return new Map([[box.id, box]]);
}
