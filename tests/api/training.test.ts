import bcrypt from 'bcrypt';
import request from 'supertest';
import { Assignment, AssignmentWork, TrainingAttempt, TrainingProblem } from '../../server/models';
import { generateExercise } from '../../shared/training/generators';
import { timeInZoneText } from '../../shared/training/time-zone';
import { MAX_ATTEMPTS } from '../../shared/api/training';
import { User } from '../../server/models';
import { BCRYPT_COST } from '../../server/routes/auth';
import { client, makeTeam, openApp, PASSWORD, type Client, type Members, type TestApp } from '../support/api';
import { mailsTo, waitForMail } from '../support/mailbox';

jest.setTimeout(30_000);

let t: TestApp;
let m: Members;
let foreign: Members;
let second: User;
const c = {} as Record<'admin' | 'lead' | 'machinist' | 'apprentice' | 'second' | 'foreign', Client>;

const inAWeek = () => new Date(Date.now() + 7 * 86_400_000).toISOString();
const body = (assigneeIds: number[], extra: object = {}) => ({
  title: 'Tapers on the mill',
  instructions: 'Work each problem by hand first.',
  items: [{ type: 'taper-depth', count: 2 }, { type: 'gauge-fewest', count: 1 }],
  dueAt: inAWeek(),
  assigneeIds,
  ...extra,
});

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('training');
  foreign = await makeTeam('training-foreign');
  second = await User.create({ teamId: m.team.id, email: `second.${m.apprentice.email}`, name: `Second ${m.apprentice.name}`, role: 'apprentice', passwordHash: await bcrypt.hash(PASSWORD, BCRYPT_COST) });
  for (const role of ['admin', 'lead', 'machinist', 'apprentice'] as const) c[role] = await client(t.app, m[role]);
  c.second = await client(t.app, second);
  c.foreign = await client(t.app, foreign.lead);
});
afterAll(() => t.close());

const post = (who: Client, url: string, payload: object = {}) => who.agent.post(url).set('X-CSRF-Token', who.token).send(payload);

/** The exact answer of one of the caller's problems, looked up from the stored seed. */
async function answerOf(assignmentId: number, userId: number, position: number): Promise<string> {
  const work = await AssignmentWork.findOne({ where: { assignmentId, userId } });
  const problem = await TrainingProblem.findOne({ where: { workId: work!.id, position } });
  return generateExercise(problem!.type, problem!.seed).exact;
}

