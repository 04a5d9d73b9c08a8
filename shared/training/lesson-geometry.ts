/**
 * Geometry of the lesson drawings: pure functions from the lesson's slider value to SVG
 * coordinates in a fixed 480 × 300 view box (y grows downward). Drawing only — every number a
 * lesson prints comes from the calculation engine, not from here. Scenes with an angle also say
 * where that angle can be dragged (`grip`), and `angleFromPointer` turns a pointer into the value.
 */

import { Dec } from '../calc/decimal-math';

/** A point in view-box units. */
export interface Pt {
  x: number;
  y: number;
}

/** Width and height of every lesson drawing's view box. */
export const LESSON_VIEW = { width: 480, height: 300 } as const;

const rad = (deg: number) => (deg * Math.PI) / 180;
const r2 = (v: number) => Math.round(v * 100) / 100;
const pt = (x: number, y: number): Pt => ({ x: r2(x), y: r2(y) });
/** Direction of `to` seen from `from`, degrees counter-clockwise on screen from +x (y grows downward). */
const screenDeg = (from: Pt, to: Pt) => (Math.atan2(from.y - to.y, to.x - from.x) * 180) / Math.PI;

/**
 * Where a drawing's angle can be grabbed: the arm carrying `handle` turns about `vertex`, a point
 * that stays put while the angle changes.
 */
export interface AngleGrip {
  /** The fixed point the arm turns about. */
  vertex: Pt;
  /** Centre of the drag handle on the moving arm. */
  handle: Pt;
  /**
   * Direction of the handle about the vertex minus the drawn angle, degrees (0 when the handle
   * lies on the arm that makes the angle, as on the sine bar and the dovetail flank).
   */
  offsetDeg: number;
}

/** The range of an angle slider, degrees. */
export interface AngleRange {
  min: number;
  max: number;
  step: number;
}

/** An SVG arc path for an angle mark from `fromDeg` to `toDeg` (counter-clockwise on screen, 0° = +x). */
export function arcPath(center: Pt, radius: number, fromDeg: number, toDeg: number): string {
  const a = pt(center.x + radius * Math.cos(rad(fromDeg)), center.y - radius * Math.sin(rad(fromDeg)));
  const b = pt(center.x + radius * Math.cos(rad(toDeg)), center.y - radius * Math.sin(rad(toDeg)));
  const large = Math.abs(toDeg - fromDeg) > 180 ? 1 : 0;
  const sweep = toDeg > fromDeg ? 0 : 1;
  return `M${a.x},${a.y} A${radius},${radius} 0 ${large} ${sweep} ${b.x},${b.y}`;
}

/** The taper lesson: a part on an angle block, tilted by `angleDeg`, and its right triangle. */
export interface TaperTriangle {
  /** The block under the part (a wedge of the set angle). */
  block: Pt[];
  /** The part outline after the cut (a pentagon), tilted with the block. */
  part: Pt[];
  /** The stock the cut removes (triangle: adjacent = taper length, opposite = stock removed). */
  removed: Pt[];
  /** Corners of the right triangle: where the taper starts (the angle), the right angle, the end corner. */
  corner: { angle: Pt; right: Pt; far: Pt };
  /** The level cutting line (the face once cut). */
  cutY: number;
  /** The angle mark at the taper start. */
  arc: string;
  /**
   * Drag handle at the end of the top face; the whole part tilts about the low corner of the
   * block, whose wedge angle is α too, so that corner stays put while the angle changes.
   */
  grip: AngleGrip;
}

/**
 * Part of length `length` and thickness `thickness` (drawing units) on a wedge of `angleDeg`
 * (0–40°); the taper starts `taperLength` from the raised end, so the cut is level.
 */
