/**
 * Runs `work` and records how long it took as a Performance API measure called `name`, so
 * tests/e2e/perf.e2e.ts can split a redraw into its parts; just runs it where the API is missing.
 */
export function timed<T>(name: string, work: () => T): T {
  if (typeof performance === 'undefined' || typeof performance.measure !== 'function') return work();
  const start = performance.now();
  const result = work();
  try {
    performance.measure(name, { start, end: performance.now() });
  } catch {
    // An older Performance API without measure options: the figure is only lost, never the result.
  }
  return result;
}
