import { type AngleArcGeometry, type DimensionGeometry, angleArc, dimensionLine } from '../drawing/dimension';
import { polygonPath, polylinePath, spreadPositions } from '../drawing/shapes';
import { type Point, boundsOf, fitView, round2 } from '../drawing/view-fit';

/** One gauge block of the stack, bottom first. */
export interface StackBlock {
  /** Size as a number (for drawing). */
  readonly size: number;
  /** Size as marked on the block. */
  readonly label: string;
}

/** What the sine-bar drawing is drawn from. */
export interface SineBarSceneInput {
  /** Roll centre distance L. */
  readonly barLength: number;
  /** Angle of the bar θ, degrees. */
  readonly angleDeg: number;
  /** Stack height H (used when there are no blocks to draw). */
  readonly stackHeight: number;
  /** The blocks under the roll, bottom first; empty for one plain stack. */
  readonly blocks: readonly StackBlock[];
  /** Label texts at the unit's resolution. */
  readonly labels: { readonly barLength: string; readonly stackHeight: string; readonly angle: string };
}

/** A block drawn in the view, with its label and leader. */
export interface DrawnBlock {
  readonly d: string;
  readonly label: string;
  readonly labelX: number;
  readonly labelY: number;
  readonly leader: string;
}

/** Everything the sine-bar drawing binds. */
export interface SineBarScene {
  readonly viewBox: string;
  readonly plate: string;
  readonly bar: string;
  readonly rolls: readonly { readonly cx: number; readonly cy: number; readonly r: number }[];
  readonly blocks: readonly DrawnBlock[];
  readonly levelLine: string;
  readonly centreLine: string;
  readonly lengthDim: DimensionGeometry;
  readonly heightDim: DimensionGeometry | null;
  readonly angleArc: AngleArcGeometry;
}

const MARGIN = 56;
/** Room right of the plate for the block labels and the stack-height dimension beside them. */
const MARGIN_RIGHT = 100;
/** Distance from the block labels' left edge to the stack-height dimension (a 6-figure label is about 48 units). */
const HEIGHT_DIM_GAP = 62;
/**
 * How far a block label's point keeps inside the stack's top and bottom lines. Its figures (13
 * units, baseline 4 below the point) reach about 0.7·13 = 9.1 above the baseline: 5.1 above the
 * point and 4 below it, each with 2 to spare for the text's halo.
 */
const LABEL_CLEAR_OF_TOP_LINE = 7.5;
const LABEL_CLEAR_OF_BOTTOM_LINE = 6.5;
/** Gap between stacked block labels, view units (one line of 13-unit text). */
const LABEL_GAP = 16;
/** The closest block labels come when the stack is short for them: figures 9.1 high, about 4 apart. */
const LABEL_GAP_TIGHT = 13;

/**
 * Lays out a sine bar on its rolls, to scale: the surface plate at y = 0, the low roll of
 * radius r = 0.08·L on the plate at (0, r), the high roll's centre at (L·cos θ, r + L·sin θ)
 * resting on the stack whose top is then at L·sin θ = H (REFERENCE.md §2: H = L·sin θ).
 * The blocks stand under the high roll bottom first, each as tall as its size.
 */
