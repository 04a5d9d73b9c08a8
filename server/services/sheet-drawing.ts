/**
 * Geometry of the set-up sketch printed on a set-up sheet: pure functions from the set-up's
 * numbers to polygons in model units (y up). The PDF renderer scales them into its box.
 * These are drawing coordinates only; every printed number comes from the decimal engine.
 */

/** A point in model units. */
export interface Pt {
  x: number;
  y: number;
}

/** A labelled shape of the sketch. */
export interface SketchShape {
  kind: 'polygon' | 'line' | 'circle' | 'dimension';
  points: Pt[];
  /** Circle radius. */
  r?: number;
  /** Text for a dimension or a callout. */
  label?: string;
  style: 'part' | 'block' | 'removed' | 'cut' | 'tool' | 'mark';
}

/** A sketch with its bounding box. */
export interface Sketch {
  title: string;
  shapes: SketchShape[];
  box: { minX: number; minY: number; maxX: number; maxY: number };
}

const RAD = Math.PI / 180;

function rotate(p: Pt, deg: number): Pt {
  const c = Math.cos(deg * RAD);
  const s = Math.sin(deg * RAD);
  return { x: p.x * c - p.y * s, y: p.x * s + p.y * c };
}

function bounds(shapes: SketchShape[]): Sketch['box'] {
  const pts = shapes.flatMap((s) => (s.kind === 'circle' && s.r ? s.points.flatMap((p) => [{ x: p.x - s.r!, y: p.y - s.r! }, { x: p.x + s.r!, y: p.y + s.r! }]) : s.points));
  return {
    minX: Math.min(...pts.map((p) => p.x)),
    minY: Math.min(...pts.map((p) => p.y)),
    maxX: Math.max(...pts.map((p) => p.x)),
    maxY: Math.max(...pts.map((p) => p.y)),
  };
}

/**
 * A part of thickness T tilted by α on an angle block, so that the taper face (L long from the end)
 * is cut horizontally; touch off on the high corner and go down h = L·sin α (REFERENCE.md §1).
 */
export function taperSketch(thickness: number, taperLength: number, angleDeg: number, depthLabel: string): Sketch {
  const L = taperLength;
  const T = thickness;
  const P = Math.max(L * 2.2, L + 2 * T);
  const tilt = (x: number, y: number) => rotate({ x, y }, angleDeg);
  const blockLen = P * Math.cos(angleDeg * RAD);
  const part = [tilt(0, 0), tilt(P, 0), tilt(P, T), tilt(0, T)];
  const start = tilt(P - L, T);
  const corner = tilt(P, T);
  // Where the horizontal cut meets the end face of the part.
  const endBottom = tilt(P, 0);
  const f = (start.y - endBottom.y) / (corner.y - endBottom.y);
  const endCut = { x: endBottom.x + (corner.x - endBottom.x) * f, y: start.y };
  const shapes: SketchShape[] = [
    { kind: 'polygon', style: 'block', points: [{ x: 0, y: 0 }, { x: blockLen, y: 0 }, { x: blockLen, y: blockLen * Math.tan(angleDeg * RAD) }], label: 'angle block' },
    { kind: 'polygon', style: 'part', points: part },
    { kind: 'polygon', style: 'removed', points: [start, corner, endCut] },
    { kind: 'line', style: 'cut', points: [{ x: start.x - L * 0.4, y: start.y }, { x: endCut.x + L * 0.3, y: start.y }] },
    { kind: 'circle', style: 'mark', points: [corner], r: T * 0.06, label: 'touch off' },
    { kind: 'dimension', style: 'mark', points: [{ x: corner.x + L * 0.25, y: corner.y }, { x: corner.x + L * 0.25, y: start.y }], label: `h ${depthLabel}` },
  ];
  return { title: 'Part on the angle block, taper face level; touch off on the high corner', shapes, box: bounds(shapes) };
}

/** A sine bar of roll centre distance L set to θ on a gauge-block stack H = L·sin θ (REFERENCE.md §2.1). */
export function sineBarSketch(barLength: number, angleDeg: number, stackLabel: string): Sketch {
  const L = barLength;
  const r = L * 0.05;
  const H = L * Math.sin(angleDeg * RAD);
  const x2 = L * Math.cos(angleDeg * RAD);
  const bar = [rotate({ x: -r * 1.5, y: r }, angleDeg), rotate({ x: L + r * 1.5, y: r }, angleDeg), rotate({ x: L + r * 1.5, y: r * 3 }, angleDeg), rotate({ x: -r * 1.5, y: r * 3 }, angleDeg)];
  const lift = (p: Pt) => ({ x: p.x, y: p.y + r });
  const w = L * 0.12;
  const shapes: SketchShape[] = [
    { kind: 'line', style: 'cut', points: [{ x: -r * 3, y: 0 }, { x: x2 + w * 2, y: 0 }], label: 'surface plate' },
    { kind: 'polygon', style: 'block', points: [{ x: x2 - w / 2, y: 0 }, { x: x2 + w / 2, y: 0 }, { x: x2 + w / 2, y: H }, { x: x2 - w / 2, y: H }], label: 'stack' },
    { kind: 'polygon', style: 'part', points: bar.map(lift) },
    { kind: 'circle', style: 'tool', points: [{ x: 0, y: r }], r },
    { kind: 'circle', style: 'tool', points: [{ x: x2, y: H + r }], r },
    { kind: 'dimension', style: 'mark', points: [{ x: x2 + w, y: 0 }, { x: x2 + w, y: H }], label: `H ${stackLabel}` },
  ];
  return { title: 'Sine bar on the gauge-block stack', shapes, box: bounds(shapes) };
}

/** A right triangle showing the angle: the sketch for areas without their own. */
export function angleSketch(angleDeg: number, label: string): Sketch {
  const a = Math.min(Math.max(angleDeg, 1), 80);
  const base = 10;
  const shapes: SketchShape[] = [
    { kind: 'polygon', style: 'part', points: [{ x: 0, y: 0 }, { x: base, y: 0 }, { x: base, y: base * Math.tan(a * RAD) }] },
    { kind: 'dimension', style: 'mark', points: [{ x: 0, y: 0 }, { x: base * 0.3, y: 0 }], label },
  ];
  return { title: 'The angle of the set-up', shapes, box: bounds(shapes) };
}
