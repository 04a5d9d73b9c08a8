import { gaugeStackRequestSchema, parseRequest, type GaugeStackRequest } from '../api/calc';
import { findGaugeSet, GAUGE_BLOCK_SETS } from '../data/gauge-sets';
import { GRADE_STATUS, LENGTH_TOLERANCES, REFERENCE_TEMPERATURE_C, STEEL_EXPANSION_PER_K, type GaugeGrade } from '../data/gauge-tolerances';
import { MM_PER_INCH, type LengthUnit } from '../units/length-unit';
import { Dec, fixedText, sqrt } from './decimal-math';
import { MAX_TARGET, StackSolver } from './stack-solver';
import { blockCountStep, guarded, impossible, invalid, step, succeed, type CalcResult, type Step } from './step';

/** Most decimals a block size may have (0.0001 in / 0.0001 mm). */
export const MAX_BLOCK_DECIMALS = 4;
/** Most physical blocks in a box. */
export const MAX_BOX_BLOCKS = 300;

/** A box of gauge blocks as the solver sees it. */
export interface GaugeBox {
  /** Unit of every size. */
  unit: LengthUnit;
  /** Standard set id, or null for a custom box. */
  setId: string | null;
  /** Every physical block's size (one entry per block). */
  pieces: Dec[];
  /** Finest step the box can make: the greatest common divisor of the sizes. */
  step: Dec;
  /** Sum of every block. */
  total: Dec;
}

/** Fields that choose a box in a request. */
export interface BoxChoice {
  set?: string | undefined;
  blocks?: (Dec | { size: Dec; count?: number | undefined })[] | undefined;
  missing?: Dec[] | undefined;
  unit?: LengthUnit | undefined;
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b];
  return a;
}

/**
 * Resolves the box a request names: a standard `set` or a custom `blocks` list, less `missing`
 * blocks. `unit`, when given, must match the set's unit; a custom list needs one.
 */
export function resolveBox(area: string, choice: BoxChoice): CalcResult<GaugeBox> {
  const { set, blocks, missing, unit } = choice;
  if (set && blocks) return invalid(area, 'blocks', 'give a set or a blocks list, not both');
  let pieces: Dec[] = [];
  let boxUnit: LengthUnit;
  if (set) {
    const found = findGaugeSet(set);
    if (!found) return invalid(area, 'set', `unknown set "${set}"; known sets: ${GAUGE_BLOCK_SETS.map((s) => s.id).join(', ')}`);
    if (unit && unit !== found.unit) return invalid(area, 'set', `${found.id} is in ${found.unit} but the unit is ${unit}`);
    boxUnit = found.unit;
    for (const b of found.blocks) for (let c = 0; c < b.count; c++) pieces.push(new Dec(b.size));
  } else if (blocks) {
    // A custom list without a unit is taken as inches; the sizes and the stack are the same numbers either way.
    boxUnit = unit ?? 'in';
    for (const [i, entry] of blocks.entries()) {
      const size = entry instanceof Dec ? entry : entry.size;
      const count = entry instanceof Dec ? 1 : (entry.count ?? 1);
      if (size.lte(0)) return invalid(area, `blocks.${i}`, 'size must be greater than 0');
      if (size.gt(1000)) return invalid(area, `blocks.${i}`, 'size must be at most 1000');
      if (size.decimalPlaces() > MAX_BLOCK_DECIMALS) return invalid(area, `blocks.${i}`, `size may have at most ${MAX_BLOCK_DECIMALS} decimals`);
      for (let c = 0; c < count; c++) pieces.push(size);
    }
    if (pieces.length > MAX_BOX_BLOCKS) return invalid(area, 'blocks', `a box may hold at most ${MAX_BOX_BLOCKS} blocks`);
  } else {
    return invalid(area, 'set', 'give a set id (e.g. inch-81) or a blocks list');
  }
  for (const [i, size] of (missing ?? []).entries()) {
    const at = pieces.findIndex((p) => p.eq(size));
    if (at < 0) return invalid(area, `missing.${i}`, `there is no ${size.toString()} block left in the box (list sizes with commas or spaces between them and a point for decimals, e.g. 0.1009, 0.125)`);
    pieces = [...pieces.slice(0, at), ...pieces.slice(at + 1)];
  }
  if (pieces.length === 0) return invalid(area, 'missing', 'leaves no blocks in the box');
  const decimals = Math.max(...pieces.map((p) => p.decimalPlaces()));
  const scale = new Dec(10).pow(decimals);
  const g = pieces.reduce((acc, p) => gcd(acc, p.mul(scale).toNumber()), 0);
  const total = pieces.reduce((a, b) => a.plus(b), new Dec(0));
  return succeed({ unit: boxUnit, setId: set ?? null, pieces, step: new Dec(g).div(scale), total });
}

