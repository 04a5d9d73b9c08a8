import { CdkCopyToClipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import { MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';

/** One number on a page's result list. */
export interface ResultItem {
  /** What the number is, in trade words ("Depth to stop"). */
  readonly label: string;
  /** The number as text at the unit's resolution ("0.3916"), or a short text ("7°30'00\""). */
  readonly value: string;
  /** Its unit ("in", "mm", "°", or "" for none). */
  readonly unit: string;
  /** A short line under the number (how to read it, where it is measured from). */
  readonly note?: string;
  /** Whether this is a number the machinist stops or sets at: shown larger. */
  readonly emphasis?: boolean;
}

/** How long the "copied" tick stays on a copy button, in milliseconds. */
const COPIED_TICK_MS = 1_500;

/** The results of a calculation: label, value and unit, each with a button that copies the value. */
@Component({
  selector: 'sw-results',
  imports: [CdkCopyToClipboard, MatIconButton, MatIcon],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 class="results-heading">{{ heading() }}</h2>
    @if (items().length) {
      <dl class="results" aria-live="polite">
        @for (item of items(); track item.label) {
          <div class="result" [class.emphasis]="item.emphasis">
            <dt class="result-label">{{ item.label }}</dt>
            <dd class="result-value">
              <span class="value-text"><span class="number">{{ item.value }}</span>@if (item.unit) {<span class="unit">{{ unitText(item.unit) }}</span>}</span>
              <button mat-icon-button type="button" class="copy no-print" [cdkCopyToClipboard]="item.value"
                      (cdkCopyToClipboardCopied)="markCopied(item.label, $event)"
                      [attr.aria-label]="'Copy ' + item.label + ' ' + item.value">
                <mat-icon aria-hidden="true">{{ copied() === item.label ? 'check' : 'content_copy' }}</mat-icon>
              </button>
            </dd>
            @if (item.note) {
              <dd class="result-note">{{ item.note }}</dd>
            }
          </div>
        }
      </dl>
    } @else {
      <p class="no-results" aria-live="polite">{{ emptyText() }}</p>
    }
    <span class="cdk-visually-hidden" aria-live="polite">{{ copied() ? copied() + ' copied' : '' }}</span>
  `,
  styles: `
    :host { display: block; }
    .results-heading { font: var(--mat-sys-title-medium); margin: 0 0 8px; }
    .results { margin: 0; display: grid; gap: 4px; grid-template-columns: repeat(auto-fill, minmax(220px, 1fr)); }
    .result { padding: 6px 4px 6px 12px; border-radius: 10px; background: var(--mat-sys-surface-container-low); border-left: 4px solid var(--mat-sys-outline-variant); }
    .result.emphasis { background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container); border-left-color: var(--mat-sys-primary); }
    .result-label { font: var(--mat-sys-label-large); }
    .result-value { margin: 0; display: flex; align-items: center; justify-content: space-between; gap: 4px; }
    .number { font: var(--mat-sys-title-large); font-variant-numeric: tabular-nums; }
    .emphasis .number { font: var(--mat-sys-headline-small); font-weight: 600; }
    .unit { font: var(--mat-sys-body-large); }
    .result-note { margin: 0 0 2px; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .emphasis .result-note { color: inherit; }
    .no-results { color: var(--mat-sys-on-surface-variant); margin: 0; }
    @media print {
      .results { grid-template-columns: repeat(3, 1fr); }
      .result { background: none !important; border-left-width: 2px; padding: 2pt 4pt; }
      .number { font-size: 12pt; }
      .emphasis .number { font-size: 14pt; }
    }
  `,
})
export class ResultList {
  /** The numbers to show. */
  readonly items = input.required<readonly ResultItem[]>();
  /** Heading above the list. */
  readonly heading = input('Results');
  /** Shown when there are no numbers (the inputs have a problem). */
  readonly emptyText = input('Fix the highlighted inputs to see the results.');

  /** A unit after its number: angle marks close up ("14.5°", "4.26″"), other units after a space ("0.3916 in"). */
  protected unitText(unit: string): string {
    return /^[°′″'"]$/.test(unit) ? unit : `\u00a0${unit}`;
  }

  /** Label of the item just copied, for the tick and the screen-reader notice. */
  protected readonly copied = signal<string | null>(null);
  private tickTimer: ReturnType<typeof setTimeout> | undefined;

  /** Shows a tick on the copied item's button for a moment. */
  protected markCopied(label: string, succeeded: boolean): void {
    if (!succeeded) return;
    this.copied.set(label);
    clearTimeout(this.tickTimer);
    this.tickTimer = setTimeout(() => this.copied.set(null), COPIED_TICK_MS);
  }
}
