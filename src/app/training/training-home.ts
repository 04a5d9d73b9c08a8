import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { catchError, of } from 'rxjs';

import { Auth } from '../core/auth';
import { localTimeText } from './due-text';
import { LESSONS } from './lessons';
import { TrainingApi } from './training-api';
import { STATUS_LABELS } from './work-status';

/** The Training area's front page: the course's lessons, practice, and the assignments that concern you. */
@Component({
  selector: 'sw-training-home',
  imports: [RouterLink, MatCardModule, MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page training">
      <h1>Training</h1>
      <p class="lead-in">The course <strong>Angles on the mill</strong>: five short lessons on the right-triangle trig behind every set-up, each on a drawing you can move, each ending in practice problems.</p>
      <nav class="links" aria-label="Training">
        <a mat-flat-button routerLink="/training/practice"><mat-icon>fitness_center</mat-icon> Practice</a>
        <a mat-stroked-button routerLink="/training/assignments"><mat-icon>assignment</mat-icon> {{ canAssign() ? 'Assignments & scores' : 'My assignments' }}</a>
      </nav>

      @if (!canAssign() && mine().length) {
        <h2>Your assignments</h2>
        <ul class="mine">
          @for (a of mine(); track a.id) {
            <li>
              <a [routerLink]="['/training/assignments', a.id]">{{ a.title }}</a>
              <span class="status" [attr.data-status]="a.work[0]?.status">{{ statusLabel(a.work[0]?.status) }}</span>
              <span class="due">due {{ time(a.dueAt) }}</span>
            </li>
          }
        </ul>
      }

      <h2>Lessons</h2>
      <ol class="lessons">
        @for (l of lessons; track l.slug; let i = $index) {
          <li>
            <mat-card appearance="outlined">
              <mat-card-header>
                <mat-card-title><a [routerLink]="['/training/lessons', l.slug]">{{ i + 1 }}. {{ l.title }}</a></mat-card-title>
                <mat-card-subtitle>{{ l.summary }}</mat-card-subtitle>
              </mat-card-header>
            </mat-card>
          </li>
        }
      </ol>
    </section>
  `,
  styles: `
    .lead-in { max-width: 70ch; }
    .links { display: flex; flex-wrap: wrap; gap: 12px; margin: 12px 0 20px; }
    h2 { font: var(--mat-sys-title-large); margin: 20px 0 8px; }
    .lessons { list-style: none; padding: 0; display: grid; grid-template-columns: repeat(auto-fill, minmax(280px, 1fr)); gap: 12px; }
    .lessons mat-card { height: 100%; padding-bottom: 12px; }
    .lessons a { color: inherit; }
    .mine { padding-left: 1.2em; display: grid; gap: 6px; }
    .status, .due { margin-left: 12px; color: var(--mat-sys-on-surface-variant); }
    .status[data-status='missing'], .status[data-status='late'] { color: var(--mat-sys-error); font-weight: 600; }
  `,
})
export default class TrainingHome {
  private readonly auth = inject(Auth);
  private readonly api = inject(TrainingApi);

  protected readonly lessons = LESSONS;
  /** A due time on this browser's clock, with the zone named. */
  protected readonly time = (iso: string) => localTimeText(iso);
  protected readonly canAssign = computed(() => ['lead', 'admin'].includes(this.auth.user()?.role ?? ''));
  /** The caller's own assignments (empty for leads and admins, who see the full list on the assignments page). */
  protected readonly mine = toSignal(this.api.assignments().pipe(catchError(() => of([]))), { initialValue: [] });
  protected statusLabel(status: string | undefined): string {
    return status ? STATUS_LABELS[status as keyof typeof STATUS_LABELS] : '';
  }
}
