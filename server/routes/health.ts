import { Router } from 'express';
import type { Sequelize } from 'sequelize';

/** GET /api/health: 200 when the database answers, 503 when it does not. */
export function createHealthRouter(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      res.json({ status: 'ok', db: 'up' });
    } catch {
      res.status(503).json({ status: 'degraded', db: 'down', error: 'The database is not answering.' });
    }
  });
  return router;
}
