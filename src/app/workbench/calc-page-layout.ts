import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/**
 * The frame every workbench page shares: a heading and intro, a toolbar row (unit toggle, save,
 * print), then the form beside the drawing with the results under it (two columns from 960 px;
 * below that the drawing comes first, then the form, then the results), and full-width extras
 * (warnings, "Show the work", cautions) underneath.
 *
 * Slots, by attribute on the projected element:
 * `pageActions`, `pageDrawing`, `pageForm`, `pageResults`, and anything else goes below.
 * Printing gives one sheet: heading, drawing and results; the form and actions are left off.
 */
@Component({
  selector: 'sw-calc-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page calc-page" [attr.aria-labelledby]="headingId()">
      <header class="calc-head">
        <div class="calc-titles">
          <h1 [id]="headingId()">{{ heading() }}</h1>
          @if (intro()) {
            <p class="calc-intro">{{ intro() }}</p>
          }
        </div>
        <div class="calc-actions no-print"><ng-content select="[pageActions]" /></div>
      </header>
      <div class="calc-grid">
        <div class="calc-drawing"><ng-content select="[pageDrawing]" /></div>
        <div class="calc-form no-print"><ng-content select="[pageForm]" /></div>
        <div class="calc-results"><ng-content select="[pageResults]" /></div>
      </div>
      <div class="calc-extras"><ng-content /></div>
    </section>
  `,
  styles: `
    :host { display: block; }
    .calc-head { display: flex; flex-wrap: wrap; gap: 8px 24px; align-items: flex-end; justify-content: space-between; margin-bottom: 16px; }
    .calc-titles h1 { margin: 0 0 4px; }
    .calc-intro { margin: 0; max-width: 70ch; color: var(--mat-sys-on-surface-variant); }
    .calc-actions { display: flex; flex-wrap: wrap; gap: 8px; align-items: center; }
    .calc-grid {
      display: grid;
      gap: 16px 24px;
      grid-template-columns: minmax(0, 1fr);
      grid-template-areas: 'drawing' 'form' 'results';
    }
    .calc-drawing { grid-area: drawing; min-width: 0; }
    .calc-form { grid-area: form; min-width: 0; }
    .calc-results { grid-area: results; min-width: 0; }
    .calc-extras { display: flex; flex-direction: column; gap: 16px; margin-top: 16px; }
    @media (min-width: 960px) {
      .calc-grid {
        grid-template-columns: minmax(320px, 5fr) minmax(0, 7fr);
        grid-template-rows: auto 1fr;
        grid-template-areas: 'form drawing' 'form results';
        align-items: start;
      }
    }
    @media print {
      .calc-grid { display: block; }
      .calc-drawing { break-inside: avoid; margin-bottom: 8pt; }
      .calc-intro { display: none; }
      .calc-head { margin-bottom: 8pt; }
      .calc-extras { gap: 6pt; margin-top: 6pt; }
    }
  `,
})
export class CalcPageLayout {
  /** The page's heading (h1). */
  readonly heading = input.required<string>();
  /** One or two sentences under the heading saying what the page works out. */
  readonly intro = input<string>('');
  /** Id of the h1, which names the page region. */
  readonly headingId = input<string>('calc-page-heading');
}
