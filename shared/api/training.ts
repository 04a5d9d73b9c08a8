import { z } from 'zod';
import { EXERCISE_TYPES, type ExerciseType } from '../training/exercise-types';
import { canonicalTimeZone } from '../training/time-zone';
import type { Role } from './auth';

export { EXERCISE_TYPES, type ExerciseType };

/** Problems per exercise type in one assignment, at most. */
export const MAX_PER_TYPE = 10;
/** Problems in one assignment, at most. */
export const MAX_PROBLEMS = 30;
/** Answers an apprentice may give to one assignment problem before it closes. */
export const MAX_ATTEMPTS = 3;
/**
 * How far ahead a due date may be set, in years: far enough for any course plan, near enough to
 * catch a slip of the year ("9999", "20260").
 */
export const MAX_DUE_YEARS = 5;

/** The latest due date allowed at `now`: the same moment MAX_DUE_YEARS on. */
export function latestDue(now = new Date()): Date {
  const latest = new Date(now.getTime());
  latest.setUTCFullYear(latest.getUTCFullYear() + MAX_DUE_YEARS);
  return latest;
}

/** Where an apprentice's work on one assignment stands. */
export type WorkStatus = 'not-started' | 'in-progress' | 'done' | 'late' | 'missing';

/** One line of a derivation as training shows it (the engine's Step). */
export interface StepDto {
  label: string;
  formula: string;
  substituted: string;
  value: string;
  unit: string;
}

/** A given value of a problem. */
export interface GivenDto {
  label: string;
  value: string;
  unit: string;
}

/** One problem of an apprentice's assignment, as the apprentice sees it. */
export interface ProblemDto {
  position: number;
  type: ExerciseType;
  title: string;
  prompt: string;
  givens: GivenDto[];
  answerLabel: string;
  unit: string;
  /** Accepted distance from the exact answer, in `unit`. */
  tolerance: string;
  attempts: Array<{ answer: string; correct: boolean; at: string }>;
  attemptsLeft: number;
  hintsAvailable: number;
  hints: StepDto[];
  closed: boolean;
  correct: boolean;
  /** Safety cautions for the set-up the problem is about (each naming its source). */
  cautions: string[];
  /** The answer and the full worked solution, once the problem is closed. */
  solution: { answer: string; steps: StepDto[] } | null;
  /** A lead's or admin's grade of the closed problem, over the checker's, with their reason; else null. */
  grade: { correct: boolean; note: string; by: string; at: string } | null;
}

/**
 * One problem of an apprentice's assignment as their lead or admin reads it: what the apprentice
 * sees, plus the hints asked for and, always (even while open), the worked solution and exact answer.
 */
export interface ReviewProblemDto extends Omit<ProblemDto, 'solution'> {
  /** Hints the apprentice has revealed (of `hintsAvailable`). */
  hintsUsed: number;
  /** The answer at the unit's resolution, the full-precision answer graded against, and every step. */
  solution: { answer: string; exact: string; steps: StepDto[] };
}

/** GET /api/training/assignments/:id/work/:userId: one apprentice's work, for their lead or an admin. */
export interface WorkReviewDto {
  /** The assignment with only this apprentice's summary. */
  assignment: AssignmentDto;
  apprentice: { id: number; name: string };
  problems: ReviewProblemDto[];
}

/** An assignment's items: how many problems of each exercise type. */
export interface AssignmentItem {
  type: ExerciseType;
  count: number;
}

/** Summary of one apprentice's work on an assignment. */
export interface WorkSummaryDto {
  userId: number;
  name: string;
  status: WorkStatus;
  correct: number;
  closed: number;
  total: number;
  /** Percent of problems answered correctly (0–100), whole number. */
  score: number;
  completedAt: string | null;
}

/** An assignment as the list and detail views show it. */
export interface AssignmentDto {
  id: number;
  title: string;
  instructions: string;
  items: AssignmentItem[];
  dueAt: string;
  createdAt: string;
  createdBy: string | null;
  /** Leads and admins: every assignee's summary. Apprentices: only their own. */
  work: WorkSummaryDto[];
}

/** One row of the lead's score table. */
export interface ScoreRowDto {
  userId: number;
  name: string;
  /** The member's role now (work stays listed after a role change). */
  role: Role;
  /** False for a deactivated member. */
  active: boolean;
  cells: Array<{ assignmentId: number; assigned: boolean; summary: WorkSummaryDto | null }>;
}

/** The lead's score table: assignments as columns, apprentices as rows. */
export interface ScoreTableDto {
  assignments: Array<{ id: number; title: string; dueAt: string }>;
  rows: ScoreRowDto[];
}

