/**
 * Route × role matrix, generated from the Express router: every API route must have an access rule
 * below (a new route without one fails this suite), and every route is tried anonymously, as each
 * role and as a member of another team.
 */
import sharp from 'sharp';
import request from 'supertest';
import type { Role } from '../../shared/api/auth';
import { CapturedMail } from '../../server/models';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';
import { apiRoutes, type RouteInfo } from '../support/routes';

/** 'public': no sign-in; 'member': any signed-in role; a role list: only those roles. */
type Rule = 'public' | 'member' | readonly Role[];
const LEADS: readonly Role[] = ['admin', 'lead'];
const RUNNERS: readonly Role[] = ['admin', 'lead', 'machinist'];

/**
 * The rules, for the resources this test makes: the set-up, its attachment, the batch run and the
 * assignment belong to the lead; the inventories to the admin.
 */
const RULES: Record<string, Rule> = {
  'GET /api/health': 'public',
  'GET /api/openapi.json': 'public',
  'GET /api/auth/csrf': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/logout': 'public',
  'GET /api/auth/session': 'public',
  'GET /api/auth/me': 'member',
  'GET /api/calc/angle-block-sets': 'public',
  'POST /api/calc/angle-blocks': 'public',
  'POST /api/calc/compound-sine-plate': 'public',
  'GET /api/calc/gauge-sets': 'public',
  'POST /api/calc/gauge-stack': 'public',
  'POST /api/calc/lathe-taper': 'public',
  'GET /api/calc/machine-tapers': 'public',
  'POST /api/calc/over-pins': 'public',
  'POST /api/calc/sine-bar': 'public',
  'POST /api/calc/sine-table': 'public',
  'POST /api/calc/taper': 'public',
  'GET /api/access/invitations/:token': 'public',
  'POST /api/access/invitations/accept': 'public',
  'POST /api/access/password-reset': 'public',
  'GET /api/access/password-reset/:token': 'public',
  'POST /api/access/password-reset/complete': 'public',
  'GET /api/setups': 'member',
  'GET /api/setups/owners': 'member',
  'POST /api/setups': 'member',
  'POST /api/setups/import': 'member',
  'GET /api/setups/:id': 'member',
  'PUT /api/setups/:id': LEADS,
  'DELETE /api/setups/:id': LEADS,
  'POST /api/setups/:id/release': LEADS,
  'POST /api/setups/:id/archive': LEADS,
  'GET /api/setups/:id/revisions': 'member',
  'GET /api/setups/:id/export': 'member',
  'GET /api/setups/:id/sheet.pdf': 'member',
  'GET /api/setups/:id/attachments': 'member',
  'POST /api/setups/:id/attachments': LEADS,
  'GET /api/setups/:id/attachments/:attachmentId': 'member',
  'GET /api/setups/:id/attachments/:attachmentId/thumbnail': 'member',
  'DELETE /api/setups/:id/attachments/:attachmentId': LEADS,
  'GET /api/batches': 'member',
  'POST /api/batches': RUNNERS,
  'GET /api/batches/:id': 'member',
  'GET /api/batches/:id/export.csv': 'member',
  'POST /api/batches/:id/parts': RUNNERS,
  'PUT /api/batches/:id/parts/:partNo': RUNNERS,
  'POST /api/batches/:id/close': LEADS,
  'GET /api/inventories': 'member',
  'GET /api/inventories/standard-sets': 'member',
  'POST /api/inventories/gauge-sets': LEADS,
  'GET /api/inventories/gauge-sets/:id': 'member',
  'PUT /api/inventories/gauge-sets/:id': LEADS,
  'DELETE /api/inventories/gauge-sets/:id': ['admin'],
  'PATCH /api/inventories/gauge-sets/:id/blocks/:blockId': LEADS,
  'GET /api/inventories/gauge-sets/:id/stack': 'member',
  'POST /api/inventories/angle-sets': LEADS,
  'GET /api/inventories/angle-sets/:id': 'member',
  'PUT /api/inventories/angle-sets/:id': LEADS,
  'DELETE /api/inventories/angle-sets/:id': ['admin'],
  'PATCH /api/inventories/angle-sets/:id/blocks/:blockId': LEADS,
  'GET /api/inventories/angle-sets/:id/combination': 'member',
  'GET /api/team/members': LEADS,
  'PATCH /api/team/members/:id': ['admin'],
  'GET /api/team/invitations': ['admin'],
  'POST /api/team/invitations': ['admin'],
  'DELETE /api/team/invitations/:id': ['admin'],
  'GET /api/team/mailbox': ['admin'],
  'GET /api/team/mailbox/:id': ['admin'],
  'GET /api/team/export': ['admin'],
  'GET /api/training/exercise-types': 'member',
  'GET /api/training/assignments': 'member',
  'POST /api/training/assignments': LEADS,
  'GET /api/training/assignments/:id': ['admin', 'lead', 'apprentice'],
  'DELETE /api/training/assignments/:id': LEADS,
  'PATCH /api/training/assignments/:id': LEADS,
  'POST /api/training/assignments/:id/assignees': LEADS,
  'GET /api/training/assignments/:id/work': ['admin', 'lead', 'apprentice'],
  'GET /api/training/assignments/:id/work/:userId': LEADS,
  'POST /api/training/assignments/:id/work/:userId/problems/:position/grade': LEADS,
  'POST /api/training/assignments/:id/problems/:position/hints': ['apprentice'],
  'POST /api/training/assignments/:id/problems/:position/attempts': ['apprentice'],
  'GET /api/training/scores': LEADS,
};

