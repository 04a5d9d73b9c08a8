import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { loadConfig } from '../../server/config';
import { Attachment } from '../../server/models';
import { ObjectNotFound } from '../../server/services/storage/object-storage';
import { S3Storage } from '../../server/services/storage/s3-storage';
import { client, makeTeam, openApp, type Client, type Members, type TestApp } from '../support/api';
import { startFakeS3, type FakeS3 } from '../support/fake-s3';

jest.setTimeout(30_000);

const LIMIT = 64 * 1024;
let t: TestApp;
let m: Members;
let foreign: Members;
const c = {} as Record<'admin' | 'lead' | 'machinist' | 'apprentice' | 'other' | 'foreign', Client>;
const taper = { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250' };
let png: Buffer;
let jpeg: Buffer;
const pdf = Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n', 'latin1');

function binary(req: request.Test): request.Test {
  return req.buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (d: Buffer) => chunks.push(d));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
}

beforeAll(async () => {
  t = openApp({ uploads: { ...loadConfig().uploads, maxBytes: LIMIT } });
  m = await makeTeam('uploads');
  foreign = await makeTeam('uploads-foreign');
  for (const role of ['admin', 'lead', 'machinist', 'apprentice', 'other'] as const) c[role] = await client(t.app, m[role]);
  c.foreign = await client(t.app, foreign.lead);
  png = await sharp({ create: { width: 640, height: 400, channels: 3, background: { r: 30, g: 110, b: 140 } } }).png().toBuffer();
  jpeg = await sharp({ create: { width: 300, height: 500, channels: 3, background: { r: 200, g: 120, b: 40 } } }).jpeg().toBuffer();
});
afterAll(() => t.close());

async function newSetup(who: Client, name = 'Drawing holder'): Promise<number> {
  const res = await who.agent.post('/api/setups').set('X-CSRF-Token', who.token).send({ name, kind: 'taper', inputs: taper }).expect(201);
  return res.body.id as number;
}
function upload(who: Client, setupId: number, bytes: Buffer, filename: string, contentType: string, field = 'file') {
  return who.agent.post(`/api/setups/${setupId}/attachments`).set('X-CSRF-Token', who.token).attach(field, bytes, { filename, contentType });
}

