import { pathRound } from 'd3-path';

import { type Point, round2 } from './view-fit';

/** Sizes of dimension marks, in view-box units. */
export interface DimensionStyle {
  /** Length of an arrow head along the line. */
  readonly arrowLength: number;
  /** Width of an arrow head across the line. */
  readonly arrowWidth: number;
  /** Gap between the feature and the start of an extension line. */
  readonly extensionGap: number;
  /** How far an extension line runs past the dimension line. */
  readonly extensionOvershoot: number;
  /** Gap between the dimension line and the label's baseline. */
  readonly labelGap: number;
}

/** Dimension marks sized for text of about 14 view units. */
export const DIMENSION_STYLE: DimensionStyle = { arrowLength: 10, arrowWidth: 6, extensionGap: 3, extensionOvershoot: 5, labelGap: 5 };

/** A label placed in the view: baseline centre, rotation in degrees (clockwise, as SVG), text. */
export interface Label {
  readonly x: number;
  readonly y: number;
  readonly rotate: number;
  readonly text: string;
}

/** Everything a dimension draws: path texts and the label. */
export interface DimensionGeometry {
  /** The two extension lines ("" when the dimension lies on the feature). */
  readonly extensionLines: string;
  /** The dimension line. */
  readonly line: string;
  /** The two arrow heads, closed triangles. */
  readonly arrows: string;
  /** The measurement text. */
  readonly label: Label;
  /** Whether the arrows sit outside the extension lines (a short dimension). */
  readonly arrowsOutside: boolean;
}

/** Height of a 14-unit label's capitals: how far a label below its line is pushed down. */
const LABEL_CAP_HEIGHT = 10;

const add = (p: Point, v: Point, k = 1): Point => ({ x: p.x + v.x * k, y: p.y + v.y * k });

/** A closed arrow head with its tip at `tip`, pointing along unit vector `u`. */
function arrowHead(path: ReturnType<typeof pathRound>, tip: Point, u: Point, style: DimensionStyle): void {
  const n = { x: u.y, y: -u.x };
  const base = add(tip, u, -style.arrowLength);
  const left = add(base, n, style.arrowWidth / 2);
  const right = add(base, n, -style.arrowWidth / 2);
  path.moveTo(tip.x, tip.y);
  path.lineTo(left.x, left.y);
  path.lineTo(right.x, right.y);
  path.closePath();
}

/**
 * Text rotation for a line direction, kept within [-90°, 90°) so labels never read upside down;
 * vertical labels read upwards, as on a drawing read from the right.
 */
export function uprightAngle(u: Point): number {
  let deg = (Math.atan2(u.y, u.x) * 180) / Math.PI;
  if (deg >= 90) deg -= 180;
  else if (deg < -90) deg += 180;
  return round2(deg);
}

/**
 * An aligned dimension between view points `a` and `b` (the measured feature), drawn parallel to
 * a→b at `offset` view units to its left as seen on screen (above a left-to-right line; a negative
 * offset goes to the other side). Extension lines run from the feature to just past the dimension
 * line, arrows point at the extension lines (outside them when the dimension is short), and the
 * label sits upright just off the line's middle. For a horizontal or vertical dimension of a
 * sloped feature, pass `a` and `b` already projected onto that direction.
 */
export function dimensionLine(a: Point, b: Point, offset: number, text: string, style: DimensionStyle = DIMENSION_STYLE): DimensionGeometry {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const length = Math.hypot(dx, dy);
  if (!(length > 0)) throw new Error(`dimensionLine: the two points must differ, got (${a.x}, ${a.y}) twice`);
  const u = { x: dx / length, y: dy / length };
  const n = { x: u.y, y: -u.x };
  const a2 = add(a, n, offset);
  const b2 = add(b, n, offset);

  let extensionLines = '';
  if (Math.abs(offset) > style.extensionGap) {
    const side = Math.sign(offset);
    const ext = pathRound(2);
    for (const [from, to] of [[a, a2], [b, b2]] as const) {
      const start = add(from, n, side * style.extensionGap);
      const end = add(to, n, side * style.extensionOvershoot);
      ext.moveTo(start.x, start.y);
      ext.lineTo(end.x, end.y);
    }
    extensionLines = ext.toString();
  }

  const arrowsOutside = length < 2.5 * style.arrowLength;
  const line = pathRound(2);
  const lineFrom = arrowsOutside ? add(a2, u, -2 * style.arrowLength) : a2;
  const lineTo = arrowsOutside ? add(b2, u, 2 * style.arrowLength) : b2;
  line.moveTo(lineFrom.x, lineFrom.y);
  line.lineTo(lineTo.x, lineTo.y);

  const arrows = pathRound(2);
  const back = { x: -u.x, y: -u.y };
  arrowHead(arrows, a2, arrowsOutside ? u : back, style);
  arrowHead(arrows, b2, arrowsOutside ? back : u, style);

  const rotate = uprightAngle(u);
  const r = (rotate * Math.PI) / 180;
  const up = { x: Math.sin(r), y: -Math.cos(r) };
  const centre = { x: (a2.x + b2.x) / 2, y: (a2.y + b2.y) / 2 };
  // Keep the text on the far side of the dimension line from the feature.
  const towardFeature = (up.x * n.x + up.y * n.y) * Math.sign(offset) < 0;
  const mid = towardFeature ? add(centre, up, -(style.labelGap + LABEL_CAP_HEIGHT)) : add(centre, up, style.labelGap);
  return {
    extensionLines,
    line: line.toString(),
    arrows: arrows.toString(),
    label: { x: round2(mid.x), y: round2(mid.y), rotate, text },
    arrowsOutside,
  };
}

