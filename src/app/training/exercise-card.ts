import { ChangeDetectionStrategy, Component, ElementRef, afterRenderEffect, computed, input, linkedSignal, output, viewChild } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { GivenDto, StepDto } from '../../../shared/api/training';
import { CautionPanel } from '../workbench/caution-panel';
import { unitSuffix, withUnit } from './unit-text';

/** What an exercise card shows: one problem, in practice or in an assignment. */
export interface ProblemView {
  title: string;
  prompt: string;
  givens: readonly GivenDto[];
  answerLabel: string;
  unit: string;
  tolerance: string;
  hints: readonly StepDto[];
  hintsAvailable: number;
  attempts: ReadonlyArray<{ answer: string; correct: boolean }>;
  /** Answers left before the problem closes, or null for unlimited (practice). */
  attemptsLeft: number | null;
  closed: boolean;
  correct: boolean;
  solution: { answer: string; steps: readonly StepDto[] } | null;
  cautions: readonly string[];
  /** A lead's grade by hand of the closed problem, with their reason (assignments only). */
  grade?: { correct: boolean; note: string; by: string; at: string } | null;
}

/**
 * One problem: the question and givens, hints revealed one step at a time, an answer box, the
 * verdict of each answer, and the worked solution once the problem is closed. Presentational:
 * the page checks answers (locally in practice, on the server in an assignment).
 */
