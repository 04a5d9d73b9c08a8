import type { DataStatus } from './gauge-sets';

/** A set of angle gauge blocks. */
export interface AngleBlockSet {
  /** Id used by the API. */
  id: string;
  /** Display name. */
  name: string;
  /** Each block's angle as DMS text. */
  blocks: readonly string[];
  /** Pieces that are not angle blocks (e.g. a square block). */
  extras: readonly string[];
  /** Where the composition comes from. */
  source: string;
  /** How well it is backed. */
  status: DataStatus;
  /** Remarks. */
  notes: string;
}

/** Angle-block sets (REFERENCE.md §6). Blocks add when their marks line up and subtract when reversed. */
export const ANGLE_BLOCK_SETS: readonly AngleBlockSet[] = [
  {
    id: 'angle-13-carvill',
    name: '13-piece set: 12 angle blocks and a square block (handbook listing)',
    blocks: ['1°', '3°', '9°', '27°', '41°', "1'", "3'", "9'", "27'", '3"', '9"', '27"'],
    extras: ['square block'],
    source: "REFERENCE.md §6: Carvill, Mechanical Engineer's Data Handbook p. 270 (OCR)",
    status: 'published',
    notes: 'Twelve angle blocks plus a square block. The OCR seconds list sums to 39", so it is probably incomplete.',
  },
  {
    id: 'angle-13-npl',
    name: '13-piece combination set (1-3-9-27 series)',
    blocks: ['1°', '3°', '9°', '27°', '41°', "1'", "3'", "9'", "27'", '3"', '6"', '18"', '30"'],
    extras: [],
    source: 'REFERENCE.md §6 (from memory; it matches the published NPL range 3" to 81°40\'57" in 3" steps)',
    status: 'from-memory',
    notes: 'Reaches every multiple of 3" up to 81°40\'57".',
  },
  {
    id: 'angle-16',
    name: '16-piece set',
    blocks: ['1°', '3°', '5°', '15°', '30°', '45°', "1'", "3'", "5'", "20'", "30'", '1"', '3"', '5"', '20"', '30"'],
    extras: [],
    source: 'REFERENCE.md §6 (from memory, unverified)',
    status: 'from-memory',
    notes: 'Degrees 1, 3, 5, 15, 30, 45; minutes 1, 3, 5, 20, 30; seconds 1, 3, 5, 20, 30.',
  },
];

/** Finds an angle-block set by id. */
export function findAngleBlockSet(id: string): AngleBlockSet | undefined {
  return ANGLE_BLOCK_SETS.find((s) => s.id === id);
}
