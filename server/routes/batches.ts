import { Router, type Request, type Response } from 'express';
import { Transaction, type Sequelize, type WhereOptions } from 'sequelize';
import { batchCorrectionBody, batchCreateBody, batchPartBody, BATCH_STATUSES, type BatchPartBody, type BatchRunDto, type PartReadings } from '../../shared/api/batch';
import type { SetupCheck } from '../../shared/api/setup';
import { checkStats, partVerdict } from '../../shared/batch/batch-stats';
import { farFromNominal, farMessage, readingProblem, readReading } from '../../shared/batch/reading';
import { currentUser } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody, parseId } from '../middleware/validate';
import { BatchPart, BatchRun } from '../models/batch-run';
import { User } from '../models/user';
import { findVisibleSetup } from '../services/setup-access';

const PEOPLE = [
  { model: User, as: 'startedBy', attributes: ['id', 'name'] },
  { model: User, as: 'closedBy', attributes: ['id', 'name'] },
];

function mayRun(user: User): void {
  if (user.role === 'apprentice') throw new HttpError(403, 'Apprentices may watch batch runs but not record them; ask a machinist or a lead.');
}

/**
 * Checks a part's values against the run's checks: every check once, each a decimal number (written
 * the usual ways: ".585" and "+0.5854" are read as 0.585 and 0.5854). A reading far from its nominal
 * (see farFromNominal) is refused unless the body confirms it; one of 0 or less on a check whose
 * nominal is above 0 is always refused.
 */
function readings(checks: readonly SetupCheck[], body: BatchPartBody): Record<string, string> {
  const fields: Record<string, string> = {};
  const out: Record<string, string> = {};
  const known = new Set(checks.map((c) => c.key));
  for (const key of Object.keys(body.values)) if (!known.has(key)) fields[`values.${key}`] = `This run has no check "${key}".`;
  for (const check of checks) {
    const raw = body.values[check.key];
    const text = raw === undefined ? '' : String(raw).trim();
    const read = readReading(text);
    if (text === '') fields[`values.${check.key}`] = `Enter the ${check.label.toLowerCase()}.`;
    else if (!read.ok) fields[`values.${check.key}`] = readingProblem(check.label, read.problem, check.nominal);
    // A length or angle measured on the part is never 0 or less when its nominal is above 0: a slip.
    else if (Number(check.nominal) > 0 && Number(read.text) <= 0) fields[`values.${check.key}`] = `${check.label} must be more than 0 (nominal ${check.nominal} ${check.unit}): check the reading.`;
    else if (body.confirm !== true && farFromNominal(check, read.text)) fields[`values.${check.key}`] = farMessage(check, read.text);
    else out[check.key] = read.text;
  }
  if (Object.keys(fields).length) throw new HttpError(400, 'Some readings are not valid.', fields);
  return out;
}

