import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { CautionPanel } from '../workbench/caution-panel';
import { ExerciseCard } from './exercise-card';
import { LessonDrawing } from './lesson-drawing';
import { LESSONS, findLesson } from './lessons';
import { PracticeSession } from './practice-session';

/** One lesson: the explanation beside its interactive drawing, cautions, then practice problems. */
@Component({
  selector: 'sw-lesson-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, LessonDrawing, ExerciseCard, CautionPanel],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page lesson">
      <a mat-button routerLink="/training"><mat-icon>arrow_back</mat-icon> All lessons</a>
      @if (lesson(); as l) {
        <h1>{{ l.title }}</h1>
        <div class="layout">
          <div class="text">
            @for (s of l.sections; track s.heading) {
              <h2>{{ s.heading }}</h2>
              @for (p of s.paragraphs; track $index) { <p>{{ p }}</p> }
            }
          </div>
          <div class="figure">
            <p class="try"><mat-icon aria-hidden="true">touch_app</mat-icon> {{ l.tryIt }}</p>
            <sw-lesson-drawing [kind]="l.drawing" />
          </div>
        </div>
        @if (l.cautions.length) { <sw-cautions [items]="l.cautions" [heading]="l.cautionHeading ?? 'Before you clamp and cut'" /> }
        <h2>Practice</h2>
        <p class="note">New numbers every time. Answers are checked to the tolerance shown; the worked solution opens once you answer. Nothing here is graded or kept: a lead gives graded work as an assignment.</p>
        <div class="practice">
          @for (s of sessions(); track s.type; let i = $index) {
            <div>
              <sw-exercise-card [problem]="s.view()" [heading]="'Practice ' + (i + 1)" [error]="s.error()" (answered)="s.answer($event)" (hint)="s.revealHint()" />
              @if (s.view().closed) {
                <button mat-stroked-button type="button" class="again" (click)="s.next()"><mat-icon>refresh</mat-icon> Another one</button>
              }
            </div>
          }
        </div>
        @if (nextLesson(); as n) {
          <a mat-flat-button [routerLink]="['/training/lessons', n.slug]">Next: {{ n.title }} <mat-icon iconPositionEnd>arrow_forward</mat-icon></a>
        }
      } @else {
        <h1>No such lesson</h1>
        <p>That lesson does not exist. Pick one from the list.</p>
      }
    </section>
  `,
  styles: `
    .layout { display: grid; grid-template-columns: minmax(0, 1fr) minmax(0, 1fr); gap: 24px; align-items: start; }
    @media (max-width: 900px) { .layout { grid-template-columns: 1fr; } }
    h2 { font: var(--mat-sys-title-large); margin: 20px 0 8px; }
    .text p { max-width: 68ch; line-height: 1.55; }
    .try { display: flex; gap: 8px; align-items: flex-start; color: var(--mat-sys-on-surface-variant); }
    .try mat-icon { flex: none; }
    .practice { display: grid; gap: 16px; margin-bottom: 24px; }
    .again { margin-top: 8px; }
    .note { color: var(--mat-sys-on-surface-variant); }
    sw-cautions { margin: 16px 0; }
  `,
})
export default class LessonPage {
  /** The lesson's slug, from the route. */
  readonly slug = input<string>();

  protected readonly lesson = computed(() => findLesson(this.slug()));
  /** One practice problem per exercise type of the lesson, fresh for each visit. */
  protected readonly sessions = computed(() => (this.lesson()?.practice ?? []).map((type) => new PracticeSession(type)));
  protected readonly nextLesson = computed(() => {
    const i = LESSONS.findIndex((l) => l.slug === this.slug());
    return i >= 0 ? LESSONS[i + 1] : undefined;
  });
}
