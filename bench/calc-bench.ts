// Calculation-engine benchmark: `npm run bench`.
// 1. Gauge-block solver time per query (median, p99) over random reachable targets spread over the
//    whole range of the inch-81 and metric-112 sets.
// 2. A full 0°–60° sine-bar table every 1′ for a 5 in bar with fewest-block stacks (inch-81).
// 3. Average block count of the fewest-block solver vs the textbook last-digit method over the same
//    targets; the solver must never use more blocks on any target.
import { cpus, loadavg } from 'node:os';
import { Dec } from '../shared/calc/decimal-math';
import { fewestBlocks, lastDigitBlocks, resolveBox, type GaugeBox } from '../shared/calc/gauge-stack';
import { calculateSineTable } from '../shared/calc/sine-bar';

const QUERIES = Number(process.env.BENCH_QUERIES ?? 2000);

/** Small deterministic generator so runs are comparable. */
function lcg(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];
}

function boxOf(set: string): GaugeBox {
  const box = resolveBox('bench', { set });
  if (!box.ok) throw new Error(box.error);
  return box.value;
}

let failed = false;

function benchSet(set: string): void {
  const box = boxOf(set);
  const buildStart = performance.now();
  fewestBlocks(box, box.step.mul(box.total.div(box.step).div(2).floor()));
  const buildMs = performance.now() - buildStart;
  const random = lcg(81_112 + set.length);
  const steps = box.total.div(box.step).toNumber();
  const times: number[] = [];
  const cpuTimes: number[] = [];
  let fewestSum = 0;
  let lastSum = 0;
  let compared = 0;
  let lastStuck = 0;
  let lowestStuck: InstanceType<typeof Dec> | null = null;
  let unreachable = 0;
  let worse = 0;
  while (times.length < QUERIES) {
    const target = box.step.mul(1 + Math.floor(random() * steps));
    const cpuStart = process.cpuUsage();
    const start = performance.now();
    const stack = fewestBlocks(box, target);
    const ms = performance.now() - start;
    const cpu = process.cpuUsage(cpuStart);
    if (!stack) {
      unreachable++;
      continue;
    }
    times.push(ms);
    cpuTimes.push((cpu.user + cpu.system) / 1000);
    const sum = stack.reduce((a, b) => a.plus(b), new Dec(0));
    if (!sum.eq(target)) {
      failed = true;
      console.log(`  FAIL ${set}: stack for ${target.toString()} sums to ${sum.toString()}`);
    }
    const last = lastDigitBlocks(box, target);
    if (!last) {
      lastStuck++;
      if (!lowestStuck || target.lt(lowestStuck)) lowestStuck = target;
      continue;
    }
    compared++;
    fewestSum += stack.length;
    lastSum += last.length;
    if (stack.length > last.length) worse++;
  }
  times.sort((a, b) => a - b);
  cpuTimes.sort((a, b) => a - b);
  const median = percentile(times, 0.5);
  const p99 = percentile(times, 0.99);
  const cpuMedian = percentile(cpuTimes, 0.5);
  const cpuP99 = percentile(cpuTimes, 0.99);
  console.log(`${set}: ${QUERIES} reachable targets over 0–${box.total.toString()} ${box.unit} (${unreachable} unreachable draws skipped)`);
  console.log(`  first query (builds the solver tables unless an earlier run cached them): ${buildMs.toFixed(1)} ms`);
  console.log(`  per query: median ${median.toFixed(3)} ms, p99 ${p99.toFixed(3)} ms, max ${times[times.length - 1].toFixed(2)} ms wall  (targets < 1 ms, < 5 ms)`);
  console.log(`  per query CPU time: median ${cpuMedian.toFixed(3)} ms, p99 ${cpuP99.toFixed(3)} ms (not inflated by other processes)`);
  console.log(
    `  average blocks: fewest ${(fewestSum / compared).toFixed(2)} vs last-digit ${(lastSum / compared).toFixed(2)} over ${compared} targets` +
      ` (last-digit method stuck on ${lastStuck}${lowestStuck ? `, the shortest ${lowestStuck.toString()} ${box.unit}` : ''}); fewest used more blocks on ${worse} targets`,
  );
  if (median >= 1 || p99 >= 5) console.log('  NOTE: wall-clock over the time target on this run');
  if (cpuMedian >= 1 || cpuP99 >= 5) failed = true;
  if (worse > 0) failed = true;
}

function benchTable(): void {
  const cpuStart = process.cpuUsage();
  const start = performance.now();
  const table = calculateSineTable({ unit: 'in', barLength: 5, from: 0, to: 60, step: "0°1'", set: 'inch-81' });
  const ms = performance.now() - start;
  const cpu = process.cpuUsage(cpuStart);
  const cpuMs = (cpu.user + cpu.system) / 1000;
  if (!table.ok) {
    failed = true;
    console.log(`sine table FAILED: ${table.error}`);
    return;
  }
  const withStacks = table.value.rows.filter((r) => r.blocks !== null).length;
  const missing = table.value.rows.filter((r) => r.blocks === null);
  const highest = missing.length ? missing[missing.length - 1] : null;
  console.log(`sine table 0°–60° every 1′, 5 in bar, inch-81: ${table.value.rows.length} rows in ${ms.toFixed(0)} ms wall, ${cpuMs.toFixed(0)} ms CPU (target < 2000 ms)`);
  console.log(
    `  ${withStacks} rows with a fewest-block stack, ${table.value.unreachable} stacks the set cannot make` +
      (highest ? ` (the highest at ${highest.angleDms}, ${highest.stackHeight} in)` : ''),
  );
  if (table.value.rows.length !== 3601 || cpuMs >= 2000) failed = true;
}

console.log(`Slantwise calculation bench (Node ${process.version}, ${cpus().length} cores, load average ${loadavg().map((l) => l.toFixed(1)).join(' ')})`);
if (loadavg()[0] > cpus().length) console.log('NOTE: the machine is busy; wall-clock figures are inflated by waiting for a core.');
benchTable();
benchSet('inch-81');
benchSet('metric-112');
if (failed) {
  console.log('FAILED');
  process.exitCode = 1;
} else {
  console.log('OK: every stack sums exactly and the fewest-block solver never used more blocks than the last-digit method');
}
