import express from 'express';
import request from 'supertest';
import { createCalcRouter } from '../routes/calc';
import { calcPaths } from './calc';

/**
 * The lathe-taper ratio as the API documents it and as POST /api/calc/lathe-taper answers it: the
 * trade's "1:20", a bare number x as 1:x, and a bare number below 1 refused as unclear.
 */
describe('lathe-taper ratio in the API', () => {
  const app = express();
  app.use(express.json());
  app.use('/api/calc', createCalcRouter());

  it('should document the ratio as the trade writes it', () => {
    const body = calcPaths['/api/calc/lathe-taper'].post.requestBody.content['application/json'].schema as { properties: Record<string, { description?: string }> };
    expect(body.properties['ratio']?.description).toMatch(/^Taper ratio as the trade writes it: "1:20" .*A bare number x means 1:x/);
  });

  it('should answer "1:20" and "1 : 20" like 20: 2.8642° included (2 · atan(1/40), derived)', async () => {
    for (const ratio of ['1:20', '1 : 20', 20]) {
      const res = await request(app).post('/api/calc/lathe-taper').send({ unit: 'mm', ratio }).expect(200);
      expect(res.body).toMatchObject({ ratio: '1:20.000', taperPerInch: '0.050000', includedAngleDeg: '2.8642', warnings: [] });
    }
  });

  it('should refuse a bare 0.05 with a 400 saying how to write 1:20, and warn of "1:0.05" as a very flat cone (168.5788°, 2 · atan(10), derived)', async () => {
    const refused = await request(app).post('/api/calc/lathe-taper').send({ unit: 'in', ratio: '0.05' }).expect(400);
    expect(refused.body.fields.ratio).toContain('"1:20" for a taper of 1 in 20');
    const flat = await request(app).post('/api/calc/lathe-taper').send({ unit: 'in', ratio: '1:0.05' }).expect(200);
    expect(flat.body.includedAngleDeg).toBe('168.5788');
    expect(flat.body.warnings[0]).toMatch(/very flat cone/);
  });
});