const SOLVERS = new Map<string, { solver: StackSolver; scale: Dec }>();
const SOLVER_CACHE_SIZE = 16;
/** Solver per resolved box object, so a table of many stacks skips the cache key. */
const BOX_SOLVERS = new WeakMap<GaugeBox, { solver: StackSolver; scale: Dec }>();

/** The (cached) solver for a box, working in steps of 10^-MAX_BLOCK_DECIMALS. */
function solverFor(box: GaugeBox): { solver: StackSolver; scale: Dec } {
  const known = BOX_SOLVERS.get(box);
  if (known) return known;
  const scale = new Dec(10).pow(MAX_BLOCK_DECIMALS);
  const ints = box.pieces.map((p) => p.mul(scale).toNumber());
  const key = ints.slice().sort((a, b) => a - b).join(',');
  let entry = SOLVERS.get(key);
  if (entry) {
    SOLVERS.delete(key);
  } else {
    entry = { solver: new StackSolver(ints, scale.toNumber()), scale };
    if (SOLVERS.size >= SOLVER_CACHE_SIZE) SOLVERS.delete(SOLVERS.keys().next().value as string);
  }
  SOLVERS.set(key, entry);
  BOX_SOLVERS.set(box, entry);
  return entry;
}

/** Why a target cannot be stacked from a box, or null when it is worth searching. */
export function stackBlocker(box: GaugeBox, target: Dec): string | null {
  const unit = box.unit;
  if (!target.mod(box.step).isZero()) {
    // The two stacks either side that the step allows, to pick from.
    const below = target.div(box.step).floor().mul(box.step);
    const above = below.plus(box.step);
    return `is finer than the box can make: its smallest step is ${box.step.toString()} ${unit}; the nearest stacks are ${below.toFixed(box.step.decimalPlaces())} and ${above.toFixed(box.step.decimalPlaces())} ${unit}`;
  }
  const total = box.total;
  if (target.gt(total)) return `is longer than all the blocks together (${total.toString()} ${unit})`;
  if (target.mul(new Dec(10).pow(MAX_BLOCK_DECIMALS)).gt(MAX_TARGET)) return 'is too long to search';
  return null;
}

/** The fewest blocks of the box that make `target` exactly, largest first; null when none do. */
export function fewestBlocks(box: GaugeBox, target: Dec): Dec[] | null {
  if (stackBlocker(box, target)) return null;
  const { solver, scale } = solverFor(box);
  const found = solver.solve(target.mul(scale).toNumber());
  return found ? found.map((w) => new Dec(w).div(scale)) : null;
}

/**
 * The textbook "last digit" method (Starrett-Webber GB49; NPL; Mitutoyo BM1, REFERENCE.md §3.5),
 * kept as a teaching answer: take the block that equals the remainder if there is one; otherwise
 * the smallest block that clears the remainder's last non-zero digit; failing that, the thickest
 * block that fits ("select thick blocks", Mitutoyo BM1). It backs up when it gets stuck and gives up
 * (null) after a bounded number of tries. Returns blocks largest first.
 */
