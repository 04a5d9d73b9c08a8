import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';

/** Prominent warnings (a taper that runs out, a cut past the flutes) or a problem with the inputs. */
@Component({
  selector: 'sw-warnings',
  imports: [MatIcon],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (items().length) {
      <!-- The live region wraps the list: role="alert" on the <ul> itself would hide its list semantics. -->
      <div role="alert">
      <ul class="warnings" [class.problem]="tone() === 'problem'">
        @for (text of items(); track text) {
          <li class="warning">
            <mat-icon aria-hidden="true">{{ tone() === 'problem' ? 'error' : 'warning' }}</mat-icon>
            <span>{{ text }}</span>
          </li>
        }
      </ul>
      </div>
    }
  `,
  styles: `
    :host { display: block; }
    .warnings { list-style: none; margin: 0; padding: 0; display: grid; gap: 8px; }
    .warning {
      display: flex; gap: 12px; align-items: flex-start; padding: 12px 16px; border-radius: 12px;
      background: #fff4d6; color: #4a3200; border: 2px solid #b07d00; font-weight: 500;
    }
    .problem .warning { background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); border-color: var(--mat-sys-error); }
    @media print { .warning { background: none; padding: 4pt 6pt; } }
  `,
})
export class WarningList {
  /** One sentence per warning. */
  readonly items = input.required<readonly string[]>();
  /** 'warning' for feasibility warnings, 'problem' for inputs that give no answer. */
  readonly tone = input<'warning' | 'problem'>('warning');
}
