import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { type AngleArcGeometry, type DimensionGeometry, angleArc, dimensionLine, polarPoint } from '../drawing/dimension';
import { AngleArcMark, DimensionMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { hatchPath, polygonPath, segmentsPath } from '../drawing/shapes';
import { type Point, type ViewFit, fitView } from '../drawing/view-fit';
import { type DovetailInput, type RollDimensionKey, type RollPoint, type RollShape, type VGrooveInput, dovetailGeometry, vGrooveGeometry } from './roll-geometry';

/** What to draw: a dovetail or a V-groove. */
export type RollSubject = ({ kind: 'dovetail' } & DovetailInput) | ({ kind: 'v-groove' } & VGrooveInput);

/** Text of each dimension, by key (a missing key leaves that dimension off). */
export type RollDimensionTexts = Partial<Record<RollDimensionKey, string>>;

/** Free space around the section for dimension labels, in view units. */
const MARGIN = 44;
/** Smallest gap between a feature and its dimension line on screen, in view units. */
const MIN_OFFSET = 22;

/**
 * The section of a dovetail (male or female) or a V-groove with its rolls or pin, the measurement
 * line over or between the rolls (or to the pin's top), the corner width, the depth and the
 * angle, drawn to scale.
 */
@Component({
  selector: 'sw-roll-drawing',
  imports: [DimensionMark, AngleArcMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg class="drawing" [attr.viewBox]="fit().viewBox" role="img" aria-labelledby="roll-title roll-desc">
      <title id="roll-title">{{ title() }}</title>
      <desc id="roll-desc">{{ description() }}</desc>
      <path class="part" [attr.d]="partPath()" />
      <path class="hatch" [attr.d]="hatch()" />
      @for (c of circles(); track $index) {
        <circle class="roll" [attr.cx]="c.x" [attr.cy]="c.y" [attr.r]="c.r" />
        <circle class="roll-centre" [attr.cx]="c.x" [attr.cy]="c.y" r="2" />
      }
      @for (d of dimensions(); track d.key) {
        <g [class.measurement]="d.key === 'measurement'" [swDimension]="d.geometry" />
      }
      <path class="legs" [attr.d]="legs()" />
      @if (arc(); as a) {
        <g [swAngleArc]="a" />
      }
    </svg>
  `,
  styles: `
    :host { display: block; }
    .drawing { display: block; width: 100%; height: auto; background: var(--mat-sys-surface-container-lowest); border-radius: 12px; }
    .part { fill: #dbe7ec; stroke: #1d3a45; stroke-width: 1.5; stroke-linejoin: round; }
    .hatch { stroke: #7d97a1; stroke-width: 0.75; fill: none; }
    .roll { fill: #f3e6d0; stroke: #5c3b00; stroke-width: 1.5; }
    .roll-centre { fill: #5c3b00; }
    .measurement { --sw-dim-color: #b3261e; }
    .legs { stroke: #8a4b00; stroke-width: 1; stroke-dasharray: 4 3; fill: none; }
    @media print { .drawing { background: none; } }
  `,
})
export class RollDrawing {
  /** The dovetail or groove to draw. */
  readonly subject = input.required<RollSubject>();
  /** Text of each dimension. */
  readonly texts = input.required<RollDimensionTexts>();
  /** Text of the angle arc (α or β). */
  readonly angleText = input.required<string>();

  private readonly width = hostWidth();

  /** The geometry in drawing units. */
  protected readonly shape = computed<RollShape>(() => {
    const s = this.subject();
    return s.kind === 'dovetail' ? dovetailGeometry(s) : vGrooveGeometry(s);
  });

  /** The section fitted into the view box. */
  protected readonly fit = computed<ViewFit>(() => {
    const [x, y, w, h] = this.shape().bounds;
    return fitView({ minX: x, minY: -(y + h), maxX: x + w, maxY: -y }, { width: this.width(), maxHeight: 400, minHeight: 220, margin: MARGIN });
  });

  private readonly toView = computed(() => {
    const fit = this.fit();
    return (p: RollPoint): Point => fit.toView({ x: p.x, y: -p.y });
  });

  private readonly partView = computed(() => this.shape().part.map(this.toView()));
  /** The part's outline. */
  protected readonly partPath = computed(() => polygonPath(this.partView()));
  /** Section hatching of the part. */
  protected readonly hatch = computed(() => hatchPath(this.partView(), 9, 45));

  /** The rolls in view units. */
  protected readonly circles = computed(() => {
    const v = this.toView();
    const scale = this.fit().scale;
    return this.shape().rolls.map((c) => ({ ...v(c.centre), r: Math.round(c.radius * scale * 100) / 100 }));
  });

  /** The dimensions that have a text, in view units. */
  protected readonly dimensions = computed<{ key: RollDimensionKey; geometry: DimensionGeometry }[]>(() => {
    const v = this.toView();
    const scale = this.fit().scale;
    const texts = this.texts();
    const out: { key: RollDimensionKey; geometry: DimensionGeometry }[] = [];
    for (const dim of this.shape().dimensions) {
      const text = texts[dim.key];
      const a = v(dim.from);
      const b = v(dim.to);
      if (!text || (a.x === b.x && a.y === b.y)) continue;
      const offset = dim.offset === 0 ? 0 : Math.sign(dim.offset) * Math.max(MIN_OFFSET, Math.abs(dim.offset) * scale);
      out.push({ key: dim.key, geometry: dimensionLine(a, b, offset, text) });
    }
    return out;
  });

  /** The arc of α (dovetail) or β (V-groove). */
  protected readonly arc = computed<AngleArcGeometry | null>(() => {
    const a = this.shape().angle;
    if (!(a.radius > 0)) return null;
    return angleArc(this.toView()(a.vertex), Math.max(24, a.radius * this.fit().scale), a.fromDeg, a.toDeg, this.angleText());
  });

  /** The two legs of the marked angle (extension lines where they run off the part's edges). */
  protected readonly legs = computed(() => {
    const a = this.shape().angle;
    const c = this.toView()(a.vertex);
    const r = Math.max(24, a.radius * this.fit().scale) * 1.2;
    return segmentsPath([a.fromDeg, a.toDeg].map((deg) => [c, polarPoint(c, r, deg)] as [Point, Point]));
  });

  /** The drawing's accessible name. */
  protected readonly title = computed(() => {
    const s = this.subject();
    if (s.kind === 'v-groove') return 'Pin in a V-groove with the height of its top over the surface';
    return s.side === 'male' ? 'Male dovetail with two rolls and the measurement over them' : 'Female dovetail with two rolls and the measurement between them';
  });

  /** What the dimensions say. */
  protected readonly description = computed(() => {
    const t = this.texts();
    const parts = [t.measurement && `measurement ${t.measurement}`, t.width && `corner width ${t.width}`, t.depth && `depth ${t.depth}`, `angle ${this.angleText()}`];
    return `Dimensions: ${parts.filter(Boolean).join(', ')}.`;
  });
}
