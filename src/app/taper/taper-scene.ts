import { type AngleArcGeometry, DIMENSION_STYLE, type DimensionGeometry, type Label, angleArc, dimensionLine } from '../drawing/dimension';
import { chordAtLevel, clipToLevel, hatchPath, polygonPath, polylinePath, segmentsPath } from '../drawing/shapes';
import { type PlacedLabel, boxInside, boxesTouch, firstClear, labelBox as boxOfText } from '../drawing/label-room';
import { type Bounds, type Point, boundsOf, fitView, round2 } from '../drawing/view-fit';
import type { HoldingDrawing } from '../../../shared/forms/taper-holding';

/** What the taper set-up drawing is drawn from: model sizes as numbers in the page's unit. */
export interface TaperSceneInput {
  /** Stock thickness T. */
  readonly thickness: number;
  /** Taper length L along the top face. */
  readonly taperLength: number;
  /** Stock removed at the end, d = L·tan α. */
  readonly removedAtEnd: number;
  /** Taper angle α in degrees: the part is tilted by α so the face to cut is level. */
  readonly angleDeg: number;
  /** Whole length of the part (at least L). */
  readonly partLength: number;
  /** Cutter diameter. */
  readonly cutterDiameter: number;
  /** DRO readings after each pass, measured down from the touch-off point. */
  readonly readings: readonly number[];
  /** The pass to show (1-based), or 0 for none. */
  readonly selectedPass: number;
  /** How the part is held (default: one angle block in the vise). */
  readonly holding?: HoldingDrawing;
  /** Label texts already at the unit's resolution. */
  readonly labels: {
    readonly depthToStop: string;
    readonly faceLength: string;
    readonly endThickness: string;
    readonly angle: string;
    readonly cutter: string;
    /** A shorter cutter label for a crowded (phone-width) drawing, e.g. "Ø0.75 in". */
    readonly cutterShort?: string;
  };
}

/** One pass line: the level the cutter reaches on that pass, across the material. */
export interface PassLine {
  /** 1-based pass number. */
  readonly pass: number;
  /** The line across the material. */
  readonly d: string;
  /** Whether it is the pass being shown. */
  readonly selected: boolean;
}

/** One outline of the work-holding, with its style: vise, block, plate, stack block… */
export interface FixturePart {
  readonly d: string;
  readonly kind: 'vise-base' | 'vise-jaw' | 'vise-body' | 'block' | 'plate' | 'base' | 'gauge' | 'gauge odd' | 'gauge missing' | 'scale';
}

/** A name label with its text anchor. */
export interface NameLabel extends Label {
  readonly anchor: 'start' | 'middle' | 'end';
}

/** Everything the taper drawing binds: view box, outlines, marks and labels in view units. */
export interface TaperScene {
  readonly viewBox: string;
  readonly width: number;
  readonly height: number;
  /** The work-holding, back to front: vise, angle blocks, sine plate and stack, or tilting vise. */
  readonly fixture: readonly FixturePart[];
  /** Lines between wrung angle blocks, and the ticks of a tilting vise's scale. */
  readonly fixtureLines: string;
  /** Rolls of a sine plate. */
  readonly rolls: readonly { readonly cx: number; readonly cy: number; readonly r: number }[];
  /** The finished part. */
  readonly part: string;
  /** The material still to remove (after the shown pass) and its hatching. */
  readonly toRemove: string;
  readonly toRemoveHatch: string;
  /** The material already removed by the shown pass. */
  readonly removed: string;
  /** The cutter: flutes and shank. */
  readonly cutterFlutes: string;
  readonly cutterShank: string;
  /** The level reference line from the block's low end, for the angle arc. */
  readonly levelLine: string;
  /** Touch-off point (the highest corner) and its label. */
  readonly touchOff: Point;
  readonly touchOffLabel: Label;
  /** Which way the touch-off note runs from its point: left of the cutter ('end') or right of it ('start'). */
  readonly touchOffAnchor: NameLabel['anchor'];
  /** Dashed level lines: touch-off level and the stop level. */
  readonly touchOffLevel: string;
  readonly stopLevel: string;
  readonly passLines: readonly PassLine[];
  /** Label of the shown pass, at the left end of its line. */
  readonly passLabel: Label | null;
  readonly depthDim: DimensionGeometry;
  readonly faceDim: DimensionGeometry;
  /** Null when the taper runs out to a knife edge. */
  readonly endDim: DimensionGeometry | null;
  readonly angleArc: AngleArcGeometry;
  /** Name labels of the cutter and the holding, each placed clear of the other labels. */
  readonly names: readonly NameLabel[];
  /** The estimated boxes of every label (dimensions, arc, notes, names), for checking that none overlap. */
  readonly labelBoxes: readonly (Bounds & { readonly text: string })[];
}

