/**
 * Property tests on every API body: for each POST, PUT and PATCH route the Express router has,
 * random JSON (unicode text, huge and odd numbers, deep arrays, prototype keys, near-valid bodies
 * with one field broken, raw number tokens such as 1e400, text that is not JSON) is sent with a
 * valid CSRF token as a member allowed to use the route (and anonymously on public routes).
 * The server must never answer 5xx, and no body may reach Object.prototype.
 */
import fc from 'fast-check';
import sharp from 'sharp';
import request from 'supertest';
import { z } from 'zod';
import * as authApi from '../../shared/api/auth';
import * as batchApi from '../../shared/api/batch';
import * as calcApi from '../../shared/api/calc';
import * as inventoryApi from '../../shared/api/inventory';
import * as setupApi from '../../shared/api/setup';
import * as teamAdminApi from '../../shared/api/team-admin';
import * as trainingApi from '../../shared/api/training';
import { client, makeTeam, openApp, type Client, type Members } from '../support/api';
import { apiRoutes, type RouteInfo } from '../support/routes';

/** A JSON value built as a tree, so keys like "__proto__" survive as own keys and raw tokens stay raw. */
type Json = null | boolean | number | string | { readonly list: Json[] } | { readonly entries: Array<[string, Json]> } | { readonly raw: string };

function toText(value: Json): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if ('raw' in value) return value.raw;
  if ('list' in value) return `[${value.list.map(toText).join(',')}]`;
  return `{${value.entries.map(([k, v]) => `${JSON.stringify(k)}:${toText(v)}`).join(',')}}`;
}

/** Every field name of the shared request schemas, so random objects often hit real fields. */
function schemaFields(): string[] {
  const names = new Set<string>(['key', 'label', 'unit', 'nominal', 'plus', 'minus', 'type', 'count', 'size', 'role', 'active', 'missing', 'damaged', 'note']);
  const visit = (schema: unknown) => {
    if (schema instanceof z.ZodObject) for (const key of Object.keys(schema.shape)) names.add(key);
    if (schema instanceof z.ZodDiscriminatedUnion) for (const option of schema.options) visit(option);
  };
  for (const module of [authApi, batchApi, calcApi, inventoryApi, setupApi, teamAdminApi, trainingApi]) for (const value of Object.values(module)) visit(value);
  return [...names];
}

const FIELDS = schemaFields();
const PROTO_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty', 'valueOf'];
const NASTY_TEXT = [
  "' OR '1'='1' -- ", '"; DROP TABLE setups; --', '<script>alert(1)</script>', '<img src=x onerror=alert(1)>', '\u0000', '\uD800', '\uFEFF',
  '../../etc/passwd', '..\\..\\x', '𝔘𝔫𝔦𝔠𝔬𝔡𝔢 🛠️', '٠٫٧٥٠', '０.７５０', 'NaN', 'Infinity', '-0', '1e999', '0x1F', ' ', '', '9'.repeat(400), '%s%n%x', '${7*7}',
];
const PLAUSIBLE: Json[] = [
  'in', 'mm', 'deg', 'arcsec', 'taper', 'sine-bar', 'gauge-blocks', 'dovetail', 'v-groove', 'admin', 'lead', 'machinist', 'apprentice', 'draft', 'released',
  '0.750', '5', '7.5', '30°', '12 30 00', '2030-01-01T12:00:00Z', 'inch-81', 'angle-13-npl', 'sine-stack', 'taper-depth', 'slantwise.setup/1', 'fuzz@example.test',
  1, 0, -1, 2, 3, 500, 501,
];
/** An object that would pollute Object.prototype if a merge trusted its keys. */
const POLLUTER: Json = { entries: [['__proto__', { entries: [['polluted', 'yes'], ['role', 'admin']] }]] };
const RAW_NUMBERS = ['1e400', '-1e400', '1e-400', '-0', '123456789012345678901234567890', '0.1e-7'];

