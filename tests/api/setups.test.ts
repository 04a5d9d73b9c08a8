import request from 'supertest';
import { Setup } from '../../server/models';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';

jest.setTimeout(30_000);

let t: TestApp;
let m: Members;
let foreign: Members;
const c = {} as Record<'admin' | 'lead' | 'machinist' | 'apprentice' | 'other' | 'foreign', Client>;

const taper = { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' };

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('setups');
  foreign = await makeTeam('setups-foreign');
  for (const role of ['admin', 'lead', 'machinist', 'apprentice', 'other'] as const) c[role] = await client(t.app, m[role]);
  c.foreign = await client(t.app, foreign.lead);
});
afterAll(() => t.close());

function create(who: Client, body: object = { name: 'Wedge taper', kind: 'taper', inputs: taper }) {
  return who.agent.post('/api/setups').set('X-CSRF-Token', who.token).send(body);
}

describe('/api/setups', () => {
  it('refuses anonymous callers with 401 on every method', async () => {
    const anon = await client(t.app);
    await request(t.app).get('/api/setups').expect(401);
    await request(t.app).get('/api/setups/1').expect(401);
    await anon.agent.post('/api/setups').set('X-CSRF-Token', anon.token).send({ name: 'x', kind: 'taper', inputs: {} }).expect(401);
    await anon.agent.put('/api/setups/1').set('X-CSRF-Token', anon.token).send({ name: 'x', kind: 'taper', inputs: {} }).expect(401);
    await anon.agent.delete('/api/setups/1').set('X-CSRF-Token', anon.token).expect(401);
  });

  it('creates a set-up with 201, its id, owner, status and version', async () => {
    const res = await create(c.machinist).expect(201);
    expect(res.body).toMatchObject({ name: 'Wedge taper', kind: 'taper', inputs: taper, notes: '', status: 'draft', version: 1, ownerId: m.machinist.id });
    expect(res.headers['location']).toBe(`/api/setups/${res.body.id}`);
    const got = await c.machinist.agent.get(`/api/setups/${res.body.id}`).expect(200);
    expect(got.body).toEqual(res.body);
  });

  it('names each bad field with 400 and stores nothing', async () => {
    const before = await Setup.count({ where: { teamId: m.team.id } });
    const res = await create(c.machinist, { name: '', kind: 'lathe-spindle', inputs: 'text', notes: 5 }).expect(400);
    expect(Object.keys(res.body.fields).sort()).toEqual(['inputs', 'kind', 'name', 'notes']);
    expect(res.body.fields.kind).toMatch(/one of/);
    expect(await Setup.count({ where: { teamId: m.team.id } })).toBe(before);
  });

  it('refuses a body that is not an object', async () => {
    const res = await c.machinist.agent.post('/api/setups').set('X-CSRF-Token', c.machinist.token).set('Content-Type', 'application/json').send('[1,2]').expect(400);
    expect(res.body.error).toMatch(/JSON object/);
  });

  it('lists only the own team\'s set-ups', async () => {
    const mine = await create(c.lead, { name: 'Lead sine set-up', kind: 'sine-bar', inputs: { unit: 'in', barLength: '5', angle: '14.5' } }).expect(201);
    const theirs = await create(c.foreign, { name: 'Foreign set-up', kind: 'taper', inputs: taper }).expect(201);
    const list = await c.lead.agent.get('/api/setups').expect(200);
    const ids = (list.body.setups as Array<{ id: number }>).map((s) => s.id);
    expect(ids).toContain(mine.body.id);
    expect(ids).not.toContain(theirs.body.id);
  });

  it('answers 404 for another team\'s set-up and for unknown or malformed ids', async () => {
    const theirs = await create(c.foreign, { name: 'Foreign 2', kind: 'taper', inputs: taper }).expect(201);
    await c.lead.agent.get(`/api/setups/${theirs.body.id}`).expect(404);
    await c.lead.agent.put(`/api/setups/${theirs.body.id}`).set('X-CSRF-Token', c.lead.token).send({ name: 'hijack', kind: 'taper', inputs: taper }).expect(404);
    await c.lead.agent.delete(`/api/setups/${theirs.body.id}`).set('X-CSRF-Token', c.lead.token).expect(404);
    await c.lead.agent.get('/api/setups/999999999').expect(404);
    const res = await c.lead.agent.get('/api/setups/abc').expect(404);
    expect(res.body.error).toMatch(/No set-up/);
    expect((await Setup.findByPk(theirs.body.id))?.name).toBe('Foreign 2');
  });

  it('lets the owner, a lead and an admin change a set-up; others get 403', async () => {
    const own = await create(c.machinist, { name: 'Owned', kind: 'taper', inputs: taper }).expect(201);
    await Setup.update({ status: 'released' }, { where: { id: own.body.id } });
    const put = async (who: Client, name: string) => {
      const version = (await Setup.findByPk(own.body.id))?.version;
      return who.agent.put(`/api/setups/${own.body.id}`).set('X-CSRF-Token', who.token).send({ name, kind: 'taper', inputs: taper, version });
    };
    expect((await put(c.apprentice, 'by apprentice')).status).toBe(403);
    expect((await put(c.other, 'by other machinist')).status).toBe(403);
    expect((await put(c.machinist, 'by owner')).status).toBe(200);
    expect((await put(c.lead, 'by lead')).body).toMatchObject({ name: 'by lead', status: 'draft' });
    expect((await put(c.admin, 'by admin')).body).toMatchObject({ name: 'by admin', version: 4 });
    await Setup.update({ status: 'released' }, { where: { id: own.body.id } });
    await c.apprentice.agent.delete(`/api/setups/${own.body.id}`).set('X-CSRF-Token', c.apprentice.token).expect(403);
    await c.other.agent.delete(`/api/setups/${own.body.id}`).set('X-CSRF-Token', c.other.token).expect(403);
    // Released: nobody deletes it (a lead archives it instead).
    await c.lead.agent.delete(`/api/setups/${own.body.id}`).set('X-CSRF-Token', c.lead.token).expect(409);
    // A draft that was never released: the owner's lead may delete it.
    await Setup.update({ status: 'draft' }, { where: { id: own.body.id } });
    await c.other.agent.delete(`/api/setups/${own.body.id}`).set('X-CSRF-Token', c.other.token).expect(404); // another's draft: not visible
    await c.lead.agent.delete(`/api/setups/${own.body.id}`).set('X-CSRF-Token', c.lead.token).expect(204);
    await c.lead.agent.get(`/api/setups/${own.body.id}`).expect(404);
  });

  it('refuses to delete a released, archived or once-released set-up, for the owner and for a lead alike (409), and keeps it', async () => {
    const del = (who: Client, id: number) => who.agent.delete(`/api/setups/${id}`).set('X-CSRF-Token', who.token);
    const post = (who: Client, path: string) => who.agent.post(path).set('X-CSRF-Token', who.token).send({});
    const s = await create(c.machinist, { name: 'Team wedge', kind: 'taper', inputs: taper }).expect(201);
    await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
    for (const who of [c.machinist, c.lead, c.admin]) {
      const res = await del(who, s.body.id).expect(409);
      expect(res.body.error).toBe('This set-up is released, so it cannot be deleted. Archive it instead (a lead or an admin archives set-ups).');
    }
    // Revised after its release: a draft again, but its released version is in use.
    const edited = await c.machinist.agent.put(`/api/setups/${s.body.id}`).set('X-CSRF-Token', c.machinist.token).send({ name: 'Team wedge, revised', kind: 'taper', inputs: taper, version: 2 }).expect(200);
    expect(edited.body).toMatchObject({ status: 'draft', releasedVersion: 2 });
    expect((await del(c.machinist, s.body.id).expect(409)).body.error).toMatch(/^Version 2 of this set-up was released, so it cannot be deleted\. Archive it instead/);
    await del(c.lead, s.body.id).expect(409);
    await post(c.lead, `/api/setups/${s.body.id}/archive`).expect(200);
    expect((await del(c.admin, s.body.id).expect(409)).body.error).toMatch(/archived/);
    // A draft a lead archived without releasing it stays on record too.
    const shelved = await create(c.machinist, { name: 'Shelved draft', kind: 'taper', inputs: taper }).expect(201);
    await post(c.lead, `/api/setups/${shelved.body.id}/archive`).expect(200);
    await del(c.machinist, shelved.body.id).expect(409);
    expect(await Setup.count({ where: { id: [s.body.id, shelved.body.id] } })).toBe(2);
    // The owner's own draft, never released, may go.
    const junk = await create(c.machinist, { name: 'Junk draft', kind: 'taper', inputs: taper }).expect(201);
    await del(c.machinist, junk.body.id).expect(204);
    expect(await Setup.findByPk(junk.body.id)).toBeNull();
  });

  it('lets an apprentice keep and delete their own draft, hidden from other non-leads', async () => {
    const draft = await create(c.apprentice, { name: 'Practice bevel', kind: 'taper', inputs: taper }).expect(201);
    await c.other.agent.get(`/api/setups/${draft.body.id}`).expect(404);
    await c.lead.agent.get(`/api/setups/${draft.body.id}`).expect(200);
    await c.apprentice.agent.delete(`/api/setups/${draft.body.id}`).set('X-CSRF-Token', c.apprentice.token).expect(204);
  });

  it('answers 409 with the current version for a stale edit and loses nothing', async () => {
    const s = await create(c.machinist, { name: 'Versioned', kind: 'taper', inputs: taper }).expect(201);
    const first = await c.machinist.agent.put(`/api/setups/${s.body.id}`).set('X-CSRF-Token', c.machinist.token).send({ name: 'Edit A', kind: 'taper', inputs: taper, version: 1 }).expect(200);
    expect(first.body.version).toBe(2);
    const stale = await c.lead.agent.put(`/api/setups/${s.body.id}`).set('X-CSRF-Token', c.lead.token).send({ name: 'Edit B', kind: 'taper', inputs: taper, version: 1 }).expect(409);
    expect(stale.body.version).toBe(2);
    expect((await Setup.findByPk(s.body.id))?.name).toBe('Edit A');
  });

  it('requires the version an edit is based on', async () => {
    const s = await create(c.machinist, { name: 'Needs version', kind: 'taper', inputs: taper }).expect(201);
    const res = await c.machinist.agent.put(`/api/setups/${s.body.id}`).set('X-CSRF-Token', c.machinist.token).send({ name: 'No version', kind: 'taper', inputs: taper }).expect(400);
    expect(res.body.fields.version).toMatch(/version/);
    expect((await Setup.findByPk(s.body.id))?.name).toBe('Needs version');
  });
});
