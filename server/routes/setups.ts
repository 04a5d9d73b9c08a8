import { Router, type Request, type Response } from 'express';
import { Transaction, type Sequelize } from 'sequelize';
import {
  nominalProblem, SETUP_EXPORT_FORMAT, setupCreateBody, setupImportBody, setupListQuery, setupStatusBody, setupUpdateBody,
  type SetupExportDto, type SetupStatus,
} from '../../shared/api/setup';
import { setupResults } from '../../shared/library/setup-results';
import type { AppConfig } from '../config';
import { currentUser } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody, parseId } from '../middleware/validate';
import { Attachment } from '../models/attachment';
import { BatchRun } from '../models/batch-run';
import { Setup } from '../models/setup';
import { SetupRevision } from '../models/setup-revision';
import { Team } from '../models/team';
import { User } from '../models/user';
import { canChangeSetup, canReleaseSetup, deleteRefusal, findVisibleSetup, NOT_IN_TEAM } from '../services/setup-access';
import { listOwners, listSetupsJson, readVisibleSetupJson } from '../services/setup-reads';
import { contentOf, diffContent, recordRevision } from '../services/setup-history';
import { renderSetupSheet } from '../services/setup-sheet';
import { teamBoxesFor } from '../services/team-boxes';
import { notifySetupReleased } from '../services/team-mail';
import type { ObjectStorage } from '../services/storage/object-storage';
import { createAttachmentsRouter } from './attachments';
import { sendJsonText } from './send-json';

/** What the library routes need from the app. */
export interface LibraryDeps {
  readonly sequelize: Sequelize;
  readonly storage: ObjectStorage;
  readonly config: AppConfig;
}

const DEFAULT_PAGE_SIZE = 50;
const CONFLICT = 'Someone changed this set-up since you opened it. Reload it and apply your edit again.';

/** Parses the list query (all strings), naming each bad parameter with a 400. */
function listQuery(req: Request) {
  const parsed = setupListQuery.safeParse(req.query);
  if (!parsed.success) {
    const fields: Record<string, string> = {};
    for (const issue of parsed.error.issues) fields[issue.path.join('.') || '_'] ??= issue.message;
    throw new HttpError(400, 'Some query parameters are not valid.', fields);
  }
  return parsed.data;
}

