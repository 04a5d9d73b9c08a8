/**
 * Writes interrupted for real, from outside: a database trigger that refuses one row in the middle
 * of a transaction, the app process killed (SIGKILL) while a statement of its transaction sleeps in
 * a trigger, an upload killed between its file and its row, and a client that drops half an upload.
 * Each is checked from outside too: the API's answers and row counts read as root over MariaDB's
 * Unix socket. The app runs as a process of its own (`node --import tsx server/main.ts`) on a
 * private MariaDB and a private upload folder.
 */
import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { Sequelize } from 'sequelize';
import sharp from 'sharp';
import request from 'supertest';
import { createSequelize } from '../../server/db';
import { initModels } from '../../server/models';
import { DiskStorage } from '../../server/services/storage/disk-storage';
import { sweepOrphanUploads } from '../../server/services/upload-sweep';
import { makeTeam, PASSWORD, type Members } from '../support/api';
import { freePort, isolatedDb, type IsolatedDb } from '../support/isolated-db';

jest.setTimeout(30_000);

const ROOT = path.resolve(__dirname, '../..');
const HOST = '127.0.0.1';
const run = promisify(execFile);

let db: IsolatedDb;
let m: Members;
let port: number;
let baseUrl: string;
let uploadDir: string;
/** The test's own connection (models bound), for makeTeam and the orphan sweep. */
let sequelize: Sequelize;
let app: ChildProcess | null = null;
let output = '';
let png: Buffer;

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/** Polls `check` every 100 ms until it gives a value (not undefined), or fails naming `what` after `ms`. */
async function until<T>(what: string, ms: number, check: () => Promise<T | undefined> | T | undefined): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`Timed out after ${ms} ms waiting for ${what}. App output so far:\n${output}`);
    await sleep(100);
  }
}

// ---- SQL as root, through the private server's Unix socket --------------------------------------

/** Runs SQL as root in the test database; `//` separates statements, so trigger bodies may hold `;`. */
async function asRoot(statement: string): Promise<string> {
  const { stdout } = await run('mariadb', [
    '--no-defaults', `--socket=${path.join(db.dir, 'mysqld.sock')}`, '-uroot', '--batch', '--skip-column-names', '--delimiter=//', db.config.db.name, '-e', statement,
  ]);
  return stdout.trim();
}

async function countOf(query: string): Promise<number> {
  const text = await asRoot(query);
  if (!/^\d+$/.test(text)) throw new Error(`Expected one number from "${query}", got "${text}"`);
  return Number(text);
}

/** The same count read without isolation, so rows of a transaction still open are seen too. */
const uncommittedCountOf = (query: string) => countOf(`SET SESSION TRANSACTION ISOLATION LEVEL READ UNCOMMITTED// ${query}`);

const triggers = new Set<string>();

async function addTrigger(name: string, definition: string): Promise<void> {
  triggers.add(name);
  await asRoot(`CREATE TRIGGER ${name} ${definition}`);
}

async function dropTrigger(name: string): Promise<void> {
  await asRoot(`DROP TRIGGER IF EXISTS ${name}`);
  triggers.delete(name);
}

/**
 * Id of the app's connection (TCP, so its host has a port; root's own calls use the socket) that
 * sleeps in the trigger statement `SET @<marker> = SLEEP(…)`, once there is one. While a trigger
 * runs, the process list shows the trigger's statement and its definer (root) as user, not the
 * INSERT that fired it and the app's user.
 */
function sleepingIn(marker: string): Promise<number> {
  return until(`a connection sleeping in the trigger that sets @${marker}`, 10_000, async () => {
    const id = await asRoot(
      `SELECT ID FROM information_schema.PROCESSLIST WHERE HOST LIKE '%:%' AND STATE = 'User sleep' AND INFO LIKE 'SET @${marker} = SLEEP%' LIMIT 1`,
    );
    return id ? Number(id) : undefined;
  });
}

/** Waits until the server has dropped connection `id` (and so rolled back whatever it had open). */
function connectionGone(id: number): Promise<true> {
  return until(`connection ${id} to end`, 10_000, async () => ((await countOf(`SELECT COUNT(*) FROM information_schema.PROCESSLIST WHERE ID = ${id}`)) === 0 ? true : undefined));
}

// ---- The app as a process of its own ---------------------------------------------------------------

