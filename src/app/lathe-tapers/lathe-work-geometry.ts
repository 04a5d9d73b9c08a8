/**
 * Pure geometry of a taper turned between centres, seen from above (plan view), in SVG drawing
 * coordinates: x along the lathe axis from the headstock centre's point, y down the page toward
 * the operator, lengths in the page's unit (drawn to scale). No DOM, no Angular.
 *
 * The work is a bar of the large diameter D between the centres, L long, with the taper (length l,
 * small diameter d) at the tail-stock end. Two ways to turn it (REFERENCE.md §4.1):
 * - compound: the compound rest is set to the half angle α/2 from the lathe axis and the tool is
 *   fed along it, on the operator's side of the work;
 * - offset: the tail stock is moved toward the operator by e, so the work's axis turns by
 *   asin(e / L) about the headstock centre and the carriage feeds parallel to the lathe axis.
 */

/** A point in drawing coordinates. */
export interface LathePoint {
  /** Along the lathe axis, from the headstock centre's point. */
  readonly x: number;
  /** Across, positive toward the operator (down the page). */
  readonly y: number;
}

/** Which dimension a line is. */
export type LatheDimensionKey = 'large' | 'small' | 'taper' | 'work' | 'offset';

/** A linear dimension between two points of the drawing. */
export interface LatheDimension {
  /** Which dimension this is, so the page can write its value. */
  readonly key: LatheDimensionKey;
  /** First measured point. */
  readonly from: LathePoint;
  /** Second measured point. */
  readonly to: LathePoint;
  /**
   * Distance from the measured points to the dimension line, perpendicular to from→to, positive
   * to the left of that direction on the paper (0: the dimension line runs through the points).
   */
  readonly offset: number;
}

/** What the drawing needs to know of the taper. */
export interface LatheWorkInput {
  /** Large diameter D (> 0). */
  readonly largeDiameter: number;
  /** Small diameter d (0 < d ≤ D). */
  readonly smallDiameter: number;
  /** Taper length l (> 0). */
  readonly taperLength: number;
  /** Length of the work between the centres' points, L (defaults to 1.5·l; never less than l). */
  readonly workLength?: number;
  /** 'compound' (compound rest at the half angle) or 'offset' (tail stock set over). */
  readonly method: 'compound' | 'offset';
  /** Tail-stock offset e for the 'offset' method (defaults to L·(D − d)/(2·l)). */
  readonly offset?: number;
}

/** An angle to mark with an arc: about `vertex`, from direction `fromDeg` to `toDeg` (counter-clockwise on the paper). */
export interface LatheAngle {
  /** Where the two lines meet. */
  readonly vertex: LathePoint;
  /** Arc radius, drawing units. */
  readonly radius: number;
  /** Start direction, degrees counter-clockwise on the paper (0 = along +x). */
  readonly fromDeg: number;
  /** End direction, degrees counter-clockwise on the paper. */
  readonly toDeg: number;
}

/** The drawing's shapes; every polygon is a list of corners. */
export interface LatheWorkShape {
  /** The work's outline (turned about the headstock centre for the offset method). */
  readonly work: readonly LathePoint[];
  /** The stock the taper takes off, on both sides (two triangles); empty for a cylinder. */
  readonly removed: readonly (readonly LathePoint[])[];
  /** The tapered face on the operator's side, the one the tool cuts: from the large end to the small end. */
  readonly cutEdge: readonly [LathePoint, LathePoint];
  /** The lathe axis (centre line of the spindle and ways), both ends. */
  readonly latheAxis: readonly [LathePoint, LathePoint];
  /** The work's own axis, both ends (equals the lathe axis for the compound method). */
  readonly workAxis: readonly [LathePoint, LathePoint];
  /** Headstock centre: a 60° point at the origin and its shank. */
  readonly headCentre: readonly LathePoint[];
  /** Tail-stock centre: a 60° point at the work's tail end and its shank, set over by the offset. */
  readonly tailCentre: readonly LathePoint[];
  /** The tool: a small wedge touching the cut edge at its middle, from the operator's side. */
  readonly tool: readonly LathePoint[];
  /** The compound rest's slide, turned to the half angle (empty for the offset method). */
  readonly compound: readonly LathePoint[];
  /** Feed direction of the tool: start and end of the arrow's shaft. */
  readonly feed: readonly [LathePoint, LathePoint];
  /** Arrowhead of the feed arrow. */
  readonly feedHead: readonly LathePoint[];
  /** The angle to mark: the half angle between the axis and the cut edge, or the work's tilt for the offset method. */
  readonly angle: LatheAngle;
  /** Angle the arc spans, degrees (positive). */
  readonly arcDeg: number;
  /** Dimensions: large and small diameter, taper length, work length, and the offset when set over. */
  readonly dimensions: readonly LatheDimension[];
  /** Smallest box holding every shape and dimension line: [minX, minY, width, height]. */
  readonly bounds: readonly [number, number, number, number];
}