export function taperTriangle(angleDeg: number, length = 300, thickness = 70, taperLength = 150): TaperTriangle {
  const a = Math.min(Math.max(angleDeg, 0.5), 40);
  const base = pt(90, 250);
  const c = Math.cos(rad(a));
  const s = Math.sin(rad(a));
  // Part frame: u along the part's base (toward the raised end), v across it (up, square to the base).
  const at = (u: number, v: number) => pt(base.x + u * c - v * s, base.y - u * s - v * c);
  const d = taperLength * Math.tan(rad(a));
  const start = at(length - taperLength, thickness);
  const endTop = at(length, thickness);
  const endCut = at(length, thickness - d);
  return {
    block: [base, pt(base.x + length * c, base.y), at(length, 0)],
    part: [at(0, 0), at(length, 0), endCut, start, at(0, thickness)],
    removed: [start, endTop, endCut],
    corner: { angle: start, right: endTop, far: endCut },
    cutY: start.y,
    arc: arcPath(start, 40, 0, a),
    grip: { vertex: base, handle: endTop, offsetDeg: (Math.atan2(thickness, length) * 180) / Math.PI },
  };
}

/** The sine-bar lesson: a bar of roll centres `barLength` on a stack under one roll. */
export interface SineBarScene {
  /** Roll centres (left on the plate, right on the stack). */
  rolls: [Pt, Pt];
  rollRadius: number;
  /** The bar's top edge, between the roll centres lifted by the roll radius. */
  bar: Pt[];
  /** The gauge stack under the raised roll. */
  stack: Pt[];
  /** Stack height in view units (H = L · sin θ). */
  stackHeight: number;
  /** The right triangle: roll centre, point under the raised roll, raised roll centre. */
  triangle: Pt[];
  arc: string;
  /** Drag handle on the raised roll; the bar turns about the roll on the plate. */
  grip: AngleGrip;
}

/**
 * Sine bar set to `angleDeg` (0–60°), drawn with a 240-unit roll centre distance: short enough
 * that the raised roll and its drag handle stay in the view box at 60°.
 */
export function sineBarScene(angleDeg: number, barLength = 240): SineBarScene {
  const a = Math.min(Math.max(angleDeg, 0), 60);
  const radius = 14;
  const plate = 270;
  const left = pt(70, plate - radius);
  const H = barLength * Math.sin(rad(a));
  const right = pt(left.x + barLength * Math.cos(rad(a)), left.y - H);
  const ux = Math.cos(rad(a));
  const uy = -Math.sin(rad(a));
  // The bar sits on the rolls: its underside is tangent to both, offset by the radius.
  const nx = uy;
  const ny = -ux;
  const bar = [
    pt(left.x - 20 * ux + radius * nx, left.y - 20 * uy + radius * ny),
    pt(right.x + 20 * ux + radius * nx, right.y + 20 * uy + radius * ny),
    pt(right.x + 20 * ux + (radius + 22) * nx, right.y + 20 * uy + (radius + 22) * ny),
    pt(left.x - 20 * ux + (radius + 22) * nx, left.y - 20 * uy + (radius + 22) * ny),
  ];
  const stack = [pt(right.x - 24, plate), pt(right.x + 24, plate), pt(right.x + 24, plate - H), pt(right.x - 24, plate - H)];
  return { rolls: [left, right], rollRadius: radius, bar, stack, stackHeight: r2(H), triangle: [left, pt(right.x, left.y), right], arc: arcPath(left, 50, 0, a), grip: { vertex: left, handle: right, offsetDeg: 0 } };
}

/** One block of a drawn stack: its rectangle and label. */
export interface StackBlock {
  x: number;
  y: number;
  width: number;
  height: number;
  label: string;
}

/**
 * Gauge blocks stacked from the plate at y = 280 up, the whole stack drawn `scale` view units per
 * unit of length — so two stacks of one length stand equally high. A block thinner than
 * `minHeight` is drawn that thick to stay readable, the height it gains taken from the thicker
 * blocks in proportion (or, when they cannot spare it, every block drawn alike).
 */
export function stackBlocks(sizes: readonly string[], scale: number, x = 0, width = 120, minHeight = 18): StackBlock[] {
  const true_ = sizes.map((label) => Number(label) * scale);
  const total = true_.reduce((a, b) => a + b, 0);
  const gain = true_.reduce((a, h) => a + Math.max(0, minHeight - h), 0);
  const thick = true_.filter((h) => h >= minHeight);
  const thickTotal = thick.reduce((a, b) => a + b, 0);
  const canSpare = thickTotal - gain >= minHeight * thick.length;
  const heights = true_.map((h) => (!canSpare ? total / sizes.length : h < minHeight ? minHeight : h - (gain * h) / thickTotal));
  let y = 280;
  return sizes.map((label, i) => {
    // Rounded once, so each block sits exactly on the one below.
    const height = r2(heights[i]!);
    y = r2(y - height);
    return { x, y, width, height, label };
  });
}