const key = fc.oneof({ arbitrary: fc.constantFrom(...FIELDS), weight: 6 }, { arbitrary: fc.constantFrom(...PROTO_KEYS), weight: 2 }, { arbitrary: fc.string({ maxLength: 12 }), weight: 1 });
const leaf: fc.Arbitrary<Json> = fc.oneof(
  { arbitrary: fc.constantFrom(...PLAUSIBLE), weight: 4 },
  { arbitrary: fc.constantFrom(...NASTY_TEXT), weight: 3 },
  { arbitrary: fc.string({ unit: 'binary', maxLength: 40 }), weight: 2 },
  { arbitrary: fc.oneof(fc.integer(), fc.double(), fc.constantFrom(Number.MAX_SAFE_INTEGER + 2, 1e308, -1e308, 5e-324, 4_294_967_296, 2 ** 31, -(2 ** 63))), weight: 2 },
  { arbitrary: fc.constantFrom(...RAW_NUMBERS).map((raw): Json => ({ raw })), weight: 1 },
  { arbitrary: fc.boolean(), weight: 1 },
  { arbitrary: fc.constant(null), weight: 1 },
  { arbitrary: fc.constantFrom<Json>(POLLUTER, { entries: [['constructor', { entries: [['prototype', POLLUTER]] }]] }), weight: 1 },
);
const { value } = fc.letrec<{ value: Json }>((tie) => ({
  value: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    { arbitrary: leaf, weight: 5 },
    { arbitrary: fc.array(tie('value'), { maxLength: 4 }).map((list): Json => ({ list })), weight: 1 },
    { arbitrary: fc.array(fc.tuple(key, tie('value')), { maxLength: 5 }).map((entries): Json => ({ entries })), weight: 1 },
  ),
}));
const object = fc.array(fc.tuple(key, value), { maxLength: 8 }).map((entries): Json => ({ entries }));
const deep = fc.integer({ min: 50, max: 400 }).map((n) => '['.repeat(n) + ']'.repeat(n));

/** A valid body with one field replaced by a random value, one added or one left out. */
function nearValid(base: Record<string, Json>): fc.Arbitrary<string> {
  const keys = Object.keys(base);
  return fc.oneof(
    fc.tuple(fc.constantFrom(...keys), value).map(([k, v]) => toText({ entries: Object.entries({ ...base, [k]: v }) })),
    fc.tuple(key, value).map(([k, v]) => toText({ entries: [...Object.entries(base), [k, v]] })),
    fc.constantFrom(...keys).map((k) => toText({ entries: Object.entries(base).filter(([name]) => name !== k) })),
  );
}

/** Request bodies as JSON text (some deliberately not JSON at all). */
function bodies(base: Record<string, Json> | undefined): fc.Arbitrary<string> {
  const parts: Array<fc.WeightedArbitrary<string>> = [
    { arbitrary: object.map(toText), weight: 5 },
    { arbitrary: value.map(toText), weight: 2 },
    { arbitrary: deep, weight: 1 },
    { arbitrary: fc.string({ unit: 'binary', maxLength: 60 }), weight: 1 },
  ];
  if (base) parts.push({ arbitrary: nearValid(base), weight: 6 });
  return fc.oneof(...parts);
}

const RUNS = Number(process.env['FUZZ_RUNS'] ?? 30);

const t = openApp({ calcRateLimitPerMinute: 1_000_000 });
const ROUTES = apiRoutes(t.app).filter((r) => ['POST', 'PUT', 'PATCH'].includes(r.method));
const PUBLIC = /^\/api\/(calc|auth|access)\//;
/** Routes only an apprentice may use: fuzzed as the apprentice, so the body is really read. */
const APPRENTICE_ONLY = /\/problems\/:position\//;

let m: Members;
const c = {} as Record<'admin' | 'apprentice', Client>;
const ids: Record<string, string> = {};
const valid: Record<string, Record<string, Json>> = {};
const statuses = new Map<number, number>();

