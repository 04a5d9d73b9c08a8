/**
 * A MariaDB of a test's own (own data dir, own port), for fault tests that stop and restart the
 * database or run several app instances, without disturbing the shared test database.
 */
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { loadConfig, type AppConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { migrate } from '../../server/migrate';
import { initModels } from '../../server/models';
import { startMariaDb, type RunningMariaDb } from '../../scripts/mariadb';

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      srv.close(() => resolve(typeof addr === 'object' && addr ? addr.port : 0));
    });
  });
}

export interface IsolatedDb {
  readonly config: AppConfig;
  readonly dir: string;
  /** Starts (or restarts) the server on the same data and port. */
  start(): Promise<void>;
  stop(): Promise<void>;
  /** Stops the server and removes its data. */
  destroy(): Promise<void>;
}

export async function isolatedDb(): Promise<IsolatedDb> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-fault-'));
  const port = await freePort();
  const config: AppConfig = {
    ...loadConfig(),
    staticDir: null,
    trustProxy: true,
    db: { host: '127.0.0.1', port, name: 'slantwise_fault', user: 'slantwise_fault', password: 'fault-test-password' },
  };
  let running: RunningMariaDb | null = null;
  const start = async () => {
    running = await startMariaDb({ dataDir: dir, port, database: config.db.name, user: config.db.user, password: config.db.password });
  };
  await start();
  const sequelize = createSequelize(config.db);
  initModels(sequelize);
  await migrate(sequelize);
  await sequelize.close();
  return {
    config,
    dir,
    start,
    async stop() {
      await running?.stop();
      running = null;
    },
    async destroy() {
      await running?.stop();
      running = null;
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