describe('/api/training', () => {
  it('refuses anonymous callers with 401', async () => {
    await request(t.app).get('/api/training/assignments').expect(401);
    await request(t.app).get('/api/training/scores').expect(401);
  });

  it('lists the exercise types', async () => {
    const res = await c.apprentice.agent.get('/api/training/exercise-types').expect(200);
    expect(res.body.types.map((x: { type: string }) => x.type)).toContain('taper-depth');
  });

  describe('creating assignments', () => {
    it('lets only leads and admins assign (403 for machinists and apprentices)', async () => {
      await post(c.apprentice, '/api/training/assignments', body([m.apprentice.id])).expect(403);
      await post(c.machinist, '/api/training/assignments', body([m.apprentice.id])).expect(403);
      await post(c.admin, '/api/training/assignments', body([m.apprentice.id])).expect(201);
    });

    it('names each bad field with 400', async () => {
      const res = await post(c.lead, '/api/training/assignments', { title: '', items: [{ type: 'knurling', count: 0 }], dueAt: 'tomorrow', assigneeIds: [] }).expect(400);
      expect(Object.keys(res.body.fields).sort()).toEqual(['assigneeIds', 'dueAt', 'items.0.count', 'items.0.type', 'title']);
      // A due date already past would make the work "missing" from the start.
      const past = await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { dueAt: '2020-01-01T10:00:00Z' })).expect(400);
      expect(past.body.fields).toEqual({ dueAt: 'The due date has passed: choose a time from now on.' });
    });

    it('asks for the due date in shop words, refuses one years ahead, and checks the time zone', async () => {
      for (const dueAt of ['', 'tomorrow', '202604-12-03T23:00', undefined]) {
        const res = await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { dueAt })).expect(400);
        expect(res.body.fields).toEqual({ dueAt: 'Pick a due date and time.' });
      }
      // A slip of the year (9999, or six years on) is refused before anyone is e-mailed.
      const far = new Date(Date.now() + 6 * 366 * 86_400_000).toISOString();
      for (const dueAt of ['9999-12-31T23:59:00Z', far]) {
        const res = await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { dueAt })).expect(400);
        expect(res.body.fields).toEqual({ dueAt: 'That due date is more than 5 years away: check the year.' });
      }
      for (const timeZone of ['Mars/Olympus_Mons', '', 'x'.repeat(65), 42]) {
        const res = await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { timeZone })).expect(400);
        expect(Object.keys(res.body.fields)).toEqual(['timeZone']);
        expect(res.body.fields.timeZone).toMatch(/America\/Chicago/);
      }
    });

    it('writes the due time in the e-mail on the lead\'s clock, with the zone named (UTC when none is sent)', async () => {
      const dueAt = new Date(Math.ceil((Date.now() + 2 * 86_400_000) / 3_600_000) * 3_600_000);
      await post(c.lead, '/api/training/assignments', body([second.id], { title: 'Chicago tonight', dueAt: dueAt.toISOString(), timeZone: 'America/Chicago' })).expect(201);
      const chicago = await waitForMail(second.email, 'Chicago tonight');
      expect(chicago.text).toContain(`It is due ${timeInZoneText(dueAt, 'America/Chicago')}.`);
      expect(chicago.text).toMatch(/It is due \w{3} \d{1,2} \w{3} \d{4}, \d\d:\d\d \(America\/Chicago\)\./);
      expect(chicago.text).not.toContain('GMT');
      await post(c.lead, '/api/training/assignments', body([second.id], { title: 'No zone given', dueAt: dueAt.toISOString() })).expect(201);
      const utc = await waitForMail(second.email, 'No zone given');
      expect(utc.text).toContain(`It is due ${timeInZoneText(dueAt, 'UTC')}.`);
      expect(utc.text).toContain('(UTC).');
    });

    it('assigns apprentices of the own team only', async () => {
      const a = await post(c.lead, '/api/training/assignments', body([foreign.apprentice.id])).expect(400);
      expect(a.body.fields.assigneeIds).toMatch(/apprentices/);
      await post(c.lead, '/api/training/assignments', body([m.machinist.id])).expect(400);
    });

    it('gives each apprentice their own problems (stored seeds) and e-mails each of them', async () => {
      const res = await post(c.lead, '/api/training/assignments', body([m.apprentice.id, second.id])).expect(201);
      expect(res.body.mailSent).toBe(2);
      expect(res.body.work).toHaveLength(2);
      expect(res.body.work.every((w: { status: string; total: number }) => w.status === 'not-started' && w.total === 3)).toBe(true);
      const works = await AssignmentWork.findAll({ where: { assignmentId: res.body.id } });
      expect(works).toHaveLength(2);
      expect(works[0]!.seed).not.toBe(works[1]!.seed);
      const problems = await TrainingProblem.findAll({ where: { workId: works.map((w) => w.id) }, order: [['workId', 'ASC'], ['position', 'ASC']] });
      expect(problems.map((p) => p.type)).toEqual(['taper-depth', 'taper-depth', 'gauge-fewest', 'taper-depth', 'taper-depth', 'gauge-fewest']);
      const mail = await waitForMail(m.apprentice.email, 'Tapers on the mill');
      expect(mail.text).toContain(`/training/assignments/${res.body.id}`);
      expect(mail.html).toContain('Open the assignment');
      // The lead's instructions travel with the notice; no empty paragraph is left where a footer would be.
      expect(mail.text).toContain('Work each problem by hand first.');
      expect(mail.html).toContain('Work each problem by hand first.');
      expect(mail.html).not.toMatch(/<p[^>]*>\s*<\/p>/);
    });
  });

  describe('an apprentice working an assignment', () => {
    let id: number;
    beforeAll(async () => {
      id = (await post(c.lead, '/api/training/assignments', body([m.apprentice.id, second.id], { title: 'Graded run' })).expect(201)).body.id;
    });

    it('shows the problems without answers or seeds until closed', async () => {
      const res = await c.apprentice.agent.get(`/api/training/assignments/${id}/work`).expect(200);
      expect(res.body.problems).toHaveLength(3);
      const p = res.body.problems[0];
      expect(p).toMatchObject({ position: 1, type: 'taper-depth', closed: false, solution: null, attemptsLeft: MAX_ATTEMPTS, hints: [] });
      expect(JSON.stringify(res.body)).not.toMatch(/"seed"|"exact"/);
      expect(JSON.stringify(res.body)).not.toContain(await answerOf(id, m.apprentice.id, 1));
    });

    it('reveals hints one step at a time, the last without its value', async () => {
      const one = await post(c.apprentice, `/api/training/assignments/${id}/problems/2/hints`).expect(200);
      expect(one.body.hints).toHaveLength(1);
      for (let i = 1; i < one.body.hintsAvailable; i++) await post(c.apprentice, `/api/training/assignments/${id}/problems/2/hints`).expect(200);
      const all = await c.apprentice.agent.get(`/api/training/assignments/${id}/work`).expect(200);
      const hints = all.body.problems[1].hints;
      expect(hints).toHaveLength(one.body.hintsAvailable);
      expect(hints[hints.length - 1].value).toBe('?');
      await post(c.apprentice, `/api/training/assignments/${id}/problems/2/hints`).expect(409);
    });

    it('grades on the server: a wrong answer, then the right one closes the problem with its worked solution', async () => {
      const exact = await answerOf(id, m.apprentice.id, 1);
      const wrong = await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: '9.9999', correct: true }).expect(201);
      expect(wrong.body.correct).toBe(false);
      expect(wrong.body.problem).toMatchObject({ closed: false, attemptsLeft: MAX_ATTEMPTS - 1, solution: null });
      const right = await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: exact.slice(0, 8) }).expect(201);
      expect(right.body.correct).toBe(true);
      expect(right.body.problem.closed).toBe(true);
      expect(right.body.problem.solution.steps.length).toBeGreaterThan(1);
      expect(right.body.problem.attempts.map((a: { correct: boolean }) => a.correct)).toEqual([false, true]);
      await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: exact }).expect(409);
    });

    it('refuses an unreadable answer with 400 without using an attempt', async () => {
      const res = await post(c.apprentice, `/api/training/assignments/${id}/problems/2/attempts`, { answer: 'about half' }).expect(400);
      expect(res.body.fields.answer).toBeDefined();
      // The right number in another unit is no answer either.
      const problem2 = (await c.apprentice.agent.get(`/api/training/assignments/${id}/work`).expect(200)).body.problems[1];
      const other = problem2.unit === 'in' ? 'mm' : 'in';
      const wrongUnit = await post(c.apprentice, `/api/training/assignments/${id}/problems/2/attempts`, { answer: `1.2345 ${other}` }).expect(400);
      expect(wrongUnit.body.fields.answer).toBe(problem2.unit === 'in' ? 'Answer in inches (in), or as a plain number.' : 'Answer in millimetres (mm), or as a plain number.');
      const work = await AssignmentWork.findOne({ where: { assignmentId: id, userId: m.apprentice.id } });
      const problem = await TrainingProblem.findOne({ where: { workId: work!.id, position: 2 } });
      expect(await TrainingAttempt.count({ where: { problemId: problem!.id } })).toBe(0);
    });

    it(`closes a problem after ${MAX_ATTEMPTS} wrong answers and completes the work when all are closed`, async () => {
      for (let i = 0; i < MAX_ATTEMPTS; i++) await post(c.apprentice, `/api/training/assignments/${id}/problems/2/attempts`, { answer: '0' }).expect(201);
      await post(c.apprentice, `/api/training/assignments/${id}/problems/2/attempts`, { answer: '0' }).expect(409);
      const answer = await answerOf(id, m.apprentice.id, 3);
      await post(c.apprentice, `/api/training/assignments/${id}/problems/3/attempts`, { answer }).expect(201);
      const res = await c.apprentice.agent.get(`/api/training/assignments/${id}`).expect(200);
      expect(res.body.work).toEqual([expect.objectContaining({ userId: m.apprentice.id, status: 'done', correct: 2, closed: 3, total: 3, score: 67 })]);
    });

    it('never shows an apprentice another apprentice\'s work or scores', async () => {
      const list = await c.second.agent.get('/api/training/assignments').expect(200);
      for (const a of list.body.assignments) expect(a.work.map((w: { userId: number }) => w.userId)).toEqual([second.id]);
      const one = await c.second.agent.get(`/api/training/assignments/${id}`).expect(200);
      expect(one.body.work).toHaveLength(1);
      expect(one.body.work[0].userId).toBe(second.id);
      expect(JSON.stringify(one.body)).not.toContain(`"userId":${m.apprentice.id},`);
      await c.second.agent.get('/api/training/scores').expect(403);
      await c.apprentice.agent.get('/api/training/scores').expect(403);
    });

    it('keeps others from answering or reading a copy that is not theirs (404)', async () => {
      await c.machinist.agent.get(`/api/training/assignments/${id}`).expect(404);
      await c.machinist.agent.get(`/api/training/assignments/${id}/work`).expect(404);
      await c.foreign.agent.get(`/api/training/assignments/${id}`).expect(404);
      await post(c.foreign, `/api/training/assignments/${id}/problems/1/attempts`, { answer: '1' }).expect(404);
    });

    it('shows the lead a score table with every apprentice, and missing and late work', async () => {
      const past = await post(c.lead, '/api/training/assignments', body([m.apprentice.id, second.id], { title: 'Already due' })).expect(201);
      // The due date passes; then the first apprentice finishes (late) and the second never does (missing).
      await Assignment.update({ dueAt: new Date(Date.now() - 60_000) }, { where: { id: past.body.id } });
      for (const position of [1, 2, 3]) {
        await post(c.apprentice, `/api/training/assignments/${past.body.id}/problems/${position}/attempts`, { answer: await answerOf(past.body.id, m.apprentice.id, position) }).expect(201);
      }
      const res = await c.lead.agent.get('/api/training/scores').expect(200);
      const col = res.body.assignments.findIndex((a: { id: number }) => a.id === past.body.id);
      const graded = res.body.assignments.findIndex((a: { id: number }) => a.id === id);
      const row = (userId: number) => res.body.rows.find((r: { userId: number }) => r.userId === userId);
      expect(row(m.apprentice.id).cells[col].summary).toMatchObject({ status: 'late', score: 100 });
      expect(row(second.id).cells[col].summary).toMatchObject({ status: 'missing', score: 0 });
      expect(row(m.apprentice.id).cells[graded].summary).toMatchObject({ status: 'done', score: 67 });
      expect(res.body.rows.map((r: { userId: number }) => r.userId)).not.toContain(m.machinist.id);
      expect(row(m.apprentice.id)).toMatchObject({ role: 'apprentice', active: true });
      const foreignScores = await c.foreign.agent.get('/api/training/scores').expect(200);
      expect(foreignScores.body.assignments.map((a: { id: number }) => a.id)).not.toContain(id);
    });
  });

  describe('the score table after a member changes', () => {
    it('keeps the work of a member made machinist or deactivated in sight, marked', async () => {
      const team = await makeTeam('scores-change');
      const lead = await client(t.app, team.lead);
      const admin = await client(t.app, team.admin);
      const moved = await User.create({ teamId: team.team.id, email: `moved.${team.team.id}@example.test`, name: 'Moved On', role: 'apprentice', passwordHash: await bcrypt.hash(PASSWORD, BCRYPT_COST) });
      await post(lead, '/api/training/assignments', body([team.apprentice.id, moved.id], { title: 'Before the change' })).expect(201);
      await admin.agent.patch(`/api/team/members/${moved.id}`).set('X-CSRF-Token', admin.token).send({ role: 'machinist' }).expect(200);
      await admin.agent.patch(`/api/team/members/${team.apprentice.id}`).set('X-CSRF-Token', admin.token).send({ active: false }).expect(200);
      const res = await lead.agent.get('/api/training/scores').expect(200);
      const rows = res.body.rows as Array<{ userId: number; role: string; active: boolean; cells: Array<{ assigned: boolean }> }>;
      expect(rows.find((r) => r.userId === moved.id)).toMatchObject({ role: 'machinist', active: true, cells: [{ assigned: true }] });
      expect(rows.find((r) => r.userId === team.apprentice.id)).toMatchObject({ role: 'apprentice', active: false });
      // A machinist who never had work is still not listed.
      expect(rows.map((r) => r.userId)).not.toContain(team.machinist.id);
    });
  });

  describe('a lead reading an apprentice\'s work', () => {
    let id: number;
    const review = (who: Client, assignmentId: number | string, userId: number | string) => who.agent.get(`/api/training/assignments/${assignmentId}/work/${userId}`);
    beforeAll(async () => {
      id = (await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { title: 'Read by the lead' })).expect(201)).body.id;
      await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: '9.9999' }).expect(201);
      await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: await answerOf(id, m.apprentice.id, 1) }).expect(201);
      await post(c.apprentice, `/api/training/assignments/${id}/problems/2/hints`).expect(200);
    });

    it('shows each answer in order with its grade, the hints used, and the solution even while a problem is open', async () => {
      const res = await review(c.lead, id, m.apprentice.id).expect(200);
      expect(res.body.apprentice).toEqual({ id: m.apprentice.id, name: m.apprentice.name });
      expect(res.body.assignment).toMatchObject({ id, title: 'Read by the lead' });
      expect(res.body.assignment.work).toEqual([expect.objectContaining({ userId: m.apprentice.id, status: 'in-progress', correct: 1, closed: 1, total: 3 })]);
      expect(res.body.problems.map((p: { position: number }) => p.position)).toEqual([1, 2, 3]);
      const [first, second, third] = res.body.problems;
      const exact = await answerOf(id, m.apprentice.id, 1);
      expect(first.attempts.map((a: { answer: string; correct: boolean }) => [a.answer, a.correct])).toEqual([['9.9999', false], [exact, true]]);
      expect(first).toMatchObject({ closed: true, correct: true, hintsUsed: 0 });
      expect(first.solution.exact).toBe(exact);
      // Problem 2 is still open: the lead sees its one hint used and its whole worked solution.
      expect(second).toMatchObject({ closed: false, hintsUsed: 1, attempts: [] });
      expect(second.hints).toHaveLength(1);
      expect(second.solution.exact).toBe(await answerOf(id, m.apprentice.id, 2));
      expect(second.solution.steps.length).toBe(second.hintsAvailable);
      expect(second.solution.steps[second.solution.steps.length - 1].value).not.toBe('?');
      expect(third).toMatchObject({ closed: false, hintsUsed: 0 });
      expect(third.solution.answer).toEqual(expect.any(String));
    });

    it('changes nothing, and the apprentice\'s own view still hides open solutions', async () => {
      const before = await TrainingAttempt.count();
      await review(c.lead, id, m.apprentice.id).expect(200);
      await review(c.admin, id, m.apprentice.id).expect(200);
      expect(await TrainingAttempt.count()).toBe(before);
      const own = await c.apprentice.agent.get(`/api/training/assignments/${id}/work`).expect(200);
      expect(own.body.problems[1]).toMatchObject({ closed: false, solution: null, hints: [expect.any(Object)] });
      expect(own.body.problems[1].hintsUsed).toBeUndefined();
      expect(JSON.stringify(own.body)).not.toContain(await answerOf(id, m.apprentice.id, 2));
    });

    it('lets admins in and refuses apprentices and machinists (403)', async () => {
      const admin = await review(c.admin, id, m.apprentice.id).expect(200);
      expect(admin.body.problems).toHaveLength(3);
      await review(c.apprentice, id, m.apprentice.id).expect(403);
      await review(c.machinist, id, m.apprentice.id).expect(403);
    });

    it('answers 404 for another team\'s lead and for an apprentice not given the assignment', async () => {
      const foreignRes = await review(c.foreign, id, m.apprentice.id).expect(404);
      expect(foreignRes.body.error).toBe('No assignment with that id in your team.');
      const unassigned = await review(c.lead, id, second.id).expect(404);
      expect(unassigned.body.error).toBe('No work for that apprentice on this assignment.');
      await review(c.lead, id, foreign.apprentice.id).expect(404);
    });

    it('answers a non-numeric id with 404 naming what was not found, as every id route does', async () => {
      const badId = await review(c.lead, 'abc', m.apprentice.id).expect(404);
      expect(badId.body.error).toBe('No assignment with that id.');
      const badUser = await review(c.lead, id, 'abc').expect(404);
      expect(badUser.body.error).toBe('No apprentice with that id.');
    });
  });

  describe('a lead grading a closed problem by hand', () => {
    let id: number;
    const grade = (who: Client, position: number | string, payload: object, userId: number | string = m.apprentice.id, assignmentId: number | string = id) =>
      post(who, `/api/training/assignments/${assignmentId}/work/${userId}/problems/${position}/grade`, payload);
    beforeAll(async () => {
      id = (await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { title: 'Graded by hand', items: [{ type: 'taper-depth', count: 2 }] })).expect(201)).body.id;
      // Problem 1: out of attempts, never right. Problem 2 stays open.
      for (let i = 0; i < MAX_ATTEMPTS; i++) await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: '9.9999' }).expect(201);
    });

    it('counts a closed problem right with a reason; the score follows and the apprentice reads who and why', async () => {
      const before = (await c.lead.agent.get(`/api/training/assignments/${id}`).expect(200)).body.work[0];
      expect(before).toMatchObject({ correct: 0, closed: 1, score: 0 });
      const res = await grade(c.lead, 1, { correct: true, note: '  Right to the thousandth; the box asked for four places.  ' }).expect(200);
      expect(res.body).toMatchObject({ position: 1, closed: true, correct: true, grade: { correct: true, note: 'Right to the thousandth; the box asked for four places.', by: m.lead.name } });
      // The checker's own verdicts on the answers are kept as they were.
      expect(res.body.attempts.every((a: { correct: boolean }) => !a.correct)).toBe(true);
      const after = (await c.lead.agent.get(`/api/training/assignments/${id}`).expect(200)).body.work[0];
      // 1 of 2 right: 50 % (derived).
      expect(after).toMatchObject({ correct: 1, closed: 1, score: 50 });
      const own = await c.apprentice.agent.get(`/api/training/assignments/${id}/work`).expect(200);
      expect(own.body.problems[0]).toMatchObject({ correct: true, grade: { correct: true, by: m.lead.name, note: 'Right to the thousandth; the box asked for four places.' } });
      expect(own.body.problems[1].grade).toBeNull();
      const scores = (await c.lead.agent.get('/api/training/scores').expect(200)).body;
      const row = scores.rows.find((r: { userId: number }) => r.userId === m.apprentice.id);
      expect(row.cells.find((cell: { assignmentId: number }) => cell.assignmentId === id).summary).toMatchObject({ correct: 1, score: 50 });
      // An admin can set it back, with its own reason.
      const back = await grade(c.admin, 1, { correct: false, note: 'Checked again: the depth was for the wrong corner.' }).expect(200);
      expect(back.body).toMatchObject({ correct: false, grade: { correct: false, by: m.admin.name } });
      expect((await c.lead.agent.get(`/api/training/assignments/${id}`).expect(200)).body.work[0]).toMatchObject({ correct: 0, score: 0 });
    });

    it('refuses an open problem with 409, changing nothing', async () => {
      const res = await grade(c.lead, 2, { correct: true, note: 'Good enough.' }).expect(409);
      expect(res.body.error).toMatch(/^This problem is still open/);
      const problem = await TrainingProblem.findOne({ where: { workId: (await AssignmentWork.findOne({ where: { assignmentId: id, userId: m.apprentice.id } }))!.id, position: 2 } });
      expect(problem).toMatchObject({ correct: false, gradedAt: null });
    });

    it('asks for the grade and a reason with 400', async () => {
      expect((await grade(c.lead, 1, { correct: true }).expect(400)).body.fields).toEqual({ note: 'Say why the grade changes, for the apprentice to read.' });
      expect((await grade(c.lead, 1, { correct: true, note: '  ' }).expect(400)).body.fields.note).toMatch(/3 characters or more/);
      expect((await grade(c.lead, 1, { correct: 'yes', note: 'Fine answer.' }).expect(400)).body.fields.correct).toMatch(/right \(true\) or wrong \(false\)/);
      expect((await grade(c.lead, 1, { correct: true, note: 'x'.repeat(501) }).expect(400)).body.fields.note).toBe('Keep the reason under 500 characters.');
    });

    it('lets only leads and admins of the team grade, and names what was not found', async () => {
      await grade(c.apprentice, 1, { correct: true, note: 'My own grade.' }).expect(403);
      await grade(c.machinist, 1, { correct: true, note: 'Not mine to give.' }).expect(403);
      expect((await grade(c.foreign, 1, { correct: true, note: 'Another team.' }).expect(404)).body.error).toBe('No assignment with that id in your team.');
      expect((await grade(c.lead, 1, { correct: true, note: 'Not given it.' }, second.id).expect(404)).body.error).toBe('No work for that apprentice on this assignment.');
      expect((await grade(c.lead, 9, { correct: true, note: 'No such problem.' }).expect(404)).body.error).toBe('No problem 9 in this work.');
      await grade(c.lead, 'abc', { correct: true, note: 'Bad position.' }).expect(404);
    });
  });

  describe('moving the due date of a sent assignment', () => {
    let id: number;
    const patch = (who: Client, assignmentId: number | string, payload: object) =>
      who.agent.patch(`/api/training/assignments/${assignmentId}`).set('X-CSRF-Token', who.token).send(payload);
    beforeAll(async () => {
      id = (await post(c.lead, '/api/training/assignments', body([m.apprentice.id, second.id], { title: 'Moved along', items: [{ type: 'gauge-fewest', count: 1 }] })).expect(201)).body.id;
      // The first apprentice has finished; the second has not.
      await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: await answerOf(id, m.apprentice.id, 1) }).expect(201);
      await waitForMail(m.apprentice.email, 'New training assignment: Moved along');
    });

    it('lets the lead move it, and e-mails only the apprentices who have not finished, on the lead\'s clock', async () => {
      const dueAt = new Date(Math.ceil((Date.now() + 10 * 86_400_000) / 60_000) * 60_000);
      const res = await patch(c.lead, id, { dueAt: dueAt.toISOString(), timeZone: 'America/Chicago' }).expect(200);
      expect(res.body).toMatchObject({ id, dueAt: dueAt.toISOString(), mailSent: 1 });
      expect(res.body.work.map((w: { userId: number; status: string }) => [w.userId, w.status]).sort()).toEqual([[m.apprentice.id, 'done'], [second.id, 'not-started']].sort());
      const mail = await waitForMail(second.email, 'New due date for training assignment: Moved along');
      expect(mail.text).toContain(`It is now due ${timeInZoneText(dueAt, 'America/Chicago')}.`);
      expect(mail.text).toContain(`/training/assignments/${id}`);
      // The apprentice who has finished is not told (the notice to the other has arrived by now).
      const notices = (await mailsTo(m.apprentice.email)).filter((x) => x.subject.includes('New due date for training assignment: Moved along'));
      // ("second.<address>" contains the first apprentice's address: compare whole recipients.)
      expect(notices.map((x) => x.recipients)).toEqual([second.email]);
      expect((await Assignment.findByPk(id))!.dueAt.toISOString()).toBe(dueAt.toISOString());
      // The apprentice sees the new date.
      const own = await c.second.agent.get(`/api/training/assignments/${id}`).expect(200);
      expect(own.body.dueAt).toBe(dueAt.toISOString());
    });

    it('sends nothing when the date does not change', async () => {
      const current = (await Assignment.findByPk(id))!.dueAt.toISOString();
      const res = await patch(c.lead, id, { dueAt: current }).expect(200);
      expect(res.body.mailSent).toBe(0);
    });

    it('lets admins of the team move it; apprentices and machinists get 403, another team 404', async () => {
      const dueAt = new Date(Math.ceil((Date.now() + 12 * 86_400_000) / 1000) * 1000).toISOString();
      await patch(c.admin, id, { dueAt }).expect(200);
      await patch(c.apprentice, id, { dueAt }).expect(403);
      await patch(c.machinist, id, { dueAt }).expect(403);
      const foreignRes = await patch(c.foreign, id, { dueAt }).expect(404);
      expect(foreignRes.body.error).toBe('No assignment with that id in your team.');
      await patch(c.lead, 'abc', { dueAt }).expect(404);
      expect((await Assignment.findByPk(id))!.dueAt.toISOString()).toBe(new Date(dueAt).toISOString());
    });

    it('refuses a past, missing or far-off date and an unknown zone with 400, changing nothing', async () => {
      const current = (await Assignment.findByPk(id))!.dueAt.toISOString();
      expect((await patch(c.lead, id, { dueAt: '2020-01-01T10:00:00Z' }).expect(400)).body.fields).toEqual({ dueAt: 'The due date has passed: choose a time from now on.' });
      expect((await patch(c.lead, id, {}).expect(400)).body.fields).toEqual({ dueAt: 'Pick a due date and time.' });
      expect((await patch(c.lead, id, { dueAt: '9999-12-31T23:59:00Z' }).expect(400)).body.fields.dueAt).toMatch(/more than 5 years away/);
      expect(Object.keys((await patch(c.lead, id, { dueAt: new Date(Date.now() + 86_400_000).toISOString(), timeZone: 'Nowhere/Atall' }).expect(400)).body.fields)).toEqual(['timeZone']);
      expect((await Assignment.findByPk(id))!.dueAt.toISOString()).toBe(current);
    });
  });

  describe('giving a sent assignment to more apprentices', () => {
    let id: number;
    let third: User;
    let thirdClient: Client;
    const add = (who: Client, assignmentId: number | string, payload: object) => post(who, `/api/training/assignments/${assignmentId}/assignees`, payload);
    beforeAll(async () => {
      id = (await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { title: 'Joined later', items: [{ type: 'taper-depth', count: 2 }] })).expect(201)).body.id;
      third = await User.create({ teamId: m.team.id, email: `third.${m.apprentice.email}`, name: `Third ${m.apprentice.name}`, role: 'apprentice', passwordHash: await bcrypt.hash(PASSWORD, BCRYPT_COST) });
      thirdClient = await client(t.app, third);
    });

    it('gives each new apprentice problems of their own and the new-assignment e-mail on the lead\'s clock', async () => {
      const res = await add(c.lead, id, { assigneeIds: [second.id, third.id], timeZone: 'Europe/Berlin' }).expect(201);
      expect(res.body).toMatchObject({ id, mailSent: 2 });
      expect(res.body.work.map((w: { userId: number }) => w.userId).sort()).toEqual([m.apprentice.id, second.id, third.id].sort());
      const works = await AssignmentWork.findAll({ where: { assignmentId: id } });
      expect(new Set(works.map((w) => w.seed)).size).toBe(3);
      const thirdWork = works.find((w) => w.userId === third.id)!;
      const problems = await TrainingProblem.findAll({ where: { workId: thirdWork.id }, order: [['position', 'ASC']] });
      expect(problems.map((p) => p.type)).toEqual(['taper-depth', 'taper-depth']);
      const due = (await Assignment.findByPk(id))!.dueAt;
      const mail = await waitForMail(third.email, 'New training assignment: Joined later');
      expect(mail.text).toContain(timeInZoneText(due, 'Europe/Berlin'));
      // The new apprentice works it like the others.
      await post(thirdClient, `/api/training/assignments/${id}/problems/1/attempts`, { answer: await answerOf(id, third.id, 1) }).expect(201);
    });

    it('refuses an apprentice who already has it with 409 naming them, adding nobody', async () => {
      const fourth = await User.create({ teamId: m.team.id, email: `fourth.${m.apprentice.email}`, name: 'Fourth Apprentice', role: 'apprentice', passwordHash: await bcrypt.hash(PASSWORD, BCRYPT_COST) });
      const res = await add(c.lead, id, { assigneeIds: [fourth.id, m.apprentice.id] }).expect(409);
      expect(res.body.error).toBe(`${m.apprentice.name} already has this assignment; choose only apprentices who do not.`);
      expect(await AssignmentWork.count({ where: { assignmentId: id, userId: fourth.id } })).toBe(0);
    });

    it('takes active apprentices of the own team only, and names a bad list with 400', async () => {
      expect((await add(c.lead, id, { assigneeIds: [foreign.apprentice.id] }).expect(400)).body.fields.assigneeIds).toBe('Choose active apprentices of your team only.');
      await add(c.lead, id, { assigneeIds: [m.machinist.id] }).expect(400);
      expect((await add(c.lead, id, { assigneeIds: [] }).expect(400)).body.fields.assigneeIds).toBe('Choose at least one apprentice to add.');
      expect((await add(c.lead, id, {}).expect(400)).body.fields.assigneeIds).toBe('Choose at least one apprentice to add.');
      expect(Object.keys((await add(c.lead, id, { assigneeIds: [m.apprentice.id], timeZone: 'Nowhere/Atall' }).expect(400)).body.fields)).toEqual(['timeZone']);
    });

    it('lets admins of the team add; apprentices and machinists get 403, another team 404', async () => {
      const fifth = await User.create({ teamId: m.team.id, email: `fifth.${m.apprentice.email}`, name: 'Fifth Apprentice', role: 'apprentice', passwordHash: await bcrypt.hash(PASSWORD, BCRYPT_COST) });
      await add(c.apprentice, id, { assigneeIds: [fifth.id] }).expect(403);
      await add(c.machinist, id, { assigneeIds: [fifth.id] }).expect(403);
      expect((await add(c.foreign, id, { assigneeIds: [foreign.apprentice.id] }).expect(404)).body.error).toBe('No assignment with that id in your team.');
      await add(c.lead, 'abc', { assigneeIds: [fifth.id] }).expect(404);
      await add(c.admin, id, { assigneeIds: [fifth.id] }).expect(201);
    });
  });

  describe('an apprentice\'s own list and a stale page', () => {
    it('lists open work above finished work, soonest due first', async () => {
      const team = await makeTeam('training-order');
      const lead = await client(t.app, team.lead);
      const apprentice = await client(t.app, team.apprentice);
      const due = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString();
      const one = { items: [{ type: 'gauge-fewest', count: 1 }] };
      const finished = (await post(lead, '/api/training/assignments', body([team.apprentice.id], { ...one, title: 'Finished first', dueAt: due(1) })).expect(201)).body.id;
      await post(lead, '/api/training/assignments', body([team.apprentice.id], { ...one, title: 'Open later', dueAt: due(9) })).expect(201);
      await post(lead, '/api/training/assignments', body([team.apprentice.id], { ...one, title: 'Open sooner', dueAt: due(3) })).expect(201);
      await post(apprentice, `/api/training/assignments/${finished}/problems/1/attempts`, { answer: await answerOf(finished, team.apprentice.id, 1) }).expect(201);
      const list = await apprentice.agent.get('/api/training/assignments').expect(200);
      expect(list.body.assignments.map((a: { title: string }) => a.title)).toEqual(['Open sooner', 'Open later', 'Finished first']);
    });

    it('answers a hint on a problem closed meanwhile with 409 and a message, and a withdrawn assignment with a plain 404', async () => {
      const res = await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { title: 'Withdrawn later', items: [{ type: 'gauge-fewest', count: 2 }] })).expect(201);
      const id = res.body.id as number;
      await post(c.apprentice, `/api/training/assignments/${id}/problems/1/attempts`, { answer: await answerOf(id, m.apprentice.id, 1) }).expect(201);
      const hint = await post(c.apprentice, `/api/training/assignments/${id}/problems/1/hints`).expect(409);
      expect(hint.body.error).toBe('This problem is closed; its worked solution is shown.');
      await c.lead.agent.delete(`/api/training/assignments/${id}`).set('X-CSRF-Token', c.lead.token).expect(204);
      const gone = 'This assignment no longer exists: your lead may have withdrawn it. Your other work is under My assignments.';
      expect((await c.apprentice.agent.get(`/api/training/assignments/${id}/work`).expect(404)).body.error).toBe(gone);
      expect((await post(c.apprentice, `/api/training/assignments/${id}/problems/2/attempts`, { answer: '3' }).expect(404)).body.error).toBe(gone);
      expect((await post(c.apprentice, `/api/training/assignments/${id}/problems/2/hints`).expect(404)).body.error).toBe(gone);
    });
  });

  it('lets a lead delete an assignment; others get 403', async () => {
    const res = await post(c.lead, '/api/training/assignments', body([m.apprentice.id], { title: 'To delete' })).expect(201);
    await c.apprentice.agent.delete(`/api/training/assignments/${res.body.id}`).set('X-CSRF-Token', c.apprentice.token).expect(403);
    await c.foreign.agent.delete(`/api/training/assignments/${res.body.id}`).set('X-CSRF-Token', c.foreign.token).expect(404);
    await c.lead.agent.delete(`/api/training/assignments/${res.body.id}`).set('X-CSRF-Token', c.lead.token).expect(204);
    await c.apprentice.agent.get(`/api/training/assignments/${res.body.id}`).expect(404);
  });
});
