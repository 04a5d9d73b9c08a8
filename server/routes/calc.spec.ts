import express, { type ErrorRequestHandler } from 'express';
import fc from 'fast-check';
import request from 'supertest';
import { AnswerCache, createCalcRouter } from './calc';

/** A bare app with the calc router and a tiny JSON error handler (malformed JSON → 400). */
function makeApp(): express.Express {
  const app = express();
  app.use(express.json());
  app.use('/api/calc', createCalcRouter());
  const handler: ErrorRequestHandler = (err, _req, res, _next) => {
    const status = Number.isInteger(err.status) && err.status >= 400 && err.status < 500 ? err.status : 500;
    res.status(status).json({ error: status < 500 ? 'Malformed request' : 'Internal Server Error', fields: {} });
  };
  app.use(handler);
  return app;
}

describe('calc router', () => {
  const app = makeApp();

  describe('POST /api/calc/taper', () => {
    it('should answer the REFERENCE.md §1 check with decimal strings and steps (derived)', async () => {
      const res = await request(app).post('/api/calc/taper').send({ unit: 'in', thickness: 0.75, angle: 5, taperLength: 3, depthPerPass: 0.1 }).expect(200);
      expect(res.body).toMatchObject({ angleDeg: '5.0000', angleDms: '5°00\'00"', taperLength: '3.0000', endThickness: '0.4875', faceLength: '3.0115', depthToStop: '0.2615', removedAtEnd: '0.2625' });
      expect(res.body.passes).toHaveLength(3);
      expect(Array.isArray(res.body.warnings)).toBe(true);
      expect(res.body.steps[0]).toEqual(expect.objectContaining({ label: expect.any(String), formula: expect.any(String), substituted: expect.any(String), value: expect.any(String), unit: 'in' }));
    });

    it('should answer 400 naming the field for an invalid value', async () => {
      const res = await request(app).post('/api/calc/taper').send({ unit: 'in', thickness: -1, angle: 5, taperLength: 3 }).expect(400);
      expect(res.body.fields).toEqual({ thickness: 'must be greater than 0' });
      expect(res.body.error).toMatch(/thickness/);
    });

    it('should answer 422 for a taper that needs more than the stock', async () => {
      const res = await request(app).post('/api/calc/taper').send({ unit: 'in', thickness: 0.5, angle: 30, taperLength: 3 }).expect(422);
      expect(res.body.fields.taperLength).toMatch(/runs out through the bottom/);
    });

    it('should answer 400 for malformed JSON and for a body that is not an object', async () => {
      await request(app).post('/api/calc/taper').set('Content-Type', 'application/json').send('{"unit":').expect(400);
      const res = await request(app).post('/api/calc/taper').set('Content-Type', 'application/json').send('[1,2]').expect(400);
      expect(res.body.fields).toEqual({ body: 'must be a JSON object' });
      await request(app).post('/api/calc/taper').send('unit=in').expect(400);
    });
  });

  describe('POST /api/calc/sine-bar', () => {
    it('should give 2.0084 in for 23°41\' on a 5 in bar, with blocks from inch-81 (US Army TC 9-524 App. C)', async () => {
      const res = await request(app).post('/api/calc/sine-bar').send({ unit: 'in', barLength: 5, angle: "23°41'", set: 'inch-81' }).expect(200);
      expect(res.body).toMatchObject({ stackHeight: '2.0084', angleDeg: '23.6833', achievedAngleDeg: '23.6832', errorArcSec: '-0.32', blockCount: 4 });
    });

    it('should answer 422 for a stack taller than the bar', async () => {
      await request(app).post('/api/calc/sine-bar').send({ unit: 'in', barLength: 5, stackHeight: 6 }).expect(422);
    });
  });

  describe('POST /api/calc/sine-table', () => {
    it('should give one row per step', async () => {
      const res = await request(app).post('/api/calc/sine-table').send({ unit: 'mm', barLength: 100, from: 10, to: 20, step: 5 }).expect(200);
      expect(res.body.rows.map((r: { stackHeight: string }) => r.stackHeight)).toEqual(['17.365', '25.882', '34.202']);
    });
  });

  describe('POST /api/calc/gauge-stack', () => {
    it('should beat the NPL hand stack for 58.345 mm (5 → 4 blocks) and show the last-digit stack beside it', async () => {
      const res = await request(app).post('/api/calc/gauge-stack').send({ target: '58.345', set: 'metric-112' }).expect(200);
      expect(res.body.count).toBe(4);
      expect(res.body.total).toBe('58.345');
      expect(res.body.lastDigit.count).toBe(5);
      expect(typeof res.body.count).toBe('number');
    });

    it('should answer 422 for an unreachable target', async () => {
      const res = await request(app).post('/api/calc/gauge-stack').send({ target: '0.0600', set: 'inch-81' }).expect(422);
      expect(res.body.fields.target).toMatch(/cannot be made/);
    });

    it('should answer 400 for an unknown set', async () => {
      await request(app).post('/api/calc/gauge-stack').send({ target: 1, set: 'nope' }).expect(400);
    });
  });

  describe('POST /api/calc/lathe-taper', () => {
    it('should give the Rose offset: 1 in/ft on 36 in → 1.5 in', async () => {
      const res = await request(app).post('/api/calc/lathe-taper').send({ unit: 'in', taperPerFoot: 1, workLength: 36 }).expect(200);
      expect(res.body).toMatchObject({ taperPerFoot: '1.00000', taperPerInch: '0.083333', includedAngleDeg: '4.7719', halfAngleDeg: '2.3859', tailstockOffset: '1.5000' });
    });
  });

  describe('POST /api/calc/angle-blocks and /over-pins', () => {
    it('should make 17°35\' from the 16-piece set', async () => {
      const res = await request(app).post('/api/calc/angle-blocks').send({ set: 'angle-16', angle: "17°35'" }).expect(200);
      expect(res.body.exact).toBe(true);
    });

    it('should measure a 60° dovetail over rolls', async () => {
      const res = await request(app).post('/api/calc/over-pins').send({ kind: 'dovetail', unit: 'in', side: 'male', angle: 60, rollDiameter: 0.5, width: 2 }).expect(200);
      expect(res.body.values.measurement).toBe('3.3660');
    });
  });

  describe('GET lists', () => {
    it('should list the gauge sets, angle-block sets and machine tapers with sources', async () => {
      const sets = await request(app).get('/api/calc/gauge-sets').expect(200);
      expect(sets.body.sets.map((s: { id: string }) => s.id)).toEqual(expect.arrayContaining(['inch-81', 'metric-112']));
      const angle = await request(app).get('/api/calc/angle-block-sets').expect(200);
      expect(angle.body.sets.length).toBeGreaterThan(0);
      const tapers = await request(app).get('/api/calc/machine-tapers').expect(200);
      expect(tapers.body.tapers.find((t: { id: string }) => t.id === 'morse-2').source).toMatch(/Machinery/);
    });
  });

  describe('never a 5xx', () => {
    it('should answer 200, 400 or 422 with an error body for any JSON body on any route (property)', async () => {
      const routes = ['taper', 'sine-bar', 'sine-table', 'compound-sine-plate', 'gauge-stack', 'angle-blocks', 'lathe-taper', 'over-pins'];
      await fc.assert(
        fc.asyncProperty(fc.constantFrom(...routes), fc.oneof(fc.jsonValue(), fc.dictionary(fc.constantFrom('unit', 'thickness', 'angle', 'target', 'set', 'barLength', 'kind', 'taperPerFoot', 'stackHeight'), fc.oneof(fc.double(), fc.string(), fc.constant(null)))), async (route, body) => {
          const res = await request(app).post(`/api/calc/${route}`).set('Content-Type', 'application/json').send(JSON.stringify(body) ?? 'null');
          expect([200, 400, 422]).toContain(res.status);
          if (res.status !== 200) {
            expect(typeof res.body.error).toBe('string');
            expect(typeof res.body.fields).toBe('object');
          }
        }),
        { numRuns: 60 },
      );
    });
  });
});

