import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { type AngleArcGeometry, DIMENSION_STYLE, type DimensionGeometry, angleArc, dimensionLine, polarPoint } from '../drawing/dimension';
import { AngleArcMark, DimensionMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { hatchPath, polygonPath, polylinePath, segmentsPath } from '../drawing/shapes';
import { type Point, type ViewFit, fitView } from '../drawing/view-fit';
import { type Box, type LabelSpot, type PlacedLabel, boxAround, nearestOnBox, overlapArea, placeLabel, rotatedTextBox, textBox } from '../drawing/label-placement';
import { type LatheDimensionKey, type LathePoint, type LatheWorkInput, latheWorkGeometry } from './lathe-work-geometry';

/** Text of each dimension, by key (a missing key leaves that dimension off). */
export type LatheDimensionTexts = Partial<Record<LatheDimensionKey, string>>;

/** Whether `p` lies inside `box`. */
function inside(p: Point, box: Box): boolean {
  return p.x > box.x && p.x < box.x + box.width && p.y > box.y && p.y < box.y + box.height;
}

/** Whether the segment p→q passes through `box`, leaving out a unit at each end (Liang–Barsky clipping). */
function segmentCrosses(p: Point, q: Point, box: Box): boolean {
  const dx = q.x - p.x;
  const dy = q.y - p.y;
  const length = Math.hypot(dx, dy);
  if (!(length > 2)) return false;
  let t0 = 1 / length;
  let t1 = 1 - 1 / length;
  const edges: [number, number][] = [
    [-dx, p.x - box.x],
    [dx, box.x + box.width - p.x],
    [-dy, p.y - box.y],
    [dy, box.y + box.height - p.y],
  ];
  for (const [toward, room] of edges) {
    if (toward === 0) {
      if (room < 0) return false;
      continue;
    }
    const t = room / toward;
    if (toward < 0) t0 = Math.max(t0, t);
    else t1 = Math.min(t1, t);
    if (t0 > t1) return false;
  }
  return true;
}

/** Free space around the work for dimension labels, in view units. */
const MARGIN = 40;
/** Smallest gap between a feature and its dimension line on screen, in view units. */
const MIN_OFFSET = 22;

/**
 * The work between centres seen from above: the bar with its taper at the tail-stock end, the
 * stock the taper takes off shaded, the tool on the operator's side with its feed, the compound
 * rest at the half angle or the tail stock set over, dimensioned to scale.
 */
@Component({
  selector: 'sw-lathe-work-drawing',
  imports: [DimensionMark, AngleArcMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <figure class="figure">
      <svg class="drawing" [attr.viewBox]="fit().viewBox" role="img" aria-labelledby="lathe-title lathe-desc">
        <title id="lathe-title">{{ title() }}</title>
        <desc id="lathe-desc">{{ description() }}</desc>
        <path class="axis" [attr.d]="paths().latheAxis" />
        <path class="work" [attr.d]="paths().work" />
        <path class="removed" [attr.d]="paths().removed" />
        <path class="removed-hatch" [attr.d]="paths().removedHatch" />
        <path class="cut" [attr.d]="paths().cut" />
        <path class="work-axis" [attr.d]="paths().workAxis" />
        <path class="centre" [attr.d]="paths().head" />
        <path class="centre" [attr.d]="paths().tail" />
        <path class="slide" [attr.d]="paths().compound" />
        <path class="tool" [attr.d]="paths().tool" />
        <path class="feed" [attr.d]="paths().feed" />
        <path class="feed-head" [attr.d]="paths().feedHead" />
        <text class="side-note" [attr.x]="labels().note.x" [attr.y]="labels().note.y">operator’s side</text>
        @for (d of dimensions(); track d.key) {
          <g [swDimension]="d.geometry" />
        }
        @for (t of diameterLabels(); track t.key) {
          <path class="dia-leader" [attr.d]="t.leader" />
          <text class="dia-text" [attr.x]="t.x" [attr.y]="t.y" [attr.text-anchor]="t.anchor">{{ t.text }}</text>
        }
        @if (arc(); as a) {
          <g [swAngleArc]="a" />
          <path class="leader" [attr.d]="labels().angle.leader" />
          <text class="angle-text" [attr.x]="labels().angle.x" [attr.y]="labels().angle.y" [attr.text-anchor]="labels().angle.anchor">{{ angleText() }}</text>
        }
      </svg>
      @if (nominal()) {
        <figcaption class="note">Diameters not given: the bar is drawn 1 unit across to show the taper’s angle.</figcaption>
      }
    </figure>
  `,
  styles: `
    :host { display: block; }
    .figure { margin: 0; }
    .drawing { display: block; width: 100%; height: auto; background: var(--mat-sys-surface-container-lowest); border-radius: 12px; }
    .axis, .work-axis { stroke: var(--mat-sys-outline); stroke-width: 1; stroke-dasharray: 14 4 3 4; fill: none; }
    .work-axis { stroke: #8a4b00; }
    .work { fill: #dbe7ec; stroke: #1d3a45; stroke-width: 1.5; stroke-linejoin: round; }
    .removed { fill: #f7e3c6; stroke: none; }
    .removed-hatch { stroke: #8a4b00; stroke-width: 0.75; fill: none; }
    .cut { stroke: #b3261e; stroke-width: 2.5; fill: none; }
    .centre { fill: #9fb3bb; stroke: #1d3a45; stroke-width: 1; }
    .slide { fill: #e4e1ec; stroke: #47464f; stroke-width: 1; }
    .tool { fill: #47464f; stroke: none; }
    .feed { stroke: #47464f; stroke-width: 1.5; fill: none; }
    .feed-head { fill: #47464f; }
    .dia-text {
      font-size: 14px; font-weight: 600; fill: #0b4f6c; paint-order: stroke; stroke: #ffffff; stroke-width: 4px; stroke-linejoin: round;
    }
    .leader { stroke: #8a4b00; stroke-width: 0.75; fill: none; }
    .dia-leader { stroke: #0b4f6c; stroke-width: 0.75; fill: none; }
    .angle-text {
      fill: #8a4b00; font-size: 14px; font-weight: 600; dominant-baseline: middle;
      paint-order: stroke; stroke: #ffffff; stroke-width: 4px; stroke-linejoin: round;
    }
    .side-note { font-size: 12px; fill: var(--mat-sys-on-surface-variant); text-anchor: start; }
    .note { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); padding-top: 4px; }
    @media print { .drawing { background: none; } }
  `,
})
export class LatheWorkDrawing {
  /** The taper to draw. */
  readonly work = input.required<LatheWorkInput>();
  /** Text of each dimension. */
  readonly texts = input.required<LatheDimensionTexts>();
  /** Text of the angle arc (half angle or the work's tilt). */
  readonly angleText = input.required<string>();
  /** True when the diameters are stand-ins, not the user's. */
  readonly nominal = input(false);

  private readonly width = hostWidth();

  /** The geometry in drawing units. */
  protected readonly shape = computed(() => latheWorkGeometry(this.work()));

  /** The work fitted into the view box. */
  protected readonly fit = computed<ViewFit>(() => {
    const [x, y, w, h] = this.shape().bounds;
    return fitView({ minX: x, minY: -(y + h), maxX: x + w, maxY: -y }, { width: this.width(), maxHeight: 420, minHeight: 200, margin: MARGIN });
  });

  private readonly toView = computed(() => {
    const fit = this.fit();
    return (p: LathePoint): Point => fit.toView({ x: p.x, y: -p.y });
  });

  /** Every outline, in view units. */
  protected readonly paths = computed(() => {
    const s = this.shape();
    const v = this.toView();
    const removed = s.removed.map((tri) => tri.map(v));
    return {
      latheAxis: polylinePath(s.latheAxis.map(v)),
      workAxis: this.work().method === 'offset' ? polylinePath(s.workAxis.map(v)) : '',
      work: polygonPath(s.work.map(v)),
      removed: removed.map(polygonPath).join(''),
      removedHatch: removed.map((tri) => hatchPath(tri, 5, 45)).join(''),
      cut: polylinePath(s.cutEdge.map(v)),
      head: polygonPath(s.headCentre.map(v)),
      tail: polygonPath(s.tailCentre.map(v)),
      compound: polygonPath(s.compound.map(v)),
      tool: polygonPath(s.tool.map(v)),
      feed: polylinePath(s.feed.map(v)),
      feedHead: polygonPath(s.feedHead.map(v)),
    };
  });

  /** Where the "operator's side" note goes by choice: below the headstock centre. */
  private readonly operatorAt = computed(() => {
    const s = this.shape();
    const p = this.toView()(s.headCentre[2]);
    return { x: p.x, y: Math.min(this.fit().height - 8, p.y + 44) };
  });

  /** The dimensions that have a text, in view units. */
  protected readonly dimensions = computed<{ key: LatheDimensionKey; geometry: DimensionGeometry }[]>(() => {
    const texts = this.texts();
    const out: { key: LatheDimensionKey; geometry: DimensionGeometry }[] = [];
    for (const dim of this.dimensionEnds()) {
      const text = texts[dim.key];
      if (!text) continue;
      // Diameters are written level above the work (see diameterLabels): a bar is rarely tall enough for upright text.
      const own = dim.key === 'large' || dim.key === 'small' ? '' : text;
      out.push({ key: dim.key, geometry: dimensionLine(dim.a, dim.b, dim.offset, own) });
    }
    return out;
  });

  /**
   * Every dimension in view units: the measured points, the dimension line's ends (a2, b2), and
   * the ends of the line as drawn (longer when the arrows sit outside a short dimension).
   */
  private readonly dimensionEnds = computed(() => {
    const v = this.toView();
    const scale = this.fit().scale;
    const out: { key: LatheDimensionKey; a: Point; b: Point; a2: Point; b2: Point; lineFrom: Point; lineTo: Point; offset: number }[] = [];
    for (const dim of this.shape().dimensions) {
      const a = v(dim.from);
      const b = v(dim.to);
      const len = Math.hypot(b.x - a.x, b.y - a.y);
      if (!(len > 0)) continue;
      // The geometry's y is flipped on screen, so "left of from→to" stays left; keep a readable gap.
      const offset = dim.offset === 0 ? 0 : Math.sign(dim.offset) * Math.max(MIN_OFFSET, Math.abs(dim.offset) * scale);
      const u = { x: (b.x - a.x) / len, y: (b.y - a.y) / len };
      const n = { x: u.y, y: -u.x };
      const a2 = { x: a.x + n.x * offset, y: a.y + n.y * offset };
      const b2 = { x: b.x + n.x * offset, y: b.y + n.y * offset };
      const past = len < 2.5 * DIMENSION_STYLE.arrowLength ? 2 * DIMENSION_STYLE.arrowLength : 0;
      out.push({
        key: dim.key, a, b, a2, b2, offset,
        lineFrom: { x: a2.x - u.x * past, y: a2.y - u.y * past },
        lineTo: { x: b2.x + u.x * past, y: b2.y + u.y * past },
      });
    }
    return out;
  });

  /** What the angle's text must not cover: dimension and extension lines, the dimensions' texts, the tool, slide and centres. */
  private readonly fixedObstacles = computed<Box[]>(() => this.obstaclesWith(7));

  /**
   * The same for a diameter's text, with the dimension lines drawn tighter (a diameter's text sits
   * just off its own line, and beside a slanted taper length when the tail stock is set over).
   */
  private readonly diameterObstacles = computed<Box[]>(() => this.obstaclesWith(2));

  /** Boxes around the drawing's fixed marks, the dimension lines grown by `linePad`. */
  private obstaclesWith(linePad: number): Box[] {
    const v = this.toView();
    const s = this.shape();
    const texts = this.texts();
    const boxes: Box[] = [];
    for (const d of this.dimensions()) {
      if (d.geometry.label.text) boxes.push(rotatedTextBox(d.geometry.label.x, d.geometry.label.y, d.geometry.label.rotate, d.geometry.label.text));
    }
    for (const dim of this.dimensionEnds()) {
      if (!texts[dim.key]) continue;
      boxes.push(boxAround([dim.lineFrom, dim.lineTo], linePad));
      // The extension lines, from the feature to just past the dimension line.
      if (Math.abs(dim.offset) > DIMENSION_STYLE.extensionGap) {
        boxes.push(boxAround([dim.a, dim.a2], 3), boxAround([dim.b, dim.b2], 3));
      }
    }
    for (const outline of [s.tool, s.compound, s.feed, s.feedHead, s.headCentre, s.tailCentre]) {
      if (outline.length) boxes.push(boxAround(outline.map(v), 3));
    }
    return boxes;
  }

  /**
   * The diameters' texts, level: the large one just above the work at its dimension line; the
   * small one there too when it fits between the taper's extension line and the small end, else
   * below the small end's dimension line, or above the taper length, with a leader to its line.
   */
  protected readonly diameterLabels = computed(() => {
    const texts = this.texts();
    const fit = this.fit();
    const view: Box = { x: 2, y: 2, width: fit.width - 4, height: fit.height - 4 };
    const out: { key: string; x: number; y: number; text: string; anchor: 'start' | 'middle' | 'end'; leader: string; leaderEnds: Point[] }[] = [];
    // Text boxes are placed by their middle; the text's baseline sits 5 below it.
    const taken: Box[] = [];
    for (const key of ['large', 'small'] as const) {
      const text = texts[key];
      const dim = this.dimensionEnds().find((d) => d.key === key);
      if (!text || !dim) continue;
      // The dimension runs from the operator's side (a) up to the far side (b).
      const top = dim.lineTo.y < dim.lineFrom.y ? dim.lineTo : dim.lineFrom;
      const bottom = top === dim.lineTo ? dim.lineFrom : dim.lineTo;
      const above = { x: dim.b.x, y: Math.round(Math.min(dim.a.y, dim.b.y) - 8) };
      if (key === 'large') {
        // Over the end of its line (on a thin bar the arrows sit outside and the line runs on past
        // the work); moved left, to end short of the taper's extension line, when it would cross it.
        const y = Math.round(top.y - 8) - 5;
        const taperStart = this.dimensionEnds().find((d) => d.key === 'taper')?.a;
        const spots: LabelSpot[] = [{ x: above.x, y, anchor: 'middle' }, ...(taperStart ? [{ x: taperStart.x - 6, y, anchor: 'end' as const }] : [])];
        const placed = placeLabel(text, spots, this.diameterObstacles(), view);
        out.push({ key, x: placed.x, y: placed.y + 5, anchor: placed.anchor, text, leader: '', leaderEnds: [] });
        taken.push(placed.box);
        continue;
      }
      const taperText = this.dimensions().find((d) => d.key === 'taper')?.geometry.label;
      const candidates: LabelSpot[] = [
        { x: above.x - 6, y: above.y, anchor: 'end' },
        { x: bottom.x + 4, y: Math.round(bottom.y + 16), anchor: 'end' },
        ...(taperText ? [{ x: top.x + 4, y: Math.round(taperText.y - 20), anchor: 'end' as const }] : []),
      ];
      // Middle-of-text spots for placeLabel, turned back to baselines below.
      const spots = candidates.map((c) => ({ ...c, y: c.y - 5 }));
      const placed = placeLabel(text, spots, [...this.diameterObstacles(), ...taken], view);
      const spot = { x: placed.x, y: placed.y + 5, anchor: placed.anchor };
      const first = spot.x === candidates[0].x && spot.y === candidates[0].y;
      // Away from its line, a leader runs from the line's nearer end to the text.
      const end = spot.y > bottom.y ? bottom : top;
      const to = nearestOnBox(placed.box, end);
      const leaderEnds = first || Math.hypot(to.x - end.x, to.y - end.y) < 4 ? [] : [end, to];
      out.push({ key, ...spot, text, leader: leaderEnds.length ? segmentsPath([[end, to]]) : '', leaderEnds });
      taken.push(placed.box);
    }
    return out;
  });

  /** The angle's arc, or null when there is no angle to show. */
  protected readonly arc = computed<AngleArcGeometry | null>(() => {
    const a = this.shape().angle;
    if (Math.abs(a.toDeg - a.fromDeg) < 1e-9) return null;
    return angleArc(this.toView()(a.vertex), Math.max(30, a.radius * this.fit().scale), a.fromDeg, a.toDeg, '');
  });

  /**
   * The angle's text where it covers no dimension, diameter, tool, slide or centre: just past the
   * arc first, then below or above the work, with a leader to the arc when it had to move away.
   * On a narrow drawing the "operator's side" note gives way to it: the note moves below the work
   * length's dimension when that clears a spot the angle's text could not otherwise have.
   */
  protected readonly labels = computed<{ angle: PlacedLabel & { leader: string }; note: { x: number; y: number } }>(() => {
    const preferred = this.operatorAt();
    const first = this.placeAngle(preferred);
    if (first.clutter === 0) return { angle: first.label, note: preferred };
    const work = this.dimensions().find((d) => d.key === 'work')?.geometry.label;
    if (!work) return { angle: first.label, note: preferred };
    const moved = { x: preferred.x, y: Math.min(this.fit().height - 6, Math.round(work.y + 18)) };
    const second = this.placeAngle(moved);
    return second.clutter < first.clutter ? { angle: second.label, note: moved } : { angle: first.label, note: preferred };
  });

  /** Places the angle's text with the note at `note`, and says how much it overlaps (0: clear). */
  private placeAngle(note: { x: number; y: number }): { label: PlacedLabel & { leader: string }; clutter: number } {
    const a = this.shape().angle;
    const fit = this.fit();
    const c = this.toView()(a.vertex);
    const radius = Math.max(30, a.radius * fit.scale);
    const mid = (a.fromDeg + a.toDeg) / 2;
    const onArc = polarPoint(c, radius, mid);
    const end = polarPoint(c, radius, a.toDeg);
    const text = this.angleText();
    const candidates = [0, 16, 34, 56, 80].flatMap((down) => [
      { x: end.x + 8, y: end.y + 16 + down, anchor: 'start' as const },
      { x: end.x - 8, y: end.y + 16 + down, anchor: 'end' as const },
      { x: onArc.x, y: onArc.y + 18 + down, anchor: 'middle' as const },
      { x: c.x - 8, y: c.y + 16 + down, anchor: 'end' as const },
      { x: end.x + 8, y: end.y - 20 - down, anchor: 'start' as const },
      { x: c.x - 8, y: c.y - 20 - down, anchor: 'end' as const },
    ]);
    const view: Box = { x: 2, y: 2, width: fit.width - 4, height: fit.height - 4 };
    const obstacles = [...this.fixedObstacles(), ...this.diameterBoxes(), textBox({ x: note.x, y: note.y - 4, anchor: 'start' }, 'operator’s side', 7)];
    // A leader should not cross a text or run across the work (the arc is on the operator's side),
    // nor a dimension line; crossing the slide or the feed arrow matters less than covering an
    // arrow with the text. Passing the tool's point is allowed.
    const v = this.toView();
    const s = this.shape();
    const work = boxAround(s.work.map(v), -2);
    const crossings: [Box, number][] = [
      ...(inside(onArc, work) ? [] : [[work, 400] as [Box, number]]),
      ...this.diameterBoxes().map((b): [Box, number] => [b, 400]),
      ...this.dimensions().filter((d) => d.geometry.label.text).map((d): [Box, number] => [rotatedTextBox(d.geometry.label.x, d.geometry.label.y, d.geometry.label.rotate, d.geometry.label.text), 400]),
      ...this.dimensionEnds().filter((d) => this.texts()[d.key]).map((d): [Box, number] => [boxAround([d.lineFrom, d.lineTo], 1), 200]),
      ...[s.compound, s.feed].filter((o) => o.length).map((o): [Box, number] => [boxAround(o.map(v), 1), 50]),
    ];
    let best: { label: PlacedLabel & { leader: string }; clutter: number } | null = null;
    for (const spot of candidates) {
      const box = textBox(spot, text);
      const to = nearestOnBox(box, onArc);
      const far = Math.hypot(to.x - onArc.x, to.y - onArc.y) > 14;
      const crossed = far ? crossings.reduce((sum, [b, weight]) => sum + (segmentCrosses(onArc, to, b) ? weight : 0), 0) : 0;
      const clutter = obstacles.reduce((sum, o) => sum + overlapArea(box, o), 0) + 2 * (box.width * box.height - overlapArea(box, view)) + crossed;
      if (!best || clutter < best.clutter) best = { label: { ...spot, box, leader: far ? segmentsPath([[onArc, to]]) : '' }, clutter };
      if (clutter === 0) break;
    }
    return best!;
  }

  /** The boxes the diameters' texts (and their leaders) cover. */
  private readonly diameterBoxes = computed<Box[]>(() => {
    const boxes: Box[] = [];
    for (const t of this.diameterLabels()) {
      boxes.push(textBox({ x: t.x, y: t.y - 5, anchor: t.anchor }, t.text));
      if (t.leaderEnds.length) boxes.push(boxAround(t.leaderEnds, 2));
    }
    return boxes;
  });

  /** The drawing's accessible name. */
  protected readonly title = computed(() =>
    this.work().method === 'offset' ? 'Taper turned between centres with the tail stock set over' : 'Taper turned between centres with the compound rest at the half angle',
  );

  /** What the dimensions say. */
  protected readonly description = computed(() => {
    const t = this.texts();
    const parts = [
      t.large && `large diameter ${t.large}`,
      t.small && `small diameter ${t.small}`,
      t.taper && `taper length ${t.taper}`,
      t.work && `work length between centres ${t.work}`,
      t.offset && `tail-stock offset ${t.offset}`,
      `angle ${this.angleText()}`,
    ].filter(Boolean);
    return `Dimensions: ${parts.join(', ')}.`;
  });
}
