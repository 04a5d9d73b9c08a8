import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';

import { EXERCISE_INFO, EXERCISE_TYPES, type ExerciseType } from '../../../shared/training/exercise-types';
import { ExerciseCard } from './exercise-card';
import { PracticeSession } from './practice-session';

/** Practice mode: any exercise type, new numbers on demand, checked in the browser, nothing stored. */
@Component({
  selector: 'sw-practice-page',
  imports: [FormsModule, RouterLink, MatFormFieldModule, MatSelectModule, MatButtonModule, MatIconModule, ExerciseCard],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page practice">
      <a mat-button routerLink="/training"><mat-icon>arrow_back</mat-icon> Training</a>
      <h1>Practice</h1>
      <p>Pick a kind of problem. Each one has fresh numbers; ask for hints one step at a time, then check your answer to see the worked solution. Nothing here is graded or kept.</p>
      <div class="controls">
        <mat-form-field appearance="outline">
          <mat-label>Kind of problem</mat-label>
          <mat-select [ngModel]="type()" (ngModelChange)="choose($event)" name="type">
            @for (t of types; track t) {
              <mat-option [value]="t">{{ info[t].title }} ({{ info[t].area }})</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <button mat-stroked-button type="button" (click)="session().next()"><mat-icon>refresh</mat-icon> New numbers</button>
      </div>
      <sw-exercise-card [problem]="session().view()" heading="Practice problem" [error]="session().error()" (answered)="session().answer($event)" (hint)="session().revealHint()" />
    </section>
  `,
  styles: `
    .controls { display: flex; flex-wrap: wrap; gap: 12px; align-items: baseline; }
    mat-form-field { min-width: min(420px, 100%); }
  `,
})
export default class PracticePage {
  protected readonly types = EXERCISE_TYPES;
  protected readonly info = EXERCISE_INFO;
  protected readonly type = signal<ExerciseType>('taper-depth');
  protected readonly session = signal(new PracticeSession('taper-depth'));

  /** Switches to another exercise type with a fresh problem. */
  protected choose(type: ExerciseType): void {
    this.type.set(type);
    this.session.set(new PracticeSession(type));
  }
}
