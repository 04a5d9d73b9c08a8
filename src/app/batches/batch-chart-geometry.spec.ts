import type { CheckStats } from '../../../shared/api/batch';
import { CHART_BOX, chartGeometry } from './batch-chart-geometry';

function stats(values: Array<[number, string, boolean]>): CheckStats {
  return {
    key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', low: '0.5844', high: '0.5864',
    n: values.length, mean: null, min: null, max: null, range: null, spreadFromFirst: null, stdDev: null, decimals: 5, passCount: 0, failCount: 0,
    deviations: values.map(([partNo, value, pass]) => ({ partNo, value, pass, fromFirst: '0', fromNominal: '0' })),
  };
}

describe('chartGeometry', () => {
  it('should shade the band between its limits with the nominal inside it', () => {
    const g = chartGeometry(stats([[1, '0.5856', true]]), 8);
    expect(g.band.height).toBeGreaterThan(0);
    expect(g.nominalY).toBeGreaterThan(g.band.y);
    expect(g.nominalY).toBeLessThan(g.band.y + g.band.height);
    expect(g.band.x).toBe(CHART_BOX.margin.left);
  });

  it('should place parts left to right in part order and higher values higher', () => {
    const g = chartGeometry(stats([[1, '0.5856', true], [2, '0.5850', true], [3, '0.5870', false]]), 8);
    expect(g.points.map((p) => p.partNo)).toEqual([1, 2, 3]);
    expect(g.points[0]!.x).toBeLessThan(g.points[1]!.x);
    expect(g.points[2]!.y).toBeLessThan(g.points[0]!.y); // SVG y grows downward
    expect(g.points[2]!.y).toBeLessThan(g.band.y); // above the band: out of tolerance
    expect(g.firstY).toBe(g.points[0]!.y);
    const [mx, my] = (/^M([\d.]+),([\d.]+)/.exec(g.path) ?? []).slice(1).map(Number);
    expect(mx).toBeCloseTo(g.points[0]!.x, 2);
    expect(my).toBeCloseTo(g.points[0]!.y, 2);
  });

  it('should keep every point inside the plot, even far outside the band', () => {
    const g = chartGeometry(stats([[1, '0.5000', false], [2, '0.7000', false]]), 2);
    for (const p of g.points) {
      expect(p.y).toBeGreaterThanOrEqual(g.plot.top);
      expect(p.y).toBeLessThanOrEqual(g.plot.bottom);
    }
  });

  it('should draw an empty run without a path and tick the parts to come', () => {
    const g = chartGeometry(stats([]), 8);
    expect(g.path).toBe('');
    expect(g.firstY).toBeNull();
    expect(g.xTicks.map((t) => t.label)).toEqual(['1', '2', '3', '4', '5', '6', '7', '8']);
    expect(g.yTicks.every((t) => /^\d\.\d{4}$/.test(t.label))).toBe(true);
  });

  it('should draw a few parts with full-size dots and a longer run with dots that stay apart', () => {
    expect(chartGeometry(stats([[1, '0.5856', true]]), 8).marks).toMatchObject({ r: 5, trace: 1.5 });
    for (const parts of [40, 60, 100]) {
      const g = chartGeometry(stats(Array.from({ length: parts }, (_, i): [number, string, boolean] => [i + 1, '0.5855', true])), parts);
      const spacing = g.points[1]!.x - g.points[0]!.x;
      // Two neighbours' dots, outlines included, do not meet.
      expect(2 * g.marks.r + g.marks.outline).toBeLessThanOrEqual(spacing);
      expect(g.marks.r).toBeGreaterThanOrEqual(1.5);
    }
  });

  it('should draw a long run as its trace with only the failed parts dotted', () => {
    const long = Array.from({ length: 300 }, (_, i): [number, string, boolean] => [i + 1, i === 150 ? '0.5870' : '0.5855', i !== 150]);
    const g = chartGeometry(stats(long), 300);
    expect(g.marks.r).toBe(0);
    expect(g.marks.failR).toBeGreaterThanOrEqual(3);
    expect(g.xTicks.length).toBeLessThanOrEqual(11);
  });
});
