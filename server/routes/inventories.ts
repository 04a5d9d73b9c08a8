import { Router, type Request } from 'express';
import { Op, type Sequelize } from 'sequelize';
import { blockSetDetailErrors, inventoryAngleQuery, inventoryBlockPatch, inventoryCreateBody, inventoryStackQuery, inventoryUpdateBody, type InventoryListDto, type InventoryType } from '../../shared/api/inventory';
import { calculateAngleBlocks } from '../../shared/calc/angle-blocks';
import { calculateGaugeStack } from '../../shared/calc/gauge-stack';
import { currentUser } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody, parseId } from '../middleware/validate';
import { InventoryBlock, InventorySet } from '../models/inventory';
import type { User } from '../models/user';
import { blockLabel, blockSizeError } from '../../shared/forms/block-list';
import { findComposition, sizeOrder, standardCompositions, type StartingBlock } from '../services/inventory-blocks';
import { boxBlockAngles } from '../../shared/forms/angle-blocks-form';
import { boxStackRequest, teamBoxOf } from '../../shared/library/team-boxes';

/** Roles that manage the shop's inventories. */
const MANAGERS = new Set(['admin', 'lead']);

const ROUTE_TYPES: Record<string, InventoryType> = { 'gauge-sets': 'gauge-blocks', 'angle-sets': 'angle-blocks' };

function requireManager(user: User): void {
  if (!MANAGERS.has(user.role)) throw new HttpError(403, 'Only an admin or a lead may change the shop\'s block sets.');
}

function parseQuery<T>(schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: { issues: Array<{ path: PropertyKey[]; message: string }> } } }, query: unknown): T {
  const parsed = schema.safeParse(query);
  if (parsed.success) return parsed.data;
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) fields[issue.path.map(String).join('.') || '_'] ??= issue.message;
  throw new HttpError(400, Object.values(fields)[0] ?? 'Some query parameters are not valid.', fields);
}

const label = (set: InventorySet) => (b: InventoryBlock) => blockLabel(set.unit, b.size);

