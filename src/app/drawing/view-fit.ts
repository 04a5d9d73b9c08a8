/** A point in model units (inches or millimetres, y up) or in view-box units (y down). */
export interface Point {
  readonly x: number;
  readonly y: number;
}

/** An axis-aligned box around some points. */
export interface Bounds {
  readonly minX: number;
  readonly minY: number;
  readonly maxX: number;
  readonly maxY: number;
}

/** How a model is fitted into a view box. */
export interface FitOptions {
  /** View-box width (the container's width in CSS pixels, so text keeps its size). */
  readonly width: number;
  /** Largest view-box height. */
  readonly maxHeight: number;
  /** Smallest view-box height (a flat model still leaves room for its dimensions). */
  readonly minHeight?: number;
  /** Free space kept on every side for dimensions and labels. */
  readonly margin: number;
  /** Free space on the right instead of `margin` (dimensions stacked beside the model). */
  readonly marginRight?: number;
}

/** A model fitted into a view box: the scale, the box and the mapping of model points. */
export interface ViewFit {
  /** View-box width. */
  readonly width: number;
  /** View-box height. */
  readonly height: number;
  /** View units per model unit (the same on both axes: the drawing is to scale). */
  readonly scale: number;
  /** The `viewBox` attribute text, "0 0 width height". */
  readonly viewBox: string;
  /** Maps a model point (y up) to view-box coordinates (y down), rounded to 0.01. */
  toView(p: Point): Point;
}

/** Rounds to 0.01, the finest step a drawing needs (keeps path text short and tests exact). */
export function round2(value: number): number {
  const r = Math.round(value * 100) / 100;
  return Object.is(r, -0) ? 0 : r;
}

/** The bounds of some points; throws for none (a drawing always has a model). */
export function boundsOf(points: readonly Point[]): Bounds {
  if (!points.length) throw new Error('boundsOf: needs at least one point');
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of points) {
    minX = Math.min(minX, p.x);
    minY = Math.min(minY, p.y);
    maxX = Math.max(maxX, p.x);
    maxY = Math.max(maxY, p.y);
  }
  return { minX, minY, maxX, maxY };
}

/**
 * Fits model bounds into a view box `width` wide, to scale on both axes, leaving `margin` on
 * every side (`marginRight` on the right when given) and centring the model in what is left. The height follows the model's shape within
 * [minHeight, maxHeight]; a zero-size model gets scale 1 rather than an infinite one.
 */
export function fitView(bounds: Bounds, options: FitOptions): ViewFit {
  const { width, maxHeight, margin } = options;
  const marginRight = options.marginRight ?? margin;
  const minHeight = Math.min(options.minHeight ?? 2 * margin, maxHeight);
  if (!(width > margin + marginRight) || !(maxHeight > 2 * margin)) {
    throw new Error(`fitView: width ${width} and maxHeight ${maxHeight} must exceed twice the margin ${margin}`);
  }
  const modelW = bounds.maxX - bounds.minX;
  const modelH = bounds.maxY - bounds.minY;
  const innerW = width - margin - marginRight;
  const scaleW = modelW > 0 ? innerW / modelW : Infinity;
  const scaleH = modelH > 0 ? (maxHeight - 2 * margin) / modelH : Infinity;
  const fitted = Math.min(scaleW, scaleH);
  const scale = Number.isFinite(fitted) ? fitted : 1;
  const height = Math.max(minHeight, Math.min(maxHeight, modelH * scale + 2 * margin));
  const offsetX = margin + (innerW - modelW * scale) / 2;
  const offsetY = (height - modelH * scale) / 2;
  const w = round2(width);
  const h = round2(height);
  return {
    width: w,
    height: h,
    scale,
    viewBox: `0 0 ${w} ${h}`,
    toView: (p) => ({ x: round2(offsetX + (p.x - bounds.minX) * scale), y: round2(h - offsetY - (p.y - bounds.minY) * scale) }),
  };
}