const DEG = Math.PI / 180;
const TAN_30 = Math.tan(30 * DEG);

/** Rounds to 1e-6 so coordinates carry no float noise. */
function r6(value: number): number {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Object.is(rounded, -0) ? 0 : rounded;
}

function pt(x: number, y: number): LathePoint {
  return { x: r6(x), y: r6(y) };
}

/** Turns a point about the origin by `rad` clockwise on the paper (toward +y). */
function turn(p: LathePoint, rad: number): LathePoint {
  return pt(p.x * Math.cos(rad) - p.y * Math.sin(rad), p.x * Math.sin(rad) + p.y * Math.cos(rad));
}

/** A 60° centre with its point at `tip`, pointing in `dir` (+1 right, −1 left), cone length `k`. */
function centreOutline(tip: LathePoint, dir: 1 | -1, k: number): LathePoint[] {
  const h = k * TAN_30;
  const back = tip.x - dir * k;
  const end = tip.x - dir * k * 2.6;
  return [
    pt(tip.x, tip.y),
    pt(back, tip.y - h),
    pt(end, tip.y - h),
    pt(end, tip.y + h),
    pt(back, tip.y + h),
  ];
}

/**
 * Lays out the work between centres. Diameters and lengths are clamped into a drawable shape
 * (d ≤ D, L ≥ l) so that a half-typed form still draws something sensible.
 */
