/**
 * The blocks of a shop's own (custom) box, typed as text one size per line, and how sizes are
 * marked. The inventory page reads the text with {@link readBlockList} and sends the sizes; the
 * server checks each size again with {@link blockSizeError}.
 */
import { parseAngle } from '../angle/angle-text';
import type { InventoryType, InventoryUnit } from '../api/inventory';
import { DECIMAL_TEXT, withLeadingZero } from '../api/setup';
import { Dec } from '../calc/decimal-math';

/** A size (decimal text: a length in the set's unit, or whole seconds of arc) and how many of it. */
export interface ListedBlock {
  size: string;
  count: number;
}

/** Most blocks of one size a box may list (as the API's count). */
export const MAX_BLOCKS_OF_A_SIZE = 50;
/** Most sizes one box may list (as the API's list). */
export const MAX_SIZES = 200;

/**
 * Longest gauge block a box may list: ISO 3650 covers nominal lengths up to 1000 mm, and inch
 * sets go to 20 in (ASME B89.1.9); 40 in leaves room for a shop's long blocks.
 */
const LONGEST_GAUGE: Readonly<Record<string, string>> = { in: '40', mm: '1000' };
/** Largest angle block: under 90° (a right angle is a square block, not an angle block). */
const LARGEST_ANGLE_ARCSEC = 90 * 3600;

/** Seconds of arc in an angle typed as text, when it is a whole, positive number of seconds. */
export function arcSecondsOf(text: string): number | null {
  const parsed = parseAngle(text);
  if (!parsed.ok) return null;
  // Minutes and seconds are not exact in decimal degrees (1′ = 0.0166…°): round off the last digits.
  const seconds = parsed.degrees.mul(3600).toDecimalPlaces(12);
  return seconds.isInteger() && seconds.gt(0) ? seconds.toNumber() : null;
}

/** "27′", "1°", "3″", "1°30′": how an angle block is marked. */
export function angleLabel(arcSeconds: number): string {
  const d = Math.floor(arcSeconds / 3600);
  const m = Math.floor((arcSeconds % 3600) / 60);
  const s = arcSeconds % 60;
  return [d ? `${d}°` : '', m ? `${m}′` : '', s ? `${s}″` : ''].join('') || '0″';
}

/** How a block of a set is marked: "0.1005 in", "2 mm", "27′". */
export function blockLabel(unit: InventoryUnit, size: string): string {
  if (unit === 'arcsec') return angleLabel(Number(size));
  const d = new Dec(size);
  return `${d.toFixed(Math.max(unit === 'in' ? 3 : 0, d.decimalPlaces()))} ${unit}`;
}

/** What is wrong with a block size of a set of this type and unit, or null. */
export function blockSizeError(type: InventoryType, unit: InventoryUnit, size: string): string | null {
  if (type === 'angle-blocks') {
    if (!/^\d{1,12}(\.\d+)?$/.test(size) || !new Dec(size).gt(0)) return `"${size}" is not a positive size.`;
    const d = new Dec(size);
    if (!d.isInteger()) return `An angle block's size is whole seconds of arc; "${size}" is not.`;
    if (d.gte(LARGEST_ANGLE_ARCSEC)) return `${angleLabel(d.toNumber())} is not an angle block: they are under 90°.`;
    return null;
  }
  if (!DECIMAL_TEXT.test(size) || !new Dec(size).gt(0)) return `"${size}" is not a positive size.`;
  const d = new Dec(size);
  const longest = LONGEST_GAUGE[unit];
  if (longest !== undefined && d.gt(longest)) return `${size} ${unit} is longer than any gauge block (at most ${longest} ${unit}).`;
  return null;
}

/** What {@link readBlockList} makes of the text: the sizes, or the first line that is wrong and why. */
export type BlockListRead = { ok: true; blocks: ListedBlock[]; total: number } | { ok: false; error: string };

/** "× 2", "x2", "*2" at the end of a line: how many of the size. */
const COUNT = /\s*[x×*]\s*(\d+)\s*$/i;
/** "0.101 to 0.149 by 0.001": a series of gauge sizes. */
const SERIES = /^(\S+)\s+to\s+(\S+)\s+(?:by|step)\s+(\S+)$/i;

