import { computed, signal, type WritableSignal } from '@angular/core';

import { checkAnswer, hintsOf, type Exercise } from '../../../shared/training/exercise';
import type { ExerciseType } from '../../../shared/training/exercise-types';
import { generateExercise } from '../../../shared/training/generators';
import { newSeed } from '../../../shared/training/prng';
import type { ProblemView } from './exercise-card';

/**
 * One practice problem worked in the browser: generated from its seed, checked with the shared
 * checker, hints one at a time, closed (worked solution shown) on the first submitted answer.
 * Nothing is stored: practice is for learning, assignments are graded on the server.
 */
export class PracticeSession {
  private readonly _exercise: WritableSignal<Exercise>;
  private readonly _hints = signal(0);
  private readonly _attempts = signal<Array<{ answer: string; correct: boolean }>>([]);
  private readonly _error = signal<string | null>(null);

  /** Why the last answer could not be read, if so. */
  readonly error = this._error.asReadonly();
  /** The exercise type. */
  readonly type: ExerciseType;
  private seed: number;

  constructor(type: ExerciseType, seed: number = newSeed()) {
    this.type = type;
    this.seed = seed;
    this._exercise = signal(generateExercise(type, seed));
  }

  /** The current exercise. */
  exercise(): Exercise {
    return this._exercise();
  }

  /** What the exercise card shows. */
  readonly view = computed<ProblemView>(() => {
    const e = this._exercise();
    const attempts = this._attempts();
    const closed = attempts.length > 0;
    return {
      title: e.title,
      prompt: e.prompt,
      givens: e.givens,
      answerLabel: e.answerLabel,
      unit: e.unit,
      tolerance: e.tolerance,
      hints: hintsOf(e).slice(0, this._hints()),
      hintsAvailable: e.steps.length,
      attempts,
      attemptsLeft: null,
      closed,
      correct: attempts.some((a) => a.correct),
      solution: closed ? { answer: e.answer, steps: e.steps } : null,
      cautions: e.cautions,
    };
  });

  /** The seed of the current problem (to reproduce it). */
  currentSeed(): number {
    return this.seed;
  }

  /** Checks an answer; unreadable text leaves the problem open with a message. */
  answer(text: string): void {
    const result = checkAnswer(this._exercise(), text);
    if (!result.ok) {
      this._error.set(result.error);
      return;
    }
    this._error.set(null);
    this._attempts.update((list) => [...list, { answer: result.given, correct: result.correct }]);
  }

  /** Reveals one more derivation step. */
  revealHint(): void {
    this._hints.update((n) => Math.min(n + 1, this._exercise().steps.length));
  }

  /** Starts a fresh problem of the same type (a given seed reproduces a problem). */
  next(seed: number = newSeed()): void {
    this.seed = seed;
    this._exercise.set(generateExercise(this.type, seed));
    this._hints.set(0);
    this._attempts.set([]);
    this._error.set(null);
  }
}