/** The dev mailbox shows every message this instance caught (a development tool), not one team's. */
const INSTANCE_WIDE = new Set(['GET /api/team/mailbox/:id']);

const ROLES: readonly Role[] = ['admin', 'lead', 'machinist', 'apprentice'];

let t: TestApp;
let m: Members;
let foreign: Members;
let routes: RouteInfo[];
const c = {} as Record<Role | 'foreign', Client>;
const ids: Record<string, string> = {};

function send(who: Client | null, method: string, path: string) {
  const agent = who ? who.agent : request(t.app);
  const req = (agent as unknown as Record<string, (p: string) => request.Test>)[method.toLowerCase()]!(path);
  if (method !== 'GET' && who) req.set('X-CSRF-Token', who.token);
  return method === 'GET' || method === 'DELETE' ? req : req.send({});
}

/** Fills a route's parameters with the ids of the resources made in beforeAll, keyed by the path before each parameter. */
function fill(route: RouteInfo): string {
  return route.path.replace(/:(\w+)/g, (_match, _name: string, offset: number) => {
    const before = route.path.slice(0, offset);
    const value = ids[before];
    if (!value) throw new Error(`no test value for the parameter after ${before}`);
    return value;
  });
}

beforeAll(async () => {
  t = openApp();
  m = await makeTeam('matrix');
  foreign = await makeTeam('matrix-foreign');
  for (const role of ROLES) c[role] = await client(t.app, m[role]);
  c.foreign = await client(t.app, foreign.admin);
  routes = apiRoutes(t.app);

  const lead = c.lead;
  const post = (path: string, body: object) => lead.agent.post(path).set('X-CSRF-Token', lead.token).send(body);
  const checks = [{ key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' }];
  const setup = await post('/api/setups', { name: 'Matrix wedge', kind: 'taper', inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' }, checks }).expect(201);
  const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: { r: 30, g: 110, b: 140 } } }).png().toBuffer();
  const attachment = await lead.agent.post(`/api/setups/${setup.body.id}/attachments`).set('X-CSRF-Token', lead.token).attach('file', png, { filename: 'dot.png', contentType: 'image/png' }).expect(201);
  // Released with its file (a file added to a released set-up makes it a draft again).
  await post(`/api/setups/${setup.body.id}/release`, {}).expect(200);
  const batch = await post('/api/batches', { setupId: setup.body.id, partCount: 3 }).expect(201);
  const gauge = await c.admin.agent.post('/api/inventories/gauge-sets').set('X-CSRF-Token', c.admin.token).send({ name: 'Matrix 81', standardSet: 'inch-81' }).expect(201);
  const angle = await c.admin.agent.post('/api/inventories/angle-sets').set('X-CSRF-Token', c.admin.token).send({ name: 'Matrix angles', standardSet: ANGLE_SET }).expect(201);
  const assignment = await post('/api/training/assignments', { title: 'Matrix', items: [{ type: TRAINING_TYPE, count: 1 }], dueAt: '2030-01-01T12:00:00Z', assigneeIds: [m.apprentice.id] }).expect(201);
  const invitation = await c.admin.agent.post('/api/team/invitations').set('X-CSRF-Token', c.admin.token).send({ email: `matrix.${m.team.id}@example.test`, role: 'machinist' }).expect(201);
  const mail = await CapturedMail.create({ sender: 'a@example.test', recipients: 'b@example.test', subject: 'Matrix', text: 'x', html: null, receivedAt: new Date() });

  const gaugeBody = gauge.body as { id: number; blocks: Array<{ id: number }> };
  const angleBody = angle.body as { id: number; blocks: Array<{ id: number }> };
  const token = 'not-a-real-token-0123456789abcdef';
  Object.assign(ids, {
    '/api/setups/': String(setup.body.id),
    '/api/setups/:id/attachments/': String(attachment.body.id),
    '/api/batches/': String(batch.body.id),
    '/api/batches/:id/parts/': '1',
    '/api/inventories/gauge-sets/': String(gaugeBody.id),
    '/api/inventories/gauge-sets/:id/blocks/': String(gaugeBody.blocks[0]!.id),
    '/api/inventories/angle-sets/': String(angleBody.id),
    '/api/inventories/angle-sets/:id/blocks/': String(angleBody.blocks[0]!.id),
    '/api/team/members/': String(m.machinist.id),
    '/api/team/invitations/': String(invitation.body.id),
    '/api/team/mailbox/': String(mail.id),
    '/api/training/assignments/': String(assignment.body.id),
    '/api/training/assignments/:id/problems/': '1',
    '/api/training/assignments/:id/work/': String(m.apprentice.id),
    '/api/training/assignments/:id/work/:userId/problems/': '1',
    '/api/access/invitations/': token,
    '/api/access/password-reset/': token,
  });
}, 120_000);
afterAll(() => t.close());

const ANGLE_SET = 'angle-13-npl';
const TRAINING_TYPE = 'sine-stack';

describe('route × role matrix', () => {
  it('has an access rule for every API route', () => {
    const missing = routes.map((r) => `${r.method} ${r.path}`).filter((key) => !(key in RULES));
    expect(missing).toEqual([]);
    expect(routes.length).toBeGreaterThan(60);
  });

  it('answers 401 to anonymous callers on every route that needs sign-in, and never 5xx', async () => {
    const wrong: string[] = [];
    for (const route of routes) {
      const rule = RULES[`${route.method} ${route.path}`];
      if (!rule) continue;
      // A fresh anonymous session with a valid CSRF token per change, so the 401 is about sign-in alone.
      const res = await send(route.method === 'GET' ? null : await client(t.app), route.method, fill(route));
      if (res.status >= 500 || (rule !== 'public' && res.status !== 401)) wrong.push(`${route.method} ${route.path} → ${res.status}`);
    }
    expect(wrong).toEqual([]);
  });

  it.each(ROLES)('lets %s in exactly where the rules say (403/404 elsewhere), never 5xx', async (role) => {
    const wrong: string[] = [];
    for (const route of routes) {
      const rule = RULES[`${route.method} ${route.path}`];
      if (!rule || rule === 'public') continue;
      const allowed = rule === 'member' || rule.includes(role);
      // Allowed changes are covered by each feature's own tests; here they would spoil the shared resources.
      if (allowed && route.method !== 'GET') continue;
      const res = await send(c[role], route.method, fill(route));
      const ok = allowed ? res.status < 500 && res.status !== 401 && res.status !== 403 : res.status === 403 || res.status === 404;
      if (!ok) wrong.push(`${route.method} ${route.path} → ${res.status} ${JSON.stringify(res.body).slice(0, 120)}`);
    }
    expect(wrong).toEqual([]);
  }, 120_000);

  it('hides every resource of one team from another team\'s admin (404), never 5xx', async () => {
    const wrong: string[] = [];
    for (const route of routes) {
      const key = `${route.method} ${route.path}`;
      const rule = RULES[key];
      if (!rule || rule === 'public' || !route.path.includes(':') || INSTANCE_WIDE.has(key)) continue;
      const res = await send(c.foreign, route.method, fill(route));
      if (res.status !== 404) wrong.push(`${key} → ${res.status}`);
    }
    expect(wrong).toEqual([]);
  }, 120_000);
});
