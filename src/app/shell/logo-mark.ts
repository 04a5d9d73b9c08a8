import { ChangeDetectionStrategy, Component } from '@angular/core';

/** The Slantwise mark: a right triangle with the arc of its acute angle. */
@Component({
  selector: 'app-logo-mark',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg viewBox="0 0 32 32" width="36" height="36" aria-hidden="true" focusable="false">
      <path class="edge" d="M5 26 H27 V8 Z" />
      <path class="square" d="M23 26 V22 H27" />
      <path class="arc" d="M18 26 A13 13 0 0 0 15.06 17.77" />
    </svg>
  `,
  styles: `
    :host { display: inline-flex; }
    path { fill: none; stroke-linecap: round; stroke-linejoin: round; }
    .edge { stroke: currentColor; stroke-width: 2.4; }
    .square { stroke: currentColor; stroke-width: 1.4; opacity: 0.8; }
    .arc { stroke: var(--mat-sys-tertiary-fixed-dim, #ecbe8e); stroke-width: 2.6; }
  `,
})
export class LogoMark {}
