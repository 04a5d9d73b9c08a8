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
  /** Where the label goes, when not at the shape's usual place. */
  labelAt?: Pt;
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

/**
 * A gauge-block stack as wrung, largest block at the bottom, each block labelled with its size and
 * the total beside it. Thin blocks get a minimum drawn height so each label has room: the sketch
 * shows the order and the sizes, not the proportions.
 */
export function gaugeStackSketch(blocks: readonly string[], totalLabel: string): Sketch {
  const sizes = blocks.map(Number).filter((n) => Number.isFinite(n) && n > 0);
  const order = [...sizes.keys()].sort((i, j) => sizes[j]! - sizes[i]!);
  const total = sizes.reduce((a, b) => a + b, 0);
  const minH = total * 0.08;
  const w = Math.max(total * 0.35, minH * 3);
  const shapes: SketchShape[] = [{ kind: 'line', style: 'cut', points: [{ x: -w * 0.4, y: 0 }, { x: w * 1.9, y: 0 }], label: 'surface plate' }];
  let y = 0;
  for (const i of order) {
    const h = Math.max(sizes[i]!, minH);
    shapes.push({ kind: 'polygon', style: 'block', points: [{ x: 0, y }, { x: w, y }, { x: w, y: y + h }, { x: 0, y: y + h }], label: blocks[i], labelAt: { x: w * 0.05, y: y + h / 2 } });
    y += h;
  }
  shapes.push({ kind: 'dimension', style: 'mark', points: [{ x: w * 1.3, y: 0 }, { x: w * 1.3, y }], label: totalLabel });
  return { title: 'Gauge-block stack, largest block at the bottom (block heights not to scale)', shapes, box: bounds(shapes) };
}

/**
 * Work turned with a taper: the large end toward the headstock, the small end toward the tail
 * stock, and the compound (or the tail-stock offset) set to the half angle. The taper is drawn at
 * least 6° a side so a slight taper still shows; the title says when it is exaggerated.
 */
export function latheTaperSketch(halfAngleDeg: number, halfAngleLabel: string, largeDiameter: number | null, length: number | null, lengthLabel = 'taper length'): Sketch {
  const L = length ?? 6;
  const D = largeDiameter ?? L / 4;
  const drawn = Math.max(halfAngleDeg, 6);
  const d = Math.max(D - 2 * L * Math.tan(drawn * RAD), D * 0.25);
  const run = (D - d) / 2 / Math.tan(drawn * RAD);
  const shapes: SketchShape[] = [
    { kind: 'polygon', style: 'block', points: [{ x: -L * 0.25, y: -D * 0.8 }, { x: 0, y: -D * 0.8 }, { x: 0, y: D * 0.8 }, { x: -L * 0.25, y: D * 0.8 }], label: 'chuck' },
    { kind: 'polygon', style: 'part', points: [{ x: 0, y: -D / 2 }, { x: run, y: -d / 2 }, { x: run, y: d / 2 }, { x: 0, y: D / 2 }] },
    { kind: 'line', style: 'mark', points: [{ x: -L * 0.3, y: 0 }, { x: run + L * 0.3, y: 0 }] },
    { kind: 'line', style: 'cut', points: [{ x: 0, y: D / 2 }, { x: run + L * 0.15, y: D / 2 - (run + L * 0.15) * Math.tan(drawn * RAD) }], label: `compound at ${halfAngleLabel}`, labelAt: { x: run * 0.2, y: D / 2 + D * 0.12 } },
    { kind: 'dimension', style: 'mark', points: [{ x: 0, y: -D / 2 - D * 0.25 }, { x: run, y: -D / 2 - D * 0.25 }], label: lengthLabel },
  ];
  const title = drawn > halfAngleDeg ? 'Taper on the work, tool path at the half angle (angle exaggerated)' : 'Taper on the work, tool path at the half angle';
  return { title, shapes, box: bounds(shapes) };
}

/** One angle block of a combination: its angle in degrees, its label, and whether it is turned round. */
export interface SketchAngleBlock {
  angleDeg: number;
  label: string;
  reversed: boolean;
}

/**
 * Angle blocks wrung into a combination, bottom first: each block adds its angle, or takes it away
 * when turned round (thick end on the other side), so the top face ends at the sum.
 */
export function angleBlocksSketch(blocks: readonly SketchAngleBlock[], resultLabel: string): Sketch {
  const L = 10;
  const t = 0.8;
  const shapes: SketchShape[] = [{ kind: 'line', style: 'cut', points: [{ x: -1, y: 0 }, { x: L + 1, y: 0 }] }];
  let origin: Pt = { x: 0, y: 0 };
  let dir = 0;
  for (const b of blocks) {
    const u = rotate({ x: 1, y: 0 }, dir);
    const n = rotate({ x: 0, y: 1 }, dir);
    const rise = L * Math.tan(b.angleDeg * RAD);
    const at = (along: number, up: number): Pt => ({ x: origin.x + u.x * along + n.x * up, y: origin.y + u.y * along + n.y * up });
    const [left, right] = b.reversed ? [t + rise, t] : [t, t + rise];
    const corners = [at(0, 0), at(L, 0), at(L, right), at(0, left)];
    shapes.push({ kind: 'polygon', style: 'block', points: corners, label: b.reversed ? `${b.label} turned round` : b.label, labelAt: at(L * 0.06, Math.min(left, right) * 0.35) });
    origin = corners[3]!;
    dir += b.reversed ? -b.angleDeg : b.angleDeg;
  }
  const top = rotate({ x: L, y: 0 }, dir);
  shapes.push({ kind: 'line', style: 'mark', points: [origin, { x: origin.x + top.x, y: origin.y + top.y }], label: `top face at ${resultLabel}`, labelAt: { x: origin.x + top.x * 0.5, y: origin.y + top.y * 0.5 + 1.2 } });
  return { title: 'Angle blocks wrung together, bottom block first; a block turned round takes its angle away', shapes, box: bounds(shapes) };
}

