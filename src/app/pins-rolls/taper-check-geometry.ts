/**
 * Pure geometry of the two-reading checks on the pins-and-rolls page, as sections in SVG drawing
 * coordinates (x across, y down the page, lengths in the page's unit, to scale). No DOM, no Angular.
 *
 * - Dovetail angle from two roll sizes (derived from Machinery's Handbook "Measuring dovetail
 *   slides", REFERENCE.md §5.1): both pairs of rolls sit in the same corners, so the readings differ
 *   by (D₂ − D₁)·(1 + cot(α/2)).
 * - Taper from readings over rolls at two heights (common practice/derived): rolls of one size on
 *   equal stacks either side of the work, then on stacks ΔH taller; tan(α/2) = (M₂ − M₁)/(2·ΔH).
 * - Two discs (Machinery's Handbook 31 p. 701): straightedges touching discs of diameters D and d at
 *   centre distance C; sin(α/2) = (D − d)/(2C) about the axis, or with one side square the angle
 *   between the sides is 2·asin((D − d)/(2C)).
 * - Two balls in an internal taper (derived): each ball touches the bore; its centre lies
 *   R / sin(α/2) from the cone's point, so sin(α/2) = (R − r)/(centre distance).
 */
import { DEG, type RollCircle, type RollDimension, type RollPoint, type RollShape, boundsOf, dovetailGeometry, pt, r6 } from './roll-geometry';

/** A dovetail's angle found from readings over two sizes of roll. */
export interface DovetailAngleInput {
  /** 'male' (read over the rolls) or 'female' (read between them). */
  readonly side: 'male' | 'female';
  /** The angle the readings give, degrees (0 < α < 90). */
  readonly angleDeg: number;
  /** First roll diameter D₁. */
  readonly rollDiameter1: number;
  /** Second roll diameter D₂. */
  readonly rollDiameter2: number;
  /** Sharp-corner width a or b the readings give. */
  readonly width: number;
}

/** A taper checked over rolls at two heights. */
export interface TwoHeightsInput {
  /** Reading over the lower rolls M₁. */
  readonly measurement1: number;
  /** Reading over the upper rolls M₂. */
  readonly measurement2: number;
  /** How much higher the second pair sits, ΔH. */
  readonly heightDifference: number;
}

/** A taper set by two discs and straightedges. */
export interface DiscsInput {
  /** Large disc diameter D. */
  readonly largeDisc: number;
  /** Small disc diameter d. */
  readonly smallDisc: number;
  /** Centre distance C. */
  readonly centreDistance: number;
  /** 'axis': taper symmetric about its axis; 'side': one side square to the base. */
  readonly reference: 'axis' | 'side';
}

/** An internal taper checked with two balls. */
export interface BallsInput {
  /** Large ball diameter. */
  readonly largeBall: number;
  /** Small ball diameter. */
  readonly smallBall: number;
  /** Depth of the large ball's top below the face (negative: it stands proud). */
  readonly largeBallDepth: number;
  /** Depth of the small ball's top below the face. */
  readonly smallBallDepth: number;
  /** Half angle the engine found, degrees. */
  readonly halfAngleDeg: number;
}

/** The roll in a corner of angle α: its centre's run from the corner along the base, (D/2)·cot(α/2). */
function cornerRun(diameter: number, alpha: number): number {
  return (diameter / 2) / Math.tan(alpha / 2);
}

/**
 * A dovetail with both pairs of rolls in its corners (the second pair dashed), the two readings,
 * the corner width and α. Male readings are stacked above the tongue; female ones at the first
 * pair's centres and above the groove.
 */