describe('set-up attachments (disk storage)', () => {
  it('should store a PNG with its checksum, size in pixels and a thumbnail', async () => {
    const id = await newSetup(c.machinist);
    const res = await upload(c.machinist, id, png, 'wedge drawing.png', 'image/png').expect(201);
    expect(res.body).toMatchObject({
      setupId: id, fileName: 'wedge drawing.png', contentType: 'image/png', size: png.length, width: 640, height: 400, hasThumbnail: true,
      sha256: createHash('sha256').update(png).digest('hex'), uploadedByName: m.machinist.name,
    });
    const thumb = await binary(c.machinist.agent.get(`/api/setups/${id}/attachments/${res.body.id}/thumbnail`)).expect(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect(meta).toMatchObject({ format: 'jpeg', width: 320, height: 200 });
    const list = await c.machinist.agent.get(`/api/setups/${id}/attachments`).expect(200);
    expect(list.body.attachments.map((a: { id: number }) => a.id)).toEqual([res.body.id]);
  });

  it('should serve the download with its content type, file name and the same bytes', async () => {
    const id = await newSetup(c.machinist);
    const up = await upload(c.machinist, id, jpeg, 'photo of set-up.jpg', 'image/jpeg').expect(201);
    const res = await binary(c.machinist.agent.get(`/api/setups/${id}/attachments/${up.body.id}`)).expect(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
    expect(res.headers['content-disposition']).toBe('attachment; filename="photo of set-up.jpg"');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(res.body as Buffer, jpeg)).toBe(0);
    const inline = await binary(c.machinist.agent.get(`/api/setups/${id}/attachments/${up.body.id}?inline=1`)).expect(200);
    expect(inline.headers['content-disposition']).toMatch(/^inline; filename=/);
  });

  it('should take a PDF drawing without a thumbnail', async () => {
    const id = await newSetup(c.machinist);
    const res = await upload(c.machinist, id, pdf, 'drawing.pdf', 'application/pdf').expect(201);
    expect(res.body).toMatchObject({ contentType: 'application/pdf', hasThumbnail: false, width: null });
    await c.machinist.agent.get(`/api/setups/${id}/attachments/${res.body.id}/thumbnail`).expect(404);
    const dl = await binary(c.machinist.agent.get(`/api/setups/${id}/attachments/${res.body.id}`)).expect(200);
    expect(dl.headers['content-type']).toBe('application/pdf');
  });

  it('should refuse a file of another type with 415, whatever its name and declared type say', async () => {
    const id = await newSetup(c.machinist);
    const before = await Attachment.count();
    const text = await upload(c.machinist, id, Buffer.from('just some notes'), 'notes.png', 'image/png').expect(415);
    expect(text.body.error).toMatch(/PDF, PNG and JPEG/);
    expect(text.body.fields.file).toBeDefined();
    await upload(c.machinist, id, Buffer.from('<html><script>alert(1)</script></html>'), 'drawing.pdf', 'application/pdf').expect(415);
    await upload(c.machinist, id, Buffer.from('GIF89a\x01\x00\x01\x00', 'latin1'), 'tiny.gif', 'image/gif').expect(415);
    expect(await Attachment.count()).toBe(before);
  });

  it('should refuse disguised content: an image header over garbage, a PDF without its end', async () => {
    const id = await newSetup(c.machinist);
    const fakePng = Buffer.concat([png.subarray(0, 8), Buffer.from('this is not image data at all, only text pretending')]);
    const res = await upload(c.machinist, id, fakePng, 'fake.png', 'image/png').expect(415);
    expect(res.body.error).toMatch(/cannot be read/);
    await upload(c.machinist, id, pdf.subarray(0, 30), 'cut.pdf', 'application/pdf').expect(415);
    await upload(c.machinist, id, png, 'really-a-png.jpg', 'image/jpeg').expect(201).then((r) => expect(r.body.contentType).toBe('image/png'));
  });

  it('should give a file whose name hides its content the ending of what it is', async () => {
    const id = await newSetup(c.machinist);
    const exe = await upload(c.machinist, id, pdf, 'x.exe', 'application/octet-stream').expect(201);
    expect(exe.body).toMatchObject({ fileName: 'x.exe.pdf', contentType: 'application/pdf' });
    const dl = await binary(c.machinist.agent.get(`/api/setups/${id}/attachments/${exe.body.id}`)).expect(200);
    expect(dl.headers['content-disposition']).toMatch(/filename="?x\.exe\.pdf"?/);
    await upload(c.machinist, id, png, 'really-a-png.jpg', 'image/jpeg').expect(201).then((r) => expect(r.body.fileName).toBe('really-a-png.jpg.png'));
    // A right ending in any case is kept as it is, and a long name stays within 200 characters.
    await upload(c.machinist, id, pdf, 'Drawing.PDF', 'application/pdf').expect(201).then((r) => expect(r.body.fileName).toBe('Drawing.PDF'));
    const long = await upload(c.machinist, id, png, `${'N'.repeat(300)}.gif`, 'image/gif').expect(201);
    expect(long.body.fileName).toHaveLength(200);
    expect(long.body.fileName).toMatch(/N\.gif\.png$/);
  });

  it('should refuse a file over the size limit with 413 and a clear message', async () => {
    const id = await newSetup(c.machinist);
    const big = Buffer.concat([pdf.subarray(0, 9), Buffer.alloc(LIMIT + 10, 0x20), Buffer.from('%%EOF')]);
    const res = await upload(c.machinist, id, big, 'huge.pdf', 'application/pdf').expect(413);
    expect(res.body.error).toBe('The file is larger than the 64 KB limit.');
    expect(await Attachment.count({ where: { setupId: id } })).toBe(0);
  });

  it('should answer 400 without a file or with the file in another field', async () => {
    const id = await newSetup(c.machinist);
    const none = await c.machinist.agent.post(`/api/setups/${id}/attachments`).set('X-CSRF-Token', c.machinist.token).field('caption', 'x').expect(400);
    expect(none.body.fields.file).toBeDefined();
    await upload(c.machinist, id, png, 'a.png', 'image/png', 'drawing').expect(400);
  });

  it('should keep user file names off the file system', async () => {
    const id = await newSetup(c.machinist);
    const res = await upload(c.machinist, id, png, '../../../etc/evil name.png', 'image/png').expect(201);
    expect(res.body.fileName).toBe('evil name.png');
    const row = await Attachment.findByPk(res.body.id);
    expect(row?.storageKey).toMatch(new RegExp(`^teams/${m.team.id}/setups/${id}/[0-9a-f-]{36}$`));
    const dir = path.resolve(t.config.uploads.dir, 'teams', String(m.team.id), 'setups', String(id));
    expect(fs.readdirSync(dir).sort()).toEqual([path.basename(row!.storageKey), `${path.basename(row!.storageKey)}-thumb`].sort());
  });

  it('should apply the set-up\'s access rules to uploads and downloads', async () => {
    const draft = await newSetup(c.machinist, 'Private draft');
    const up = await upload(c.machinist, draft, png, 'p.png', 'image/png').expect(201);
    await c.other.agent.get(`/api/setups/${draft}/attachments/${up.body.id}`).expect(404);
    await c.foreign.agent.get(`/api/setups/${draft}/attachments/${up.body.id}`).expect(404);
    await c.lead.agent.get(`/api/setups/${draft}/attachments/${up.body.id}`).expect(200);
    await c.lead.agent.post(`/api/setups/${draft}/release`).set('X-CSRF-Token', c.lead.token).expect(200);
    await c.other.agent.get(`/api/setups/${draft}/attachments/${up.body.id}`).expect(200);
    await upload(c.apprentice, draft, png, 'a.png', 'image/png').expect(403);
    await upload(c.other, draft, png, 'o.png', 'image/png').expect(403);
    await c.other.agent.delete(`/api/setups/${draft}/attachments/${up.body.id}`).set('X-CSRF-Token', c.other.token).expect(403);
    await request(t.app).get(`/api/setups/${draft}/attachments/${up.body.id}`).expect(401);
    await c.machinist.agent.get(`/api/setups/${draft}/attachments/999999`).expect(404);
  });

  it('should delete the row and the stored files', async () => {
    const id = await newSetup(c.machinist);
    const up = await upload(c.machinist, id, png, 'gone.png', 'image/png').expect(201);
    const row = await Attachment.findByPk(up.body.id);
    const file = path.resolve(t.config.uploads.dir, ...row!.storageKey.split('/'));
    expect(fs.existsSync(file)).toBe(true);
    await c.machinist.agent.delete(`/api/setups/${id}/attachments/${up.body.id}`).set('X-CSRF-Token', c.machinist.token).expect(204);
    expect(fs.existsSync(file)).toBe(false);
    expect(fs.existsSync(`${file}-thumb`)).toBe(false);
    await c.machinist.agent.get(`/api/setups/${id}/attachments/${up.body.id}`).expect(404);
    const revs = await c.machinist.agent.get(`/api/setups/${id}/revisions`).expect(200);
    expect(revs.body.revisions.map((r: { action: string }) => r.action)).toEqual(['detached', 'attached', 'created']);
  });

  it('should make a released set-up a draft again when its files change, with a new version a stale edit cannot overwrite', async () => {
    const id = await newSetup(c.machinist, 'Released with a drawing');
    const first = await upload(c.machinist, id, png, 'first.png', 'image/png').expect(201);
    const draftVersion = (await c.machinist.agent.get(`/api/setups/${id}`).expect(200)).body.version as number;
    // A file on a draft changes nothing else.
    expect((await c.machinist.agent.get(`/api/setups/${id}`).expect(200)).body).toMatchObject({ status: 'draft', version: draftVersion });
    const released = await c.lead.agent.post(`/api/setups/${id}/release`).set('X-CSRF-Token', c.lead.token).expect(200);
    expect(released.body.status).toBe('released');
    const v = released.body.version as number;

    await upload(c.machinist, id, pdf, 'second.pdf', 'application/pdf').expect(201);
    const afterAttach = (await c.machinist.agent.get(`/api/setups/${id}`).expect(200)).body;
    expect(afterAttach).toMatchObject({ status: 'draft', version: v + 1, releasedAt: null });
    // An edit based on the released version is now stale.
    await c.machinist.agent.put(`/api/setups/${id}`).set('X-CSRF-Token', c.machinist.token).send({ name: 'Renamed', kind: 'taper', inputs: taper, version: v }).expect(409);
    const revs = (await c.machinist.agent.get(`/api/setups/${id}/revisions`).expect(200)).body.revisions as Array<{ action: string; status: string; changes: Array<{ field: string; from: string; to: string }> }>;
    expect(revs[0]).toMatchObject({ action: 'attached', status: 'draft' });
    // The entry lists the files before and after, so the version's files can be read from it.
    expect(revs[0]!.changes).toEqual([{ field: 'attachments', from: 'first.png', to: 'first.png, second.pdf' }, { field: 'status', from: 'released', to: 'draft' }]);

    // Removing a file from a released set-up does the same, a lead's removal too.
    const again = await c.lead.agent.post(`/api/setups/${id}/release`).set('X-CSRF-Token', c.lead.token).expect(200);
    await c.lead.agent.delete(`/api/setups/${id}/attachments/${first.body.id}`).set('X-CSRF-Token', c.lead.token).expect(204);
    expect((await c.lead.agent.get(`/api/setups/${id}`).expect(200)).body).toMatchObject({ status: 'draft', version: (again.body.version as number) + 1 });
    const removed = (await c.lead.agent.get(`/api/setups/${id}/revisions`).expect(200)).body.revisions[0];
    expect(removed).toMatchObject({ action: 'detached', changes: [{ field: 'attachments', from: 'first.png, second.pdf', to: 'second.pdf' }, { field: 'status', from: 'released', to: 'draft' }] });
    // No batch can start on it until it is released again.
    const refused = await c.lead.agent.post('/api/batches').set('X-CSRF-Token', c.lead.token).send({ setupId: id, partCount: 2 }).expect(409);
    expect(refused.body.error).toContain('Only a released set-up can be run');
  });
});

describe('S3 storage adapter against a local fake', () => {
  let s3: FakeS3;
  let storage: S3Storage;
  beforeAll(async () => {
    s3 = await startFakeS3();
    storage = new S3Storage({ endpoint: s3.endpoint, bucket: s3.bucket, region: 'us-east-1', accessKeyId: 'test-key', secretAccessKey: 'test-secret', prefix: 'slantwise' });
  });
  afterAll(async () => {
    storage.close();
    await s3.close();
  });

  it('should put, head, get and delete objects path-style with signed requests', async () => {
    await storage.put('teams/1/setups/2/abc', png, 'image/png');
    expect(s3.objects.get('slantwise/teams/1/setups/2/abc')).toMatchObject({ contentType: 'image/png' });
    expect(await storage.exists('teams/1/setups/2/abc')).toBe(true);
    expect(Buffer.compare(await storage.get('teams/1/setups/2/abc'), png)).toBe(0);
    await storage.delete('teams/1/setups/2/abc');
    expect(await storage.exists('teams/1/setups/2/abc')).toBe(false);
    expect(s3.requests.map((r) => r.method)).toEqual(['PUT', 'HEAD', 'GET', 'DELETE', 'HEAD']);
    expect(s3.requests.every((r) => r.path.startsWith(`/${s3.bucket}/slantwise/`) && r.authorization.includes('Credential=test-key/'))).toBe(true);
  });

  it('should report a missing object as ObjectNotFound and refuse keys it did not make', async () => {
    await expect(storage.get('teams/1/none')).rejects.toBeInstanceOf(ObjectNotFound);
    await expect(storage.put('../escape', png, 'image/png')).rejects.toThrow(/refused key/);
  });

  it('should serve attachments through the API when the app is configured for S3', async () => {
    const app = openApp({ uploads: { driver: 's3', dir: '/nonexistent', maxBytes: LIMIT, s3: { endpoint: s3.endpoint, bucket: s3.bucket, region: 'us-east-1', accessKeyId: 'k', secretAccessKey: 's' } } });
    try {
      const who = await client(app.app, m.machinist);
      const res = await who.agent.post('/api/setups').set('X-CSRF-Token', who.token).send({ name: 'S3 held', kind: 'taper', inputs: taper }).expect(201);
      const up = await upload(who, res.body.id, png, 's3.png', 'image/png').expect(201);
      const row = await Attachment.findByPk(up.body.id);
      expect(s3.objects.has(row!.storageKey)).toBe(true);
      expect(s3.objects.has(`${row!.storageKey}-thumb`)).toBe(true);
      const dl = await binary(who.agent.get(`/api/setups/${res.body.id}/attachments/${up.body.id}`)).expect(200);
      expect(Buffer.compare(dl.body as Buffer, png)).toBe(0);
      await who.agent.delete(`/api/setups/${res.body.id}/attachments/${up.body.id}`).set('X-CSRF-Token', who.token).expect(204);
      expect(s3.objects.has(row!.storageKey)).toBe(false);
    } finally {
      await app.close();
    }
  });
});
