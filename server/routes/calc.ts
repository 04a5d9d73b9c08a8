import { Router, type Request, type Response } from 'express';
import { calculateAngleBlocks } from '../../shared/calc/angle-blocks';
import { calculateGaugeStack } from '../../shared/calc/gauge-stack';
import { calculateLatheTaper } from '../../shared/calc/lathe-taper';
import { calculateOverPins } from '../../shared/calc/over-pins';
import { calculateCompoundSinePlate, calculateSineBar, calculateSineTable } from '../../shared/calc/sine-bar';
import type { CalcResult } from '../../shared/calc/step';
import { calculateTaper } from '../../shared/calc/taper';
import { ANGLE_BLOCK_SETS } from '../../shared/data/angle-block-sets';
import { GAUGE_BLOCK_SETS } from '../../shared/data/gauge-sets';
import { MACHINE_TAPERS } from '../../shared/data/machine-tapers';
import { sendJsonText } from './send-json';

/** A calculation answer ready to send: the status and the JSON bytes (encoded once, sent as they are). */
interface Answer {
  readonly status: number;
  readonly json: Buffer;
}

function answer<T>(result: CalcResult<T>): Answer {
  if (result.ok) return { status: 200, json: Buffer.from(JSON.stringify(result.value)) };
  return { status: result.kind === 'invalid' ? 400 : 422, json: Buffer.from(JSON.stringify({ error: result.error, fields: result.fields })) };
}

/**
 * The engine functions are pure, so the same body always gets the same answer: the last
 * `capacity` answers are kept (least recently used dropped first), keyed by route and body text.
 * Bodies and answers above a size limit are never kept.
 */
export class AnswerCache {
  private readonly entries = new Map<string, Answer>();

  constructor(
    private readonly capacity = 2_000,
    private readonly maxKeyLength = 2_000,
    private readonly maxAnswerLength = 64_000,
  ) {}

  get size(): number {
    return this.entries.size;
  }

  answer(path: string, body: unknown, compute: () => Answer): Answer {
    const key = `${path} ${JSON.stringify(body ?? null)}`;
    if (key.length > this.maxKeyLength) return compute();
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const fresh = compute();
    if (fresh.json.length <= this.maxAnswerLength) {
      this.entries.set(key, fresh);
      if (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
    }
    return fresh;
  }
}

/**
 * The public calculation API, mounted at /api/calc. Every POST body is validated with the shared
 * zod schemas inside the engine functions (the same ones the forms use); no route can answer 5xx
 * for any body, because the engine functions never throw. Answers are memoised (see AnswerCache).
 */
export function createCalcRouter(cache = new AnswerCache()): Router {
  const router = Router();
  const calcs: Record<string, (body: unknown) => CalcResult<unknown>> = {
    '/taper': calculateTaper,
    '/sine-bar': calculateSineBar,
    '/sine-table': calculateSineTable,
    '/compound-sine-plate': calculateCompoundSinePlate,
    '/gauge-stack': calculateGaugeStack,
    '/angle-blocks': calculateAngleBlocks,
    '/lathe-taper': calculateLatheTaper,
    '/over-pins': calculateOverPins,
  };
  for (const [path, calc] of Object.entries(calcs)) {
    router.post(path, (req: Request, res: Response) => {
      const { status, json } = cache.answer(path, req.body, () => answer(calc(req.body)));
      sendJsonText(res, json, status);
    });
  }
  router.get('/gauge-sets', (_req, res) => {
    res.json({ sets: GAUGE_BLOCK_SETS });
  });
  router.get('/angle-block-sets', (_req, res) => {
    res.json({ sets: ANGLE_BLOCK_SETS });
  });
  router.get('/machine-tapers', (_req, res) => {
    res.json({ tapers: MACHINE_TAPERS });
  });
  return router;
}
