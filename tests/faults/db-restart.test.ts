import request from 'supertest';
import { startServer, type RunningServer } from '../../server/main';
import { Setup } from '../../server/models';
import { isolatedDb, type IsolatedDb } from '../support/isolated-db';
import { makeTeam, PASSWORD, type Members } from '../support/api';

let db: IsolatedDb;
let server: RunningServer;
let m: Members;

beforeAll(async () => {
  db = await isolatedDb();
  server = await startServer({ ...db.config, port: 0 });
  m = await makeTeam('restart');
}, 120_000);

afterAll(async () => {
  await server?.close();
  await db?.destroy();
});

describe('a database restart while the app runs', () => {
  it('turns health to 503, answers requests with a clear 503, then recovers without losing data or sessions', async () => {
    const agent = request.agent(server.url);
    const { token } = (await agent.get('/api/auth/csrf').expect(200)).body as { token: string };
    await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: m.machinist.email, password: PASSWORD }).expect(200);
    const created = await agent.post('/api/setups').set('X-CSRF-Token', token).send({ name: 'Kept through restart', kind: 'taper', inputs: { unit: 'in' } }).expect(201);

    await db.stop();
    const health = await request(server.url).get('/api/health').expect(503);
    expect(health.body).toMatchObject({ db: 'down' });
    const down = await agent.get('/api/setups').expect(503);
    expect(down.body.error).toMatch(/database/i);
    // The public calculation routes need no database and keep answering.
    const calc = await request(server.url).post('/api/calc/sine-bar').send({ unit: 'in', barLength: '5', angle: '30' });
    expect(calc.status).toBe(200);

    await db.start();
    let status = 0;
    for (let i = 0; i < 50 && status !== 200; i++) {
      status = (await request(server.url).get('/api/health')).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(status).toBe(200);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.email).toBe(m.machinist.email);
    const kept = await agent.get(`/api/setups/${created.body.id}`).expect(200);
    expect(kept.body.name).toBe('Kept through restart');
    expect(await Setup.count({ where: { id: created.body.id } })).toBe(1);
  }, 120_000);
});