/** An angle arc: the arc, its two arrow heads and the label. */
export interface AngleArcGeometry {
  /** The arc. */
  readonly arc: string;
  /** Arrow heads at both ends, pointing along the arc. */
  readonly arrows: string;
  /** The angle text, horizontal, just outside the arc's middle. */
  readonly label: Label;
}

/** The view point at `radius` from `center` in direction `deg` (counter-clockwise as seen, 0° = right). */
export function polarPoint(center: Point, radius: number, deg: number): Point {
  const r = (deg * Math.PI) / 180;
  return { x: center.x + radius * Math.cos(r), y: center.y - radius * Math.sin(r) };
}

/** Font size of an angle arc's text in view units (as `.arc-text` in dimension-mark.ts). */
const ARC_TEXT_SIZE = 14;

/**
 * An arc marking the angle between the directions `fromDeg` and `toDeg` (degrees, counter-clockwise
 * as seen on screen, 0° pointing right) about `center`, with arrows at both ends and the label on
 * the arc's bisector, moved out until its text (estimated, as label-room.ts does, 0.62 of the size
 * a character, centred on its point) stays `labelGap` clear of the arc: a small angle's text no
 * longer lies across its own arc and arrows.
 */
export function angleArc(center: Point, radius: number, fromDeg: number, toDeg: number, text: string, style: DimensionStyle = DIMENSION_STYLE): AngleArcGeometry {
  if (!(radius > 0)) throw new Error(`angleArc: radius must be > 0, got ${radius}`);
  const lo = Math.min(fromDeg, toDeg);
  const hi = Math.max(fromDeg, toDeg);
  const arc = pathRound(2);
  const start = polarPoint(center, radius, lo);
  arc.moveTo(start.x, start.y);
  // SVG angles run clockwise on screen, so the screen's counter-clockwise sweep is negative.
  arc.arc(center.x, center.y, radius, (-lo * Math.PI) / 180, (-hi * Math.PI) / 180, true);
  const tangentAt = (deg: number): Point => {
    const r = (deg * Math.PI) / 180;
    return { x: -Math.sin(r), y: -Math.cos(r) };
  };
  const arcLength = (radius * (hi - lo) * Math.PI) / 180;
  const outside = arcLength < 2.5 * style.arrowLength;
  const arrows = pathRound(2);
  const tLo = tangentAt(lo);
  const tHi = tangentAt(hi);
  arrowHead(arrows, start, outside ? tLo : { x: -tLo.x, y: -tLo.y }, style);
  arrowHead(arrows, polarPoint(center, radius, hi), outside ? { x: -tHi.x, y: -tHi.y } : tHi, style);
  const halfW = ([...text].length * 0.62 * ARC_TEXT_SIZE) / 2;
  const halfH = ARC_TEXT_SIZE / 2;
  const clearOfArc = (p: Point): boolean => {
    // The nearest point of the text's box to the centre.
    const dx = Math.max(0, Math.abs(p.x - center.x) - halfW);
    const dy = Math.max(0, Math.abs(p.y - center.y) - halfH);
    return Math.hypot(dx, dy) >= radius + style.labelGap;
  };
  let distance = radius + style.labelGap + 6;
  let mid = polarPoint(center, distance, (lo + hi) / 2);
  while (!clearOfArc(mid) && distance < radius + 4 * (halfW + halfH)) {
    distance += 1;
    mid = polarPoint(center, distance, (lo + hi) / 2);
  }
  return { arc: arc.toString(), arrows: arrows.toString(), label: { x: round2(mid.x), y: round2(mid.y), rotate: 0, text } };
}