export function sineBarScene(input: SineBarSceneInput, width: number): SineBarScene {
  const L = input.barLength;
  const a = (input.angleDeg * Math.PI) / 180;
  const u = { x: Math.cos(a), y: Math.sin(a) };
  const n = { x: -Math.sin(a), y: Math.cos(a) };
  const r = 0.08 * L;
  const c1 = { x: 0, y: r };
  const c2 = { x: L * u.x, y: r + L * u.y };
  const H = input.blocks.length ? input.blocks.reduce((sum, b) => sum + b.size, 0) : input.stackHeight;
  const along = (p: Point, k: number, m: number): Point => ({ x: p.x + u.x * k + n.x * m, y: p.y + u.y * k + n.y * m });
  const overhang = 0.12 * L;
  const barH = 0.16 * L;
  const bar = [along(c1, -overhang, 0), along(c2, overhang, 0), along(c2, overhang, barH), along(c1, -overhang, barH)];
  const stackW = 0.22 * L;
  const plate = [{ x: -0.25 * L, y: -0.05 * L }, { x: c2.x + stackW + 0.3 * L, y: -0.05 * L }, { x: c2.x + stackW + 0.3 * L, y: 0 }, { x: -0.25 * L, y: 0 }];

  const fit = fitView(boundsOf([...bar, ...plate, { x: c1.x - r, y: 0 }, { x: c2.x + r, y: c2.y + r }]), {
    width,
    maxHeight: Math.max(2 * MARGIN + 120, width * 0.62),
    minHeight: 220,
    margin: MARGIN,
    marginRight: MARGIN_RIGHT,
  });
  const v = fit.toView;
  const vs = (pts: readonly Point[]) => pts.map(v);

  const pieces = input.blocks.length ? input.blocks : H > 0 ? [{ size: H, label: input.labels.stackHeight }] : [];
  const left = c2.x - stackW / 2;
  const right = c2.x + stackW / 2;
  let y = 0;
  const raw = pieces.map((b) => {
    const rect = [{ x: left, y }, { x: right, y }, { x: right, y: y + b.size }, { x: left, y: y + b.size }];
    const mid = v({ x: right, y: y + b.size / 2 });
    y += b.size;
    return { rect, mid, label: b.label };
  });
  // Labels go right of the stack, top block first on screen, spread so thin blocks stay readable.
  // The stack-height dimension's top extension line runs right from the stack's top face through
  // the label column, so the top label starts a text's half height and a little below it.
  const order = raw.map((_, i) => i).reverse();
  // The bottom extension line likewise; when the labels do not fit between the two at a full
  // line's gap, they close up to a little more than the text's height first.
  const belowTopLine = v({ x: 0, y: H }).y + LABEL_CLEAR_OF_TOP_LINE;
  const aboveBottomLine = v({ x: 0, y: 0 }).y - LABEL_CLEAR_OF_BOTTOM_LINE;
  const room = (aboveBottomLine - belowTopLine) / Math.max(1, raw.length - 1);
  const gap = Math.min(LABEL_GAP, Math.max(LABEL_GAP_TIGHT, room));
  const spread = spreadPositions(order.map((i) => Math.max(raw[i].mid.y, belowTopLine)), gap, aboveBottomLine);
  const labelX = round2(v({ x: right, y: 0 }).x + 36);
  const blocks: DrawnBlock[] = raw.map((b, i) => {
    const labelY = spread[order.indexOf(i)];
    return {
      d: polygonPath(vs(b.rect)),
      label: b.label,
      labelX,
      labelY,
      leader: polylinePath([{ x: b.mid.x + 2, y: b.mid.y }, { x: labelX - 4, y: labelY }]),
    };
  });

  const c1v = v(c1);
  const c2v = v(c2);
  const arcRadius = Math.min(110, Math.max(40, 0.35 * L * fit.scale));
  const stackTop = v({ x: right, y: H });
  const plateRight = v({ x: right, y: 0 });
  return {
    viewBox: fit.viewBox,
    plate: polygonPath(vs(plate)),
    bar: polygonPath(vs(bar)),
    rolls: [c1v, c2v].map((c) => ({ cx: c.x, cy: c.y, r: round2(r * fit.scale) })),
    blocks,
    levelLine: polylinePath([c1v, { x: c1v.x + arcRadius + 18, y: c1v.y }]),
    centreLine: polylinePath([c1v, c2v]),
    lengthDim: dimensionLine(c1v, c2v, barH * fit.scale + 26, input.labels.barLength),
    heightDim: H > 0 ? dimensionLine(stackTop, plateRight, labelX - plateRight.x + HEIGHT_DIM_GAP, input.labels.stackHeight) : null,
    angleArc: angleArc(c1v, arcRadius, 0, input.angleDeg, input.labels.angle),
  };
}