function csvCell(value: string | number | null | undefined, text = false): string {
  let s = value === null || value === undefined ? '' : String(value);
  // A text cell starting like a formula is neutralised for spreadsheet programs.
  if (text && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The batch run as CSV: one row per part, a column per check value (band in the header). */
/** The readings as first recorded, for the CSV: "touch_off=0.0000; dro_at_stop=-0.1632; End thickness=0.5805". */
function firstRecordedText(first: PartReadings | null, checks: readonly SetupCheck[]): string {
  if (!first) return '';
  const parts = [`touch_off=${first.touchOff ?? ''}`, `dro_at_stop=${first.droAtStop ?? ''}`, ...checks.map((c) => `${c.label}=${first.values[c.key] ?? ''}`)];
  return parts.join('; ');
}

export function batchCsv(run: BatchRun, parts: readonly BatchPart[]): string {
  const checks = run.checks;
  const header = [
    'part', 'measured_at_utc', 'operator', 'touch_off', 'dro_at_stop', ...checks.map((c) => `${c.label} (${c.unit}) [${c.nominal} +${c.plus}/-${c.minus}]`), 'pass', 'out_of_band', 'note',
    'corrected_at_utc', 'corrected_by', 'first_recorded',
  ];
  const lines = [header.map((h) => csvCell(h, true)).join(',')];
  for (const p of [...parts].sort((a, b) => a.partNo - b.partNo)) {
    lines.push([
      csvCell(p.partNo), csvCell(p.measuredAt.toISOString()), csvCell(p.operator?.name ?? '', true), csvCell(p.touchOff), csvCell(p.droAtStop),
      ...checks.map((c) => csvCell(p.readings[c.key] ?? '')),
      csvCell(p.pass ? 'pass' : 'fail'), csvCell(p.outOfBand, true), csvCell(p.note, true),
      csvCell(p.correctedAt ? p.correctedAt.toISOString() : ''), csvCell(p.correctedAt ? (p.correctedBy?.name ?? '') : '', true), csvCell(firstRecordedText(p.firstRecorded, checks), true),
    ].join(','));
  }
  // A UTF-8 byte-order mark first, so spreadsheet programs read accents and emoji in names as UTF-8.
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}

/** /api/batches: batch runs of released set-ups, part by part. */
export function createBatchesRouter(sequelize: Sequelize): Router {
  const router = Router();

  async function loadRun(teamId: number, id: number, withParts = false): Promise<BatchRun> {
    const run = await BatchRun.findOne({
      where: { id, teamId },
      include: withParts ? [...PEOPLE, { model: BatchPart, as: 'parts', include: [{ model: User, as: 'operator', attributes: ['id', 'name'] }, { model: User, as: 'correctedBy', attributes: ['id', 'name'] }] }] : PEOPLE,
    });
    if (!run) throw new HttpError(404, 'No batch run with that id in your team.');
    return run;
  }

  const findRun = (req: Request, withParts = false) => loadRun(currentUser(req).teamId, parseId(req.params['id'], 'batch run'), withParts);

  function fullDto(run: BatchRun): BatchRunDto {
    const parts = [...(run.parts ?? [])].sort((a, b) => a.partNo - b.partNo);
    return { ...run.toDto(), parts: parts.map((p) => p.toDto()), stats: checkStats(run.checks, parts.map((p) => ({ partNo: p.partNo, values: p.readings }))) };
  }

  router.get('/', async (req, res) => {
    const user = currentUser(req);
    const where: WhereOptions = { teamId: user.teamId };
    const setupId = req.query['setupId'];
    const status = req.query['status'];
    if (setupId !== undefined) {
      if (typeof setupId !== 'string' || !/^\d{1,10}$/.test(setupId)) throw new HttpError(400, 'Some query parameters are not valid.', { setupId: 'setupId must be a whole number.' });
      Object.assign(where, { setupId: Number(setupId) });
    }
    if (status !== undefined) {
      if (typeof status !== 'string' || !(BATCH_STATUSES as readonly string[]).includes(status)) throw new HttpError(400, 'Some query parameters are not valid.', { status: 'Status must be open or closed.' });
      Object.assign(where, { status });
    }
    // Open runs first: an ENUM sorts by its declared order ('open', 'closed'), not alphabetically.
    const runs = await BatchRun.findAll({ where, include: [...PEOPLE, { model: BatchPart, as: 'parts', attributes: ['id', 'partNo', 'pass'] }], order: [['status', 'ASC'], ['createdAt', 'DESC'], ['id', 'DESC']], limit: 200 });
    res.json({ batches: runs.map((r) => r.toDto()) });
  });

  router.post('/', async (req, res) => {
    const user = currentUser(req);
    mayRun(user);
    const body = parseBody(batchCreateBody, req.body);
    const setup = await findVisibleSetup(body.setupId, user).catch(() => {
      throw new HttpError(400, 'Some fields are not valid.', { setupId: 'No set-up with that id in your team.' });
    });
    if (setup.status !== 'released') throw new HttpError(409, 'Only a released set-up can be run; ask a lead to release it first.', { setupId: 'This set-up is not released.' });
    if (setup.checks.length === 0) throw new HttpError(409, 'This set-up names no check values to measure; add them to the set-up first.', { setupId: 'The set-up has no check values.' });
    const run = await BatchRun.create({
      teamId: user.teamId, setupId: setup.id, setupVersion: setup.version, setupName: setup.name,
      label: body.label || `${setup.job ?? setup.name} × ${body.partCount}`, partCount: body.partCount, checks: setup.checks, startedById: user.id,
    });
    const fresh = await loadRun(user.teamId, run.id, true);
    res.status(201).location(`/api/batches/${run.id}`).json(fullDto(fresh));
  });

  router.get('/:id', async (req, res) => {
    res.json(fullDto(await findRun(req, true)));
  });

  router.get('/:id/export.csv', async (req, res) => {
    const run = await findRun(req, true);
    res.type('text/csv; charset=utf-8').attachment(`batch-${run.id}.csv`).send(batchCsv(run, run.parts ?? []));
  });

  /** Writes one part inside a transaction that holds the run's row: no half records, no duplicate numbers. */
  async function savePart(req: Request, partNo: number | undefined, replace: boolean): Promise<{ run: BatchRun; partNo: number }> {
    const user = currentUser(req);
    mayRun(user);
    const runId = parseId(req.params['id'], 'batch run');
    const number = await sequelize.transaction(async (transaction) => {
      const run = await BatchRun.findOne({ where: { id: runId, teamId: user.teamId }, lock: Transaction.LOCK.UPDATE, transaction });
      if (!run) throw new HttpError(404, 'No batch run with that id in your team.');
      // The body is read only once the run is known to be this team's: another team learns nothing from a 400.
      const body = replace ? parseBody(batchCorrectionBody, req.body) : parseBody(batchPartBody, req.body);
      if (run.status === 'closed') {
        const closer = run.closedById ? await User.findByPk(run.closedById, { attributes: ['id', 'name'], transaction }) : null;
        throw new HttpError(409, `This batch run was closed${closer ? ` by ${closer.name}` : ''} and is read-only; nothing was saved.`);
      }
      const existing = await BatchPart.findAll({ where: { runId: run.id }, attributes: ['id', 'partNo', 'operatorId'], include: [{ model: User, as: 'operator', attributes: ['id', 'name'] }], transaction });
      // Without a number, the lowest part not yet entered (a part sent out of turn leaves a gap to fill).
      const taken = new Set(existing.map((p) => p.partNo));
      let next = 1;
      while (taken.has(next)) next += 1;
      const wanted = partNo ?? body.partNo ?? next;
      if (wanted > run.partCount) throw new HttpError(409, `This run is for ${run.partCount} parts; part ${wanted} is beyond it.`, { partNo: `At most ${run.partCount}.` });
      const already = existing.find((p) => p.partNo === wanted);
      if (replace) {
        if (!already) throw new HttpError(404, `Part ${wanted} has not been entered yet.`);
        const part = (await BatchPart.findByPk(already.id, { transaction }))!;
        // Optimistic concurrency on the part: a correction made from a form loaded before someone
        // else's correction would silently replace it.
        if ('revision' in body && body.revision !== undefined && body.revision !== part.revision()) {
          throw new HttpError(409, `Someone changed part ${wanted} while you were correcting it; nothing was saved. Check the part as it is now, then save your correction again if it is still needed.`);
        }
        const values = readings(run.checks, body);
        const verdict = partVerdict(run.checks, values);
        const entered = { touchOff: body.touchOff ?? null, droAtStop: body.droAtStop ?? null, readings: values, pass: verdict.pass, outOfBand: verdict.outOfBand.join(','), note: body.note ?? '' };
        // A correction keeps who measured the part and when; changed readings record who corrected
        // them and when, and keep the readings as first recorded (a note alone is just edited).
        const readingsOf = (p: { touchOff: string | null; droAtStop: string | null; readings: Record<string, string> }) => ({ touchOff: p.touchOff, droAtStop: p.droAtStop, values: p.readings });
        const changed = JSON.stringify(readingsOf(part)) !== JSON.stringify(readingsOf(entered));
        await part.update(
          { ...entered, ...(changed ? { correctedById: user.id, correctedAt: new Date(), firstRecorded: part.firstRecorded ?? readingsOf(part) } : {}) },
          { transaction },
        );
      } else {
        if (already) {
          const by = already.operator?.name;
          throw new HttpError(409, `Part ${wanted} is already recorded${by ? `, by ${by}` : ''}; your readings were not saved. Correct part ${wanted} instead, or record them as another part.`, { partNo: 'Already recorded.' });
        }
        const values = readings(run.checks, body);
        const verdict = partVerdict(run.checks, values);
        const entered = { touchOff: body.touchOff ?? null, droAtStop: body.droAtStop ?? null, readings: values, pass: verdict.pass, outOfBand: verdict.outOfBand.join(','), note: body.note ?? '' };
        await BatchPart.create({ runId: run.id, partNo: wanted, ...entered, operatorId: user.id, measuredAt: new Date() }, { transaction });
      }
      await run.update({ version: run.version + 1 }, { transaction });
      return wanted;
    });
    return { run: await findRun(req, true), partNo: number };
  }

  /**
   * A part that could not be saved because the run changed (closed, the part recorded or corrected
   * meanwhile) is answered 409 with the run as it is now, so the page can show it and keep what was typed.
   */
  async function conflict(req: Request, res: Response, err: unknown, partNo?: number): Promise<boolean> {
    if (!(err instanceof HttpError) || err.status !== 409) return false;
    const fresh = fullDto(await findRun(req, true));
    const part = partNo === undefined ? undefined : fresh.parts?.find((p) => p.partNo === partNo);
    res.status(409).json({ error: err.message, ...(err.fields ? { fields: err.fields } : {}), run: fresh, ...(part ? { part } : {}) });
    return true;
  }

  router.post('/:id/parts', async (req, res) => {
    try {
      const { run, partNo } = await savePart(req, undefined, false);
      const dto = fullDto(run);
      res.status(201).location(`/api/batches/${run.id}/parts/${partNo}`).json({ part: dto.parts?.find((p) => p.partNo === partNo), run: dto });
    } catch (err) {
      if (!(await conflict(req, res, err))) throw err;
    }
  });

  router.put('/:id/parts/:partNo', async (req, res) => {
    const partNo = parseId(req.params['partNo'], 'part');
    try {
      const { run } = await savePart(req, partNo, true);
      const dto = fullDto(run);
      res.json({ part: dto.parts?.find((p) => p.partNo === partNo), run: dto });
    } catch (err) {
      if (!(await conflict(req, res, err, partNo))) throw err;
    }
  });

  router.post('/:id/close', async (req, res) => {
    const user = currentUser(req);
    mayRun(user);
    const runId = parseId(req.params['id'], 'batch run');
    await sequelize.transaction(async (transaction) => {
      const run = await BatchRun.findOne({ where: { id: runId, teamId: user.teamId }, lock: Transaction.LOCK.UPDATE, transaction });
      if (!run) throw new HttpError(404, 'No batch run with that id in your team.');
      if (run.status === 'closed') throw new HttpError(409, 'This batch run is already closed.');
      if (user.role === 'machinist' && run.startedById !== user.id) throw new HttpError(403, 'Only the machinist who started the run, a lead or an admin may close it.');
      await run.update({ status: 'closed', closedAt: new Date(), closedById: user.id, version: run.version + 1 }, { transaction });
    });
    res.json(fullDto(await findRun(req, true)));
  });

  return router;
}
