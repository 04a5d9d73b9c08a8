/**
 * The ceiling for the load benchmark: a bare Express route that does nothing but answer JSON,
 * run with the same number of cluster workers (WORKERS) as the app it is compared with.
 */
import cluster from 'node:cluster';
import os from 'node:os';
import express from 'express';
import { superviseWorkers, workerCount } from '../server/workers';

const count = workerCount(process.env['WORKERS'], os.availableParallelism());
if (count > 1 && cluster.isPrimary) {
  const supervisor = superviseWorkers(count, () => undefined);
  void supervisor.ready.then((url) => console.log(`LISTENING ${url}`));
  process.once('SIGTERM', () => void supervisor.stop().then(() => process.exit(0)));
} else {
  const app = express();
  app.disable('x-powered-by');
  app.get('/bare', (_req, res) => {
    res.json({ ok: true });
  });
  const server = app.listen(Number(process.env['PORT'] ?? 0), '127.0.0.1', () => {
    const addr = server.address();
    if (cluster.isPrimary) console.log(`LISTENING ${typeof addr === 'object' && addr ? addr.port : ''}`);
  });
  process.once('SIGTERM', () => server.close(() => process.exit(0)));
}
