/**
 * Team export and import, round trip: a team with data of every kind is made through the API on
 * one instance, exported as an archive, imported with the command-line tool into a second, empty
 * instance (a MariaDB of its own), and every table and file is compared; then members sign in there.
 */
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import sharp from 'sharp';
import request from 'supertest';
import { createSequelize } from '../../server/db';
import { MAX_ATTEMPTS } from '../../shared/api/training';
import { startServer, type RunningServer } from '../../server/main';
import { DiskStorage } from '../../server/services/storage/disk-storage';
import { ImportInvalid, importTeamArchive } from '../../server/services/team-archive/team-import';
import { readTarGz } from '../../server/services/team-archive/tar-reader';
import { NOT_EXPORTED, TEAM_TABLES } from '../../server/services/team-archive/team-tables';
import { makeTeam, PASSWORD, type Members } from '../support/api';
import { isolatedDb, type IsolatedDb } from '../support/isolated-db';

type Row = Record<string, unknown>;

let source: IsolatedDb;
let target: IsolatedDb;
let a: RunningServer | null = null;
let b: RunningServer | null = null;
let m: Members;
let archive: Buffer;
let png: Buffer;
let sourceBoxId: number;
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-export-'));
const uploadsA = path.join(work, 'uploads-a');
const uploadsB = path.join(work, 'uploads-b');
const archiveFile = path.join(work, 'team.tar.gz');

/** A signed-in agent on a running instance, with its CSRF token. */
async function signIn(url: string, email: string) {
  const agent = request.agent(url);
  const csrf = await agent.get('/api/auth/csrf').expect(200);
  const token = csrf.body.token as string;
  await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email, password: PASSWORD }).expect(200);
  return {
    agent,
    post: (p: string, body: object = {}) => agent.post(p).set('X-CSRF-Token', token).send(body),
    put: (p: string, body: object) => agent.put(p).set('X-CSRF-Token', token).send(body),
    patch: (p: string, body: object) => agent.patch(p).set('X-CSRF-Token', token).send(body),
    del: (p: string) => agent.delete(p).set('X-CSRF-Token', token),
    upload: (p: string, bytes: Buffer, name: string, type: string) => agent.post(p).set('X-CSRF-Token', token).attach('file', bytes, { filename: name, contentType: type }),
  };
}

function binary(res: request.Response, done: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

/** Every file under a folder, relative paths. */
function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return (fs.readdirSync(dir, { recursive: true }) as string[]).filter((f) => fs.statSync(path.join(dir, f)).isFile()).sort();
}

function sha(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Runs the import tool against the target instance. */
function importTool(file: string): Promise<{ code: number | null; out: string }> {
  const db = target.config.db;
  const env = { ...process.env, DB_HOST: db.host, DB_PORT: String(db.port), DB_NAME: db.name, DB_USER: db.user, DB_PASSWORD: db.password, STORAGE_DRIVER: 'disk', UPLOAD_DIR: uploadsB };
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/import-team.ts', file], { env, cwd: path.resolve(__dirname, '../..') });
    let out = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.stderr.on('data', (d: Buffer) => (out += d.toString()));
    child.on('close', (code) => resolve({ code, out }));
  });
}

async function rows(sequelize: Sequelize, table: string): Promise<Row[]> {
  return sequelize.query<Row>(`SELECT * FROM \`${table}\` ORDER BY id`, { type: QueryTypes.SELECT });
}

/** Foreign keys as the database itself declares them: table → column → referenced table. */
async function foreignKeys(sequelize: Sequelize, schema: string): Promise<Map<string, Map<string, string>>> {
  const found = await sequelize.query<{ t: string; c: string; r: string }>(
    'SELECT TABLE_NAME AS t, COLUMN_NAME AS c, REFERENCED_TABLE_NAME AS r FROM information_schema.KEY_COLUMN_USAGE WHERE TABLE_SCHEMA = ? AND REFERENCED_TABLE_NAME IS NOT NULL',
    { replacements: [schema], type: QueryTypes.SELECT },
  );
  const out = new Map<string, Map<string, string>>();
  for (const f of found) out.set(f.t, (out.get(f.t) ?? new Map<string, string>()).set(f.c, f.r));
  return out;
}

/**
 * Every exported table with ids replaced by each row's position in its table and foreign keys by
 * the position of the row they point at, storage keys by the stored file's SHA-256, dates as ISO text.
 */
