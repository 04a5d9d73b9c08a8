import type { SessionData } from 'express-session';
import request from 'supertest';
import { SESSION_COOKIE } from '../../server/app';
import { Session, User } from '../../server/models';
import { createSessionStore } from '../../server/services/session-store';
import { client, clientIp, makeTeam, openApp, PASSWORD, type Members, type TestApp } from '../support/api';

let t: TestApp;
let m: Members;

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('auth');
});
afterAll(() => t.close());

describe('GET /api/health', () => {
  it('reports the database up', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up' });
  });
});

describe('sign-in', () => {
  it('signs in with e-mail and password and returns the public user', async () => {
    const c = await client(t.app);
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: m.lead.email, password: PASSWORD }).expect(200);
    expect(res.body).toEqual({ user: { id: m.lead.id, email: m.lead.email, name: m.lead.name, role: 'lead' } });
    const me = await c.agent.get('/api/auth/me').expect(200);
    expect(me.body).toEqual({ id: m.lead.id, email: m.lead.email, name: m.lead.name, role: 'lead' });
  });

  it('accepts the e-mail in any letter case', async () => {
    const c = await client(t.app);
    await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: m.machinist.email.toUpperCase(), password: PASSWORD }).expect(200);
  });

  it('gives one message for an unknown e-mail and for a wrong password', async () => {
    const c = await client(t.app);
    const unknown = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: 'nobody@example.test', password: PASSWORD }).expect(401);
    const wrong = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: m.admin.email, password: 'not-the-password' }).expect(401);
    expect(unknown.body.error).toBe(wrong.body.error);
    expect(unknown.body.error).toMatch(/incorrect/);
  });

  it('names the missing fields of a bad body with 400', async () => {
    const c = await client(t.app);
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: '' }).expect(400);
    expect(Object.keys(res.body.fields)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('refuses malformed JSON with a JSON 400', async () => {
    const c = await client(t.app);
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).set('Content-Type', 'application/json').send('{"email":').expect(400);
    expect(res.body.error).toMatch(/not valid JSON/);
  });

  it('does not sign in a deactivated member', async () => {
    const { team } = m;
    const gone = await User.create({ teamId: team.id, email: `gone.${team.id}@example.test`, name: 'Gone', role: 'machinist', passwordHash: m.lead.passwordHash, active: false });
    const c = await client(t.app);
    await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: gone.email, password: PASSWORD }).expect(401);
  });

  it('regenerates the session id on sign-in (no fixation) and keeps the CSRF token valid', async () => {
    const sid = (res: request.Response) => /slantwise\.sid=([^;]+)/.exec(String(res.headers['set-cookie']))?.[1];
    const agent = request.agent(t.app).set('X-Forwarded-For', clientIp());
    const first = await agent.get('/api/auth/csrf').expect(200);
    const before = sid(first);
    expect(before).toBeDefined();
    const login = await agent.post('/api/auth/login').set('X-CSRF-Token', first.body.token).send({ email: m.apprentice.email, password: PASSWORD }).expect(200);
    const after = sid(login);
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    // The session id set before sign-in does not carry the signed-in user.
    await request(t.app).get('/api/auth/me').set('Cookie', `${SESSION_COOKIE}=${before}`).expect(401);
    await request(t.app).get('/api/auth/me').set('Cookie', `${SESSION_COOKIE}=${after}`).expect(200);
    // The token the client already holds still works after sign-in.
    await agent.post('/api/auth/logout').set('X-CSRF-Token', first.body.token).expect(204);
  });

  it('sets a named, httpOnly, sameSite=lax session cookie with an expiry', async () => {
    const res = await request(t.app).get('/api/auth/csrf').set('X-Forwarded-For', clientIp()).expect(200);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toContain(`${SESSION_COOKIE}=`);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).toMatch(/Expires=/);
    expect(cookie).not.toMatch(/Secure/);
  });

  it('marks the cookie Secure when served over TLS behind a trusted proxy', async () => {
    const res = await request(t.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https').set('X-Forwarded-For', clientIp()).expect(200);
    expect(String(res.headers['set-cookie'])).toMatch(/Secure/);
  });

  it('stores sessions in MariaDB with the user id', async () => {
    const c = await client(t.app, m.other);
    const rows = await Session.findAll({ where: { userId: m.other.id } });
    expect(rows.length).toBeGreaterThan(0);
    await c.agent.post('/api/auth/logout').set('X-CSRF-Token', c.token).expect(204);
  });
});

