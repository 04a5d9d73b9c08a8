import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

/** Shown for any address that matches no page. */
@Component({
  selector: 'app-not-found-page',
  imports: [RouterLink, MatIconModule, MatButtonModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page">
      <h1>Page not found</h1>
      <p>There is no page at this address. It may have moved, or the link may be mistyped.</p>
      <a mat-flat-button routerLink="/"><mat-icon>home</mat-icon> Go to the home page</a>
    </section>
  `,
})
export default class NotFoundPage {}