async function comparable(sequelize: Sequelize, schema: string, uploads: string): Promise<Record<string, Row[]>> {
  const fks = await foreignKeys(sequelize, schema);
  const all: Record<string, Row[]> = {};
  for (const { table } of TEAM_TABLES) all[table] = await rows(sequelize, table);
  const position = (table: string, id: unknown) => (id === null ? null : all[table]!.findIndex((r) => r['id'] === id));
  const out: Record<string, Row[]> = {};
  for (const { table } of TEAM_TABLES) {
    out[table] = all[table]!.map((row) => {
      const copy: Row = {};
      for (const [column, value] of Object.entries(row)) {
        const ref = fks.get(table)?.get(column);
        if (column === 'id') copy[column] = position(table, value);
        else if (ref) copy[column] = position(ref, value);
        else if ((table === 'setups' && column === 'inputs') || (table === 'setup_revisions' && (column === 'snapshot' || column === 'changes'))) {
          // Boxes named in inputs by their id, as the position of the box.
          copy[column] = String(value).replace(/box:(\d+)/g, (_m, n: string) => `box:#${position('inventory_sets', Number(n))}`);
        } else if (table === 'attachments' && (column === 'storageKey' || column === 'thumbnailKey')) {
          copy[column] = value === null ? null : sha(fs.readFileSync(path.join(uploads, ...String(value).split('/'))));
        } else if (value instanceof Date) copy[column] = value.toISOString();
        else copy[column] = value;
      }
      return copy;
    });
  }
  return out;
}

