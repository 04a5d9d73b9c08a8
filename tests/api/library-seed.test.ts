import demo from '../../fixtures/demo.json';
import { BatchRun, InventorySet, InventoryBlock, BatchPart, Setup, SetupRevision, Team, User } from '../../server/models';
import { seedLibrary, type DemoLibrary } from '../../server/seed/library';
import { openApp, type TestApp } from '../support/api';

jest.setTimeout(30_000);

let t: TestApp;
beforeAll(() => {
  t = openApp();
});
afterAll(() => t.close());

describe('demo library seed', () => {
  it('should hold the demo shop\'s 81-piece set with blocks marked, an angle set and two wedge runs', async () => {
    const team = await Team.findOne({ where: { name: demo.team } });
    expect(team).not.toBeNull();
    const gauge = await InventorySet.findOne({ where: { teamId: team!.id, type: 'gauge-blocks' }, include: [{ model: InventoryBlock, as: 'blocks' }] });
    const blocks = gauge?.blocks ?? [];
    expect(blocks.reduce((a, b) => a + b.count, 0)).toBe(81);
    expect(blocks.filter((b) => b.missing > 0).map((b) => b.size)).toEqual(['0.1007']);
    expect(blocks.filter((b) => b.damaged > 0).map((b) => b.size)).toEqual(['0.137']);
    expect(await InventorySet.count({ where: { teamId: team!.id, type: 'angle-blocks' } })).toBe(1);
    // The seed's runs come first; end-to-end tests running alongside may add runs to the demo team after them.
    const runs = (await BatchRun.findAll({ where: { teamId: team!.id }, include: [{ model: BatchPart, as: 'parts' }], order: [['id', 'ASC']] })).slice(0, 2);
    expect(runs.map((r) => [r.status, r.partCount, r.parts?.length])).toEqual([['closed', 8, 8], ['open', 8, 3]]);
    expect(runs[0]?.parts?.every((p) => p.pass)).toBe(true);
    expect(runs[1]?.parts?.filter((p) => !p.pass).map((p) => p.partNo)).toEqual([3]);
    // Each run starts no later than its first part and closes after its last (and after any correction).
    for (const run of runs) {
      const measured = (run.parts ?? []).map((p) => p.measuredAt.getTime());
      expect(run.createdAt.getTime()).toBeLessThanOrEqual(Math.min(...measured));
      if (run.closedAt) expect(run.closedAt.getTime()).toBeGreaterThan(Math.max(...measured, ...(run.parts ?? []).map((p) => p.correctedAt?.getTime() ?? 0)));
    }
    // Lot A's part 4 was first typed as 0.5815 and corrected by the lead after it was measured.
    const corrected = runs[0]?.parts?.filter((p) => p.correctedAt) ?? [];
    expect(corrected.map((p) => [p.partNo, p.readings['end-thickness'], p.firstRecorded?.values['end-thickness']])).toEqual([[4, '0.5851', '0.5815']]);
    expect(corrected[0]!.correctedAt!.getTime()).toBeGreaterThan(corrected[0]!.measuredAt.getTime());
  });

  it("should date each demo set-up's history as the set-up: written, then released, then run", async () => {
    const team = await Team.findOne({ where: { name: demo.team } });
    const setups = await Setup.findAll({ where: { teamId: team!.id, name: demo.setups.map((s) => s.name) } });
    expect(setups.length).toBe(demo.setups.length);
    for (const setup of setups) {
      const revs = await SetupRevision.findAll({ where: { setupId: setup.id }, order: [['id', 'ASC']] });
      const created = revs.find((r) => r.action === 'created');
      expect(created?.createdAt.getTime()).toBe(setup.createdAt.getTime());
      const released = revs.find((r) => r.action === 'released');
      if (setup.status === 'released') {
        expect(released?.createdAt.getTime()).toBe(setup.releasedAt!.getTime());
        expect(setup.releasedAt!.getTime()).toBeGreaterThan(setup.createdAt.getTime());
      }
      const runs = await BatchRun.findAll({ where: { setupId: setup.id } });
      for (const run of runs) expect(run.createdAt.getTime()).toBeGreaterThan((setup.releasedAt ?? setup.createdAt).getTime());
    }
  });

  it('should add nothing when run again', async () => {
    const team = await Team.findOne({ where: { name: demo.team } });
    const members = await User.findAll({ where: { teamId: team!.id } });
    const added = await seedLibrary(team!.id, demo.library as DemoLibrary, new Map(members.map((u) => [u.email, u])));
    expect(added).toBe(0);
  });
});