/** The lathe-taper lesson: a tapered shaft seen from above, with the compound's half angle. */
export interface LatheTaperScene {
  /** Outline of the taper (large end left). */
  outline: Pt[];
  /** The axis line. */
  axis: [Pt, Pt];
  /** The line of the compound's travel along the top flank. */
  flank: [Pt, Pt];
  /** The half angle, degrees, as drawn (`exaggeration` times the true one). */
  drawnHalfAngle: number;
  /** How many times steeper than true the angle is drawn (1: to scale). */
  exaggeration: number;
  /** The α/2 arc at the large end, between the line parallel to the axis and the flank. */
  arc: string;
  /** Where the α/2 label goes, beside the arc. */
  label: Pt;
}

/** The steepest half angle the drawing holds: the flank meets the axis side 8 units short of the centre. */
const LATHE_LENGTH = 360;
const LATHE_D = 140;
const MAX_DRAWN_HALF = Math.atan((LATHE_D / 2 - 8) / LATHE_LENGTH);

/**
 * A taper of `taperPerFoot` (in/ft on the diameter) over one foot, drawn 360 units long with a
 * 140-unit large diameter. Small tapers are drawn steeper so they show — about `exaggerate` times,
 * less as the taper grows; the factor (to a tenth) is returned for the drawing to say.
 */
export function latheTaperScene(taperPerFoot: number, exaggerate = 4): LatheTaperScene {
  const length = LATHE_LENGTH;
  const D = LATHE_D;
  const trueHalf = Math.atan(Math.max(taperPerFoot, 0) / 24);
  // `exaggerate` times steeper for small tapers, easing off smoothly toward the steepest angle the
  // part holds: a steeper taper is always drawn steeper, never flattened at a limit.
  const half = MAX_DRAWN_HALF * Math.tanh((exaggerate * trueHalf) / MAX_DRAWN_HALF);
  const factor = trueHalf > 0 ? Math.round((half / trueHalf) * 10) / 10 : exaggerate;
  const drop = length * Math.tan(half);
  const cy = 150;
  const x0 = 60;
  const outline = [pt(x0, cy - D / 2), pt(x0 + length, cy - D / 2 + drop), pt(x0 + length, cy + D / 2 - drop), pt(x0, cy + D / 2)];
  const drawn = (Math.atan(drop / length) * 180) / Math.PI;
  return {
    outline,
    axis: [pt(x0 - 30, cy), pt(x0 + length + 30, cy)],
    flank: [outline[0]!, outline[1]!],
    drawnHalfAngle: r2(drawn),
    exaggeration: factor,
    // At the large end the flank leaves the line parallel to the axis (drawn along the top) downwards.
    arc: arcPath(outline[0]!, 90, 0, -drawn),
    label: pt(x0 + 100, cy - D / 2 - 8),
  };
}

/** The over-pins lesson: a male dovetail with a pin in each corner and the reading over them. */
export interface DovetailScene {
  /** Dovetail outline (base on the bottom, flanks leaning in). */
  outline: Pt[];
  pins: [Pt, Pt];
  pinRadius: number;
  /** The measurement line over the pins (outer tangents). */
  measure: [Pt, Pt];
  /** The sharp-corner width line at the base. */
  width: [Pt, Pt];
  arc: string;
  /** Drag handle part-way up the right flank, which turns about its corner at the base. */
  grip: AngleGrip;
}

/** How far up the dovetail flank its drag handle sits, view units. */
const GRIP_ON_FLANK = 100;

/**
 * Male dovetail of flank angle `angleDeg` (to the base, 30–80°), sharp-corner width 260 and
 * height 110 (lower at shallow angles, so the overhang stays inside the view), with pins of
 * diameter `pinDiameter` sitting in the corners at the base. The α arc sits in the right-hand
 * corner between the base line and the flank, inside the pin.
 */