beforeAll(async () => {
  [source, target] = await Promise.all([isolatedDb(), isolatedDb()]);
  a = await startServer({ ...source.config, port: 0, uploads: { ...source.config.uploads, driver: 'disk', dir: uploadsA } });
  m = await makeTeam('export');

  const lead = await signIn(a.url, m.lead.email);
  const admin = await signIn(a.url, m.admin.email);
  const machinist = await signIn(a.url, m.machinist.email);
  const apprentice = await signIn(a.url, m.apprentice.email);
  const checks = [{ key: 'end-thickness', label: 'End thickness', unit: 'in', nominal: '0.5854', plus: '0.0010', minus: '0.0010' }];
  const wedge = await lead.post('/api/setups', { name: 'Wedge, 7.5° face', kind: 'taper', job: 'KL-2291', notes: 'Clamp on the parallel; «deburr» after.', inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' }, checks }).expect(201);
  const id = wedge.body.id as number;
  await lead.put(`/api/setups/${id}`, { name: 'Wedge, 7.5° face', kind: 'taper', notes: 'Clamp on the parallel; deburr after.', inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' }, checks, version: 1 }).expect(200);
  png = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 200, g: 90, b: 30 } } }).png().toBuffer();
  await lead.upload(`/api/setups/${id}/attachments`, png, 'fixture photo.png', 'image/png').expect(201);
  const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n', 'latin1');
  await lead.upload(`/api/setups/${id}/attachments`, pdf, 'drawing.pdf', 'application/pdf').expect(201);
  // Released with its files (a file added to a released set-up makes it a draft again).
  await lead.post(`/api/setups/${id}/release`).expect(200);
  await machinist.post('/api/setups', { name: 'Sine bar draft', kind: 'sine-bar', inputs: { unit: 'in', barLength: '5', angle: '12' } }).expect(201);
  const old = await lead.post('/api/setups', { name: 'Old fixture', kind: 'angle-blocks', inputs: {} }).expect(201);
  await lead.post(`/api/setups/${old.body.id}/archive`).expect(200);

  const gauge = await admin.post('/api/inventories/gauge-sets', { name: 'Inch set, tool crib', standardSet: 'inch-81', grade: '0', notes: 'Wring with care.' }).expect(201);
  await admin.patch(`/api/inventories/gauge-sets/${gauge.body.id}/blocks/${gauge.body.blocks[3].id}`, { missing: 1, note: 'lost 2026-11' }).expect(200);
  await admin.post('/api/inventories/angle-sets', { name: 'Angle blocks', standardSet: 'angle-13-npl' }).expect(201);
  // A set-up naming the team's own box ("box:<id>"), first saved with a standard set: its inputs,
  // its revision's snapshot and the revision's change of set all name the box.
  const boxInputs = { mode: 'angle', unit: 'in', barLength: '5', angle: '12', set: 'inch-81' };
  const boxed = await lead.post('/api/setups', { name: 'Sine bar on the crib box', kind: 'sine-bar', inputs: boxInputs }).expect(201);
  await lead.put(`/api/setups/${boxed.body.id}`, { name: 'Sine bar on the crib box', kind: 'sine-bar', inputs: { ...boxInputs, set: `box:${gauge.body.id}` }, version: 1 }).expect(200);
  sourceBoxId = gauge.body.id as number;

  const run = await machinist.post('/api/batches', { setupId: id, partCount: 3, label: 'KL-2291 lot 1' }).expect(201);
  await machinist.post(`/api/batches/${run.body.id}/parts`, { values: { 'end-thickness': '0.5856' }, touchOff: '0.1000', note: 'first part' }).expect(201);
  await machinist.post(`/api/batches/${run.body.id}/parts`, { values: { 'end-thickness': '0.5880' } }).expect(201);
  // A corrected part: who corrected it and the readings as first recorded go along.
  const loaded = (await lead.agent.get(`/api/batches/${run.body.id}`).expect(200)).body as { parts: Array<{ partNo: number; revision: string }> };
  const revision = loaded.parts.find((p) => p.partNo === 2)!.revision;
  await lead.put(`/api/batches/${run.body.id}/parts/2`, { values: { 'end-thickness': '0.5858' }, revision }).expect(200);
  await lead.post(`/api/batches/${run.body.id}/close`).expect(200);

  const assignment = await lead.post('/api/training/assignments', { title: 'Sine stacks', instructions: 'Show your working.', items: [{ type: 'sine-stack', count: 2 }], dueAt: '2030-01-01T12:00:00Z', assigneeIds: [m.apprentice.id] }).expect(201);
  await apprentice.agent.get(`/api/training/assignments/${assignment.body.id}/work`).expect(200);
  await apprentice.post(`/api/training/assignments/${assignment.body.id}/problems/1/hints`).expect(200);
  await apprentice.post(`/api/training/assignments/${assignment.body.id}/problems/1/attempts`, { answer: '1.2345' }).expect(201);
  // Problem 1 closed out of attempts and graded by hand: who graded it goes along.
  for (let i = 1; i < MAX_ATTEMPTS; i++) await apprentice.post(`/api/training/assignments/${assignment.body.id}/problems/1/attempts`, { answer: '1.2345' }).expect(201);
  await lead.post(`/api/training/assignments/${assignment.body.id}/work/${m.apprentice.id}/problems/1/grade`, { correct: true, note: 'Right in inches; the box asked for mm.' }).expect(200);

  await admin.post('/api/team/invitations', { email: `pending.${m.team.id}@example.test`, role: 'machinist' }).expect(201);
  const revoked = await admin.post('/api/team/invitations', { email: `revoked.${m.team.id}@example.test`, role: 'apprentice' }).expect(201);
  await admin.del(`/api/team/invitations/${revoked.body.invitation.id}`).expect(204);
  await admin.patch(`/api/team/members/${m.other.id}`, { active: false }).expect(200);
  const anon = request.agent(a.url);
  const csrf = await anon.get('/api/auth/csrf').expect(200);
  await anon.post('/api/access/password-reset').set('X-CSRF-Token', csrf.body.token).send({ email: m.machinist.email }).expect((res) => expect(res.status).toBeLessThan(300));

  const res = await admin.agent.get('/api/team/export').buffer(true).parse(binary).expect(200);
  expect(res.headers['content-type']).toMatch(/application\/gzip/);
  expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?slantwise-team-\d+-\d{4}-\d\d-\d\d\.tar\.gz"?$/);
  archive = res.body as Buffer;
  fs.writeFileSync(archiveFile, archive);
}, 180_000);

afterAll(async () => {
  await a?.close();
  await b?.close();
  await source?.destroy();
  await target?.destroy();
  fs.rmSync(work, { recursive: true, force: true });
});

