import { type AngleArcGeometry, type DimensionGeometry, type Label, angleArc, dimensionLine } from '../drawing/dimension';
import { chordAtLevel, clipToLevel, hatchPath, polygonPath, polylinePath } from '../drawing/shapes';
import { type Point, boundsOf, fitView } from '../drawing/view-fit';

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
  /** Label texts already at the unit's resolution. */
  readonly labels: { readonly depthToStop: string; readonly faceLength: string; readonly endThickness: string; readonly angle: string; readonly cutter: string };
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

/** Everything the taper drawing binds: view box, outlines, marks and labels in view units. */
export interface TaperScene {
  readonly viewBox: string;
  readonly width: number;
  readonly height: number;
  /** The vise: base and the fixed jaw seen behind the work. */
  readonly viseBase: string;
  readonly viseJaw: string;
  /** The angle block under the part. */
  readonly block: string;
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
  /** Name labels of the block, vise and cutter. */
  readonly names: readonly Label[];
}

/** View-box height as a share of its width, and the free margin round the model. */
const MAX_HEIGHT_RATIO = 0.72;
const MARGIN = 64;
/** Room on the right for the end-thickness and depth-to-stop dimensions side by side. */
const MARGIN_RIGHT = 120;
/** Distance from the end face to the depth-to-stop dimension, clear of the end-thickness one. */
const DEPTH_DIM_CLEARANCE = 84;
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
  const P = Math.max(input.partLength, L);
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

  // Angle block, vise base and the fixed jaw behind the work: sizes in proportion to the part.
  const m = 0.3 * T;
  const right = P * c;
  const jawLeft = -0.08 * P - T * s;
  const jawRight = right + 0.08 * P;
  const blockLeft = Math.max(-0.15 * T * (s / Math.max(c, 1e-9)), -0.5 * m);
  const block = [{ x: blockLeft, y: -m }, { x: right, y: -m }, { x: right, y: P * s }, { x: blockLeft, y: blockLeft * (s / Math.max(c, 1e-9)) }];
  const baseH = 0.3 * T;
  const viseBase = [{ x: jawLeft, y: -m - baseH }, { x: jawRight, y: -m - baseH }, { x: jawRight, y: -m }, { x: jawLeft, y: -m }];
  const jawTop = P * s + 0.35 * (yCut - P * s);
  const viseJaw = [{ x: jawLeft, y: -m }, { x: jawRight, y: -m }, { x: jawRight, y: jawTop }, { x: jawLeft, y: jawTop }];

  // The cutter stands on the touch-off corner; drawn length is kept in proportion to the part.
  const D = input.cutterDiameter > 0 ? input.cutterDiameter : 0.5 * T;
  const fluteH = Math.min(Math.max(D, 0.8 * T), 1.5 * T);
  const shankH = 0.5 * T;
  const cutterFlutes = [{ x: corner.x - D / 2, y: yTop }, { x: corner.x + D / 2, y: yTop }, { x: corner.x + D / 2, y: yTop + fluteH }, { x: corner.x - D / 2, y: yTop + fluteH }];
  const shankW = D * 0.8;
  const cutterShank = [{ x: corner.x - shankW / 2, y: yTop + fluteH }, { x: corner.x + shankW / 2, y: yTop + fluteH }, { x: corner.x + shankW / 2, y: yTop + fluteH + shankH }, { x: corner.x - shankW / 2, y: yTop + fluteH + shankH }];

  const compact = width < COMPACT_WIDTH;
  const margin = compact ? COMPACT.margin : MARGIN;
  const fit = fitView(boundsOf([...viseBase, ...viseJaw, ...part, ...cutterShank, ...cutterFlutes]), {
    width,
    maxHeight: Math.max(2 * margin + 80, width * MAX_HEIGHT_RATIO),
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
  const passLabel = shownChord ? { ...v(shownChord[0]), rotate: 0, text: `Pass ${selected}` } : null;

  const cornerV = v(corner);
  const faceEndV = v(faceEnd);
  const depthA = v({ x: faceEnd.x, y: yTop });
  const depthOffset = Math.max(0, v(endBottom).x - faceEndV.x) + (compact ? COMPACT.clearance : DEPTH_DIM_CLEARANCE);
  const remaining = vs(remainingModel);
  const hatchSpacing = Math.max(6, Math.min(12, (yTop - yCut) * fit.scale / 3));
  const arcRadius = Math.min(90, Math.max(36, 0.3 * right * fit.scale));
  const origin = v({ x: 0, y: 0 });

  return {
    viewBox: fit.viewBox,
    width: fit.width,
    height: fit.height,
    viseBase: polygonPath(vs(viseBase)),
    viseJaw: polygonPath(vs(viseJaw)),
    block: polygonPath(vs(block)),
    part: polygonPath(vs(part)),
    toRemove: polygonPath(remaining),
    toRemoveHatch: hatchPath(remaining, hatchSpacing, 45),
    removed: polygonPath(vs(removedModel)),
    cutterFlutes: polygonPath(vs(cutterFlutes)),
    cutterShank: polygonPath(vs(cutterShank)),
    levelLine: polylinePath([origin, { x: origin.x + arcRadius + 16, y: origin.y }]),
    touchOff: cornerV,
    // Left of the cutter, so the cutter never covers it.
    touchOffLabel: { x: v({ x: corner.x - D / 2, y: yTop }).x - 8, y: cornerV.y - 6, rotate: 0, text: 'Touch off' },
    touchOffLevel: polylinePath([cornerV, depthA]),
    stopLevel: polylinePath([v(faceStart), faceEndV]),
    passLines,
    passLabel,
    depthDim: dimensionLine(depthA, faceEndV, depthOffset, input.labels.depthToStop),
    faceDim: dimensionLine(v(faceStart), faceEndV, (yTop - yCut) * fit.scale + 30, input.labels.faceLength),
    endDim: d < T - 1e-9 ? dimensionLine(faceEndV, v(endBottom), 30, input.labels.endThickness) : null,
    angleArc: angleArc(origin, arcRadius, 0, input.angleDeg, input.labels.angle),
    names: [
      { ...v({ x: right * 0.55, y: -m * 0.55 }), rotate: 0, text: 'angle block' },
      { ...v({ x: jawLeft + 0.02 * P, y: -m - baseH * 0.7 }), rotate: 0, text: 'vise' },
      { ...v({ x: corner.x - shankW / 2, y: yTop + fluteH + shankH * 0.5 }), rotate: 0, text: input.labels.cutter },
    ],
  };
}
