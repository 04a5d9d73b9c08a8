import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCardModule } from '@angular/material/card';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { ReviewProblemDto, WorkReviewDto } from '../../../shared/api/training';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth } from '../core/auth';
import { localTimeText } from './due-text';
import { TrainingApi } from './training-api';
import { unitSuffix, withUnit } from './unit-text';
import { STATUS_ICONS, STATUS_LABELS } from './work-status';

/**
 * One apprentice's work on an assignment as their lead (or an admin) reads it: every answer with
 * its grade and time, the hints used, and each problem's worked solution even while it is open.
 * Nothing here changes the apprentice's answers; a closed problem can be graded by hand, with a
 * reason the apprentice reads (an answer right in another form, a slip in the problem).
 */
@Component({
  selector: 'sw-work-review-page',
  imports: [RouterLink, FormsModule, MatButtonModule, MatButtonToggleModule, MatCardModule, MatExpansionModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page review">
      <a mat-button routerLink="/training/assignments"><mat-icon>arrow_back</mat-icon> Assignments &amp; scores</a>
      @if (view(); as v) {
        <h1>{{ v.apprentice.name }}: {{ v.assignment.title }}</h1>
        <p class="meta">
          Due {{ time(v.assignment.dueAt) }}
          @if (summary(); as s) {
            · <span class="status" [attr.data-status]="s.status"><mat-icon aria-hidden="true" inline>{{ statusIcons[s.status] }}</mat-icon>
            <strong>{{ statusLabels[s.status] }}</strong></span>
            · {{ s.correct }} of {{ s.total }} right ({{ s.score }}%)
          }
        </p>
        <p class="note">The answers are the apprentice's own and cannot be changed here. The worked solutions show here even while a problem is open; the apprentice sees them only once it closes. A closed problem can be graded by hand, with a reason the apprentice reads.</p>
        <div class="problems">
          @for (p of v.problems; track p.position) {
            <mat-card appearance="outlined" class="problem">
              <mat-card-header>
                <mat-card-title><h2>Problem {{ p.position }}: {{ p.title }}</h2></mat-card-title>
                <mat-card-subtitle>
                  @if (p.closed) {
                    Closed · {{ p.grade ? (p.correct ? 'counted right by hand' : 'counted wrong by hand') : p.correct ? 'answered right' : 'not answered right' }}
                  } @else {
                    Open · {{ p.attemptsLeft }} {{ p.attemptsLeft === 1 ? 'try' : 'tries' }} left
                  }
                  · hints used {{ p.hintsUsed }} of {{ p.hintsAvailable }}
                </mat-card-subtitle>
              </mat-card-header>
              <mat-card-content>
                <p class="prompt">{{ p.prompt }}</p>
                <dl class="givens">
                  @for (g of p.givens; track g.label) {
                    <div><dt>{{ g.label }}</dt><dd>{{ g.value }}{{ suffix(g.value, g.unit) }}</dd></div>
                  }
                </dl>
                <h3>Answers</h3>
                <ol class="attempts" [attr.aria-label]="'Answers to problem ' + p.position">
                  @for (a of p.attempts; track $index) {
                    <li [class.right]="a.correct" [class.wrong]="!a.correct">
                      <mat-icon aria-hidden="true">{{ a.correct ? 'check_circle' : 'cancel' }}</mat-icon>
                      {{ withUnit(a.answer, p.unit) }} — <strong class="verdict">{{ a.correct ? 'Right' : 'Wrong' }}</strong> · <span class="at">{{ time(a.at) }}</span>
                    </li>
                  } @empty {
                    <li class="none">No answer yet.</li>
                  }
                </ol>
                @if (p.grade; as g) {
                  <p class="grade"><mat-icon aria-hidden="true">rate_review</mat-icon>
                    <span>{{ g.by }} counted it {{ g.correct ? 'right' : 'wrong' }} on {{ time(g.at) }}: “{{ g.note }}”</span></p>
                }
                @if (p.closed) {
                  @if (grading() === p.position) {
                    <form class="grade-form" (ngSubmit)="saveGrade(p)" [attr.aria-label]="'New grade of problem ' + p.position">
                      <mat-button-toggle-group name="counts" [ngModel]="gradeRight()" (ngModelChange)="gradeRight.set($event)" [attr.aria-label]="'Problem ' + p.position + ' counts as'">
                        <mat-button-toggle [value]="true">Counts as right</mat-button-toggle>
                        <mat-button-toggle [value]="false">Counts as wrong</mat-button-toggle>
                      </mat-button-toggle-group>
                      <mat-form-field appearance="outline" subscriptSizing="dynamic" class="reason">
                        <mat-label>Why, for the apprentice to read</mat-label>
                        <textarea matInput name="reason" rows="2" maxlength="500" [ngModel]="gradeNote()" (ngModelChange)="gradeNote.set($event)"></textarea>
                        @if (gradeError()) { <mat-hint class="field-error" role="alert">{{ gradeError() }}</mat-hint> }
                      </mat-form-field>
                      <div class="grade-actions">
                        <button mat-flat-button type="submit" [disabled]="savingGrade()">Save grade</button>
                        <button mat-button type="button" (click)="grading.set(null)">Cancel</button>
                      </div>
                    </form>
                  } @else {
                    <button mat-stroked-button type="button" class="grade-button" (click)="openGrade(p)" [attr.aria-label]="'Grade by hand: problem ' + p.position">
                      <mat-icon>rate_review</mat-icon> Grade by hand
                    </button>
                  }
                }
                <mat-expansion-panel class="solution">
                  <mat-expansion-panel-header>
                    <mat-panel-title>Worked solution</mat-panel-title>
                    <mat-panel-description>answer {{ withUnit(p.solution.answer, p.unit) }}</mat-panel-description>
                  </mat-expansion-panel-header>
                  <ol class="steps">
                    @for (s of p.solution.steps; track $index) {
                      <li><span class="label">{{ s.label }}</span>: <i>{{ s.formula }}</i> → {{ s.substituted }} = <strong>{{ s.value }}</strong>{{ suffix(s.value, s.unit) }}</li>
                    }
                  </ol>
                  <p class="exact">
                    {{ p.answerLabel }} = <strong>{{ p.solution.answer }}</strong>{{ suffix(p.solution.answer, p.unit) }}
                    (exact {{ p.solution.exact }}; answers within {{ withUnit('±' + p.tolerance, p.unit) }} are right)
                  </p>
                </mat-expansion-panel>
              </mat-card-content>
            </mat-card>
          }
        </div>
      } @else if (failed()) {
        <h1>Apprentice work</h1>
        <p role="alert" class="failed">{{ failed() }}</p>
        @if (ownWork(); as link) {
          <a mat-stroked-button [routerLink]="link"><mat-icon>assignment</mat-icon> Open your own work on this assignment</a>
        }
      } @else {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the apprentice's work" />
      }
    </section>
  `,
  styles: `
    .meta, .note { color: var(--mat-sys-on-surface-variant); }
    .meta .status { display: inline-flex; gap: 4px; align-items: center; }
    [data-status='missing'], [data-status='late'] { color: var(--mat-sys-error); }
    .problems { display: grid; gap: 16px; }
    h2 { margin: 0; font: var(--mat-sys-title-large); }
    h3 { margin: 12px 0 4px; font: var(--mat-sys-title-small); }
    .prompt { font: var(--mat-sys-body-large); }
    .givens { display: flex; flex-wrap: wrap; gap: 8px 24px; margin: 0 0 12px; }
    .givens div { display: grid; }
    dt { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; font: var(--mat-sys-title-medium); font-variant-numeric: tabular-nums; }
    .attempts { list-style: none; padding: 0; margin: 0 0 12px; display: grid; gap: 4px; font-variant-numeric: tabular-nums; }
    .attempts li { display: flex; flex-wrap: wrap; gap: 4px 6px; align-items: center; }
    .attempts .at, .none { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    .right .verdict, .right mat-icon { color: var(--mat-sys-primary); }
    .wrong .verdict, .wrong mat-icon { color: var(--mat-sys-error); }
    .steps { display: grid; gap: 6px; padding-left: 1.4em; font-variant-numeric: tabular-nums; overflow-wrap: anywhere; }
    .label { font-weight: 600; }
    .exact { overflow-wrap: anywhere; }
    .failed { color: var(--mat-sys-error); }
    .grade { display: flex; gap: 6px; align-items: flex-start; overflow-wrap: anywhere; }
    .grade mat-icon { flex: none; color: var(--mat-sys-primary); }
    .grade-form { display: grid; gap: 8px; margin: 0 0 12px; max-width: 640px; }
    .grade-form mat-button-toggle-group { justify-self: start; max-width: 100%; flex-wrap: wrap; }
    .grade-actions { display: flex; gap: 8px; flex-wrap: wrap; }
    .grade-button { margin: 0 0 12px; }
    .field-error { color: var(--mat-sys-error); }
  `,
})
export default class WorkReviewPage {
  private readonly api = inject(TrainingApi);
  private readonly auth = inject(Auth);

  /** The assignment id, from the route. */
  readonly id = input.required<string>();
  /** The apprentice's user id, from the route. */
  readonly userId = input.required<string>();

  protected readonly view = signal<WorkReviewDto | null>(null);
  protected readonly failed = signal<string | null>(null);
  /** Where an apprentice who opened the lead's view of their own work finds it (null otherwise). */
  protected readonly ownWork = signal<string | null>(null);
  protected readonly summary = computed(() => this.view()?.assignment.work[0] ?? null);
  protected readonly statusLabels = STATUS_LABELS;
  protected readonly statusIcons = STATUS_ICONS;
  /** Times on this browser's clock, with the zone named. */
  protected readonly time = (iso: string) => localTimeText(iso);
  protected readonly withUnit = withUnit;
  protected readonly suffix = unitSuffix;

  /** The problem whose grade form is open, what it will count as, and why. */
  protected readonly grading = signal<number | null>(null);
  protected readonly gradeRight = signal(true);
  protected readonly gradeNote = signal('');
  protected readonly gradeError = signal<string | null>(null);
  protected readonly savingGrade = signal(false);

  constructor() {
    effect(() => void this.load(this.id(), this.userId()));
  }

  /** Opens the grade form of a closed problem, set to the other grade than it has now. */
  protected openGrade(p: ReviewProblemDto): void {
    this.grading.set(p.position);
    this.gradeRight.set(!p.correct);
    this.gradeNote.set('');
    this.gradeError.set(null);
  }

  /** Saves a grade by hand; the score above follows. */
  protected async saveGrade(p: ReviewProblemDto): Promise<void> {
    this.gradeError.set(null);
    if (this.gradeNote().trim().length < 3) {
      this.gradeError.set('Say why the grade changes, for the apprentice to read (3 characters or more).');
      return;
    }
    this.savingGrade.set(true);
    try {
      await firstValueFrom(this.api.grade(this.id(), this.userId(), p.position, { correct: this.gradeRight(), note: this.gradeNote() }));
      this.grading.set(null);
      this.view.set(await firstValueFrom(this.api.review(this.id(), this.userId())));
    } catch (err) {
      const fields = apiFieldErrors(err);
      this.gradeError.set(fields['note'] ?? fields['correct'] ?? apiErrorMessage(err));
    } finally {
      this.savingGrade.set(false);
    }
  }

  /** Loads the work; a refusal (403, 404) shows the server's own message. */
  private async load(id: string, userId: string): Promise<void> {
    this.view.set(null);
    this.failed.set(null);
    this.ownWork.set(null);
    try {
      this.view.set(await firstValueFrom(this.api.review(id, userId)));
    } catch (err) {
      const role = this.auth.user()?.role;
      if (err instanceof HttpErrorResponse && err.status === 403 && role !== 'lead' && role !== 'admin') {
        // A lead's link sent on: say what the page is and where the reader's own work is.
        const own = String(this.auth.user()?.id) === userId;
        this.failed.set(
          own
            ? "This is the lead hand's view of your work, with every worked solution shown; only a lead hand or an admin opens it. Your own page for this assignment is below."
            : "This page shows an apprentice's answers to their lead hand; only a lead hand or an admin opens it.",
        );
        this.ownWork.set(own ? `/training/assignments/${id}` : null);
        return;
      }
      this.failed.set(apiErrorMessage(err));
    }
  }
}
