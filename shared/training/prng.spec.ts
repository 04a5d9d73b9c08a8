import { childSeed, MAX_SEED, mulberry32, newSeed, pick, randomInt, randomStep } from './prng';

describe('mulberry32', () => {
  it('should give the same sequence for the same seed', () => {
    const a = mulberry32(12_345);
    const b = mulberry32(12_345);
    for (let i = 0; i < 100; i++) expect(a()).toBe(b());
  });

  it('should give different sequences for different seeds', () => {
    const a = mulberry32(1);
    const b = mulberry32(2);
    const same = Array.from({ length: 20 }, () => a() === b()).filter(Boolean).length;
    expect(same).toBe(0);
  });

  it('should stay in [0, 1) and spread evenly (mean near 0.5)', () => {
    const r = mulberry32(7);
    let sum = 0;
    for (let i = 0; i < 10_000; i++) {
      const x = r();
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThan(1);
      sum += x;
    }
    expect(sum / 10_000).toBeGreaterThan(0.48);
    expect(sum / 10_000).toBeLessThan(0.52);
  });

  it('should accept the largest seed and treat seeds as unsigned 32-bit', () => {
    expect(mulberry32(MAX_SEED)()).toBe(mulberry32(-1)());
  });
});

describe('randomInt, pick, randomStep', () => {
  it('should hit both ends of an integer range and nothing outside', () => {
    const r = mulberry32(3);
    const seen = new Set<number>();
    for (let i = 0; i < 500; i++) seen.add(randomInt(r, 2, 5));
    expect([...seen].sort()).toEqual([2, 3, 4, 5]);
  });

  it('should pick only list members and refuse an empty list', () => {
    const r = mulberry32(4);
    for (let i = 0; i < 50; i++) expect(['a', 'b']).toContain(pick(r, ['a', 'b']));
    expect(() => pick(r, [])).toThrow(/empty/);
  });

  it('should give exact decimals on the grid, inside the range', () => {
    const r = mulberry32(5);
    for (let i = 0; i < 500; i++) {
      const x = randomStep(r, '0.500', '1.500', '0.125');
      expect(x.gte('0.5') && x.lte('1.5')).toBe(true);
      expect(x.mod('0.125').isZero()).toBe(true);
    }
  });
});

describe('seeds', () => {
  it('should make unsigned 32-bit seeds', () => {
    for (let i = 0; i < 100; i++) {
      const s = newSeed();
      expect(Number.isInteger(s) && s >= 0 && s <= MAX_SEED).toBe(true);
    }
  });

  it('should derive stable, distinct child seeds', () => {
    const children = Array.from({ length: 30 }, (_, n) => childSeed(99, n));
    expect(new Set(children).size).toBe(30);
    expect(childSeed(99, 4)).toBe(children[4]);
    expect(childSeed(100, 4)).not.toBe(children[4]);
  });
});
