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

/** Sends a calculation result: 200 with the answer, 400 for invalid input, 422 for impossible input. */
function send<T>(res: Response, result: CalcResult<T>): void {
  if (result.ok) {
    res.json(result.value);
    return;
  }
  res.status(result.kind === 'invalid' ? 400 : 422).json({ error: result.error, fields: result.fields });
}

/**
 * The public calculation API, mounted at /api/calc. Every POST body is validated with the shared
 * zod schemas inside the engine functions (the same ones the forms use); no route can answer 5xx
 * for any body, because the engine functions never throw.
 */
export function createCalcRouter(): Router {
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
    router.post(path, (req: Request, res: Response) => send(res, calc(req.body)));
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
