import { Router, type Request } from 'express';
import { col, Op, where as columnWhere, type Sequelize } from 'sequelize';
import { blockSetDetailErrors, inventoryAngleQuery, inventoryBlockPatch, inventoryCreateBody, inventoryStackQuery, inventoryUpdateBody, STACK_QUERY_FIELDS, wearBlocksAfter, type InventoryListDto, type InventoryType } from '../../shared/api/inventory';
import { calculateAngleBlocks } from '../../shared/calc/angle-blocks';
import { calculateGaugeStack } from '../../shared/calc/gauge-stack';
import { currentUser } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseBody, parseId } from '../middleware/validate';
import { InventoryBlock, InventorySet } from '../models/inventory';
import { Setup } from '../models/setup';
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

/**
 * Parses a query, or throws a 400 whose fields say what is wrong without their names (the page
 * puts its own label before them) and whose message is the first of them as a sentence.
 */
function parseQuery<T>(schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: { issues: Array<{ path: PropertyKey[]; message: string }> } } }, query: unknown, names: Readonly<Record<string, string>> = {}): T {
  const parsed = schema.safeParse(query);
  if (parsed.success) return parsed.data;
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) fields[issue.path.map(String).join('.') || '_'] ??= issue.message;
  const [first] = Object.entries(fields);
  const sentence = first ? (names[first[0]] ? `${names[first[0]]} ${first[1]}.` : first[1]) : 'Some query parameters are not valid.';
  throw new HttpError(400, sentence, fields);
}

/** Every string in a JSON value (a set-up's inputs), to find the box names in it. */
function stringsIn(value: unknown): string[] {
  if (typeof value === 'string') return [value];
  if (Array.isArray(value)) return value.flatMap(stringsIn);
  if (value !== null && typeof value === 'object') return Object.values(value).flatMap(stringsIn);
  return [];
}

/** The team's set-ups (any status) whose inputs name the box `box:<id>`, by name. */
async function setupsNamingBox(teamId: number, boxId: number): Promise<Setup[]> {
  const name = `box:${boxId}`;
  // The LIKE narrows the rows; the inputs are then read, so "box:12" never matches "box:123".
  const rows = await Setup.findAll({ where: { teamId, [Op.and]: [columnWhere(col('inputs'), { [Op.like]: `%"${name}"%` })] }, attributes: ['id', 'name', 'inputs'], order: [['name', 'ASC'], ['id', 'ASC']] });
  return rows.filter((s) => stringsIn(s.inputs).includes(name));
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
      const wear = wearBlocksAfter({ wearBlockSize: null, wearBlockCount: 0 }, body);
      const details = blockSetDetailErrors(type, unit, { ...body, ...wear });
      if (Object.keys(details).length > 0) throw new HttpError(400, 'Some fields are not valid.', details);
      if (await InventorySet.findOne({ where: { teamId: user.teamId, type, name: body.name } })) {
        throw new HttpError(409, 'Your team already has a set with that name.', { name: 'Choose another name.' });
      }
      const ordered = [...blocks].sort((a, b) => sizeOrder(a.size).cmp(sizeOrder(b.size)));
      const id = await sequelize.transaction(async (transaction) => {
        const set = await InventorySet.create(
          { teamId: user.teamId, type, name: body.name, unit, standardSet: body.standardSet ?? null, grade: body.grade ?? null, wearBlockSize: type === 'gauge-blocks' ? wear.wearBlockSize : null, wearBlockCount: type === 'gauge-blocks' ? wear.wearBlockCount : 0, notes: body.notes ?? '' },
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
      // The wear blocks are checked as they will stand, so a half-given change cannot leave a count without a thickness.
      const wear = wearBlocksAfter(set, body);
      const details = blockSetDetailErrors(type, set.unit, { ...body, ...wear });
      if (Object.keys(details).length > 0) throw new HttpError(400, 'Some fields are not valid.', details);
      if (await InventorySet.findOne({ where: { teamId: user.teamId, type, name: body.name, id: { [Op.ne]: set.id } } })) {
        throw new HttpError(409, 'Your team already has a set with that name.', { name: 'Choose another name.' });
      }
      const [count] = await InventorySet.update(
        {
          name: body.name,
          grade: body.grade === undefined ? set.grade : body.grade,
          wearBlockSize: type === 'gauge-blocks' ? wear.wearBlockSize : null,
          wearBlockCount: type === 'gauge-blocks' ? wear.wearBlockCount : 0,
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
      // A set-up answered from this box would be left with no blocks to answer from: keep the box.
      const using = await setupsNamingBox(user.teamId, set.id);
      if (using.length > 0) {
        const shown = using.slice(0, 3).map((s) => `"${s.name}"`).join(', ');
        const more = using.length > 3 ? ` and ${using.length - 3} more` : '';
        const count = using.length === 1 ? '1 saved set-up uses' : `${using.length} saved set-ups use`;
        throw new HttpError(409, `${count} this set (${shown}${more}) and would lose ${using.length === 1 ? 'its stack' : 'their stacks'}. Save ${using.length === 1 ? 'it' : 'them'} with another set, or delete ${using.length === 1 ? 'it' : 'them'}, first (archived set-ups count too).`);
      }
      await set.destroy();
      res.status(204).end();
    });
  }

  // The stack with the fewest blocks from what is in the box: missing and damaged blocks left out.
  router.get('/gauge-sets/:id/stack', async (req, res) => {
    const set = await findSet(req, 'gauge-blocks');
    const q = parseQuery(inventoryStackQuery, req.query, STACK_QUERY_FIELDS);
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
