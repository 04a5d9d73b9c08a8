import { Router, type Request } from 'express';
import { Op, type Includeable, type Transaction } from 'sequelize';
import { assignmentAddBody, assignmentCreateBody, assignmentDueBody, attemptBody, gradeBody, MAX_ATTEMPTS, type AssignmentDto, type ScoreTableDto, type WorkReviewDto } from '../../shared/api/training';
import { checkAnswer } from '../../shared/training/exercise';
import { EXERCISE_INFO, EXERCISE_TYPES } from '../../shared/training/exercise-types';
import { generateExercise } from '../../shared/training/generators';
import { newSeed } from '../../shared/training/prng';
import { currentUser, requireRole } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody, parseId } from '../middleware/validate';
import { Assignment, AssignmentWork, TrainingAttempt, TrainingProblem, User } from '../models';
import { sendMail } from '../services/mailer';
import { assignmentMail } from '../services/team-mail';
import { assignmentDto, plannedProblems, problemDto, reviewProblemDto, workSummary } from '../services/training';

const canAssign = (user: User) => user.role === 'lead' || user.role === 'admin';

const workInclude = [
  { model: User, as: 'user', attributes: ['id', 'name'] },
  { model: TrainingProblem, as: 'problems', include: [{ model: TrainingAttempt, as: 'attempts' }] },
];

/** The assignment of the caller's team, or 404 (with `missing` as the message when given). */
async function teamAssignment(id: number, user: User, missing = 'No assignment with that id in your team.'): Promise<Assignment> {
  const assignment = await Assignment.findOne({ where: { id, teamId: user.teamId }, include: [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }] });
  if (!assignment) throw new HttpError(404, missing);
  return assignment;
}

/** The active apprentices of the lead's team with these ids; 400 naming the field when any is not one. */
async function teamApprentices(lead: User, ids: readonly number[]): Promise<User[]> {
  const apprentices = await User.findAll({ where: { id: { [Op.in]: [...ids] }, teamId: lead.teamId, role: 'apprentice', active: true } });
  if (apprentices.length !== ids.length) {
    throw new HttpError(400, 'Some fields are not valid.', { assigneeIds: 'Choose active apprentices of your team only.' });
  }
  return apprentices;
}

/** Gives each apprentice their own copy of the assignment: a stored seed and the planned problems. */
async function giveWork(assignment: Assignment, apprentices: readonly User[], transaction: Transaction): Promise<void> {
  for (const apprentice of apprentices) {
    const work = await AssignmentWork.create({ assignmentId: assignment.id, userId: apprentice.id, seed: newSeed() }, { transaction });
    await TrainingProblem.bulkCreate(plannedProblems(assignment.items, work.seed).map((p) => ({ ...p, workId: work.id })), { transaction });
  }
}

/** Sends each apprentice the new-assignment e-mail, the due time on the lead's clock; how many the SMTP server took. */
async function mailAssigned(assignment: Assignment, apprentices: readonly User[], lead: User, timeZone = 'UTC'): Promise<number> {
  const total = assignment.items.reduce((n, i) => n + i.count, 0);
  const sent = await Promise.all(
    apprentices.map((a) => sendMail(assignmentMail(a.email, a.name, assignment.title, total, assignment.dueAt, lead.name, assignment.id, assignment.instructions, { timeZone }))),
  );
  return sent.filter(Boolean).length;
}

/** One apprentice's work on an assignment, the apprentice of the lead's team (with `include` as well), or 404. */
async function apprenticeWork(assignment: Assignment, lead: User, userId: number, include: Includeable[] = []): Promise<AssignmentWork & { user: User }> {
  const work = await AssignmentWork.findOne({
    where: { assignmentId: assignment.id, userId },
    include: [{ model: User, as: 'user', attributes: ['id', 'name'], where: { teamId: lead.teamId } }, ...include],
  });
  if (!work?.user) throw new HttpError(404, 'No work for that apprentice on this assignment.');
  return work as AssignmentWork & { user: User };
}

/** What an apprentice reads when their assignment is gone (the lead deleted it) or never was. */
const ASSIGNMENT_GONE = 'This assignment no longer exists: your lead may have withdrawn it. Your other work is under My assignments.';

/** The caller's own copy of an assignment (with problems and attempts), or 404. */
async function ownWork(req: Request): Promise<{ assignment: Assignment; work: AssignmentWork }> {
  const user = currentUser(req);
  const assignment = await teamAssignment(parseId(req.params['id'], 'assignment'), user, ASSIGNMENT_GONE);
  const work = await AssignmentWork.findOne({ where: { assignmentId: assignment.id, userId: user.id }, include: workInclude });
  if (!work) throw new HttpError(404, 'This assignment was not given to you. Your own work is under My assignments.');
  return { assignment, work };
}