/** View-box height as a share of its width, and the free margin round the model. */
const MAX_HEIGHT_RATIO = 0.72;
const TALL_HEIGHT_RATIO = 1;
const MARGIN = 64;
/** Room on the right for the end-thickness and depth-to-stop dimensions side by side. */
const MARGIN_RIGHT = 120;
/** Distance from the end face to the depth-to-stop dimension, clear of the end-thickness one. */
const DEPTH_DIM_CLEARANCE = 84;
/** A label's estimated box, with its text (for telling which labels a failed check is about). */
function labelBox(label: PlacedLabel): Bounds & { readonly text: string } {
  return { ...boxOfText(label), text: label.text };
}

/** Font sizes of dimension text and of notes and names, in view units (as in taper-drawing.ts). */
const DIM_TEXT = 14;
const NOTE_TEXT = 13;
/** Below this view width (a phone) the margins shrink so the set-up itself stays large. */
const COMPACT_WIDTH = 520;
const COMPACT = { margin: 36, marginRight: 92, clearance: 66 } as const;

/**
 * Lays out the taper set-up, to scale: the part of thickness T tilted by α on an angle block so
 * the taper face is level, held in the vise, with the cutter touched off on the highest corner
 * (the top edge at the end). In model units (y up, origin at the block's low end where the part's
 * bottom corner sits) the part's corner (x, y) goes to (x·cos α − y·sin α, x·sin α + y·cos α).
 * Then the touch-off corner is at height P·sin α + T·cos α, the cut (stop) level at
 * P·sin α + (T − d)·cos α, and their difference is L·sin α, the depth to stop.
 */
