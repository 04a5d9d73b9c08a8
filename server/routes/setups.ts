import { Router } from 'express';
import { setupCreateBody, setupUpdateBody } from '../../shared/api/setup';
import { currentUser } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody, parseId } from '../middleware/validate';
import { Setup } from '../models/setup';
import { User } from '../models/user';
import { canChangeSetup, canSeeSetup } from '../services/setup-access';

async function findVisible(id: number, user: User): Promise<Setup> {
  const setup = await Setup.findOne({ where: { id, teamId: user.teamId }, include: [{ model: User, as: 'owner', attributes: ['id', 'name'] }] });
  if (!setup || !canSeeSetup(user, setup)) throw new HttpError(404, 'No set-up with that id in your team.');
  return setup;
}

/** /api/setups: the team's saved set-ups. */
export function createSetupsRouter(): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const user = currentUser(req);
    const rows = await Setup.findAll({
      where: { teamId: user.teamId },
      include: [{ model: User, as: 'owner', attributes: ['id', 'name'] }],
      order: [['updatedAt', 'DESC'], ['id', 'DESC']],
    });
    res.json({ setups: rows.filter((s) => canSeeSetup(user, s)).map((s) => s.toDto()) });
  });

  router.post('/', async (req, res) => {
    const user = currentUser(req);
    const body = parseBody(setupCreateBody, req.body);
    const created = await Setup.create({
      teamId: user.teamId,
      ownerId: user.id,
      name: body.name,
      kind: body.kind,
      inputs: body.inputs,
      notes: body.notes ?? '',
      job: body.job ?? null,
    });
    const setup = await findVisible(created.id, user);
    res.status(201).location(`/api/setups/${setup.id}`).json(setup.toDto());
  });

  router.get('/:id', async (req, res) => {
    const user = currentUser(req);
    res.json((await findVisible(parseId(req.params['id']), user)).toDto());
  });

  router.put('/:id', async (req, res) => {
    const user = currentUser(req);
    const setup = await findVisible(parseId(req.params['id']), user);
    if (!canChangeSetup(user, setup)) throw new HttpError(403, 'You may only change your own set-ups.');
    const body = parseBody(setupUpdateBody, req.body);
    if (body.version !== undefined && body.version !== setup.version) {
      res.status(409).json({ error: 'Someone changed this set-up since you opened it. Reload it and apply your edit again.', version: setup.version, setup: setup.toDto() });
      return;
    }
    const [count] = await Setup.update(
      { name: body.name, kind: body.kind, inputs: body.inputs, notes: body.notes ?? setup.notes, job: body.job === undefined ? setup.job : body.job, version: setup.version + 1 },
      { where: { id: setup.id, version: setup.version } },
    );
    const fresh = await findVisible(setup.id, user);
    if (count === 0) {
      res.status(409).json({ error: 'Someone changed this set-up since you opened it. Reload it and apply your edit again.', version: fresh.version, setup: fresh.toDto() });
      return;
    }
    res.json(fresh.toDto());
  });

  router.delete('/:id', async (req, res) => {
    const user = currentUser(req);
    const setup = await findVisible(parseId(req.params['id']), user);
    if (!canChangeSetup(user, setup)) throw new HttpError(403, 'You may only delete your own set-ups.');
    await setup.destroy();
    res.status(204).end();
  });

  return router;
}
