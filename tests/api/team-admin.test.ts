import request from 'supertest';
import { Invitation, PasswordReset, Session, User } from '../../server/models';
import { hashToken } from '../../server/services/tokens';
import { RESET_REQUESTED_MESSAGE } from '../../shared/api/team-admin';
import { client, clientIp, makeTeam, openApp, PASSWORD, type Client, type Members, type TestApp } from '../support/api';
import { mailsTo, tokenIn, waitForMail } from '../support/mailbox';

jest.setTimeout(30_000);

let t: TestApp;
let m: Members;
let foreign: Members;
const c = {} as Record<'admin' | 'lead' | 'machinist' | 'apprentice' | 'foreign', Client>;

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('team-admin');
  foreign = await makeTeam('team-admin-foreign');
  for (const role of ['admin', 'lead', 'machinist', 'apprentice'] as const) c[role] = await client(t.app, m[role]);
  c.foreign = await client(t.app, foreign.admin);
});
afterAll(() => t.close());

const post = (who: Client, url: string, body: object) => who.agent.post(url).set('X-CSRF-Token', who.token).send(body);
const patch = (who: Client, url: string, body: object) => who.agent.patch(url).set('X-CSRF-Token', who.token).send(body);
const uniqueEmail = (who: string) => `${who}.${Date.now()}.${Math.floor(Math.random() * 1e6)}@example.test`;

describe('/api/team members', () => {
  it('refuses anonymous callers with 401', async () => {
    await request(t.app).get('/api/team/members').expect(401);
  });

  it('lists the own team only, to admins and leads', async () => {
    const res = await c.admin.agent.get('/api/team/members').expect(200);
    const emails = (res.body.members as Array<{ email: string }>).map((x) => x.email);
    expect(emails).toEqual(expect.arrayContaining([m.admin.email, m.apprentice.email]));
    expect(emails).not.toContain(foreign.admin.email);
    expect(res.body.members[0]).not.toHaveProperty('passwordHash');
    await c.lead.agent.get('/api/team/members').expect(200);
  });

  it('refuses machinists and apprentices with 403', async () => {
    await c.machinist.agent.get('/api/team/members').expect(403);
    await c.apprentice.agent.get('/api/team/members').expect(403);
  });

  it('lets only admins change roles; a lead gets 403', async () => {
    await patch(c.lead, `/api/team/members/${m.other.id}`, { role: 'lead' }).expect(403);
    const res = await patch(c.admin, `/api/team/members/${m.other.id}`, { role: 'lead' }).expect(200);
    expect(res.body).toMatchObject({ id: m.other.id, role: 'lead', active: true });
    expect((await User.findByPk(m.other.id))!.role).toBe('lead');
    await patch(c.admin, `/api/team/members/${m.other.id}`, { role: 'machinist' }).expect(200);
  });

  it('names a bad role and an empty body with 400', async () => {
    const bad = await patch(c.admin, `/api/team/members/${m.other.id}`, { role: 'foreman' }).expect(400);
    expect(bad.body.fields.role).toMatch(/one of/);
    await patch(c.admin, `/api/team/members/${m.other.id}`, {}).expect(400);
  });

  it('answers 404 for another team\'s member and for an id that cannot exist', async () => {
    await patch(c.admin, `/api/team/members/${foreign.machinist.id}`, { active: false }).expect(404);
    await patch(c.admin, '/api/team/members/abc', { active: false }).expect(404);
    expect((await User.findByPk(foreign.machinist.id))!.active).toBe(true);
  });

  it('will not let an admin demote or deactivate themselves', async () => {
    await patch(c.admin, `/api/team/members/${m.admin.id}`, { active: false }).expect(409);
    await patch(c.admin, `/api/team/members/${m.admin.id}`, { role: 'apprentice' }).expect(409);
  });

  it('ends every session of a deactivated member at once, and refuses their sign-in', async () => {
    const team = await makeTeam('deactivate');
    const admin = await client(t.app, team.admin);
    const first = await client(t.app, team.machinist);
    const second = await client(t.app, team.machinist);
    await first.agent.get('/api/auth/me').expect(200);
    expect(await Session.count({ where: { userId: team.machinist.id } })).toBe(2);

    await patch(admin, `/api/team/members/${team.machinist.id}`, { active: false }).expect(200);
    expect(await Session.count({ where: { userId: team.machinist.id } })).toBe(0);
    await first.agent.get('/api/auth/me').expect(401);
    await second.agent.get('/api/setups').expect(401);
    const again = await client(t.app);
    await post(again, '/api/auth/login', { email: team.machinist.email, password: PASSWORD }).expect(401);

    const back = await patch(admin, `/api/team/members/${team.machinist.id}`, { active: true }).expect(200);
    expect(back.body.active).toBe(true);
    await post(again, '/api/auth/login', { email: team.machinist.email, password: PASSWORD }).expect(200);
  });
});

