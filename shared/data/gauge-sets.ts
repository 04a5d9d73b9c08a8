import { Dec } from '../calc/decimal-math';
import type { LengthUnit } from '../units/length-unit';

/** How well a data table is backed (REFERENCE.md labels). */
export type DataStatus = 'published' | 'published-secondary' | 'from-memory';

/** Blocks of one size in a set. */
export interface BlockCount {
  /** Nominal size as decimal text in the set's unit. */
  size: string;
  /** How many blocks of that size the set holds. */
  count: number;
}

/** A standard gauge-block set composition. */
export interface GaugeBlockSet {
  /** Id used by the API (e.g. "inch-81"). */
  id: string;
  /** Display name. */
  name: string;
  /** Unit of every size. */
  unit: LengthUnit;
  /** Every size with its count. */
  blocks: readonly BlockCount[];
  /** Total number of blocks. */
  total: number;
  /** Where the composition comes from. */
  source: string;
  /** How well the composition is backed. */
  status: DataStatus;
  /** Remarks (series, caveats). */
  notes: string;
}

/** Sizes from `from` to `to` in steps of `by`, as decimal text with `decimals` places. */
function series(from: string, to: string, by: string, decimals: number): string[] {
  const out: string[] = [];
  for (let x = new Dec(from); x.lte(to); x = x.plus(by)) out.push(x.toFixed(decimals));
  return out;
}

function makeSet(meta: Omit<GaugeBlockSet, 'blocks' | 'total'>, sizes: readonly string[]): GaugeBlockSet {
  const counts = new Map<string, number>();
  for (const s of sizes) {
    const key = new Dec(s).toString();
    counts.set(key, (counts.get(key) ?? 0) + 1);
  }
  const blocks = [...counts].map(([size, count]) => ({ size, count })).sort((a, b) => new Dec(a.size).cmp(b.size));
  return { ...meta, blocks, total: sizes.length };
}

/** Standard gauge-block sets, by id. */
export const GAUGE_BLOCK_SETS: readonly GaugeBlockSet[] = [
  makeSet(
    {
      id: 'inch-81',
      name: 'Inch 81-piece set',
      unit: 'in',
      source: 'REFERENCE.md §3.2: "Jo Block Stacks" course text; consistent with Starrett-Webber GB49 (.106 .116 .126 .136 .146 in the 81 set)',
      status: 'published',
      notes: '.1001–.1009 by .0001 (9); .101–.149 by .001 (49); .050–.950 by .050 (19); 1, 2, 3, 4 in (4).',
    },
    [...series('0.1001', '0.1009', '0.0001', 4), ...series('0.101', '0.149', '0.001', 3), ...series('0.050', '0.950', '0.050', 3), '1', '2', '3', '4'],
  ),
  makeSet(
    {
      id: 'metric-112',
      name: 'Metric 112-piece set (M 112)',
      unit: 'mm',
      source: 'REFERENCE.md §3.4: askfilo M112 table (its "70" read as 75); the name M 112 is used by NPL',
      status: 'published-secondary',
      notes: '1.0005 (1); 1.001–1.009 by 0.001 (9); 1.01–1.49 by 0.01 (49); 0.5–24.5 by 0.5 (49); 25, 50, 75, 100 (4).',
    },
    ['1.0005', ...series('1.001', '1.009', '0.001', 3), ...series('1.01', '1.49', '0.01', 2), ...series('0.5', '24.5', '0.5', 1), '25', '50', '75', '100'],
  ),
  makeSet(
    {
      id: 'metric-78-bs888',
      name: 'Metric 78-piece set (BS 888 M78)',
      unit: 'mm',
      source: "REFERENCE.md §3.4: Carvill, Mechanical Engineer's Data Handbook p. 269 (OCR)",
      status: 'published',
      notes: '1.01–1.49 by 0.01 (49); 0.50–9.50 by 0.50 (19); 10, 20, 30, 40, 50, 75, 100 (7); 1.0025, 1.005, 1.0075 (3).',
    },
    [...series('1.01', '1.49', '0.01', 2), ...series('0.5', '9.5', '0.5', 1), '10', '20', '30', '40', '50', '75', '100', '1.0025', '1.005', '1.0075'],
  ),
  makeSet(
    {
      id: 'metric-56',
      name: 'Metric 56-piece set',
      unit: 'mm',
      source: 'REFERENCE.md §3.4: apps.elegantwallp.com "slip gauges"',
      status: 'published-secondary',
      notes: '1.001–1.009 (9); 1.01–1.09 (9); 1.1–1.9 (9); 1–25 by 1 (25); 25–75 by 25 (3); 1.0005 (1). 25 appears twice.',
    },
    [...series('1.001', '1.009', '0.001', 3), ...series('1.01', '1.09', '0.01', 2), ...series('1.1', '1.9', '0.1', 1), ...series('1', '25', '1', 0), '25', '50', '75', '1.0005'],
  ),
  makeSet(
    {
      id: 'metric-87',
      name: 'Metric 87-piece set',
      unit: 'mm',
      source: 'REFERENCE.md §3.4 (from memory, unverified)',
      status: 'from-memory',
      notes: '1.001–1.009 (9); 1.01–1.49 (49); 0.5–9.5 by 0.5 (19); 10–100 by 10 (10).',
    },
    [...series('1.001', '1.009', '0.001', 3), ...series('1.01', '1.49', '0.01', 2), ...series('0.5', '9.5', '0.5', 1), ...series('10', '100', '10', 0)],
  ),
  makeSet(
    {
      id: 'metric-88',
      name: 'Metric 88-piece set',
      unit: 'mm',
      source: 'REFERENCE.md §3.4 (from memory, unverified)',
      status: 'from-memory',
      notes: 'The 87-piece set plus 1.0005.',
    },
    ['1.0005', ...series('1.001', '1.009', '0.001', 3), ...series('1.01', '1.49', '0.01', 2), ...series('0.5', '9.5', '0.5', 1), ...series('10', '100', '10', 0)],
  ),
  makeSet(
    {
      id: 'metric-103',
      name: 'Metric 103-piece set',
      unit: 'mm',
      source: 'REFERENCE.md §3.4 (from memory, unverified)',
      status: 'from-memory',
      notes: '1.005 (1); 1.01–1.49 (49); 0.5–24.5 by 0.5 (49); 25, 50, 75, 100 (4).',
    },
    ['1.005', ...series('1.01', '1.49', '0.01', 2), ...series('0.5', '24.5', '0.5', 1), '25', '50', '75', '100'],
  ),
  makeSet(
    {
      id: 'inch-36',
      name: 'Inch 36-piece set',
      unit: 'in',
      source: 'REFERENCE.md §3.3 (from memory, unverified; Starrett-Webber GB49 confirms only .1002 and .106)',
      status: 'from-memory',
      notes: '.1001–.1009 (9); .101–.109 (9); .110–.190 by .010 (9); .100–.500 by .100 (5); 1, 2, 4 in (3); .050 (1).',
    },
    [...series('0.1001', '0.1009', '0.0001', 4), ...series('0.101', '0.109', '0.001', 3), ...series('0.110', '0.190', '0.010', 3), ...series('0.100', '0.500', '0.100', 3), '1', '2', '4', '0.050'],
  ),
];

/** Finds a standard set by id. */
export function findGaugeSet(id: string): GaugeBlockSet | undefined {
  return GAUGE_BLOCK_SETS.find((s) => s.id === id);
}
