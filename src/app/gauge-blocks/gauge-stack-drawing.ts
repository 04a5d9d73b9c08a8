import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { DimensionMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { NO_ANSWER_TEXT, UNDRAWABLE_TEXT, layoutOrNull } from '../drawing/safe-layout';
import { type GaugeStackSceneInput, gaugeStackScene } from './gauge-stack-scene';

/** The fewest-blocks stack beside the last-digit-method stack, block by block in wringing order. */
@Component({
  selector: 'sw-gauge-stack-drawing',
  imports: [DimensionMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (scene(); as s) {
      <svg class="drawing" [attr.viewBox]="s.viewBox" role="img" aria-labelledby="gauge-drawing-title gauge-drawing-desc">
        <title id="gauge-drawing-title">Gauge-block stacks drawing</title>
        <desc id="gauge-drawing-desc">{{ description() }}</desc>
        <path class="base" [attr.d]="s.baseLine" />
        @for (stack of s.stacks; track stack.title) {
          <text class="title" [class.narrow]="s.narrow" [attr.x]="stack.titleX" [attr.y]="s.titleY">{{ stack.title }}</text>
          @for (p of stack.pieces; track $index) {
            <path class="block" [class.odd]="$index % 2 === 1" [class.wear]="p.wear" [attr.d]="p.d" />
            <path class="leader" [attr.d]="p.leader" />
            <text class="label" [attr.text-anchor]="stack.anchor" [attr.x]="p.labelX" [attr.y]="p.labelY + 4">{{ p.label }}{{ p.wear ? ' wear' : '' }}</text>
          }
        }
        <g [swDimension]="s.totalDim" />
      </svg>
    } @else {
      <p class="no-drawing">{{ model() ? undrawableText : noAnswerText }}</p>
    }
  `,
  styles: `
    :host { display: block; }
    .drawing { display: block; width: 100%; height: auto; background: #fbfcfd; border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; }
    .base { stroke: #6d787e; stroke-width: 3; }
    .block { fill: #cfd8dc; stroke: #37474f; stroke-width: 1; }
    .block.odd { fill: #e7ecee; }
    .block.wear { fill: #d8cba8; stroke: #6b5a2b; }
    .leader { stroke: #546e7a; stroke-width: 0.8; fill: none; }
    .label { font-size: 13px; font-weight: 600; fill: #1d2a30; font-variant-numeric: tabular-nums; }
    .title { font-size: 14px; font-weight: 600; text-anchor: middle; fill: #16394a; }
    .title.narrow { font-size: 12px; }
    .no-drawing { padding: 48px 16px; text-align: center; border: 1px dashed var(--mat-sys-outline); border-radius: 12px; color: var(--mat-sys-on-surface-variant); }
    @media print { .drawing { border: none; background: none; max-height: 78mm; } }
  `,
})
export class GaugeStackDrawing {
  /** The stacks to draw, or null. */
  readonly model = input.required<GaugeStackSceneInput | null>();
  protected readonly noAnswerText = NO_ANSWER_TEXT;
  protected readonly undrawableText = UNDRAWABLE_TEXT;
  private readonly width = hostWidth();
  /** The laid-out drawing. */
  protected readonly scene = computed(() => {
    const m = this.model();
    return m ? layoutOrNull(() => gaugeStackScene(m, this.width())) : null;
  });
  /** A sentence for screen readers. */
  protected readonly description = computed(() => {
    const m = this.model();
    if (!m) return '';
    const last = m.lastDigit ? ` The last-digit method uses ${m.lastDigit.map((p) => p.label).join(', ')}.` : '';
    return `A ${m.totalLabel} stack of ${m.fewest.map((p) => p.label).join(', ')}, bottom first.${last}`;
  });
}
