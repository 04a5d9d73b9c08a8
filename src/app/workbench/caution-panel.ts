import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';

/** The line every caution panel ends with: these notes never replace the rules where the work is done. */
export const DEFER_TO_SHOP_RULES =
  'These notes are reminders, not a safety procedure: your shop rules, local regulations and the machine maker\u2019s instructions come first.';

/** Safety and care cautions for work that involves cutting or clamping, deferring to shop rules. */
@Component({
  selector: 'sw-cautions',
  imports: [MatIcon],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="caution cautions" [attr.aria-label]="heading()">
      <mat-icon aria-hidden="true">health_and_safety</mat-icon>
      <div>
        <h2 class="cautions-heading">{{ heading() }}</h2>
        <ul class="caution-items">
          @for (text of items(); track text) {
            <li>{{ text }}</li>
          }
        </ul>
        <p class="defer">{{ deferText }}</p>
      </div>
    </section>
  `,
  styles: `
    :host { display: block; }
    .cautions-heading { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .caution-items { margin: 0; padding-left: 1.2em; display: grid; gap: 4px; }
    .defer { margin: 8px 0 0; font-style: italic; }
    @media print {
      .cautions { padding: 4pt 6pt; font-size: 8.5pt; line-height: 1.25; }
      .cautions-heading { font-size: 10pt; margin: 0; }
      .caution-items { gap: 0; }
      .defer { margin-top: 2pt; }
    }
  `,
})
export class CautionPanel {
  /** One caution per line, each naming its source. */
  readonly items = input.required<readonly string[]>();
  /** The panel's heading. */
  readonly heading = input('Before you clamp and cut');
  /** The closing line deferring to shop rules and local regulations. */
  protected readonly deferText = DEFER_TO_SHOP_RULES;
}