describe('AnswerCache', () => {
  const compute = (text: string) => jest.fn(() => ({ status: 200, json: Buffer.from(text) }));

  it('computes an answer once per route and body, then reuses it', () => {
    const cache = new AnswerCache();
    const first = compute('{"a":1}');
    expect(cache.answer('/taper', { x: '1' }, first)).toEqual({ status: 200, json: Buffer.from('{"a":1}') });
    expect(cache.answer('/taper', { x: '1' }, first)).toEqual({ status: 200, json: Buffer.from('{"a":1}') });
    expect(first).toHaveBeenCalledTimes(1);
    const other = compute('{"a":2}');
    expect(cache.answer('/sine-bar', { x: '1' }, other).json.toString()).toBe('{"a":2}');
    expect(cache.answer('/taper', { x: '2' }, other).json.toString()).toBe('{"a":2}');
    expect(other).toHaveBeenCalledTimes(2);
  });

  it('drops the least recently used answer beyond its capacity', () => {
    const cache = new AnswerCache(2);
    cache.answer('/p', 1, compute('1'));
    cache.answer('/p', 2, compute('2'));
    cache.answer('/p', 1, compute('x')); // 1 is now the most recent
    cache.answer('/p', 3, compute('3')); // drops 2
    expect(cache.size).toBe(2);
    const again = compute('2 again');
    expect(cache.answer('/p', 2, again).json.toString()).toBe('2 again');
    expect(again).toHaveBeenCalledTimes(1);
    expect(cache.answer('/p', 3, compute('y')).json.toString()).toBe('3');
  });

  it('keeps neither long bodies nor long answers', () => {
    const cache = new AnswerCache(10, 50, 10);
    cache.answer('/p', 'x'.repeat(100), compute('short'));
    cache.answer('/p', 'y', compute('a long answer text'));
    expect(cache.size).toBe(0);
  });
});
