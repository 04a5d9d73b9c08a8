import { pathRound } from 'd3-path';

import { type Point, round2 } from './view-fit';

/** The SVG path text of a closed polygon through view-box points ("" for fewer than two). */
export function polygonPath(points: readonly Point[]): string {
  if (points.length < 2) return '';
  const path = pathRound(2);
  path.moveTo(points[0].x, points[0].y);
  for (const p of points.slice(1)) path.lineTo(p.x, p.y);
  path.closePath();
  return path.toString();
}

/** The SVG path text of an open polyline through view-box points. */
export function polylinePath(points: readonly Point[]): string {
  if (points.length < 2) return '';
  const path = pathRound(2);
  path.moveTo(points[0].x, points[0].y);
  for (const p of points.slice(1)) path.lineTo(p.x, p.y);
  return path.toString();
}

/** The SVG path text of separate straight segments ("M a L b" for each). */
export function segmentsPath(segments: readonly (readonly [Point, Point])[]): string {
  const path = pathRound(2);
  for (const [a, b] of segments) {
    path.moveTo(a.x, a.y);
    path.lineTo(b.x, b.y);
  }
  return path.toString();
}

/**
 * Hatching inside a polygon: parallel lines `spacing` apart at `angleDeg` (measured from the
 * view's x axis, counter-clockwise as seen on screen) at odd multiples of half the spacing
 * from the rotated origin, clipped to the polygon with the even-odd
 * rule. Returns the segments; empty for a polygon with no area or a spacing ≤ 0.
 */
export function hatchSegments(polygon: readonly Point[], spacing: number, angleDeg = 45): [Point, Point][] {
  if (polygon.length < 3 || !(spacing > 0)) return [];
  // Rotate the polygon so the hatch lines are horizontal, cut it with scanlines, rotate back.
  const a = (angleDeg * Math.PI) / 180;
  const cos = Math.cos(a);
  const sin = Math.sin(a);
  // On screen y points down, so "counter-clockwise as seen" means rotating by -a in view axes.
  const toLocal = (p: Point): Point => ({ x: p.x * cos - p.y * sin, y: p.x * sin + p.y * cos });
  const toView = (p: Point): Point => ({ x: round2(p.x * cos + p.y * sin), y: round2(-p.x * sin + p.y * cos) });
  const local = polygon.map(toLocal);
  const ys = local.map((p) => p.y);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  const segments: [Point, Point][] = [];
  // Lines sit half a spacing off the grid so they rarely run exactly along an edge or a vertex.
  const first = (Math.ceil(minY / spacing - 0.5) + 0.5) * spacing;
  for (let y = first; y <= maxY; y += spacing) {
    const xs: number[] = [];
    for (let i = 0; i < local.length; i++) {
      const p = local[i];
      const q = local[(i + 1) % local.length];
      // Half-open rule on y so a vertex on the scanline counts once.
      if ((p.y <= y && q.y > y) || (q.y <= y && p.y > y)) xs.push(p.x + ((y - p.y) * (q.x - p.x)) / (q.y - p.y));
    }
    xs.sort((m, n) => m - n);
    for (let i = 0; i + 1 < xs.length; i += 2) {
      if (xs[i + 1] - xs[i] > 1e-9) segments.push([toView({ x: xs[i], y }), toView({ x: xs[i + 1], y })]);
    }
  }
  return segments;
}

/** The hatching of {@link hatchSegments} as one SVG path. */
export function hatchPath(polygon: readonly Point[], spacing: number, angleDeg = 45): string {
  return segmentsPath(hatchSegments(polygon, spacing, angleDeg));
}

/**
 * The part of a polygon on one side of the level y = `level` (model units, y up): `'above'` keeps
 * y ≥ level, `'below'` keeps y ≤ level (one Sutherland–Hodgman pass). Empty when nothing is left.
 */
export function clipToLevel(polygon: readonly Point[], level: number, keep: 'above' | 'below'): Point[] {
  const inside = (p: Point) => (keep === 'above' ? p.y >= level : p.y <= level);
  const out: Point[] = [];
  for (let i = 0; i < polygon.length; i++) {
    const p = polygon[i];
    const q = polygon[(i + 1) % polygon.length];
    if (inside(p)) out.push(p);
    if (inside(p) !== inside(q)) {
      const t = (level - p.y) / (q.y - p.y);
      out.push({ x: p.x + t * (q.x - p.x), y: level });
    }
  }
  return out.length >= 3 ? out : [];
}

/** Where the level y = `level` crosses a convex polygon: the chord's two ends (left first), or null. */
export function chordAtLevel(polygon: readonly Point[], level: number): [Point, Point] | null {
  const xs: number[] = [];
  for (let i = 0; i < polygon.length; i++) {
    const p = polygon[i];
    const q = polygon[(i + 1) % polygon.length];
    if (p.y === level && q.y === level) {
      xs.push(p.x, q.x);
    } else if ((p.y - level) * (q.y - level) <= 0 && p.y !== q.y) {
      xs.push(p.x + ((level - p.y) * (q.x - p.x)) / (q.y - p.y));
    }
  }
  if (xs.length < 2) return null;
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  return hi - lo > 1e-12 ? [{ x: lo, y: level }, { x: hi, y: level }] : null;
}

/**
 * Label positions along one axis: each as near its wanted position as possible, in the same
 * order, at least `minGap` apart (stacked labels of thin blocks must not overlap). Positions
 * are pushed apart forwards from the first, then the whole run is slid back inside `max` if it
 * overran it. Rounded to 0.01.
 */
export function spreadPositions(wanted: readonly number[], minGap: number, max = Infinity): number[] {
  const out: number[] = [];
  for (const w of wanted) out.push(out.length ? Math.max(w, out[out.length - 1] + minGap) : w);
  const over = out.length ? out[out.length - 1] - max : 0;
  if (over > 0) {
    // Slide back from the end, keeping the gaps, but never further than each wanted position allows.
    for (let i = out.length - 1; i >= 0; i--) {
      const limit = i === out.length - 1 ? max : out[i + 1] - minGap;
      out[i] = Math.min(out[i], limit);
    }
  }
  return out.map(round2);
}
