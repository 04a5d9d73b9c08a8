/**
 * Orphaned upload files (a crash between storing a file and committing its row, or in the middle
 * of a disk write) are removed by sweepOrphanUploads once older than the grace period; files an
 * attachment refers to, and young files of uploads still in flight, stay. Disk and S3 storage.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import type request from 'supertest';
import type { Sequelize } from 'sequelize';
import { loadConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { Attachment, initModels } from '../../server/models';
import { DiskStorage } from '../../server/services/storage/disk-storage';
import type { ObjectStorage } from '../../server/services/storage/object-storage';
import { S3Storage } from '../../server/services/storage/s3-storage';
import { scheduleUploadSweeps, sweepOrphanUploads } from '../../server/services/upload-sweep';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';
import { startFakeS3, type FakeS3 } from '../support/fake-s3';

jest.setTimeout(60_000);

const HOUR = 3_600_000;
const taper = { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' };
const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n', 'latin1');
let png: Buffer;
let m: Members;
let sequelize: Sequelize;
let base: string;

function binary(req: request.Test): request.Test {
  return req.buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (d: Buffer) => chunks.push(d));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
}

interface Uploaded {
  readonly setupId: number;
  readonly id: number;
  readonly bytes: Buffer;
  readonly storageKey: string;
  readonly thumbnailKey: string | null;
}

/** A set-up with a PNG (file and thumbnail) and a PDF (file only), uploaded through the API. */
async function uploadTwo(who: Client): Promise<[Uploaded, Uploaded]> {
  const setup = await who.agent.post('/api/setups').set('X-CSRF-Token', who.token).send({ name: 'Sweep holder', kind: 'taper', inputs: taper }).expect(201);
  const setupId = setup.body.id as number;
  const one = async (bytes: Buffer, filename: string, contentType: string): Promise<Uploaded> => {
    const res = await who.agent.post(`/api/setups/${setupId}/attachments`).set('X-CSRF-Token', who.token).attach('file', bytes, { filename, contentType }).expect(201);
    const row = await Attachment.findByPk(res.body.id as number);
    return { setupId, id: res.body.id as number, bytes, storageKey: row!.storageKey, thumbnailKey: row!.thumbnailKey };
  };
  return [await one(png, 'wedge.png', 'image/png'), await one(pdf, 'wedge.pdf', 'application/pdf')];
}

/** Each attachment still downloads byte for byte, and the PNG's thumbnail is still served. */
async function expectDownloads(who: Client, files: readonly Uploaded[]): Promise<void> {
  for (const f of files) {
    const dl = await binary(who.agent.get(`/api/setups/${f.setupId}/attachments/${f.id}`)).expect(200);
    expect(Buffer.compare(dl.body as Buffer, f.bytes)).toBe(0);
    if (f.thumbnailKey) await binary(who.agent.get(`/api/setups/${f.setupId}/attachments/${f.id}/thumbnail`)).expect(200);
  }
}

function allFiles(dir: string): string[] {
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
}

beforeAll(async () => {
  base = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-sweep-'));
  png = await sharp({ create: { width: 200, height: 120, channels: 3, background: { r: 40, g: 90, b: 160 } } }).png().toBuffer();
  sequelize = createSequelize(loadConfig().db);
  initModels(sequelize);
  m = await makeTeam('sweep');
});
afterAll(async () => {
  await sequelize.close();
  fs.rmSync(base, { recursive: true, force: true });
});