export function dovetailAngleGeometry(input: DovetailAngleInput): RollShape {
  const alpha = Math.min(Math.max(input.angleDeg, 1), 89) * DEG;
  const d1 = Math.max(input.rollDiameter1, 1e-9);
  const d2 = Math.max(input.rollDiameter2, 1e-9);
  const big = Math.max(d1, d2);
  const contactBig = cornerRun(big, alpha) * Math.sin(alpha);
  const depth = Math.max(big * 1.6, contactBig * 1.15);
  const base = dovetailGeometry({ side: input.side, angleDeg: input.angleDeg, rollDiameter: d1, width: input.width, depth });
  const w = Math.max(input.width, 1e-9);
  const male = input.side === 'male';
  const k = 1 + 1 / Math.tan(alpha / 2);
  const r2 = d2 / 2;
  const run2 = cornerRun(d2, alpha);
  const centre2 = male ? w / 2 + run2 : w / 2 - run2;
  const flank = male ? 1 : -1;
  const second: RollCircle[] = [-1, 1].map((s) => ({
    centre: pt(s * centre2, -r2),
    radius: r6(r2),
    contacts: [pt(s * centre2, 0), pt(s * (w / 2 + flank * run2 * Math.cos(alpha)), -run2 * Math.sin(alpha))],
    second: true,
  }));
  const reading2 = male ? w + d2 * k : w - d2 * k;
  const gap = Math.max(d1 * 0.9, depth * 0.5);
  const dims: RollDimension[] = base.dimensions.filter((d) => d.key !== 'depth');
  dims.push({ key: 'measurement2', from: pt(-reading2 / 2, -r2), to: pt(reading2 / 2, -r2), offset: r6(depth - r2 + gap), tier: male ? 1 : 0 });
  const points = [...base.part, ...[...base.rolls, ...second].flatMap((c) => [pt(c.centre.x - c.radius, c.centre.y - c.radius), pt(c.centre.x + c.radius, c.centre.y + c.radius)])];
  return { ...base, rolls: [...base.rolls, ...second], dimensions: dims, bounds: boundsOf(points, dims) };
}

/**
 * A taper standing on the surface plate, its large or small end down, with rolls on equal
 * gauge-block stacks either side (the first reading) and the second pair ΔH higher (dashed), the
 * readings below the plate, ΔH at the side and the half angle at the top corner.
 * The rolls' size is not part of the answer; they are drawn at 8 % of the smaller reading.
 */
