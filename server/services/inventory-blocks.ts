import type { InventoryType, InventoryUnit } from '../../shared/api/inventory';
import { Dec } from '../../shared/calc/decimal-math';
import { ANGLE_BLOCK_SETS, findAngleBlockSet } from '../../shared/data/angle-block-sets';
import { GAUGE_BLOCK_SETS, findGaugeSet } from '../../shared/data/gauge-sets';
import { arcSecondsOf } from '../../shared/forms/block-list';

/** A size and count to put in a new set. */
export interface StartingBlock {
  size: string;
  count: number;
}

/** A standard composition a team's set can start from. */
export interface StandardComposition {
  id: string;
  name: string;
  type: InventoryType;
  unit: InventoryUnit;
  blocks: StartingBlock[];
  total: number;
  source: string;
  status: string;
}

/** Sort key of a size (numeric order). */
export function sizeOrder(size: string): Dec {
  return new Dec(size);
}

/** Every standard composition of either type (from the shared data tables). */
export function standardCompositions(): StandardComposition[] {
  const gauge = GAUGE_BLOCK_SETS.map((s) => ({
    id: s.id, name: s.name, type: 'gauge-blocks' as const, unit: s.unit, blocks: s.blocks.map((b) => ({ size: b.size, count: b.count })), total: s.total, source: s.source, status: s.status,
  }));
  const angle = ANGLE_BLOCK_SETS.map((s) => {
    const counts = new Map<number, number>();
    for (const b of s.blocks) {
      const sec = arcSecondsOf(b);
      if (sec !== null) counts.set(sec, (counts.get(sec) ?? 0) + 1);
    }
    const blocks = [...counts].sort((a, b) => b[0] - a[0]).map(([sec, count]) => ({ size: String(sec), count }));
    return { id: s.id, name: s.name, type: 'angle-blocks' as const, unit: 'arcsec' as const, blocks, total: s.blocks.length, source: s.source, status: s.status };
  });
  return [...gauge, ...angle];
}

/** The standard composition of a type with an id, or undefined. */
export function findComposition(type: InventoryType, id: string): StandardComposition | undefined {
  const known = type === 'gauge-blocks' ? findGaugeSet(id) : findAngleBlockSet(id);
  if (!known) return undefined;
  return standardCompositions().find((c) => c.type === type && c.id === id);
}