@Component({
  selector: 'sw-exercise-card',
  imports: [FormsModule, MatCardModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, CautionPanel],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card appearance="outlined" class="exercise">
      <mat-card-header>
        <mat-card-title><h3>{{ heading() }}</h3></mat-card-title>
        <mat-card-subtitle>{{ problem().title }}</mat-card-subtitle>
      </mat-card-header>
      <mat-card-content>
        <p class="prompt">{{ problem().prompt }}</p>
        <dl class="givens">
          @for (g of problem().givens; track g.label) {
            <div><dt>{{ g.label }}</dt><dd>{{ g.value }}{{ suffix(g.value, g.unit) }}</dd></div>
          }
        </dl>

        @if (!problem().closed && problem().hints.length) {
          <ol class="hints" aria-label="Hints">
            @for (h of problem().hints; track $index) {
              <li><span class="label">{{ h.label }}</span> <i>{{ h.formula }}</i> → {{ h.substituted }} = <strong>{{ h.value }}</strong>{{ suffix(h.value, h.unit) }}</li>
            }
          </ol>
        }

        @if (problem().attempts.length) {
          <ul class="attempts" aria-label="Your answers">
            @for (a of problem().attempts; track $index) {
              <li [class.right]="a.correct" [class.wrong]="!a.correct">
                <mat-icon aria-hidden="true">{{ a.correct ? 'check_circle' : 'cancel' }}</mat-icon>
                {{ answerText(a.answer) }} — {{ a.correct ? 'correct' : wrongText() }}
              </li>
            }
          </ul>
        }

        @if (!problem().closed) {
          <form class="answer" (ngSubmit)="submit()">
            <mat-form-field appearance="outline">
              <mat-label>{{ problem().answerLabel }}</mat-label>
              <!-- Read only, not disabled, while the server answers: the box keeps the keyboard focus. -->
              <input matInput name="answer" [ngModel]="draft()" (ngModelChange)="draft.set($event)" autocomplete="off" [readonly]="busy()">
              <span matTextSuffix>{{ problem().unit }}</span>
              <mat-hint>{{ checkedText() }}{{ attemptsText() }}</mat-hint>
            </mat-form-field>
            @if (error()) { <p class="error" role="alert">{{ error() }}</p> }
            <div class="actions">
              <button mat-flat-button type="submit" [disabled]="busy() || !draft().trim()" disabledInteractive><mat-icon>task_alt</mat-icon> Check answer</button>
              <button mat-stroked-button type="button" (click)="askHint()" [disabled]="busy() || !hintsLeft()" disabledInteractive>
                <mat-icon>lightbulb</mat-icon> Hint {{ problem().hints.length }}/{{ problem().hintsAvailable }}
              </button>
            </div>
          </form>
        } @else if (problem().solution; as solution) {
          @if (error()) { <p class="error" role="alert">{{ error() }}</p> }
          <section class="solution" [class.right]="problem().correct" aria-label="Worked solution">
            <p class="verdict" #verdict tabindex="-1">
              <mat-icon aria-hidden="true">{{ problem().correct ? 'verified' : 'menu_book' }}</mat-icon>
              <span>{{ problem().correct ? (problem().grade ? 'Counted right.' : 'Correct.') : 'Closed.' }} The answer is <strong>{{ answerText(solution.answer) }}</strong>.</span>
            </p>
            @if (problem().grade; as g) {
              <p class="grade"><mat-icon aria-hidden="true">rate_review</mat-icon>
                <span>{{ g.by }} counted this {{ g.correct ? 'right' : 'wrong' }}: “{{ g.note }}”</span></p>
            }
            <h4>Worked solution</h4>
            <ol class="steps">
              @for (s of solution.steps; track $index) {
                <li><span class="label">{{ s.label }}</span>: <i>{{ s.formula }}</i> → {{ s.substituted }} = <strong>{{ s.value }}</strong>{{ suffix(s.value, s.unit) }}</li>
              }
            </ol>
          </section>
        }
        @if (showCautions() && problem().cautions.length) {
          <sw-cautions [items]="problem().cautions" heading="On the machine" />
        }
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    :host { display: block; }
    h3 { margin: 0; font: var(--mat-sys-title-large); }
    .prompt { font: var(--mat-sys-body-large); }
    .givens { display: flex; flex-wrap: wrap; gap: 8px 24px; margin: 0 0 12px; }
    .givens div { display: grid; }
    dt { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; font: var(--mat-sys-title-medium); font-variant-numeric: tabular-nums; }
    .hints, .steps { display: grid; gap: 6px; padding-left: 1.4em; font-variant-numeric: tabular-nums; overflow-wrap: anywhere; }
    .label { font-weight: 600; }
    .attempts { list-style: none; padding: 0; display: grid; gap: 4px; }
    .attempts li { display: flex; gap: 6px; align-items: center; }
    .right { color: var(--mat-sys-primary); }
    .wrong { color: var(--mat-sys-error); }
    .answer mat-form-field { width: 100%; max-width: 420px; }
    .actions { display: flex; flex-wrap: wrap; gap: 12px; }
    .error { color: var(--mat-sys-error); margin: 0 0 8px; }
    .solution { border-left: 4px solid var(--mat-sys-outline); padding: 4px 12px; margin: 12px 0; }
    .solution.right { border-color: var(--mat-sys-primary); }
    .verdict { display: flex; gap: 8px; align-items: center; }
    .verdict:focus-visible { outline: 2px solid var(--mat-sys-primary); outline-offset: 2px; border-radius: 4px; }
    .grade { display: flex; gap: 6px; align-items: flex-start; overflow-wrap: anywhere; }
    .grade mat-icon { flex: none; color: var(--mat-sys-primary); }
    h4 { margin: 8px 0 4px; font: var(--mat-sys-title-small); }
    sw-cautions { margin-top: 12px; }
  `,
})
export class ExerciseCard {
  /** The problem to show. */
  readonly problem = input.required<ProblemView>();
  /** Heading of the card, e.g. "Problem 2". */
  readonly heading = input('Problem');
  /** Whether an answer or hint is being processed. */
  readonly busy = input(false);
  /** A message about the last answer (e.g. not a number), shown under the box. */
  readonly error = input<string | null>(null);
  /** The typed answer, on "Check answer". */
  readonly answered = output<string>();
  /** "Hint" was pressed. */
  readonly hint = output<void>();
  /** Whether the card shows the problem's safety cautions (a page of many problems shows them once). */
  readonly showCautions = input(true);

  /**
   * The answer being typed. It stays after an answer that was not graded (a unit slip, a typo) so
   * it can be corrected, and empties once the answer is graded (one more attempt) or the problem changes.
   */
  protected readonly draft = linkedSignal<string, string>({ source: computed(() => `${this.problem().prompt}|${this.problem().attempts.length}`), computation: () => '' });
  /** Whether a hint is left to reveal. */
  protected readonly hintsLeft = computed(() => this.problem().hints.length < this.problem().hintsAvailable);

  private readonly verdict = viewChild<ElementRef<HTMLElement>>('verdict');
  /** Set when this card's own answer or hint is on its way: if the problem closes, focus goes to the verdict. */
  private acted = false;

  constructor() {
    // The answer box goes away when the problem closes: keep the keyboard user's place by moving
    // focus to the verdict rather than letting it fall back to the top of the page.
    afterRenderEffect(() => {
      const el = this.verdict()?.nativeElement;
      const { closed } = this.problem();
      if (!closed && !this.busy()) this.acted = false;
      else if (el && closed && this.acted) {
        this.acted = false;
        el.focus();
      }
    });
  }

  /** The unit after a value, closed up for degrees: " in", "°", or nothing. */
  protected suffix(value: string, unit: string): string {
    return unitSuffix(value, unit);
  }

  /** A value with the problem's unit: "0.2993 in", "19.4600° (19°27'36")" (a degree sign only once), "5 blocks". */
  protected answerText(value: string): string {
    return withUnit(value, this.problem().unit);
  }

  /** What a wrong answer missed by: the tolerance, or for a count the exact number. */
  protected readonly wrongText = computed(() => (Number(this.problem().tolerance) === 0 ? 'not the number wanted' : `not within ${this.toleranceText()}`));
  /** How the answer is checked. */
  protected readonly checkedText = computed(() => (Number(this.problem().tolerance) === 0 ? 'Counted exactly' : `Checked to ${this.toleranceText()}`));
  private readonly toleranceText = computed(() => withUnit(`±${this.problem().tolerance}`, this.problem().unit));

  /** The attempts-left note of the hint line. */
  protected readonly attemptsText = computed(() => {
    const left = this.problem().attemptsLeft;
    return left === null ? '' : ` · ${left} ${left === 1 ? 'try' : 'tries'} left`;
  });

  /** Sends the typed answer to the page; the box keeps it until the answer is graded. */
  protected submit(): void {
    const text = this.draft().trim();
    if (!text || this.busy()) return;
    this.acted = true;
    this.answered.emit(text);
  }

  /** Asks for the next hint (the button stays focusable while busy or when none is left, so it does nothing then). */
  protected askHint(): void {
    if (this.busy() || !this.hintsLeft()) return;
    this.acted = true;
    this.hint.emit();
  }
}