export function twoHeightsGeometry(input: TwoHeightsInput): RollShape {
  const m1 = Math.max(input.measurement1, 1e-9);
  const m2 = Math.max(input.measurement2, 1e-9);
  const dh = Math.max(input.heightDifference, 1e-9);
  const r = Math.min(m1, m2) * 0.08;
  const theta = Math.atan((m2 - m1) / (2 * dh));
  const stack = Math.max(dh * 0.25, r);
  const z1 = stack + r;
  const z2 = z1 + dh;
  const top = z2 + r + Math.max(dh * 0.15, r);
  const floor = Math.min(m1, m2) * 0.02;
  const half = (z: number) => Math.max(m1 / 2 - r - r / Math.cos(theta) + Math.tan(theta) * (z - z1), floor);
  const part = [pt(-half(0), 0), pt(half(0), 0), pt(half(top), -top), pt(-half(top), -top)];
  // The right side's outward normal is (cos θ, sin θ) on the paper; a roll touches it r inward of its centre.
  const rolls: RollCircle[] = [];
  for (const [reading, z, second] of [[m1, z1, false], [m2, z2, true]] as const) {
    for (const s of [-1, 1]) {
      const cx = s * (reading / 2 - r);
      rolls.push({
        centre: pt(cx, -z),
        radius: r6(r),
        contacts: [pt(cx, -(z - r)), pt(cx - s * r * Math.cos(theta), -z - r * Math.sin(theta) * 1)],
        ...(second ? { second: true } : {}),
      });
    }
  }
  const plateT = top * 0.08;
  const plateHalf = Math.max(m1, m2) / 2 + r * 4;
  const stackHalf = r * 0.8;
  const supports = [
    [pt(-plateHalf, 0), pt(plateHalf, 0), pt(plateHalf, plateT), pt(-plateHalf, plateT)],
    ...[-1, 1].map((s) => {
      const cx = s * (m1 / 2 - r);
      return [pt(cx - stackHalf, -stack), pt(cx + stackHalf, -stack), pt(cx + stackHalf, 0), pt(cx - stackHalf, 0)];
    }),
  ];
  const gap = Math.max(r * 1.5, top * 0.08);
  const outer = Math.max(m1, m2) / 2;
  const dims: RollDimension[] = [
    // Below the plate: the left of a left-to-right line is up the page, so a negative offset is down.
    { key: 'measurement', from: pt(-m1 / 2, -z1), to: pt(m1 / 2, -z1), offset: r6(-(z1 + plateT + gap)) },
    { key: 'measurement2', from: pt(-m2 / 2, -z2), to: pt(m2 / 2, -z2), offset: r6(-(z2 + plateT + gap)), tier: 1 },
    // ΔH between the pairs' centre lines, right of the rolls: for an upward line a negative offset is to the right.
    { key: 'height', from: pt(outer, -z1), to: pt(outer, -z2), offset: r6(-gap) },
  ];
  const thetaDeg = theta / DEG;
  const angle = {
    vertex: pt(half(top), -top),
    radius: r6(Math.max(top * 0.3, dh * 0.3)),
    fromDeg: r6(Math.min(90, 90 - thetaDeg)),
    toDeg: r6(Math.max(90, 90 - thetaDeg)),
  };
  const points = [...part, ...supports.flat(), ...rolls.flatMap((c) => [pt(c.centre.x - r, c.centre.y - r), pt(c.centre.x + r, c.centre.y + r)]), pt(angle.vertex.x, angle.vertex.y - angle.radius * 1.2)];
  return {
    part,
    rolls,
    dimensions: dims,
    angle,
    supports,
    axis: [pt(0, plateT), pt(0, -top - angle.radius * 0.6)],
    bounds: boundsOf(points, dims),
  };
}

/**
 * Two discs with the straightedges touching them: about a vertical axis (the large disc below),
 * or with the left straightedge square. Marks the angle between the right straightedge and the
 * square: α/2 about the axis, α with one side square.
 */
export function discsGeometry(input: DiscsInput): RollShape {
  const R = Math.max(input.largeDisc, 1e-9) / 2;
  const r = Math.min(Math.max(input.smallDisc, 1e-9) / 2, R);
  const C = Math.max(input.centreDistance, (R - r) * 1.0001, 1e-9);
  const phi = Math.asin((R - r) / C);
  const bottom = R * 1.3;
  let large: RollPoint;
  let small: RollPoint;
  let lines: [RollPoint, RollPoint][];
  let tilt: number;
  let axis: [RollPoint, RollPoint] | undefined;
  if (input.reference === 'axis') {
    large = pt(0, 0);
    small = pt(0, -C);
    const top = -C - r * 1.3;
    // Right straightedge: x = R/cos φ − (−y)·tan φ, narrowing upward; the left one is its mirror.
    const x = (y: number) => R / Math.cos(phi) + y * Math.tan(phi);
    lines = [1, -1].map((s) => [pt(s * x(bottom), bottom), pt(s * x(top), top)] as [RollPoint, RollPoint]);
    tilt = phi;
    axis = [pt(0, bottom + R * 0.2), pt(0, top - r * 0.3)];
  } else {
    const rise = C * Math.cos(phi);
    large = pt(R, 0);
    small = pt(r, -rise);
    const top = -rise - r * 1.3;
    // The other straightedge mirrors the square one (x = 0) in the line of centres: 2φ from the square.
    const t = 2 * phi;
    const c = -Math.cos(t) * large.x + Math.sin(t) * large.y - R;
    const x = (y: number) => (Math.sin(t) * y - c) / Math.cos(t);
    lines = [
      [pt(x(bottom), bottom), pt(x(top), top)],
      [pt(0, bottom), pt(0, top)],
    ];
    tilt = t;
  }
  const rolls: RollCircle[] = [large, small].map((centre, i) => ({ centre, radius: r6(i === 0 ? R : r), contacts: [] }));
  const dims: RollDimension[] = [
    { key: 'large', from: pt(large.x - R, large.y), to: pt(large.x + R, large.y), offset: 0 },
    { key: 'small', from: pt(small.x - r, small.y), to: pt(small.x + r, small.y), offset: 0 },
    { key: 'centres', from: large, to: small, offset: 0 },
  ];
  const vertex = lines[0][0];
  const angle = { vertex, radius: r6(C * 0.45), fromDeg: 90, toDeg: r6(90 + tilt / DEG) };
  const points = [...lines.flat(), pt(large.x - R, large.y + R), pt(large.x + R, large.y - R), pt(small.x - r, small.y - r), pt(small.x + r, small.y + r)];
  return { part: [], rolls, dimensions: dims, angle, sides: lines, ...(axis ? { axis } : {}), bounds: boundsOf(points, dims) };
}

