import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { type AngleArcGeometry, type DimensionGeometry, angleArc, dimensionLine, polarPoint } from '../drawing/dimension';
import { AngleArcMark, DimensionMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { hatchPath, polygonPath, polylinePath, segmentsPath } from '../drawing/shapes';
import { type Point, type ViewFit, fitView } from '../drawing/view-fit';
import { type Box, type PlacedLabel, boxAround, nearestOnBox, placeLabel, rotatedTextBox, textBox } from '../drawing/label-placement';
import { type LatheDimensionKey, type LathePoint, type LatheWorkInput, latheWorkGeometry } from './lathe-work-geometry';

/** Text of each dimension, by key (a missing key leaves that dimension off). */
export type LatheDimensionTexts = Partial<Record<LatheDimensionKey, string>>;

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
        <text class="side-note" [attr.x]="operatorAt().x" [attr.y]="operatorAt().y">operator’s side</text>
        @for (d of dimensions(); track d.key) {
          <g [swDimension]="d.geometry" />
        }
        @for (t of diameterLabels(); track t.key) {
          <text class="dia-text" [attr.x]="t.x" [attr.y]="t.y" [attr.text-anchor]="t.anchor">{{ t.text }}</text>
        }
        @if (arc(); as a) {
          <g [swAngleArc]="a" />
          <path class="leader" [attr.d]="angleLabel().leader" />
          <text class="angle-text" [attr.x]="angleLabel().x" [attr.y]="angleLabel().y" [attr.text-anchor]="angleLabel().anchor">{{ angleText() }}</text>
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

  /** Where the "operator's side" note goes: below the headstock centre. */
  protected readonly operatorAt = computed(() => {
    const s = this.shape();
    const p = this.toView()(s.headCentre[2]);
    return { x: p.x, y: Math.min(this.fit().height - 8, p.y + 44) };
  });

  /** The dimensions that have a text, in view units. */
  protected readonly dimensions = computed<{ key: LatheDimensionKey; geometry: DimensionGeometry }[]>(() => {
    const v = this.toView();
    const scale = this.fit().scale;
    const texts = this.texts();
    const out: { key: LatheDimensionKey; geometry: DimensionGeometry }[] = [];
    for (const dim of this.shape().dimensions) {
      const text = texts[dim.key];
      const a = v(dim.from);
      const b = v(dim.to);
      if (!text || (a.x === b.x && a.y === b.y)) continue;
      // The geometry's y is flipped on screen, so "left of from→to" stays left; keep a readable gap.
      const offset = dim.offset === 0 ? 0 : Math.sign(dim.offset) * Math.max(MIN_OFFSET, Math.abs(dim.offset) * scale);
      // Diameters are written level above the work (see diameterLabels): a bar is rarely tall enough for upright text.
      const own = dim.key === 'large' || dim.key === 'small' ? '' : text;
      out.push({ key: dim.key, geometry: dimensionLine(a, b, offset, own) });
    }
    return out;
  });

  /** The diameters' texts, level, just above the work at their dimension lines. */
  protected readonly diameterLabels = computed(() => {
    const v = this.toView();
    const texts = this.texts();
    const out: { key: string; x: number; y: number; text: string; anchor: string }[] = [];
    for (const dim of this.shape().dimensions) {
      if (dim.key !== 'large' && dim.key !== 'small') continue;
      const text = texts[dim.key];
      if (!text) continue;
      const top = v(dim.to);
      const small = dim.key === 'small';
      out.push({ key: dim.key, x: top.x + (small ? -6 : 0), y: Math.round(top.y - 8), text, anchor: small ? 'end' : 'middle' });
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
   */
  protected readonly angleLabel = computed<PlacedLabel & { leader: string }>(() => {
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
    const placed = placeLabel(text, candidates, this.obstacles(), { x: 2, y: 2, width: fit.width - 4, height: fit.height - 4 });
    const to = nearestOnBox(placed.box, onArc);
    const far = Math.hypot(to.x - onArc.x, to.y - onArc.y) > 14;
    return { ...placed, leader: far ? segmentsPath([[onArc, to]]) : '' };
  });

  /** What the angle's text must not cover. */
  private readonly obstacles = computed<Box[]>(() => {
    const v = this.toView();
    const s = this.shape();
    const boxes: Box[] = [];
    for (const d of this.dimensions()) boxes.push(rotatedTextBox(d.geometry.label.x, d.geometry.label.y, d.geometry.label.rotate, d.geometry.label.text));
    // Dimension lines and their arrows, from the measured points and offsets.
    for (const dim of s.dimensions) {
      const a = v(dim.from);
      const b = v(dim.to);
      const len = Math.hypot(b.x - a.x, b.y - a.y);
      if (!(len > 0)) continue;
      const own = this.dimensions().find((d) => d.key === dim.key);
      if (!own) continue;
      const scale = this.fit().scale;
      const off = dim.offset === 0 ? 0 : Math.sign(dim.offset) * Math.max(MIN_OFFSET, Math.abs(dim.offset) * scale);
      const n = { x: (b.y - a.y) / len, y: -(b.x - a.x) / len };
      boxes.push(boxAround([{ x: a.x + n.x * off, y: a.y + n.y * off }, { x: b.x + n.x * off, y: b.y + n.y * off }], 7));
    }
    for (const t of this.diameterLabels()) boxes.push(textBox({ x: t.x, y: t.y - 5, anchor: t.anchor as 'start' | 'middle' | 'end' }, t.text));
    const note = this.operatorAt();
    boxes.push(textBox({ x: note.x, y: note.y - 4, anchor: 'start' }, 'operator’s side', 7));
    for (const outline of [s.tool, s.compound, s.feed, s.feedHead, s.headCentre, s.tailCentre]) {
      if (outline.length) boxes.push(boxAround(outline.map(v), 3));
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