describe('sign-out and /me', () => {
  it('tells the app who is signed in on /session, 200 with null for nobody', async () => {
    expect((await request(t.app).get('/api/auth/session').expect(200)).body).toEqual({ user: null });
    const c = await client(t.app, m.lead);
    expect((await c.agent.get('/api/auth/session').expect(200)).body).toEqual({ user: { id: m.lead.id, email: m.lead.email, name: m.lead.name, role: 'lead' } });
  });

  it('answers 401 on /me when nobody is signed in', async () => {
    const res = await request(t.app).get('/api/auth/me').expect(401);
    expect(res.body.error).toMatch(/Sign in/);
  });

  it('destroys the session on sign-out', async () => {
    const c = await client(t.app, m.machinist);
    await c.agent.get('/api/auth/me').expect(200);
    await c.agent.post('/api/auth/logout').set('X-CSRF-Token', c.token).expect(204);
    await c.agent.get('/api/auth/me').expect(401);
  });

  it('ends a session on the server once its idle expiry has passed', async () => {
    const c = await client(t.app, m.admin);
    await c.agent.get('/api/auth/me').expect(200);
    await Session.update({ expires: new Date(Date.now() - 1000) }, { where: { userId: m.admin.id } });
    await c.agent.get('/api/auth/me').expect(401);
  });

  it('renews the session (its cookie and its row) at most once a minute, not on every response', async () => {
    const c = await client(t.app, m.machinist);
    await c.agent.get('/api/auth/me').expect(200);
    const quiet = await c.agent.get('/api/auth/me').expect(200);
    expect(quiet.headers['set-cookie']).toBeUndefined();
    // Move the last renewal two minutes back and the row's expiry close: the next request renews both.
    const [row] = await Session.findAll({ where: { userId: m.machinist.id }, order: [['updatedAt', 'DESC']], limit: 1 });
    const data = JSON.parse(row!.data!) as { renewedAt: number };
    expect(data.renewedAt).toBeGreaterThan(Date.now() - 60_000);
    const soon = new Date(Date.now() + 60_000);
    await row!.update({ data: JSON.stringify({ ...data, renewedAt: data.renewedAt - 120_000 }), expires: soon });
    const renewed = await c.agent.get('/api/auth/me').expect(200);
    const cookie = String(renewed.headers['set-cookie']);
    expect(cookie).toMatch(new RegExp(`^${SESSION_COOKIE}=`));
    const cookieExpires = new Date(/Expires=([^;]+)/.exec(cookie)![1]!).getTime();
    expect(cookieExpires).toBeGreaterThan(Date.now() + t.config.sessionIdleMs - 5_000);
    await row!.reload();
    expect(row!.expires!.getTime()).toBeGreaterThan(soon.getTime() + 60_000);
    expect(row!.userId).toBe(m.machinist.id);
  });

  it('keeps a signed-out session gone when a request that began before the sign-out saves it afterwards', async () => {
    const store = createSessionStore(Session.sequelize!, t.config.sessionIdleMs);
    try {
      const call = <T>(fn: (done: (err: unknown, value?: T) => void) => void) => new Promise<T | undefined>((resolve, reject) => fn((err, value) => (err ? reject(err) : resolve(value))));
      const sid = `race-${Date.now()}-${Math.random().toString(36).slice(2, 10)}`;
      const data = { cookie: { originalMaxAge: 60_000, expires: new Date(Date.now() + 60_000) }, userId: m.machinist.id, csrfToken: 'x' };
      await call((done) => store.store.set(sid, data as never, done));
      const loaded = await call<SessionData | null>((done) => store.store.get(sid, done));
      expect(loaded).toMatchObject({ userId: m.machinist.id });
      await call((done) => store.store.destroy(sid, done)); // the sign-out
      await call((done) => store.store.set(sid, { ...data, renewedAt: Date.now() } as never, done)); // the late renewal
      expect(await call((done) => store.store.get(sid, done))).toBeNull();
      expect(await Session.count({ where: { sid } })).toBe(0);
    } finally {
      store.stop();
    }
  });

  it('answers many requests in flight on one session each with that session\'s member and current role', async () => {
    const extra = await User.create({ teamId: m.team.id, email: `busy.${m.team.id}@example.test`, name: 'Busy', role: 'machinist', passwordHash: m.lead.passwordHash });
    const c = await client(t.app, extra);
    const other = await client(t.app, m.apprentice);
    const answers = await Promise.all(Array.from({ length: 24 }, (_, i) => (i % 3 === 2 ? other : c).agent.get('/api/auth/me')));
    answers.forEach((res, i) => {
      expect(res.status).toBe(200);
      expect(res.body.id).toBe(i % 3 === 2 ? m.apprentice.id : extra.id);
    });
    // A role changed between requests shows on the next one: the user is read with each request's session.
    await extra.update({ role: 'lead' });
    expect((await c.agent.get('/api/auth/me').expect(200)).body.role).toBe('lead');
  });

  it('ends the session of a member deactivated while signed in', async () => {
    const extra = await User.create({ teamId: m.team.id, email: `late.${m.team.id}@example.test`, name: 'Late', role: 'machinist', passwordHash: m.lead.passwordHash });
    const c = await client(t.app, extra);
    await c.agent.get('/api/auth/me').expect(200);
    await extra.update({ active: false });
    await c.agent.get('/api/auth/me').expect(401);
  });
});