describe('/api/team/invitations', () => {
  it('lets only admins invite', async () => {
    await post(c.lead, '/api/team/invitations', { email: uniqueEmail('x'), role: 'apprentice' }).expect(403);
    await post(c.apprentice, '/api/team/invitations', { email: uniqueEmail('x'), role: 'apprentice' }).expect(403);
  });

  it('names bad fields with 400', async () => {
    const res = await post(c.admin, '/api/team/invitations', { email: 'not-an-address', role: 'boss' }).expect(400);
    expect(Object.keys(res.body.fields).sort()).toEqual(['email', 'role']);
  });

  it('refuses an address that already has an account with 409', async () => {
    const res = await post(c.admin, '/api/team/invitations', { email: m.machinist.email, role: 'lead' }).expect(409);
    expect(res.body.fields.email).toBeDefined();
  });

  it('mails a single-use link, stores only its hash, and the accepted invitation makes the member', async () => {
    const email = uniqueEmail('new.hand');
    const res = await post(c.admin, '/api/team/invitations', { email: email.toUpperCase(), role: 'apprentice' }).expect(201);
    expect(res.body.mailSent).toBe(true);
    expect(res.body.invitation).toMatchObject({ email, role: 'apprentice', invitedBy: m.admin.name });

    const mail = await waitForMail(email, 'invited');
    expect(mail.html).toContain('/accept-invite?token=');
    const token = tokenIn(mail.text, '/accept-invite');
    expect(mail.text).toContain(`${t.config.publicUrl}/accept-invite?token=${token}`);
    const row = await Invitation.findByPk(res.body.invitation.id);
    expect(row!.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(row!.toJSON())).not.toContain(token);

    const list = await c.admin.agent.get('/api/team/invitations').expect(200);
    expect((list.body.invitations as Array<{ email: string }>).map((i) => i.email)).toContain(email);
    const foreignList = await c.foreign.agent.get('/api/team/invitations').expect(200);
    expect((foreignList.body.invitations as Array<{ email: string }>).map((i) => i.email)).not.toContain(email);

    const anon = await client(t.app);
    const preview = await anon.agent.get(`/api/access/invitations/${token}`).expect(200);
    expect(preview.body).toMatchObject({ email, role: 'apprentice', teamName: m.team.name });

    const short = await post(anon, '/api/access/invitations/accept', { token, name: '', password: 'short' }).expect(400);
    expect(Object.keys(short.body.fields).sort()).toEqual(['name', 'password']);

    const accepted = await post(anon, '/api/access/invitations/accept', { token, name: 'Rowan Fell', password: 'a-long-new-password' }).expect(201);
    expect(accepted.body.user).toMatchObject({ email, name: 'Rowan Fell', role: 'apprentice' });
    const user = await User.findOne({ where: { email } });
    expect(user!.teamId).toBe(m.team.id);

    // Single use: the same link is gone afterwards.
    await anon.agent.get(`/api/access/invitations/${token}`).expect(410);
    await post(anon, '/api/access/invitations/accept', { token, name: 'Someone Else', password: 'another-long-password' }).expect(410);
    await post(anon, '/api/auth/login', { email, password: 'a-long-new-password' }).expect(200);
  });

  it('refuses a password of spaces only and one over 200 characters, on an invitation and a reset alike', async () => {
    const email = uniqueEmail('blank');
    await post(c.admin, '/api/team/invitations', { email, role: 'machinist' }).expect(201);
    const token = tokenIn((await waitForMail(email, 'invited')).text, '/accept-invite');
    // Its own address, so the reset below does not count against the other tests' throttle.
    const anon = await client(t.app, undefined, clientIp());
    const spaces = await post(anon, '/api/access/invitations/accept', { token, name: 'A', password: ' '.repeat(12) }).expect(400);
    expect(spaces.body.fields).toEqual({ password: 'Use letters, digits or signs, not only spaces.' });
    const long = await post(anon, '/api/access/invitations/accept', { token, name: 'A', password: 'p'.repeat(201) }).expect(400);
    expect(long.body.fields).toEqual({ password: 'Use at most 200 characters.' });
    expect(await User.count({ where: { email } })).toBe(0);
    // Spaces inside a password are kept and count.
    await post(anon, '/api/access/invitations/accept', { token, name: 'A', password: '  two words  ' }).expect(201);

    const team = await makeTeam('reset-blank');
    await post(anon, '/api/access/password-reset', { email: team.lead.email }).expect(202);
    const reset = tokenIn((await waitForMail(team.lead.email, 'Reset')).text, '/reset-password');
    const blank = await post(anon, '/api/access/password-reset/complete', { token: reset, password: '\t'.repeat(3) + ' '.repeat(9) }).expect(400);
    expect(blank.body.fields).toEqual({ password: 'Use letters, digits or signs, not only spaces.' });
    await post(anon, '/api/auth/login', { email: team.lead.email, password: PASSWORD }).expect(200);
  });

  it('refuses an expired invitation with 410 and an unknown token with 404', async () => {
    const email = uniqueEmail('late');
    const res = await post(c.admin, '/api/team/invitations', { email, role: 'machinist' }).expect(201);
    const token = tokenIn((await waitForMail(email, 'invited')).text, '/accept-invite');
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: res.body.invitation.id } });
    const anon = await client(t.app);
    await anon.agent.get(`/api/access/invitations/${token}`).expect(410);
    await post(anon, '/api/access/invitations/accept', { token, name: 'Late Comer', password: 'a-long-new-password' }).expect(410);
    expect(await User.count({ where: { email } })).toBe(0);
    await anon.agent.get(`/api/access/invitations/${'x'.repeat(43)}`).expect(404);
  });

  it('revokes an invitation (and a newer one replaces the older link)', async () => {
    const email = uniqueEmail('twice');
    await post(c.admin, '/api/team/invitations', { email, role: 'machinist' }).expect(201);
    const firstToken = tokenIn((await waitForMail(email, 'invited')).text, '/accept-invite');
    const second = await post(c.admin, '/api/team/invitations', { email, role: 'lead' }).expect(201);
    const anon = await client(t.app);
    await anon.agent.get(`/api/access/invitations/${firstToken}`).expect(410);
    await c.foreign.agent.delete(`/api/team/invitations/${second.body.invitation.id}`).set('X-CSRF-Token', c.foreign.token).expect(404);
    for (let i = 0; i < 80 && (await mailsTo(email)).length < 2; i++) await new Promise((r) => setTimeout(r, 100));
    const secondToken = tokenIn((await waitForMail(email, 'invited')).text, '/accept-invite');
    expect(secondToken).not.toBe(firstToken);
    await c.admin.agent.delete(`/api/team/invitations/${second.body.invitation.id}`).set('X-CSRF-Token', c.admin.token).expect(204);
    // The invitee is told the invitation was withdrawn, not that the link expired; the replaced one says the same.
    expect((await anon.agent.get(`/api/access/invitations/${secondToken}`).expect(410)).body.error).toMatch(/withdrawn/);
    expect((await anon.agent.get(`/api/access/invitations/${firstToken}`).expect(410)).body.error).toMatch(/replaced by a newer one/);
    const late = await post(anon, '/api/access/invitations/accept', { token: secondToken, name: 'Too Late', password: 'a-long-new-password' }).expect(410);
    expect(late.body.error).toMatch(/withdrawn/);
    const list = await c.admin.agent.get('/api/team/invitations').expect(200);
    expect((list.body.invitations as Array<{ email: string }>).map((i) => i.email)).not.toContain(email);
  });
});