/** /api/inventories: the team's gauge-block and angle-block sets, and stacks from what is in the box. */
export function createInventoriesRouter(sequelize: Sequelize): Router {
  const router = Router();

  async function findSet(req: Request, type: InventoryType): Promise<InventorySet> {
    const user = currentUser(req);
    const set = await InventorySet.findOne({ where: { id: parseId(req.params['id'], 'block set'), teamId: user.teamId, type }, include: [{ model: InventoryBlock, as: 'blocks' }] });
    if (!set) throw new HttpError(404, 'No block set with that id in your team.');
    return set;
  }

  router.get('/', async (req, res) => {
    const user = currentUser(req);
    const sets = await InventorySet.findAll({ where: { teamId: user.teamId }, include: [{ model: InventoryBlock, as: 'blocks' }], order: [['name', 'ASC']] });
    const summary = (s: InventorySet) => ({ ...s.toDto(label(s)), blocks: undefined });
    const body: InventoryListDto = { gaugeSets: sets.filter((s) => s.type === 'gauge-blocks').map(summary), angleSets: sets.filter((s) => s.type === 'angle-blocks').map(summary) };
    res.json(body);
  });

  router.get('/standard-sets', (_req, res) => {
    res.json({ sets: standardCompositions() });
  });

  for (const [path, type] of Object.entries(ROUTE_TYPES)) {
    router.post(`/${path}`, async (req, res) => {
      const user = currentUser(req);
      requireManager(user);
      const body = parseBody(inventoryCreateBody, req.body);
      let blocks: StartingBlock[];
      let unit: InventorySet['unit'];
      if (body.standardSet) {
        const standard = findComposition(type, body.standardSet);
        if (!standard) {
          const known = standardCompositions().filter((c) => c.type === type).map((c) => c.id).join(', ');
          throw new HttpError(400, 'Some fields are not valid.', { standardSet: `Unknown standard set "${body.standardSet}"; known: ${known}.` });
        }
        blocks = standard.blocks;
        unit = standard.unit;
      } else if (body.blocks) {
        if (type === 'gauge-blocks' && !body.unit) throw new HttpError(400, 'Some fields are not valid.', { unit: 'Say whether the sizes are in inch or mm.' });
        unit = type === 'gauge-blocks' ? (body.unit ?? 'in') : 'arcsec';
        blocks = body.blocks;
        if (new Set(blocks.map((b) => sizeOrder(b.size).toString())).size !== blocks.length) throw new HttpError(400, 'Some fields are not valid.', { blocks: 'List each size once, with its count.' });
        const wrong = blocks.map((b) => blockSizeError(type, unit, b.size)).find((e) => e !== null);
        if (wrong) throw new HttpError(400, 'Some fields are not valid.', { blocks: wrong });
      } else {
        throw new HttpError(400, 'Some fields are not valid.', { standardSet: 'Start from a standard set or list the blocks.' });
      }
      const details = blockSetDetailErrors(type, unit, body);
      if (Object.keys(details).length > 0) throw new HttpError(400, 'Some fields are not valid.', details);
      if (await InventorySet.findOne({ where: { teamId: user.teamId, type, name: body.name } })) {
        throw new HttpError(409, 'Your team already has a set with that name.', { name: 'Choose another name.' });
      }
      const ordered = [...blocks].sort((a, b) => sizeOrder(a.size).cmp(sizeOrder(b.size)));
      const id = await sequelize.transaction(async (transaction) => {
        const set = await InventorySet.create(
          { teamId: user.teamId, type, name: body.name, unit, standardSet: body.standardSet ?? null, grade: body.grade ?? null, wearBlockSize: type === 'gauge-blocks' ? (body.wearBlockSize ?? null) : null, wearBlockCount: body.wearBlockCount ?? (body.wearBlockSize ? 2 : 0), notes: body.notes ?? '' },
          { transaction },
        );
        await InventoryBlock.bulkCreate(ordered.map((b, i) => ({ setId: set.id, size: sizeOrder(b.size).toString(), position: i + 1, count: b.count })), { transaction });
        return set.id;
      });
      const created = await InventorySet.findByPk(id, { include: [{ model: InventoryBlock, as: 'blocks' }] });
      res.status(201).location(`/api/inventories/${path}/${id}`).json(created?.toDto(label(created)));
    });

    router.get(`/${path}/:id`, async (req, res) => {
      const set = await findSet(req, type);
      res.json(set.toDto(label(set)));
    });

    router.put(`/${path}/:id`, async (req, res) => {
      const user = currentUser(req);
      const set = await findSet(req, type);
      requireManager(user);
      const body = parseBody(inventoryUpdateBody, req.body);
      const details = blockSetDetailErrors(type, set.unit, body);
      if (Object.keys(details).length > 0) throw new HttpError(400, 'Some fields are not valid.', details);
      if (await InventorySet.findOne({ where: { teamId: user.teamId, type, name: body.name, id: { [Op.ne]: set.id } } })) {
        throw new HttpError(409, 'Your team already has a set with that name.', { name: 'Choose another name.' });
      }
      const [count] = await InventorySet.update(
        {
          name: body.name,
          grade: body.grade === undefined ? set.grade : body.grade,
          wearBlockSize: type === 'gauge-blocks' ? (body.wearBlockSize === undefined ? set.wearBlockSize : body.wearBlockSize) : null,
          wearBlockCount: body.wearBlockCount ?? set.wearBlockCount,
          notes: body.notes ?? set.notes,
          version: set.version + 1,
        },
        { where: { id: set.id, version: body.version } },
      );
      const fresh = await findSet(req, type);
      if (count === 0) {
        res.status(409).json({ error: 'Someone changed this set since you opened it. Reload it and apply your change again.', version: fresh.version });
        return;
      }
      res.json(fresh.toDto(label(fresh)));
    });

    router.patch(`/${path}/:id/blocks/:blockId`, async (req, res) => {
      const user = currentUser(req);
      const set = await findSet(req, type);
      requireManager(user);
      const body = parseBody(inventoryBlockPatch, req.body);
      const blockId = parseId(req.params['blockId'], 'block');
      const block = (set.blocks ?? []).find((b) => b.id === blockId);
      if (!block) throw new HttpError(404, 'No block with that id in this set.');
      const next = { count: body.count ?? block.count, missing: body.missing ?? block.missing, damaged: body.damaged ?? block.damaged, note: body.note ?? block.note };
      if (next.missing + next.damaged > next.count) {
        throw new HttpError(400, 'Some fields are not valid.', { missing: `Missing and damaged together cannot exceed the ${next.count} block(s) of this size.` });
      }
      await sequelize.transaction(async (transaction) => {
        await block.update(next, { transaction });
        await InventorySet.update({ version: set.version + 1 }, { where: { id: set.id }, transaction });
      });
      const fresh = await findSet(req, type);
      res.json(fresh.toDto(label(fresh)));
    });

    router.delete(`/${path}/:id`, async (req, res) => {
      const user = currentUser(req);
      const set = await findSet(req, type);
      if (user.role !== 'admin') throw new HttpError(403, 'Only an admin may delete a block set.');
      await set.destroy();
      res.status(204).end();
    });
  }

  // The stack with the fewest blocks from what is in the box: missing and damaged blocks left out.
  router.get('/gauge-sets/:id/stack', async (req, res) => {
    const set = await findSet(req, 'gauge-blocks');
    const q = parseQuery(inventoryStackQuery, req.query);
    const request = boxStackRequest(teamBoxOf(set), { target: q.target, grade: q.grade, wear: q.wear !== 'no' });
    if (!request) throw new HttpError(422, 'Every block of this set is marked missing or damaged.');
    const result = calculateGaugeStack(request);
    const excluded = (set.blocks ?? []).filter((b) => b.missing + b.damaged > 0).map((b) => ({ size: b.size, missing: b.missing, damaged: b.damaged }));
    if (!result.ok) {
      res.status(result.kind === 'invalid' ? 400 : 422).json({ error: result.error, fields: result.fields, excluded });
      return;
    }
    res.json({ ...result.value, inventory: { id: set.id, name: set.name, version: set.version }, excluded });
  });

  router.get('/angle-sets/:id/combination', async (req, res) => {
    const set = await findSet(req, 'angle-blocks');
    const q = parseQuery(inventoryAngleQuery, req.query);
    const pieces = boxBlockAngles(set.blocks ?? []);
    if (pieces.length === 0) throw new HttpError(422, 'Every block of this set is marked missing or damaged.');
    const result = calculateAngleBlocks({ blocks: pieces, angle: q.angle });
    const excluded = (set.blocks ?? []).filter((b) => b.missing + b.damaged > 0).map((b) => ({ size: b.size, label: blockLabel(set.unit, b.size), missing: b.missing, damaged: b.damaged }));
    if (!result.ok) {
      res.status(result.kind === 'invalid' ? 400 : 422).json({ error: result.error, fields: result.fields, excluded });
      return;
    }
    res.json({ ...result.value, inventory: { id: set.id, name: set.name, version: set.version }, excluded });
  });

  return router;
}
