import { BatchRun, InventorySet, Setup, SetupRevision } from '../../server/models';
import type { SetupCheck } from '../../shared/api/setup';
import { SETUP_PEOPLE } from '../../server/services/setup-access';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';
import { pdfText } from '../support/pdf-text';

jest.setTimeout(30_000);

let t: TestApp;
let m: Members;
let foreign: Members;
const c = {} as Record<'admin' | 'lead' | 'machinist' | 'apprentice' | 'other' | 'foreign', Client>;

const taper = { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250', depthPerPass: '0.040' };
const checks = [{ key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' }];

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('library');
  foreign = await makeTeam('library-foreign');
  for (const role of ['admin', 'lead', 'machinist', 'apprentice', 'other'] as const) c[role] = await client(t.app, m[role]);
  c.foreign = await client(t.app, foreign.lead);
});
afterAll(() => t.close());

function create(who: Client, body: Record<string, unknown>) {
  return who.agent.post('/api/setups').set('X-CSRF-Token', who.token).send({ kind: 'taper', inputs: taper, ...body });
}
/** GET a set-up's sheet as bytes (200 expected). */
function sheet(who: Client, id: number) {
  return who.agent.get(`/api/setups/${id}/sheet.pdf`).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (d: Buffer) => chunks.push(d));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  }).expect(200);
}
function post(who: Client, path: string, body: object = {}) {
  return who.agent.post(path).set('X-CSRF-Token', who.token).send(body);
}
function put(who: Client, id: number, body: Record<string, unknown>) {
  return who.agent.put(`/api/setups/${id}`).set('X-CSRF-Token', who.token).send({ kind: 'taper', inputs: taper, ...body });
}

