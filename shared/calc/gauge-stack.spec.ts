import fc from 'fast-check';
import { Dec } from './decimal-math';
import { calculateGaugeStack, fewestBlocks, lastDigitBlocks, resolveBox, type GaugeBox, type GaugeStackResult } from './gauge-stack';
import type { CalcResult } from './step';

function value<T>(r: CalcResult<T>): T {
  if (!r.ok) throw new Error(r.error);
  return r.value;
}
const stack = (input: Record<string, unknown>): GaugeStackResult => value(calculateGaugeStack(input));
const sum = (blocks: readonly string[]) => blocks.reduce((a, b) => a.plus(b), new Dec(0));
const box = (set: string): GaugeBox => value(resolveBox('test', { set }));

/** Every size the stack uses at most as often as the box holds it. */
function expectWithinBox(blocks: readonly (string | InstanceType<typeof Dec>)[], b: GaugeBox): void {
  const left = new Map<string, number>();
  for (const p of b.pieces) left.set(p.toString(), (left.get(p.toString()) ?? 0) + 1);
  for (const block of blocks) {
    const key = new Dec(block).toString();
    const n = left.get(key) ?? 0;
    expect(n).toBeGreaterThan(0);
    left.set(key, n - 1);
  }
}

describe('calculateGaugeStack', () => {
  describe('published and derived stacks (REFERENCE.md §3.5): exact sum and minimal count', () => {
    it.each([
      ['G1 Starrett-Webber GB49', '3.9762', 'inch-81', 4],
      ['G2 "Jo Block Stacks"', '4.3301', 'inch-81', 4],
      ['G3 NPL FAQ (published 5-block stack; fewest is 4)', '58.345', 'metric-112', 4],
      ['G4 Mitutoyo BM1 manual (published 5-block stack; fewest is 4 in M112)', '37.785', 'metric-112', 4],
      ['G4 in the 103 set (from memory set, derived)', '37.785', 'metric-103', 4],
      ['G4 in the 87 set (from memory set, derived)', '37.785', 'metric-87', 4],
      ['G6 TC 9-524 sine example (derived)', '2.0084', 'inch-81', 4],
      ['G7 Walsh 34°25\' (derived)', '2.8260', 'inch-81', 3],
      ['G8 5 in @ 12° (derived)', '1.0396', 'inch-81', 3],
      ['G9 MH taper check (derived)', '2.3960', 'inch-81', 3],
      ['G10 (derived)', '5.4373', 'inch-81', 5],
      ['G11 (derived)', '9.9999', 'inch-81', 6],
      ['G12 100 mm bar @ 10° in M87 (derived)', '17.365', 'metric-87', 4],
      ['G13 100 mm bar @ 20° in M87 (derived)', '34.202', 'metric-87', 4],
      ['G14 BS 888 M78 (derived)', '41.2375', 'metric-78-bs888', 4],
      ['G15 a single block (derived)', '0.2000', 'inch-81', 1],
    ])('%s: %s in %s → %i blocks', (_source, target, set, count) => {
      const r = stack({ target, set });
      expect(r.count).toBe(count);
      expect(sum(r.blocks).eq(target)).toBe(true);
      expectWithinBox(r.blocks, box(set));
    });

    it('should beat the published hand stacks G3 and G4 (5 → 4 blocks)', () => {
      expect(stack({ target: '58.345', set: 'metric-112' }).count).toBeLessThan(5);
      expect(stack({ target: '37.785', set: 'metric-112' }).count).toBeLessThan(5);
    });

    it('should build G5 with two 2.5 mm protectors: 92.357 = 87.357 + 2 × 2.5, 4 + 2 blocks (askfilo M112 question)', () => {
      const r = stack({ target: '92.357', set: 'metric-112', wearBlocks: '2.5' });
      expect(r.count).toBe(6);
      expect(r.blocks[0]).toBe('2.50');
      expect(r.blocks[5]).toBe('2.50');
      expect(sum(r.blocks).eq('92.357')).toBe(true);
    });
  });

  describe('wear blocks', () => {
    it('should name the wear blocks at both ends of both stacks, apart from the set\'s own block of that size', () => {
      // 2.75 = 0.050 + 2.650 + 0.050 with the two 0.050 in wear blocks; by the last digit 2.650 is
      // 2.000 + 0.600 + 0.050, which uses the 81-piece set's own 0.050 block too (derived).
      const r = stack({ target: '2.75', set: 'inch-81', wearBlocks: '0.050' });
      expect(r.lastDigit?.blocks).toEqual(['0.050', '2.000', '0.600', '0.050', '0.050']);
      expect(r.lastDigit?.labels).toEqual(['0.050 wear', '2.000', '0.600', '0.050', '0.050 wear']);
      // Wear blocks go on the two ends of the stack (common practice); the rest largest first.
      expect(r.labels[0]).toBe('0.050 wear');
      expect(r.labels[r.labels.length - 1]).toBe('0.050 wear');
      expect(r.labels.slice(1, -1)).toEqual(r.blocks.slice(1, -1));
      expect(r.steps.find((s) => s.label === 'Fewest blocks')?.substituted).toBe(`n = count of (${r.labels.join(' + ')})`);
      // Without wear blocks the labels are the sizes.
      const plain = stack({ target: '2.75', set: 'inch-81' });
      expect(plain.labels).toEqual(plain.blocks);
    });
  });

  describe('last-digit teaching answer', () => {
    it('should reproduce the NPL hand stack for G3: 1.005 + 1.04 + 1.30 + 5 + 50 (NPL FAQ)', () => {
      const r = stack({ target: '58.345', set: 'metric-112' });
      expect(r.lastDigit?.blocks.map((b) => new Dec(b).toString()).sort()).toEqual(['1.005', '1.04', '1.3', '5', '50']);
    });

    it('should never use fewer blocks than the exact solver (property)', () => {
      const inch = box('inch-81');
      fc.assert(
        fc.property(fc.integer({ min: 1000, max: 100_000 }), (tenThousandths) => {
          const target = new Dec(tenThousandths).div(10_000);
          const fewest = fewestBlocks(inch, target);
          const last = lastDigitBlocks(inch, target);
          if (fewest && last) {
            expect(fewest.length).toBeLessThanOrEqual(last.length);
            expect(sum(last.map(String)).eq(target)).toBe(true);
          }
        }),
        { numRuns: 200 },
      );
    });
  });

  describe('stacks (property)', () => {
    it.each(['inch-81', 'metric-112'])('should sum exactly to the target and never over-use a block (%s)', (set) => {
      const b = box(set);
      const steps = b.total.div(b.step).floor().toNumber();
      fc.assert(
        fc.property(fc.integer({ min: 1, max: Math.min(steps, 400_000) }), (n) => {
          const target = b.step.mul(n);
          const found = fewestBlocks(b, target);
          if (!found) return;
          expect(found.reduce((a, c) => a.plus(c), new Dec(0)).eq(target)).toBe(true);
          expectWithinBox(found, b);
        }),
        { numRuns: 150 },
      );
    });
  });

  describe('custom boxes and missing blocks', () => {
    it('should respect counts: two 4 mm blocks make 8, one does not', () => {
      expect(stack({ target: 8, unit: 'mm', blocks: [{ size: 4, count: 2 }, 1] }).count).toBe(2);
      const r = calculateGaugeStack({ target: 8, unit: 'mm', blocks: [4, 1, 2] });
      expect(r.ok || r.kind).toBe('impossible');
    });

    it('should work around a missing block', () => {
      const r = stack({ target: '2.0084', set: 'inch-81', missing: [1] });
      expect(r.blocks).not.toContain('1.000');
      expect(sum(r.blocks).eq('2.0084')).toBe(true);
    });

    it('should take a custom list without a unit as inches, and say so', () => {
      const r = stack({ target: 7, blocks: [1, 2, 4] });
      expect([r.unit, r.count]).toEqual(['in', 3]);
      expect(r.warnings.join(' ')).toMatch(/inches assumed/);
    });

    it('should refuse a missing block the box does not have', () => {
      const r = calculateGaugeStack({ target: 1, set: 'inch-81', missing: ['0.0507'] });
      expect(r.ok || r.fields['missing.0']).toMatch(/no 0.0507 block/);
    });
  });

  describe('tolerance and temperature', () => {
    it('should add grade 0 tolerances worst case and root-sum-square (DIN 861 table, REFERENCE.md §3.1)', () => {
      // 58.345 = 50 + 6 + 1.34 + 1.005: te 0.20 (>25–50 mm) + 3 × 0.12 (0.5–10 mm) µm, grade 0.
      const r = stack({ target: '58.345', set: 'metric-112', grade: '0' });
      expect(r.tolerance?.worstCaseUm).toBe('0.560');
      // √(0.20² + 3·0.12²) = 0.2884 µm (derived).
      expect(r.tolerance?.rssUm).toBe('0.288');
      expect(r.tolerance?.status).toBe('published-secondary');
    });

    it('should give the length change away from 20 °C with α = 11.5e-6/K for steel (EOD Manufacturing §35.6.2)', () => {
      // 100 mm at 25 °C: 100 · 11.5e-6 · 5 = 0.00575 mm (derived).
      const r = stack({ target: 100, set: 'metric-112', temperature: 25 });
      expect(r.temperature?.change).toBe('0.00575');
      expect(r.temperature?.lengthAtTemperature).toBe('100.00575');
    });
  });

  describe('impossible and invalid input', () => {
    it.each([
      [{ target: '1.23456', set: 'inch-81' }, 'target', 'impossible'],
      [{ target: '0.0600', set: 'inch-81' }, 'target', 'impossible'],
      [{ target: 40, set: 'inch-81' }, 'target', 'impossible'],
      [{ target: 1, set: 'no-such-set' }, 'set', 'invalid'],
      [{ target: 1 }, 'set', 'invalid'],
      [{ target: -1, set: 'inch-81' }, 'target', 'invalid'],
      [{ target: 1, set: 'inch-81', unit: 'mm' }, 'set', 'invalid'],
      [{ target: 1, set: 'inch-81', wearBlocks: 0.5 }, 'wearBlocks', 'impossible'],
    ])('should refuse %j on %s as %s', (input, field, kind) => {
      const r = calculateGaugeStack(input);
      expect(r.ok).toBe(false);
      if (!r.ok) {
        expect(r.kind).toBe(kind);
        expect(Object.keys(r.fields)).toContain(field);
      }
    });

    it('should never throw (property)', () => {
      fc.assert(fc.property(fc.anything(), (x) => void expect(typeof calculateGaugeStack(x).ok).toBe('boolean')));
      fc.assert(
        fc.property(fc.record({ target: fc.oneof(fc.double(), fc.string()), set: fc.constantFrom('inch-81', 'metric-112', 'x'), missing: fc.array(fc.double()) }, { requiredKeys: [] }), (x) => {
          expect(JSON.stringify(calculateGaugeStack(x))).not.toMatch(/NaN|Infinity/);
        }),
      );
    });
  });
});

describe('the worked stack, as it is built by hand', () => {
  it('should take the block that clears the last decimal first and count the blocks in words', () => {
    // 5.3338 in from the 81-piece inch set: 0.1008 clears the fourth decimal, 0.133 the third
    // (common practice: "last digit first"); five blocks in all, derived by hand.
    const r = calculateGaugeStack({ target: '5.3338', set: 'inch-81' });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const takes = r.value.steps.filter((st) => st.label.startsWith('Take the')).map((st) => st.label);
    expect(takes[0]).toBe('Take the 0.1008 block');
    expect(takes[1]).toBe('Take the 0.133 block');
    const last = r.value.steps.find((st) => st.label === 'Fewest blocks')!;
    expect(last.substituted).toBe(`n = count of (${r.value.blocks.join(' + ')})`);
    expect([last.value, last.unit]).toEqual(['5', 'blocks']);
    // Each remainder really is the one before less the block taken.
    const remainders = r.value.steps.filter((st) => st.label.startsWith('Take the')).map((st) => Number(st.value));
    expect(remainders[remainders.length - 1]).toBe(0);
  });
});
