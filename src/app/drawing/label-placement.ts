/**
 * Places a free label (an angle's value) in a drawing where it covers nothing else: tries spots in
 * order of preference and takes the first whose text box stays inside the view and clear of every
 * obstacle, else the spot that overlaps least. Pure view-unit arithmetic, no DOM.
 */

/** An axis-aligned box in view units. */
export interface Box {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

/** Where a label may go: its anchor point and how the text hangs off it; y is the text's middle. */
export interface LabelSpot {
  readonly x: number;
  readonly y: number;
  readonly anchor: 'start' | 'middle' | 'end';
}

/** A chosen spot with the box its text covers. */
export interface PlacedLabel extends LabelSpot {
  readonly box: Box;
}

/** Average advance of a 14 px semibold character (digits, degree and minute signs), view units. */
export const CHAR_WIDTH = 8.2;
/** Height of a 14 px label's box. */
export const LABEL_HEIGHT = 16;

/** The box a label's text covers at a spot (estimated from its length). */
export function textBox(spot: LabelSpot, text: string, charWidth = CHAR_WIDTH, height = LABEL_HEIGHT): Box {
  const width = Math.max(text.length, 1) * charWidth;
  const x = spot.anchor === 'start' ? spot.x : spot.anchor === 'end' ? spot.x - width : spot.x - width / 2;
  return { x, y: spot.y - height / 2, width, height };
}

/** The box of a rotated label (0° or ±90°) whose text's baseline centre is at (x, y). */
export function rotatedTextBox(x: number, y: number, rotate: number, text: string): Box {
  const length = Math.max(text.length, 1) * CHAR_WIDTH;
  if (Math.abs(Math.abs(rotate) - 90) < 1) return { x: x - LABEL_HEIGHT, y: y - length / 2, width: LABEL_HEIGHT + 2, height: length };
  return { x: x - length / 2, y: y - LABEL_HEIGHT + 3, width: length, height: LABEL_HEIGHT };
}

/** The box around a list of points, grown by `pad` on every side. */
export function boxAround(points: readonly { x: number; y: number }[], pad = 0): Box {
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  const x = Math.min(...xs) - pad;
  const y = Math.min(...ys) - pad;
  return { x, y, width: Math.max(...xs) + pad - x, height: Math.max(...ys) + pad - y };
}

/** Area two boxes share (0 when apart). */
export function overlapArea(a: Box, b: Box): number {
  const w = Math.min(a.x + a.width, b.x + b.width) - Math.max(a.x, b.x);
  const h = Math.min(a.y + a.height, b.y + b.height) - Math.max(a.y, b.y);
  return w > 0 && h > 0 ? w * h : 0;
}

/** How much of `box` lies outside `view`. */
function outsideArea(box: Box, view: Box): number {
  return box.width * box.height - overlapArea(box, view);
}

/**
 * The first spot whose text box lies inside `view` and overlaps no obstacle; when none is clear,
 * the spot with the least overlap (outside the view counts as overlap). `candidates` must not be empty.
 */
export function placeLabel(text: string, candidates: readonly LabelSpot[], obstacles: readonly Box[], view: Box): PlacedLabel {
  let best: PlacedLabel | null = null;
  let bestCost = Infinity;
  for (const spot of candidates) {
    const box = textBox(spot, text);
    const cost = outsideArea(box, view) * 2 + obstacles.reduce((sum, o) => sum + overlapArea(box, o), 0);
    if (cost === 0) return { ...spot, box };
    if (cost < bestCost) {
      best = { ...spot, box };
      bestCost = cost;
    }
  }
  if (!best) throw new Error('placeLabel: no candidate spots');
  return best;
}

/** The point of `box` nearest to `p`: where a leader line from `p` meets the label. */
export function nearestOnBox(box: Box, p: { x: number; y: number }): { x: number; y: number } {
  return { x: Math.min(Math.max(p.x, box.x), box.x + box.width), y: Math.min(Math.max(p.y, box.y), box.y + box.height) };
}
