/**
 * Pure geometry of a combination of angle blocks wrung one on another, in SVG drawing coordinates
 * (x to the right, y down, so "up" on the paper is −y). No DOM, no Angular: tested in jest with
 * exact coordinates. Lengths are drawing units; the angles are drawn true.
 *
 * Each block is a wedge: its bottom face (length `length`) lies on the top face of the block below
 * (the first on the surface plate), its thin end is `thinEnd` high and its top face turns by the
 * block's angle. A block wrung the usual way (its direction mark in line with the others) turns
 * the face up and adds its angle; a reversed block has its thick end at the other end, turns the
 * face down and subtracts (REFERENCE.md §6, lab sheet "To develop the required angle with the help
 * of angle gauge").
 */

/** A point in drawing coordinates. */
export interface StackPoint {
  /** To the right. */
  readonly x: number;
  /** Down. */
  readonly y: number;
}

/** One block of a combination as the drawing needs it. */
export interface StackBlockInput {
  /** The block's angle in decimal degrees (0 < angle ≤ 90 draws; larger angles are clamped to 90). */
  readonly angleDeg: number;
  /** True when the block is turned end for end, so that it subtracts. */
  readonly reversed: boolean;
  /** Text written on the block (e.g. "27°" or "9′"). */
  readonly label: string;
}

/** One block laid out on the drawing. */
export interface StackBlockShape {
  /** Outline: bottom-left, bottom-right, top-right, top-left (corners of the wedge). */
  readonly outline: readonly [StackPoint, StackPoint, StackPoint, StackPoint];
  /** Where the block's label is centred. */
  readonly labelAt: StackPoint;
  /** The direction mark: three points of a chevron pointing from the thin end to the thick end. */
  readonly mark: readonly [StackPoint, StackPoint, StackPoint];
  /** True when the block subtracts. */
  readonly reversed: boolean;
  /** Text written on the block. */
  readonly label: string;
  /** Direction of this block's top face after it is placed, degrees counter-clockwise from the plate. */
  readonly topDeg: number;
}

/** The whole combination laid out on the surface plate. */
export interface AngleStackShape {
  /** The blocks from the plate upward. */
  readonly blocks: readonly StackBlockShape[];
  /** The surface plate's top line, from left to right. */
  readonly plate: readonly [StackPoint, StackPoint];
  /** Angle of the top face of the combination, degrees counter-clockwise from the plate. */
  readonly totalDeg: number;
  /**
   * The top face's higher end: the vertex of the angle arc. The level line runs from it over the
   * top face (to the left when the face rises to the right), so it never crosses the blocks.
   */
  readonly vertex: StackPoint;
  /** The far end of the level reference line through the vertex, `arcRadius` · 1.35 long. */
  readonly levelEnd: StackPoint;
  /** Radius of the angle arc at the vertex, between the level line and the top face. */
  readonly arcRadius: number;
  /** Direction of the level line from the vertex, degrees on the paper (180 or 0). */
  readonly arcFromDeg: number;
  /** Direction of the top face from the vertex, degrees on the paper. */
  readonly arcToDeg: number;
  /** Smallest box holding every shape: [minX, minY, width, height]. */
  readonly bounds: readonly [number, number, number, number];
}

/** Drawing proportions of a block. */
export interface StackOptions {
  /** Length of each block's bottom face (default 100). */
  readonly length?: number;
  /** Height of each block's thin end (default 9). */
  readonly thinEnd?: number;
}

const DEG = Math.PI / 180;

/** Rounds to 1e-6 so the drawing's numbers (and the specs') carry no float noise. */
function r6(value: number): number {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Object.is(rounded, -0) ? 0 : rounded;
}

function pt(x: number, y: number): StackPoint {
  return { x: r6(x), y: r6(y) };
}

/** Unit vector along a direction given in degrees counter-clockwise on the paper. */
function along(deg: number): StackPoint {
  return { x: Math.cos(deg * DEG), y: -Math.sin(deg * DEG) };
}