describe('/api/access/password-reset', () => {
  it('answers the same for a known and an unknown address, and mails only the known one', async () => {
    const team = await makeTeam('reset');
    const anon = await client(t.app);
    const unknown = uniqueEmail('nobody');
    const a = await post(anon, '/api/access/password-reset', { email: team.apprentice.email }).expect(202);
    const b = await post(anon, '/api/access/password-reset', { email: unknown }).expect(202);
    expect(a.body).toEqual({ message: RESET_REQUESTED_MESSAGE });
    expect(b.body).toEqual(a.body);
    expect(Object.keys(a.headers).sort()).toEqual(Object.keys(b.headers).sort());
    await waitForMail(team.apprentice.email, 'Reset');
    await new Promise((r) => setTimeout(r, 300));
    expect(await mailsTo(unknown)).toHaveLength(0);
  });

  it('sets a new password once, ends every session, and the link is single-use', async () => {
    const team = await makeTeam('reset-use');
    const signedIn = await client(t.app, team.machinist);
    const anon = await client(t.app);
    await post(anon, '/api/access/password-reset', { email: team.machinist.email }).expect(202);
    const mail = await waitForMail(team.machinist.email, 'Reset');
    const token = tokenIn(mail.text, '/reset-password');
    expect(await PasswordReset.count({ where: { tokenHash: hashToken(token) } })).toBe(1);

    await anon.agent.get(`/api/access/password-reset/${token}`).expect(200);
    const weak = await post(anon, '/api/access/password-reset/complete', { token, password: 'short' }).expect(400);
    expect(weak.body.fields.password).toBeDefined();
    await post(anon, '/api/access/password-reset/complete', { token, password: 'brand-new-password-1' }).expect(204);
    await signedIn.agent.get('/api/auth/me').expect(401);
    await post(anon, '/api/access/password-reset/complete', { token, password: 'brand-new-password-2' }).expect(410);
    await anon.agent.get(`/api/access/password-reset/${token}`).expect(410);
    const fresh = await client(t.app);
    await post(fresh, '/api/auth/login', { email: team.machinist.email, password: PASSWORD }).expect(401);
    await post(fresh, '/api/auth/login', { email: team.machinist.email, password: 'brand-new-password-1' }).expect(200);
  });

  it('keeps only the newest reset link working', async () => {
    const team = await makeTeam('reset-newest');
    const anon = await client(t.app, undefined, clientIp());
    await post(anon, '/api/access/password-reset', { email: team.apprentice.email }).expect(202);
    const first = tokenIn((await waitForMail(team.apprentice.email, 'Reset')).text, '/reset-password');
    await post(anon, '/api/access/password-reset', { email: team.apprentice.email }).expect(202);
    // The mail goes out after the answer: wait for the second message.
    for (let i = 0; i < 80 && (await mailsTo(team.apprentice.email)).length < 2; i++) await new Promise((r) => setTimeout(r, 100));
    const second = tokenIn((await waitForMail(team.apprentice.email, 'Reset')).text, '/reset-password');
    expect(second).not.toBe(first);
    await anon.agent.get(`/api/access/password-reset/${first}`).expect(410);
    await anon.agent.get(`/api/access/password-reset/${second}`).expect(200);
    await post(anon, '/api/access/password-reset/complete', { token: first, password: 'brand-new-password-1' }).expect(410);
  });

  it('refuses an expired reset link with 410', async () => {
    const team = await makeTeam('reset-expired');
    const anon = await client(t.app);
    await post(anon, '/api/access/password-reset', { email: team.lead.email }).expect(202);
    const token = tokenIn((await waitForMail(team.lead.email, 'Reset')).text, '/reset-password');
    await PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });
    await post(anon, '/api/access/password-reset/complete', { token, password: 'brand-new-password-1' }).expect(410);
  });

  it('throttles repeated requests with 429, for known and unknown addresses alike', async () => {
    const anon = await client(t.app, undefined, clientIp());
    const email = uniqueEmail('flood');
    for (let i = 0; i < 5; i++) await post(anon, '/api/access/password-reset', { email }).expect(202);
    const res = await post(anon, '/api/access/password-reset', { email }).expect(429);
    expect(res.headers['retry-after']).toBeDefined();
  });

  it('needs the CSRF token like every other unsafe request', async () => {
    await request(t.app).post('/api/access/password-reset').send({ email: 'a@example.test' }).expect(403);
  });

  it('names a bad address with 400', async () => {
    const anon = await client(t.app);
    const res = await post(anon, '/api/access/password-reset', { email: 'nope' }).expect(400);
    expect(res.body.fields.email).toBeDefined();
  });
});

describe('/api/team/mailbox (dev mailbox)', () => {
  it('shows captured messages with their links to admins only', async () => {
    const email = uniqueEmail('mailbox');
    await post(c.admin, '/api/team/invitations', { email, role: 'machinist' }).expect(201);
    await waitForMail(email, 'invited');
    const res = await c.admin.agent.get(`/api/team/mailbox?to=${encodeURIComponent(email)}`).expect(200);
    expect(res.body.messages).toHaveLength(1);
    expect(res.body.messages[0].links[0]).toMatch(/\/accept-invite\?token=/);
    const one = await c.admin.agent.get(`/api/team/mailbox/${res.body.messages[0].id}`).expect(200);
    expect(one.body.subject).toMatch(/invited/);
    await c.lead.agent.get('/api/team/mailbox').expect(403);
    await c.apprentice.agent.get('/api/team/mailbox').expect(403);
  });

  it('is 404 for everyone when the real SMTP server is in use', async () => {
    const real = openApp({ mailFake: false });
    try {
      const admin = await client(real.app, m.admin);
      await admin.agent.get('/api/team/mailbox').expect(404);
    } finally {
      await real.close();
    }
  });
});
