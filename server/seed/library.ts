import type { SetupCheck } from '../../shared/api/setup';
import { partVerdict } from '../../shared/batch/batch-stats';
import { BatchPart, BatchRun, InventoryBlock, InventorySet, Setup, SetupRevision, type User } from '../models';
import { findComposition, sizeOrder } from '../services/inventory-blocks';
import { recordRevision } from '../services/setup-history';

interface DemoMark {
  size: string;
  missing?: number;
  damaged?: number;
  note?: string;
}
interface DemoSet {
  name: string;
  standardSet: string;
  grade: string | null;
  wearBlockSize?: string;
  wearBlockCount?: number;
  notes: string;
  marks: DemoMark[];
}
interface DemoPart {
  partNo: number;
  operator: string;
  minutesAfterStart: number;
  touchOff: string;
  droAtStop: string;
  values: Record<string, string>;
  note: string;
  /** A reading corrected after it was recorded: by whom, when, and what was first typed. */
  correction?: { by: string; minutesAfterStart: number; firstValues: Record<string, string> };
}
interface DemoRun {
  setup: string;
  label: string;
  partCount: number;
  startedBy: string;
  closedBy: string | null;
  startedDaysAgo: number;
  parts: DemoPart[];
}

/** The `library` part of fixtures/demo.json. */
export interface DemoLibrary {
  setupChecks: Record<string, SetupCheck[]>;
  gaugeSets: DemoSet[];
  angleSets: DemoSet[];
  batchRuns: DemoRun[];
}

async function seedSet(teamId: number, type: 'gauge-blocks' | 'angle-blocks', s: DemoSet): Promise<number> {
  if (await InventorySet.findOne({ where: { teamId, type, name: s.name } })) return 0;
  const standard = findComposition(type, s.standardSet);
  if (!standard) return 0;
  const set = await InventorySet.create({
    teamId, type, name: s.name, unit: standard.unit, standardSet: standard.id, grade: s.grade,
    wearBlockSize: s.wearBlockSize ?? null, wearBlockCount: s.wearBlockCount ?? 0, notes: s.notes,
  });
  const marks = new Map(s.marks.map((mk) => [sizeOrder(mk.size).toString(), mk]));
  await InventoryBlock.bulkCreate(
    [...standard.blocks].sort((a, b) => sizeOrder(a.size).cmp(sizeOrder(b.size))).map((b, i) => {
      const size = sizeOrder(b.size).toString();
      const mk = marks.get(size);
      return { setId: set.id, size, position: i + 1, count: b.count, missing: mk?.missing ?? 0, damaged: mk?.damaged ?? 0, note: mk?.note ?? '' };
    }),
  );
  return 1;
}

/**
 * Seeds the demo shop's library extras: check values and release stamps on the demo set-ups,
 * their first history entries, the gauge-block and angle-block sets, and two batch runs of the
 * fixture wedge (one closed, one open). Only what is absent is added.
 */
export async function seedLibrary(teamId: number, lib: DemoLibrary, byEmail: ReadonlyMap<string, User>): Promise<number> {
  let created = 0;
  const lead = byEmail.get('lead@demo.test') ?? null;
  const setups = await Setup.findAll({ where: { teamId } });
  for (const setup of setups) {
    const checks = lib.setupChecks[setup.name];
    if (checks && setup.checks.length === 0) await setup.update({ checks });
    if (setup.status === 'released' && !setup.releasedAt) await setup.update({ releasedAt: new Date(Date.now() - 10 * 86_400_000), releasedById: lead?.id ?? null });
    if ((await SetupRevision.count({ where: { setupId: setup.id } })) === 0) {
      const owner = [...byEmail.values()].find((u) => u.id === setup.ownerId) ?? null;
      // Dated as the set-up itself: written when it was created, released when it was stamped.
      await recordRevision(setup, 'created', owner, [], undefined, setup.createdAt);
      if (setup.status === 'released') await recordRevision(setup, 'released', lead, [{ field: 'status', from: 'draft', to: 'released' }], undefined, setup.releasedAt ?? undefined);
      created++;
    }
  }
  for (const s of lib.gaugeSets) created += await seedSet(teamId, 'gauge-blocks', s);
  for (const s of lib.angleSets) created += await seedSet(teamId, 'angle-blocks', s);
  for (const r of lib.batchRuns) {
    if (await BatchRun.findOne({ where: { teamId, label: r.label } })) continue;
    const setup = await Setup.findOne({ where: { teamId, name: r.setup } });
    if (!setup || setup.checks.length === 0) continue;
    const start = new Date(Date.now() - r.startedDaysAgo * 86_400_000);
    const last = r.parts.reduce((m, p) => Math.max(m, p.minutesAfterStart), 0);
    const closer = r.closedBy ? byEmail.get(r.closedBy) : undefined;
    const run = await BatchRun.create({
      teamId, setupId: setup.id, setupVersion: setup.version, setupName: setup.name, label: r.label, partCount: r.partCount,
      checks: setup.checks, startedById: byEmail.get(r.startedBy)?.id ?? null,
      status: closer ? 'closed' : 'open', closedById: closer?.id ?? null, closedAt: closer ? new Date(start.getTime() + (last + 20) * 60_000) : null,
      // Started when its first part was measured, so it is not closed before it began.
      createdAt: start,
    });
    await BatchPart.bulkCreate(r.parts.map((p) => {
      const verdict = partVerdict(setup.checks, p.values);
      return {
        runId: run.id, partNo: p.partNo, touchOff: p.touchOff, droAtStop: p.droAtStop, readings: p.values, pass: verdict.pass,
        outOfBand: verdict.outOfBand.join(','), operatorId: byEmail.get(p.operator)?.id ?? null, measuredAt: new Date(start.getTime() + p.minutesAfterStart * 60_000), note: p.note,
        ...(p.correction
          ? {
              correctedById: byEmail.get(p.correction.by)?.id ?? null,
              correctedAt: new Date(start.getTime() + p.correction.minutesAfterStart * 60_000),
              firstRecorded: { touchOff: p.touchOff, droAtStop: p.droAtStop, values: p.correction.firstValues },
            }
          : {}),
      };
    }));
    created++;
  }
  return created;
}