/**
 * A ring or bush with an internal taper (opening toward the face at y = 0), the two balls resting
 * in it, their depths below the face and α/2 at the face's edge.
 */
export function ballsGeometry(input: BallsInput): RollShape {
  const R = Math.max(input.largeBall, 1e-9) / 2;
  const r = Math.min(Math.max(input.smallBall, 1e-9) / 2, R);
  const theta = Math.min(Math.max(input.halfAngleDeg, 0.05), 80) * DEG;
  const yL = input.largeBallDepth + R;
  const yS = Math.max(input.smallBallDepth + r, yL);
  // The bore's half width at depth y, from the large ball touching it: R / cos θ at its centre.
  const w0 = R / Math.cos(theta) + yL * Math.tan(theta);
  const w = (y: number) => Math.max(w0 - y * Math.tan(theta), 0);
  const floor = yS + r * 1.5;
  const outer = w0 + Math.max(R, w0 * 0.6);
  const bodyBottom = floor + Math.max(floor * 0.3, r);
  const part = [pt(-outer, 0), pt(-w0, 0), pt(-w(floor), floor), pt(w(floor), floor), pt(w0, 0), pt(outer, 0), pt(outer, bodyBottom), pt(-outer, bodyBottom)];
  const contacts = (y: number, radius: number) => [-1, 1].map((s) => pt(s * radius * Math.cos(theta), y + radius * Math.sin(theta)));
  const rolls: RollCircle[] = [
    { centre: pt(0, yL), radius: r6(R), contacts: contacts(yL, R) },
    { centre: pt(0, yS), radius: r6(r), contacts: contacts(yS, r) },
  ];
  const gap = Math.max(R * 0.6, outer * 0.15);
  const dims: RollDimension[] = [
    // Downward lines: a positive offset is to the right on the paper, a negative one to the left.
    { key: 'largeDepth', from: pt(0, 0), to: pt(0, input.largeBallDepth), offset: r6(-(outer + gap)) },
    { key: 'smallDepth', from: pt(0, 0), to: pt(0, input.smallBallDepth), offset: r6(outer + gap) },
    { key: 'large', from: pt(-R, yL), to: pt(R, yL), offset: 0 },
    { key: 'small', from: pt(-r, yS), to: pt(r, yS), offset: 0 },
  ];
  const thetaDeg = theta / DEG;
  const angle = { vertex: pt(w0, 0), radius: r6(Math.max(w0 * 0.5, R)), fromDeg: r6(90 - thetaDeg), toDeg: 90 };
  const proud = Math.min(0, yL - R);
  const points = [...part, pt(-R, proud), pt(R, proud), pt(w0, -angle.radius * 1.25)];
  return { part, rolls, dimensions: dims, angle, axis: [pt(0, proud - R * 0.3), pt(0, bodyBottom + R * 0.2)], bounds: boundsOf(points, dims) };
}
