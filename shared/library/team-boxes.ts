/**
 * A team's own block boxes (the inventory's gauge-block and angle-block sets) as saved set-ups are
 * answered with them. A set-up saved with one names it as `box:<id>` in its set; the library page,
 * the set-up sheet and the release check load that box and solve with what is in it now — the
 * same blocks the calculator page and the inventory route use.
 */
import { type GaugeStackRequest, MAX_SOLVER_BLOCKS_OF_A_SIZE } from '../api/calc';
import { GAUGE_GRADES, type InventorySetDto } from '../api/inventory';
import { Dec } from '../calc/decimal-math';
import { type GaugeBox, calculateGaugeStack, resolveBox } from '../calc/gauge-stack';
import { boxIdOf } from '../forms/gauge-blocks-form';

/** A team box: its name and the blocks in it, with how many of each may be used. */
export interface TeamBox {
  readonly id: number;
  readonly type: 'gauge-blocks' | 'angle-blocks';
  readonly name: string;
  readonly unit: string;
  readonly grade: string | null;
  readonly wearBlockSize: string | null;
  readonly wearBlockCount: number;
  /** Each size with how many are usable (count less missing and damaged). */
  readonly blocks: ReadonlyArray<{ readonly size: string; readonly available: number }>;
}

/** A set as the inventory keeps it (its DTO, or the server's row with its blocks), as a box to answer set-ups with. */
export function teamBoxOf(set: Pick<InventorySetDto, 'id' | 'type' | 'name' | 'unit' | 'grade' | 'wearBlockSize' | 'wearBlockCount'> & { blocks?: ReadonlyArray<{ size: string; available: number }> | undefined }): TeamBox {
  return {
    id: set.id,
    type: set.type,
    name: set.name,
    unit: set.unit,
    grade: set.grade ?? null,
    wearBlockSize: set.wearBlockSize ?? null,
    wearBlockCount: set.wearBlockCount,
    blocks: (set.blocks ?? []).map((b) => ({ size: b.size, available: b.available })),
  };
}

/** The boxes at hand, by id. */
export type TeamBoxes = ReadonlyMap<number, TeamBox>;

/** The team box a set-up of this kind names, with the type of box it must be; or null. */
export function namedBox(kind: string, inputs: Record<string, unknown>): { id: number; type: TeamBox['type'] } | null {
  const set = inputs['set'];
  if (typeof set !== 'string') return null;
  const id = boxIdOf(set);
  if (id === null) return null;
  if (kind === 'gauge-blocks' || kind === 'sine-bar') return { id, type: 'gauge-blocks' };
  if (kind === 'angle-blocks') return { id, type: 'angle-blocks' };
  return null;
}

/**
 * The gauge-stack request for a stack from a box, as the inventory route makes it: the usable
 * blocks, the grade asked for or else the box's own, the box's wear-block pair when wanted and the
 * box has two. Null when every block is marked missing or damaged.
 */
export function boxStackRequest(box: Omit<TeamBox, 'id' | 'type' | 'name'>, q: { target: string; grade?: string | undefined; wear: boolean }): GaugeStackRequest | null {
  const usable = box.blocks.filter((b) => b.available > 0);
  if (usable.length === 0) return null;
  const grade = q.grade ?? (box.grade && (GAUGE_GRADES as readonly string[]).includes(box.grade) ? box.grade : undefined);
  const wearBlocks = q.wear && box.wearBlockSize && box.wearBlockCount >= 2 ? box.wearBlockSize : undefined;
  return {
    target: q.target,
    unit: box.unit as GaugeStackRequest['unit'],
    // A box may hold more of a size (shims) than any stack uses; the solver takes at most its limit.
    blocks: usable.map((b) => ({ size: b.size, count: Math.min(b.available, MAX_SOLVER_BLOCKS_OF_A_SIZE) })),
    grade: grade as GaugeStackRequest['grade'],
    wearBlocks,
  };
}

/**
 * The fewest blocks from a box for a stack (largest first), as the inventory route picks them: none
 * for a zero stack, null when the box cannot make it.
 */
export function boxStackBlocks(box: Omit<TeamBox, 'id' | 'type' | 'name'>, stack: string): string[] | null {
  if (Number(stack) === 0) return [];
  const request = boxStackRequest(box, { target: stack, wear: false });
  const found = request ? calculateGaugeStack(request) : null;
  return found?.ok ? found.value.blocks : null;
}

/**
 * A box as the stack solver sees it, with the blocks the inventory route would use (the usable
 * ones, at most the solver's limit of a size): for answers that need several stacks from the box
 * at once, such as the two stacks of a compound plate. Null when no block is usable or the box
 * is in neither inches nor millimetres.
 */
export function teamGaugeBox(box: Omit<TeamBox, 'id' | 'type' | 'name'>): GaugeBox | null {
  if (box.unit !== 'in' && box.unit !== 'mm') return null;
  const usable = box.blocks.filter((b) => b.available > 0);
  if (usable.length === 0) return null;
  // A size that is not a number (never from the inventory, which checks them) gives no box.
  if (!usable.every((b) => /^\d+(\.\d+)?$/.test(b.size))) return null;
  const blocks = usable.map((b) => ({ size: new Dec(b.size), count: Math.min(b.available, MAX_SOLVER_BLOCKS_OF_A_SIZE) }));
  const resolved = resolveBox('Gauge stack', { blocks, unit: box.unit });
  return resolved.ok ? resolved.value : null;
}
