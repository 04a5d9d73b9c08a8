import { MAX_ATTEMPTS, type AssignmentDto, type AssignmentItem, type ProblemDto, type ReviewProblemDto, type WorkStatus, type WorkSummaryDto } from '../../shared/api/training';
import { EXERCISE_INFO } from '../../shared/training/exercise-types';
import { hintsOf } from '../../shared/training/exercise';
import { generateExercise } from '../../shared/training/generators';
import { childSeed } from '../../shared/training/prng';
import type { Assignment, AssignmentWork, TrainingProblem } from '../models';

/** The problem list of one apprentice's copy: type per position and a seed derived from the work's seed. */
export function plannedProblems(items: readonly AssignmentItem[], workSeed: number): Array<{ position: number; type: AssignmentItem['type']; seed: number }> {
  const out: Array<{ position: number; type: AssignmentItem['type']; seed: number }> = [];
  for (const item of items) {
    for (let i = 0; i < item.count; i++) {
      const position = out.length + 1;
      out.push({ position, type: item.type, seed: childSeed(workSeed, position) });
    }
  }
  return out;
}

/** Where an apprentice's work stands at `now`. */
export function workStatus(work: AssignmentWork, dueAt: Date, started: boolean, now = new Date()): WorkStatus {
  if (work.completedAt) return work.completedAt.getTime() > dueAt.getTime() ? 'late' : 'done';
  if (now.getTime() > dueAt.getTime()) return 'missing';
  return started ? 'in-progress' : 'not-started';
}

/** The summary of one apprentice's work (problems and the user must be loaded). */
export function workSummary(work: AssignmentWork, dueAt: Date, now = new Date()): WorkSummaryDto {
  const problems = work.problems ?? [];
  const closed = problems.filter((p) => p.closedAt).length;
  const correct = problems.filter((p) => p.correct).length;
  const started = problems.some((p) => p.closedAt || p.hintsUsed > 0 || (p.attempts?.length ?? 0) > 0);
  const total = problems.length;
  return {
    userId: work.userId,
    name: work.user?.name ?? '',
    status: workStatus(work, dueAt, started, now),
    correct,
    closed,
    total,
    score: total ? Math.round((100 * correct) / total) : 0,
    completedAt: work.completedAt ? work.completedAt.toISOString() : null,
  };
}

/** An assignment with the given work summaries (the caller decides whose work may be shown). */
export function assignmentDto(assignment: Assignment, work: readonly AssignmentWork[], now = new Date()): AssignmentDto {
  return {
    id: assignment.id,
    title: assignment.title,
    instructions: assignment.instructions,
    items: assignment.items,
    dueAt: assignment.dueAt.toISOString(),
    createdAt: assignment.createdAt.toISOString(),
    createdBy: assignment.createdBy?.name ?? null,
    work: work.map((w) => workSummary(w, assignment.dueAt, now)).sort((a, b) => a.name.localeCompare(b.name)),
  };
}

/**
 * One problem as its apprentice sees it: regenerated from type and seed; hints only as far as
 * asked for; the answer and worked solution only once the problem is closed.
 */
export function problemDto(problem: TrainingProblem, exercise = generateExercise(problem.type, problem.seed)): ProblemDto {
  const attempts = [...(problem.attempts ?? [])].sort((a, b) => a.id - b.id);
  const hints = hintsOf(exercise);
  const closed = problem.closedAt !== null && problem.closedAt !== undefined;
  return {
    position: problem.position,
    type: problem.type,
    title: EXERCISE_INFO[problem.type].title,
    prompt: exercise.prompt,
    givens: exercise.givens,
    answerLabel: exercise.answerLabel,
    unit: exercise.unit,
    tolerance: exercise.tolerance,
    attempts: attempts.map((a) => ({ answer: a.answer, correct: a.correct, at: a.createdAt.toISOString() })),
    attemptsLeft: closed ? 0 : Math.max(0, MAX_ATTEMPTS - attempts.length),
    hintsAvailable: hints.length,
    hints: closed ? [] : hints.slice(0, problem.hintsUsed),
    closed,
    correct: problem.correct,
    cautions: exercise.cautions,
    solution: closed ? { answer: exercise.answer, steps: exercise.steps } : null,
    grade: problem.gradedAt ? { correct: problem.correct, note: problem.gradeNote ?? '', by: problem.gradedByName ?? '', at: problem.gradedAt.toISOString() } : null,
  };
}

/**
 * One problem as a lead or admin reads it: the apprentice's view plus the hints used and, even
 * while the problem is open, the worked solution and exact answer (regenerated from the seed).
 */
export function reviewProblemDto(problem: TrainingProblem): ReviewProblemDto {
  const exercise = generateExercise(problem.type, problem.seed);
  return {
    ...problemDto(problem, exercise),
    hintsUsed: problem.hintsUsed,
    solution: { answer: exercise.answer, exact: exercise.exact, steps: exercise.steps },
  };
}
