import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import type { AngleArcGeometry, DimensionGeometry, Label } from './dimension';

/** Draws a dimension computed by `dimensionLine` inside an SVG: `<svg:g [swDimension]="dim" />`. */
@Component({
  selector: 'g[swDimension]',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg:path class="ext" [attr.d]="swDimension().extensionLines" />
    <svg:path class="dim-line" [attr.d]="swDimension().line" />
    <svg:path class="arrow" [attr.d]="swDimension().arrows" />
    <svg:text class="dim-text" [attr.x]="swDimension().label.x" [attr.y]="swDimension().label.y"
              [attr.transform]="labelTransform(swDimension().label)">{{ swDimension().label.text }}</svg:text>
  `,
  styles: `
    .ext, .dim-line { fill: none; stroke: var(--sw-dim-color, #0b4f6c); stroke-width: 1; }
    .arrow { fill: var(--sw-dim-color, #0b4f6c); stroke: none; }
    .dim-text {
      fill: var(--sw-dim-color, #0b4f6c); font-size: 14px; font-weight: 600; text-anchor: middle;
      paint-order: stroke; stroke: #ffffff; stroke-width: 4px; stroke-linejoin: round; font-variant-numeric: tabular-nums;
    }
  `,
})
export class DimensionMark {
  /** The dimension's geometry. */
  readonly swDimension = input.required<DimensionGeometry>();
  /** The rotation of a label about its own anchor. */
  protected labelTransform(label: Label): string | null {
    return labelTransform(label);
  }
}

/** Draws an angle arc computed by `angleArc`: `<svg:g [swAngleArc]="arc" />`. */
@Component({
  selector: 'g[swAngleArc]',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg:path class="arc" [attr.d]="swAngleArc().arc" />
    <svg:path class="arrow" [attr.d]="swAngleArc().arrows" />
    <svg:text class="arc-text" [attr.x]="swAngleArc().label.x" [attr.y]="swAngleArc().label.y">{{ swAngleArc().label.text }}</svg:text>
  `,
  styles: `
    .arc { fill: none; stroke: var(--sw-angle-color, #8a4b00); stroke-width: 1.25; }
    .arrow { fill: var(--sw-angle-color, #8a4b00); }
    .arc-text {
      fill: var(--sw-angle-color, #8a4b00); font-size: 14px; font-weight: 600; text-anchor: middle; dominant-baseline: middle;
      paint-order: stroke; stroke: #ffffff; stroke-width: 4px; stroke-linejoin: round;
    }
  `,
})
export class AngleArcMark {
  /** The arc's geometry. */
  readonly swAngleArc = input.required<AngleArcGeometry>();
}

/** The SVG transform that turns a label about its anchor, or null when it is level. */
export function labelTransform(label: Label): string | null {
  return label.rotate ? `rotate(${label.rotate} ${label.x} ${label.y})` : null;
}
