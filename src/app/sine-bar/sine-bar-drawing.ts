import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { AngleArcMark, DimensionMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { NO_ANSWER_TEXT, UNDRAWABLE_TEXT, layoutOrNull } from '../drawing/safe-layout';
import { type SineBarSceneInput, sineBarScene } from './sine-bar-scene';

/** A sine bar on its rolls with the gauge blocks under the high roll, drawn to scale. */
@Component({
  selector: 'sw-sine-bar-drawing',
  imports: [DimensionMark, AngleArcMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (scene(); as s) {
      <svg class="drawing" [attr.viewBox]="s.viewBox" role="img" [attr.aria-labelledby]="titleId() + ' ' + titleId() + '-desc'">
        <title [id]="titleId()">{{ title() }}</title>
        <desc [id]="titleId() + '-desc'">{{ description() }}</desc>
        <path class="plate" [attr.d]="s.plate" />
        @for (b of s.blocks; track $index) {
          <path class="block" [class.odd]="$index % 2 === 1" [attr.d]="b.d" />
          <path class="leader" [attr.d]="b.leader" />
          <text class="block-label" [attr.x]="b.labelX" [attr.y]="b.labelY + 4">{{ b.label }}</text>
        }
        <path class="bar" [attr.d]="s.bar" />
        <path class="centre" [attr.d]="s.centreLine" />
        @for (roll of s.rolls; track $index) {
          <circle class="roll" [attr.cx]="roll.cx" [attr.cy]="roll.cy" [attr.r]="roll.r" />
          <circle class="roll-centre" [attr.cx]="roll.cx" [attr.cy]="roll.cy" r="2" />
        }
        <path class="level" [attr.d]="s.levelLine" />
        <g [swAngleArc]="s.angleArc" />
        <g [swDimension]="s.lengthDim" />
        @if (s.heightDim; as h) {
          <g [swDimension]="h" />
        }
      </svg>
    } @else {
      <p class="no-drawing">{{ model() ? undrawableText : noAnswerText }}</p>
    }
  `,
  styles: `
    :host { display: block; }
    .drawing { display: block; width: 100%; height: auto; background: #fbfcfd; border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; }
    .plate { fill: #c9d0d4; stroke: #6d787e; }
    .bar { fill: #b9d3e0; fill-opacity: 0.9; stroke: #16394a; stroke-width: 2; stroke-linejoin: round; }
    .roll { fill: #e8edf0; stroke: #16394a; stroke-width: 1.5; }
    .roll-centre { fill: #16394a; }
    .centre { stroke: #16394a; stroke-width: 0.8; stroke-dasharray: 8 3 2 3; fill: none; }
    .block { fill: #d8cba8; stroke: #6b5a2b; stroke-width: 1; }
    .block.odd { fill: #efe4c4; }
    .leader { stroke: #6b5a2b; stroke-width: 0.8; fill: none; }
    .block-label { font-size: 13px; font-weight: 600; fill: #3d2f0a; font-variant-numeric: tabular-nums; }
    .level { fill: none; stroke: #444; stroke-width: 0.8; stroke-dasharray: 2 3; }
    .no-drawing { padding: 48px 16px; text-align: center; border: 1px dashed var(--mat-sys-outline); border-radius: 12px; color: var(--mat-sys-on-surface-variant); }
    @media print { .drawing { border: none; background: none; max-height: 78mm; } }
  `,
})
export class SineBarDrawing {
  /** The set-up to draw, or null. */
  readonly model = input.required<SineBarSceneInput | null>();
  protected readonly noAnswerText = NO_ANSWER_TEXT;
  protected readonly undrawableText = UNDRAWABLE_TEXT;
  /** The drawing's title. */
  readonly title = input('Sine bar set-up drawing');
  /** Id of the title element (two drawings may share a page). */
  readonly titleId = input('sine-bar-drawing-title');
  private readonly width = hostWidth();
  /** The laid-out drawing. */
  protected readonly scene = computed(() => {
    const m = this.model();
    return m ? layoutOrNull(() => sineBarScene(m, this.width())) : null;
  });
  /** A sentence describing the drawing for screen readers. */
  protected readonly description = computed(() => {
    const m = this.model();
    if (!m) return '';
    const blocks = m.blocks.length ? ` built from ${m.blocks.map((b) => b.label).join(', ')}` : '';
    return `Bar with roll centres ${m.labels.barLength} apart, set at ${m.labels.angle} on a stack of ${m.labels.stackHeight}${blocks}.`;
  });
}