/**
 * A dovetail checked with two equal rolls: on a male dovetail the rolls sit in the undercut beside
 * it and the reading is over them; in a female slot they sit in its corners and the reading is
 * between them. Each roll touches the base and the flank, so its centre is r·cot(α/2) from the
 * sharp corner along the base (REFERENCE.md §5).
 */
export function dovetailSketch(side: 'male' | 'female', width: number, angleDeg: number, rollDiameter: number, depth: number | null, measurementLabel: string): Sketch {
  const W = width;
  const r = rollDiameter / 2;
  const h = depth ?? W * 0.35;
  const run = h / Math.tan(angleDeg * RAD);
  const offset = r / Math.tan((angleDeg / 2) * RAD);
  const B = W / 2 + Math.max(run, 0) + W * 0.45;
  const shapes: SketchShape[] = [];
  let cx: number;
  if (side === 'male') {
    shapes.push({ kind: 'polygon', style: 'block', points: [{ x: -B, y: -h * 0.4 }, { x: B, y: -h * 0.4 }, { x: B, y: 0 }, { x: -B, y: 0 }] });
    shapes.push({ kind: 'polygon', style: 'part', points: [{ x: -W / 2, y: 0 }, { x: W / 2, y: 0 }, { x: W / 2 + run, y: h }, { x: -W / 2 - run, y: h }] });
    cx = W / 2 + offset;
  } else {
    shapes.push({ kind: 'polygon', style: 'part', points: [{ x: -B, y: -h * 0.4 }, { x: B, y: -h * 0.4 }, { x: B, y: h }, { x: W / 2 - run, y: h }, { x: W / 2, y: 0 }, { x: -W / 2, y: 0 }, { x: -W / 2 + run, y: h }, { x: -B, y: h }] });
    cx = W / 2 - offset;
  }
  shapes.push({ kind: 'circle', style: 'tool', points: [{ x: -cx, y: r }], r }, { kind: 'circle', style: 'tool', points: [{ x: cx, y: r }], r });
  const reach = side === 'male' ? cx + r : cx - r;
  shapes.push({ kind: 'dimension', style: 'mark', points: [{ x: -reach, y: h + r * 1.5 }, { x: reach, y: h + r * 1.5 }], label: `M ${measurementLabel}` });
  shapes.push({ kind: 'line', style: 'mark', points: [{ x: -reach, y: r }, { x: -reach, y: h + r * 1.5 }] }, { kind: 'line', style: 'mark', points: [{ x: reach, y: r }, { x: reach, y: h + r * 1.5 }] });
  const title = side === 'male' ? 'Male dovetail: reading over two rolls' : 'Female dovetail: reading between two rolls';
  return { title, shapes, box: bounds(shapes) };
}

/**
 * A pin resting in a V-groove of included angle θ and width W at the surface: the pin touches both
 * flanks, so its centre is r / sin(θ/2) above the groove's apex; the reading is the height of its
 * top over the surface (negative when it sits below).
 */
export function vGrooveSketch(width: number, includedAngleDeg: number, pinDiameter: number, heightLabel: string): Sketch {
  const r = pinDiameter / 2;
  const half = (includedAngleDeg / 2) * RAD;
  const apex = width / 2 / Math.tan(half);
  const centre = { x: 0, y: -apex + r / Math.sin(half) };
  const top = centre.y + r;
  const B = width / 2 + Math.max(width * 0.6, pinDiameter);
  const floor = -apex - Math.max(apex * 0.4, pinDiameter * 0.3);
  const x = Math.max(width / 2, r) + pinDiameter * 0.8;
  const shapes: SketchShape[] = [
    { kind: 'polygon', style: 'part', points: [{ x: -B, y: floor }, { x: B, y: floor }, { x: B, y: 0 }, { x: width / 2, y: 0 }, { x: 0, y: -apex }, { x: -width / 2, y: 0 }, { x: -B, y: 0 }] },
    { kind: 'circle', style: 'tool', points: [centre], r },
    { kind: 'line', style: 'mark', points: [{ x: 0, y: top }, { x, y: top }] },
    { kind: 'dimension', style: 'mark', points: [{ x, y: 0 }, { x, y: top }], label: `h ${heightLabel}` },
  ];
  return { title: 'Pin in the V-groove: height of its top over the surface', shapes, box: bounds(shapes) };
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
