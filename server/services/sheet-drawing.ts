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
  /** A circle's label above it, ending at its centre (where a dimension to its right would cross it). */
  labelAbove?: true;
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

/** The bounding box of the shapes and of the points their labels are placed at. */
function boundsWithLabels(shapes: SketchShape[]): Sketch['box'] {
  const anchors = shapes.flatMap((s) => (s.labelAt ? [s.labelAt] : []));
  return bounds([...shapes, { kind: 'line', style: 'mark', points: anchors }]);
}

/** What holds the part at the taper angle, as the taper page plans it (shared/forms/taper-holding). */
export type TaperSketchHolding =
  | { kind: 'angle-block' }
  /** A sine plate of roll distance `plateLength` (model units) on a stack under its free roll. */
  | { kind: 'sine-plate'; plateLength: number; stackLabel: string }
  | { kind: 'tilted-vise' };

/**
 * A part of thickness T tilted by α so that the taper face (L long from the end) is cut
 * horizontally; touch off on the high corner and go down h = L·sin α (REFERENCE.md §1). The part
 * sits on angle blocks, on a sine plate over a stack of H = Lp·sin α (REFERENCE.md §2.1), or in the
 * jaws of a tilted vise; the end to taper is always the raised one.
 */
export function taperSketch(thickness: number, taperLength: number, angleDeg: number, depthLabel: string, holding: TaperSketchHolding = { kind: 'angle-block' }): Sketch {
  const L = taperLength;
  const T = thickness;
  const P = Math.max(L * 2.2, L + 2 * T);
  const sin = Math.sin(angleDeg * RAD);
  const cos = Math.cos(angleDeg * RAD);
  const support: SketchShape[] = [];
  // Where the part lies: part coordinates (x along its bottom face from the low end, y up through
  // it) → drawing coordinates.
  let tilt = (x: number, y: number) => rotate({ x, y }, angleDeg);
  let title = 'Part on the angle block, taper face level; touch off on the high corner';
  if (holding.kind === 'angle-block') {
    const blockLen = P * cos;
    const rise = blockLen * Math.tan(angleDeg * RAD);
    // The name beside the wedge's tall end, clear of its lines however flat the wedge is.
    support.push({ kind: 'polygon', style: 'block', points: [{ x: 0, y: 0 }, { x: blockLen, y: 0 }, { x: blockLen, y: rise }], label: 'angle block', labelAt: { x: blockLen, y: rise * 0.5 } });
  } else if (holding.kind === 'sine-plate') {
    // As the sine-bar sketch: the hinge roll's centre r above the base, the plate r to 3r above
    // the roll centres, the free roll on a stack of H = Lp·sin α; the part on the plate, its
    // tapered end toward the raised roll.
    const Lp = holding.plateLength;
    const r = Math.max(Lp, P) * 0.04;
    const onPlate = (x: number, y: number) => {
      const p = rotate({ x, y }, angleDeg);
      return { x: p.x, y: p.y + r };
    };
    const x0 = Math.max(0, Lp - P);
    tilt = (x, y) => onPlate(x0 + x, y + 3 * r);
    const H = Lp * sin;
    const x2 = Lp * cos;
    const w = Math.max(Lp, P) * 0.1;
    support.push(
      { kind: 'line', style: 'cut', points: [{ x: -r * 3, y: 0 }, { x: Math.max(x2, (x0 + P) * cos) + w * 2, y: 0 }], label: 'surface plate' },
      { kind: 'polygon', style: 'block', points: [{ x: x2 - w / 2, y: 0 }, { x: x2 + w / 2, y: 0 }, { x: x2 + w / 2, y: H }, { x: x2 - w / 2, y: H }], label: 'stack', labelAt: { x: x2 - w / 2, y: H / 2 } },
      { kind: 'polygon', style: 'block', points: [onPlate(-r * 1.5, r), onPlate(Math.max(Lp, x0 + P) + r * 1.5, r), onPlate(Math.max(Lp, x0 + P) + r * 1.5, 3 * r), onPlate(-r * 1.5, 3 * r)], label: 'sine plate', labelAt: onPlate(Lp * 0.3, 2.3 * r) },
      { kind: 'circle', style: 'tool', points: [{ x: 0, y: r }], r },
      { kind: 'circle', style: 'tool', points: [{ x: x2, y: H + r }], r },
      { kind: 'dimension', style: 'mark', points: [{ x: x2 + w, y: 0 }, { x: x2 + w, y: H }], label: `H ${holding.stackLabel}` },
    );
    title = `Part on the sine plate over a ${holding.stackLabel} stack, taper face level; touch off on the high corner`;
  } else {
    // The vise body tilted about its hinge at the low end; the part in its jaws, on a parallel.
    const bed = T * 0.9;
    const m = P * 0.08;
    const body = [tilt(-m, -bed), tilt(P + m, -bed), tilt(P + m, 0), tilt(-m, 0)];
    const low = Math.min(...body.map((p) => p.y));
    const hinge = tilt(-m * 0.5, -bed * 0.5);
    support.push(
      { kind: 'polygon', style: 'block', points: [{ x: -m * 1.5, y: low - bed }, { x: (P + m) * cos + m, y: low - bed }, { x: (P + m) * cos + m, y: low - bed * 0.25 }, { x: -m * 1.5, y: low - bed * 0.25 }], label: 'vise base', labelAt: { x: P * 0.3, y: low - bed * 0.6 } },
      { kind: 'polygon', style: 'block', points: body, label: 'vise body, tilted', labelAt: tilt(P * 0.3, -bed * 0.45) },
      { kind: 'circle', style: 'tool', points: [hinge], r: bed * 0.3 },
    );
    title = 'Part in the tilted vise, taper face level; touch off on the high corner';
  }
  const part = [tilt(0, 0), tilt(P, 0), tilt(P, T), tilt(0, T)];
  const start = tilt(P - L, T);
  const corner = tilt(P, T);
  // Where the horizontal cut meets the end face of the part.
  const endBottom = tilt(P, 0);
  const f = (start.y - endBottom.y) / (corner.y - endBottom.y);
  const endCut = { x: endBottom.x + (corner.x - endBottom.x) * f, y: start.y };
  const shapes: SketchShape[] = [
    ...support,
    { kind: 'polygon', style: 'part', points: part },
    { kind: 'polygon', style: 'removed', points: [start, corner, endCut] },
    { kind: 'line', style: 'cut', points: [{ x: start.x - L * 0.4, y: start.y }, { x: endCut.x + L * 0.3, y: start.y }] },
    { kind: 'circle', style: 'mark', points: [corner], r: T * 0.06, label: 'touch off', labelAbove: true },
    // The depth to stop, when the engine gave one.
    { kind: 'dimension', style: 'mark', points: [{ x: corner.x + L * 0.25, y: corner.y }, { x: corner.x + L * 0.25, y: start.y }], ...(/\d/.test(depthLabel) ? { label: `h ${depthLabel}` } : {}) },
  ];
  return { title, shapes, box: bounds(shapes) };
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
    { kind: 'polygon', style: 'block', points: [{ x: x2 - w / 2, y: 0 }, { x: x2 + w / 2, y: 0 }, { x: x2 + w / 2, y: H }, { x: x2 - w / 2, y: H }], label: 'stack', labelAt: { x: x2 - w / 2, y: H / 2 } },
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
 * shows the order and the sizes, not the proportions. With wear blocks (`labels` naming them, as
 * the answer does: "0.050 wear"), the stack is drawn in its wringing order, a wear block at each end.
 */
export function gaugeStackSketch(blocks: readonly string[], totalLabel: string, labels?: readonly string[]): Sketch {
  const named = labels && labels.length === blocks.length ? labels : blocks;
  const wear = named.some((l, i) => l !== blocks[i]);
  const entries = blocks.map((b, i) => ({ size: Number(b), label: named[i] ?? b })).filter((e) => Number.isFinite(e.size) && e.size > 0);
  const sizes = entries.map((e) => e.size);
  const order = wear ? [...sizes.keys()] : [...sizes.keys()].sort((i, j) => sizes[j]! - sizes[i]!);
  const total = sizes.reduce((a, b) => a + b, 0);
  const minH = total * 0.08;
  const w = Math.max(total * 0.35, minH * 3);
  const shapes: SketchShape[] = [{ kind: 'line', style: 'cut', points: [{ x: -w * 0.4, y: 0 }, { x: w * 1.9, y: 0 }], label: 'surface plate' }];
  let y = 0;
  for (const i of order) {
    const h = Math.max(sizes[i]!, minH);
    shapes.push({ kind: 'polygon', style: 'block', points: [{ x: 0, y }, { x: w, y }, { x: w, y: y + h }, { x: 0, y: y + h }], label: entries[i]!.label, labelAt: { x: w * 0.05, y: y + h / 2 } });
    y += h;
  }
  shapes.push({ kind: 'dimension', style: 'mark', points: [{ x: w * 1.3, y: 0 }, { x: w * 1.3, y }], label: totalLabel });
  const title = wear ? 'Gauge-block stack as wrung, a wear block at each end, largest block next (block heights not to scale)' : 'Gauge-block stack, largest block at the bottom (block heights not to scale)';
  return { title, shapes, box: bounds(shapes) };
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
 * The section of a dovetail with its sharp corners at ±W/2 on the base (y = 0) and flanks rising
 * `run` outward (male: the tongue widens upward on its base block) or inward (female: the slot
 * narrows upward) over the depth h; B is the half width of the block or the body.
 */
function dovetailSection(side: 'male' | 'female', W: number, run: number, h: number, B: number): SketchShape[] {
  if (side === 'male') {
    return [
      { kind: 'polygon', style: 'block', points: [{ x: -B, y: -h * 0.4 }, { x: B, y: -h * 0.4 }, { x: B, y: 0 }, { x: -B, y: 0 }] },
      { kind: 'polygon', style: 'part', points: [{ x: -W / 2, y: 0 }, { x: W / 2, y: 0 }, { x: W / 2 + run, y: h }, { x: -W / 2 - run, y: h }] },
    ];
  }
  return [{ kind: 'polygon', style: 'part', points: [{ x: -B, y: -h * 0.4 }, { x: B, y: -h * 0.4 }, { x: B, y: h }, { x: W / 2 - run, y: h }, { x: W / 2, y: 0 }, { x: -W / 2, y: 0 }, { x: -W / 2 + run, y: h }, { x: -B, y: h }] }];
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
  const shapes: SketchShape[] = dovetailSection(side, W, run, h, B);
  const cx = side === 'male' ? W / 2 + offset : W / 2 - offset;
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

/** Labels of {@link dovetailAngleSketch}: the two readings as set up, the engine's width and angle. */
export interface DovetailAngleLabels {
  reading1: string;
  reading2: string;
  width: string;
  angle: string;
}

/**
 * A dovetail checked with two sizes of roll in the same corners: each pair touches the base and the
 * flank, so the readings differ by (D₂ − D₁)·k with k = 1 + cot(α/2). The angle and the corner width
 * are placed from the readings themselves (REFERENCE.md §5.1, inverse): k = Δx/ΔD, α = 2·atan(1/(k − 1)),
 * a = x₁ − D₁·k (male) or b = y₁ + D₁·k (female). The larger pair is drawn first, the second pair in
 * the accent colour. Null when the readings do not make a dovetail (k ≤ 2, i.e. α ≥ 90°, or no width).
 */
export function dovetailAngleSketch(side: 'male' | 'female', rollDiameter1: number, measurement1: number, rollDiameter2: number, measurement2: number, labels: DovetailAngleLabels): Sketch | null {
  const male = side === 'male';
  const k = (male ? measurement2 - measurement1 : measurement1 - measurement2) / (rollDiameter2 - rollDiameter1);
  const W = male ? measurement1 - rollDiameter1 * k : measurement1 + rollDiameter1 * k;
  const alpha = 2 * Math.atan(1 / (k - 1));
  if (![k, W, alpha].every(Number.isFinite) || !(k > 2) || !(W > 0) || !(rollDiameter1 > 0) || !(rollDiameter2 > 0) || !(measurement1 > 0) || !(measurement2 > 0)) return null;
  const big = Math.max(rollDiameter1, rollDiameter2);
  // Deep enough that the larger roll touches the flank below the corner, r·(1 + cos α) < 2r;
  // a female slot keeps at least a tenth of its width open at the top.
  const h = male ? big * 1.6 : Math.min(big * 1.6, W * 0.45 * Math.tan(alpha));
  const run = h / Math.tan(alpha);
  const B = male ? Math.max(W / 2 + run, measurement1 / 2, measurement2 / 2) + Math.max(W * 0.2, big) : W / 2 + Math.max(W * 0.45, big);
  const shapes = dovetailSection(side, W, run, h, B);
  const pairs = [
    { d: rollDiameter1, label: labels.reading1, style: 'tool' as const },
    { d: rollDiameter2, label: labels.reading2, style: 'mark' as const },
  ];
  const gap = Math.max(big * 0.9, h * 0.35);
  // A roll of radius r touching base and flank: its centre is r·cot(α/2) out from (male) or in from (female) the corner.
  const centreX = (r: number) => (male ? W / 2 + r / Math.tan(alpha / 2) : W / 2 - r / Math.tan(alpha / 2));
  const readings: SketchShape[] = [];
  pairs.forEach((pair, i) => {
    const r = pair.d / 2;
    const cx = centreX(r);
    const reach = male ? cx + r : cx - r;
    const y = h + gap * (i + 1);
    readings.push(
      { kind: 'dimension', style: 'mark', points: [{ x: -reach, y }, { x: reach, y }], label: pair.label, labelAt: { x: -reach / 2, y: y + gap * 0.3 } },
      { kind: 'line', style: 'mark', points: [{ x: -reach, y: r }, { x: -reach, y }] },
      { kind: 'line', style: 'mark', points: [{ x: reach, y: r }, { x: reach, y }] },
    );
  });
  for (const pair of [...pairs].sort((a, b) => b.d - a.d)) {
    const r = pair.d / 2;
    const cx = centreX(r);
    shapes.push({ kind: 'circle', style: pair.style, points: [{ x: -cx, y: r }], r }, { kind: 'circle', style: pair.style, points: [{ x: cx, y: r }], r });
  }
  shapes.push(...readings);
  const below = -h * 0.4 - gap * 0.6;
  shapes.push(
    { kind: 'dimension', style: 'mark', points: [{ x: -W / 2, y: below }, { x: W / 2, y: below }], label: labels.width },
    { kind: 'line', style: 'mark', points: [{ x: -W / 2, y: 0 }, { x: -W / 2, y: below }] },
    { kind: 'line', style: 'mark', points: [{ x: W / 2, y: 0 }, { x: W / 2, y: below }] },
  );
  const flankTop = { x: male ? W / 2 + run : W / 2 - run, y: h };
  shapes.push({ kind: 'line', style: 'mark', points: [{ x: W / 2, y: 0 }, flankTop], label: labels.angle, labelAt: { x: W / 2 + (flankTop.x - W / 2) * 0.8, y: h * 0.8 } });
  const title = male ? 'Male dovetail: readings over two sizes of roll in the same corners give the angle' : 'Female dovetail: readings between two sizes of roll in the same corners give the angle';
  return { title, shapes, box: boundsWithLabels(shapes) };
}

/** Labels of {@link taperTwoHeightsSketch}: the readings and ΔH as set up, the engine's angles. */
export interface TwoHeightsLabels {
  reading1: string;
  reading2: string;
  height: string;
  halfAngle: string;
  included: string;
}

/**
 * A taper standing on the surface plate, checked over a pair of rolls at one height (M₁) and again
 * with the rolls ΔH higher (M₂, accent colour): each roll rests on the plate or its stack and
 * touches the side, so the side leans at tan(α/2) = (M₂ − M₁)/(2·ΔH) (REFERENCE.md §5.2). The roll
 * size cancels; it is drawn small enough (and the stacks low enough) that the work keeps a width at
 * the plate and at the top and the stacks clear it.
 */
export function taperTwoHeightsSketch(measurement1: number, measurement2: number, heightDifference: number, labels: TwoHeightsLabels): Sketch | null {
  const m1 = measurement1;
  const m2 = measurement2;
  const dh = heightDifference;
  if (![m1, m2, dh].every((n) => Number.isFinite(n) && n > 0)) return null;
  const theta = Math.atan((m2 - m1) / (2 * dh));
  const t = Math.tan(theta);
  const c = Math.cos(theta);
  const least = Math.min(m1, m2);
  const r = Math.min(least * 0.08, (least * 0.3) / (1 + 1 / c + 2 * Math.abs(t)));
  // x of the right side at the first rolls' centre height, then along the side.
  const x1 = m1 / 2 - r - r / c;
  let stack = Math.max(dh * 0.25, r);
  // Widening upward: the foot of the side stays at least a tenth of M₁ from the axis.
  if (t > 0) stack = Math.min(stack, Math.max((x1 - m1 * 0.1) / t - r, 0));
  // Narrowing upward: the stack (0.8 r a side of the roll's centre) stays clear of the side.
  if (t < 0) stack = Math.min(stack, Math.max((r * (1 / c - 0.85)) / -t - r, 0));
  const z1 = stack + r;
  const z2 = z1 + dh;
  const top = z2 + 2 * r;
  const side = (z: number) => x1 + t * (z - z1);
  const plateT = Math.max(top * 0.05, r * 0.5);
  const outer = Math.max(m1, m2) / 2;
  const plateHalf = Math.max(outer, side(0), side(top)) + r * 3;
  const shapes: SketchShape[] = [
    { kind: 'polygon', style: 'block', points: [{ x: -plateHalf, y: -plateT }, { x: plateHalf, y: -plateT }, { x: plateHalf, y: 0 }, { x: -plateHalf, y: 0 }], label: 'surface plate', labelAt: { x: plateHalf, y: -plateT / 2 } },
    { kind: 'polygon', style: 'part', points: [{ x: -side(0), y: 0 }, { x: side(0), y: 0 }, { x: side(top), y: top }, { x: -side(top), y: top }] },
  ];
  for (const s of [-1, 1]) {
    // The second reading's stacks, ΔH higher, at the rolls' second place: dashed outlines.
    const cx2 = s * (m2 / 2 - r);
    const high = z2 - r;
    shapes.push(
      { kind: 'line', style: 'mark', points: [{ x: cx2 - r * 0.8, y: 0 }, { x: cx2 - r * 0.8, y: high }] },
      { kind: 'line', style: 'mark', points: [{ x: cx2 + r * 0.8, y: 0 }, { x: cx2 + r * 0.8, y: high }] },
      { kind: 'line', style: 'mark', points: [{ x: cx2 - r * 0.8, y: high }, { x: cx2 + r * 0.8, y: high }] },
    );
    if (stack > 0) {
      const cx = s * (m1 / 2 - r);
      shapes.push({ kind: 'polygon', style: 'block', points: [{ x: cx - r * 0.8, y: 0 }, { x: cx + r * 0.8, y: 0 }, { x: cx + r * 0.8, y: stack }, { x: cx - r * 0.8, y: stack }] });
    }
  }
  const gap = Math.max(r * 2, top * 0.13);
  const readings = [
    { m: m1, z: z1, style: 'tool' as const, label: labels.reading1 },
    { m: m2, z: z2, style: 'mark' as const, label: labels.reading2 },
  ];
  readings.forEach(({ m, z, style, label }, i) => {
    const y = -plateT - gap * (i + 1);
    shapes.push(
      { kind: 'circle', style, points: [{ x: -(m / 2 - r), y: z }], r },
      { kind: 'circle', style, points: [{ x: m / 2 - r, y: z }], r },
      { kind: 'dimension', style: 'mark', points: [{ x: -m / 2, y }, { x: m / 2, y }], label, labelAt: { x: -m / 4, y: y + gap * 0.3 } },
      { kind: 'line', style: 'mark', points: [{ x: -m / 2, y: z }, { x: -m / 2, y }] },
      { kind: 'line', style: 'mark', points: [{ x: m / 2, y: z }, { x: m / 2, y }] },
    );
  });
  const xh = plateHalf + gap;
  shapes.push(
    { kind: 'dimension', style: 'mark', points: [{ x: xh, y: z1 }, { x: xh, y: z2 }], label: labels.height },
    { kind: 'line', style: 'mark', points: [{ x: m1 / 2, y: z1 }, { x: xh, y: z1 }] },
    { kind: 'line', style: 'mark', points: [{ x: m2 / 2, y: z2 }, { x: xh, y: z2 }] },
    // The side, its half angle labelled beside its top corner: above the rolls, stacks and reading lines.
    { kind: 'line', style: 'mark', points: [{ x: side(0), y: 0 }, { x: side(top), y: top }], label: labels.halfAngle, labelAt: { x: side(top), y: top } },
    { kind: 'line', style: 'mark', points: [{ x: 0, y: -plateT }, { x: 0, y: top + r * 2.4 }], label: labels.included, labelAt: { x: 0, y: top + r * 2.4 } },
  );
  return { title: 'Taper on the surface plate: M1 over a pair of rolls, M2 with the rolls raised ΔH on higher stacks (dashed)', shapes, box: boundsWithLabels(shapes) };
}

/** Labels of {@link taperDiscsSketch}: the discs as set up, the engine's centre distance and angle. */
export interface DiscsLabels {
  large: string;
  small: string;
  centres: string;
  angle: string;
}

/**
 * Two discs of diameters D and d at centre distance C between two straightedges. About the axis
 * each straightedge leans sin φ = (D − d)/(2C) from the centre line; with one side square the square
 * straightedge touches both discs and the other is its mirror image in the line of centres, 2φ from
 * it (Machinery's Handbook disc method, REFERENCE.md §5.2; placement derived). Null unless D > d and
 * C > (D − d)/2.
 */
export function taperDiscsSketch(reference: 'axis' | 'side', largeDisc: number, smallDisc: number, centreDistance: number, labels: DiscsLabels): Sketch | null {
  const R = largeDisc / 2;
  const r = smallDisc / 2;
  const C = centreDistance;
  if (![R, r, C].every((n) => Number.isFinite(n) && n > 0) || !(R > r) || !(C > R - r)) return null;
  const phi = Math.asin((R - r) / C);
  const t = R * 0.15;
  const ext = Math.max(R * 0.9, r * 1.6);
  /** A straightedge t thick on the outer side (unit normal n) of the line through a and b, run past both. */
  const edge = (a: Pt, b: Pt, n: Pt, label?: string): SketchShape => {
    const len = Math.hypot(b.x - a.x, b.y - a.y);
    // Along the line from a to b (the normal turned a quarter, when a and b coincide).
    const u = len > 0 ? { x: (b.x - a.x) / len, y: (b.y - a.y) / len } : { x: -n.y, y: n.x };
    const p = { x: a.x - u.x * ext, y: a.y - u.y * ext };
    const q = { x: b.x + u.x * ext, y: b.y + u.y * ext };
    const outer = [{ x: q.x + n.x * t, y: q.y + n.y * t }, { x: p.x + n.x * t, y: p.y + n.y * t }];
    // The label just past the lower end, clear of the discs.
    const labelAt = { x: p.x + n.x * t - u.x * R * 0.3, y: p.y + n.y * t - u.y * R * 0.3 };
    return { kind: 'polygon', style: 'block', points: [p, q, ...outer], ...(label ? { label, labelAt } : {}) };
  };
  const shapes: SketchShape[] = [];
  let large: Pt;
  let small: Pt;
  // The slanted straightedge on the right: its unit normal, pointing away from the discs.
  let n: Pt;
  if (reference === 'axis') {
    large = { x: 0, y: 0 };
    small = { x: 0, y: C };
    n = { x: Math.cos(phi), y: Math.sin(phi) };
    const m = { x: -n.x, y: n.y };
    shapes.push(edge({ x: m.x * R, y: m.y * R }, { x: m.x * r, y: C + m.y * r }, m));
    shapes.push({ kind: 'line', style: 'mark', points: [{ x: 0, y: -R * 1.5 }, { x: 0, y: C + r + ext }] });
  } else {
    large = { x: R, y: 0 };
    small = { x: r, y: C * Math.cos(phi) };
    n = { x: Math.cos(2 * phi), y: Math.sin(2 * phi) };
    shapes.push(edge({ x: 0, y: 0 }, { x: 0, y: small.y }, { x: -1, y: 0 }, 'square side'));
  }
  const a = { x: large.x + n.x * R, y: large.y + n.y * R };
  const b = { x: small.x + n.x * r, y: small.y + n.y * r };
  shapes.push(edge(a, b, n, 'straightedge'));
  const len = Math.hypot(b.x - a.x, b.y - a.y);
  const along = len > 0 ? { x: (b.x - a.x) / len, y: (b.y - a.y) / len } : { x: -n.y, y: n.x };
  const far = { x: b.x + along.x * (ext + R * 0.4), y: b.y + along.y * (ext + R * 0.4) };
  shapes.push(
    { kind: 'circle', style: 'tool', points: [large], r: R, label: labels.large, labelAt: { x: a.x + n.x * t * 1.5, y: a.y + n.y * t * 1.5 } },
    { kind: 'circle', style: 'tool', points: [small], r, label: labels.small, labelAt: { x: b.x + n.x * t * 1.5, y: b.y + n.y * t * 1.5 } },
    { kind: 'dimension', style: 'mark', points: [large, small], label: labels.centres },
    { kind: 'line', style: 'mark', points: [a, far], label: labels.angle, labelAt: far },
  );
  const title = reference === 'axis' ? 'Two discs between straightedges set about the axis of the taper' : 'Two discs between straightedges, one side square';
  return { title, shapes, box: boundsWithLabels(shapes) };
}

/** Labels of {@link taperBallsSketch}: the depths as set up, the engine's centre distance and angles. */
export interface BallsLabels {
  large: string;
  small: string;
  largeDepth: string;
  smallDepth: string;
  centres: string;
  halfAngle: string;
  included: string;
}

/**
 * An internal taper opening at the face (y = 0) with a large ball (radius R) and a small one (r)
 * resting in it, their tops h₁ and h₂ below the face (negative: standing proud). The centres are
 * s = (h₂ + r) − (h₁ + R) apart and sin(α/2) = (R − r)/s (REFERENCE.md §5.2); each ball touches the
 * bore, its centre R/cos(α/2) from the wall measured across (derived). Null when the balls do not
 * fit a taper (s ≤ R − r) or the large ball would touch the bore above the face.
 */
export function taperBallsSketch(largeBall: number, smallBall: number, largeBallDepth: number, smallBallDepth: number, labels: BallsLabels): Sketch | null {
  const R = largeBall / 2;
  const r = smallBall / 2;
  if (![R, r].every((n) => Number.isFinite(n) && n > 0) || !Number.isFinite(largeBallDepth) || !Number.isFinite(smallBallDepth) || !(R > r)) return null;
  const yL = -(largeBallDepth + R);
  const yS = -(smallBallDepth + r);
  const s = yL - yS;
  if (!(s > R - r)) return null;
  const theta = Math.asin((R - r) / s);
  const t = Math.tan(theta);
  if (yL - R * Math.sin(theta) > 0) return null;
  // Right-hand wall of the bore: x at height y.
  const wall = (y: number) => R / Math.cos(theta) + (y - yL) * t;
  const w0 = wall(0);
  const floor = Math.max(yS - r * 1.5, yS - r / Math.sin(theta));
  const wf = Math.max(wall(floor), 0);
  const outer = w0 + Math.max(R, w0 * 0.6);
  const bottom = floor - Math.max(Math.abs(floor) * 0.25, r);
  const shapes: SketchShape[] = [
    { kind: 'polygon', style: 'part', points: [{ x: -outer, y: 0 }, { x: -w0, y: 0 }, { x: -wf, y: floor }, { x: wf, y: floor }, { x: w0, y: 0 }, { x: outer, y: 0 }, { x: outer, y: bottom }, { x: -outer, y: bottom }] },
    { kind: 'line', style: 'mark', points: [{ x: 0, y: bottom - r }, { x: 0, y: Math.max(0, yL + R) + R * 0.8 }], label: labels.included, labelAt: { x: 0, y: bottom - r } },
    { kind: 'circle', style: 'tool', points: [{ x: 0, y: yL }], r: R, label: labels.large, labelAt: { x: -R * 0.6, y: yL + R * 0.4 } },
    { kind: 'circle', style: 'tool', points: [{ x: 0, y: yS }], r, label: labels.small, labelAt: { x: -r * 0.6, y: yS + r * 0.4 } },
  ];
  const gap = Math.max(R * 0.8, outer * 0.2);
  const depths = [
    { h: largeBallDepth, label: labels.largeDepth },
    { h: smallBallDepth, label: labels.smallDepth },
  ];
  depths.forEach(({ h, label }, i) => {
    const x = outer + gap * (i + 1);
    shapes.push(
      { kind: 'dimension', style: 'mark', points: [{ x, y: 0 }, { x, y: -h }], label },
      { kind: 'line', style: 'mark', points: [{ x: 0, y: -h }, { x, y: -h }] },
    );
  });
  shapes.push({ kind: 'line', style: 'mark', points: [{ x: outer, y: 0 }, { x: outer + gap * 2, y: 0 }] });
  const xs = -outer - gap;
  shapes.push(
    { kind: 'dimension', style: 'mark', points: [{ x: xs, y: yS }, { x: xs, y: yL }], label: labels.centres, labelAt: { x: xs - gap * 3, y: (yL + yS) / 2 } },
    { kind: 'line', style: 'mark', points: [{ x: 0, y: yL }, { x: xs, y: yL }] },
    { kind: 'line', style: 'mark', points: [{ x: 0, y: yS }, { x: xs, y: yS }] },
    { kind: 'line', style: 'mark', points: [{ x: wf, y: floor }, { x: w0 + R * 0.6 * t, y: R * 0.6 }], label: labels.halfAngle, labelAt: { x: wall((yL + yS) / 2), y: (yL + yS) / 2 } },
  );
  return { title: 'Internal taper with a large and a small ball: depth of each top below the face', shapes, box: boundsWithLabels(shapes) };
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
