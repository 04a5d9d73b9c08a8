import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { ProblemDto } from '../../../shared/api/training';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { CautionPanel } from '../workbench/caution-panel';
import { localTimeText } from './due-text';
import { ExerciseCard, type ProblemView } from './exercise-card';
import { TrainingApi, type AssignmentWorkView } from './training-api';
import { STATUS_LABELS } from './work-status';

/** An apprentice's own copy of an assignment: every problem, answered and graded on the server. */
@Component({
  selector: 'sw-assignment-work-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, ExerciseCard, CautionPanel],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page work">
      <a mat-button routerLink="/training/assignments"><mat-icon>arrow_back</mat-icon> My assignments</a>
      @if (view(); as v) {
        <h1>{{ v.assignment.title }}</h1>
        <p class="meta">
          Due {{ time(v.assignment.dueAt) }} · set by {{ v.assignment.createdBy }}
          @if (summary(); as s) {
            · <strong>{{ statusLabel() }}</strong> · {{ s.correct }} of {{ s.total }} right ({{ s.score }}%)
          }
        </p>
        @if (v.assignment.instructions) { <p class="instructions">{{ v.assignment.instructions }}</p> }
        <p class="note">Each problem takes up to three answers; a right answer or the last try closes it and shows the worked solution.</p>
        @if (cautions().length) {
          <!-- Once for the page, not under every problem: the set-ups of the problems share them. -->
          <sw-cautions [items]="cautions()" heading="On the machine" />
        }
        <div class="problems">
          @for (p of v.problems; track p.position) {
            <sw-exercise-card [problem]="toView(p)" [heading]="'Problem ' + p.position" [busy]="busy() === p.position" [showCautions]="false"
                              [error]="errors()[p.position] ?? null" (answered)="answer(p.position, $event)" (hint)="hint(p.position)" />
          }
        </div>
      } @else if (failed()) {
        <h1>Assignment</h1>
        <p role="alert">{{ failed() }}</p>
      } @else {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the assignment" />
      }
    </section>
  `,
  styles: `
    .meta, .note { color: var(--mat-sys-on-surface-variant); }
    .instructions { max-width: 70ch; white-space: pre-line; }
    .problems { display: grid; gap: 16px; }
    sw-cautions { margin: 0 0 16px; }
  `,
})
export default class AssignmentWorkPage {
  private readonly api = inject(TrainingApi);

  /** The assignment id, from the route. */
  readonly id = input.required<string>();

  protected readonly view = signal<AssignmentWorkView | null>(null);
  protected readonly failed = signal<string | null>(null);
  /** Position of the problem whose request is on its way. */
  protected readonly busy = signal<number | null>(null);
  protected readonly errors = signal<Readonly<Record<number, string | undefined>>>({});
  protected readonly summary = computed(() => this.view()?.assignment.work[0] ?? null);
  protected readonly statusLabel = computed(() => {
    const s = this.summary();
    return s ? STATUS_LABELS[s.status] : '';
  });

  /** Every caution of the page's problems, each once (problems of one set-up share theirs). */
  protected readonly cautions = computed(() => [...new Set((this.view()?.problems ?? []).flatMap((p) => p.cautions))]);
  protected readonly time = (iso: string) => localTimeText(iso);

  constructor() {
    effect(() => void this.load(Number(this.id())));
  }

  /** The card's view of a problem. */
  protected toView(p: ProblemDto): ProblemView {
    return p;
  }

  /** Sends an answer to the server and shows its verdict. */
  protected async answer(position: number, text: string): Promise<void> {
    this.busy.set(position);
    this.errors.update((e) => ({ ...e, [position]: '' }));
    try {
      const result = await firstValueFrom(this.api.attempt(Number(this.id()), position, text));
      this.replace(result.problem);
      await this.load(Number(this.id()));
    } catch (err) {
      await this.refused(position, err, apiFieldErrors(err)['answer']);
    } finally {
      this.busy.set(null);
    }
  }

  /** Reveals the next hint of a problem. */
  protected async hint(position: number): Promise<void> {
    this.busy.set(position);
    this.errors.update((e) => ({ ...e, [position]: '' }));
    try {
      this.replace(await firstValueFrom(this.api.hint(Number(this.id()), position)));
    } catch (err) {
      await this.refused(position, err);
    } finally {
      this.busy.set(null);
    }
  }

  /**
   * Shows why an answer or hint was refused under its problem. A conflict (409: the problem was
   * closed from another page or device meanwhile) or a vanished assignment (404) means this page
   * is out of date: it is read again, so the problem shows its worked solution and the header its score.
   */
  private async refused(position: number, err: unknown, fieldMessage?: string): Promise<void> {
    this.errors.update((e) => ({ ...e, [position]: fieldMessage ?? apiErrorMessage(err) }));
    if (err instanceof HttpErrorResponse && (err.status === 409 || err.status === 404)) await this.load(Number(this.id()));
  }

  private replace(problem: ProblemDto): void {
    this.view.update((v) => (v ? { ...v, problems: v.problems.map((p) => (p.position === problem.position ? problem : p)) } : v));
  }

  private async load(id: number): Promise<void> {
    // An address such as /training/assignments/abc names no assignment: say so without asking.
    if (!Number.isSafeInteger(id) || id < 1) {
      this.failed.set('There is no such assignment: check the address, or open it from Training.');
      return;
    }
    try {
      this.view.set(await firstValueFrom(this.api.work(id)));
    } catch (err) {
      // The server says whether the assignment is gone (withdrawn by the lead) or not given to you.
      if (err instanceof HttpErrorResponse && err.status === 404) this.view.set(null);
      this.failed.set(apiErrorMessage(err));
    }
  }
}
