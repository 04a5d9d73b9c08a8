import { z } from 'zod';
import { MAX_LENGTH } from './calc';
import { DECIMAL_TEXT, withLeadingZero } from './setup';

/** The two kinds of block set a team keeps. */
export const INVENTORY_TYPES = ['gauge-blocks', 'angle-blocks'] as const;
export type InventoryType = (typeof INVENTORY_TYPES)[number];

/** Unit of a set's block sizes: gauge blocks in inch or mm, angle blocks in seconds of arc (exact integers). */
export type InventoryUnit = 'in' | 'mm' | 'arcsec';

/** One size of block in a team's box, with how many the box should hold and how many are out of use. */
export interface InventoryBlockDto {
  id: number;
  /** Size as decimal text: length in the set's unit, or an angle in seconds of arc. */
  size: string;
  /** The size as people read it ("0.1005 in", "27′"). */
  label: string;
  count: number;
  missing: number;
  damaged: number;
  /** count − missing − damaged: what the solver may use. */
  available: number;
  note: string;
}

/** A team's gauge-block or angle-block set. */
export interface InventorySetDto {
  id: number;
  type: InventoryType;
  name: string;
  unit: InventoryUnit;
  /** Id of the standard composition it started from, or null for a custom set. */
  standardSet: string | null;
  /** Accuracy grade of the set (gauge blocks: ISO 3650 K, 0, 1, 2; angle blocks: free text). */
  grade: string | null;
  /** Thickness of the wear blocks kept with the set (gauge blocks only), or null. */
  wearBlockSize: string | null;
  wearBlockCount: number;
  notes: string;
  version: number;
  totals: { sizes: number; blocks: number; missing: number; damaged: number; available: number };
  blocks?: InventoryBlockDto[];
  createdAt: string;
  updatedAt: string;
}

/** GET /api/inventories. */
export interface InventoryListDto {
  gaugeSets: InventorySetDto[];
  angleSets: InventorySetDto[];
}

const count = (what: string) => z.number({ error: `${what} must be a whole number.` }).int(`${what} must be a whole number.`).min(0, `${what} must be 0 or more.`).max(50, `${what} must be at most 50.`);
const sizeText = z
  .union([z.string(), z.number()], { error: 'Size must be a number.' })
  .transform((v) => (typeof v === 'number' ? String(v) : v.trim()))
  .refine((v) => DECIMAL_TEXT.test(v) && Number(v) > 0, 'Size must be a positive decimal number (at most 6 decimals).');

/** A block size with its count, for a custom set. */
export const inventoryBlockInput = z.object({ size: sizeText, count: count('Count').refine((n) => n >= 1, 'Count must be at least 1.') });

/** POST /api/inventories/gauge-sets and /angle-sets. Give `standardSet` to start from a standard composition, or `blocks`. */
export const inventoryCreateBody = z.object({
  name: z.string({ error: 'Give the set a name.' }).trim().min(1, 'Give the set a name.').max(120, 'Keep the name under 120 characters.'),
  standardSet: z.string({ error: 'Standard set must be a set id.' }).min(1).max(40).optional(),
  /** Custom composition (used when no standard set is given). Gauge sizes need `unit`. */
  blocks: z.array(inventoryBlockInput, { error: 'Blocks must be a list of {size, count}.' }).min(1, 'List at least one block.').max(200, 'At most 200 sizes.').optional(),
  unit: z.enum(['in', 'mm'], { error: 'Unit must be in or mm.' }).optional(),
  grade: z.string({ error: 'Grade must be text.' }).trim().max(20, 'Keep the grade under 20 characters.').nullable().optional(),
  wearBlockSize: sizeText.nullable().optional(),
  // 0 or 2 is checked with the thickness (blockSetDetailErrors), so all wrong details are said at once.
  wearBlockCount: z.number({ error: 'Wear blocks must be a whole number: 0 or 2.' }).int('Wear blocks must be a whole number: 0 or 2.').min(0, 'Wear blocks must be 0 or 2.').optional(),
  notes: z.string({ error: 'Notes must be text.' }).max(4_000, 'Keep the notes under 4,000 characters.').optional(),
});
export type InventoryCreateBody = z.infer<typeof inventoryCreateBody>;

/** Accuracy grades of gauge blocks (ISO 3650); the stack solver works with these. */
export const GAUGE_GRADES = ['K', '0', '1', '2'] as const;

/** Thickest wear block a gauge set may keep, per unit (common practice: 0.050 or 0.100 in, 1 or 2 mm). */
const MAX_WEAR_BLOCK: Readonly<Record<string, number>> = { in: 0.25, mm: 6 };

/**
 * What is wrong with a gauge set's grade and wear blocks for its unit (field → message), or
 * nothing. Angle-block grades are free text.
 */
