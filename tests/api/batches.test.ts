import { BatchPart, BatchRun } from '../../server/models';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';

jest.setTimeout(30_000);

let t: TestApp;
let m: Members;
let foreign: Members;
const c = {} as Record<'admin' | 'lead' | 'machinist' | 'apprentice' | 'other' | 'foreign', Client>;

const taper = { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' };
// Invented tolerance bands for the tests.
const checks = [
  { key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' },
  { key: 'face-length', label: 'Face length', unit: 'in', nominal: '1.2608', plus: '0.005', minus: '0.005' },
];
let released: number;

function post(who: Client, path: string, body: object = {}) {
  return who.agent.post(path).set('X-CSRF-Token', who.token).send(body);
}
async function releasedSetup(body: object = {}): Promise<number> {
  const s = await post(c.machinist, '/api/setups', { name: 'Batch wedge', kind: 'taper', inputs: taper, checks, ...body }).expect(201);
  await post(c.lead, `/api/setups/${s.body.id}/release`).expect(200);
  return s.body.id as number;
}
const part = (end: string, face = '1.2610', extra: object = {}) => ({ touchOff: '0.0000', droAtStop: '-0.1632', values: { 'end-thickness': end, 'face-length': face }, ...extra });
/** The revision of a part as a person loading the run now would see it. */
async function revisionOf(runId: number, partNo: number): Promise<string> {
  const res = await c.machinist.agent.get(`/api/batches/${runId}`).expect(200);
  return (res.body.parts as Array<{ partNo: number; revision: string }>).find((p) => p.partNo === partNo)!.revision;
}
/** PUT …/parts/:partNo based on the part as it is now, expecting `status`. */
async function correct(who: Client, runId: number, partNo: number, body: object, status = 200) {
  const revision = await revisionOf(runId, partNo);
  return who.agent.put(`/api/batches/${runId}/parts/${partNo}`).set('X-CSRF-Token', who.token).send({ ...body, revision }).expect(status);
}

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('batches');
  foreign = await makeTeam('batches-foreign');
  for (const role of ['admin', 'lead', 'machinist', 'apprentice', 'other'] as const) c[role] = await client(t.app, m[role]);
  c.foreign = await client(t.app, foreign.lead);
  released = await releasedSetup();
});
afterAll(() => t.close());

