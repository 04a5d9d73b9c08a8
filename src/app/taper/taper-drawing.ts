import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { AngleArcMark, DimensionMark } from '../drawing/dimension-mark';
import { hostWidth } from '../drawing/element-width';
import { NO_ANSWER_TEXT, UNDRAWABLE_TEXT, layoutOrNull } from '../drawing/safe-layout';
import { type TaperScene, type TaperSceneInput, taperScene } from './taper-scene';

/** The taper set-up drawn to scale: part on the angle block in the vise, cutter, touch-off, dimensions, passes. */
@Component({
  selector: 'sw-taper-drawing',
  imports: [DimensionMark, AngleArcMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (scene(); as s) {
      <svg class="drawing" [attr.viewBox]="s.viewBox" role="img" aria-labelledby="taper-drawing-title taper-drawing-desc"
           preserveAspectRatio="xMidYMid meet">
        <title id="taper-drawing-title">Taper set-up drawing</title>
        <desc id="taper-drawing-desc">{{ description() }}</desc>
        @for (f of s.fixture; track $index) {
          <path [attr.class]="'fixture ' + f.kind" [attr.d]="f.d" />
        }
        <path class="fixture-lines" [attr.d]="s.fixtureLines" />
        @for (roll of s.rolls; track $index) {
          <circle class="roll" [attr.cx]="roll.cx" [attr.cy]="roll.cy" [attr.r]="roll.r" />
        }
        <path class="part" [attr.d]="s.part" />
        <path class="removed" [attr.d]="s.removed" />
        <path class="to-remove" [attr.d]="s.toRemove" />
        <path class="hatch" [attr.d]="s.toRemoveHatch" />
        @for (line of s.passLines; track line.pass) {
          <path class="pass" [class.selected]="line.selected" [attr.d]="line.d" />
        }
        <path class="level" [attr.d]="s.stopLevel" />
        <path class="level" [attr.d]="s.touchOffLevel" />
        <path class="level" [attr.d]="s.levelLine" />
        <!-- The cutter under the dimensions: a short face's length can lie across it and stays readable. -->
        <path class="cutter" [attr.d]="s.cutterFlutes" />
        <path class="cutter shank" [attr.d]="s.cutterShank" />
        <g [swAngleArc]="s.angleArc" />
        <g [swDimension]="s.faceDim" />
        <g [swDimension]="s.depthDim" class="depth" />
        @if (s.endDim; as endDim) {
          <g [swDimension]="endDim" />
        }
        <circle class="touch-off" [attr.cx]="s.touchOff.x" [attr.cy]="s.touchOff.y" r="5" />
        <text [attr.class]="'note ' + s.touchOffAnchor" [attr.x]="s.touchOffLabel.x" [attr.y]="s.touchOffLabel.y">{{ s.touchOffLabel.text }}</text>
        @if (s.passLabel; as label) {
          <text class="note end pass-note" [attr.x]="label.x - 6" [attr.y]="label.y + 4">{{ label.text }}</text>
        }
        @for (n of s.names; track $index) {
          <text [attr.class]="'name ' + n.anchor" [attr.x]="n.x" [attr.y]="n.y">{{ n.text }}</text>
        }
      </svg>
    } @else {
      <p class="no-drawing">{{ model() ? undrawableText : noAnswerText }}</p>
    }
  `,
  styles: `
    :host { display: block; }
    .drawing { display: block; width: 100%; height: auto; background: #fbfcfd; border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; }
    .vise-jaw { fill: #e3e7ea; stroke: #8c969c; stroke-width: 1; }
    .vise-base, .base { fill: #c9d0d4; stroke: #6d787e; stroke-width: 1; }
    .vise-body { fill: #d5dbdf; stroke: #5d686e; stroke-width: 1.25; }
    .block { fill: #d8cba8; stroke: #6b5a2b; stroke-width: 1.25; }
    .plate { fill: #c4ced4; stroke: #38454c; stroke-width: 1.5; }
    .gauge { fill: #d8cba8; stroke: #6b5a2b; stroke-width: 1; }
    .gauge.odd { fill: #efe4c4; }
    .gauge.missing { fill: none; stroke: #c1121f; stroke-dasharray: 4 3; }
    .scale { fill: #f6eed6; fill-opacity: 0.92; stroke: #6b5a2b; stroke-width: 1.25; }
    .fixture-lines { fill: none; stroke: #4a3d1c; stroke-width: 1.25; }
    .roll { fill: #e8edf0; stroke: #16394a; stroke-width: 1.5; }
    .part { fill: #b9d3e0; stroke: #16394a; stroke-width: 2; stroke-linejoin: round; }
    .removed { fill: #ffffff; stroke: #c1121f; stroke-width: 1; stroke-dasharray: 3 3; }
    .to-remove { fill: #ffd9d4; stroke: #c1121f; stroke-width: 1.5; }
    .hatch { fill: none; stroke: #c1121f; stroke-width: 0.8; }
    .pass { fill: none; stroke: #7a1a12; stroke-width: 1; stroke-dasharray: 6 3; }
    .pass.selected { stroke-width: 2.5; stroke-dasharray: none; }
    .level { fill: none; stroke: #444; stroke-width: 0.8; stroke-dasharray: 2 3; }
    .cutter { fill: #9aa5ab; stroke: #2b3438; stroke-width: 1.25; fill-opacity: 0.85; }
    .shank { fill: #b8c1c6; }
    .touch-off { fill: #ffb000; stroke: #1d1d1d; stroke-width: 1.5; }
    .note, .name { font-size: 13px; fill: #1d1d1d; paint-order: stroke; stroke: #fbfcfd; stroke-width: 4px; stroke-linejoin: round; }
    .note { font-weight: 600; }
    .pass-note { fill: #7a1a12; }
    .name { fill: #3d474c; font-style: italic; }
    .end { text-anchor: end; }
    .middle { text-anchor: middle; }
    .start { text-anchor: start; }
    .depth { --sw-dim-color: #7a1a12; }
    .no-drawing { padding: 48px 16px; text-align: center; border: 1px dashed var(--mat-sys-outline); border-radius: 12px; color: var(--mat-sys-on-surface-variant); }
    @media print { .drawing { border: none; background: none; max-height: 78mm; } }
  `,
})
export class TaperDrawing {
  /** The set-up to draw, or null when the inputs give no answer. */
  readonly model = input.required<TaperSceneInput | null>();
  protected readonly noAnswerText = NO_ANSWER_TEXT;
  protected readonly undrawableText = UNDRAWABLE_TEXT;
  /** The drawing's width in view units: the width it has on screen. */
  private readonly width = hostWidth();
  /** The laid-out drawing. */
  protected readonly scene = computed<TaperScene | null>(() => {
    const model = this.model();
    return model ? layoutOrNull(() => taperScene(model, this.width())) : null;
  });
  /** A sentence describing the drawing for screen readers. */
  protected readonly description = computed(() => {
    const m = this.model();
    if (!m) return '';
    const h = m.holding;
    const plate = h?.kind === 'sine-plate' && h.unmakeable ? `on a sine plate whose stack, ${h.stackLabel}, the set cannot make` : 'on a sine plate set on gauge blocks';
    const held = { 'angle-block': 'on angle blocks in the vise', 'sine-plate': plate, 'tilted-vise': 'in a tilting vise' }[h?.kind ?? 'angle-block'];
    return `Part tilted ${m.labels.angle} ${held}, cutter touched off on the highest corner; depth to stop ${m.labels.depthToStop}, face length ${m.labels.faceLength}, end thickness ${m.labels.endThickness}.`;
  });
}