const lengthOf = (text: string): Dec | null => {
  const t = withLeadingZero(text.trim());
  return DECIMAL_TEXT.test(t) ? new Dec(t) : null;
};

/**
 * Reads a box's blocks typed one size per line (or separated by semicolons): a size alone
 * ("0.1001", or for angle blocks "1°", "27'", "3\""), a size with how many ("0.1001 x 2"), or for
 * gauge blocks a series ("0.101 to 0.149 by 0.001", each once unless "x 2" follows). A size
 * listed twice counts twice. Sizes come back as the API keeps them: lengths as decimal text in
 * the unit, angles in whole seconds of arc, smallest first.
 */
export function readBlockList(type: InventoryType, unit: InventoryUnit, text: string): BlockListRead {
  const counts = new Map<string, { size: Dec; count: number }>();
  const lines = text.split(/[\n;]/).map((l) => l.trim());
  const example = type === 'angle-blocks' ? `e.g. 1°, 27' or 3" x 2` : `e.g. 0.1001, 0.1001 x 2 or 0.101 to 0.149 by 0.001`;
  for (const [i, raw] of lines.entries()) {
    if (raw === '') continue;
    const where = `Line ${i + 1} ("${raw.length > 40 ? raw.slice(0, 40) + '…' : raw}")`;
    const countMatch = COUNT.exec(raw);
    const count = countMatch ? Number(countMatch[1]) : 1;
    if (count < 1 || count > MAX_BLOCKS_OF_A_SIZE) return { ok: false, error: `${where}: the count must be 1 to ${MAX_BLOCKS_OF_A_SIZE}.` };
    const body = countMatch ? raw.slice(0, countMatch.index).trim() : raw;
    let sizes: Dec[];
    const series = type === 'gauge-blocks' ? SERIES.exec(body) : null;
    if (series) {
      const [from, to, step] = [lengthOf(series[1]!), lengthOf(series[2]!), lengthOf(series[3]!)];
      if (!from || !to || !step || !step.gt(0) || !from.gt(0) || to.lt(from)) return { ok: false, error: `${where}: a series runs from a smaller size to a larger one by a positive step, ${example}.` };
      const n = to.minus(from).div(step);
      if (!n.isInteger()) return { ok: false, error: `${where}: ${step.toString()} steps from ${from.toString()} do not land on ${to.toString()}.` };
      if (n.gte(MAX_SIZES)) return { ok: false, error: `${where}: that series has more than ${MAX_SIZES} sizes.` };
      sizes = Array.from({ length: n.toNumber() + 1 }, (_, k) => from.plus(step.mul(k)));
    } else if (type === 'angle-blocks') {
      const seconds = arcSecondsOf(body);
      if (seconds === null) return { ok: false, error: `${where}: not an angle block's size in whole seconds, ${example}.` };
      sizes = [new Dec(seconds)];
    } else {
      const size = lengthOf(body);
      if (!size) return { ok: false, error: `${where}: not a size, ${example} (a point for decimals, at most 6 decimals).` };
      sizes = [size];
    }
    for (const size of sizes) {
      const problem = blockSizeError(type, unit, size.toString());
      if (problem) return { ok: false, error: `${where}: ${problem}` };
      const key = size.toString();
      const seen = counts.get(key);
      const now = (seen?.count ?? 0) + count;
      if (now > MAX_BLOCKS_OF_A_SIZE) return { ok: false, error: `${where}: more than ${MAX_BLOCKS_OF_A_SIZE} blocks of ${blockLabel(unit, key)}.` };
      counts.set(key, { size, count: now });
    }
  }
  if (counts.size === 0) return { ok: false, error: `List the blocks in the box, one size per line, ${example}.` };
  if (counts.size > MAX_SIZES) return { ok: false, error: `At most ${MAX_SIZES} sizes in one box; this list has ${counts.size}.` };
  const blocks = [...counts.values()].sort((a, b) => a.size.cmp(b.size)).map((b) => ({ size: b.size.toString(), count: b.count }));
  return { ok: true, blocks, total: blocks.reduce((n, b) => n + b.count, 0) };
}