describe('/api/batches', () => {
  describe('starting a run', () => {
    it('should start from a released set-up and copy its checks and version', async () => {
      const res = await post(c.machinist, '/api/batches', { setupId: released, partCount: 8 }).expect(201);
      expect(res.body).toMatchObject({ setupId: released, setupVersion: 2, setupName: 'Batch wedge', partCount: 8, status: 'open', checks, startedByName: m.machinist.name, parts: [], summary: { entered: 0, passed: 0, failed: 0 } });
      expect(res.headers['location']).toBe(`/api/batches/${res.body.id}`);
    });

    it('should refuse drafts, set-ups without checks, apprentices and other teams', async () => {
      const draft = await post(c.machinist, '/api/setups', { name: 'Draft wedge', kind: 'taper', inputs: taper, checks }).expect(201);
      const r1 = await post(c.machinist, '/api/batches', { setupId: draft.body.id, partCount: 3 }).expect(409);
      expect(r1.body.error).toMatch(/released/);
      const bare = await releasedSetup({ checks: [] });
      await post(c.machinist, '/api/batches', { setupId: bare, partCount: 3 }).expect(409);
      await post(c.apprentice, '/api/batches', { setupId: released, partCount: 3 }).expect(403);
      const r2 = await post(c.foreign, '/api/batches', { setupId: released, partCount: 3 }).expect(400);
      expect(r2.body.fields.setupId).toBeDefined();
      const r3 = await post(c.machinist, '/api/batches', { setupId: released, partCount: 0 }).expect(400);
      expect(r3.body.fields.partCount).toBeDefined();
    });
  });

  describe('entering parts', () => {
    it('should record each part with pass/fail and give hand-checked statistics', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 4 }).expect(201)).body;
      const entered = [];
      for (const [who, end] of [[c.machinist, '0.5856'], [c.other, '0.5850'], [c.machinist, '0.5862'], [c.lead, '0.5841']] as const) {
        entered.push((await post(who, `/api/batches/${run.id}/parts`, part(end)).expect(201)).body);
      }
      expect(entered.map((e) => [e.part.partNo, e.part.pass, e.part.outOfBand])).toEqual([[1, true, []], [2, true, []], [3, true, []], [4, false, ['end-thickness']]]);
      expect(entered[1].part).toMatchObject({ operatorName: m.other.name, touchOff: '0.0000', droAtStop: '-0.1632' });
      const res = await c.apprentice.agent.get(`/api/batches/${run.id}`).expect(200);
      // Hand computation (derived), every figure to 4 + 1 = 5 decimals: 0.5856, 0.5850, 0.5862, 0.5841 → sum 2.3409,
      // mean 0.585225 → 0.58523; range 0.5862 − 0.5841 = 0.0021; largest |x − 0.5856| = 0.0015; s = √(2.4075e-6 / 3) = 0.000896 → 0.00090.
      expect(res.body.stats[0]).toMatchObject({ key: 'end-thickness', n: 4, mean: '0.58523', range: '0.00210', spreadFromFirst: '0.00150', stdDev: '0.00090', passCount: 3, failCount: 1, low: '0.5844', high: '0.5864', decimals: 5 });
      expect(res.body.stats[1]).toMatchObject({ key: 'face-length', n: 4, mean: '1.26100', range: '0.00000', spreadFromFirst: '0.00000', passCount: 4, decimals: 5 });
      expect(res.body.summary).toEqual({ entered: 4, passed: 3, failed: 1 });
    });

    it('should name every bad reading with 400 and store nothing', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 3 }).expect(201)).body;
      const res = await post(c.machinist, `/api/batches/${run.id}/parts`, { touchOff: 'zero', values: { 'end-thickness': 'abc', colour: '1' } }).expect(400);
      expect(Object.keys(res.body.fields).sort()).toEqual(['touchOff']);
      const res2 = await post(c.machinist, `/api/batches/${run.id}/parts`, { values: { 'end-thickness': 'abc', colour: '1' } }).expect(400);
      expect(Object.keys(res2.body.fields).sort()).toEqual(['values.colour', 'values.end-thickness', 'values.face-length']);
      // A reading of 0 or less on a check whose nominal is above 0 is a slip, not a part.
      const negative = await post(c.machinist, `/api/batches/${run.id}/parts`, part('-5')).expect(400);
      expect(negative.body.fields).toEqual({ 'values.end-thickness': 'End thickness must be more than 0 (nominal 0.5854 in): check the reading.' });
      expect(await BatchPart.count({ where: { runId: run.id } })).toBe(0);
      expect((await BatchRun.findByPk(run.id))?.version).toBe(1);
    });

    it('should refuse a part beyond the run and a part number already entered', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 2 }).expect(201)).body;
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854', '1.2608', { partNo: 2 })).expect(201);
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854', '1.2608', { partNo: 2 })).expect(409);
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854', '1.2608', { partNo: 3 })).expect(409);
      const fix = await correct(c.machinist, run.id, 2, part('0.5899'));
      expect(fix.body.part).toMatchObject({ partNo: 2, pass: false, values: { 'end-thickness': '0.5899' } });
      expect(fix.body.part).toMatchObject({ correctedByName: m.machinist.name, firstRecorded: { touchOff: '0.0000', droAtStop: '-0.1632', values: { 'end-thickness': '0.5854', 'face-length': '1.2608' } } });
      await c.machinist.agent.put(`/api/batches/${run.id}/parts/1`).set('X-CSRF-Token', c.machinist.token).send(part('0.5854', '1.2610', { revision: 'none' })).expect(404);
      expect(await BatchPart.count({ where: { runId: run.id } })).toBe(1);
      // A part sent without a number fills the gap part 2 left, so the run can be finished.
      const first = await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854')).expect(201);
      expect(first.body.part.partNo).toBe(1);
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854')).expect(409);
    });


    it('should keep who measured a corrected part and when, and the readings as first recorded', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 2 }).expect(201)).body;
      const first = (await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5805', '1.2610', { note: 'typed fast' })).expect(201)).body.part;
      expect(first).toMatchObject({ correctedAt: null, correctedByName: null, firstRecorded: null });
      const put = (who: Client, body: object) => correct(who, run.id, 1, body);
      // Only the note changes: an edit, not a correction of the readings.
      const noted = (await put(c.machinist, part('0.5805', '1.2610', { note: 'burr on the edge' }))).body.part;
      expect(noted).toMatchObject({ note: 'burr on the edge', correctedAt: null, firstRecorded: null });
      const fixed = (await put(c.lead, part('0.5850', '1.2610', { note: '' }))).body.part;
      expect(fixed).toMatchObject({ operatorName: m.machinist.name, measuredAt: first.measuredAt, correctedByName: m.lead.name, note: '', pass: true, values: { 'end-thickness': '0.5850' } });
      expect(Date.parse(fixed.correctedAt)).toBeGreaterThanOrEqual(Date.parse(first.measuredAt));
      expect(fixed.firstRecorded).toEqual({ touchOff: '0.0000', droAtStop: '-0.1632', values: { 'end-thickness': '0.5805', 'face-length': '1.2610' } });
      // A second correction keeps the readings as first recorded, and names the latest corrector.
      const again = (await put(c.machinist, part('0.5851'))).body.part;
      expect(again).toMatchObject({ correctedByName: m.machinist.name, firstRecorded: fixed.firstRecorded, values: { 'end-thickness': '0.5851' } });
      const row = await BatchPart.findOne({ where: { runId: run.id, partNo: 1 } });
      expect(row?.operatorId).toBe(m.machinist.id);
    });
    it('should refuse a correction made from a stale form with 409 and the part as it is now', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 4 }).expect(201)).body;
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5850')).expect(201);
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5850')).expect(201);
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5800')).expect(201);
      // Machinist and lead both open part 3 for correction.
      const seen = await revisionOf(run.id, 3);
      const put = (who: Client, body: object) => who.agent.put(`/api/batches/${run.id}/parts/3`).set('X-CSRF-Token', who.token).send(body);
      // A part recorded meanwhile is no change to part 3: no false conflict.
      await post(c.other, `/api/batches/${run.id}/parts`, part('0.5851')).expect(201);
      await put(c.machinist, part('0.5854', '1.2610', { revision: seen })).expect(200);
      const version = (await BatchRun.findByPk(run.id))?.version;
      const stale = await put(c.lead, part('0.5860', '1.2610', { revision: seen })).expect(409);
      expect(stale.body.error).toBe('Someone changed part 3 while you were correcting it; nothing was saved. Check the part as it is now, then save your correction again if it is still needed.');
      expect(stale.body.part).toMatchObject({ partNo: 3, values: { 'end-thickness': '0.5854' }, correctedByName: m.machinist.name });
      expect(stale.body.run.parts).toHaveLength(4);
      expect((await BatchPart.findOne({ where: { runId: run.id, partNo: 3 } }))?.readings['end-thickness']).toBe('0.5854');
      expect((await BatchRun.findByPk(run.id))?.version).toBe(version);
      // Based on the part as it is now, the lead's correction goes through (and names the lead).
      const fresh = await put(c.lead, part('0.5860', '1.2610', { revision: stale.body.part.revision })).expect(200);
      expect(fresh.body.part).toMatchObject({ correctedByName: m.lead.name, values: { 'end-thickness': '0.5860' } });
      expect(fresh.body.part.revision).not.toBe(stale.body.part.revision);
      // A note-only edit changes the part too.
      await put(c.machinist, part('0.5860', '1.2610', { note: 'burr', revision: stale.body.part.revision })).expect(409);
      // A revision that is no revision is named.
      const empty = await put(c.lead, part('0.5861', '1.2610', { revision: '' })).expect(400);
      expect(empty.body.fields).toEqual({ revision: 'Send the revision of the part your correction is based on (from the part as loaded).' });
      await put(c.lead, part('0.5861', '1.2610', { revision: 7 })).expect(400);
    });

    it('should answer 409 with the run as it is now when the part meant was recorded meanwhile', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 6 }).expect(201)).body;
      for (let i = 0; i < 4; i += 1) await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854')).expect(201);
      // Two tabs both show "Record part 5".
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854', '1.2610', { partNo: 5 })).expect(201);
      const late = await post(c.lead, `/api/batches/${run.id}/parts`, part('0.5858', '1.2610', { partNo: 5 })).expect(409);
      expect(late.body).toMatchObject({
        error: `Part 5 is already recorded, by ${m.machinist.name}; your readings were not saved. Correct part 5 instead, or record them as another part.`,
        fields: { partNo: 'Already recorded.' },
        run: { id: run.id, summary: { entered: 5 } },
      });
      expect(await BatchPart.count({ where: { runId: run.id } })).toBe(5);
      expect((await BatchPart.findOne({ where: { runId: run.id, partNo: 5 } }))?.readings['end-thickness']).toBe('0.5854');
    });

    it('should refuse a reading far from the nominal unless confirmed, and keep "-0" refused', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 3 }).expect(201)).body;
      // Half of 0.5854 is 0.2927 (wider than ten bands of 0.0020): readings from 0.2927 to 0.8781 are plausible (derived).
      const slip = await post(c.machinist, `/api/batches/${run.id}/parts`, part('5854')).expect(400);
      expect(slip.body.fields).toEqual({ 'values.end-thickness': 'End thickness 5854 is far from the nominal 0.5854 in: check the decimal point. If the reading is right, confirm it to record it anyway.' });
      const both = await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.05854', '12.608')).expect(400);
      expect(Object.keys(both.body.fields).sort()).toEqual(['values.end-thickness', 'values.face-length']);
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.8782')).expect(400);
      const zero = await post(c.machinist, `/api/batches/${run.id}/parts`, part('-0', '1.2610', { confirm: true })).expect(400);
      expect(zero.body.fields).toEqual({ 'values.end-thickness': 'End thickness must be more than 0 (nominal 0.5854 in): check the reading.' });
      expect(await BatchPart.count({ where: { runId: run.id } })).toBe(0);
      const bad = await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.8781')).expect(201);
      expect(bad.body.part).toMatchObject({ pass: false, values: { 'end-thickness': '0.8781' } });
      const kept = await post(c.machinist, `/api/batches/${run.id}/parts`, part('5854', '1.2610', { confirm: true })).expect(201);
      expect(kept.body.part).toMatchObject({ pass: false, values: { 'end-thickness': '5854' } });
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854', '1.2610', { confirm: 'yes' })).expect(400);
    });

    it('should read ".585" and "+0.5854" as readings and call a very long number too long', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 3 }).expect(201)).body;
      const res = await post(c.machinist, `/api/batches/${run.id}/parts`, { touchOff: '+.5', droAtStop: '-.1632', values: { 'end-thickness': '.585', 'face-length': '+1.2610' } }).expect(201);
      expect(res.body.part).toMatchObject({ touchOff: '0.5', droAtStop: '-0.1632', values: { 'end-thickness': '0.585', 'face-length': '1.2610' } });
      const long = `0.${'5'.repeat(300)}`;
      const refused = await post(c.machinist, `/api/batches/${run.id}/parts`, { touchOff: long, values: { 'end-thickness': long, 'face-length': '1.2610' } }).expect(400);
      expect(refused.body.fields).toEqual({ touchOff: 'Touch-off is too long: a reading has at most 6 digits before and 6 after the decimal point.' });
      const refused2 = await post(c.machinist, `/api/batches/${run.id}/parts`, part(long)).expect(400);
      expect(refused2.body.fields).toEqual({ 'values.end-thickness': 'End thickness is too long: a reading has at most 6 digits before and 6 after the decimal point.' });
      const words = await post(c.machinist, `/api/batches/${run.id}/parts`, part('0,585')).expect(400);
      expect(words.body.fields).toEqual({ 'values.end-thickness': 'End thickness must be a decimal number such as 0.5854.' });
    });

    it('should keep the band at the check\'s decimals and the figures at one resolution after a 5-decimal reading', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 3 }).expect(201)).body;
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5855')).expect(201);
      const res = await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.58541')).expect(201);
      // Mean (0.5855 + 0.58541) / 2 = 0.585455 → 0.58546 (half up); range 0.00009 (derived).
      expect(res.body.run.stats[0]).toMatchObject({ low: '0.5844', high: '0.5864', decimals: 5, mean: '0.58546', range: '0.00009', min: '0.58541', max: '0.58550' });
    });

    it('should number parts entered at the same moment without gaps or duplicates (one transaction each)', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 6 }).expect(201)).body;
      const results = await Promise.all(Array.from({ length: 6 }, (_, i) => post(i % 2 ? c.other : c.machinist, `/api/batches/${run.id}/parts`, part('0.5854'))));
      expect(results.map((r) => r.status)).toEqual([201, 201, 201, 201, 201, 201]);
      expect(results.map((r) => r.body.part.partNo).sort((a: number, b: number) => a - b)).toEqual([1, 2, 3, 4, 5, 6]);
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854')).expect(409);
      expect(await BatchPart.count({ where: { runId: run.id } })).toBe(6);
      expect((await BatchRun.findByPk(run.id))?.version).toBe(7);
    });
  });

  describe('closing a run', () => {
    it('should let the starter, a lead or an admin close it, and keep it read-only after', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 3 }).expect(201)).body;
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5854')).expect(201);
      await post(c.other, `/api/batches/${run.id}/close`).expect(403);
      await post(c.apprentice, `/api/batches/${run.id}/close`).expect(403);
      await post(c.foreign, `/api/batches/${run.id}/close`).expect(404);
      const closed = await post(c.machinist, `/api/batches/${run.id}/close`).expect(200);
      expect(closed.body).toMatchObject({ status: 'closed', closedByName: m.machinist.name });
      expect(closed.body.closedAt).toBeTruthy();
      const more = await post(c.lead, `/api/batches/${run.id}/parts`, part('0.5854')).expect(409);
      // Who closed it, and the run as it is now, so a stale tab can show why nothing was saved.
      expect(more.body.error).toBe(`This batch run was closed by ${m.machinist.name} and is read-only; nothing was saved.`);
      expect(more.body.run).toMatchObject({ id: run.id, status: 'closed', closedByName: m.machinist.name, summary: { entered: 1 } });
      const fix = await correct(c.lead, run.id, 1, part('0.5800'), 409);
      expect(fix.body).toMatchObject({ error: `This batch run was closed by ${m.machinist.name} and is read-only; nothing was saved.`, run: { status: 'closed' }, part: { partNo: 1 } });
      await post(c.lead, `/api/batches/${run.id}/close`).expect(409);
      expect((await BatchPart.findOne({ where: { runId: run.id, partNo: 1 } }))?.readings['end-thickness']).toBe('0.5854');
    });
  });

  describe('listing and CSV export', () => {
    it('should list the team\'s runs with filters and hide other teams\' runs', async () => {
      const list = await c.machinist.agent.get(`/api/batches?setupId=${released}&status=open`).expect(200);
      expect(list.body.batches.length).toBeGreaterThan(0);
      expect(list.body.batches.every((b: { setupId: number; status: string }) => b.setupId === released && b.status === 'open')).toBe(true);
      await c.machinist.agent.get('/api/batches?status=half').expect(400);
      // Open runs come first, then closed ones (the earlier tests closed some).
      const all = (await c.machinist.agent.get('/api/batches').expect(200)).body.batches.map((b: { status: string }) => b.status);
      expect(all).toContain('closed');
      expect(all).toEqual([...all].sort((a: string, b: string) => (a === b ? 0 : a === 'open' ? -1 : 1)));
      const theirs = await c.foreign.agent.get('/api/batches').expect(200);
      expect(theirs.body.batches).toEqual([]);
      await c.foreign.agent.get(`/api/batches/${list.body.batches[0].id}`).expect(404);
    });

    it('should export a run as CSV, one row per part', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 2 }).expect(201)).body;
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5856', '1.2610', { note: '=SUM(A1), burr on edge' })).expect(201);
      await post(c.other, `/api/batches/${run.id}/parts`, part('0.5870')).expect(201);
      const res = await c.machinist.agent.get(`/api/batches/${run.id}/export.csv`).expect(200);
      expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
      expect(res.headers['content-disposition']).toMatch(/attachment; filename="?batch-\d+\.csv"?/);
      // After the byte-order mark (its own test below).
      const lines = res.text.replace(/^\uFEFF/, '').trimEnd().split('\r\n');
      expect(lines).toHaveLength(3);
      expect(lines[0]).toBe(
        'part,measured_at_utc,operator,touch_off,dro_at_stop,End thickness (in) [0.5854 +0.0010/-0.0010],Face length (in) [1.2608 +0.005/-0.005],pass,out_of_band,note,corrected_at_utc,corrected_by,first_recorded',
      );
      expect(lines[1]).toMatch(new RegExp(`^1,\\d{4}-\\d\\d-\\d\\dT[^,]+,${m.machinist.name},0\\.0000,-0\\.1632,0\\.5856,1\\.2610,pass,,"'=SUM\\(A1\\), burr on edge",,,$`));
      expect(lines[2]).toMatch(new RegExp(`^2,[^,]+,${m.other.name},0\\.0000,-0\\.1632,0\\.5870,1\\.2610,fail,end-thickness,,,,$`));
      // A correction by the lead: the measurement keeps its operator; the correction and the first readings are listed.
      await correct(c.lead, run.id, 2, part('0.5860'));
      const after = (await c.machinist.agent.get(`/api/batches/${run.id}/export.csv`).expect(200)).text.trimEnd().split('\r\n');
      expect(after[2]).toMatch(
        new RegExp(`^2,[^,]+,${m.other.name},0\\.0000,-0\\.1632,0\\.5860,1\\.2610,pass,,,\\d{4}-[^,]+Z,${m.lead.name},touch_off=0\\.0000; dro_at_stop=-0\\.1632; End thickness=0\\.5870; Face length=1\\.2610$`),
      );
    });

    it('should start the CSV with a UTF-8 byte-order mark so spreadsheets read accents and emoji, formulas still neutralised', async () => {
      const run = (await post(c.machinist, '/api/batches', { setupId: released, partCount: 1 }).expect(201)).body;
      await post(c.machinist, `/api/batches/${run.id}/parts`, part('0.5856', '1.2610', { note: '=1+1 Ø écrou 🛠' })).expect(201);
      const res = await c.machinist.agent.get(`/api/batches/${run.id}/export.csv`).buffer(true).parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (chunk: Buffer) => chunks.push(chunk));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      }).expect(200);
      const bytes = res.body as Buffer;
      // EF BB BF is U+FEFF in UTF-8 (RFC 3629); the rest is the text as before.
      expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
      const text = bytes.subarray(3).toString('utf8');
      expect(text.startsWith('part,measured_at_utc,')).toBe(true);
      expect(text).toContain("'=1+1 Ø écrou 🛠");
    });
  });
});