async function startApp(): Promise<void> {
  output = '';
  const c = db.config;
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      PORT: String(port), HOST, WORKERS: '1', STATIC_DIR: '',
      DB_HOST: c.db.host, DB_PORT: String(c.db.port), DB_NAME: c.db.name, DB_USER: c.db.user, DB_PASSWORD: c.db.password,
      STORAGE_DRIVER: 'disk', UPLOAD_DIR: uploadDir,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  app = child;
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  await until('the app to listen', 40_000, () => {
    if (child.exitCode !== null || child.signalCode !== null) throw new Error(`The app exited early (${child.exitCode ?? child.signalCode}):\n${output}`);
    return output.includes(`Slantwise instance listening on ${baseUrl}`) ? true : undefined;
  });
}

async function killApp(): Promise<void> {
  const child = app;
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  child.kill('SIGKILL');
  await Promise.race([exited, sleep(5_000)]);
  expect(child.signalCode).toBe('SIGKILL');
}

const appAlive = () => app !== null && app.exitCode === null && app.signalCode === null;

// ---- Signed-in calls -------------------------------------------------------------------------------

interface Session {
  readonly cookie: string;
  readonly token: string;
}

function cookieOf(res: request.Response): string | undefined {
  const set = res.headers['set-cookie'] as unknown as string[] | undefined;
  return set?.[0]?.split(';')[0];
}

async function signIn(email: string): Promise<Session> {
  const csrf = await request(baseUrl).get('/api/auth/csrf').expect(200);
  const token = (csrf.body as { token: string }).token;
  const first = cookieOf(csrf);
  if (!first) throw new Error('No session cookie from /api/auth/csrf');
  const login = await request(baseUrl).post('/api/auth/login').set('Cookie', first).set('X-CSRF-Token', token).send({ email, password: PASSWORD }).expect(200);
  return { cookie: cookieOf(login) ?? first, token };
}

const as = (s: Session) => ({
  get: (p: string) => request(baseUrl).get(p).set('Cookie', s.cookie),
  post: (p: string, body: object = {}) => request(baseUrl).post(p).set('Cookie', s.cookie).set('X-CSRF-Token', s.token).send(body),
  put: (p: string, body: object) => request(baseUrl).put(p).set('Cookie', s.cookie).set('X-CSRF-Token', s.token).send(body),
  upload: (setupId: number, bytes: Buffer, filename: string) =>
    request(baseUrl).post(`/api/setups/${setupId}/attachments`).set('Cookie', s.cookie).set('X-CSRF-Token', s.token).attach('file', bytes, { filename, contentType: 'image/png' }),
});

let lead: ReturnType<typeof as>;
let machinist: ReturnType<typeof as>;
let machinistSession: Session;

/** A server failure answered as the error handler promises: JSON with one plain sentence, no HTML, no stack, no SQL. */
function expectPlainJsonError(res: request.Response): void {
  expect(res.status).toBe(500);
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  expect(Object.keys(res.body as object)).toEqual(['error']);
  expect((res.body as { error: string }).error).toMatch(/went wrong on the server/);
  expect(res.text).not.toMatch(/<html|\n\s+at |SQLSTATE|45000|fault test|INSERT INTO|UPDATE /i);
}

// ---- Upload folder ---------------------------------------------------------------------------------

