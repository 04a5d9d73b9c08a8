import type { Label } from './dimension';
import { type Bounds, round2 } from './view-fit';

/** How a label's text hangs off its anchor point. */
export type TextAnchor = 'start' | 'middle' | 'end';

/** A label with what is needed to estimate the room it takes. */
export interface PlacedLabel extends Label {
  /** Text anchor (SVG `text-anchor`). */
  readonly anchor: TextAnchor;
  /** Font size in view units. */
  readonly size: number;
}

/**
 * Width of one character as a share of the font size: a generous figure for the bold, tabular
 * figures and italic words the drawings use, so an estimate errs on the side of more room.
 */
const CHAR_WIDTH = 0.62;

/**
 * The box a label's text takes in view units, estimated from its length: width = characters ·
 * 0.62 · size, from 1.0 · size above the baseline to 0.3 · size below (the line box a browser
 * measures, a little taller than the letters), turned about the anchor
 * by the label's rotation (the box of the turned rectangle).
 */
export function labelBox(label: PlacedLabel): Bounds {
  const w = [...label.text].length * CHAR_WIDTH * label.size;
  const x0 = label.anchor === 'start' ? 0 : label.anchor === 'end' ? -w : -w / 2;
  const corners = [
    { x: x0, y: -1.0 * label.size },
    { x: x0 + w, y: -1.0 * label.size },
    { x: x0 + w, y: 0.3 * label.size },
    { x: x0, y: 0.3 * label.size },
  ];
  const r = (label.rotate * Math.PI) / 180;
  const cos = Math.cos(r);
  const sin = Math.sin(r);
  const xs = corners.map((c) => label.x + c.x * cos - c.y * sin);
  const ys = corners.map((c) => label.y + c.x * sin + c.y * cos);
  return { minX: round2(Math.min(...xs)), minY: round2(Math.min(...ys)), maxX: round2(Math.max(...xs)), maxY: round2(Math.max(...ys)) };
}

/** Whether two boxes overlap, or come closer than `gap`. */
export function boxesTouch(a: Bounds, b: Bounds, gap = 0): boolean {
  return a.minX < b.maxX + gap && b.minX < a.maxX + gap && a.minY < b.maxY + gap && b.minY < a.maxY + gap;
}

/** Whether a box lies inside a view box `width` × `height` (with `inset` to spare on every side). */
export function boxInside(box: Bounds, width: number, height: number, inset = 0): boolean {
  return box.minX >= inset && box.minY >= inset && box.maxX <= width - inset && box.maxY <= height - inset;
}

/**
 * The first of `candidates` whose box stays clear of every box in `taken` (by `gap`) and inside
 * the view; the first candidate when none does (the drawing must still say what it is).
 */
export function firstClear(candidates: readonly PlacedLabel[], taken: readonly Bounds[], view: { width: number; height: number }, gap = 2): PlacedLabel {
  if (!candidates.length) throw new Error('firstClear: needs at least one candidate');
  return (
    candidates.find((c) => {
      const box = labelBox(c);
      return boxInside(box, view.width, view.height) && taken.every((t) => !boxesTouch(box, t, gap));
    }) ?? candidates[0]
  );
}