/** Unfinished work (not started, in progress, overdue) comes before finished work. */
const FINISHED = new Set(['done', 'late']);

/** An apprentice's list: open work first, soonest due first; then finished work, latest due first. */
function ownListOrder(a: AssignmentDto, b: AssignmentDto): number {
  const finishedA = FINISHED.has(a.work[0]?.status ?? '');
  const finishedB = FINISHED.has(b.work[0]?.status ?? '');
  if (finishedA !== finishedB) return finishedA ? 1 : -1;
  return finishedA ? b.dueAt.localeCompare(a.dueAt) : a.dueAt.localeCompare(b.dueAt);
}

function positionParam(raw: string | string[] | undefined): number {
  return parseId(raw, 'problem');
}

/** /api/training: exercise types, assignments, the apprentice's own work and the lead's score table. */
export function createTrainingRouter(): Router {
  const router = Router();
  const leadOnly = requireRole('lead', 'admin');

  router.get('/exercise-types', (_req, res) => {
    res.json({ types: EXERCISE_TYPES.map((type) => ({ type, ...EXERCISE_INFO[type] })) });
  });

  router.get('/assignments', async (req, res) => {
    const user = currentUser(req);
    const now = new Date();
    if (canAssign(user)) {
      const rows = await Assignment.findAll({
        where: { teamId: user.teamId },
        include: [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }, { model: AssignmentWork, as: 'work', include: workInclude }],
        order: [['dueAt', 'DESC'], ['id', 'DESC']],
      });
      res.json({ assignments: rows.map((a) => assignmentDto(a, a.work ?? [], now)) });
      return;
    }
    // Everyone else sees only the assignments given to them, with only their own work.
    const own = await AssignmentWork.findAll({
      where: { userId: user.id },
      include: [...workInclude, { model: Assignment, as: 'assignment', where: { teamId: user.teamId }, include: [{ model: User, as: 'createdBy', attributes: ['id', 'name'] }] }],
    });
    const list = own.map((w) => assignmentDto(w.assignment!, [w], now)).sort(ownListOrder);
    res.json({ assignments: list });
  });

  router.post('/assignments', leadOnly, async (req, res) => {
    const lead = currentUser(req);
    const body = parseBody(assignmentCreateBody, req.body);
    const apprentices = await teamApprentices(lead, [...new Set(body.assigneeIds)]);
    const dueAt = new Date(body.dueAt);
    const assignment = await Assignment.sequelize!.transaction(async (transaction) => {
      const created = await Assignment.create(
        { teamId: lead.teamId, createdById: lead.id, title: body.title, instructions: body.instructions ?? '', items: body.items, dueAt },
        { transaction },
      );
      await giveWork(created, apprentices, transaction);
      return created;
    });
    const mailSent = await mailAssigned(assignment, apprentices, lead, body.timeZone);
    const fresh = await teamAssignment(assignment.id, lead);
    const work = await AssignmentWork.findAll({ where: { assignmentId: assignment.id }, include: workInclude });
    res.status(201).location(`/api/training/assignments/${assignment.id}`).json({ ...assignmentDto(fresh, work), mailSent });
  });

  router.get('/assignments/:id', async (req, res) => {
    const user = currentUser(req);
    const assignment = await teamAssignment(parseId(req.params['id'], 'assignment'), user);
    const where = canAssign(user) ? { assignmentId: assignment.id } : { assignmentId: assignment.id, userId: user.id };
    const work = await AssignmentWork.findAll({ where, include: workInclude });
    if (!canAssign(user) && work.length === 0) throw new HttpError(404, 'No assignment with that id for you.');
    res.json(assignmentDto(assignment, work));
  });

  // A lead or admin of the team moves the due date. Apprentices who have not finished get a notice
  // (the due time on the lead's clock); those who have finished are not bothered.
  router.patch('/assignments/:id', leadOnly, async (req, res) => {
    const lead = currentUser(req);
    const assignment = await teamAssignment(parseId(req.params['id'], 'assignment'), lead);
    const body = parseBody(assignmentDueBody, req.body);
    // Kept to the second, as the database keeps it: the same minute sent again is no move.
    const dueAt = new Date(Math.floor(Date.parse(body.dueAt) / 1000) * 1000);
    const moved = dueAt.getTime() !== assignment.dueAt.getTime();
    if (moved) await assignment.update({ dueAt });
    const work = await AssignmentWork.findAll({ where: { assignmentId: assignment.id }, include: workInclude });
    const open = moved ? work.filter((w) => !w.completedAt).map((w) => w.userId) : [];
    const notify = open.length ? await User.findAll({ where: { id: { [Op.in]: open }, teamId: lead.teamId, active: true } }) : [];
    const total = assignment.items.reduce((n, i) => n + i.count, 0);
    const timeZone = body.timeZone ?? 'UTC';
    const sent = await Promise.all(
      notify.map((a) => sendMail(assignmentMail(a.email, a.name, assignment.title, total, dueAt, lead.name, assignment.id, '', { timeZone, dueMoved: true }))),
    );
    res.json({ ...assignmentDto(assignment, work), mailSent: sent.filter(Boolean).length });
  });

  // A lead or admin gives the assignment to more apprentices (someone who joined later): each gets
  // problems of their own and the new-assignment e-mail. Those who already have it are refused.
  router.post('/assignments/:id/assignees', leadOnly, async (req, res) => {
    const lead = currentUser(req);
    const assignment = await teamAssignment(parseId(req.params['id'], 'assignment'), lead);
    const body = parseBody(assignmentAddBody, req.body);
    const ids = [...new Set(body.assigneeIds)];
    const apprentices = await teamApprentices(lead, ids);
    await Assignment.sequelize!.transaction(async (transaction) => {
      // Locks the assignment row, so two leads adding the same apprentice at once cannot both do it.
      await Assignment.findOne({ where: { id: assignment.id }, lock: transaction.LOCK.UPDATE, transaction });
      const already = await AssignmentWork.findAll({ where: { assignmentId: assignment.id, userId: { [Op.in]: ids } }, transaction });
      if (already.length) {
        const names = apprentices.filter((a) => already.some((w) => w.userId === a.id)).map((a) => a.name);
        throw new HttpError(409, `${names.join(', ')} already ${names.length === 1 ? 'has' : 'have'} this assignment; choose only apprentices who do not.`);
      }
      await giveWork(assignment, apprentices, transaction);
    });
    const mailSent = await mailAssigned(assignment, apprentices, lead, body.timeZone);
    const work = await AssignmentWork.findAll({ where: { assignmentId: assignment.id }, include: workInclude });
    res.status(201).json({ ...assignmentDto(assignment, work), mailSent });
  });

  router.delete('/assignments/:id', leadOnly, async (req, res) => {
    const assignment = await teamAssignment(parseId(req.params['id'], 'assignment'), currentUser(req));
    await assignment.destroy();
    res.status(204).end();
  });

  router.get('/assignments/:id/work', async (req, res) => {
    const { assignment, work } = await ownWork(req);
    const problems = [...(work.problems ?? [])].sort((a, b) => a.position - b.position);
    res.json({ assignment: assignmentDto(assignment, [work]), problems: problems.map((p) => problemDto(p)) });
  });

  // A lead or admin reads one apprentice's work of their own team: read only, solutions always shown.
  router.get('/assignments/:id/work/:userId', leadOnly, async (req, res) => {
    const lead = currentUser(req);
    const assignmentId = parseId(req.params['id'], 'assignment');
    const userId = parseId(req.params['userId'], 'apprentice');
    const assignment = await teamAssignment(assignmentId, lead);
    const work = await apprenticeWork(assignment, lead, userId, [{ model: TrainingProblem, as: 'problems', include: [{ model: TrainingAttempt, as: 'attempts' }] }]);
    const problems = [...(work.problems ?? [])].sort((a, b) => a.position - b.position);
    const review: WorkReviewDto = {
      assignment: assignmentDto(assignment, [work]),
      apprentice: { id: work.user.id, name: work.user.name },
      problems: problems.map((p) => reviewProblemDto(p)),
    };
    res.json(review);
  });

  // A lead or admin grades a closed problem by hand, over the checker (an answer right in another
  // form, a slip in the problem): the score follows, and the apprentice reads who changed it and why.
  router.post('/assignments/:id/work/:userId/problems/:position/grade', leadOnly, async (req, res) => {
    const lead = currentUser(req);
    const assignment = await teamAssignment(parseId(req.params['id'], 'assignment'), lead);
    const userId = parseId(req.params['userId'], 'apprentice');
    const position = positionParam(req.params['position']);
    const body = parseBody(gradeBody, req.body);
    const work = await apprenticeWork(assignment, lead, userId);
    const problem = await TrainingProblem.findOne({ where: { workId: work.id, position }, include: [{ model: TrainingAttempt, as: 'attempts' }] });
    if (!problem) throw new HttpError(404, `No problem ${position} in this work.`);
    if (!problem.closedAt) {
      throw new HttpError(409, 'This problem is still open: the apprentice is still working it. Grade it once it is closed (answered right, or out of attempts).');
    }
    await problem.update({ correct: body.correct, gradedById: lead.id, gradedByName: lead.name, gradeNote: body.note, gradedAt: new Date() });
    res.json(reviewProblemDto(problem));
  });

  router.post('/assignments/:id/problems/:position/hints', async (req, res) => {
    const { work } = await ownWork(req);
    const position = positionParam(req.params['position']);
    const problem = (work.problems ?? []).find((p) => p.position === position);
    if (!problem) throw new HttpError(404, 'No problem at that position.');
    if (problem.closedAt) throw new HttpError(409, 'This problem is closed; its worked solution is shown.');
    const available = generateExercise(problem.type, problem.seed).steps.length;
    if (problem.hintsUsed >= available) throw new HttpError(409, 'Every hint of this problem is already shown.');
    await TrainingProblem.increment('hintsUsed', { by: 1, where: { id: problem.id, hintsUsed: problem.hintsUsed } });
    await problem.reload({ include: [{ model: TrainingAttempt, as: 'attempts' }] });
    res.json(problemDto(problem));
  });

  router.post('/assignments/:id/problems/:position/attempts', async (req, res) => {
    const { work } = await ownWork(req);
    const position = positionParam(req.params['position']);
    const { answer } = parseBody(attemptBody, req.body);
    const sequelize = TrainingProblem.sequelize!;
    const result = await sequelize.transaction(async (transaction) => {
      // Lock the problem row so two quick submissions cannot both use the last attempt.
      const problem = await TrainingProblem.findOne({ where: { workId: work.id, position }, transaction, lock: transaction.LOCK.UPDATE });
      if (!problem) throw new HttpError(404, 'No problem at that position.');
      if (problem.closedAt) throw new HttpError(409, 'This problem is closed; no more answers are taken.');
      // Graded here from the stored seed: a grade sent by the browser is never trusted.
      const check = checkAnswer(generateExercise(problem.type, problem.seed), answer);
      if (!check.ok) throw new HttpError(400, 'Some fields are not valid.', { answer: check.error });
      await TrainingAttempt.create({ problemId: problem.id, answer: check.given.slice(0, 60), correct: check.correct }, { transaction });
      const used = await TrainingAttempt.count({ where: { problemId: problem.id }, transaction });
      const now = new Date();
      if (check.correct || used >= MAX_ATTEMPTS) {
        await problem.update({ closedAt: now, correct: check.correct }, { transaction });
        const open = await TrainingProblem.count({ where: { workId: work.id, closedAt: null }, transaction });
        if (open === 0) await AssignmentWork.update({ completedAt: now }, { where: { id: work.id }, transaction });
      }
      return { correct: check.correct, problemId: problem.id };
    });
    const problem = await TrainingProblem.findByPk(result.problemId, { include: [{ model: TrainingAttempt, as: 'attempts' }] });
    res.status(201).json({ correct: result.correct, problem: problemDto(problem!) });
  });

  router.get('/scores', leadOnly, async (req, res) => {
    const lead = currentUser(req);
    const now = new Date();
    const assignments = await Assignment.findAll({
      where: { teamId: lead.teamId },
      include: [{ model: AssignmentWork, as: 'work', include: workInclude }],
      order: [['dueAt', 'ASC'], ['id', 'ASC']],
    });
    // Today's apprentices, and anyone with work on an assignment who has since changed role or
    // been deactivated: their work stays in sight, marked.
    const withWork = [...new Set(assignments.flatMap((a) => (a.work ?? []).map((w) => w.userId)))];
    const apprentices = await User.findAll({
      where: { teamId: lead.teamId, [Op.or]: [{ role: 'apprentice' }, ...(withWork.length ? [{ id: withWork }] : [])] },
      order: [['name', 'ASC'], ['id', 'ASC']],
    });
    const table: ScoreTableDto = {
      assignments: assignments.map((a) => ({ id: a.id, title: a.title, dueAt: a.dueAt.toISOString() })),
      rows: apprentices.map((u) => ({
        userId: u.id,
        name: u.name,
        role: u.role,
        active: u.active,
        cells: assignments.map((a) => {
          const work = (a.work ?? []).find((w) => w.userId === u.id);
          return { assignmentId: a.id, assigned: !!work, summary: work ? workSummary(work, a.dueAt, now) : null };
        }),
      })),
    };
    res.json(table);
  });

  return router;
}
