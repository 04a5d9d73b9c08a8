import fc from 'fast-check';
import { StackSolver } from './stack-solver';

/** Fewest pieces by trying every subset (for small boxes only). */
function bruteForce(sizes: number[], target: number): number | null {
  let best: number | null = null;
  for (let mask = 1; mask < 1 << sizes.length; mask++) {
    let sum = 0;
    let count = 0;
    for (let i = 0; i < sizes.length; i++) {
      if (mask & (1 << i)) {
        sum += sizes[i];
        count++;
      }
    }
    if (sum === target && (best === null || count < best)) best = count;
  }
  return best;
}

describe('StackSolver', () => {
  it('should match an exhaustive search on random small boxes (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.integer({ min: 1, max: 60 }), fc.constantFrom(5, 10, 50, 100, 105, 250, 500)), { minLength: 1, maxLength: 13 }), fc.integer({ min: 1, max: 1500 }), fc.constantFrom(1, 10, 100, 1000), (sizes, target, modulus) => {
        const solver = new StackSolver(sizes, modulus);
        const found = solver.solve(target);
        const best = bruteForce(sizes, target);
        expect(found === null ? null : found.length).toBe(best);
        if (found) {
          expect(found.reduce((a, b) => a + b, 0)).toBe(target);
          // Never uses a size more often than the box holds.
          for (const size of new Set(found)) {
            expect(found.filter((s) => s === size).length).toBeLessThanOrEqual(sizes.filter((s) => s === size).length);
          }
          // Largest first.
          expect([...found].sort((a, b) => b - a)).toEqual(found);
        }
      }),
      { numRuns: 600 },
    );
  });

  it('should refuse zero, negative and fractional targets', () => {
    const solver = new StackSolver([1, 2, 3], 10);
    expect(solver.solve(0)).toBeNull();
    expect(solver.solve(-3)).toBeNull();
    expect(solver.solve(1.5)).toBeNull();
    expect(solver.solve(7)).toBeNull();
    expect(solver.solve(6)).toEqual([3, 2, 1]);
  });
});