export function dovetailScene(angleDeg: number, pinDiameter = 44): DovetailScene {
  const a = Math.min(Math.max(angleDeg, 30), 80);
  const width = 260;
  const baseY = 230;
  const x0 = 110;
  // The overhang of each flank is at most 95, so the top corners stay 15 inside the 480-wide view.
  const height = Math.min(110, 95 * Math.tan(rad(a)));
  const run = height / Math.tan(rad(a));
  // The dovetail overhangs: it is narrow at the base and wide at the top, so pins lie in the acute corners.
  const outline = [pt(x0, baseY), pt(x0 + width, baseY), pt(x0 + width + run, baseY - height), pt(x0 - run, baseY - height)];
  const r = pinDiameter / 2;
  // A pin touching the base and the flank: its centre is r/tan(α/2) from the corner along the base.
  const offset = r / Math.tan(rad(a / 2));
  const left = pt(x0 - offset, baseY - r);
  const right = pt(x0 + width + offset, baseY - r);
  return {
    outline,
    pins: [left, right],
    pinRadius: r,
    measure: [pt(left.x - r, baseY + 34), pt(right.x + r, baseY + 34)],
    width: [pt(x0, baseY + 14), pt(x0 + width, baseY + 14)],
    // Between the base line (0°) and the flank (α), small enough to stay clear of the pin.
    arc: arcPath(outline[1]!, Math.max(8, Math.min(36, r / Math.sin(rad(a / 2)) - r - 4)), 0, a),
    // A fixed distance along the flank keeps the handle inside the view box at the shallowest angles.
    grip: { vertex: outline[1]!, handle: pt(x0 + width + GRIP_ON_FLANK * Math.cos(rad(a)), baseY - GRIP_ON_FLANK * Math.sin(rad(a))), offsetDeg: 0 },
  };
}

/**
 * `value` rounded to the nearest step counted from `range.min`, then kept within the range.
 * Rounded in decimal so a step of 0.5 gives 7.5, never 7.499999….
 */
export function snapAngle(value: number, range: AngleRange): number {
  const { min, max, step } = range;
  if (!Number.isFinite(value)) return min;
  const steps = new Dec(value).minus(min).div(step).round();
  const snapped = steps.times(step).plus(min).toNumber();
  return Math.min(Math.max(snapped, min), max);
}

/**
 * The angle a pointer at `pointer` (view units) sets when it drags `grip`'s handle: its direction
 * about the vertex less the handle's offset, clamped to the range and snapped to its step. Past
 * either end the nearer end wins (going round the circle); a pointer on the vertex has no
 * direction, so `current` is kept.
 */
export function angleFromPointer(pointer: Pt, grip: AngleGrip, current: number, range: AngleRange): number {
  if (!Number.isFinite(pointer.x) || !Number.isFinite(pointer.y) || Math.hypot(pointer.x - grip.vertex.x, pointer.y - grip.vertex.y) < 1e-6) {
    return current;
  }
  const mid = (range.min + range.max) / 2;
  let deg = screenDeg(grip.vertex, pointer) - grip.offsetDeg;
  // Bring the direction into the turn centred on the range, so "past the end" means the nearer end.
  deg = ((((deg - mid + 180) % 360) + 360) % 360) - 180 + mid;
  return snapAngle(deg, range);
}

/** The inverse of an SVG element's screen matrix (the six numbers of `getScreenCTM().inverse()`). */
export interface ScreenToView {
  a: number;
  b: number;
  c: number;
  d: number;
  e: number;
  f: number;
}

/** A pointer's client (screen) position in the drawing's view-box units. */
export function toViewPoint(m: ScreenToView, clientX: number, clientY: number): Pt {
  return { x: m.a * clientX + m.c * clientY + m.e, y: m.b * clientX + m.d * clientY + m.f };
}

/** Points as an SVG polygon `points` attribute. */
export function pointsAttr(points: readonly Pt[]): string {
  return points.map((p) => `${p.x},${p.y}`).join(' ');
}