export function lastDigitBlocks(box: GaugeBox, target: Dec): Dec[] | null {
  const scale = new Dec(10).pow(MAX_BLOCK_DECIMALS);
  const left = new Map<number, number>();
  for (const p of box.pieces) {
    const w = p.mul(scale).toNumber();
    left.set(w, (left.get(w) ?? 0) + 1);
  }
  const sizes = [...left.keys()].sort((a, b) => a - b);
  const picked: number[] = [];
  let budget = 5000;
  const walk = (r: number): boolean => {
    if (r === 0) return true;
    if (--budget < 0) return false;
    if ((left.get(r) ?? 0) > 0) {
      picked.push(r);
      return true;
    }
    let place = 1;
    while (r % (place * 10) === 0) place *= 10;
    const usable = sizes.filter((w) => w <= r && (left.get(w) ?? 0) > 0);
    const clearing = usable.filter((w) => (r - w) % (place * 10) === 0);
    const order = clearing.length > 0 ? clearing : [...usable].reverse();
    for (const w of order) {
      left.set(w, (left.get(w) ?? 0) - 1);
      picked.push(w);
      if (walk(r - w)) return true;
      picked.pop();
      left.set(w, (left.get(w) ?? 0) + 1);
    }
    return false;
  };
  if (stackBlocker(box, target) || !walk(target.mul(scale).toNumber())) return null;
  return picked.sort((a, b) => b - a).map((w) => new Dec(w).div(scale));
}

/** A stack as returned by the API. */
export interface StackAnswer {
  /** Block sizes in wringing order, largest first (wear blocks, when used, at both ends). */
  blocks: string[];
  /** The same blocks as the result text names them: a wear block says so ("0.050 wear"). */
  labels: string[];
  /** Number of blocks, wear blocks included. */
  count: number;
  /** Sum of the blocks (equals the target). */
  total: string;
}

/** Tolerance of a stack from its grade. */
export interface StackTolerance {
  /** ISO 3650 grade. */
  grade: GaugeGrade;
  /** Worst case: the sum of each block's ±te, µm. */
  worstCaseUm: string;
  /** Root-sum-square of the blocks' te, µm. */
  rssUm: string;
  /** Worst case in the stack's unit. */
  worstCase: string;
  /** Root-sum-square in the stack's unit. */
  rss: string;
  /** ±te of each block, µm, in stack order. */
  perBlockUm: string[];
  /** Where the tolerances come from. */
  source: string;
  /** How well that source is backed. */
  status: string;
}

/** Length change of a stack away from 20 °C. */
export interface StackTemperature {
  /** Temperature of the blocks, °C. */
  temperatureC: string;
  /** Expansion coefficient used, 1/K. */
  coefficientPerK: string;
  /** ΔL = L·α·(t − 20 °C), in the stack's unit. */
  change: string;
  /** L + ΔL. */
  lengthAtTemperature: string;
}

/** Answer of {@link calculateGaugeStack}. */
export interface GaugeStackResult extends StackAnswer {
  /** Unit of every size. */
  unit: LengthUnit;
  /** Standard set id, or null for a custom box. */
  set: string | null;
  /** The target length. */
  target: string;
  /** Finest step the box can make. */
  resolution: string;
  /** Wear-block size used at each end, or null. */
  wearBlock: string | null;
  /** The textbook last-digit stack (teaching answer), or null when that method gets stuck. */
  lastDigit: StackAnswer | null;
  /** Grade tolerance of the stack, when a grade was given and every block has a band. */
  tolerance: StackTolerance | null;
  /** Length change with temperature, when a temperature was given. */
  temperature: StackTemperature | null;
  /** Notes (why a tolerance is missing, etc.). */
  warnings: string[];
  /** Published cautions for handling gauge blocks. */
  cautions: string[];
  /** The derivation. */
  steps: Step[];
}

/** Published gauge-block care cautions (REFERENCE.md §7.5). */
export const GAUGE_BLOCK_CAUTIONS: readonly string[] = [
  'Check blocks for nicks and burrs before wringing; hold them so fingers never touch the gauging faces; do not leave blocks wrung together overnight (Starrett-Webber "Use and Care" GB45).',
  'Let blocks settle to room temperature after handling or washing before measuring; lengths are defined at 20 °C (GB50; ISO 1).',
];

