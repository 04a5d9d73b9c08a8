import { formatDegrees, formatDms } from '../angle/angle-text';
import { angleBlocksRequestSchema, parseRequest, type AngleBlocksRequest } from '../api/calc';
import { ANGLE_BLOCK_SETS, findAngleBlockSet } from '../data/angle-block-sets';
import { parseAngle } from '../angle/angle-text';
import { Dec, fixedText } from './decimal-math';
import { guarded, impossible, invalid, step, succeed, type CalcResult, type Step } from './step';

/**
 * Angle gauge blocks: blocks wrung with their marks in line add, a reversed block subtracts
 * (lab sheet "To develop the required angle with the help of angle gauge", REFERENCE.md §6).
 * The fewest-blocks search works on whole arc-seconds: meet in the middle, each half of the set
 * enumerated over {−1, 0, +1} per block (3ⁿᐟ² sums), the halves matched by binary search — exact,
 * and it also gives the nearest reachable angle when the wanted one cannot be made.
 */

/** One block in a combination. */
export interface AngleBlockUse {
  /** The block's angle as DMS. */
  angle: string;
  /**
   * The block's angle, decimal degrees to 6 places (0.000001°): blocks come in whole seconds of
   * arc, and at 0.0001° (0.36″) a 1″ or 3″ block would read 1.08″ or 2.88″.
   */
  angleDeg: string;
  /** 'add' (marks in line) or 'reverse' (turned end for end: subtracts). */
  direction: 'add' | 'reverse';
}

/** Answer of {@link calculateAngleBlocks}. */
export interface AngleBlocksResult {
  /** Set id, or null for a custom set. */
  set: string | null;
  /** The wanted angle, decimal degrees to 6 places (null when totalling a given combination). */
  targetDeg: string | null;
  /** The wanted angle as DMS. */
  targetDms: string | null;
  /** Blocks used, largest first. */
  blocks: AngleBlockUse[];
  /** Number of blocks. */
  count: number;
  /** The angle the blocks make, decimal degrees to 6 places (whole seconds, as for each block). */
  achievedAngleDeg: string;
  /** The angle the blocks make, DMS. */
  achievedAngleDms: string;
  /** achieved − wanted, arc-seconds (0 for an exact match or a given combination). */
  errorArcSec: string;
  /** True when the blocks make the wanted angle exactly. */
  exact: boolean;
  /** Notes. */
  warnings: string[];
  /** The derivation. */
  steps: Step[];
}

interface Half {
  /** Sums (arc-seconds), ascending, one entry per distinct sum. */
  sums: Int32Array;
  /** Fewest blocks for each sum. */
  counts: Uint8Array;
  /** Base-3 code of the assignment (digit 0: unused, 1: add, 2: reverse). */
  codes: Float64Array;
}

/** Enumerates every assignment of {unused, add, reverse} over `blocks`, keeping the fewest per sum. */
function enumerateHalf(blocks: readonly number[]): Half {
  const best = new Map<number, { count: number; code: number }>();
  const total = 3 ** blocks.length;
  for (let code = 0; code < total; code++) {
    let rest = code;
    let sum = 0;
    let count = 0;
    for (const b of blocks) {
      const digit = rest % 3;
      rest = (rest - digit) / 3;
      if (digit === 1) sum += b;
      else if (digit === 2) sum -= b;
      if (digit) count++;
    }
    const seen = best.get(sum);
    if (!seen || count < seen.count) best.set(sum, { count, code });
  }
  const keys = [...best.keys()].sort((a, b) => a - b);
  return {
    sums: Int32Array.from(keys),
    counts: Uint8Array.from(keys.map((k) => best.get(k)!.count)),
    codes: Float64Array.from(keys.map((k) => best.get(k)!.code)),
  };
}

interface Matcher {
  blocks: number[];
  left: number[];
  right: number[];
  a: Half;
  b: Half;
}

const MATCHERS = new Map<string, Matcher>();

function matcherFor(blocks: number[]): Matcher {
  const key = blocks.join(',');
  let m = MATCHERS.get(key);
  if (!m) {
    const sorted = [...blocks].sort((x, y) => y - x);
    const left = sorted.filter((_, i) => i % 2 === 0);
    const right = sorted.filter((_, i) => i % 2 === 1);
    m = { blocks: sorted, left, right, a: enumerateHalf(left), b: enumerateHalf(right) };
    if (MATCHERS.size > 16) MATCHERS.delete(MATCHERS.keys().next().value as string);
    MATCHERS.set(key, m);
  }
  return m;
}

