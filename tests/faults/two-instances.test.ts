import request from 'supertest';
import { startServer, type RunningServer } from '../../server/main';
import { isolatedDb, type IsolatedDb } from '../support/isolated-db';
import { makeTeam, PASSWORD, type Members } from '../support/api';

let db: IsolatedDb;
let a: RunningServer;
let b: RunningServer;
let m: Members;

beforeAll(async () => {
  db = await isolatedDb();
  a = await startServer({ ...db.config, port: 0 });
  b = await startServer({ ...db.config, port: 0 });
  m = await makeTeam('two');
}, 120_000);

afterAll(async () => {
  await a?.close();
  await b?.close();
  await db?.destroy();
});

function cookieOf(res: request.Response): string {
  return String(res.headers['set-cookie']).split(';')[0]!;
}

describe('two app instances on one database', () => {
  it('accepts a session made on one instance on the other', async () => {
    const csrf = await request(a.url).get('/api/auth/csrf').expect(200);
    const login = await request(a.url).post('/api/auth/login').set('Cookie', cookieOf(csrf)).set('X-CSRF-Token', csrf.body.token).send({ email: m.lead.email, password: PASSWORD }).expect(200);
    const cookie = cookieOf(login);
    const me = await request(b.url).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.body.id).toBe(m.lead.id);
    // The CSRF token from instance A is valid on instance B too.
    await request(b.url).post('/api/auth/logout').set('Cookie', cookie).set('X-CSRF-Token', csrf.body.token).expect(204);
    await request(a.url).get('/api/auth/me').set('Cookie', cookie).expect(401);
  });

  it('ends concurrent edits of one set-up through both in one 200 and one 409', async () => {
    const signIn = async (url: string) => {
      const csrf = await request(url).get('/api/auth/csrf');
      const res = await request(url).post('/api/auth/login').set('Cookie', cookieOf(csrf)).set('X-CSRF-Token', csrf.body.token).send({ email: m.lead.email, password: PASSWORD }).expect(200);
      return { cookie: cookieOf(res), token: csrf.body.token as string };
    };
    const sa = await signIn(a.url);
    const sb = await signIn(b.url);
    for (let round = 0; round < 5; round++) {
      const created = await request(a.url).post('/api/setups').set('Cookie', sa.cookie).set('X-CSRF-Token', sa.token).send({ name: `Race ${round}`, kind: 'taper', inputs: { unit: 'in' } }).expect(201);
      const id = created.body.id as number;
      const [ra, rb] = await Promise.all([
        request(a.url).put(`/api/setups/${id}`).set('Cookie', sa.cookie).set('X-CSRF-Token', sa.token).send({ name: 'Edit through A', kind: 'taper', inputs: { unit: 'in' }, version: 1 }),
        request(b.url).put(`/api/setups/${id}`).set('Cookie', sb.cookie).set('X-CSRF-Token', sb.token).send({ name: 'Edit through B', kind: 'taper', inputs: { unit: 'in' }, version: 1 }),
      ]);
      expect([ra.status, rb.status].sort()).toEqual([200, 409]);
      const winner = ra.status === 200 ? ra : rb;
      const final = await request(a.url).get(`/api/setups/${id}`).set('Cookie', sa.cookie).expect(200);
      expect(final.body.name).toBe(winner.body.name);
      expect(final.body.version).toBe(2);
    }
  }, 60_000);
});
