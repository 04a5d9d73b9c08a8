import { type DimensionGeometry, dimensionLine } from '../drawing/dimension';
import { polygonPath, polylinePath, spreadPositions } from '../drawing/shapes';
import { round2 } from '../drawing/view-fit';

/** One block of a stack in wringing order (first = bottom). */
export interface GaugeBlockPiece {
  /** Size as a number, for drawing. */
  readonly size: number;
  /** Size as marked. */
  readonly label: string;
  /** Whether it is a wear block. */
  readonly wear?: boolean;
}

/** What the two-stack drawing is drawn from. */
export interface GaugeStackSceneInput {
  /** Stack length (both stacks make it). */
  readonly target: number;
  /** The fewest-blocks stack, bottom first. */
  readonly fewest: readonly GaugeBlockPiece[];
  /** The last-digit-method stack, bottom first, or null when that method gets stuck. */
  readonly lastDigit: readonly GaugeBlockPiece[] | null;
  /** The stack length as text with unit. */
  readonly totalLabel: string;
}

/** A block drawn in a column. */
export interface DrawnPiece {
  readonly d: string;
  readonly label: string;
  readonly wear: boolean;
  readonly labelX: number;
  readonly labelY: number;
  readonly leader: string;
}

/** A drawn stack with its heading. */
export interface DrawnStack {
  readonly title: string;
  readonly titleX: number;
  readonly pieces: readonly DrawnPiece[];
  /** Which side its labels are on (text anchor). */
  readonly anchor: 'start' | 'end';
}

/** Everything the gauge-stack drawing binds. */
export interface GaugeStackScene {
  readonly viewBox: string;
  readonly height: number;
  readonly titleY: number;
  /** Laid out for a phone: the headings in their short form and smaller. */
  readonly narrow: boolean;
  readonly stacks: readonly DrawnStack[];
  readonly totalDim: DimensionGeometry;
  readonly baseLine: string;
}

const TOP = 48;
const BOTTOM = 36;
const LABEL_GAP = 16;
const LEADER = 30;
/** Below this width (view units = CSS pixels) the two stacks are laid out for a phone. */
const NARROW = 520;

/**
 * Lays out the fewest-blocks stack beside the last-digit-method stack, each block as tall as its
 * size (one vertical scale: stack length to the free height) and a fixed column width, labels
 * spread beside each column (fewest on its left, last-digit on its right) and the stack length
 * dimensioned between them. Both stacks stand on one base line.
 */
export function gaugeStackScene(input: GaugeStackSceneInput, width: number): GaugeStackScene {
  const height = round2(Math.min(520, Math.max(300, width * 0.7)));
  const base = height - BOTTOM;
  const scale = input.target > 0 ? (height - TOP - BOTTOM) / input.target : 0;
  const colW = Math.min(110, width * 0.18);
  // On a narrow screen the columns move left so the right-hand labels stay inside the drawing.
  const narrow = width < NARROW;
  const centres = input.lastDigit ? (narrow ? [width * 0.3, width * 0.66] : [width * 0.33, width * 0.72]) : [width * 0.5];

  const column = (pieces: readonly GaugeBlockPiece[], centre: number, anchor: 'start' | 'end', title: string): DrawnStack => {
    const left = centre - colW / 2;
    const right = centre + colW / 2;
    let cum = 0;
    const raw = pieces.map((p) => {
      const y0 = base - cum * scale;
      cum += p.size;
      const y1 = base - cum * scale;
      return { p, y0, y1 };
    });
    const order = raw.map((_, i) => i).reverse();
    const spread = spreadPositions(order.map((i) => (raw[i].y0 + raw[i].y1) / 2), LABEL_GAP, base);
    const edge = anchor === 'end' ? left : right;
    const labelX = round2(anchor === 'end' ? left - LEADER : right + LEADER);
    return {
      title,
      titleX: round2(centre),
      anchor,
      pieces: raw.map((r, i) => {
        const labelY = spread[order.indexOf(i)];
        const mid = (r.y0 + r.y1) / 2;
        return {
          d: polygonPath([{ x: left, y: r.y0 }, { x: right, y: r.y0 }, { x: right, y: r.y1 }, { x: left, y: r.y1 }]),
          label: r.p.label,
          wear: r.p.wear === true,
          labelX,
          labelY,
          leader: polylinePath([{ x: edge, y: mid }, { x: labelX + (anchor === 'end' ? 4 : -4), y: labelY }]),
        };
      }),
    };
  };

  const count = (pieces: readonly GaugeBlockPiece[]) => `${pieces.length} ${pieces.length === 1 ? 'block' : 'blocks'}`;
  const stacks = [column(input.fewest, centres[0], 'end', `Fewest: ${count(input.fewest)}`)];
  // The two headings fit side by side on a narrow screen in their short form.
  if (input.lastDigit) stacks.push(column(input.lastDigit, centres[1], 'start', `${narrow ? 'Last digit' : 'Last-digit method'}: ${count(input.lastDigit)}`));

  const right0 = centres[0] + colW / 2;
  const gap = input.lastDigit ? centres[1] - colW / 2 - right0 : 60;
  const top = base - input.target * scale;
  return {
    viewBox: `0 0 ${round2(width)} ${height}`,
    narrow,
    height,
    titleY: 24,
    stacks,
    totalDim: dimensionLine({ x: right0, y: top }, { x: right0, y: base }, gap / 2, input.totalLabel),
    baseLine: polylinePath([{ x: width * 0.08, y: base }, { x: width * 0.92, y: base }]),
  };
}
