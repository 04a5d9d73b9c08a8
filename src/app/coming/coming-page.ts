import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

/** Placeholder for an area still being built; the area's name comes from route data `heading`. */
@Component({
  selector: 'app-coming-page',
  imports: [RouterLink, MatIconModule, MatButtonModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page">
      <h1>{{ heading() }}</h1>
      <p class="note"><mat-icon>construction</mat-icon> This area is being built. It will appear here in a coming release.</p>
      <a mat-stroked-button routerLink="/"><mat-icon>home</mat-icon> Back to all areas</a>
    </section>
  `,
  styles: `
    .note { display: flex; gap: 12px; align-items: center; font: var(--mat-sys-body-large); color: var(--mat-sys-on-surface-variant); }
  `,
})
export default class ComingPage {
  /** The area's name, bound from the route's `data.heading`. */
  // Route-bound inputs are reset to undefined when the route has no such data.
  readonly areaName = input<string | undefined>(undefined, { alias: 'heading' });
  /** The page heading. */
  protected readonly heading = computed(() => this.areaName() || 'Coming soon');
}
