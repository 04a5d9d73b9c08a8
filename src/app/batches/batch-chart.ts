import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { CheckStats } from '../../../shared/api/batch';
import { chartGeometry } from './batch-chart-geometry';

/** One check of a batch run drawn per part, with its tolerance band (D3 computes, the template draws). */
@Component({
  selector: 'app-batch-chart',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let g = geometry();
    <figure>
      <figcaption>{{ stats().label }} ({{ stats().unit }}): band {{ stats().low }} – {{ stats().high }}</figcaption>
      <svg [attr.viewBox]="g.viewBox" role="img" [attr.aria-label]="label()">
        <rect class="band" [attr.x]="g.band.x" [attr.y]="g.band.y" [attr.width]="g.band.width" [attr.height]="g.band.height" />
        @for (t of g.yTicks; track t.label) {
          <line class="grid" [attr.x1]="g.plot.left" [attr.x2]="g.plot.right" [attr.y1]="t.y" [attr.y2]="t.y" />
          <text class="tick" [attr.x]="g.plot.left - 6" [attr.y]="t.y + 4" text-anchor="end">{{ t.label }}</text>
        }
        @for (t of g.xTicks; track t.label) {
          <text class="tick" [attr.x]="t.x" [attr.y]="g.plot.bottom + 18" text-anchor="middle">{{ t.label }}</text>
        }
        <line class="nominal" [attr.x1]="g.plot.left" [attr.x2]="g.plot.right" [attr.y1]="g.nominalY" [attr.y2]="g.nominalY" />
        @if (g.firstY !== null) {
          <line class="first" [attr.x1]="g.plot.left" [attr.x2]="g.plot.right" [attr.y1]="g.firstY" [attr.y2]="g.firstY" />
        }
        <path class="trace" [attr.d]="g.path" [attr.stroke-width]="g.marks.trace" />
        @for (p of g.points; track p.partNo) {
          @if (!p.pass || g.marks.r > 0) {
            <circle [class.fail]="!p.pass" [attr.cx]="p.x" [attr.cy]="p.y" [attr.r]="p.pass ? g.marks.r : g.marks.failR" [attr.stroke-width]="g.marks.outline">
              <title>Part {{ p.partNo }}: {{ p.value }}{{ p.pass ? '' : ' (out of tolerance)' }}</title>
            </circle>
          }
        }
      </svg>
      <div class="legend"><span class="key band-key"></span> tolerance band <span class="key nominal-key"></span> nominal <span class="key first-key"></span> first part</div>
    </figure>
  `,
  styles: `
    figure { margin: 0; }
    figcaption { font: var(--mat-sys-title-small); margin-bottom: 4px; }
    svg { width: 100%; height: auto; display: block; }
    .band { fill: var(--mat-sys-primary-container); opacity: 0.7; }
    .grid { stroke: var(--mat-sys-outline-variant); stroke-width: 0.5; }
    .tick { font-size: 11px; fill: var(--mat-sys-on-surface-variant); }
    .nominal { stroke: var(--mat-sys-primary); stroke-width: 1.5; }
    .first { stroke: var(--mat-sys-tertiary); stroke-dasharray: 5 4; }
    .trace { fill: none; stroke: var(--mat-sys-on-surface); }
    circle { fill: var(--mat-sys-primary); stroke: var(--mat-sys-surface); }
    circle.fail { fill: var(--mat-sys-error); }
    .legend { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); display: flex; gap: 6px; align-items: center; flex-wrap: wrap; }
    .key { display: inline-block; width: 18px; height: 10px; margin-left: 8px; }
    .band-key { background: var(--mat-sys-primary-container); }
    .nominal-key { border-top: 2px solid var(--mat-sys-primary); height: 0; }
    .first-key { border-top: 2px dashed var(--mat-sys-tertiary); height: 0; }
  `,
})
export class BatchChart {
  /** Statistics of the check, with each part's value. */
  readonly stats = input.required<CheckStats>();
  /** Parts planned in the run (the chart leaves room for them). */
  readonly partCount = input.required<number>();

  protected readonly geometry = computed(() => chartGeometry(this.stats(), this.partCount()));
  protected readonly label = computed(() => {
    const s = this.stats();
    return `${s.label} per part: ${s.n} parts, ${s.failCount} outside the band ${s.low} to ${s.high} ${s.unit}`;
  });
}