describe('orphaned upload files on disk', () => {
  let t: TestApp;
  let who: Client;
  let dir: string;
  beforeAll(async () => {
    dir = path.join(base, 'disk');
    t = openApp({ uploads: { ...loadConfig().uploads, driver: 'disk', dir } });
    who = await client(t.app, m.machinist);
  });
  afterAll(() => t.close());

  it('removes exactly the old orphans and stale temp files; referenced files and young orphans stay', async () => {
    const storage: ObjectStorage = new DiskStorage(dir);
    const [image, drawing] = await uploadTwo(who);
    const prefix = `teams/${m.team.id}/setups/${image.setupId}`;
    // A row whose thumbnail does not follow the "<key>-thumb" naming (as another writer might store
    // it); its main file is young (stored below), so only the thumbnail column refers to the old one.
    const oddKey = `${prefix}/${randomUUID()}`;
    const oddThumb = `${prefix}/${randomUUID()}-small`;
    await storage.put(oddThumb, png, 'image/jpeg');
    await Attachment.create({ teamId: m.team.id, setupId: image.setupId, storageKey: oddKey, thumbnailKey: oddThumb, fileName: 'odd.pdf', contentType: 'application/pdf', size: pdf.length, sha256: '0'.repeat(64), width: null, height: null, uploadedById: m.machinist.id });
    // Left by crashes: files stored but no row committed, and a disk write cut short.
    const oldOrphan = `${prefix}/${randomUUID()}`;
    const oldOrphanThumb = `${oldOrphan}-thumb`;
    const pdfThumbLookalike = `${drawing.storageKey}-thumb`; // the PDF's row has no thumbnail
    const oldTemp = `${prefix}/${randomUUID()}.0123456789ab.part`;
    for (const key of [oldOrphan, oldOrphanThumb, pdfThumbLookalike]) await storage.put(key, Buffer.from(`orphan ${key}`), 'application/pdf');
    fs.writeFileSync(path.join(dir, ...oldTemp.split('/')), 'half a file');
    // Everything so far is two hours old …
    const old = new Date(Date.now() - 2 * HOUR);
    for (const file of allFiles(dir)) fs.utimesSync(file, old, old);
    // … except an upload in flight: its file is stored, its row not yet committed.
    const freshOrphan = `${prefix}/${randomUUID()}`;
    const freshTemp = `${prefix}/${randomUUID()}.ba9876543210.part`;
    await storage.put(freshOrphan, Buffer.from('in flight'), 'application/pdf');
    fs.writeFileSync(path.join(dir, ...freshTemp.split('/')), 'being written');
    await storage.put(oddKey, pdf, 'application/pdf');

    const referenced = [image.storageKey, image.thumbnailKey!, drawing.storageKey, oddKey, oddThumb];
    expect(image.thumbnailKey).toBe(`${image.storageKey}-thumb`);
    expect(drawing.thumbnailKey).toBeNull();
    const before = (await storage.list('')).map((o) => o.key).sort();
    expect(before).toEqual([...referenced, oldOrphan, oldOrphanThumb, pdfThumbLookalike, oldTemp, freshOrphan, freshTemp].sort());

    const result = await sweepOrphanUploads({ sequelize, storage, olderThanMs: HOUR });
    expect(result.checked).toBe(before.length);
    expect([...result.removed].sort()).toEqual([oldOrphan, oldOrphanThumb, pdfThumbLookalike, oldTemp].sort());
    expect((await storage.list('')).map((o) => o.key).sort()).toEqual([...referenced, freshOrphan, freshTemp].sort());
    expect(fs.existsSync(path.join(dir, ...oldTemp.split('/')))).toBe(false);
    await expectDownloads(who, [image, drawing]);

    const again = await sweepOrphanUploads({ sequelize, storage, olderThanMs: HOUR });
    expect(again).toEqual({ checked: before.length - 4, removed: [] });

    // Once the in-flight upload is past the grace period it goes too (`now` moved on).
    const later = await sweepOrphanUploads({ sequelize, storage, olderThanMs: HOUR, now: new Date(Date.now() + 2 * HOUR) });
    expect([...later.removed].sort()).toEqual([freshOrphan, freshTemp].sort());
    await expectDownloads(who, [image, drawing]);
  });

  it('removes the folders its removals leave empty; folders with kept files stay', async () => {
    const storage: ObjectStorage = new DiskStorage(dir);
    const [image] = await uploadTwo(who);
    // Files of a set-up whose rows are all gone (no row refers to anything in its folder).
    const goneFolder = `teams/${m.team.id}/setups/${image.setupId + 100_000}`;
    const gone = [`${goneFolder}/${randomUUID()}`, `${goneFolder}/${randomUUID()}-thumb`];
    for (const key of gone) await storage.put(key, Buffer.from('orphan'), 'application/pdf');
    const old = new Date(Date.now() - 2 * HOUR);
    for (const key of gone) fs.utimesSync(path.join(dir, ...key.split('/')), old, old);

    const result = await sweepOrphanUploads({ sequelize, storage, olderThanMs: HOUR });
    expect([...result.removed].sort()).toEqual([...gone].sort());
    expect(fs.existsSync(path.join(dir, ...goneFolder.split('/')))).toBe(false);
    // The team's other set-up folders (with files still referred to) are where they were.
    expect(fs.existsSync(path.join(dir, ...image.storageKey.split('/')))).toBe(true);
    await expectDownloads(who, [image]);
  });

  it('keeps referenced files when they are far more than one lookup chunk (1,200 attachments)', async () => {
    const bulkDir = path.join(base, 'bulk');
    const storage: ObjectStorage = new DiskStorage(bulkDir);
    const setup = await who.agent.post('/api/setups').set('X-CSRF-Token', who.token).send({ name: 'Bulk holder', kind: 'taper', inputs: taper }).expect(201);
    const prefix = `teams/${m.team.id}/setups/${setup.body.id as number}`;
    const rows = Array.from({ length: 1_200 }, () => {
      const key = `${prefix}/${randomUUID()}`;
      return { teamId: m.team.id, setupId: setup.body.id as number, storageKey: key, thumbnailKey: `${key}-thumb`, fileName: 'bulk.png', contentType: 'image/png' as const, size: 3, sha256: '0'.repeat(64), width: 1, height: 1, uploadedById: m.machinist.id };
    });
    await Attachment.bulkCreate(rows);
    const orphans = Array.from({ length: 7 }, () => `${prefix}/${randomUUID()}`);
    const keys = [...rows.flatMap((r) => [r.storageKey, r.thumbnailKey]), ...orphans];
    for (const key of keys) await storage.put(key, Buffer.from('abc'), 'image/png');
    const started = Date.now();
    const result = await sweepOrphanUploads({ sequelize, storage, olderThanMs: HOUR, now: new Date(Date.now() + 2 * HOUR) });
    const ms = Date.now() - started;
    expect(result.checked).toBe(2_407);
    expect([...result.removed].sort()).toEqual([...orphans].sort());
    expect((await storage.list('')).length).toBe(2_400);
    expect(ms).toBeLessThan(15_000);
  });

  it('runs on a timer that logs a failure (database gone) instead of throwing, and sweeps when it can', async () => {
    const timerDir = path.join(base, 'timer');
    const storage: ObjectStorage = new DiskStorage(timerDir);
    const orphan = `teams/${m.team.id}/setups/1/${randomUUID()}`;
    await storage.put(orphan, Buffer.from('left behind'), 'application/pdf');
    const old = new Date(Date.now() - 2 * HOUR);
    fs.utimesSync(path.join(timerDir, ...orphan.split('/')), old, old);

    const closed = createSequelize(loadConfig().db);
    await closed.close();
    const lines: string[] = [];
    const failing = scheduleUploadSweeps({ sequelize: closed, storage, everyMs: 60_000, graceMs: HOUR, firstDelayMs: 10, log: (line) => lines.push(line) });
    for (let i = 0; i < 100 && lines.length === 0; i++) await new Promise((r) => setTimeout(r, 20));
    failing.stop();
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^Upload sweep failed \(will try again in 1 min\): /);
    expect(await storage.exists(orphan)).toBe(true);

    const working = scheduleUploadSweeps({ sequelize, storage, everyMs: 60_000, graceMs: HOUR, firstDelayMs: 10, log: (line) => lines.push(line) });
    for (let i = 0; i < 100 && (await storage.exists(orphan)); i++) await new Promise((r) => setTimeout(r, 20));
    working.stop();
    expect(await storage.exists(orphan)).toBe(false);
    expect(lines).toHaveLength(1);
  });

  it('refuses a grace period that is not a number of milliseconds', async () => {
    const storage: ObjectStorage = new DiskStorage(path.join(base, 'none'));
    for (const olderThanMs of [-1, Number.NaN, Number.POSITIVE_INFINITY]) {
      await expect(sweepOrphanUploads({ sequelize, storage, olderThanMs })).rejects.toThrow(/olderThanMs must be a number of milliseconds/);
    }
  });
});

