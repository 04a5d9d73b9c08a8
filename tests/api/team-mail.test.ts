import { notifySetupReleased } from '../../server/services/team-mail';
import { Assignment, AssignmentWork, Setup, TrainingProblem, User } from '../../server/models';
import { seedDemo } from '../../server/seed/demo';
import { workSummary } from '../../server/services/training';
import demo from '../../fixtures/demo.json';
import { client, makeTeam, openApp, type TestApp } from '../support/api';
import { mailsTo, waitForMail } from '../support/mailbox';

jest.setTimeout(30_000);

let t: TestApp;
beforeAll(() => {
  t = openApp();
});
afterAll(() => t.close());

describe('set-up released notice', () => {
  it('mails the owner when a lead releases their set-up, with text and HTML parts and a link', async () => {
    const m = await makeTeam('release-mail');
    const machinist = await client(t.app, m.machinist);
    const lead = await client(t.app, m.lead);
    const created = await machinist.agent.post('/api/setups').set('X-CSRF-Token', machinist.token)
      .send({ name: 'Wedge for release', kind: 'taper', inputs: { unit: 'in', thickness: '0.750', angle: '5', taperLength: '1.000' } }).expect(201);
    await lead.agent.post(`/api/setups/${created.body.id}/release`).set('X-CSRF-Token', lead.token).send({}).expect(200);
    const mail = await waitForMail(m.machinist.email, 'Set-up released: Wedge for release');
    expect(mail.text).toContain(`${t.config.publicUrl}/library/${created.body.id}`);
    expect(mail.text).toContain(m.lead.name);
    expect(mail.html).toContain('<a href=');
  });

  it('sends nothing when the owner released it themselves', async () => {
    const m = await makeTeam('release-self');
    const setup = await Setup.create({ teamId: m.team.id, ownerId: m.lead.id, name: 'Own set-up', kind: 'taper', inputs: {}, status: 'released' });
    expect(await notifySetupReleased(setup, m.lead)).toBe(false);
    expect(await mailsTo(m.lead.email)).toHaveLength(0);
  });
});

describe('demo training seed', () => {
  it('has the course\'s three assignments: one done with a score, one due soon, one overdue — and seeds nothing twice', async () => {
    const before = await Assignment.count();
    await seedDemo(t.config.demoPassword);
    expect(await Assignment.count()).toBe(before);
    const apprentice = await User.findOne({ where: { email: 'apprentice@demo.test' } });
    const statuses: Record<string, { status: string; score: number }> = {};
    for (const a of demo.training.assignments) {
      const assignment = await Assignment.findOne({ where: { title: a.title } });
      const work = await AssignmentWork.findOne({
        where: { assignmentId: assignment!.id, userId: apprentice!.id },
        include: [{ model: User, as: 'user' }, { model: TrainingProblem, as: 'problems', include: ['attempts'] }],
      });
      statuses[a.state] = workSummary(work!, assignment!.dueAt);
      // Given before it was due and before any of its work was done.
      expect(assignment!.createdAt.getTime()).toBeLessThan(assignment!.dueAt.getTime());
      if (work!.completedAt) expect(assignment!.createdAt.getTime()).toBeLessThan(work!.completedAt.getTime());
    }
    expect(statuses['done']).toMatchObject({ status: 'done', score: 67 });
    expect(statuses['open']).toMatchObject({ status: 'not-started' });
    expect(statuses['overdue']).toMatchObject({ status: 'missing' });
  });
});