describe('team export and import', () => {
  it('exports team.json and every file and thumbnail, without secrets of sessions or links', async () => {
    const entries = readTarGz(archive);
    const names = entries.map((e) => e.name);
    expect(names).toContain('team.json');
    const manifest = JSON.parse(entries.find((e) => e.name === 'team.json')!.body.toString('utf8'));
    expect(manifest.format).toBe('slantwise.team-archive/1');
    expect(manifest.tables.users).toHaveLength(5);
    expect(manifest.tables.users.every((u: Row) => typeof u['passwordHash'] === 'string' && String(u['passwordHash']).startsWith('$2'))).toBe(true);
    expect(manifest.tables.invitations.every((i: Row) => !('tokenHash' in i))).toBe(true);
    expect(Object.keys(manifest.tables).filter((t) => t in NOT_EXPORTED)).toEqual([]);
    // No session id, reset-token hash or invitation-token hash of the source appears anywhere in team.json.
    const text = entries.find((e) => e.name === 'team.json')!.body.toString('utf8');
    const sequelize = createSequelize(source.config.db);
    try {
      const secrets = [
        ...(await sequelize.query<{ v: string }>('SELECT sid AS v FROM sessions UNION ALL SELECT tokenHash FROM password_resets UNION ALL SELECT tokenHash FROM invitations', { type: QueryTypes.SELECT })).map((r) => r.v),
      ];
      expect(secrets.length).toBeGreaterThanOrEqual(7);
      expect(secrets.filter((secret) => text.includes(secret))).toEqual([]);
    } finally {
      await sequelize.close();
    }
    // Two attachments: the PNG with its thumbnail, the PDF without one.
    expect(names.filter((n) => n.startsWith('files/'))).toHaveLength(3);
    const stored = entries.find((e) => e.body.equals(png));
    expect(stored?.name).toMatch(/^files\/teams\/\d+\/setups\/\d+\/[0-9a-f-]{36}$/);
  });

  it('checks that every table of the schema is either exported or deliberately left out', async () => {
    const sequelize = createSequelize(source.config.db);
    try {
      const tables = (await sequelize.query<{ t: string }>('SELECT TABLE_NAME AS t FROM information_schema.TABLES WHERE TABLE_SCHEMA = ?', { replacements: [source.config.db.name], type: QueryTypes.SELECT })).map((r) => r.t).sort();
      const covered = [...TEAM_TABLES.map((t) => t.table), ...Object.keys(NOT_EXPORTED)].sort();
      expect(tables).toEqual(covered);
    } finally {
      await sequelize.close();
    }
  });

  it('refuses a damaged archive and leaves the empty instance untouched', async () => {
    const sequelize = createSequelize(target.config.db);
    try {
      await expect(importTeamArchive(sequelize, new DiskStorage(uploadsB), archive.subarray(0, archive.length - 200))).rejects.toBeInstanceOf(ImportInvalid);
      await expect(importTeamArchive(sequelize, new DiskStorage(uploadsB), Buffer.from('not an archive'))).rejects.toThrow(/not a gzip-compressed archive/);
      expect(await rows(sequelize, 'teams')).toEqual([]);
      expect(filesUnder(uploadsB)).toEqual([]);
    } finally {
      await sequelize.close();
    }
  });

  it('rolls every row back and removes the files already written when storage fails half-way', async () => {
    const sequelize = createSequelize(target.config.db);
    class FullDisk extends DiskStorage {
      puts = 0;
      override async put(key: string, body: Buffer): Promise<void> {
        if (++this.puts === 3) throw new Error('Storage: disk full (test)');
        await super.put(key, body);
      }
    }
    try {
      const storage = new FullDisk(uploadsB);
      await expect(importTeamArchive(sequelize, storage, archive)).rejects.toThrow(/disk full/);
      expect(storage.puts).toBe(3);
      for (const { table } of TEAM_TABLES) expect(await rows(sequelize, table)).toEqual([]);
      expect(filesUnder(uploadsB)).toEqual([]);
    } finally {
      await sequelize.close();
    }
  });

  it('imports into the empty instance with the command-line tool: same rows, same files', async () => {
    // Boxes get ids here that they did not have at the source, so a box named by the old id would show.
    const bump = createSequelize(target.config.db);
    try {
      await bump.query(`ALTER TABLE inventory_sets AUTO_INCREMENT = ${sourceBoxId + 500}`);
    } finally {
      await bump.close();
    }
    const result = await importTool(archiveFile);
    expect(result.out).toMatch(/Imported team "Test shop export-/);
    expect(result.code).toBe(0);

    const one = createSequelize(source.config.db);
    const two = createSequelize(target.config.db);
    try {
      const before = await comparable(one, source.config.db.name, uploadsA);
      const after = await comparable(two, target.config.db.name, uploadsB);
      // Open invitations come back revoked (their links cannot work on another instance); the rest is identical.
      const pendingBefore = before['invitations']!.filter((i) => i['acceptedAt'] === null && i['revokedAt'] === null);
      expect(pendingBefore).toHaveLength(1);
      for (const inv of after['invitations']!) expect(inv['revokedAt']).not.toBeNull();
      for (const list of [before, after]) for (const inv of list['invitations']!) {
        delete inv['revokedAt'];
        delete inv['tokenHash'];
      }
      for (const { table } of TEAM_TABLES) {
        expect({ table, rows: after[table] }).toEqual({ table, rows: before[table] });
        expect(after[table]!.length).toBeGreaterThan(0);
      }
      // The stored files are byte for byte those uploaded: the checksum of each equals its row's.
      for (const att of after['attachments']!) expect(att['storageKey']).toBe(att['sha256']);
      expect(filesUnder(uploadsB)).toHaveLength(3);
      // No sign-ins, reset links or caught mails travel with the data.
      for (const table of ['sessions', 'password_resets', 'captured_mails']) expect(await two.query(`SELECT * FROM \`${table}\``, { type: QueryTypes.SELECT })).toEqual([]);
      expect(await one.query('SELECT * FROM password_resets', { type: QueryTypes.SELECT })).toHaveLength(1);
    } finally {
      await one.close();
      await two.close();
    }
  }, 60_000);

  it('lets members sign in on the imported instance and serves their files', async () => {
    await a?.close();
    a = null;
    b = await startServer({ ...target.config, port: 0, uploads: { ...target.config.uploads, driver: 'disk', dir: uploadsB } });
    const lead = await signIn(b.url, m.lead.email);
    const list = await lead.agent.get('/api/setups?sort=name').expect(200);
    expect(list.body.setups.map((s: { name: string }) => s.name)).toEqual(['Old fixture', 'Sine bar draft', 'Sine bar on the crib box', 'Wedge, 7.5° face']);
    // The set-up names the imported box by its new id.
    const boxes = await lead.agent.get('/api/inventories').expect(200);
    const crib = boxes.body.gaugeSets.find((g: { name: string }) => g.name === 'Inch set, tool crib');
    expect(crib.id).not.toBe(sourceBoxId);
    const boxed = await lead.agent.get(`/api/setups/${list.body.setups.find((s: { name: string }) => s.name === 'Sine bar on the crib box').id}`).expect(200);
    expect(boxed.body.inputs.set).toBe(`box:${crib.id}`);
    const history = await lead.agent.get(`/api/setups/${boxed.body.id}/revisions`).expect(200);
    expect(JSON.stringify(history.body.revisions)).not.toContain(`box:${sourceBoxId}"`);
    expect(history.body.revisions[0].changes).toContainEqual(expect.objectContaining({ field: 'inputs.set', from: 'inch-81', to: `box:${crib.id}` }));
    const wedge = list.body.setups.find((s: { name: string }) => s.name.startsWith('Wedge'));
    expect(wedge).toMatchObject({ status: 'released', version: 3, job: 'KL-2291', ownerName: m.lead.name });
    const files = await lead.agent.get(`/api/setups/${wedge.id}/attachments`).expect(200);
    const photo = files.body.attachments.find((f: { fileName: string }) => f.fileName === 'fixture photo.png');
    const download = await lead.agent.get(`/api/setups/${wedge.id}/attachments/${photo.id}`).buffer(true).parse(binary).expect(200);
    expect((download.body as Buffer).equals(png)).toBe(true);
    await lead.agent.get(`/api/setups/${wedge.id}/attachments/${photo.id}/thumbnail`).expect(200);
    const revisions = await lead.agent.get(`/api/setups/${wedge.id}/revisions`).expect(200);
    expect(revisions.body.revisions.map((r: { action: string }) => r.action)).toEqual(['released', 'attached', 'attached', 'edited', 'created']);
    // The deactivated member stays deactivated.
    const csrf = await request(b.url).get('/api/auth/csrf').expect(200);
    const cookie = String(csrf.headers['set-cookie']).split(';')[0]!;
    await request(b.url).post('/api/auth/login').set('Cookie', cookie).set('X-CSRF-Token', csrf.body.token).send({ email: m.other.email, password: PASSWORD }).expect(401);
  });

  it('refuses a second import into the now non-empty instance (exit code 2)', async () => {
    const result = await importTool(archiveFile);
    expect(result.code).toBe(2);
    expect(result.out).toMatch(/already holds 1 team\(s\).*empty instance/);
  });
});