export function blockSetDetailErrors(type: InventoryType, unit: string, d: { grade?: string | null | undefined; wearBlockSize?: string | null | undefined; wearBlockCount?: number | undefined }): Record<string, string> {
  const errors: Record<string, string> = {};
  if (type !== 'gauge-blocks') return errors;
  if (d.grade && !(GAUGE_GRADES as readonly string[]).includes(d.grade)) errors['grade'] = `Grade must be one of ${GAUGE_GRADES.join(', ')} (ISO 3650), or left empty.`;
  const most = MAX_WEAR_BLOCK[unit];
  if (d.wearBlockSize && most !== undefined && Number(d.wearBlockSize) > most) errors['wearBlockSize'] = `A wear block is a thin end block: at most ${most} ${unit}.`;
  // The stack solver puts wear blocks at both ends of a stack, so a set keeps a pair or none.
  if (d.wearBlockCount !== undefined && d.wearBlockCount !== 0 && d.wearBlockCount !== WEAR_PAIR) errors['wearBlockCount'] = 'Wear blocks come as a pair, one for each end of the stack: 0 or 2.';
  else if (d.wearBlockCount === WEAR_PAIR && !d.wearBlockSize) errors['wearBlockSize'] = 'Give the thickness of the two wear blocks, or set the wear blocks to 0.';
  else if (d.wearBlockCount === 0 && d.wearBlockSize) errors['wearBlockCount'] = 'A thickness is given, so say 2 wear blocks, or clear the thickness.';
  return errors;
}

/** How many wear blocks a set keeps when it keeps any: one for each end of a stack. */
export const WEAR_PAIR = 2;

/**
 * The set's wear blocks as they stand after an edit: what the body gives, else what the set has.
 * A thickness given without a count means the pair; clearing the thickness with no count, none.
 */
export function wearBlocksAfter(set: { wearBlockSize: string | null; wearBlockCount: number }, body: { wearBlockSize?: string | null | undefined; wearBlockCount?: number | undefined }): { wearBlockSize: string | null; wearBlockCount: number } {
  const wearBlockSize = body.wearBlockSize === undefined ? set.wearBlockSize : body.wearBlockSize;
  const wearBlockCount = body.wearBlockCount ?? (body.wearBlockSize === undefined ? set.wearBlockCount : wearBlockSize ? WEAR_PAIR : 0);
  return { wearBlockSize, wearBlockCount };
}

/** Whether a set holds the pair of wear blocks a stack can be built between. */
export function hasWearPair(set: { type?: InventoryType; wearBlockSize: string | null; wearBlockCount: number }): boolean {
  return (set.type === undefined || set.type === 'gauge-blocks') && !!set.wearBlockSize && set.wearBlockCount >= WEAR_PAIR;
}

/** PUT /api/inventories/{gauge,angle}-sets/:id: the set's own fields, with the version it was based on. */
export const inventoryUpdateBody = z.object({
  name: inventoryCreateBody.shape.name,
  grade: inventoryCreateBody.shape.grade,
  wearBlockSize: inventoryCreateBody.shape.wearBlockSize,
  wearBlockCount: inventoryCreateBody.shape.wearBlockCount,
  notes: inventoryCreateBody.shape.notes,
  version: z.number({ error: 'Send the version your edit is based on.' }).int().positive(),
});
export type InventoryUpdateBody = z.input<typeof inventoryUpdateBody>;

/** Longest note on one block size (why it is missing or damaged). */
export const BLOCK_NOTE_MAX = 200;

/** PATCH …/blocks/:blockId: mark blocks missing or damaged, change the count, or note why. */
export const inventoryBlockPatch = z
  .object({
    count: count('Count').optional(),
    missing: count('Missing').optional(),
    damaged: count('Damaged').optional(),
    note: z.string({ error: 'Note must be text.' }).trim().max(BLOCK_NOTE_MAX, `Keep the note under ${BLOCK_NOTE_MAX} characters.`).optional(),
  })
  .refine((b) => Object.keys(b).length > 0, 'Send count, missing, damaged or note.');
export type InventoryBlockPatch = z.infer<typeof inventoryBlockPatch>;

/** Query of GET /api/inventories/gauge-sets/:id/stack. */
export const inventoryStackQuery = z.object({
  // Messages say what is wrong without the field's name (as /api/calc does); the page puts its own label before them.
  target: z
    .string({ error: 'is empty; type the length, e.g. 2.0084' })
    .trim()
    // ".5" as typed on the shop floor is 0.5.
    .transform(withLeadingZero)
    .superRefine((v, ctx) => {
      const problem = stackTargetProblem(v);
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    }),
  grade: z.enum(['K', '0', '1', '2'], { error: 'must be one of K, 0, 1, 2' }).optional(),
  wear: z.enum(['yes', 'no'], { error: 'must be yes or no' }).optional(),
});

/** Names of the stack query's fields, for the sentence the route answers with. */
export const STACK_QUERY_FIELDS: Readonly<Record<string, string>> = { target: 'Target', grade: 'Grade', wear: 'Wear' };

/** What is wrong with a typed stack length, said without its name; null when it is a length. */
function stackTargetProblem(v: string): string | null {
  if (v === '') return 'is empty; type the length, e.g. 2.0084';
  if (!/^-?\d+(\.\d+)?$/.test(v)) return 'must be a decimal number such as 2.0084';
  if (Number(v) <= 0) return 'must be greater than 0';
  if ((v.split('.')[1] ?? '').length > 6) return 'must have at most 6 decimals';
  // MAX_LENGTH has no more digits than DECIMAL_TEXT allows, so a length within it is also valid text.
  if (Number(v) > MAX_LENGTH) return `must be at most ${MAX_LENGTH}`;
  return null;
}

/** Query of GET /api/inventories/angle-sets/:id/combination. */
export const inventoryAngleQuery = z.object({
  angle: z.string({ error: 'Give the angle, e.g. 17°35\'.' }).trim().min(1, 'Give the angle, e.g. 17°35\'.').max(40),
});