describe('CSRF', () => {
  it('refuses sign-in without the token', async () => {
    const c = await client(t.app);
    const res = await c.agent.post('/api/auth/login').send({ email: m.lead.email, password: PASSWORD }).expect(403);
    expect(res.body.error).toMatch(/CSRF/);
  });

  it('refuses a token from another session', async () => {
    const a = await client(t.app);
    const b = await client(t.app, m.lead);
    await b.agent.post('/api/auth/logout').set('X-CSRF-Token', a.token).expect(403);
    await b.agent.post('/api/setups').set('X-CSRF-Token', a.token).send({ name: 'x', kind: 'taper', inputs: {} }).expect(403);
    await b.agent.get('/api/auth/me').expect(200);
  });

  it('refuses sign-out without the token', async () => {
    const c = await client(t.app, m.lead);
    await c.agent.post('/api/auth/logout').expect(403);
    await c.agent.get('/api/auth/me').expect(200);
  });

  it('does not ask for a token on the calculation routes', async () => {
    const res = await request(t.app).post('/api/calc/taper').send({ unit: 'in', thickness: '0.750', angle: '5', taperLength: '3.000' });
    expect(res.status).not.toBe(403);
  });
});

describe('throttling', () => {
  it('answers 429 after repeated failures for one account, even from other addresses', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const c = await client(t.app);
      const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: m.other.email, password: 'wrong-' + i });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 5).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
    // Even the right password is refused while the account is throttled.
    const c = await client(t.app);
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: m.other.email, password: PASSWORD }).expect(429);
    expect(res.headers['retry-after']).toBeDefined();
    expect(res.body.error).toMatch(/Too many/);
  });

  it('answers 429 after repeated failures from one address across accounts', async () => {
    const ip = clientIp();
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const c = await client(t.app, undefined, ip);
      const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: `someone${i}@example.test`, password: 'wrong' });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 5).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
  });

  it('answers 429 on the calculation routes past the per-address limit, telling what is left', async () => {
    const limited = openApp({ calcRateLimitPerMinute: 3 });
    try {
      const body = { unit: 'in', barLength: '5', angle: '30' };
      const ip = clientIp();
      const calc = (from: string) => request(limited.app).post('/api/calc/sine-bar').set('X-Forwarded-For', from).send(body);
      const first = await calc(ip).expect(200);
      expect(first.headers['ratelimit-policy']).toBe('3;w=60');
      expect(first.headers['ratelimit']).toMatch(/^limit=3, remaining=2, reset=\d+$/);
      await calc(ip).expect(200);
      await calc(ip).expect(200);
      const refused = await calc(ip).expect(429);
      expect(refused.headers['content-type']).toMatch(/json/);
      expect(refused.body.error).toMatch(/wait a minute/);
      expect(refused.headers['ratelimit']).toMatch(/remaining=0/);
      // Another address is counted on its own.
      await calc(clientIp()).expect(200);
    } finally {
      await limited.close();
    }
  });
});

describe('security headers and errors', () => {
  it('sends a CSP without inline scripts or third-party origins, and nosniff', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toMatch(/script-src 'self'(;|$)/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    expect(csp).not.toMatch(/https?:\/\//);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('answers unknown API paths with a JSON 404', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body.error).toMatch(/No such API route/);
  });

  it('refuses an oversized JSON body with 413', async () => {
    const c = await client(t.app);
    const res = await c.agent.post('/api/auth/login').set('X-CSRF-Token', c.token).send({ email: 'x'.repeat(200_000), password: 'y' }).expect(413);
    expect(res.body.error).toMatch(/too large/);
  });
});
