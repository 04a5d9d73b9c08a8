/**
 * The scale-out configuration, tested: two stateless instances behind a load balancer that
 * terminates TLS (TRUST_PROXY=1), sessions and data in one MariaDB, uploads in S3-compatible storage.
 */
import sharp from 'sharp';
import request from 'supertest';
import type { AppConfig } from '../../server/config';
import { startServer, type RunningServer } from '../../server/main';
import { startFakeS3, type FakeS3 } from '../support/fake-s3';
import { isolatedDb, type IsolatedDb } from '../support/isolated-db';
import { makeTeam, PASSWORD, type Members } from '../support/api';
import { startRoundRobin, type Balancer } from '../support/round-robin';

let db: IsolatedDb;
let s3: FakeS3;
let instances: RunningServer[] = [];
let lb: Balancer;
let m: Members;

beforeAll(async () => {
  db = await isolatedDb();
  s3 = await startFakeS3('slantwise-scale');
  const config: AppConfig = {
    ...db.config,
    port: 0,
    trustProxy: 1,
    uploads: { driver: 's3', dir: '/nonexistent', maxBytes: 20 * 1024 * 1024, s3: { endpoint: s3.endpoint, bucket: s3.bucket, region: 'us-east-1', accessKeyId: 'scale-key', secretAccessKey: 'scale-secret' } },
  };
  instances = [await startServer(config), await startServer(config)];
  lb = await startRoundRobin(instances.map((i) => i.url));
  m = await makeTeam('scale');
}, 120_000);

afterAll(async () => {
  await lb?.close();
  for (const i of instances) await i.close();
  await s3?.close();
  await db?.destroy();
});

describe('two instances behind a load balancer, uploads in object storage', () => {
  it('keeps one session across instances, marks its cookie Secure behind TLS, and serves an upload from either instance', async () => {
    const agent = request.agent(lb.url);
    const csrf = await agent.get('/api/auth/csrf').expect(200);
    expect(String(csrf.headers['set-cookie'])).toMatch(/Secure/);
    // supertest's cookie jar keeps Secure cookies only for https: send the cookie by hand.
    let cookie = String(csrf.headers['set-cookie']).split(';')[0]!;
    const login = await request(lb.url).post('/api/auth/login').set('Cookie', cookie).set('X-CSRF-Token', csrf.body.token).send({ email: m.machinist.email, password: PASSWORD }).expect(200);
    cookie = String(login.headers['set-cookie']).split(';')[0]!;
    const token = csrf.body.token as string;

    const setup = await request(lb.url).post('/api/setups').set('Cookie', cookie).set('X-CSRF-Token', token).send({ name: 'Scaled wedge', kind: 'taper', inputs: { unit: 'in' } }).expect(201);
    const png = await sharp({ create: { width: 80, height: 50, channels: 3, background: { r: 200, g: 120, b: 40 } } }).png().toBuffer();
    const up = await request(lb.url).post(`/api/setups/${setup.body.id}/attachments`).set('Cookie', cookie).set('X-CSRF-Token', token).attach('file', png, { filename: 'wedge.png', contentType: 'image/png' }).expect(201);
    expect([...s3.objects.keys()].some((k) => k.endsWith('-thumb'))).toBe(true);

    const before = [...lb.hits];
    for (let i = 0; i < 4; i++) {
      const res = await request(lb.url).get(`/api/setups/${setup.body.id}/attachments/${up.body.id}`).set('Cookie', cookie).buffer(true).parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      }).expect(200);
      expect(Buffer.compare(res.body as Buffer, png)).toBe(0);
      expect((await request(lb.url).get('/api/auth/me').set('Cookie', cookie).expect(200)).body.email).toBe(m.machinist.email);
    }
    // Both instances answered some of those requests.
    expect(lb.hits.every((h, i) => h > before[i]!)).toBe(true);
  });
});