/** Every file under the upload folder, as paths relative to it (sorted). */
function filesIn(): string[] {
  return (fs.readdirSync(uploadDir, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((e) => e.isFile())
    .map((e) => path.relative(uploadDir, path.join(e.parentPath, e.name)))
    .sort();
}

const taper = { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' };

async function newSetup(name: string, extra: object = {}): Promise<{ id: number; teamId: number }> {
  const res = await machinist.post('/api/setups', { name, kind: 'taper', inputs: taper, ...extra }).expect(201);
  return { id: res.body.id as number, teamId: m.team.id };
}

// Twelve sizes of the 0.1001…0.1009 in and 0.101…0.103 in series (sizes only; any list of ≥ 10 will do).
const SIZES = ['0.1001', '0.1002', '0.1003', '0.1004', '0.1005', '0.1006', '0.1007', '0.1008', '0.1009', '0.101', '0.102', '0.103'];
const gaugeSet = (name: string) => ({ name, unit: 'in', blocks: SIZES.map((size) => ({ size, count: 1 })) });

const setsNamed = (name: string) => countOf(`SELECT COUNT(*) FROM inventory_sets WHERE teamId = ${m.team.id} AND name = '${name}'`);
const allBlocks = () => countOf('SELECT COUNT(*) FROM inventory_blocks');
const orphanBlocks = () => countOf('SELECT COUNT(*) FROM inventory_blocks b LEFT JOIN inventory_sets s ON s.id = b.setId WHERE s.id IS NULL');

beforeAll(async () => {
  db = await isolatedDb();
  uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-interrupted-uploads-'));
  sequelize = createSequelize(db.config.db);
  initModels(sequelize);
  m = await makeTeam('interrupted');
  port = await freePort();
  baseUrl = `http://${HOST}:${port}`;
  png = await sharp({ create: { width: 480, height: 320, channels: 3, background: { r: 40, g: 90, b: 150 } } }).png().toBuffer();
  await startApp();
  lead = as(await signIn(m.lead.email));
  machinistSession = await signIn(m.machinist.email);
  machinist = as(machinistSession);
}, 120_000);

afterEach(async () => {
  for (const name of [...triggers]) await dropTrigger(name);
});

afterAll(async () => {
  if (app && appAlive()) app.kill('SIGKILL');
  await sequelize?.close();
  await db?.destroy();
  if (uploadDir) fs.rmSync(uploadDir, { recursive: true, force: true });
});

describe('a write that fails in the middle of its transaction leaves nothing behind', () => {
  it('a block set whose 7th of 12 block rows is refused: JSON error, no set, no blocks; without the trigger every block is written', async () => {
    const before = await allBlocks();
    await addTrigger(
      'fault_refuse_block_7',
      "BEFORE INSERT ON inventory_blocks FOR EACH ROW IF NEW.position = 7 THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'fault test: block 7 refused'; END IF",
    );
    const refused = await lead.post('/api/inventories/gauge-sets', gaugeSet('Cut short at seven'));
    expectPlainJsonError(refused);
    expect(await setsNamed('Cut short at seven')).toBe(0);
    expect(await allBlocks()).toBe(before);
    expect(await orphanBlocks()).toBe(0);
    const list = await lead.get('/api/inventories').expect(200);
    expect(list.body.gaugeSets.map((s: { name: string }) => s.name)).not.toContain('Cut short at seven');

    await dropTrigger('fault_refuse_block_7');
    const made = await lead.post('/api/inventories/gauge-sets', gaugeSet('Cut short at seven')).expect(201);
    expect(made.body.blocks.map((b: { size: string }) => b.size)).toEqual(SIZES);
    expect(await setsNamed('Cut short at seven')).toBe(1);
    expect(await countOf(`SELECT COUNT(*) FROM inventory_blocks WHERE setId = ${made.body.id as number}`)).toBe(SIZES.length);
    expect(await allBlocks()).toBe(before + SIZES.length);
  });

  it('a batch part whose run version bump is refused: no part row without the bump, for a new part and for a correction', async () => {
    const checks = [{ key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' }];
    const setup = await newSetup('Interrupted batch wedge', { checks });
    await lead.post(`/api/setups/${setup.id}/release`).expect(200);
    const started = (await machinist.post('/api/batches', { setupId: setup.id, partCount: 5 }).expect(201)).body as { id: number; version: number };
    const runId = started.id;
    const version = () => countOf(`SELECT version FROM batch_runs WHERE id = ${runId}`);
    const parts = () => countOf(`SELECT COUNT(*) FROM batch_parts WHERE runId = ${runId}`);
    const v0 = await version();
    expect(started.version).toBe(v0);

    // The part insert succeeds inside the transaction; the run update after it is refused.
    await addTrigger(
      'fault_refuse_run_bump',
      "BEFORE UPDATE ON batch_runs FOR EACH ROW IF NEW.version <> OLD.version THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'fault test: run bump refused'; END IF",
    );
    expectPlainJsonError(await machinist.post(`/api/batches/${runId}/parts`, { values: { 'end-thickness': '0.5856' } }));
    expect(await parts()).toBe(0);
    expect(await version()).toBe(v0);
    expect((await machinist.get(`/api/batches/${runId}`).expect(200)).body).toMatchObject({ version: v0, parts: [] });

    await dropTrigger('fault_refuse_run_bump');
    const saved = await machinist.post(`/api/batches/${runId}/parts`, { values: { 'end-thickness': '0.5856' } }).expect(201);
    expect(saved.body.part).toMatchObject({ partNo: 1, values: { 'end-thickness': '0.5856' } });
    expect(await parts()).toBe(1);
    expect(await version()).toBe(v0 + 1);

    // A correction of part 1 refused the same way keeps the reading it had.
    await addTrigger(
      'fault_refuse_run_bump',
      "BEFORE UPDATE ON batch_runs FOR EACH ROW IF NEW.version <> OLD.version THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'fault test: run bump refused'; END IF",
    );
    expectPlainJsonError(await machinist.put(`/api/batches/${runId}/parts/1`, { values: { 'end-thickness': '0.5870' }, revision: saved.body.part.revision }));
    const after = (await machinist.get(`/api/batches/${runId}`).expect(200)).body as { version: number; parts: { partNo: number; values: Record<string, string> }[] };
    expect(after.version).toBe(v0 + 1);
    expect(after.parts.map((p) => [p.partNo, p.values['end-thickness']])).toEqual([[1, '0.5856']]);
    expect(await version()).toBe(v0 + 1);
  });
});

describe('the app process killed in the middle of a transaction', () => {
  it('leaves no set and no blocks once MariaDB rolls back the dropped connection; the restarted app creates the set', async () => {
    const before = await allBlocks();
    await addTrigger('fault_pause_block_5', 'BEFORE INSERT ON inventory_blocks FOR EACH ROW IF NEW.position = 5 THEN SET @fault_pause_block = SLEEP(5); END IF');
    const answer = lead.post('/api/inventories/gauge-sets', gaugeSet('Killed at five')).then((r) => r.status, (e: NodeJS.ErrnoException) => e.code ?? e.message);
    const connection = await sleepingIn('fault_pause_block');
    // The half record exists, uncommitted, when the process dies: the set row and blocks 1 to 4.
    expect(await uncommittedCountOf(`SELECT COUNT(*) FROM inventory_sets WHERE teamId = ${m.team.id} AND name = 'Killed at five'`)).toBe(1);
    expect(await uncommittedCountOf(`SELECT COUNT(*) FROM inventory_blocks b JOIN inventory_sets s ON s.id = b.setId WHERE s.teamId = ${m.team.id} AND s.name = 'Killed at five'`)).toBe(4);
    expect(await setsNamed('Killed at five')).toBe(0);
    await killApp();
    expect(typeof (await answer)).toBe('string');
    await connectionGone(connection);
    await dropTrigger('fault_pause_block_5');

    expect(await setsNamed('Killed at five')).toBe(0);
    expect(await allBlocks()).toBe(before);
    expect(await orphanBlocks()).toBe(0);

    await startApp();
    const made = await lead.post('/api/inventories/gauge-sets', gaugeSet('Killed at five')).expect(201);
    expect(made.body.blocks).toHaveLength(SIZES.length);
    expect(await setsNamed('Killed at five')).toBe(1);
    expect(await allBlocks()).toBe(before + SIZES.length);
  }, 60_000);
});

describe('uploads interrupted between the file and its row', () => {
  it('killed during the row insert: the files stay without a row until the orphan sweep removes them, and only them', async () => {
    const setup = await newSetup('Killed upload holder');
    const folder = `teams/${setup.teamId}/setups/${setup.id}/`;
    const rows = () => countOf(`SELECT COUNT(*) FROM attachments WHERE setupId = ${setup.id}`);
    const filesBefore = filesIn();

    await addTrigger('fault_pause_attachment', 'BEFORE INSERT ON attachments FOR EACH ROW SET @fault_pause_attachment = SLEEP(5)');
    const answer = machinist.upload(setup.id, png, 'killed.png').then((r) => r.status, (e: NodeJS.ErrnoException) => e.code ?? e.message);
    const connection = await sleepingIn('fault_pause_attachment');
    await killApp();
    expect(typeof (await answer)).toBe('string');
    await connectionGone(connection);
    await dropTrigger('fault_pause_attachment');

    // The file and its thumbnail were stored before the insert; no row and no revision refer to them.
    const orphans = filesIn().filter((f) => !filesBefore.includes(f));
    expect(orphans).toHaveLength(2);
    expect(orphans.every((f) => f.startsWith(folder))).toBe(true);
    const image = orphans.find((f) => !f.endsWith('-thumb'))!;
    expect(orphans).toContain(`${image}-thumb`);
    expect(fs.readFileSync(path.join(uploadDir, image)).equals(png)).toBe(true);
    expect(await rows()).toBe(0);
    expect(await countOf(`SELECT COUNT(*) FROM setup_revisions WHERE setupId = ${setup.id} AND action = 'attached'`)).toBe(0);

    // The restarted app stores the next upload normally; its files are referenced by its row.
    await startApp();
    const kept = await machinist.upload(setup.id, png, 'kept.png').expect(201);
    const keptKeys = (await asRoot(`SELECT storageKey, thumbnailKey FROM attachments WHERE id = ${kept.body.id as number}`)).split('\t');
    expect(keptKeys).toHaveLength(2);
    expect(filesIn()).toEqual(expect.arrayContaining(keptKeys));

    // Every file in the folder is listed; exactly the two orphans go.
    const beforeSweep = filesIn();
    const result = await sweepOrphanUploads({ sequelize, storage: new DiskStorage(uploadDir), olderThanMs: 0 });
    expect(result.checked).toBe(beforeSweep.length);
    expect([...result.removed].sort()).toEqual(orphans);
    const left = filesIn();
    expect(left).toHaveLength(beforeSweep.length - orphans.length);
    for (const orphan of orphans) expect(left).not.toContain(orphan);
    expect(left).toEqual(expect.arrayContaining([...filesBefore, ...keptKeys]));
    expect(await rows()).toBe(1);
    const bytes = await machinist.get(`/api/setups/${setup.id}/attachments/${kept.body.id as number}`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (d: Buffer) => chunks.push(d));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    expect((bytes.body as Buffer).equals(png)).toBe(true);
    await machinist.get(`/api/setups/${setup.id}/attachments/${kept.body.id as number}/thumbnail`).expect(200);
  }, 60_000);

  it('a refused row insert answers a JSON error and leaves neither row nor file, with no sweep', async () => {
    const setup = await newSetup('Refused upload holder');
    const filesBefore = filesIn();
    await addTrigger('fault_refuse_attachment', "BEFORE INSERT ON attachments FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'fault test: attachment refused'");
    expectPlainJsonError(await machinist.upload(setup.id, png, 'refused.png'));
    expect(await countOf(`SELECT COUNT(*) FROM attachments WHERE setupId = ${setup.id}`)).toBe(0);
    expect(await countOf(`SELECT COUNT(*) FROM setup_revisions WHERE setupId = ${setup.id} AND action = 'attached'`)).toBe(0);
    expect(filesIn()).toEqual(filesBefore);
    expect((await machinist.get(`/api/setups/${setup.id}/attachments`).expect(200)).body).toEqual({ attachments: [] });
  });
});

describe('a client that gives up in the middle of an upload', () => {
  it('leaves no row and no file, and the app keeps answering and taking uploads', async () => {
    const setup = await newSetup('Half upload holder');
    // A noisy image, so the body spans many TCP segments.
    const big = await sharp({ create: { width: 400, height: 400, channels: 3, background: { r: 128, g: 128, b: 128 }, noise: { type: 'gaussian', mean: 128, sigma: 40 } } }).png().toBuffer();
    expect(big.length).toBeGreaterThan(100_000);
    const boundary = `----fault${randomBytes(8).toString('hex')}`;
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.png"\r\nContent-Type: image/png\r\n\r\n`),
      big,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const head = [
      `POST /api/setups/${setup.id}/attachments HTTP/1.1`, `Host: ${HOST}:${port}`, `Cookie: ${machinistSession.cookie}`, `X-CSRF-Token: ${machinistSession.token}`,
      `Content-Type: multipart/form-data; boundary=${boundary}`, `Content-Length: ${body.length}`, 'Connection: close', '', '',
    ].join('\r\n');
    const filesBefore = filesIn();

    let answered = '';
    const socket = net.connect({ host: HOST, port });
    socket.on('data', (d: Buffer) => (answered += d.toString('latin1')));
    const closed = new Promise<void>((resolve) => socket.once('close', () => resolve()));
    socket.on('error', () => undefined);
    await new Promise<void>((resolve, reject) => {
      socket.once('connect', resolve);
      socket.once('error', reject);
    });
    await new Promise<void>((resolve) => socket.write(Buffer.concat([Buffer.from(head, 'latin1'), body.subarray(0, Math.floor(body.length / 2))]), () => resolve()));
    // Let the app pass the access checks and start reading the body; it cannot answer before the body ends.
    await sleep(700);
    expect(answered).toBe('');
    socket.destroy();
    await closed;

    await sleep(500);
    expect(appAlive()).toBe(true);
    await request(baseUrl).get('/api/health').expect(200);
    expect(await countOf(`SELECT COUNT(*) FROM attachments WHERE setupId = ${setup.id}`)).toBe(0);
    expect(filesIn()).toEqual(filesBefore);
    expect((await machinist.get(`/api/setups/${setup.id}/attachments`).expect(200)).body).toEqual({ attachments: [] });

    // The same file sent whole goes in.
    const whole = await machinist.upload(setup.id, big, 'whole.png').expect(201);
    expect(whole.body).toMatchObject({ size: big.length, width: 400, height: 400 });
    expect(await countOf(`SELECT COUNT(*) FROM attachments WHERE setupId = ${setup.id}`)).toBe(1);
    expect(filesIn().filter((f) => !filesBefore.includes(f))).toHaveLength(2);
  });

  it('leaves no trigger behind in the test database', async () => {
    expect(await countOf(`SELECT COUNT(*) FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = '${db.config.db.name}'`)).toBe(0);
  });
});
