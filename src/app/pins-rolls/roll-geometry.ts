/**
 * Pure geometry of measuring over (or between) rolls, as a cross-section in SVG drawing
 * coordinates: x across the part, y down the page, lengths in the page's unit, drawn to scale.
 * No DOM, no Angular.
 *
 * - Dovetail (Machinery's Handbook, "Measuring dovetail slides", REFERENCE.md §5.1): two equal
 *   rolls of diameter D sit in the acute corners between the flanks (angle α to the base) and the
 *   base. A roll in a corner of angle α has its centre (D/2)·cot(α/2) from the corner along the
 *   base and D/2 above it, so the reading over the rolls of a male dovetail with corner width a is
 *   x = a + D·(1 + cot(α/2)), and between the rolls of a female one with corner width b it is
 *   y = b − D·(1 + cot(α/2)).
 * - V-groove (plain geometry, derived): a pin of radius r in a V of included angle β touches both
 *   flanks, its centre r / sin(β/2) above the V's point; with the groove w wide at the surface the
 *   point lies (w/2)·cot(β/2) below the surface, so the pin's top stands
 *   m = r / sin(β/2) + r − (w/2)·cot(β/2) above the surface.
 */

/** A point in drawing coordinates. */
export interface RollPoint {
  /** Across the part. */
  readonly x: number;
  /** Down the page. */
  readonly y: number;
}

/** A roll or pin seen end-on. */
export interface RollCircle {
  /** Centre. */
  readonly centre: RollPoint;
  /** Radius. */
  readonly radius: number;
  /** Where it touches the part (two points). */
  readonly contacts: readonly RollPoint[];
  /** True for the second set-up of a two-reading check (drawn dashed). */
  readonly second?: boolean;
}

/** Which dimension a line is. */
export type RollDimensionKey =
  | 'measurement'
  | 'measurement2'
  | 'width'
  | 'depth'
  | 'height'
  | 'large'
  | 'small'
  | 'centres'
  | 'largeDepth'
  | 'smallDepth';

/** A linear dimension between two points (see LatheDimension for the offset convention). */
export interface RollDimension {
  /** Which dimension this is. */
  readonly key: RollDimensionKey;
  /** First measured point. */
  readonly from: RollPoint;
  /** Second measured point. */
  readonly to: RollPoint;
  /** Distance to the dimension line, positive to the left of from→to on the paper. */
  readonly offset: number;
  /**
   * Extra rows of clearance on screen: a dimension stacked outside another one on the same side
   * is drawn this many label rows further out (0 or absent: none).
   */
  readonly tier?: number;
}

/** An angle to mark with an arc: about `vertex`, from direction `fromDeg` to `toDeg` (counter-clockwise on the paper). */
export interface RollAngle {
  /** Where the two lines meet. */
  readonly vertex: RollPoint;
  /** Arc radius, drawing units. */
  readonly radius: number;
  /** Start direction, degrees counter-clockwise on the paper (0 = along +x). */
  readonly fromDeg: number;
  /** End direction, degrees counter-clockwise on the paper. */
  readonly toDeg: number;
}

/** The drawing's shapes. */
export interface RollShape {
  /** The part's section outline (corners). */
  readonly part: readonly RollPoint[];
  /** The rolls (two for a dovetail, one pin for a V-groove). */
  readonly rolls: readonly RollCircle[];
  /** Dimensions: the measurement over/between the rolls (or the pin's height), the width and the depth. */
  readonly dimensions: readonly RollDimension[];
  /** The angle to mark: α at the left corner, β at the V's point, or a taper's half angle. */
  readonly angle: RollAngle;
  /** Supports drawn under the part or rolls (the surface plate, gauge-block stacks): outlines. */
  readonly supports?: readonly (readonly RollPoint[])[];
  /** Straight lines drawn as the part's sides where there is no part outline (a taper's straightedges). */
  readonly sides?: readonly (readonly [RollPoint, RollPoint])[];
  /** The taper's axis, drawn as a centre line. */
  readonly axis?: readonly [RollPoint, RollPoint];
  /** Smallest box holding every shape and dimension line: [minX, minY, width, height]. */
  readonly bounds: readonly [number, number, number, number];
}