describe('orphaned upload files in S3 storage (paged listing)', () => {
  const PAGE = 3;
  let s3: FakeS3;
  let t: TestApp;
  let who: Client;
  let storage: S3Storage;
  beforeAll(async () => {
    s3 = await startFakeS3('slantwise-sweep', { pageSize: PAGE });
    const settings = { endpoint: s3.endpoint, bucket: s3.bucket, region: 'us-east-1', accessKeyId: 'sweep-key', secretAccessKey: 'sweep-secret' };
    t = openApp({ uploads: { driver: 's3', dir: '/nonexistent', maxBytes: 1024 * 1024, s3: settings } });
    who = await client(t.app, m.machinist);
    storage = new S3Storage(settings);
  });
  afterAll(async () => {
    storage.close();
    await t.close();
    await s3.close();
  });

  it('lists every object across pages, and strips its own prefix leaving other names alone', async () => {
    const prefixed = new S3Storage({ endpoint: s3.endpoint, bucket: s3.bucket, region: 'us-east-1', accessKeyId: 'k', secretAccessKey: 's', prefix: 'slantwise' });
    try {
      const keys = Array.from({ length: 8 }, (_, i) => `teams/9/setups/${i}/${randomUUID()}`);
      for (const key of keys) await prefixed.put(key, Buffer.from(key), 'application/pdf');
      await storage.put('elsewhere/one', Buffer.from('not under the prefix'), 'text/plain');
      s3.objects.set('slantwise/Not-A-Key.txt', { body: Buffer.from('x'), contentType: 'text/plain', lastModified: new Date() });
      const lists = () => s3.requests.filter((r) => r.method === 'GET' && (r.path === `/${s3.bucket}` || r.path === `/${s3.bucket}/`)).length;
      const before = lists();
      const listed = await prefixed.list('');
      expect(listed.map((o) => o.key).sort()).toEqual([...keys].sort());
      expect(lists() - before).toBe(Math.ceil(9 / PAGE)); // 8 keys and the skipped name, 3 a page
      expect((await prefixed.list('teams/9/setups/3/')).map((o) => o.key)).toEqual([keys[3]]);
      const old = new Date('2026-03-04T05:06:07Z');
      s3.objects.get(`slantwise/${keys[0]}`)!.lastModified = old;
      expect((await prefixed.list(keys[0]!))[0]?.lastModified.toISOString()).toBe(old.toISOString());
    } finally {
      prefixed.close();
      s3.objects.clear();
    }
  });

  it('removes exactly the old orphans; referenced objects and a young orphan stay, downloads unchanged', async () => {
    const [image, drawing] = await uploadTwo(who);
    const prefix = `teams/${m.team.id}/setups/${image.setupId}`;
    const oldOrphans = [`${prefix}/${randomUUID()}`, `${prefix}/${randomUUID()}`, `${prefix}/${randomUUID()}-thumb`, `${drawing.storageKey}-thumb`, `teams/${m.team.id}/setups/999999/${randomUUID()}`];
    for (const key of oldOrphans) await storage.put(key, Buffer.from('orphan'), 'application/pdf');
    const old = new Date(Date.now() - 2 * HOUR);
    for (const object of s3.objects.values()) object.lastModified = old;
    const fresh = `${prefix}/${randomUUID()}`;
    await storage.put(fresh, Buffer.from('in flight'), 'application/pdf');
    const referenced = [image.storageKey, image.thumbnailKey!, drawing.storageKey];
    expect(s3.objects.size).toBe(referenced.length + oldOrphans.length + 1);
    expect(s3.objects.size).toBeGreaterThan(2 * PAGE);

    const result = await sweepOrphanUploads({ sequelize, storage, olderThanMs: HOUR });
    expect(result.checked).toBe(9);
    expect([...result.removed].sort()).toEqual([...oldOrphans].sort());
    expect([...s3.objects.keys()].sort()).toEqual([...referenced, fresh].sort());
    await expectDownloads(who, [image, drawing]);

    expect(await sweepOrphanUploads({ sequelize, storage, olderThanMs: HOUR })).toEqual({ checked: 4, removed: [] });
    expect([...s3.objects.keys()].sort()).toEqual([...referenced, fresh].sort());
  });
});

