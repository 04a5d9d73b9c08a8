import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';

import type { Step } from '../../../shared/calc/step';

/** "Show the work": the derivation of a result, one step per line (formula, values put in, result). */
@Component({
  selector: 'sw-derivation',
  imports: [MatExpansionModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-expansion-panel class="derivation" [expanded]="expanded()">
      <mat-expansion-panel-header>
        <mat-panel-title>{{ heading() }}</mat-panel-title>
        <mat-panel-description>{{ steps().length }} {{ steps().length === 1 ? 'step' : 'steps' }}</mat-panel-description>
      </mat-expansion-panel-header>
      <ol class="steps">
        @for (s of steps(); track $index) {
          <li class="step">
            <span class="step-label">{{ s.label }}</span>
            <span class="formula">{{ s.formula }}</span>
            <span class="substituted">{{ s.substituted }}</span>
            <span class="step-result">= <strong>{{ s.value }}</strong>{{ s.unit ? ' ' + s.unit : '' }}</span>
          </li>
        } @empty {
          <li class="step">No derivation: fix the inputs first.</li>
        }
      </ol>
    </mat-expansion-panel>
  `,
  styles: `
    :host { display: block; }
    .steps { margin: 0; padding-left: 1.5em; display: grid; gap: 10px; }
    .step { display: grid; gap: 2px; }
    .step-label { font: var(--mat-sys-title-small); }
    .formula { font-family: 'IBM Plex Sans', serif; font-style: italic; }
    .substituted, .formula { font-variant-numeric: tabular-nums; overflow-wrap: anywhere; }
    .substituted { color: var(--mat-sys-on-surface-variant); }
    @media print { :host { display: none; } }
  `,
})
export class DerivationPanel {
  /** The steps, in the order they were worked. */
  readonly steps = input.required<readonly Step[]>();
  /** The panel's title. */
  readonly heading = input('Show the work');
  /** Whether the panel starts open. */
  readonly expanded = input(false);
}