/** A dovetail to draw. */
export interface DovetailInput {
  /** 'male' (a tongue, read over the rolls) or 'female' (a groove, read between them). */
  readonly side: 'male' | 'female';
  /** Angle between flank and base, degrees (0 < α < 90). */
  readonly angleDeg: number;
  /** Roll diameter D. */
  readonly rollDiameter: number;
  /** Sharp-corner width at the roll side: a (male) or b (female). */
  readonly width: number;
  /** Depth h of the dovetail (defaults to 1.6·D, at least enough to cover the contact point). */
  readonly depth?: number;
}

/** A V-groove to draw. */
export interface VGrooveInput {
  /** Included angle of the V, degrees (0 < β < 180). */
  readonly includedAngleDeg: number;
  /** Pin diameter. */
  readonly pinDiameter: number;
  /** Width of the groove at the surface (sharp corners). */
  readonly grooveWidth: number;
}

/** Radians per degree. */
export const DEG = Math.PI / 180;

/** Rounds to 1e-6 so coordinates carry no float noise. */
export function r6(value: number): number {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Object.is(rounded, -0) ? 0 : rounded;
}

export function pt(x: number, y: number): RollPoint {
  return { x: r6(x), y: r6(y) };
}

/** The box around points and dimension lines. */
export function boundsOf(points: RollPoint[], dimensions: readonly RollDimension[]): [number, number, number, number] {
  const all = [...points];
  for (const dim of dimensions) {
    const dx = dim.to.x - dim.from.x;
    const dy = dim.to.y - dim.from.y;
    const len = Math.hypot(dx, dy) || 1;
    const n = { x: dy / len, y: -dx / len };
    all.push(pt(dim.from.x + n.x * dim.offset, dim.from.y + n.y * dim.offset), pt(dim.to.x + n.x * dim.offset, dim.to.y + n.y * dim.offset));
  }
  const xs = all.map((p) => p.x);
  const ys = all.map((p) => p.y);
  const minX = Math.min(...xs);
  const minY = Math.min(...ys);
  return [r6(minX), r6(minY), r6(Math.max(...xs) - minX), r6(Math.max(...ys) - minY)];
}

/**
 * Lays out a dovetail section with its two rolls, the base at y = 0 and the part's body below it.
 * Angles outside 1°…89° are clamped so that a half-typed form still draws.
 */
export function dovetailGeometry(input: DovetailInput): RollShape {
  const alpha = Math.min(Math.max(input.angleDeg, 1), 89) * DEG;
  const D = Math.max(input.rollDiameter, 1e-9);
  const r = D / 2;
  const w = Math.max(input.width, 1e-9);
  const cotHalf = 1 / Math.tan(alpha / 2);
  const cotA = 1 / Math.tan(alpha);
  // The roll touches the flank (D/2)·cot(α/2) from the corner; its height there is that times sin α.
  const contactRun = r * cotHalf;
  const contactHeight = contactRun * Math.sin(alpha);
  const h = Math.max(input.depth ?? D * 1.6, contactHeight * 1.15);
  const slant = h * cotA;
  const reading = input.side === 'male' ? w + D * (1 + cotHalf) : w - D * (1 + cotHalf);
  const body = Math.max(h * 0.9, D);

  let outline: RollPoint[];
  let centreX: number;
  let partHalf: number;
  if (input.side === 'male') {
    // The tongue widens upward from its corners at ±a/2 on the base.
    partHalf = Math.max(w / 2 + slant, reading / 2) + D * 1.2;
    outline = [
      pt(-partHalf, body), pt(partHalf, body), pt(partHalf, 0), pt(w / 2, 0),
      pt(w / 2 + slant, -h), pt(-w / 2 - slant, -h), pt(-w / 2, 0), pt(-partHalf, 0),
    ];
    centreX = w / 2 + contactRun;
  } else {
    // The groove narrows upward from its corners at ±b/2 on its floor.
    partHalf = w / 2 + D * 1.5;
    outline = [
      pt(-partHalf, body), pt(partHalf, body), pt(partHalf, -h), pt(w / 2 - slant, -h),
      pt(w / 2, 0), pt(-w / 2, 0), pt(-w / 2 + slant, -h), pt(-partHalf, -h),
    ];
    centreX = w / 2 - contactRun;
  }
  const flankDir = input.side === 'male' ? 1 : -1;
  const rolls: RollCircle[] = [-1, 1].map((s) => ({
    centre: pt(s * centreX, -r),
    radius: r6(r),
    contacts: [
      pt(s * centreX, 0),
      pt(s * (w / 2 + flankDir * contactRun * Math.cos(alpha)), -contactHeight),
    ],
  }));

  const gap = Math.max(D * 0.9, h * 0.5);
  // Depth is vertical, beside the part: from the base level up to the top level.
  const depthX = partHalf + gap * 0.8;
  const dimensions: RollDimension[] = [
    input.side === 'male'
      ? // Over the rolls, above the tongue: left of a left-to-right line is up the page.
        { key: 'measurement', from: pt(-reading / 2, -r), to: pt(reading / 2, -r), offset: h - r + gap }
      : // Between the rolls, at their centres.
        { key: 'measurement', from: pt(-reading / 2, -r), to: pt(reading / 2, -r), offset: 0 },
    // The corner width a or b, below the part (left of a right-to-left line is down the page).
    { key: 'width', from: pt(w / 2, 0), to: pt(-w / 2, 0), offset: body + gap * 0.8 },
    { key: 'depth', from: pt(depthX, 0), to: pt(depthX, -h), offset: 0 },
  ];

  // α where the left flank meets the top, inside the material, so that the roll in the corner at
  // the base does not hide it: between the flank and the top face (alternate angles, both α).
  // Male: from the top-left corner the top face runs right (0°) and the flank down to the base (−α).
  // Female: from the groove's top-left edge the top runs left (180°) and the flank down to the floor (180° + α).
  const arcR = r6(h * 0.55);
  const angle: RollAngle =
    input.side === 'male'
      ? { vertex: pt(-w / 2 - slant, -h), radius: arcR, fromDeg: r6(-alpha / DEG), toDeg: 0 }
      : { vertex: pt(-w / 2 + slant, -h), radius: arcR, fromDeg: 180, toDeg: r6(180 + alpha / DEG) };

  const points = [...outline, ...rolls.flatMap((c) => [pt(c.centre.x - r, c.centre.y - r), pt(c.centre.x + r, c.centre.y + r)])];
  return { part: outline, rolls, dimensions, angle, bounds: boundsOf(points, dimensions) };
}

