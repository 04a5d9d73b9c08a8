import { Setup } from '../../server/models';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';

jest.setTimeout(30_000);

let t: TestApp;
let m: Members;
let foreign: Members;
const c = {} as Record<'admin' | 'lead' | 'machinist' | 'apprentice' | 'foreign', Client>;

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('inventory');
  foreign = await makeTeam('inventory-foreign');
  for (const role of ['admin', 'lead', 'machinist', 'apprentice'] as const) c[role] = await client(t.app, m[role]);
  c.foreign = await client(t.app, foreign.admin);
});
afterAll(() => t.close());

interface Block { id: number; size: string; label: string; count: number; missing: number; damaged: number; available: number; note: string }

function send(who: Client, method: 'post' | 'put' | 'patch', path: string, body: object) {
  return who.agent[method](path).set('X-CSRF-Token', who.token).send(body);
}
function blockOf(set: { blocks: Block[] }, size: string): Block {
  const found = set.blocks.find((b) => b.size === size);
  if (!found) throw new Error(`no block ${size}`);
  return found;
}

describe('/api/inventories', () => {
  describe('gauge-block sets', () => {
    let set: { id: number; version: number; blocks: Block[] };

    beforeAll(async () => {
      const res = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Inch 81 in the cabinet', standardSet: 'inch-81', grade: '0' }).expect(201);
      set = res.body;
    });

    it('should start a set from the standard 81-piece composition', () => {
      // REFERENCE.md §3.2: 9 tenths + 49 thousandths + 19 fiftieths + 4 inch blocks = 81.
      expect(set).toMatchObject({ type: 'gauge-blocks', unit: 'in', standardSet: 'inch-81', grade: '0', totals: { sizes: 81, blocks: 81, missing: 0, damaged: 0, available: 81 } });
      expect(blockOf(set, '0.1001').label).toBe('0.1001 in');
      expect(blockOf(set, '0.2').label).toBe('0.200 in');
    });

    it('should let admins and leads manage sets; machinists and apprentices get 403', async () => {
      await send(c.machinist, 'post', '/api/inventories/gauge-sets', { name: 'Mine', standardSet: 'inch-81' }).expect(403);
      await send(c.apprentice, 'patch', `/api/inventories/gauge-sets/${set.id}/blocks/${blockOf(set, '0.1').id}`, { missing: 1 }).expect(403);
      await send(c.lead, 'post', '/api/inventories/gauge-sets', { name: 'Metric 112', standardSet: 'metric-112' }).expect(201);
      const list = await c.machinist.agent.get('/api/inventories').expect(200);
      expect(list.body.gaugeSets.map((s: { name: string }) => s.name)).toEqual(['Inch 81 in the cabinet', 'Metric 112']);
      expect(list.body.gaugeSets[0].blocks).toBeUndefined();
    });

    it('should refuse unknown compositions, duplicate names and impossible counts with the field named', async () => {
      const unknown = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Odd', standardSet: 'inch-999' }).expect(400);
      expect(unknown.body.fields.standardSet).toMatch(/inch-81/);
      await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Inch 81 in the cabinet', standardSet: 'inch-81' }).expect(409);
      const tooMany = await send(c.admin, 'patch', `/api/inventories/gauge-sets/${set.id}/blocks/${blockOf(set, '0.1').id}`, { missing: 1, damaged: 1 }).expect(400);
      expect(tooMany.body.fields.missing).toMatch(/cannot exceed/);
      const custom = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Loose', blocks: [{ size: '0.5', count: 1 }] }).expect(400);
      expect(custom.body.fields.unit).toBeDefined();
    });

    it('should build the fewest-block stack only from blocks that are in the box', async () => {
      // 0.2000 in is one block of the 81 set (REFERENCE.md §3.5, G15).
      const whole = await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=0.2000`).expect(200);
      expect(whole.body).toMatchObject({ count: 1, total: '0.2000', inventory: { id: set.id } });
      const marked = await send(c.lead, 'patch', `/api/inventories/gauge-sets/${set.id}/blocks/${blockOf(set, '0.2').id}`, { missing: 1, note: 'lost 2026-11' }).expect(200);
      expect(blockOf(marked.body, '0.2')).toMatchObject({ missing: 1, available: 0 });
      expect(marked.body.totals).toMatchObject({ missing: 1, available: 80 });
      // Without the .200 block: .150 + .050 (derived; no single block is left for it).
      const without = await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=0.2000`).expect(200);
      expect(without.body).toMatchObject({ count: 2, total: '0.2000', excluded: [{ size: '0.2', missing: 1, damaged: 0 }] });
      expect(without.body.blocks).not.toContain('0.200');
    });

    it('should find a longer stack when a block of the textbook answer is damaged', async () => {
      // 2.8260 in: .126 + .700 + 2.000 = 3 blocks (REFERENCE.md §3.5, G7, derived).
      const before = await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=2.8260`).expect(200);
      expect(before.body.count).toBe(3);
      await send(c.admin, 'patch', `/api/inventories/gauge-sets/${set.id}/blocks/${blockOf(set, '0.126').id}`, { damaged: 1 }).expect(200);
      // Without .126 no three blocks end in 6 thousandths and reach .826 (.106/.116/.136/.146 need
      // .720/.710/.690/.680, none a block); four do: .106 + .120 + .600 + 2.000 (derived).
      const after = await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=2.8260`).expect(200);
      expect(after.body).toMatchObject({ count: 4, total: '2.8260' });
      expect(after.body.blocks).not.toContain('0.126');
    });

    it('should put the set\'s wear blocks on both ends unless asked not to', async () => {
      const res = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'With wear blocks', standardSet: 'inch-81', wearBlockSize: '0.050', wearBlockCount: 2 }).expect(201);
      // 1.0000 − 2 · 0.050 = 0.900: one block between the wear blocks (derived).
      const wear = await c.machinist.agent.get(`/api/inventories/gauge-sets/${res.body.id}/stack?target=1.0000`).expect(200);
      expect(wear.body).toMatchObject({ count: 3, total: '1.0000', wearBlock: '0.050' });
      expect([wear.body.blocks[0], wear.body.blocks[2]]).toEqual(['0.050', '0.050']);
      const plain = await c.machinist.agent.get(`/api/inventories/gauge-sets/${res.body.id}/stack?target=1.0000&wear=no`).expect(200);
      expect(plain.body).toMatchObject({ count: 1, blocks: ['1.000'] });
    });

    it('should answer 400 for a bad target and 422 for one the box cannot make', async () => {
      const bad = await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=abc`).expect(400);
      // The field's message leaves out its name (the page puts its own label before it), as /api/calc does.
      expect(bad.body).toEqual({ error: 'Target must be a decimal number such as 2.0084.', fields: { target: 'must be a decimal number such as 2.0084' } });
      // ".5" as typed on the shop floor is 0.5.
      const point = await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=.5`).expect(200);
      expect(point.body).toMatchObject({ count: 1, total: '0.5000' });
      await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack`).expect(400);
      const far = await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=0.0001`).expect(422);
      expect(far.body.error).toBeTruthy();
    });

    it('should say what is wrong with a target that is a number but no length for a stack', async () => {
      const said = async (target: string) => (await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=${encodeURIComponent(target)}`).expect(400)).body;
      // Positive, but longer than any calculation takes (MAX_LENGTH, shared/api/calc.ts).
      expect(await said('99999999')).toEqual({ error: 'Target must be at most 100000.', fields: { target: 'must be at most 100000' } });
      expect((await said('-1')).fields.target).toBe('must be greater than 0');
      expect((await said('0')).fields.target).toBe('must be greater than 0');
      expect((await said('1.1234567')).fields.target).toBe('must have at most 6 decimals');
      expect((await said('')).fields.target).toBe('is empty; type the length, e.g. 2.0084');
    });

    it('should keep wear blocks as a pair with a thickness, or none, on create and edit', async () => {
      const made = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: `Wear rule ${Date.now()}`, standardSet: 'inch-36' }).expect(201);
      let version = made.body.version as number;
      const put = (body: object) => send(c.lead, 'put', `/api/inventories/gauge-sets/${made.body.id}`, { name: made.body.name, version, ...body });
      // The stack solver puts a wear block at each end (shared/calc/gauge-stack.ts), so 1 is no use and 3 too many.
      for (const wearBlockCount of [1, 3, 99_999_999_999]) {
        const odd = await put({ wearBlockSize: '0.050', wearBlockCount }).expect(400);
        expect(odd.body.fields).toEqual({ wearBlockCount: 'Wear blocks come as a pair, one for each end of the stack: 0 or 2.' });
      }
      const noSize = await put({ wearBlockSize: null, wearBlockCount: 2 }).expect(400);
      expect(noSize.body.fields).toEqual({ wearBlockSize: 'Give the thickness of the two wear blocks, or set the wear blocks to 0.' });
      const noCount = await put({ wearBlockSize: '0.050', wearBlockCount: 0 }).expect(400);
      expect(noCount.body.fields).toEqual({ wearBlockCount: 'A thickness is given, so say 2 wear blocks, or clear the thickness.' });
      // A count alone on a set without a thickness is refused too, not saved half.
      await put({ wearBlockCount: 2 }).expect(400);
      await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: `Wear odd ${Date.now()}`, standardSet: 'inch-36', wearBlockCount: 2 }).expect(400);
      await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: `Wear one ${Date.now()}`, standardSet: 'inch-36', wearBlockSize: '0.050', wearBlockCount: 1 }).expect(400);
      expect((await c.admin.agent.get(`/api/inventories/gauge-sets/${made.body.id}`).expect(200)).body).toMatchObject({ wearBlockSize: null, wearBlockCount: 0, version });
      // A thickness alone is the pair; clearing it alone leaves none.
      const pair = await put({ wearBlockSize: '0.050' }).expect(200);
      expect(pair.body).toMatchObject({ wearBlockSize: '0.050', wearBlockCount: 2 });
      version = pair.body.version;
      const none = await put({ wearBlockSize: null }).expect(200);
      expect(none.body).toMatchObject({ wearBlockSize: null, wearBlockCount: 0 });
    });

    it('should keep a note on a block, trimmed and limited in length', async () => {
      const block = blockOf(set, '0.1005');
      const noted = await send(c.lead, 'patch', `/api/inventories/gauge-sets/${set.id}/blocks/${block.id}`, { note: '  nicked face, sent for lapping  ' }).expect(200);
      expect(blockOf(noted.body, '0.1005').note).toBe('nicked face, sent for lapping');
      const long = await send(c.lead, 'patch', `/api/inventories/gauge-sets/${set.id}/blocks/${block.id}`, { note: 'x'.repeat(201) }).expect(400);
      expect(long.body.fields.note).toBe('Keep the note under 200 characters.');
      expect(blockOf((await c.machinist.agent.get(`/api/inventories/gauge-sets/${set.id}`).expect(200)).body, '0.1005').note).toBe('nicked face, sent for lapping');
    });

    it('should update the set with optimistic concurrency', async () => {
      const fresh = (await c.admin.agent.get(`/api/inventories/gauge-sets/${set.id}`).expect(200)).body;
      const ok = await send(c.admin, 'put', `/api/inventories/gauge-sets/${set.id}`, { name: fresh.name, grade: '1', version: fresh.version }).expect(200);
      expect(ok.body).toMatchObject({ grade: '1', version: fresh.version + 1 });
      const stale = await send(c.lead, 'put', `/api/inventories/gauge-sets/${set.id}`, { name: 'Renamed', version: fresh.version }).expect(409);
      expect(stale.body.version).toBe(fresh.version + 1);
    });

    it('should refuse a name another set of the team has, on a rename too (409, never a 500)', async () => {
      const fresh = (await c.admin.agent.get(`/api/inventories/gauge-sets/${set.id}`).expect(200)).body;
      const other = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: `Second box ${Date.now()}`, standardSet: 'inch-36' }).expect(201);
      const taken = await send(c.lead, 'put', `/api/inventories/gauge-sets/${other.body.id}`, { name: fresh.name, version: other.body.version }).expect(409);
      expect(taken.body).toEqual({ error: 'Your team already has a set with that name.', fields: { name: 'Choose another name.' } });
      // Keeping its own name is no clash.
      await send(c.lead, 'put', `/api/inventories/gauge-sets/${other.body.id}`, { name: other.body.name, version: other.body.version }).expect(200);
    });

    it('should refuse a gauge set grade outside ISO 3650 and wear blocks that are not thin end blocks', async () => {
      const fresh = (await c.admin.agent.get(`/api/inventories/gauge-sets/${set.id}`).expect(200)).body;
      const bad = await send(c.lead, 'put', `/api/inventories/gauge-sets/${set.id}`, { name: fresh.name, grade: 'Z9', wearBlockSize: '100', wearBlockCount: 3, version: fresh.version }).expect(400);
      expect(Object.keys(bad.body.fields).sort()).toEqual(['grade', 'wearBlockCount', 'wearBlockSize']);
      expect(bad.body.fields.grade).toBe('Grade must be one of K, 0, 1, 2 (ISO 3650), or left empty.');
      expect((await c.admin.agent.get(`/api/inventories/gauge-sets/${set.id}`).expect(200)).body.version).toBe(fresh.version);
      await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Graded oddly', standardSet: 'inch-36', grade: 'AA' }).expect(400);
      // Angle-block grades are free text.
      await send(c.admin, 'post', '/api/inventories/angle-sets', { name: `Angle box ${Date.now()}`, standardSet: 'angle-16', grade: 'Lab grade' }).expect(201);
    });

    it('should refuse to delete a box that saved set-ups of any status name, saying how many and which', async () => {
      const box = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: `Crib box ${Date.now()}`, standardSet: 'inch-36' }).expect(201);
      const form = { unit: 'in', target: '1.2011', set: `box:${box.body.id}`, missing: '', wearBlocks: '', grade: '', temperature: '' };
      const saved: number[] = [];
      for (const name of ['Stack A', 'Stack B', 'Stack C', 'Stack D']) {
        saved.push((await send(c.machinist, 'post', '/api/setups', { name, kind: 'gauge-blocks', inputs: form }).expect(201)).body.id);
      }
      // A box whose id starts with the same digits is another box: it does not count.
      const other = { ...form, set: `box:${box.body.id}0` };
      await send(c.machinist, 'post', '/api/setups', { name: 'Other box', kind: 'gauge-blocks', inputs: other }).expect(201);
      const del = () => c.admin.agent.delete(`/api/inventories/gauge-sets/${box.body.id}`).set('X-CSRF-Token', c.admin.token);
      const refused = await del().expect(409);
      expect(refused.body.error).toBe('4 saved set-ups use this set ("Stack A", "Stack B", "Stack C" and 1 more) and would lose their stacks. Save them with another set, or delete them, first (archived set-ups count too).');
      await c.admin.agent.get(`/api/inventories/gauge-sets/${box.body.id}`).expect(200);
      // Archived set-ups count too: they can be restored and printed.
      await Setup.update({ status: 'archived' }, { where: { id: saved } });
      await Setup.destroy({ where: { id: saved.slice(1) } });
      const archived = await del().expect(409);
      expect(archived.body.error).toMatch(/^1 saved set-up uses this set \("Stack A"\) and would lose its stack\./);
      await Setup.destroy({ where: { id: saved[0] } });
      await del().expect(204);
    });

    it('should hide other teams\' sets', async () => {
      await c.foreign.agent.get(`/api/inventories/gauge-sets/${set.id}`).expect(404);
      await c.foreign.agent.get(`/api/inventories/gauge-sets/${set.id}/stack?target=1`).expect(404);
      await send(c.foreign, 'patch', `/api/inventories/gauge-sets/${set.id}/blocks/${blockOf(set, '1').id}`, { missing: 1 }).expect(404);
      expect((await c.foreign.agent.get('/api/inventories').expect(200)).body.gaugeSets).toEqual([]);
    });
  });

  describe('angle-block sets', () => {
    it('should make an angle from the blocks in the box and avoid blocks marked missing', async () => {
      const res = await send(c.admin, 'post', '/api/inventories/angle-sets', { name: 'Angle blocks, 16', standardSet: 'angle-16' }).expect(201);
      expect(res.body).toMatchObject({ unit: 'arcsec', totals: { blocks: 16 } });
      const five = blockOf(res.body, '300');
      expect(five.label).toBe('5′');
      // 17°35' with the 16-piece set: REFERENCE.md §6 builds it with 5 blocks (15 + 3 − 1, 30' + 5');
      // 15° + 3° − 30' + 5' does it with 4 (derived, the add/subtract rule of §6).
      const full = await c.machinist.agent.get(`/api/inventories/angle-sets/${res.body.id}/combination?angle=${encodeURIComponent("17°35'")}`).expect(200);
      expect(full.body).toMatchObject({ count: 4, exact: true });
      expect(full.body.blocks.map((b: { angle: string }) => b.angle)).toContain(`0°05'00"`);
      await send(c.lead, 'patch', `/api/inventories/angle-sets/${res.body.id}/blocks/${five.id}`, { missing: 1 }).expect(200);
      const without = await c.machinist.agent.get(`/api/inventories/angle-sets/${res.body.id}/combination?angle=${encodeURIComponent("17°35'")}`).expect(200);
      // Without 5': the minutes blocks (±30, ±20, ±3, ±1) make neither 35' nor −25', and the seconds
      // blocks total only 59", so 17°35' can no longer be made exactly (derived).
      expect(without.body.blocks.map((b: { angle: string }) => b.angle)).not.toContain(`0°05'00"`);
      expect(without.body.exact).toBe(false);
      expect(without.body.excluded).toEqual([{ size: '300', label: '5′', missing: 1, damaged: 0 }]);
    });

    it("should keep a shop's own box listed block by block, and refuse sizes no angle block has", async () => {
      const half = await send(c.admin, 'post', '/api/inventories/angle-sets', { name: 'Odd box', blocks: [{ size: '0.5', count: 1 }] }).expect(400);
      expect(half.body.fields.blocks).toMatch(/whole seconds of arc/);
      const square = await send(c.admin, 'post', '/api/inventories/angle-sets', { name: 'Odd box', blocks: [{ size: String(90 * 3600), count: 1 }] }).expect(400);
      expect(square.body.fields.blocks).toMatch(/90° is not an angle block/);
      // One each of 1°, 3°, 5°, 15°, 30°, 45° and 1', 3', 5', 20', 30': 20°10' = 15° + 5° + 30' − 20'
      // (derived: no single block is 20° or 10', so two for the degrees and two for the minutes).
      const own = await send(c.lead, 'post', '/api/inventories/angle-sets', {
        name: 'Angle blocks, small box',
        blocks: [1, 3, 5, 15, 30, 45].map((d) => ({ size: String(d * 3600), count: 1 })).concat([1, 3, 5, 20, 30].map((m) => ({ size: String(m * 60), count: 1 }))),
      }).expect(201);
      expect(own.body).toMatchObject({ unit: 'arcsec', standardSet: null, totals: { sizes: 11, blocks: 11 } });
      expect(own.body.blocks.map((b: Block) => b.label)).toEqual(['1′', '3′', '5′', '20′', '30′', '1°', '3°', '5°', '15°', '30°', '45°']);
      const made = await c.machinist.agent.get(`/api/inventories/angle-sets/${own.body.id}/combination?angle=${encodeURIComponent("20°10'")}`).expect(200);
      expect(made.body).toMatchObject({ count: 4, exact: true });
    });

    it('should build stacks from a box that holds more of one size than any stack uses (shims)', async () => {
      const shims = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Shim drawer', unit: 'in', blocks: [{ size: '0.05', count: 30 }, { size: '0.1', count: 1 }, { size: '1', count: 1 }] }).expect(201);
      // 1.150 = 1 + 0.100 + 0.050 (derived: the fewest blocks).
      const stack = await c.machinist.agent.get(`/api/inventories/gauge-sets/${shims.body.id}/stack?target=1.15`).expect(200);
      expect(stack.body).toMatchObject({ count: 3, total: '1.1500' });
      // 2.150 = 1 + 0.100 + 21 × 0.050 would need more of one size than a stack is built from (20 at
      // most; 2.100 is the longest stack, derived).
      await c.machinist.agent.get(`/api/inventories/gauge-sets/${shims.body.id}/stack?target=2.1`).expect(200);
      await c.machinist.agent.get(`/api/inventories/gauge-sets/${shims.body.id}/stack?target=2.15`).expect(422);
    });

    it('should refuse a gauge block longer than ISO 3650 covers', async () => {
      // ISO 3650 covers gauge blocks up to 1000 mm nominal length.
      const long = await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Long', unit: 'mm', blocks: [{ size: '500', count: 1 }, { size: '1200', count: 1 }] }).expect(400);
      expect(long.body.fields.blocks).toMatch(/1200 mm is longer than any gauge block \(at most 1000 mm\)/);
      await send(c.admin, 'post', '/api/inventories/gauge-sets', { name: 'Long', unit: 'mm', blocks: [{ size: '500', count: 1 }, { size: '1000', count: 1 }] }).expect(201);
    });
  });
});
