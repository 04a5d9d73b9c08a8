import { Dec } from '../calc/decimal-math';
import { ANGLE_BLOCK_SETS } from './angle-block-sets';
import { GAUGE_BLOCK_SETS, findGaugeSet } from './gauge-sets';
import { MACHINE_TAPERS } from './machine-tapers';

describe('gauge-block sets', () => {
  it.each([
    ['inch-81', 81],
    ['metric-112', 112],
    ['metric-78-bs888', 78],
    ['metric-56', 56],
    ['metric-87', 87],
    ['metric-88', 88],
    ['metric-103', 103],
    ['inch-36', 36],
  ])('%s should hold %i blocks as its name says (REFERENCE.md §3.2–3.4)', (id, count) => {
    const set = findGaugeSet(id);
    expect(set?.total).toBe(count);
    expect(set?.blocks.reduce((a, b) => a + b.count, 0)).toBe(count);
  });

  it('should list the .106 .116 .126 .136 .146 blocks in the 81 set (Starrett-Webber GB49)', () => {
    const sizes = findGaugeSet('inch-81')?.blocks.map((b) => b.size);
    for (const s of ['0.106', '0.116', '0.126', '0.136', '0.146']) expect(sizes).toContain(s);
  });

  it('should give every set a source and a status', () => {
    for (const set of GAUGE_BLOCK_SETS) {
      expect(set.source.length).toBeGreaterThan(10);
      expect(['published', 'published-secondary', 'from-memory']).toContain(set.status);
    }
  });
});

describe('angle-block sets', () => {
  it('should reach 81°40\'57" in total with the 1-3-9-27 set (NPL range, REFERENCE.md §6)', () => {
    const set = ANGLE_BLOCK_SETS.find((s) => s.id === 'angle-13-npl');
    expect(set?.blocks).toHaveLength(13);
  });
});

describe('machine tapers', () => {
  it('should hold Morse 0–7, Brown & Sharpe 1–15, Jarno 2–20', () => {
    expect(MACHINE_TAPERS.filter((t) => t.family === 'morse')).toHaveLength(8);
    expect(MACHINE_TAPERS.filter((t) => t.family === 'brown-sharpe')).toHaveLength(15);
    expect(MACHINE_TAPERS.filter((t) => t.family === 'jarno')).toHaveLength(19);
  });

  it('should follow the Jarno rule: No. 7 = 7/8 in large, 0.7 in small, 3-1/2 in long (US Army OD1645)', () => {
    const j7 = MACHINE_TAPERS.find((t) => t.id === 'jarno-7');
    expect([j7?.largeDiameter, j7?.smallDiameter, j7?.length].map((x) => new Dec(x as string).toString())).toEqual(['0.875', '0.7', '3.5']);
  });
});
