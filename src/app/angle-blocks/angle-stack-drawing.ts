import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { type AngleArcGeometry, angleArc } from '../drawing/dimension';
import { AngleArcMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { hatchPath, polygonPath, polylinePath } from '../drawing/shapes';
import { type Point, type ViewFit, fitView } from '../drawing/view-fit';
import { type StackBlockInput, type StackPoint, angleStackGeometry } from './angle-stack-geometry';
import { timed } from './timed';

/** One block as drawn: outline, hatching (reversed blocks), direction mark and label, in view units. */
interface BlockView {
  readonly outline: string;
  readonly hatch: string;
  readonly mark: string;
  readonly label: Point;
  readonly text: string;
  readonly reversed: boolean;
}

/** Free space around the stack for the angle label, in view units. */
const MARGIN = 44;

/**
 * The angle blocks wrung together on the surface plate, drawn to their true angles: added
 * blocks with their thick end to the right, reversed blocks turned end for end and hatched, each
 * with its direction mark and size, and the arc of the angle the combination makes.
 */
@Component({
  selector: 'sw-angle-stack-drawing',
  imports: [AngleArcMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <figure class="figure">
      <svg class="drawing" [attr.viewBox]="fit().viewBox" role="img" aria-labelledby="angle-stack-title angle-stack-desc">
        <title id="angle-stack-title">{{ title() }}</title>
        <desc id="angle-stack-desc">{{ description() }}</desc>
        <path class="plate" [attr.d]="platePath()" />
        @for (b of blockViews(); track $index) {
          <path class="block" [class.reversed]="b.reversed" [attr.d]="b.outline" />
          <path class="hatch" [attr.d]="b.hatch" />
          <path class="mark" [attr.d]="b.mark" />
          <text class="block-text" [attr.x]="b.label.x" [attr.y]="b.label.y">{{ b.text }}</text>
        }
        <path class="reference" [attr.d]="referencePath()" />
        @if (arc(); as a) {
          <g class="total" [swAngleArc]="a" />
        }
      </svg>
      <figcaption class="legend">
        <span><span class="swatch"></span> added (direction marks in line)</span>
        <span><span class="swatch reversed"></span> reversed: subtracts</span>
      </figcaption>
    </figure>
  `,
  styles: `
    :host { display: block; }
    .figure { margin: 0; }
    .drawing { display: block; width: 100%; height: auto; background: var(--mat-sys-surface-container-lowest); border-radius: 12px; }
    .plate { stroke: var(--mat-sys-on-surface); stroke-width: 3; fill: none; }
    .block { fill: #dbe7ec; stroke: #1d3a45; stroke-width: 1.5; stroke-linejoin: round; }
    .block.reversed { fill: #f7e3c6; stroke: #6b3d00; }
    .hatch { stroke: #8a4b00; stroke-width: 0.75; fill: none; }
    .mark { stroke: #1d3a45; stroke-width: 2; fill: none; stroke-linecap: round; stroke-linejoin: round; }
    .block-text {
      font-size: 13px; font-weight: 600; text-anchor: middle; dominant-baseline: middle; fill: #10242c;
      paint-order: stroke; stroke: #ffffff; stroke-width: 3px; stroke-linejoin: round;
    }
    .reference { stroke: var(--mat-sys-outline); stroke-width: 1; stroke-dasharray: 6 4; fill: none; }
    .legend { display: flex; flex-wrap: wrap; gap: 4px 20px; padding: 6px 4px 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .swatch { display: inline-block; width: 14px; height: 10px; border: 1px solid #1d3a45; background: #dbe7ec; vertical-align: middle; }
    .swatch.reversed { background: repeating-linear-gradient(135deg, #f7e3c6 0 3px, #8a4b00 3px 4px); border-color: #6b3d00; }
    @media print { .drawing { background: none; } }
  `,
})
export class AngleStackDrawing {
  /** The blocks from the plate upward. */
  readonly stack = input.required<readonly StackBlockInput[]>();
  /** The angle the combination makes, as text for the arc ("17°35′"). */
  readonly totalText = input.required<string>();

  private readonly width = hostWidth();

  /** The stack's geometry in drawing units. */
  protected readonly shape = computed(() => timed('sw-angle-stack-geometry', () => angleStackGeometry(this.stack())));

  /** The stack fitted into a view box as wide as the drawing's space. */
  protected readonly fit = computed<ViewFit>(() => {
    const [x, y, w, h] = this.shape().bounds;
    // The geometry's y runs down the page; the fit's model y runs up.
    return fitView({ minX: x, minY: -(y + h), maxX: x + w, maxY: -y }, { width: this.width(), maxHeight: 460, minHeight: 220, margin: MARGIN });
  });

  private readonly toView = computed(() => {
    const fit = this.fit();
    return (p: StackPoint): Point => fit.toView({ x: p.x, y: -p.y });
  });

  /** Each block, in view units. */
  protected readonly blockViews = computed<BlockView[]>(() => {
    const view = this.toView();
    const scale = this.fit().scale;
    return timed('sw-angle-stack-paths', () => this.shape().blocks.map((b) => {
      const outline = b.outline.map(view);
      return {
        outline: polygonPath(outline),
        hatch: b.reversed ? hatchPath(outline, Math.max(5, scale * 4), 45) : '',
        mark: polylinePath(b.mark.map(view)),
        label: view(b.labelAt),
        text: b.reversed ? `−${b.label}` : b.label,
        reversed: b.reversed,
      };
    }));
  });

  /** The surface plate's line. */
  protected readonly platePath = computed(() => polylinePath(this.shape().plate.map(this.toView())));

  /** The level line through the top face's high end, over the face. */
  protected readonly referencePath = computed(() => {
    const s = this.shape();
    if (!s.blocks.length) return '';
    const view = this.toView();
    return polylinePath([view(s.vertex), view(s.levelEnd)]);
  });

  /** The arc of the combination's angle, or null for a level top face. */
  protected readonly arc = computed<AngleArcGeometry | null>(() => {
    const s = this.shape();
    if (!s.blocks.length || Math.abs(s.totalDeg) < 1e-9) return null;
    return angleArc(this.toView()(s.vertex), s.arcRadius * this.fit().scale, s.arcFromDeg, s.arcToDeg, this.totalText());
  });

  /** The drawing's accessible name. */
  protected readonly title = computed(() => `Angle blocks wrung together, making ${this.totalText()}`);

  /** A short description of the blocks, in order from the plate. */
  protected readonly description = computed(() => {
    const list = this.stack().map((b) => `${b.label}${b.reversed ? ' reversed' : ''}`);
    return list.length ? `From the surface plate up: ${list.join(', ')}.` : 'No blocks.';
  });
}