const AREA = 'Gauge stack';

/** Formats a block size as marked on the block: its own decimals, at least 3 (in) or 2 (mm). */
export function formatBlock(size: Dec, box: Pick<GaugeBox, 'unit'>): string {
  return fixedText(size, Math.max(box.unit === 'in' ? 3 : 2, size.decimalPlaces()));
}

/** Formats a stack length at the unit's resolution, or finer when the value needs it (0.0005 mm). */
export function formatStack(size: Dec, box: Pick<GaugeBox, 'unit'>): string {
  return fixedText(size, Math.max(box.unit === 'in' ? 4 : 3, size.decimalPlaces()));
}

/** ±te (µm) of one block for a grade, or null beyond the table. */
function blockTolerance(size: Dec, unit: LengthUnit, grade: GaugeGrade): Dec | null {
  const mm = unit === 'in' ? size.mul(MM_PER_INCH) : size;
  const band = LENGTH_TOLERANCES.find((b) => mm.lte(b.upToMm));
  return band ? new Dec(band.te[grade]) : null;
}

/**
 * Builds the answer for a stack: blocks in wringing order with the wear blocks at both ends (they
 * take the wear of wringing and of the work, so the set's own blocks are spared — common
 * practice), named as wear blocks in `labels` so a set's own block of the same size is told apart.
 */
function answer(blocks: Dec[], box: GaugeBox, wear: Dec | undefined): StackAnswer {
  const sized = blocks.map((b) => formatBlock(b, box));
  const all = wear ? [wear, ...blocks, wear] : blocks;
  const total = all.reduce((a, b) => a.plus(b), new Dec(0));
  const wearLabel = wear ? `${formatBlock(wear, box)} wear` : '';
  return {
    blocks: all.map((b) => formatBlock(b, box)),
    labels: wear ? [wearLabel, ...sized, wearLabel] : sized,
    count: all.length,
    total: formatStack(total, box),
  };
}

/**
 * Finds the stack with the fewest blocks for a target length from a standard set or a custom
 * box (each block used at most once, missing blocks left out, optional wear blocks on both ends),
 * with the textbook last-digit stack beside it, the grade tolerance and the length change with
 * temperature. An unreachable target is an 'impossible' failure.
 */