export function taperScene(input: TaperSceneInput, width: number): TaperScene {
  const T = input.thickness;
  const L = input.taperLength;
  const d = Math.min(input.removedAtEnd, T);
  // A part far longer than its taper is drawn shortened, so the taper stays big enough to read.
  const P = Math.min(Math.max(input.partLength, L), L + 10 * Math.max(L, T));
  const a = (input.angleDeg * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const rot = (p: Point): Point => ({ x: p.x * c - p.y * s, y: p.x * s + p.y * c });

  const partModel = [{ x: 0, y: 0 }, { x: P, y: 0 }, { x: P, y: T - d }, { x: P - L, y: T }, { x: 0, y: T }];
  const part = (d < T ? partModel : partModel.filter((_, i) => i !== 2)).map(rot);
  const triangle = [{ x: P - L, y: T }, { x: P, y: T }, { x: P, y: T - d }].map(rot);
  const corner = rot({ x: P, y: T });
  const faceStart = rot({ x: P - L, y: T });
  const faceEnd = rot({ x: P, y: T - d });
  const endBottom = rot({ x: P, y: 0 });
  const yTop = corner.y;
  const yCut = faceEnd.y;

  const holder = holdingModel(input.holding ?? { kind: 'angle-block', blocks: [] }, { T, P, d, a, yCut });

  // The cutter stands on the touch-off corner; drawn length is kept in proportion to the part.
  const D = input.cutterDiameter > 0 ? input.cutterDiameter : 0.5 * T;
  const fluteH = Math.min(Math.max(D, 0.8 * T), 1.5 * T);
  const shankH = 0.5 * T;
  const cutterFlutes = [{ x: corner.x - D / 2, y: yTop }, { x: corner.x + D / 2, y: yTop }, { x: corner.x + D / 2, y: yTop + fluteH }, { x: corner.x - D / 2, y: yTop + fluteH }];
  const shankW = D * 0.8;
  const cutterShank = [{ x: corner.x - shankW / 2, y: yTop + fluteH }, { x: corner.x + shankW / 2, y: yTop + fluteH }, { x: corner.x + shankW / 2, y: yTop + fluteH + shankH }, { x: corner.x - shankW / 2, y: yTop + fluteH + shankH }];

  const compact = width < COMPACT_WIDTH;
  const margin = compact ? COMPACT.margin : MARGIN;
  const fit = fitView(boundsOf([...holder.extent, ...part, ...cutterShank, ...cutterFlutes]), {
    width,
    // On a phone a sine plate or tilting vise (taller than a block in a vise) gets a taller view.
    maxHeight: Math.max(2 * margin + 80, width * (compact && input.holding && input.holding.kind !== 'angle-block' ? TALL_HEIGHT_RATIO : MAX_HEIGHT_RATIO)),
    minHeight: compact ? 200 : 240,
    margin,
    marginRight: compact ? COMPACT.marginRight : MARGIN_RIGHT,
  });
  const v = fit.toView;
  const vs = (pts: readonly Point[]) => pts.map(v);

  // Passes: level lines across the material; the shown pass splits removed from still to remove.
  const readings = input.readings.filter((r) => r > 0 && r <= yTop - yCut + 1e-9);
  const selected = Math.min(Math.max(0, Math.round(input.selectedPass)), readings.length);
  const shownLevel = selected > 0 ? yTop - readings[selected - 1] : yTop;
  const removedModel = selected > 0 ? clipToLevel(triangle, shownLevel, 'above') : [];
  const remainingModel = selected > 0 ? clipToLevel(triangle, shownLevel, 'below') : triangle;
  const passLines: PassLine[] = [];
  readings.forEach((r, i) => {
    const chord = chordAtLevel(triangle, Math.max(yCut, yTop - r));
    if (chord) passLines.push({ pass: i + 1, d: polylinePath(vs(chord)), selected: i + 1 === selected });
  });
  const shownChord = selected > 0 ? chordAtLevel(triangle, Math.max(yCut, shownLevel)) : null;
  const passAnchor = shownChord ? v(shownChord[0]) : null;

  const cornerV = v(corner);
  const faceEndV = v(faceEnd);
  const depthA = v({ x: faceEnd.x, y: yTop });
  const depthOffset = Math.max(0, v(endBottom).x - faceEndV.x) + (compact ? COMPACT.clearance : DEPTH_DIM_CLEARANCE);
  const remaining = vs(remainingModel);
  const hatchSpacing = Math.max(6, Math.min(12, (yTop - yCut) * fit.scale / 3));
  const arcRadius = Math.min(90, Math.max(36, 0.3 * P * c * fit.scale));
  const origin = v({ x: 0, y: 0 });

  const depthDim = dimensionLine(depthA, faceEndV, depthOffset, input.labels.depthToStop);
  // The end dimension is short beside its text: the text keeps clear of the extension lines' overshoot.
  const endDim = d < T - 1e-9 ? dimensionLine(faceEndV, v(endBottom), 30, input.labels.endThickness, { ...DIMENSION_STYLE, labelGap: DIMENSION_STYLE.extensionOvershoot + 4 }) : null;
  const arc = angleArc(origin, arcRadius, 0, input.angleDeg, input.labels.angle);
  const view = { width: fit.width, height: fit.height };

  // Labels placed by the geometry (dimensions and the arc) stay; then the touch-off note, the pass
  // note, the face-length dimension (which may rise a step or two) and the names of the cutter
  // and the holding each take the first of their places that stays clear of every label so far.
  const fixedLabels: PlacedLabel[] = [
    { ...depthDim.label, anchor: 'middle', size: DIM_TEXT },
    ...(endDim ? [{ ...endDim.label, anchor: 'middle' as const, size: DIM_TEXT }] : []),
    // The arc's text is centred on its y (dominant-baseline: middle).
    { ...arc.label, y: arc.label.y + 0.3 * DIM_TEXT, anchor: 'middle', size: DIM_TEXT },
  ];
  const settled = fixedLabels.map(labelBox);
  const settle = (candidates: readonly PlacedLabel[]): PlacedLabel => {
    const chosen = firstClear(candidates, settled, view);
    settled.push(labelBox(chosen));
    return chosen;
  };
  const cutterLeftX = v({ x: corner.x - D / 2, y: yTop }).x;
  const cutterRightX = v({ x: corner.x + D / 2, y: yTop }).x;
  const note = (x: number, y: number, text: string, anchor: NameLabel['anchor']): PlacedLabel => ({ x: round2(x), y: round2(y), rotate: 0, text, anchor, size: NOTE_TEXT });
  // Left of the cutter, so the cutter never covers it.
  const touchPlaced = settle([
    note(cutterLeftX - 8, cornerV.y - 6, 'Touch off', 'end'),
    note(cutterLeftX - 8, cornerV.y - 22, 'Touch off', 'end'),
    note(cutterRightX + 8, cornerV.y - 22, 'Touch off', 'start'),
  ]);
  const touchOffLabel: Label = { x: touchPlaced.x, y: touchPlaced.y, rotate: 0, text: 'Touch off' };
  const touchOffAnchor = touchPlaced.anchor;
  // The pass note is drawn 6 left of and 4 below its point (taper-drawing.ts); it may drop a line or two.
  let passLabel: Label | null = null;
  if (passAnchor) {
    const text = `Pass ${selected}`;
    const placed = settle([0, -30, -60].flatMap((dx) => [0, 18, 36, 54, -18].map((dy) => note(passAnchor.x - 6 + dx, passAnchor.y + 4 + dy, text, 'end'))));
    passLabel = { x: round2(placed.x + 6), y: round2(placed.y - 4), rotate: 0, text };
  }
  const fixedCount = settled.length;

  const shankLeft = v({ x: corner.x - shankW / 2, y: yTop + fluteH + shankH * 0.5 });
  const shankRight = v({ x: corner.x + shankW / 2, y: yTop + fluteH + shankH * 0.5 });
  const shankTop = v({ x: corner.x, y: yTop + fluteH + shankH });
  const cutterCandidates = [input.labels.cutter, input.labels.cutterShort ?? input.labels.cutter].flatMap((text) => {
    const at = (x: number, y: number, anchor: NameLabel['anchor']): PlacedLabel => ({ x: round2(x), y: round2(y), rotate: 0, text, anchor, size: NOTE_TEXT });
    return [
      at(shankLeft.x - 8, shankLeft.y + 4, 'end'),
      at(shankRight.x + 8, shankRight.y + 4, 'start'),
      at(shankTop.x, shankTop.y - 8, 'middle'),
      at(shankLeft.x - 8, shankTop.y + 4, 'end'),
    ];
  });
  const faceBase = (yTop - yCut) * fit.scale + 30;
  let faceDim = dimensionLine(v(faceStart), faceEndV, faceBase, input.labels.faceLength);
  let cutterLabel = cutterCandidates[0];
  for (const rise of [0, 20, 36]) {
    const face = dimensionLine(v(faceStart), faceEndV, faceBase + rise, input.labels.faceLength);
    const faceBox = labelBox({ ...face.label, anchor: 'middle', size: DIM_TEXT });
    if (!boxInside(faceBox, view.width, view.height)) break;
    const taken = [...settled.slice(0, fixedCount), faceBox];
    const clear = cutterCandidates.find((c) => {
      const box = labelBox(c);
      return boxInside(box, view.width, view.height) && taken.every((t) => !boxesTouch(box, t, 2));
    });
    if (clear) {
      faceDim = face;
      cutterLabel = clear;
      break;
    }
  }
  const taken = [...settled.slice(0, fixedCount), ...[{ ...faceDim.label, anchor: 'middle' as const, size: DIM_TEXT }, cutterLabel].map(labelBox)];
  const names: NameLabel[] = [{ x: cutterLabel.x, y: cutterLabel.y, rotate: 0, text: cutterLabel.text, anchor: cutterLabel.anchor }];
  for (const n of holder.names) {
    const candidates = [n, ...(n.alts ?? [])].flatMap((spot) => {
      const at = v(spot.at);
      return [0, 18, -18, 36, 54].map((dy): PlacedLabel => ({ x: round2(at.x), y: round2(at.y + dy), rotate: 0, text: n.text, anchor: spot.anchor, size: NOTE_TEXT }));
    });
    const chosen = firstClear(candidates, taken, view);
    taken.push(labelBox(chosen));
    names.push({ x: chosen.x, y: chosen.y, rotate: 0, text: chosen.text, anchor: chosen.anchor });
  }

  return {
    viewBox: fit.viewBox,
    width: fit.width,
    height: fit.height,
    fixture: holder.parts.map((f) => ({ d: polygonPath(vs(f.points)), kind: f.kind })),
    fixtureLines: segmentsPath(holder.lines.map(([p, q]) => [v(p), v(q)] as const)),
    rolls: holder.rolls.map((r) => ({ cx: v(r.c).x, cy: v(r.c).y, r: round2(r.r * fit.scale) })),
    part: polygonPath(vs(part)),
    toRemove: polygonPath(remaining),
    toRemoveHatch: hatchPath(remaining, hatchSpacing, 45),
    removed: polygonPath(vs(removedModel)),
    cutterFlutes: polygonPath(vs(cutterFlutes)),
    cutterShank: polygonPath(vs(cutterShank)),
    levelLine: polylinePath([origin, { x: origin.x + arcRadius + 16, y: origin.y }]),
    touchOff: cornerV,
    // Left of the cutter, so the cutter never covers it.
    touchOffLabel,
    touchOffAnchor,
    touchOffLevel: polylinePath([cornerV, depthA]),
    stopLevel: polylinePath([v(faceStart), faceEndV]),
    passLines,
    passLabel,
    depthDim,
    faceDim,
    endDim,
    angleArc: arc,
    names,
    labelBoxes: taken,
  };
}

/** The work-holding in model units (y up, the part's low bottom corner at the origin). */
interface HoldingModel {
  readonly parts: readonly { readonly points: readonly Point[]; readonly kind: FixturePart['kind'] }[];
  readonly lines: readonly (readonly [Point, Point])[];
  readonly rolls: readonly { readonly c: Point; readonly r: number }[];
  /** Names with their place and, when that is crowded, other places to try in order. */
  readonly names: readonly {
    readonly at: Point;
    readonly text: string;
    readonly anchor: NameLabel['anchor'];
    readonly alts?: readonly { readonly at: Point; readonly anchor: NameLabel['anchor'] }[];
  }[];
  /** Points the view must take in. */
  readonly extent: readonly Point[];
}

/**
 * The holding under a part of thickness T and length P tilted by `a` (radians) about its low
 * bottom corner, drawn in proportion to the part (to scale for a sine plate's roll distance and
 * stack, which come from the engine):
 * - angle blocks: the wedge in the vise, split into the wrung blocks, the vise's fixed jaw behind;
 * - sine plate: the plate on its hinge roll and on the gauge blocks under the free roll, whose
 *   centres lie the plate length apart along the tilted plate, so the stack is L·sin a tall;
 * - tilting vise: the body tilted about its pivot over the base, with its scale behind.
 */
function holdingModel(h: HoldingDrawing, g: { T: number; P: number; d: number; a: number; yCut: number }): HoldingModel {
  const { T, P, d, a, yCut } = g;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const tan = s / Math.max(c, 1e-9);
  // A point `k` along the part's tilted bottom face and `m` square to it (up is positive).
  const along = (k: number, m: number): Point => ({ x: k * c - m * s, y: k * s + m * c });

  if (h.kind === 'sine-plate') {
    const Lp = h.plateLength;
    const r = 0.07 * Lp;
    const tp = 0.1 * Lp;
    const a0 = (P - Lp) / 2;
    const k0 = Math.min(a0 - 0.08 * Lp, -0.02 * P);
    const k1 = Math.max(a0 + 1.08 * Lp, 1.02 * P);
    const plate = [along(k0, -tp), along(k1, -tp), along(k1, 0), along(k0, 0)];
    const c1 = along(a0, -(tp + r));
    const c2 = along(a0 + Lp, -(tp + r));
    const yb = c1.y - r;
    const stackW = 0.16 * Lp;
    const baseLeft = Math.min(c1.x - r, plate[0].x) - 0.1 * Lp;
    const baseRight = Math.max(c2.x + stackW / 2, plate[1].x, plate[2].x) + 0.1 * Lp;
    const base = [{ x: baseLeft, y: yb - 0.12 * Lp }, { x: baseRight, y: yb - 0.12 * Lp }, { x: baseRight, y: yb }, { x: baseLeft, y: yb }];
    const hinge = [{ x: c1.x - 0.8 * r, y: yb }, { x: c1.x + 0.8 * r, y: yb }, { x: c1.x + 0.8 * r, y: c1.y }, { x: c1.x - 0.8 * r, y: c1.y }];
    // The stack reaches the free roll exactly: L·sin a, drawn in proportion to the blocks.
    const H = c2.y - r - yb;
    const sum = h.blocks.reduce((t, b) => t + b.size, 0);
    const k = sum > 0 ? H / sum : 0;
    let y = yb;
    const stack = h.blocks.map((b, i) => {
      const rect = [{ x: c2.x - stackW / 2, y }, { x: c2.x + stackW / 2, y }, { x: c2.x + stackW / 2, y: y + b.size * k }, { x: c2.x - stackW / 2, y: y + b.size * k }];
      y += b.size * k;
      return { points: rect, kind: (h.unmakeable ? 'gauge missing' : i % 2 ? 'gauge odd' : 'gauge') as FixturePart['kind'] };
    });
    return {
      parts: [{ points: base, kind: 'base' }, { points: hinge, kind: 'base' }, ...(H > 0 ? stack : []), { points: plate, kind: 'plate' }],
      lines: [],
      rolls: [{ c: c1, r }, { c: c2, r }],
      names: [
        {
          at: { x: c1.x - r - 0.03 * Lp, y: c1.y - 0.5 * r },
          text: 'hinge roll',
          anchor: 'end',
          alts: [{ at: { x: c1.x + r + 0.03 * Lp, y: yb + 0.02 * Lp }, anchor: 'start' }, { at: { x: c1.x, y: yb - 0.12 * Lp - 0.1 * Lp }, anchor: 'middle' }],
        },
        {
          at: { x: c2.x + stackW / 2 + 0.04 * Lp, y: yb + Math.max(H / 2, 0.02 * Lp) },
          text: h.stackLabel,
          anchor: 'start',
          alts: [{ at: { x: c2.x - stackW / 2 - 0.04 * Lp, y: yb + Math.max(H / 2, 0.02 * Lp) }, anchor: 'end' }, { at: { x: c2.x, y: yb - 0.12 * Lp - 0.1 * Lp }, anchor: 'middle' }],
        },
        {
          at: { x: (c1.x + c2.x) / 2, y: yb - 0.08 * Lp },
          text: 'sine plate',
          anchor: 'middle',
          alts: [{ at: { x: baseRight - 0.05 * Lp, y: yb - 0.08 * Lp }, anchor: 'end' }, { at: { x: (c1.x + c2.x) / 2, y: yb - 0.12 * Lp - 0.1 * Lp }, anchor: 'middle' }],
        },
      ],
      extent: [...base, ...plate, { x: c1.x - r, y: c1.y }, { x: c2.x + r, y: c2.y + r }],
    };
  }

  if (h.kind === 'tilted-vise') {
    const tv = 0.45 * T;
    const k0 = -0.1 * P;
    const k1 = 1.1 * P;
    const body = [along(k0, -tv), along(k1, -tv), along(k1, 0), along(k0, 0)];
    const jawH = Math.max(0.15 * T, 0.55 * (T - d));
    const jaw = [along(k0, 0), along(k1, 0), along(k1, jawH), along(k0, jawH)];
    const pivot = body[0];
    const baseH = 0.35 * T;
    const baseLeft = pivot.x - 0.15 * P;
    const baseRight = Math.max(body[1].x, body[2].x) + 0.05 * P;
    const base = [{ x: baseLeft, y: pivot.y - baseH }, { x: baseRight, y: pivot.y - baseH }, { x: baseRight, y: pivot.y }, { x: baseLeft, y: pivot.y }];
    // The scale: a quadrant plate on the side, about the pivot, from level to a little past the
    // setting, marked every 5° (long marks every 10°), with the body's index line at the setting.
    const R = 0.35 * P;
    const endDeg = Math.min(90, (a * 180) / Math.PI + 12);
    const polar = (rad: number, deg: number): Point => ({ x: pivot.x + rad * Math.cos((deg * Math.PI) / 180), y: pivot.y + rad * Math.sin((deg * Math.PI) / 180) });
    const sector: Point[] = [pivot];
    for (let deg = 0; deg <= endDeg + 1e-9; deg += Math.max(1, endDeg / 24)) sector.push(polar(R, deg));
    sector.push(polar(R, endDeg));
    const ticks: (readonly [Point, Point])[] = [];
    for (let deg = 0; deg <= endDeg + 1e-9; deg += 5) ticks.push([polar(R * (deg % 10 === 0 ? 0.8 : 0.88), deg), polar(R, deg)]);
    const setting = (a * 180) / Math.PI;
    ticks.push([pivot, polar(R * 1.04, setting)]);
    return {
      parts: [{ points: base, kind: 'vise-base' }, { points: jaw, kind: 'vise-jaw' }, { points: body, kind: 'vise-body' }, { points: sector, kind: 'scale' }],
      lines: ticks,
      rolls: [{ c: pivot, r: 0.06 * T }],
      names: [{ at: { x: (baseLeft + baseRight) / 2, y: pivot.y - 0.7 * baseH }, text: 'tilting vise', anchor: 'middle' }],
      extent: [...base, ...body, ...jaw, ...sector],
    };
  }

  // Angle blocks in the vise: the wedge (thin end left) under the part, the jaw behind the work.
  const m = 0.3 * T;
  const right = P * c;
  const jawLeft = -0.08 * P - T * s;
  const jawRight = right + 0.08 * P;
  const blockLeft = Math.max(-0.15 * T * tan, -0.5 * m);
  const topLeft = blockLeft * tan;
  const block = [{ x: blockLeft, y: -m }, { x: right, y: -m }, { x: right, y: P * s }, { x: blockLeft, y: topLeft }];
  const baseH = 0.3 * T;
  const viseBase = [{ x: jawLeft, y: -m - baseH }, { x: jawRight, y: -m - baseH }, { x: jawRight, y: -m }, { x: jawLeft, y: -m }];
  const jawTop = P * s + 0.35 * (yCut - P * s);
  const viseJaw = [{ x: jawLeft, y: -m }, { x: jawRight, y: -m }, { x: jawRight, y: jawTop }, { x: jawLeft, y: jawTop }];
  // Wrung blocks: each joint rises from the thin end at the running total of the angles so far.
  const lines: [Point, Point][] = [];
  let total = 0;
  const n = h.blocks.length;
  for (let i = 0; i + 1 < n; i++) {
    total += blockDegrees(h.blocks[i]);
    const yLeft = -m + ((i + 1) * (topLeft + m)) / n;
    const topAt = (x: number) => x * tan;
    const yRight = Math.min(topAt(right), Math.max(-m, yLeft + Math.tan((total * Math.PI) / 180) * (right - blockLeft)));
    lines.push([{ x: blockLeft, y: yLeft }, { x: right, y: yRight }]);
  }
  const name = n > 1 ? `angle blocks ${h.blocks.join(' ')}` : 'angle block';
  return {
    parts: [{ points: viseJaw, kind: 'vise-jaw' }, { points: viseBase, kind: 'vise-base' }, { points: block, kind: 'block' }],
    lines,
    rolls: [],
    names: [
      { at: { x: right * 0.55, y: -m * 0.55 }, text: name, anchor: 'middle', alts: [{ at: { x: right * 0.5, y: -m - baseH - 0.25 * T }, anchor: 'middle' }] },
      {
        at: { x: jawLeft + 0.02 * P, y: -m - baseH * 0.7 },
        text: 'vise',
        anchor: 'start',
        alts: [{ at: { x: jawRight - 0.02 * P, y: -m - baseH * 0.7 }, anchor: 'end' }, { at: { x: jawLeft, y: -m - baseH - 0.25 * T }, anchor: 'start' }],
      },
    ],
    extent: [...viseBase, ...viseJaw],
  };
}

/** The signed angle of a block label ("5°", "+3°", "−30'") in degrees, for drawing its joint. */
function blockDegrees(label: string): number {
  const m = /^([+−-]?)(?:(\d+)°)?(?:(\d+)')?(?:([\d.]+)")?$/.exec(label);
  if (!m) return 0;
  const deg = Number(m[2] ?? 0) + Number(m[3] ?? 0) / 60 + Number(m[4] ?? 0) / 3600;
  return m[1] === '−' || m[1] === '-' ? -deg : deg;
}