/** The answer to an attempt. */
export interface AttemptResultDto {
  correct: boolean;
  problem: ProblemDto;
}

const itemSchema = z.object({
  type: z.enum(EXERCISE_TYPES, { error: `Type must be one of: ${EXERCISE_TYPES.join(', ')}.` }),
  count: z
    .number({ error: 'Count must be a whole number.' })
    .int('Count must be a whole number.')
    .min(1, `Count must be from 1 to ${MAX_PER_TYPE} (a type left at 0 is not set).`)
    .max(MAX_PER_TYPE, `Count must be at most ${MAX_PER_TYPE}.`),
});

/** A due date: a date and time with its offset (the browser sends UTC), from now to a year ahead. */
const dueAtField = z.iso
  .datetime({ offset: true, error: 'Pick a due date and time.' })
  .refine((text) => Date.parse(text) > Date.now(), 'The due date has passed: choose a time from now on.')
  .refine((text) => Date.parse(text) <= latestDue().getTime(), `That due date is more than ${MAX_DUE_YEARS} years away: check the year.`);

/**
 * The lead's time zone as their browser names it (IANA, e.g. "America/Chicago"), checked against
 * the server's Intl database. The e-mail gives the due time on that clock; UTC when none is sent.
 */
const timeZoneField = z
  .string({ error: 'The time zone must be a name such as America/Chicago.' })
  .max(64, 'The time zone must be a name such as America/Chicago.')
  .transform((name, ctx) => {
    const zone = canonicalTimeZone(name);
    if (zone === null) {
      ctx.addIssue({ code: 'custom', message: 'That is not a time zone we know: use a name such as America/Chicago, or leave it out for UTC.' });
      return z.NEVER;
    }
    return zone;
  })
  .optional();

/** POST /api/training/assignments */
export const assignmentCreateBody = z.object({
  title: z.string({ error: 'Give the assignment a title.' }).trim().min(1, 'Give the assignment a title.').max(160, 'Keep the title under 160 characters.'),
  instructions: z.string({ error: 'Instructions must be text.' }).max(4000, 'Keep the instructions under 4,000 characters.').optional(),
  items: z
    .array(itemSchema, { error: 'Choose at least one exercise type.' })
    .min(1, 'Choose at least one exercise type.')
    .max(EXERCISE_TYPES.length, 'List each exercise type once.')
    .refine((items) => new Set(items.map((i) => i.type)).size === items.length, 'List each exercise type once.')
    .refine((items) => items.reduce((n, i) => n + i.count, 0) <= MAX_PROBLEMS, `An assignment holds at most ${MAX_PROBLEMS} problems.`),
  dueAt: dueAtField,
  timeZone: timeZoneField,
  assigneeIds: z
    .array(z.number().int().positive(), { error: 'Choose at least one apprentice.' })
    .min(1, 'Choose at least one apprentice.')
    .max(200, 'Choose at most 200 apprentices.'),
});
export type AssignmentCreateBody = z.input<typeof assignmentCreateBody>;

/** PATCH /api/training/assignments/:id: a new due date (leads and admins of the team). */
export const assignmentDueBody = z.object({
  dueAt: dueAtField,
  timeZone: timeZoneField,
});
export type AssignmentDueBody = z.input<typeof assignmentDueBody>;

/** POST /api/training/assignments/:id/work/:userId/problems/:position/grade: a lead grades a closed problem by hand. */
export const gradeBody = z.object({
  correct: z.boolean({ error: 'Say whether the problem counts as right (true) or wrong (false).' }),
  note: z
    .string({ error: 'Say why the grade changes, for the apprentice to read.' })
    .trim()
    .min(3, 'Say why the grade changes, for the apprentice to read (3 characters or more).')
    .max(500, 'Keep the reason under 500 characters.'),
});
export type GradeBody = z.input<typeof gradeBody>;

/** POST /api/training/assignments/:id/assignees: apprentices given the assignment after it was made (leads and admins). */
export const assignmentAddBody = z.object({
  assigneeIds: z
    .array(z.number().int().positive(), { error: 'Choose at least one apprentice to add.' })
    .min(1, 'Choose at least one apprentice to add.')
    .max(200, 'Choose at most 200 apprentices.'),
  timeZone: timeZoneField,
});
export type AssignmentAddBody = z.input<typeof assignmentAddBody>;

/** POST /api/training/assignments/:id/problems/:position/attempts */
export const attemptBody = z.object({
  answer: z.string({ error: 'Type your answer.' }).trim().min(1, 'Type your answer.').max(60, 'That answer is too long.'),
});
export type AttemptBody = z.infer<typeof attemptBody>;