/** Unit normal pointing "up" off a face whose direction is `deg`. */
function upOff(deg: number): StackPoint {
  return { x: -Math.sin(deg * DEG), y: -Math.cos(deg * DEG) };
}

function plus(p: StackPoint, v: StackPoint, k: number): StackPoint {
  return { x: p.x + v.x * k, y: p.y + v.y * k };
}

/**
 * Lays out a combination of angle blocks on the surface plate, the first block's bottom-left
 * corner at the origin. Returns an empty stack (and a 0° total) for no blocks.
 */
export function angleStackGeometry(blocks: readonly StackBlockInput[], options: StackOptions = {}): AngleStackShape {
  const length = options.length ?? 100;
  const thin = options.thinEnd ?? 9;
  const shapes: StackBlockShape[] = [];
  let start: StackPoint = { x: 0, y: 0 };
  let faceDeg = 0;
  for (const block of blocks) {
    const a = Math.min(Math.max(block.angleDeg, 0), 90);
    const u = along(faceDeg);
    const n = upOff(faceDeg);
    const b0 = start;
    const b1 = plus(b0, u, length);
    let t0: StackPoint;
    let t1: StackPoint;
    let topDeg: number;
    if (block.reversed) {
      // Thick end on the left: the top face runs down to the right, ending thin above b1.
      topDeg = faceDeg - a;
      t1 = plus(b1, n, thin);
      t0 = plus(t1, along(topDeg), -length);
    } else {
      topDeg = faceDeg + a;
      t0 = plus(b0, n, thin);
      t1 = plus(t0, along(topDeg), length);
    }
    // The chevron sits near the thin end, in the middle of the block's height there, pointing to the thick end.
    const towardThick = block.reversed ? -1 : 1;
    const thinMid = block.reversed ? plus(b1, n, thin / 2) : plus(b0, n, thin / 2);
    const tip = plus(thinMid, u, towardThick * length * 0.16);
    const back = plus(thinMid, u, towardThick * length * 0.1);
    const half = thin * 0.28;
    shapes.push({
      outline: [pt(b0.x, b0.y), pt(b1.x, b1.y), pt(t1.x, t1.y), pt(t0.x, t0.y)],
      labelAt: pt((b0.x + b1.x + t1.x + t0.x) / 4, (b0.y + b1.y + t1.y + t0.y) / 4),
      mark: [pt(back.x + n.x * half, back.y + n.y * half), pt(tip.x, tip.y), pt(back.x - n.x * half, back.y - n.y * half)],
      reversed: block.reversed,
      label: block.label,
      topDeg: r6(topDeg),
    });
    start = t0;
    faceDeg = topDeg;
  }
  // The top face runs from `start` (its left end) for `length` along faceDeg.
  const rises = faceDeg >= 0;
  const faceRight = plus(start, along(faceDeg), length);
  const vertex = rises ? pt(faceRight.x, faceRight.y) : pt(start.x, start.y);
  const arcRadius = length * 0.55;
  const reach = arcRadius * 1.35;
  const levelEnd = pt(vertex.x + (rises ? -reach : reach), vertex.y);
  const arcFromDeg = rises ? 180 : 0;
  const arcToDeg = rises ? 180 + faceDeg : faceDeg;

  const plate: [StackPoint, StackPoint] = [pt(-length * 0.15, 0), pt(length * 1.15, 0)];
  const all: StackPoint[] = [...plate, vertex, levelEnd, ...shapes.flatMap((s) => s.outline)];
  const xs = all.map((p) => p.x);
  const ys = all.map((p) => p.y);
  const minX = Math.min(...xs);
  const minY = Math.min(...ys);
  return {
    blocks: shapes,
    plate,
    totalDeg: r6(faceDeg),
    vertex,
    levelEnd,
    arcRadius: r6(arcRadius),
    arcFromDeg,
    arcToDeg: r6(arcToDeg),
    bounds: [r6(minX), r6(minY), r6(Math.max(...xs) - minX), r6(Math.max(...ys) - minY)],
  };
}