/** /api/setups: the team's set-up library. */
export function createSetupsRouter({ sequelize, storage, config }: LibraryDeps): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const q = listQuery(req);
    // A SetupPageDto, as JSON text built by the query.
    sendJsonText(res, (await listSetupsJson(sequelize, currentUser(req), { ...q, page: q.page ?? 1, pageSize: q.pageSize ?? DEFAULT_PAGE_SIZE })).json);
  });

  router.get('/owners', async (req, res) => {
    res.json(await listOwners(sequelize, currentUser(req)));
  });

  router.post('/', async (req, res) => {
    const user = currentUser(req);
    const body = parseBody(setupCreateBody, req.body);
    const id = await sequelize.transaction(async (transaction) => {
      const created = await Setup.create(
        { teamId: user.teamId, ownerId: user.id, name: body.name, kind: body.kind, inputs: body.inputs, notes: body.notes ?? '', job: body.job || null, checks: body.checks ?? [] },
        { transaction },
      );
      await recordRevision(created, 'created', user, [], transaction);
      return created.id;
    });
    const setup = await findVisibleSetup(id, user);
    res.status(201).location(`/api/setups/${setup.id}`).json(setup.toDto());
  });

  router.post('/import', async (req, res) => {
    const user = currentUser(req);
    const body = parseBody(setupImportBody, req.body);
    const s = body.setup;
    const id = await sequelize.transaction(async (transaction) => {
      const created = await Setup.create(
        { teamId: user.teamId, ownerId: user.id, name: s.name, kind: s.kind, inputs: s.inputs, notes: s.notes ?? '', job: s.job || null, checks: s.checks ?? [] },
        { transaction },
      );
      await recordRevision(created, 'imported', user, [], transaction);
      return created.id;
    });
    const setup = await findVisibleSetup(id, user);
    res.status(201).location(`/api/setups/${setup.id}`).json(setup.toDto());
  });

  router.get('/:id', async (req, res) => {
    const user = currentUser(req);
    const setup = await readVisibleSetupJson(sequelize, parseId(req.params['id']), user);
    if (!setup) throw new HttpError(404, NOT_IN_TEAM);
    sendJsonText(res, setup.json);
  });

  router.put('/:id', async (req, res) => {
    const user = currentUser(req);
    const setup = await findVisibleSetup(parseId(req.params['id']), user);
    if (!canChangeSetup(user, setup)) throw new HttpError(403, 'You may only change your own set-ups.');
    const body = parseBody(setupUpdateBody, req.body);
    if (body.version !== setup.version) {
      res.status(409).json({ error: CONFLICT, version: setup.version, setup: setup.toDto() });
      return;
    }
    if (setup.status === 'archived') throw new HttpError(409, 'This set-up is archived and read-only. A lead can release it again before it is changed.');
    const before = contentOf(setup);
    const after = { name: body.name, kind: body.kind, inputs: body.inputs, notes: body.notes ?? setup.notes, job: body.job === undefined ? (setup.job ?? null) : body.job || null, checks: body.checks ?? setup.checks };
    const changes = diffContent(before, after);
    if (changes.length === 0) {
      res.json(setup.toDto());
      return;
    }
    // Changing released content makes a new draft for a lead to release; the released content
    // stays in the history.
    const status: SetupStatus = 'draft';
    if (setup.status !== status) changes.push({ field: 'status', from: setup.status, to: status });
    const stale = await sequelize.transaction(async (transaction) => {
      const [count] = await Setup.update(
        { ...after, status, releasedAt: null, releasedById: null, version: setup.version + 1 },
        { where: { id: setup.id, version: setup.version }, transaction },
      );
      if (count === 0) return true;
      const fresh = await Setup.findByPk(setup.id, { transaction });
      if (fresh) await recordRevision(fresh, 'edited', user, changes, transaction);
      return false;
    });
    const fresh = await findVisibleSetup(setup.id, user);
    if (stale) {
      res.status(409).json({ error: CONFLICT, version: fresh.version, setup: fresh.toDto() });
      return;
    }
    res.json(fresh.toDto());
  });

  /** Moves a set-up to a new status (lead or admin), stamping it and adding it to the history; answers the request. */
  async function changeStatus(req: Request, res: Response, to: 'released' | 'archived'): Promise<void> {
    const user = currentUser(req);
    const setup = await findVisibleSetup(parseId(req.params['id']), user);
    if (!canReleaseSetup(user, setup)) throw new HttpError(403, `Only a lead or an admin may ${to === 'released' ? 'release' : 'archive'} set-ups.`);
    const raw: unknown = req.body;
    const body = raw === undefined || raw === null || (typeof raw === 'object' && Object.keys(raw).length === 0) ? {} : parseBody(setupStatusBody, raw);
    if (body.version !== undefined && body.version !== setup.version) {
      res.status(409).json({ error: CONFLICT, version: setup.version, setup: setup.toDto() });
      return;
    }
    if (setup.status === to) throw new HttpError(409, `This set-up is already ${to}.`);
    if (to === 'released') {
      // A released set-up is run on parts: its numbers must come out of the engine.
      const results = setupResults(setup.kind, setup.inputs, await teamBoxesFor(setup.teamId, setup.kind, setup.inputs));
      if (!results.ok && !results.pageOnly) {
        throw new HttpError(422, `This set-up does not compute, so it cannot be released: ${results.error}. Open it in its calculator, correct the inputs and save it again.`);
      }
      // Check values saved before their nominals were checked (a minus sign on a thickness) would fail every part.
      const fields: Record<string, string> = {};
      setup.checks.forEach((check, i) => {
        const problem = nominalProblem(check.unit, check.nominal);
        if (problem) fields[`checks.${i}.nominal`] = `${check.label}: ${problem}`;
      });
      if (Object.keys(fields).length) {
        throw new HttpError(422, `This set-up cannot be released: ${Object.values(fields).join(' ')} Correct the check values under Edit details and save them.`, fields);
      }
    }
    const stamp = to === 'released' ? { releasedAt: new Date(), releasedById: user.id, releasedVersion: setup.version + 1 } : {};
    const stale = await sequelize.transaction(async (transaction) => {
      const [count] = await Setup.update({ status: to, version: setup.version + 1, ...stamp }, { where: { id: setup.id, version: setup.version }, transaction });
      if (count === 0) return true;
      const fresh = await Setup.findByPk(setup.id, { transaction });
      if (fresh) await recordRevision(fresh, to, user, [{ field: 'status', from: setup.status, to }], transaction);
      return false;
    });
    const fresh = await findVisibleSetup(setup.id, user);
    if (stale) res.status(409).json({ error: CONFLICT, version: fresh.version, setup: fresh.toDto() });
    else res.json(fresh.toDto());
    // Tell the owner their set-up was released (e-mail; a mail failure is logged, never fails the release).
    if (!stale && to === 'released') void notifySetupReleased(fresh, user);
  }

  router.post('/:id/release', async (req, res) => {
    await changeStatus(req, res, 'released');
  });

  router.post('/:id/archive', async (req, res) => {
    await changeStatus(req, res, 'archived');
  });

  router.get('/:id/revisions', async (req, res) => {
    const user = currentUser(req);
    const setup = await findVisibleSetup(parseId(req.params['id']), user);
    const rows = await SetupRevision.findAll({ where: { setupId: setup.id }, include: [{ model: User, as: 'user', attributes: ['id', 'name'] }], order: [['id', 'DESC']] });
    res.json({ revisions: rows.map((r) => r.toDto()) });
  });

  router.get('/:id/export', async (req, res) => {
    const user = currentUser(req);
    const setup = await findVisibleSetup(parseId(req.params['id']), user);
    const team = await Team.findByPk(user.teamId);
    const body: SetupExportDto = {
      format: SETUP_EXPORT_FORMAT,
      exportedAt: new Date().toISOString(),
      source: { team: team?.name ?? '', id: setup.id, version: setup.version, status: setup.status },
      setup: contentOf(setup),
    };
    res.attachment(`setup-${setup.id}-v${setup.version}.json`).json(body);
  });

  router.get('/:id/sheet.pdf', async (req, res) => {
    const user = currentUser(req);
    const setup = await findVisibleSetup(parseId(req.params['id']), user);
    const attachments = await Attachment.findAll({ where: { setupId: setup.id }, order: [['id', 'ASC']] });
    const boxes = await teamBoxesFor(setup.teamId, setup.kind, setup.inputs);
    const pdf = await renderSetupSheet({ setup, attachments, storage, boxes, link: `${config.publicUrl.replace(/\/$/, '')}/library/${setup.id}` });
    res.type('application/pdf').attachment(`setup-sheet-${setup.id}-v${setup.version}.pdf`).send(pdf);
  });

  router.delete('/:id', async (req, res) => {
    const user = currentUser(req);
    const setup = await findVisibleSetup(parseId(req.params['id']), user);
    if (!canChangeSetup(user, setup)) throw new HttpError(403, 'You may only delete your own set-ups.');
    // The row is held while it is checked and deleted: a release or a run started meanwhile waits.
    const files = await sequelize.transaction(async (transaction) => {
      const row = await Setup.findOne({ where: { id: setup.id, teamId: user.teamId }, lock: Transaction.LOCK.UPDATE, transaction });
      if (!row) throw new HttpError(404, NOT_IN_TEAM);
      const refusal = deleteRefusal(row);
      if (refusal) throw new HttpError(409, refusal);
      if ((await BatchRun.count({ where: { setupId: row.id }, transaction })) > 0) {
        throw new HttpError(409, 'This set-up has batch runs on record, so it cannot be deleted. Archive it instead (a lead or an admin archives set-ups).');
      }
      const attached = await Attachment.findAll({ where: { setupId: row.id }, transaction });
      await row.destroy({ transaction });
      return attached;
    });
    for (const f of files) {
      await storage.delete(f.storageKey);
      if (f.thumbnailKey) await storage.delete(f.thumbnailKey);
    }
    res.status(204).end();
  });

  router.use('/:id/attachments', createAttachmentsRouter({ sequelize, storage, maxBytes: config.uploads.maxBytes }));

  return router;
}