export function calculateGaugeStack(input: GaugeStackRequest | unknown): CalcResult<GaugeStackResult> {
  return guarded<GaugeStackResult>(AREA, () => {
    const parsed = parseRequest(AREA, gaugeStackRequestSchema, input);
    if (!parsed.ok) return parsed;
    const p = parsed.value;
    const boxed = resolveBox(AREA, p);
    if (!boxed.ok) return boxed;
    const box = boxed.value;
    const unit = box.unit;
    const steps: Step[] = [];
    const wear = p.wearBlocks;
    let core = p.target;
    if (wear) {
      core = p.target.minus(wear.mul(2));
      if (core.lte(0)) return impossible(AREA, 'wearBlocks', `make ${wear.mul(2).toString()} ${unit} together, which leaves nothing to build for the target; try without the wear blocks`);
      steps.push(step('Length to build between the wear blocks', 'L′ = L − 2·w', `L′ = ${p.target.toString()} − 2 · ${wear.toString()}`, formatStack(core, box), unit));
    }
    const blocker = stackBlocker(box, core);
    if (blocker) return impossible(AREA, 'target', blocker);
    const fewest = fewestBlocks(box, core);
    if (!fewest) {
      const between = wear ? ` between the two ${wear.toString()} ${unit} wear blocks; try without the wear blocks` : '';
      return impossible(AREA, 'target', `cannot be made from the blocks in the box (${formatStack(core, box)} ${unit} wanted${between})`);
    }
    // Show the work the way it is done by hand: the block that clears the last decimal first, then
    // the next decimal, the whole sizes last (smaller first among equals).
    const places = (b: Dec) => Math.max(0, b.decimalPlaces());
    const byHand = [...fewest].sort((a, b) => places(b) - places(a) || a.cmp(b));
    let remainder = core;
    for (const b of byHand) {
      const next = remainder.minus(b);
      steps.push(step(`Take the ${formatBlock(b, box)} block`, 'remainder = remainder − block', `${formatStack(remainder, box)} − ${formatBlock(b, box)}`, formatStack(next, box), unit));
      remainder = next;
    }
    const fewestAnswer = answer(fewest, box, wear);
    steps.push(blockCountStep(fewestAnswer.labels, fewestAnswer.count));
    const lastDigit = lastDigitBlocks(box, core);
    const lastDigitAnswer = lastDigit ? answer(lastDigit, box, wear) : null;
    const warnings: string[] = [];
    if (p.blocks && !p.unit) warnings.push('No unit was given for the custom blocks: inches assumed.');

    let tolerance: StackTolerance | null = null;
    const all = wear ? [wear, ...fewest, wear] : fewest;
    if (p.grade) {
      const grade = p.grade;
      const te = all.map((b) => blockTolerance(b, unit, grade));
      if (te.some((t) => t === null)) {
        warnings.push('No grade tolerance: a block is longer than the 150 mm the tolerance table covers.');
      } else {
        const values = te as Dec[];
        const worst = values.reduce((a, b) => a.plus(b), new Dec(0));
        const rss = sqrt(values.reduce((a, b) => a.plus(b.mul(b)), new Dec(0)));
        const toUnit = (um: Dec) => (unit === 'in' ? um.div(MM_PER_INCH).div(1000) : um.div(1000));
        const unitDecimals = unit === 'in' ? 7 : 5;
        tolerance = {
          grade,
          worstCaseUm: fixedText(worst, 3),
          rssUm: fixedText(rss, 3),
          worstCase: fixedText(toUnit(worst), unitDecimals),
          rss: fixedText(toUnit(rss), unitDecimals),
          perBlockUm: values.map((v) => fixedText(v, 2)),
          source: GRADE_STATUS[grade].source,
          status: GRADE_STATUS[grade].status,
        };
        steps.push(step(`Worst-case tolerance, grade ${grade}`, 'T = Σ te', `T = ${values.map((v) => v.toString()).join(' + ')} µm`, tolerance.worstCaseUm, 'µm'));
        steps.push(step(`Root-sum-square tolerance, grade ${grade}`, 'T = √(Σ te²)', `T = √(${values.map((v) => `${v.toString()}²`).join(' + ')}) µm`, tolerance.rssUm, 'µm'));
      }
    }

    let temperature: StackTemperature | null = null;
    if (p.temperature) {
      const alpha = p.expansionCoefficient ?? new Dec(STEEL_EXPANSION_PER_K);
      const length = all.reduce((a, b) => a.plus(b), new Dec(0));
      const dT = p.temperature.minus(REFERENCE_TEMPERATURE_C);
      const change = length.mul(alpha).mul(dT);
      const decimals = unit === 'in' ? 6 : 5;
      temperature = {
        temperatureC: p.temperature.toString(),
        coefficientPerK: alpha.toString(),
        change: fixedText(change, decimals),
        lengthAtTemperature: fixedText(length.plus(change), decimals),
      };
      steps.push(step('Length change with temperature', 'ΔL = L · α · (t − 20 °C)', `ΔL = ${formatStack(length, box)} · ${alpha.toString()} · (${p.temperature.toString()} − 20)`, temperature.change, unit));
    }

    return succeed({
      unit,
      set: box.setId,
      target: formatStack(p.target, box),
      resolution: box.step.toString(),
      wearBlock: wear ? formatBlock(wear, box) : null,
      ...fewestAnswer,
      lastDigit: lastDigitAnswer,
      tolerance,
      temperature,
      warnings,
      cautions: [...GAUGE_BLOCK_CAUTIONS],
      steps,
    });
  });
}