describe('UPLOAD_SWEEP_MINUTES and UPLOAD_SWEEP_GRACE_MINUTES', () => {
  it('sweeps every 60 minutes with 60 minutes of grace by default, and not at all under jest unless asked', () => {
    expect(loadConfig({}).uploadSweep).toEqual({ everyMs: HOUR, graceMs: HOUR });
    expect(loadConfig({ NODE_ENV: 'test' }).uploadSweep).toEqual({ everyMs: 0, graceMs: HOUR });
    expect(loadConfig({ NODE_ENV: 'test', UPLOAD_SWEEP_MINUTES: '5' }).uploadSweep.everyMs).toBe(5 * 60_000);
    expect(loadConfig({ UPLOAD_SWEEP_MINUTES: '0', UPLOAD_SWEEP_GRACE_MINUTES: '180' }).uploadSweep).toEqual({ everyMs: 0, graceMs: 3 * HOUR });
  });

  it.each([
    ['UPLOAD_SWEEP_MINUTES', '-1', 0, 10_080],
    ['UPLOAD_SWEEP_MINUTES', '1.5', 0, 10_080],
    ['UPLOAD_SWEEP_MINUTES', 'hourly', 0, 10_080],
    ['UPLOAD_SWEEP_MINUTES', '40000', 0, 10_080],
    ['UPLOAD_SWEEP_GRACE_MINUTES', '0', 1, 525_600],
    ['UPLOAD_SWEEP_GRACE_MINUTES', '1e3', 1, 525_600],
  ])('refuses %s=%s with a message naming the setting', (name, value, min, max) => {
    expect(() => loadConfig({ [name]: value })).toThrow(`${name} must be a whole number of minutes from ${min} to ${max} (got "${value}").`);
  });
});