/** Lays out a V-groove section with its pin, the surface at y = 0. */
export function vGrooveGeometry(input: VGrooveInput): RollShape {
  const beta = Math.min(Math.max(input.includedAngleDeg, 1), 179) * DEG;
  const r = Math.max(input.pinDiameter, 1e-9) / 2;
  const w = Math.max(input.grooveWidth, 1e-9);
  const half = beta / 2;
  const pointDepth = (w / 2) / Math.tan(half);
  const centreY = pointDepth - r / Math.sin(half);
  const top = centreY - r;
  const partHalf = Math.max(w / 2, r) + Math.max(w, r * 2) * 0.6;
  const body = pointDepth + Math.max(pointDepth * 0.8, r);
  const outline = [pt(-partHalf, 0), pt(-w / 2, 0), pt(0, pointDepth), pt(w / 2, 0), pt(partHalf, 0), pt(partHalf, body), pt(-partHalf, body)];
  // The pin touches each flank where the radius meets it square: r·cos(β/2) out, r·sin(β/2) down from the centre.
  const contacts = [-1, 1].map((s) => pt(s * r * Math.cos(half), centreY + r * Math.sin(half)));
  const pin: RollCircle = { centre: pt(0, centreY), radius: r6(r), contacts };

  const gap = Math.max(r * 0.8, w * 0.15);
  const x = Math.max(r, w / 2) + gap;
  const dimensions: RollDimension[] = [
    // The pin's top over the surface: from the surface up to the top (a negative height points down).
    { key: 'measurement', from: pt(x, 0), to: pt(x, top), offset: 0 },
    { key: 'width', from: pt(w / 2, 0), to: pt(-w / 2, 0), offset: body + gap },
  ];
  // β at the V's point, marked between the flanks' extensions below it (vertical angles are equal),
  // where the pin does not cover it: 270° ± β/2 on the paper.
  const angle: RollAngle = {
    vertex: pt(0, pointDepth),
    radius: r6(Math.min(pointDepth * 0.45, w * 0.3)),
    fromDeg: r6(270 - half / DEG),
    toDeg: r6(270 + half / DEG),
  };

  const points = [...outline, pt(-r, top), pt(r, centreY + r)];
  return { part: outline, rolls: [pin], dimensions, angle, bounds: boundsOf(points, dimensions) };
}
