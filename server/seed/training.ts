import type { AssignmentItem } from '../../shared/api/training';
import { generateExercise } from '../../shared/training/generators';
import { newSeed } from '../../shared/training/prng';
import { Assignment, AssignmentWork, TrainingAttempt, TrainingProblem, type User } from '../models';
import { plannedProblems } from '../services/training';

/** The demo course as fixtures/demo.json describes it. */
export interface DemoTraining {
  course: string;
  lead: string;
  apprentices: string[];
  assignments: Array<{ title: string; instructions: string; items: AssignmentItem[]; state: 'done' | 'open' | 'overdue'; dueInDays: number }>;
}

const DAY_MS = 86_400_000;

/**
 * Seeds the apprentice course: each assignment for every demo apprentice. A "done" assignment is
 * answered (the first problem wrong once, then right; the last wrong three times) so it has a
 * score; "open" is due soon and untouched; "overdue" is past its due date with one answer given.
 * Assignments already present (by title) are left alone.
 */
export async function seedTraining(teamId: number, training: DemoTraining, byEmail: ReadonlyMap<string, User>): Promise<number> {
  const lead = byEmail.get(training.lead);
  const apprentices = training.apprentices.map((e) => byEmail.get(e)).filter((u): u is User => !!u);
  if (!lead || apprentices.length === 0) return 0;
  let created = 0;
  for (const a of training.assignments) {
    if (await Assignment.findOne({ where: { teamId, title: a.title } })) continue;
    const now = Date.now();
    const dueAt = new Date(now + a.dueInDays * DAY_MS);
    // Given a week before it is due (or now, if that is later), so it is never made after its own work.
    const createdAt = new Date(Math.min(now, dueAt.getTime() - 7 * DAY_MS));
    const assignment = await Assignment.create({ teamId, createdById: lead.id, title: a.title, instructions: a.instructions, items: a.items, dueAt, createdAt });
    created++;
    for (const apprentice of apprentices) {
      const work = await AssignmentWork.create({ assignmentId: assignment.id, userId: apprentice.id, seed: newSeed() });
      const planned = plannedProblems(a.items, work.seed);
      await TrainingProblem.bulkCreate(planned.map((p) => ({ ...p, workId: work.id })));
      const problems = await TrainingProblem.findAll({ where: { workId: work.id }, order: [['position', 'ASC']] });
      const answeredAt = new Date(dueAt.getTime() - DAY_MS);
      if (a.state === 'done') {
        for (const [i, problem] of problems.entries()) {
          const exercise = generateExercise(problem.type, problem.seed);
          const last = i === problems.length - 1;
          if (i === 0) await TrainingAttempt.create({ problemId: problem.id, answer: '0.1', correct: false, createdAt: answeredAt });
          if (last) {
            for (let k = 0; k < 3; k++) await TrainingAttempt.create({ problemId: problem.id, answer: '0', correct: false, createdAt: answeredAt });
          } else {
            await TrainingAttempt.create({ problemId: problem.id, answer: exercise.exact.slice(0, 10), correct: true, createdAt: answeredAt });
          }
          await problem.update({ closedAt: answeredAt, correct: !last, hintsUsed: i === 0 ? 1 : 0 });
        }
        await work.update({ completedAt: answeredAt });
      } else if (a.state === 'overdue' && problems[0]) {
        const exercise = generateExercise(problems[0].type, problems[0].seed);
        await TrainingAttempt.create({ problemId: problems[0].id, answer: exercise.exact.slice(0, 10), correct: true, createdAt: answeredAt });
        await problems[0].update({ closedAt: answeredAt, correct: true });
      }
    }
  }
  return created;
}