/** Index of the first sum ≥ x. */
function lowerIndex(sums: Int32Array, x: number): number {
  let lo = 0;
  let hi = sums.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sums[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Decodes a base-3 assignment into signed block values. */
function decode(blocks: readonly number[], code: number): number[] {
  const out: number[] = [];
  let rest = code;
  for (const b of blocks) {
    const digit = rest % 3;
    rest = (rest - digit) / 3;
    if (digit === 1) out.push(b);
    else if (digit === 2) out.push(-b);
  }
  return out;
}

/**
 * Fewest signed blocks (arc-seconds) whose sum is nearest to `target` (exact when possible),
 * ties broken by fewer blocks. Returns the signed values, largest magnitude first.
 */
export function nearestAngleCombination(blocks: number[], target: number): number[] {
  const m = matcherFor(blocks);
  let bestErr = Infinity;
  let bestCount = Infinity;
  let bestA = 0;
  let bestB = 0;
  for (let i = 0; i < m.a.sums.length; i++) {
    const want = target - m.a.sums[i];
    const j = lowerIndex(m.b.sums, want);
    for (const k of [j - 1, j]) {
      if (k < 0 || k >= m.b.sums.length) continue;
      const sum = m.a.sums[i] + m.b.sums[k];
      if (sum <= 0) continue;
      const err = Math.abs(sum - target);
      const count = m.a.counts[i] + m.b.counts[k];
      if (err < bestErr - 1e-9 || (Math.abs(err - bestErr) <= 1e-9 && count < bestCount)) {
        bestErr = err;
        bestCount = count;
        bestA = i;
        bestB = k;
      }
    }
  }
  if (!Number.isFinite(bestErr)) return [];
  return [...decode(m.left, m.a.codes[bestA]), ...decode(m.right, m.b.codes[bestB])].sort((x, y) => Math.abs(y) - Math.abs(x));
}

const AREA = 'Angle blocks';

/** Whole arc-seconds of an angle given in degrees, or null when it is not a whole number of seconds. */
function toSeconds(deg: Dec): number | null {
  const s = deg.mul(3600);
  const rounded = s.toDecimalPlaces(0);
  return s.minus(rounded).abs().lt('1e-20') ? rounded.toNumber() : null;
}

function use(seconds: number): AngleBlockUse {
  const deg = new Dec(Math.abs(seconds)).div(3600);
  return { angle: formatDms(deg), angleDeg: formatDegrees(deg, 6), direction: seconds < 0 ? 'reverse' : 'add' };
}

/**
 * Angle blocks: with `angle`, the fewest blocks of the set (each added or reversed) that make
 * it, or the nearest angle the set can make and its error; with `combination`, the angle those
 * blocks make.
 */
export function calculateAngleBlocks(input: AngleBlocksRequest | unknown): CalcResult<AngleBlocksResult> {
  return guarded<AngleBlocksResult>(AREA, () => {
    const parsed = parseRequest(AREA, angleBlocksRequestSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    if (p.set && p.blocks) return invalid(AREA, 'blocks', 'give a set or a blocks list, not both');
    let blockDegrees: Dec[] | null = null;
    if (p.set) {
      const set = findAngleBlockSet(p.set);
      if (!set) return invalid(AREA, 'set', `unknown set "${p.set}"; known sets: ${ANGLE_BLOCK_SETS.map((s) => s.id).join(', ')}`);
      blockDegrees = set.blocks.map((b) => {
        const parsedBlock = parseAngle(b);
        if (!parsedBlock.ok) throw new Error(`angle-block set ${set.id}: bad block ${b}`);
        return parsedBlock.degrees;
      });
    } else if (p.blocks) {
      blockDegrees = p.blocks;
    }
    const blockSeconds = blockDegrees?.map(toSeconds) ?? null;
    if (blockSeconds && blockSeconds.some((s) => s === null)) {
      return invalid(AREA, `blocks.${blockSeconds.findIndex((s) => s === null)}`, 'must be a whole number of arc-seconds');
    }
    const steps: Step[] = [];
    const warnings: string[] = [];

    if (p.combination) {
      if (p.angle) return invalid(AREA, 'combination', 'give angle or combination, not both');
      const left = blockSeconds ? [...(blockSeconds as number[])] : null;
      let total = new Dec(0);
      const used: AngleBlockUse[] = [];
      for (const [i, c] of p.combination.entries()) {
        const s = c.angle.mul(3600).toDecimalPlaces(6);
        if (left) {
          const at = left.findIndex((b) => new Dec(b).eq(s));
          if (at < 0) {
            const inSet = (blockSeconds as number[]).filter((b) => new Dec(b).eq(s)).length;
            const why = inSet === 0 ? 'is not in the set, or is marked missing or damaged' : `is used more often than the set has it (${inSet} ${inSet === 1 ? 'block' : 'blocks'})`;
            return invalid(AREA, `combination.${i}.angle`, `${formatDms(c.angle)} ${why}`);
          }
          left.splice(at, 1);
        }
        total = c.reversed ? total.minus(c.angle) : total.plus(c.angle);
        used.push({ angle: formatDms(c.angle), angleDeg: formatDegrees(c.angle, 6), direction: c.reversed ? 'reverse' : 'add' });
      }
      const text = used.map((u, i) => `${u.direction === 'reverse' ? '− ' : i ? '+ ' : ''}${u.angle}`).join(' ');
      steps.push(step('Angle of the combination', 'θ = Σ added − Σ reversed', text, formatDms(total), ''));
      if (total.isZero()) warnings.push('The reversed blocks cancel the added ones: the combination makes 0°, a level face.');
      else if (total.lt(0)) warnings.push('The reversed blocks outweigh the added ones: the combination leans the other way.');
      return succeed({
        set: p.set ?? null,
        targetDeg: null,
        targetDms: null,
        blocks: used,
        count: used.length,
        achievedAngleDeg: formatDegrees(total, 6),
        achievedAngleDms: formatDms(total),
        errorArcSec: '0.00',
        exact: true,
        warnings,
        steps,
      });
    }

    if (!p.angle) return invalid(AREA, 'angle', 'is required (or give a combination to total)');
    if (!blockSeconds) return invalid(AREA, 'set', 'give a set id (e.g. angle-13-npl) or a blocks list');
    // In seconds, rounded far below any block: 6″ typed is 0.00166…° and must not exceed the set by its last digit.
    const targetSeconds = p.angle.mul(3600).toDecimalPlaces(9);
    const reach = (blockSeconds as number[]).reduce((a, b) => a + b, 0);
    if (targetSeconds.gt(reach)) {
      return impossible(
        AREA,
        'angle',
        `is beyond the set: all its blocks added together make ${formatDms(new Dec(reach).div(3600))}. Set the work on a square or an angle plate for 90° and build the rest from blocks, or use a sine plate (common practice)`,
      );
    }
    const signed = nearestAngleCombination(blockSeconds as number[], targetSeconds.toNumber());
    if (signed.length === 0) return impossible(AREA, 'angle', 'no combination of these blocks makes a positive angle');
    const achievedSeconds = signed.reduce((a, b) => a + b, 0);
    const achieved = new Dec(achievedSeconds).div(3600);
    const error = new Dec(achievedSeconds).minus(targetSeconds);
    const exact = error.isZero();
    const used = signed.map(use);
    const text = used.map((u, i) => `${u.direction === 'reverse' ? '− ' : i ? '+ ' : ''}${u.angle}`).join(' ');
    steps.push(step('Blocks (marks in line add, reversed subtract)', 'θ = Σ added − Σ reversed', text, formatDms(achieved), ''));
    steps.push(step('Error', 'e = (θ − wanted) · 3600', `e = (${formatDms(achieved)} − ${formatDms(p.angle, 1)})`, fixedText(error, 2), '″'));
    if (!exact) warnings.push(`The set cannot make ${formatDms(p.angle, 1)} exactly; the nearest is ${formatDms(achieved)} (${fixedText(error, 2)}″).`);
    return succeed({
      set: p.set ?? null,
      targetDeg: formatDegrees(p.angle, 6),
      targetDms: formatDms(p.angle, 1),
      blocks: used,
      count: used.length,
      achievedAngleDeg: formatDegrees(achieved, 6),
      achievedAngleDms: formatDms(achieved),
      errorArcSec: fixedText(error, 2),
      exact,
      warnings,
      steps,
    });
  });
}