beforeAll(async () => {
  m = await makeTeam('fuzz');
  c.admin = await client(t.app, m.admin);
  c.apprentice = await client(t.app, m.apprentice);
  const post = (path: string, body: object) => c.admin.agent.post(path).set('X-CSRF-Token', c.admin.token).send(body);
  const checks = [{ key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' }];
  const setup = await post('/api/setups', { name: 'Fuzz wedge', kind: 'taper', inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' }, checks }).expect(201);
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: { r: 0, g: 0, b: 0 } } }).png().toBuffer();
  const attachment = await c.admin.agent.post(`/api/setups/${setup.body.id}/attachments`).set('X-CSRF-Token', c.admin.token).attach('file', png, 'a.png').expect(201);
  // Released with its file (a file added to a released set-up makes it a draft again).
  await post(`/api/setups/${setup.body.id}/release`, {}).expect(200);
  const batch = await post('/api/batches', { setupId: setup.body.id, partCount: 50 }).expect(201);
  await post(`/api/batches/${batch.body.id}/parts`, { values: { 'end-thickness': '0.5854' } }).expect(201);
  const gauge = await post('/api/inventories/gauge-sets', { name: 'Fuzz 81', standardSet: 'inch-81' }).expect(201);
  const angle = await post('/api/inventories/angle-sets', { name: 'Fuzz angles', standardSet: 'angle-13-npl' }).expect(201);
  const assignment = await post('/api/training/assignments', { title: 'Fuzz', items: [{ type: 'sine-stack', count: 2 }], dueAt: '2030-01-01T12:00:00Z', assigneeIds: [m.apprentice.id] }).expect(201);
  await c.apprentice.agent.get(`/api/training/assignments/${assignment.body.id}/work`).expect(200);
  const invitation = await post('/api/team/invitations', { email: `fuzz.${m.team.id}@example.test`, role: 'machinist' }).expect(201);
  Object.assign(ids, {
    '/api/setups/': String(setup.body.id),
    '/api/setups/:id/attachments/': String(attachment.body.id),
    '/api/batches/': String(batch.body.id),
    '/api/batches/:id/parts/': '1',
    '/api/inventories/gauge-sets/': String(gauge.body.id),
    '/api/inventories/gauge-sets/:id/blocks/': String(gauge.body.blocks[0].id),
    '/api/inventories/angle-sets/': String(angle.body.id),
    '/api/inventories/angle-sets/:id/blocks/': String(angle.body.blocks[0].id),
    '/api/team/members/': String(m.machinist.id),
    '/api/team/invitations/': String(invitation.body.invitation.id),
    '/api/training/assignments/': String(assignment.body.id),
    '/api/training/assignments/:id/problems/': '1',
    '/api/training/assignments/:id/work/': String(m.apprentice.id),
    '/api/training/assignments/:id/work/:userId/problems/': '1',
  });
  const taper = { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' };
  const setupBody = { name: 'Fuzzed', kind: 'taper', inputs: { entries: Object.entries(taper) }, notes: 'n', job: 'J-1', checks: { list: [{ entries: Object.entries(checks[0]!) }] } } as Record<string, Json>;
  Object.assign(valid, {
    'POST /api/setups': setupBody,
    'PUT /api/setups/:id': { ...setupBody, version: 3 },
    'POST /api/setups/:id/release': { version: 2 },
    'POST /api/setups/:id/archive': { version: 2 },
    'POST /api/setups/import': { format: 'slantwise.setup/1', setup: { entries: Object.entries(setupBody) } },
    'POST /api/batches': { setupId: setup.body.id, partCount: 2, label: 'Fuzz run' },
    'POST /api/batches/:id/parts': { values: { entries: [['end-thickness', '0.5855']] }, touchOff: '0.1', droAtStop: '0.2', note: 'n' },
    'PUT /api/batches/:id/parts/:partNo': { values: { entries: [['end-thickness', '0.5855']] }, touchOff: '0.1', note: 'n' },
    'POST /api/inventories/gauge-sets': { name: 'Fuzz set', standardSet: 'inch-81', grade: '0', notes: '' },
    'PUT /api/inventories/gauge-sets/:id': { name: 'Fuzz 81', grade: '0', notes: '', version: 1 },
    'PATCH /api/inventories/gauge-sets/:id/blocks/:blockId': { missing: 0, damaged: 0, note: 'n' },
    'POST /api/inventories/angle-sets': { name: 'Fuzz angle set', standardSet: 'angle-13-npl' },
    'PUT /api/inventories/angle-sets/:id': { name: 'Fuzz angles', notes: '', version: 1 },
    'PATCH /api/inventories/angle-sets/:id/blocks/:blockId': { count: 1 },
    'PATCH /api/team/members/:id': { role: 'machinist' },
    'POST /api/team/invitations': { email: `fuzz2.${m.team.id}@example.test`, role: 'apprentice' },
    'POST /api/training/assignments': { title: 'T', instructions: 'I', items: { list: [{ entries: [['type', 'sine-stack'], ['count', 1]] }] }, dueAt: '2030-01-01T12:00:00Z', assigneeIds: { list: [m.apprentice.id] } },
    'POST /api/training/assignments/:id/problems/:position/attempts': { answer: '1.000' },
    'POST /api/training/assignments/:id/work/:userId/problems/:position/grade': { correct: true, note: 'Right in another form.' },
    'POST /api/training/assignments/:id/assignees': { assigneeIds: { list: [m.apprentice.id] }, timeZone: 'Europe/Berlin' },
    'PATCH /api/training/assignments/:id': { dueAt: '2030-01-01T12:00:00Z', timeZone: 'America/Chicago' },
    'POST /api/calc/taper': taper,
    'POST /api/calc/sine-bar': { unit: 'in', barLength: '5', angle: '12' },
    'POST /api/calc/gauge-stack': { unit: 'in', target: '2.0084', set: 'inch-81' },
    'POST /api/calc/over-pins': { kind: 'v-groove', unit: 'in', angle: '90', pin: '0.500' },
    'POST /api/access/password-reset': { email: 'nobody@example.test' },
    'POST /api/access/password-reset/complete': { token: 'x'.repeat(40), password: 'a long enough password' },
    'POST /api/access/invitations/accept': { token: 'x'.repeat(40), name: 'N', password: 'a long enough password' },
  });
}, 120_000);

afterAll(() => t.close());

function fill(route: RouteInfo): string {
  return route.path.replace(/:(\w+)/g, (_match, _name: string, offset: number) => {
    const id = ids[route.path.slice(0, offset)];
    if (!id) throw new Error(`no test value for the parameter after ${route.path.slice(0, offset)}`);
    return id;
  });
}

/** Sends one body; returns a description when the answer is a 5xx. */
async function probe(who: Client, route: RouteInfo, text: string): Promise<void> {
  const agent = who.agent as unknown as Record<string, (p: string) => request.Test>;
  const res = await agent[route.method.toLowerCase()]!(fill(route)).set('X-CSRF-Token', who.token).set('Content-Type', 'application/json').send(text);
  statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
  if (res.status >= 500) throw new Error(`${route.method} ${route.path} answered ${res.status} ${JSON.stringify(res.body)} to ${text.slice(0, 300)}`);
  if (!/json/.test(String(res.headers['content-type'])) && res.status !== 204) throw new Error(`${route.method} ${route.path} answered ${res.status} without JSON`);
}

describe('fuzzing every API body', () => {
  it('finds the body routes of the router', () => {
    expect(ROUTES.length).toBeGreaterThan(25);
  });

  it.each(ROUTES.map((r) => [`${r.method} ${r.path}`, r] as const))('never answers 5xx on %s', async (name, route) => {
    // Sign-in and sign-out run on fresh anonymous sessions, so the signed-in clients stay signed in.
    const auth = route.path.startsWith('/api/auth/') || route.path.startsWith('/api/access/');
    const who = auth ? await client(t.app) : APPRENTICE_ONLY.test(route.path) ? c.apprentice : c.admin;
    // bcrypt makes every well-formed sign-in cost ~0.5 s: fewer near-valid sign-ins.
    const base = name === 'POST /api/auth/login' ? undefined : valid[name];
    await fc.assert(fc.asyncProperty(bodies(base), (text) => probe(who, route, text)), { numRuns: RUNS });
    if (PUBLIC.test(route.path) && !auth) {
      const anon = await client(t.app);
      await fc.assert(fc.asyncProperty(bodies(base), (text) => probe(anon, route, text)), { numRuns: Math.ceil(RUNS / 2) });
    }
  }, 60_000);

  it('leaves Object.prototype clean and the app answering', async () => {
    expect(Object.keys(Object.prototype)).toEqual([]);
    expect(({} as Record<string, unknown>)['polluted']).toBeUndefined();
    await request(t.app).get('/api/health').expect(200);
    const total = [...statuses.values()].reduce((a, b) => a + b, 0);
    expect(total).toBeGreaterThan(ROUTES.length * RUNS * 0.9);
    expect([...statuses.keys()].every((s) => s < 500)).toBe(true);
    console.log(`fuzz: ${total} requests on ${ROUTES.length} routes; statuses ${JSON.stringify(Object.fromEntries([...statuses].sort((x, y) => x[0] - y[0])))}`);
  });
});