describe('set-up library', () => {
  describe('GET /api/setups paging, filters, sort and search', () => {
    let team: Members;
    const w = {} as Record<'lead' | 'machinist' | 'other' | 'apprentice', Client>;
    beforeAll(async () => {
      team = await makeTeam('library-list');
      for (const role of ['lead', 'machinist', 'other', 'apprentice'] as const) w[role] = await client(t.app, team[role]);
      const made: Array<[Client, Record<string, unknown>, boolean]> = [
        [w.machinist, { name: 'Alpha wedge', job: 'J-100', notes: 'first of the wedges' }, true],
        [w.machinist, { name: 'Bravo wedge', job: 'J-100' }, false],
        [w.machinist, { name: 'Charlie sine', kind: 'sine-bar', inputs: { unit: 'in', barLength: '5', angle: '14.5' }, job: 'J-200' }, true],
        [w.other, { name: 'Delta dovetail 50%_off', kind: 'pins-rolls', inputs: { kind: 'dovetail', unit: 'in', side: 'male', angle: '60', rollDiameter: '0.5', width: '2' }, job: 'J-300' }, true],
        [w.other, { name: 'Echo draft of other', job: 'J-300' }, false],
        [w.apprentice, { name: 'Foxtrot practice' }, false],
        [w.lead, { name: 'Golf lathe', kind: 'lathe-taper', inputs: { unit: 'in', taperPerFoot: '0.6' }, job: 'J-400' }, true],
      ];
      for (const [who, body, release] of made) {
        const res = await create(who, body).expect(201);
        if (release) await post(w.lead, `/api/setups/${res.body.id}/release`).expect(200);
      }
    });

    it('should keep {setups} and add total, page and pageSize', async () => {
      const res = await w.lead.agent.get('/api/setups?pageSize=3&sort=name&dir=asc').expect(200);
      expect(res.body).toMatchObject({ total: 7, page: 1, pageSize: 3 });
      expect(res.body.setups.map((s: { name: string }) => s.name)).toEqual(['Alpha wedge', 'Bravo wedge', 'Charlie sine']);
      const last = await w.lead.agent.get('/api/setups?pageSize=3&page=3&sort=name&dir=asc').expect(200);
      expect(last.body.setups.map((s: { name: string }) => s.name)).toEqual(['Golf lathe']);
      const beyond = await w.lead.agent.get('/api/setups?pageSize=3&page=9').expect(200);
      expect(beyond.body).toMatchObject({ total: 7, setups: [] });
    });

    it('should count only what the caller may see (released plus own drafts)', async () => {
      const res = await w.machinist.agent.get('/api/setups?sort=name').expect(200);
      expect(res.body.setups.map((s: { name: string }) => s.name)).toEqual(['Alpha wedge', 'Bravo wedge', 'Charlie sine', 'Delta dovetail 50%_off', 'Golf lathe']);
      expect(res.body.total).toBe(5);
    });

    it('should filter by kind, status, owner and job, and sort descending', async () => {
      const kind = await w.lead.agent.get('/api/setups?kind=taper&sort=name&dir=desc').expect(200);
      expect(kind.body.setups.map((s: { name: string }) => s.name)).toEqual(['Foxtrot practice', 'Echo draft of other', 'Bravo wedge', 'Alpha wedge']);
      const drafts = await w.lead.agent.get('/api/setups?status=draft').expect(200);
      expect(drafts.body.total).toBe(3);
      const owner = await w.lead.agent.get(`/api/setups?ownerId=${team.other.id}`).expect(200);
      expect(owner.body.total).toBe(2);
      const job = await w.lead.agent.get('/api/setups?job=J-100').expect(200);
      expect(job.body.total).toBe(2);
      // The start of a job number finds its set-ups; LIKE wildcards are taken literally.
      expect((await w.lead.agent.get('/api/setups?job=J-1').expect(200)).body.total).toBe(2);
      expect((await w.lead.agent.get('/api/setups?job=J-_00').expect(200)).body.total).toBe(0);
      expect((await w.lead.agent.get('/api/setups?job=J-3').expect(200)).body.total).toBe(2);
      const combined = await w.lead.agent.get('/api/setups?job=J-100&status=released').expect(200);
      expect(combined.body.setups.map((s: { name: string }) => s.name)).toEqual(['Alpha wedge']);
    });

    it('should sort by owner name', async () => {
      const res = await w.lead.agent.get('/api/setups?sort=owner&dir=asc&pageSize=100').expect(200);
      const owners = res.body.setups.map((s: { ownerName: string }) => s.ownerName);
      expect(owners).toEqual([...owners].sort());
    });

    it('should search name, job and notes, every word, with wildcards taken literally', async () => {
      expect((await w.lead.agent.get('/api/setups?q=wedge').expect(200)).body.total).toBe(2);
      expect((await w.lead.agent.get('/api/setups?q=first%20wedges').expect(200)).body.setups.map((s: { name: string }) => s.name)).toEqual(['Alpha wedge']);
      expect((await w.lead.agent.get('/api/setups?q=J-300').expect(200)).body.total).toBe(2);
      expect((await w.lead.agent.get('/api/setups?q=50%25_').expect(200)).body.total).toBe(1);
      expect((await w.lead.agent.get('/api/setups?q=%25').expect(200)).body.total).toBe(1);
    });

    it('should answer each list row and the detail exactly as the stored set-up reads through its model', async () => {
      const res = await w.lead.agent.get('/api/setups?pageSize=100').expect(200);
      expect(res.body.setups).toHaveLength(7);
      for (const row of res.body.setups as Array<{ id: number }>) {
        const model = await Setup.findByPk(row.id, { include: SETUP_PEOPLE });
        const expected = JSON.parse(JSON.stringify(model!.toDto()));
        expect(row).toEqual(expected);
        expect((await w.lead.agent.get(`/api/setups/${row.id}`).expect(200)).body).toEqual(expected);
      }
      // Released rows name their releaser, drafts do not; both read back their inputs as objects.
      const released = res.body.setups.find((s: { name: string }) => s.name === 'Charlie sine');
      expect(released).toMatchObject({ status: 'released', releasedByName: team.lead.name, inputs: { barLength: '5' } });
    });

    it('should name everyone who owns set-ups the caller may see, with how many, for the owner filter', async () => {
      const byId = (owners: Array<{ id: number; name: string; count: number }>) => Object.fromEntries(owners.map((o) => [o.id, [o.name, o.count]]));
      const lead = (await w.lead.agent.get('/api/setups/owners').expect(200)).body.owners;
      expect(byId(lead)).toEqual({
        [team.machinist.id]: [team.machinist.name, 3],
        [team.other.id]: [team.other.name, 2],
        [team.apprentice.id]: [team.apprentice.name, 1],
        [team.lead.id]: [team.lead.name, 1],
      });
      const names = lead.map((o: { name: string }) => o.name);
      expect(names).toEqual([...names].sort((a: string, b: string) => a.localeCompare(b)));
      // A machinist sees released set-ups and their own drafts only: the apprentice's draft is not counted.
      const machinist = (await w.machinist.agent.get('/api/setups/owners').expect(200)).body.owners;
      expect(byId(machinist)).toEqual({ [team.machinist.id]: [team.machinist.name, 3], [team.other.id]: [team.other.name, 1], [team.lead.id]: [team.lead.name, 1] });
      // Each count is what the list shows for that owner.
      for (const o of machinist as Array<{ id: number; count: number }>) {
        expect((await w.machinist.agent.get(`/api/setups?ownerId=${o.id}`).expect(200)).body.total).toBe(o.count);
      }
      expect((await c.foreign.agent.get('/api/setups/owners').expect(200)).body.owners.map((o: { id: number }) => o.id)).not.toContain(team.machinist.id);
    });

    it('should send hard text and odd inputs in list rows exactly as stored (rows are JSON built by MariaDB)', async () => {
      // A team of its own, so the counts above stay as they are.
      const odd = await makeTeam('library-odd');
      const lead = await client(t.app, odd.lead);
      const bodies = [
        {
          name: 'He said "7°30′" \\ then\ttabbed \u0001 ✓ 🛠 </script>',
          notes: 'line one\nline two\r\n\u2028 \'quoted\' & <b>bold</b> %_\\',
          job: 'Ü-ß/α',
          inputs: { unit: 'mm', angle: "7°30'", nested: { list: [1, 0.1, 1e-7, -2.5e21, true, false, null, ''], 'ключ': 'значение' }, empty: {} },
          checks,
        },
        { name: 'Plain', inputs: taper, job: '' },
        { name: 'Second plain', inputs: taper, notes: '' },
      ];
      for (const body of bodies) await create(lead, body).expect(201);
      const res = await lead.agent.get('/api/setups?pageSize=100').expect(200);
      expect(res.body.total).toBe(3);
      for (const row of res.body.setups as Array<{ id: number }>) {
        const model = await Setup.findByPk(row.id, { include: SETUP_PEOPLE });
        expect(row).toEqual(JSON.parse(JSON.stringify(model!.toDto())));
      }
      expect(res.body.setups.find((s: { name: string }) => s.name.startsWith('He said')).inputs.nested.list).toEqual([1, 0.1, 1e-7, -2.5e21, true, false, null, '']);
      // Every sort, both ways: walking pages of one gives the same order as one page of all.
      for (const sort of ['name', 'kind', 'status', 'job', 'owner', 'updatedAt', 'createdAt']) {
        for (const dir of ['asc', 'desc']) {
          const all = (await lead.agent.get(`/api/setups?sort=${sort}&dir=${dir}&pageSize=100`).expect(200)).body.setups.map((s: { id: number }) => s.id);
          const walked: number[] = [];
          for (let page = 1; page <= 3; page += 1) {
            const one = (await lead.agent.get(`/api/setups?sort=${sort}&dir=${dir}&pageSize=1&page=${page}`).expect(200)).body;
            expect(one).toMatchObject({ total: 3, page, pageSize: 1 });
            walked.push(...one.setups.map((s: { id: number }) => s.id));
          }
          expect(walked).toEqual(all);
        }
      }
    });

    it('should answer a repeated page from MariaDB\'s query cache and still show every change at once', async () => {
      const sequelize = Setup.sequelize!;
      const read = async (sql: string) => ((await sequelize.query(sql, { plain: true })) as { Value: string } | null)?.Value;
      const status = async (name: string) => Number(await read(`SHOW GLOBAL STATUS LIKE '${name}'`));
      expect(await read("SHOW GLOBAL VARIABLES LIKE 'query_cache_type'")).toBe('ON');
      const fresh = await makeTeam('library-cache');
      const lead = await client(t.app, fresh.lead);
      const made = await create(lead, { name: 'Cached wedge' }).expect(201);
      const page = '/api/setups?sort=name&pageSize=10';
      expect((await lead.agent.get(page).expect(200)).body.setups.map((s: { name: string }) => s.name)).toEqual(['Cached wedge']);
      const hits = await status('Qcache_hits');
      expect((await lead.agent.get(page).expect(200)).body.setups.map((s: { name: string }) => s.name)).toEqual(['Cached wedge']);
      expect(await status('Qcache_hits')).toBeGreaterThan(hits);
      // An edit through the API, and one straight to the table (as another instance would), show on the next read.
      await put(lead, made.body.id, { name: 'Renamed wedge', version: made.body.version }).expect(200);
      expect((await lead.agent.get(page).expect(200)).body.setups.map((s: { name: string; version: number }) => [s.name, s.version])).toEqual([['Renamed wedge', 2]]);
      await Setup.update({ notes: 'changed elsewhere' }, { where: { id: made.body.id } });
      expect((await lead.agent.get(page).expect(200)).body.setups[0].notes).toBe('changed elsewhere');
      await create(lead, { name: 'Another wedge' }).expect(201);
      expect((await lead.agent.get(page).expect(200)).body.total).toBe(2);
    });

    it('should answer 400 naming each bad query parameter', async () => {
      const res = await w.lead.agent.get('/api/setups?page=0&pageSize=1000&sort=colour&kind=lathe-spindle&status=gone').expect(400);
      expect(Object.keys(res.body.fields).sort()).toEqual(['kind', 'page', 'pageSize', 'sort', 'status']);
    });
  });

  describe('release and archive', () => {
    it('should let only a lead or an admin release and archive (others 403, other teams 404)', async () => {
      const s = await create(c.machinist, { name: 'To release' }).expect(201);
      await post(c.machinist, `/api/setups/${s.body.id}/release`).expect(403);
      await post(c.apprentice, `/api/setups/${s.body.id}/release`).expect(404); // a draft of another: not visible
      await post(c.foreign, `/api/setups/${s.body.id}/release`).expect(404);
      const released = await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
      expect(released.body).toMatchObject({ status: 'released', version: 2, releasedByName: m.lead.name });
      expect(Date.parse(released.body.releasedAt)).toBeGreaterThan(Date.now() - 60_000);
      await post(c.apprentice, `/api/setups/${s.body.id}/archive`).expect(403);
      await post(c.other, `/api/setups/${s.body.id}/archive`).expect(403);
      await post(c.lead, `/api/setups/${s.body.id}/release`).expect(409);
      const archived = await post(c.admin, `/api/setups/${s.body.id}/archive`).expect(200);
      expect(archived.body).toMatchObject({ status: 'archived', version: 3 });
      const refused = await put(c.machinist, s.body.id, { name: 'Edit archived', version: 3 }).expect(409);
      expect(refused.body.error).toMatch(/archived/);
      expect((await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200)).body.status).toBe('released');
    });

    it('should refuse to release a set-up that does not compute, and release one answered on its page only', async () => {
      // Imported with a negative thickness and text for an angle: a draft may hold it, a release may not.
      const bad = await create(c.machinist, { name: 'Imported bad wedge', inputs: { unit: 'in', thickness: '-5', angle: 'abc', taperLength: '1.250' } }).expect(201);
      const refused = await post(c.lead, `/api/setups/${bad.body.id}/release`).expect(422);
      expect(refused.body.error).toMatch(/^This set-up does not compute, so it cannot be released: Taper: .+ Open it in its calculator, correct the inputs and save it again\.$/);
      expect((await c.lead.agent.get(`/api/setups/${bad.body.id}`).expect(200)).body).toMatchObject({ status: 'draft', version: 1 });
      // A sine table saved from its page is answered there: it is sound and may be released.
      const table = { unit: 'in', mode: 'table', barLength: '5', angle: '', stackHeight: '', set: '', missing: '', tableFrom: '0', tableTo: '10', tableStep: '1', compoundBy: 'angles', angleB: '', stackB: '', lengthB: '' };
      const page = await create(c.machinist, { name: 'Sine table 0-10', kind: 'sine-bar', inputs: table }).expect(201);
      expect((await post(c.lead, `/api/setups/${page.body.id}/release`).expect(200)).body.status).toBe('released');
    });

    it('should refuse to release a set-up whose team box is gone (422, naming the box), and print no stale stack', async () => {
      const form = { unit: 'in', target: '1.2011', missing: '', wearBlocks: '', grade: '', temperature: '' };
      const box = await post(c.admin, '/api/inventories/gauge-sets', { name: 'Crib box, soon gone', standardSet: 'inch-81' }).expect(201);
      const s = await create(c.machinist, { name: 'Stack from a box that goes', kind: 'gauge-blocks', inputs: { ...form, set: `box:${box.body.id}` }, checks }).expect(201);
      // The box is deleted behind the set-up's back (as the inventory allowed before it checked for set-ups).
      await InventorySet.destroy({ where: { id: box.body.id } });
      const refused = await post(c.lead, `/api/setups/${s.body.id}/release`).expect(422);
      expect(refused.body.error).toBe(`This set-up does not compute, so it cannot be released: Gauge blocks: the team's box it was saved with (no. ${box.body.id}) is no longer in the team's inventory, so its blocks cannot be picked. Open it in its calculator, correct the inputs and save it again.`);
      expect((await Setup.findByPk(s.body.id))?.status).toBe('draft');
      const text = pdfText((await sheet(c.machinist, s.body.id)).body as Buffer);
      expect(text).toContain(`a box since deleted (no. ${box.body.id})`);
      expect(text).toMatch(/is\s+no\s+longer\s+in\s+the\s+team's\s+inventory/);
      // Another team's box of a number is not this team's either.
      const theirs = await post(c.foreign, '/api/inventories/gauge-sets', { name: 'Their box', standardSet: 'inch-81' }).expect(201);
      const borrowed = await create(c.machinist, { name: 'Stack from their box', kind: 'gauge-blocks', inputs: { ...form, set: `box:${theirs.body.id}` } }).expect(201);
      expect((await post(c.lead, `/api/setups/${borrowed.body.id}/release`).expect(422)).body.error).toMatch(/no longer in the team's inventory/);
    });

    it('should refuse a negative check nominal when saved (beside the field) and when released', async () => {
      const minus = [{ ...checks[0]!, nominal: '-0.4209' }];
      const res = await create(c.machinist, { name: 'Minus thickness', checks: minus }).expect(400);
      expect(res.body.fields).toEqual({ 'checks.0.nominal': 'Nominal must be 0 or more: a size measured on the part is never below 0 in. Take off the minus sign.' });
      const angle = await create(c.machinist, { name: 'Minus angle', checks: [{ key: 'angle', label: 'Taper angle', unit: 'deg', nominal: '-7.5', plus: '0.1', minus: '0.1' }] }).expect(400);
      expect(angle.body.fields).toEqual({ 'checks.0.nominal': 'Nominal must be 0° or more: an angle measured on the part has no sign.' });
      // 0 stays for what is measured from zero (flatness, runout), and a plain size is taken.
      const flat = [{ key: 'flatness', label: 'Flatness', unit: 'in', nominal: '0', plus: '0.0005', minus: '0' }, { ...checks[0]!, nominal: '0.4209' }];
      const ok = await create(c.machinist, { name: 'Plain checks', checks: flat }).expect(201);
      expect(ok.body.checks.map((x: { nominal: string }) => x.nominal)).toEqual(['0', '0.4209']);
      // One saved before the rule (written straight to the table) is not released.
      const old = await create(c.machinist, { name: 'Old minus thickness', checks }).expect(201);
      await Setup.update({ checks: minus as SetupCheck[] }, { where: { id: old.body.id } });
      const refused = await post(c.lead, `/api/setups/${old.body.id}/release`).expect(422);
      expect(refused.body.fields).toEqual({ 'checks.0.nominal': 'End thickness: Nominal must be 0 or more: a size measured on the part is never below 0 in. Take off the minus sign.' });
      expect((await Setup.findByPk(old.body.id))?.status).toBe('draft');
    });

    it('should keep an apprentice\'s set-up a draft until a lead releases it', async () => {
      const s = await create(c.apprentice, { name: 'Apprentice bevel' }).expect(201);
      expect(s.body.status).toBe('draft');
      await post(c.apprentice, `/api/setups/${s.body.id}/release`).expect(403);
      await c.machinist.agent.get(`/api/setups/${s.body.id}`).expect(404);
      await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
      expect((await c.machinist.agent.get(`/api/setups/${s.body.id}`).expect(200)).body.status).toBe('released');
    });

    it('should refuse a release based on a stale version with 409 and the current version', async () => {
      const s = await create(c.machinist, { name: 'Stale release' }).expect(201);
      await put(c.machinist, s.body.id, { name: 'Stale release, edited', version: 1 }).expect(200);
      const res = await post(c.lead, `/api/setups/${s.body.id}/release`, { version: 1 }).expect(409);
      expect(res.body.version).toBe(2);
      expect((await Setup.findByPk(s.body.id))?.status).toBe('draft');
    });

    it('should make a new draft when a released set-up is edited, for a lead to release again', async () => {
      const s = await create(c.machinist, { name: 'Released wedge', checks }).expect(201);
      await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
      const edited = await put(c.machinist, s.body.id, { name: 'Released wedge', inputs: { ...taper, angle: '8' }, checks, version: 2 }).expect(200);
      expect(edited.body).toMatchObject({ status: 'draft', version: 3, releasedAt: null, releasedVersion: 2 });
      // The team still reads it while it is revised (its runs and sheet are in use), marked a draft.
      const seen = await c.other.agent.get(`/api/setups/${s.body.id}`).expect(200);
      expect(seen.body).toMatchObject({ status: 'draft', version: 3, releasedVersion: 2 });
      const listed = await c.other.agent.get('/api/setups?q=Released%20wedge').expect(200);
      expect(listed.body.setups.map((x: { id: number; releasedVersion: number | null }) => [x.id, x.releasedVersion])).toEqual([[s.body.id, 2]]);
      // Another member may read it, not change it.
      await put(c.other, s.body.id, { name: 'Released wedge', inputs: taper, checks, version: 3 }).expect(403);
      const again = await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
      expect(again.body).toMatchObject({ status: 'released', version: 4, releasedVersion: 4 });
      // An edit that changes nothing is not a new revision.
      const same = await put(c.machinist, s.body.id, { name: 'Released wedge', inputs: { ...taper, angle: '8' }, checks, version: 4 }).expect(200);
      expect(same.body).toMatchObject({ status: 'released', version: 4 });
    });
  });

  describe('GET /api/setups/:id/revisions', () => {
    it('should list who changed what and when, newest first', async () => {
      const s = await create(c.machinist, { name: 'History wedge' }).expect(201);
      await put(c.machinist, s.body.id, { name: 'History wedge', inputs: { ...taper, angle: '10' }, version: 1 }).expect(200);
      await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
      const res = await c.machinist.agent.get(`/api/setups/${s.body.id}/revisions`).expect(200);
      const revs = res.body.revisions as Array<{ action: string; version: number; userName: string; changes: Array<{ field: string; from: string; to: string }>; createdAt: string }>;
      expect(revs.map((r) => [r.action, r.version, r.userName])).toEqual([
        ['released', 3, m.lead.name],
        ['edited', 2, m.machinist.name],
        ['created', 1, m.machinist.name],
      ]);
      expect(revs[1]?.changes).toEqual([{ field: 'inputs.angle', from: "7°30'", to: '10' }]);
      expect(revs[0]?.changes).toEqual([{ field: 'status', from: 'draft', to: 'released' }]);
      expect(await SetupRevision.count({ where: { setupId: s.body.id } })).toBe(3);
      await c.foreign.agent.get(`/api/setups/${s.body.id}/revisions`).expect(404);
    });
  });

  describe('check values', () => {
    it('should show a changed tolerance or nominal in the history, not only the check names', async () => {
      const s = await create(c.machinist, { name: 'Tolerance history', checks }).expect(201);
      const tighter = [{ ...checks[0]!, nominal: '0.5860', plus: '0.0005' }];
      await put(c.machinist, s.body.id, { name: 'Tolerance history', inputs: taper, checks: tighter, version: 1 }).expect(200);
      const revs = (await c.machinist.agent.get(`/api/setups/${s.body.id}/revisions`).expect(200)).body.revisions as Array<{ changes: Array<{ field: string; from: string; to: string }> }>;
      expect(revs[0]?.changes).toEqual([{ field: 'checks', from: 'End thickness 0.5854 in +0.0010/-0.0010', to: 'End thickness 0.5860 in +0.0005/-0.0010' }]);
    });

    it('should refuse two checks of one name, beside the second', async () => {
      const twice = [checks[0]!, { ...checks[0]!, key: 'end-again', label: ' end THICKNESS ', nominal: '1.2608' }];
      const res = await create(c.machinist, { name: 'Two of one name', checks: twice }).expect(400);
      expect(res.body.fields).toEqual({ 'checks.1.label': '"end THICKNESS" is already a check of this set-up; give each check its own name.' });
    });
  });

  describe('export and import', () => {
    it('should export a set-up as JSON and import it into another team as a draft', async () => {
      const s = await create(c.machinist, { name: 'Portable wedge', job: 'KL-9', notes: 'carry me', checks }).expect(201);
      const exported = await c.machinist.agent.get(`/api/setups/${s.body.id}/export`).expect(200);
      expect(exported.headers['content-disposition']).toMatch(/attachment; filename="?setup-\d+-v1\.json"?/);
      expect(exported.body).toMatchObject({ format: 'slantwise.setup/1', setup: { name: 'Portable wedge', kind: 'taper', inputs: taper, notes: 'carry me', job: 'KL-9', checks } });
      const imported = await post(c.foreign, '/api/setups/import', exported.body).expect(201);
      expect(imported.body).toMatchObject({ name: 'Portable wedge', status: 'draft', version: 1, ownerId: foreign.lead.id, inputs: taper, checks });
      expect(imported.body.id).not.toBe(s.body.id);
      const revs = await c.foreign.agent.get(`/api/setups/${imported.body.id}/revisions`).expect(200);
      expect(revs.body.revisions[0].action).toBe('imported');
    });

    it('should refuse an import of another format, naming the field', async () => {
      const res = await post(c.foreign, '/api/setups/import', { format: 'other/1', setup: { name: '', kind: 'taper', inputs: {} } }).expect(400);
      expect(Object.keys(res.body.fields).sort()).toEqual(['format', 'setup.name']);
      // A file without its format or set-up says what a set-up file is, in words.
      const bare = await post(c.foreign, '/api/setups/import', { name: 'loose' }).expect(400);
      expect(bare.body.fields).toEqual({
        format: 'This is not a set-up file exported from Slantwise (its format must be "slantwise.setup/1").',
        setup: 'Send the set-up as an object with its name, kind and inputs.',
      });
    });
  });

  describe('GET /api/setups/:id/sheet.pdf', () => {
    it('should print a PDF set-up sheet with the name, results, checks and cautions', async () => {
      const s = await create(c.machinist, { name: 'Sheet wedge 7°30\'', checks, notes: 'Touch off on the high corner.' }).expect(201);
      const res = await sheet(c.machinist, s.body.id);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toMatch(/attachment; filename="?setup-sheet-\d+-v1\.pdf"?/);
      const pdf = res.body as Buffer;
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      const text = pdfText(pdf);
      expect(text).toContain("Sheet wedge 7°30'");
      expect(text).toContain('NOT RELEASED');
      expect(text).toContain('Depth to stop');
      expect(text).toContain('End thickness');
      expect(text).toContain('Touch off on the high corner.');
      expect(text).toMatch(/Clamp the work/);
      expect(text).toContain(`/library/${s.body.id}`);
    });

    it('should print names and notes in Latin, Greek and Cyrillic scripts as typed, in the embedded app font', async () => {
      const name = 'Klin 7°30′ — Łukasz Żółć, Dvořák';
      const notes = 'Ελένη: α/2 from the drawing. Сергей: check the flank. 日本';
      const s = await create(c.machinist, { name, notes }).expect(201);
      const pdf = (await sheet(c.machinist, s.body.id)).body as Buffer;
      const text = pdfText(pdf);
      expect(text).toContain(name);
      expect(text).toContain('Ελένη: α/2 from the drawing. Сергей: check the flank. ??');
      // The fonts are IBM Plex Sans, embedded (subsets), not the standard PDF fonts.
      const source = pdf.toString('latin1');
      expect(source).toMatch(/\/BaseFont \/[A-Z]{6}\+IBMPlexSans/);
      expect(source).not.toMatch(/\/BaseFont \/Helvetica/);
    });

    it('should print how a taper saved from its page is held: the sine-plate stack and the steps in order', async () => {
      const form = {
        unit: 'in', shape: 'taper', given: 'angle-length', thickness: '0.75', angle: "7°30'", taperLength: '2.5', endThickness: '', faceLength: '',
        partLength: '4', depthPerPass: '0.1', fluteLength: '1', cutterDiameter: '0.75', holding: 'sine-plate', angleSet: 'angle-16', plateLength: '5', plateSet: 'inch-81',
      };
      const s = await create(c.machinist, { name: 'Wedge on the sine plate', kind: 'taper', inputs: form }).expect(201);
      const res = await sheet(c.machinist, s.body.id);
      const text = pdfText(res.body as Buffer);
      // H = 5 · sin 7°30′ = 0.6526 in (REFERENCE.md §2.1); h = 2.5 · sin 7°30′ = 0.3263 in (REFERENCE.md §1).
      expect(text).toContain('Part on the sine plate over a 0.6526 in stack');
      expect(text).toContain('Set-up on a sine plate');
      expect(text).toMatch(/1\. Wring a 0\.6526 in stack: /);
      expect(text).toMatch(/5\. Touch the cutter off on the highest corner .*feed down 0\.3263 in/s);
      expect(text).not.toMatch(/Part on the angle block|Set-up on angle blocks/);
      // Inputs in words, the holding and the stack set by their names.
      expect(text).toContain('Taper length');
      expect(text).toContain('Sine plate on gauge blocks');
      expect(text).toContain('Inch 81-piece set');
      expect(text).not.toMatch(/taperLength|plateSet|inch-81/);
    });

    it('should print a pins-and-rolls set-up saved from its page with the page\'s figures and answer', async () => {
      // The page saves its whole form; for a two-height taper the readings are lowerReading and
      // upperReading (measurement1/2 hold the dovetail-angle example). REFERENCE.md §5.2 published
      // example (hobby-machinist): .745 and .620 in, 1 in apart → 3°34'35" a side, TPF 1.50000 in/ft.
      const form = {
        unit: 'in', kind: 'taper-two-heights', mode: 'cut', side: 'male', angle: '60', rollDiameter: '0.375', width: '1.250', depth: '0.375',
        reading: '2.2900', includedAngle: '90', pinDiameter: '0.500', grooveWidth: '1.000', pinHeight: '0.1200', rollDiameter1: '0.375',
        measurement1: '2.2745', rollDiameter2: '0.500', measurement2: '2.6160', lowerReading: '0.745', upperReading: '0.620', heightDifference: '1',
        largeDisc: '1.000', smallDisc: '0.500', discGiven: 'centreDistance', centreDistance: '3.000', discTaperPerFoot: '2.000', discAngle: '9',
        reference: 'axis', largeBall: '1.000', smallBall: '0.500', largeBallDepth: '0.250', smallBallDepth: '2.000',
      };
      const s = await create(c.machinist, { name: 'Two-height taper check', kind: 'pins-rolls', inputs: form }).expect(201);
      const res = await sheet(c.machinist, s.body.id);
      const text = pdfText(res.body as Buffer);
      expect(text).toContain('Half angle (DMS)');
      expect(text).toContain('3°34\'35"');
      expect(text).toContain('1.50000 in/ft');
      expect(text).toContain('M1 0.745 in');
      // Only the figures of the kind are listed, under the engine's names; none of the other fields.
      expect(text).toContain('Height difference');
      expect(text).not.toContain('heightDifference');
      expect(text).not.toMatch(/lowerReading|Lower reading/);
      expect(text).not.toContain('2.2745');
      expect(text).not.toContain('?');
    });

    it('should print the stack from the team\'s own box, by the box\'s name, and only a box of the team', async () => {
      const box = await post(c.admin, '/api/inventories/gauge-sets', { name: 'Inch set, sheet crib', standardSet: 'inch-81', grade: '0' }).expect(201);
      const block = (box.body.blocks as Array<{ id: number; size: string }>).find((b) => b.size === '0.1007')!;
      await c.admin.agent.patch(`/api/inventories/gauge-sets/${box.body.id}/blocks/${block.id}`).set('X-CSRF-Token', c.admin.token).send({ missing: 1 }).expect(200);
      const form = { unit: 'in', target: '0.2507', set: `box:${box.body.id}`, missing: '', wearBlocks: '', grade: '', temperature: '' };
      const s = await create(c.machinist, { name: 'Stack from the crib box', kind: 'gauge-blocks', inputs: form }).expect(201);
      const text = pdfText((await sheet(c.machinist, s.body.id)).body as Buffer);
      // 0.2507 in from an 81-piece set is 0.1007 + 0.150; without the 0.1007 it takes another combination (derived by hand).
      const stack = /Gauge-block stack \(wringing order\)\s+([\d. +]+?)\s+\((\d+) blocks?\)/.exec(text);
      expect(stack).not.toBeNull();
      const blocks = stack![1]!.trim().split(' + ');
      expect(blocks.reduce((sum, b) => sum + Math.round(Number(b) * 10_000), 0)).toBe(2_507);
      expect(blocks).not.toContain('0.1007');
      expect(text).toContain('Blocks from our box "Inch set, sheet crib"');
      expect(text).toContain('Our box: Inch set, sheet crib');
      expect(text).not.toContain('open the set-up in its calculator');
      // Another team's box of that number is never read: for that team it is not in its inventory.
      const theirs = await post(c.foreign, '/api/setups', { name: 'Their stack', kind: 'gauge-blocks', inputs: form }).expect(201);
      const foreignText = pdfText((await sheet(c.foreign, theirs.body.id)).body as Buffer);
      expect(foreignText).not.toContain('sheet crib');
      expect(foreignText).toMatch(/no\s+longer\s+in\s+the\s+team's\s+inventory/);
      // A box with every block out of use cannot make it: the set-up is not released.
      const empty = await post(c.admin, '/api/inventories/gauge-sets', { name: 'Empty crib', blocks: [{ size: '0.1', count: 1 }], unit: 'in' }).expect(201);
      await c.admin.agent.patch(`/api/inventories/gauge-sets/${empty.body.id}/blocks/${empty.body.blocks[0].id}`).set('X-CSRF-Token', c.admin.token).send({ damaged: 1 }).expect(200);
      const hopeless = await create(c.machinist, { name: 'From the empty crib', kind: 'gauge-blocks', inputs: { ...form, set: `box:${empty.body.id}` } }).expect(201);
      const refused = await post(c.lead, `/api/setups/${hopeless.body.id}/release`).expect(422);
      expect(refused.body.error).toMatch(/does not compute.*every block marked missing or damaged/);
      await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
    });

    it('should follow the set-up\'s access rules', async () => {
      const s = await create(c.machinist, { name: 'Private sheet' }).expect(201);
      await c.other.agent.get(`/api/setups/${s.body.id}/sheet.pdf`).expect(404);
      await c.foreign.agent.get(`/api/setups/${s.body.id}/sheet.pdf`).expect(404);
    });
  });

  describe('DELETE /api/setups/:id with batch runs', () => {
    it('should refuse with 409 so the run records stay', async () => {
      const s = await create(c.machinist, { name: 'Run wedge', checks }).expect(201);
      await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
      await post(c.machinist, '/api/batches', { setupId: s.body.id, partCount: 2 }).expect(201);
      const res = await c.machinist.agent.delete(`/api/setups/${s.body.id}`).set('X-CSRF-Token', c.machinist.token).expect(409);
      expect(res.body.error).toMatch(/archive/);
      expect(await BatchRun.count({ where: { setupId: s.body.id } })).toBe(1);
      // Even a draft with no release on record (set so by hand here) keeps its runs.
      await Setup.update({ status: 'draft', releasedVersion: null }, { where: { id: s.body.id } });
      const again = await c.machinist.agent.delete(`/api/setups/${s.body.id}`).set('X-CSRF-Token', c.machinist.token).expect(409);
      expect(again.body.error).toMatch(/^This set-up has batch runs on record, so it cannot be deleted\. Archive it instead/);
      expect(await Setup.count({ where: { id: s.body.id } })).toBe(1);
    });
  });
});
