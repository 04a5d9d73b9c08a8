import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';

import type { CheckStats } from '../../../shared/api/batch';

/** Size of a chart in view-box units. */
export interface ChartBox {
  readonly width: number;
  readonly height: number;
  readonly margin: { readonly top: number; readonly right: number; readonly bottom: number; readonly left: number };
}

/** A plotted part. */
export interface ChartPoint {
  readonly partNo: number;
  readonly value: string;
  readonly x: number;
  readonly y: number;
  readonly pass: boolean;
}

/** Everything the chart template binds. */
export interface ChartGeometry {
  readonly viewBox: string;
  /** The tolerance band as a rectangle. */
  readonly band: { readonly x: number; readonly y: number; readonly width: number; readonly height: number };
  readonly nominalY: number;
  /** Level of the first part's value (the "same as the first" line), or null. */
  readonly firstY: number | null;
  /** Path through the parts in order. */
  readonly path: string;
  readonly points: readonly ChartPoint[];
  readonly xTicks: ReadonlyArray<{ readonly x: number; readonly label: string }>;
  readonly yTicks: ReadonlyArray<{ readonly y: number; readonly label: string }>;
  readonly plot: { readonly left: number; readonly right: number; readonly top: number; readonly bottom: number };
  /**
   * Marker sizes for the run's length: a few parts get 5-unit dots, a longer run smaller ones, so
   * neighbours do not merge into one band; a long run shows its trace with only the failed parts
   * dotted (`r` 0). A failed part's dot stays big enough to find.
   */
  readonly marks: { readonly r: number; readonly failR: number; readonly outline: number; readonly trace: number };
}

/** The default chart size (it scales with its container). */
export const CHART_BOX: ChartBox = { width: 560, height: 220, margin: { top: 12, right: 16, bottom: 30, left: 64 } };

/**
 * Chart geometry of one check over a run: parts 1…partCount across, the value up, the tolerance
 * band shaded, the nominal and the first part's value as lines. The vertical range always shows the
 * whole band plus every value, with a little room; numbers are for drawing only (the statistics
 * themselves are exact decimals from the server).
 */
export function chartGeometry(stats: CheckStats, partCount: number, box: ChartBox = CHART_BOX): ChartGeometry {
  const { width, height, margin } = box;
  const plot = { left: margin.left, right: width - margin.right, top: margin.top, bottom: height - margin.bottom };
  const low = Number(stats.low);
  const high = Number(stats.high);
  const values = stats.deviations.map((d) => Number(d.value));
  const lo = Math.min(low, ...values);
  const hi = Math.max(high, ...values);
  const pad = (hi - lo || Math.abs(hi) || 1) * 0.15;
  const lastPart = Math.max(partCount, ...stats.deviations.map((d) => d.partNo), 1);
  const x = scaleLinear().domain([lastPart > 1 ? 1 : 0, Math.max(lastPart, 2)]).range([plot.left + 8, plot.right - 8]);
  const y = scaleLinear().domain([lo - pad, hi + pad]).range([plot.bottom, plot.top]);
  const points = stats.deviations.map((d) => ({ partNo: d.partNo, value: d.value, x: x(d.partNo), y: y(Number(d.value)), pass: d.pass }));
  const path = line<ChartPoint>().x((p) => p.x).y((p) => p.y)(points) ?? '';
  const decimals = Math.max(0, ...[stats.nominal, stats.low, stats.high].map((t) => (t.includes('.') ? t.length - t.indexOf('.') - 1 : 0)));
  const step = Math.max(1, Math.ceil(lastPart / 10));
  const xTicks = Array.from({ length: lastPart }, (_, i) => i + 1).filter((n) => n === 1 || n % step === 0).map((n) => ({ x: x(n), label: String(n) }));
  const yTicks = y.ticks(5).map((v) => ({ y: y(v), label: v.toFixed(decimals) }));
  // A dot's radius at most 0.4 of the spacing of two parts, so neighbours stay apart (5 units up
  // to about 40 parts). Closer than 4 units (a run of more than about 115 parts) the passing parts
  // are the trace alone and only the failed ones are dotted.
  const spacing = lastPart > 1 ? x(2) - x(1) : Infinity;
  const r = spacing < 4 ? 0 : Math.round(Math.min(5, Math.max(1.5, 0.4 * spacing)) * 100) / 100;
  const marks = { r, failR: Math.max(r, 3), outline: r >= 4 || r === 0 ? 1.5 : 0.1 * spacing, trace: r >= 4 ? 1.5 : 1 };
  return {
    viewBox: `0 0 ${width} ${height}`,
    band: { x: plot.left, y: y(high), width: plot.right - plot.left, height: Math.max(0, y(low) - y(high)) },
    nominalY: y(Number(stats.nominal)),
    firstY: points[0] ? points[0].y : null,
    path,
    points,
    xTicks,
    yTicks,
    plot,
    marks,
  };
}
