import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { type AngleArcGeometry, type DimensionGeometry, angleArc, dimensionLine, polarPoint } from '../drawing/dimension';
import { AngleArcMark, DimensionMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { hatchPath, polygonPath, segmentsPath } from '../drawing/shapes';
import { type Point, type ViewFit, fitView } from '../drawing/view-fit';
import { type Box, type PlacedLabel, boxAround, nearestOnBox, placeLabel, rotatedTextBox } from '../drawing/label-placement';
import { type DovetailInput, type RollDimensionKey, type RollPoint, type RollShape, type VGrooveInput, dovetailGeometry, vGrooveGeometry } from './roll-geometry';
import {
  type BallsInput,
  type DiscsInput,
  type DovetailAngleInput,
  type TwoHeightsInput,
  ballsGeometry,
  discsGeometry,
  dovetailAngleGeometry,
  twoHeightsGeometry,
} from './taper-check-geometry';

/** What to draw: one of the measurements of the pins-and-rolls page. */
export type RollSubject =
  | ({ kind: 'dovetail' } & DovetailInput)
  | ({ kind: 'v-groove' } & VGrooveInput)
  | ({ kind: 'dovetail-angle' } & DovetailAngleInput)
  | ({ kind: 'taper-two-heights' } & TwoHeightsInput)
  | ({ kind: 'taper-discs' } & DiscsInput)
  | ({ kind: 'taper-balls' } & BallsInput);

/** The geometry of a subject. */
export function rollShape(s: RollSubject): RollShape {
  switch (s.kind) {
    case 'dovetail':
      return dovetailGeometry(s);
    case 'v-groove':
      return vGrooveGeometry(s);
    case 'dovetail-angle':
      return dovetailAngleGeometry(s);
    case 'taper-two-heights':
      return twoHeightsGeometry(s);
    case 'taper-discs':
      return discsGeometry(s);
    case 'taper-balls':
      return ballsGeometry(s);
  }
}

/** Text of each dimension, by key (a missing key leaves that dimension off). */
export type RollDimensionTexts = Partial<Record<RollDimensionKey, string>>;

/** Free space around the section for dimension labels, in view units. */
const MARGIN = 44;
/** Smallest gap between a feature and its dimension line on screen, in view units. */
const MIN_OFFSET = 22;
/** Extra distance of each stacked row of dimensions, in view units. */
const TIER_STEP = 30;

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
      <path class="support" [attr.d]="supportPath()" />
      <path class="part" [attr.d]="partPath()" />
      <path class="hatch" [attr.d]="hatch()" />
      <path class="axis" [attr.d]="axisPath()" />
      <path class="sides" [attr.d]="sidesPath()" />
      @for (c of circles(); track $index) {
        <circle class="roll" [class.second]="c.second" [attr.cx]="c.x" [attr.cy]="c.y" [attr.r]="c.r" />
        <circle class="roll-centre" [attr.cx]="c.x" [attr.cy]="c.y" r="2" />
      }
      @for (d of dimensions(); track d.key) {
        <g [class.measurement]="d.key === 'measurement' || d.key === 'measurement2'" [swDimension]="d.geometry" />
      }
      <path class="legs" [attr.d]="legs()" />
      @if (arc(); as a) {
        <g [swAngleArc]="a" />
        <path class="leader" [attr.d]="angleLabel().leader" />
        <text class="angle-text" [attr.x]="angleLabel().x" [attr.y]="angleLabel().y" [attr.text-anchor]="angleLabel().anchor">{{ angleText() }}</text>
      }
    </svg>
  `,
  styles: `
    :host { display: block; }
    .drawing { display: block; width: 100%; height: auto; background: var(--mat-sys-surface-container-lowest); border-radius: 12px; }
    .part { fill: #dbe7ec; stroke: #1d3a45; stroke-width: 1.5; stroke-linejoin: round; }
    .hatch { stroke: #7d97a1; stroke-width: 0.75; fill: none; }
    .roll { fill: #f3e6d0; stroke: #5c3b00; stroke-width: 1.5; }
    .roll.second { fill: none; stroke-dasharray: 5 3; }
    .roll-centre { fill: #5c3b00; }
    .support { fill: #e7e2d8; stroke: #5f5e5a; stroke-width: 1; }
    .axis { stroke: var(--mat-sys-outline); stroke-width: 1; stroke-dasharray: 14 4 3 4; fill: none; }
    .sides { stroke: #1d3a45; stroke-width: 3; fill: none; stroke-linecap: round; }
    .leader { stroke: #8a4b00; stroke-width: 0.75; fill: none; }
    .angle-text {
      fill: #8a4b00; font-size: 14px; font-weight: 600; dominant-baseline: middle;
      paint-order: stroke; stroke: #ffffff; stroke-width: 4px; stroke-linejoin: round;
    }
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
  protected readonly shape = computed<RollShape>(() => rollShape(this.subject()));

  /** The section fitted into the view box, with room for stacked dimensions. */
  protected readonly fit = computed<ViewFit>(() => {
    const shape = this.shape();
    const [x, y, w, h] = shape.bounds;
    const tiers = Math.max(0, ...shape.dimensions.map((d) => d.tier ?? 0));
    return fitView({ minX: x, minY: -(y + h), maxX: x + w, maxY: -y }, { width: this.width(), maxHeight: 420, minHeight: 220, margin: MARGIN + tiers * TIER_STEP });
  });

  private readonly toView = computed(() => {
    const fit = this.fit();
    return (p: RollPoint): Point => fit.toView({ x: p.x, y: -p.y });
  });

  private readonly partView = computed(() => this.shape().part.map(this.toView()));
  /** The part's outline. */
  protected readonly partPath = computed(() => (this.partView().length ? polygonPath(this.partView()) : ''));
  /** Section hatching of the part. */
  protected readonly hatch = computed(() => (this.partView().length ? hatchPath(this.partView(), 9, 45) : ''));
  /** The surface plate and block stacks. */
  protected readonly supportPath = computed(() => (this.shape().supports ?? []).map((o) => polygonPath(o.map(this.toView()))).join(''));
  /** The taper's centre line. */
  protected readonly axisPath = computed(() => {
    const a = this.shape().axis;
    return a ? segmentsPath([[this.toView()(a[0]), this.toView()(a[1])]]) : '';
  });
  /** Straightedges touching discs. */
  protected readonly sidesPath = computed(() => segmentsPath((this.shape().sides ?? []).map(([a, b]) => [this.toView()(a), this.toView()(b)] as [Point, Point])));

  /** The rolls in view units. */
  protected readonly circles = computed(() => {
    const v = this.toView();
    const scale = this.fit().scale;
    return this.shape().rolls.map((c) => ({ ...v(c.centre), r: Math.round(c.radius * scale * 100) / 100, second: !!c.second }));
  });

  /** The dimensions that have a text, in view units. */
  protected readonly dimensions = computed<{ key: RollDimensionKey; geometry: DimensionGeometry; lineBox: Box }[]>(() => {
    const v = this.toView();
    const scale = this.fit().scale;
    const texts = this.texts();
    const out: { key: RollDimensionKey; geometry: DimensionGeometry; lineBox: Box }[] = [];
    for (const dim of this.shape().dimensions) {
      const text = texts[dim.key];
      const a = v(dim.from);
      const b = v(dim.to);
      if (!text || (a.x === b.x && a.y === b.y)) continue;
      const offset = dim.offset === 0 ? 0 : Math.sign(dim.offset) * (Math.max(MIN_OFFSET, Math.abs(dim.offset) * scale) + (dim.tier ?? 0) * TIER_STEP);
      // The dimension line itself: the measured points moved `offset` to the left of a→b on screen.
      const len = Math.hypot(b.x - a.x, b.y - a.y);
      const n = { x: (b.y - a.y) / len, y: -(b.x - a.x) / len };
      const lineBox = boxAround([{ x: a.x + n.x * offset, y: a.y + n.y * offset }, { x: b.x + n.x * offset, y: b.y + n.y * offset }], 6);
      out.push({ key: dim.key, geometry: dimensionLine(a, b, offset, text), lineBox });
    }
    return out;
  });

  /** The arc of α (dovetail) or β (V-groove). */
  protected readonly arc = computed<AngleArcGeometry | null>(() => {
    const a = this.shape().angle;
    if (!(a.radius > 0)) return null;
    return angleArc(this.toView()(a.vertex), Math.max(24, a.radius * this.fit().scale), a.fromDeg, a.toDeg, '');
  });

  /**
   * The angle's text where it covers no dimension, roll or label: beside the arc first, then
   * further out, with a leader to the arc's middle when it had to move away.
   */
  protected readonly angleLabel = computed<PlacedLabel & { leader: string }>(() => {
    const a = this.shape().angle;
    const c = this.toView()(a.vertex);
    const fit = this.fit();
    const radius = Math.max(24, a.radius * fit.scale);
    const midDeg = (a.fromDeg + a.toDeg) / 2;
    const onArc = polarPoint(c, radius, midDeg);
    const text = this.angleText();
    const candidates = [0, 14, 28, 44, 64].flatMap((extra) => {
      const p = polarPoint(c, radius + 14 + extra, midDeg);
      const anchor: 'start' | 'middle' | 'end' = p.x > c.x + 4 ? 'start' : p.x < c.x - 4 ? 'end' : 'middle';
      return [
        { x: p.x, y: p.y, anchor },
        { x: p.x + 6, y: p.y - 18, anchor: 'start' as const },
        { x: p.x - 6, y: p.y - 18, anchor: 'end' as const },
        { x: p.x + 6, y: p.y + 18, anchor: 'start' as const },
        { x: p.x - 6, y: p.y + 18, anchor: 'end' as const },
      ];
    });
    const placed = placeLabel(text, candidates, this.obstacles(), { x: 2, y: 2, width: fit.width - 4, height: fit.height - 4 });
    const end = nearestOnBox(placed.box, onArc);
    const far = Math.hypot(end.x - onArc.x, end.y - onArc.y) > 16;
    return { ...placed, leader: far ? segmentsPath([[onArc, end]]) : '' };
  });

  /** What the angle's text must not cover: dimension labels and lines, rolls and supports. */
  private readonly obstacles = computed<Box[]>(() => {
    const boxes: Box[] = [];
    for (const d of this.dimensions()) {
      const l = d.geometry.label;
      boxes.push(rotatedTextBox(l.x, l.y, l.rotate, l.text), d.lineBox);
    }
    for (const c of this.circles()) boxes.push({ x: c.x - c.r, y: c.y - c.r, width: 2 * c.r, height: 2 * c.r });
    for (const o of this.shape().supports ?? []) boxes.push(boxAround(o.map(this.toView())));
    return boxes;
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
    switch (s.kind) {
      case 'v-groove':
        return 'Pin in a V-groove with the height of its top over the surface';
      case 'dovetail':
        return s.side === 'male' ? 'Male dovetail with two rolls and the measurement over them' : 'Female dovetail with two rolls and the measurement between them';
      case 'dovetail-angle':
        return `${s.side === 'male' ? 'Male' : 'Female'} dovetail with two sizes of roll in its corners and both readings`;
      case 'taper-two-heights':
        return 'Taper on the surface plate with rolls on block stacks at two heights and both readings';
      case 'taper-discs':
        return s.reference === 'side' ? 'Two discs between straightedges, one side square' : 'Two discs between straightedges about the taper’s axis';
      case 'taper-balls':
        return 'Internal taper with a large and a small ball and their depths below the face';
    }
  });

  /** What the dimensions say. */
  protected readonly description = computed(() => {
    const t = this.texts();
    const names: Record<RollDimensionKey, string> = {
      measurement: 'first reading',
      measurement2: 'second reading',
      width: 'corner width',
      depth: 'depth',
      height: 'height difference',
      large: 'large diameter',
      small: 'small diameter',
      centres: 'centre distance',
      largeDepth: 'large ball depth',
      smallDepth: 'small ball depth',
    };
    const single = this.subject().kind === 'dovetail' || this.subject().kind === 'v-groove';
    const parts = (Object.keys(names) as RollDimensionKey[])
      .filter((k) => t[k])
      .map((k) => `${single && k === 'measurement' ? 'measurement' : names[k]} ${t[k]}`);
    const second = this.shape().rolls.some((r) => r.second) ? ' Dashed: the second set-up.' : '';
    return `Dimensions: ${[...parts, `angle ${this.angleText()}`].join(', ')}.${second}`;
  });
}