export function latheWorkGeometry(input: LatheWorkInput): LatheWorkShape {
  const D = Math.max(input.largeDiameter, 1e-9);
  const d = Math.min(Math.max(input.smallDiameter, 0), D);
  const l = Math.max(input.taperLength, 1e-9);
  const L = Math.max(Number.isFinite(input.workLength) ? (input.workLength as number) : l * 1.5, l);
  const halfRad = Math.atan((D - d) / (2 * l));
  const e = input.method === 'offset' ? Math.min(input.offset ?? (L * (D - d)) / (2 * l), L * 0.5) : 0;
  const tilt = input.method === 'offset' ? Math.asin(e / L) : 0;
  const k = Math.min(D * 0.45, L * 0.1);
  const start = L - l;

  // The work in its own frame, then turned about the headstock centre (a no-op for the compound method).
  const own = [pt(0, -D / 2), pt(start, -D / 2), pt(L, -d / 2), pt(L, d / 2), pt(start, D / 2), pt(0, D / 2)];
  const outline = own.map((p) => turn(p, tilt));
  const cutEdge: [LathePoint, LathePoint] = [outline[4], outline[3]];
  const tailTip = turn(pt(L, 0), tilt);

  // The tool touches the middle of the cut edge from the operator's side.
  const mid = pt((cutEdge[0].x + cutEdge[1].x) / 2, (cutEdge[0].y + cutEdge[1].y) / 2);
  const edgeDir = { x: cutEdge[1].x - cutEdge[0].x, y: cutEdge[1].y - cutEdge[0].y };
  const edgeLen = Math.hypot(edgeDir.x, edgeDir.y);
  const u = { x: edgeDir.x / edgeLen, y: edgeDir.y / edgeLen };
  // Away from the work, toward the operator: u turned a quarter clockwise on the paper.
  const away = { x: -u.y, y: u.x };
  const toolSize = Math.min(D * 0.5, l * 0.35);
  const tool = [
    mid,
    pt(mid.x - u.x * toolSize * 0.35 + away.x * toolSize, mid.y - u.y * toolSize * 0.35 + away.y * toolSize),
    pt(mid.x + u.x * toolSize * 0.35 + away.x * toolSize, mid.y + u.y * toolSize * 0.35 + away.y * toolSize),
  ];

  let compound: LathePoint[] = [];
  let feedDir = { x: 1, y: 0 };
  if (input.method === 'compound') {
    // The slide lies along the cut edge, behind the tool.
    const from = toolSize * 1.1;
    const to = toolSize * 1.1 + D * 0.35;
    const half = l * 0.45;
    compound = [
      pt(mid.x - u.x * half + away.x * from, mid.y - u.y * half + away.y * from),
      pt(mid.x + u.x * half + away.x * from, mid.y + u.y * half + away.y * from),
      pt(mid.x + u.x * half + away.x * to, mid.y + u.y * half + away.y * to),
      pt(mid.x - u.x * half + away.x * to, mid.y - u.y * half + away.y * to),
    ];
    feedDir = u;
  }
  // The feed arrow runs beside the tool, on the operator's side, pointing toward the tail stock.
  const feedAt = toolSize * (input.method === 'compound' ? 0.55 : 1.3) + (input.method === 'compound' ? D * 0.35 + toolSize * 0.75 : 0);
  const feedHalf = l * 0.3;
  const feed: [LathePoint, LathePoint] = [
    pt(mid.x - feedDir.x * feedHalf + away.x * feedAt, mid.y - feedDir.y * feedHalf + away.y * feedAt),
    pt(mid.x + feedDir.x * feedHalf + away.x * feedAt, mid.y + feedDir.y * feedHalf + away.y * feedAt),
  ];
  const head = Math.min(l * 0.08, D * 0.25);
  const feedHead = [
    feed[1],
    pt(feed[1].x - feedDir.x * head - feedDir.y * head * 0.45, feed[1].y - feedDir.y * head + feedDir.x * head * 0.45),
    pt(feed[1].x - feedDir.x * head + feedDir.y * head * 0.45, feed[1].y - feedDir.y * head - feedDir.x * head * 0.45),
  ];

  // The angle: half angle at the large end of the cut edge (compound), or the tilt at the headstock centre (offset).
  // The cut edge climbs toward the small end (counter-clockwise on the paper); the offset work tilts clockwise.
  const angle: LatheAngle =
    input.method === 'compound'
      ? // Three quarters of the taper: the arc's end stays clear of the small diameter's arrows.
        { vertex: cutEdge[0], radius: r6(l * 0.75), fromDeg: 0, toDeg: r6(halfRad / DEG) }
      : { vertex: pt(0, 0), radius: r6(L * 0.55), fromDeg: r6(-tilt / DEG), toDeg: 0 };
  const arcDeg = input.method === 'compound' ? halfRad / DEG : tilt / DEG;

  const gap = Math.max(D * 0.35, L * 0.05);
  // How far the tool, the compound slide and the feed arrow reach below the cut edge.
  const below = input.method === 'compound' ? toolSize * 1.9 + D * 0.7 : toolSize * 1.4;
  const bodyX = start > L * 0.15 ? start / 2 : start;
  const ownDims: LatheDimension[] = [
    { key: 'large', from: pt(bodyX, D / 2), to: pt(bodyX, -D / 2), offset: 0 },
    { key: 'small', from: pt(L - l * 0.04, d / 2), to: pt(L - l * 0.04, -d / 2), offset: 0 },
    // Above the work, away from the tool: projected onto the large diameter's line so it reads level.
    { key: 'taper', from: pt(start, -D / 2), to: pt(L, -D / 2), offset: gap },
    // Below the work, past the tool, slide and feed arrow: the left of a right-to-left line is down the page.
    { key: 'work', from: pt(L, 0), to: pt(0, 0), offset: D / 2 + below + gap },
  ];
  const dimensions: LatheDimension[] = ownDims.map((dim) => ({ ...dim, from: turn(dim.from, tilt), to: turn(dim.to, tilt) }));
  if (input.method === 'offset') {
    const x = tailTip.x + k * 3.4;
    dimensions.push({ key: 'offset', from: pt(x, 0), to: pt(x, tailTip.y), offset: 0 });
  }

  const latheAxis: [LathePoint, LathePoint] = [pt(-k * 3.2, 0), pt(L + k * 3.2, 0)];
  const workAxis: [LathePoint, LathePoint] = [pt(0, 0), tailTip];

  const points: LathePoint[] = [...outline, ...latheAxis, feed[0], feed[1], pt(-k * 2.6, -k * TAN_30), pt(tailTip.x + k * 2.6, tailTip.y + k * TAN_30)];
  for (const dim of dimensions) {
    const dx = dim.to.x - dim.from.x;
    const dy = dim.to.y - dim.from.y;
    const len = Math.hypot(dx, dy) || 1;
    // Left of from→to on the paper (y down) is (dy, −dx)/len.
    const nx = dy / len;
    const ny = -dx / len;
    points.push(pt(dim.from.x + nx * dim.offset, dim.from.y + ny * dim.offset), pt(dim.to.x + nx * dim.offset, dim.to.y + ny * dim.offset));
  }
  if (compound.length) {
    const to = toolSize * 1.1 + D * 0.35;
    points.push(pt(mid.x + away.x * to - u.x * l * 0.45, mid.y + away.y * to - u.y * l * 0.45), pt(mid.x + away.x * to + u.x * l * 0.45, mid.y + away.y * to + u.y * l * 0.45));
  }
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  const minX = Math.min(...xs);
  const minY = Math.min(...ys);

  // The stock the taper takes off: between the large diameter and the taper, both sides.
  const removed = d < D ? [[own[1], pt(L, -D / 2), own[2]], [own[4], pt(L, D / 2), own[3]]].map((tri) => tri.map((p) => turn(p, tilt))) : [];

  return {
    work: outline,
    removed,
    cutEdge,
    latheAxis,
    workAxis,
    headCentre: centreOutline(pt(0, 0), 1, k),
    tailCentre: centreOutline(tailTip, -1, k),
    tool,
    compound,
    feed,
    feedHead,
    angle,
    arcDeg: r6(arcDeg),
    dimensions,
    bounds: [r6(minX), r6(minY), r6(Math.max(...xs) - minX), r6(Math.max(...ys) - minY)],
  };
}
