import cluster from 'node:cluster';
import type { Server } from 'node:http';
import os from 'node:os';
import type { Sequelize } from 'sequelize';
import { createApp } from './app';
import { loadConfig, type AppConfig } from './config';
import { createSequelize } from './db';
import { initModels } from './models';
import { scheduleUploadSweeps } from './services/upload-sweep';
import { superviseWorkers, workerCount } from './workers';

export interface RunningServer {
  readonly url: string;
  readonly server: Server;
  readonly sequelize: Sequelize;
  close(): Promise<void>;
}

export interface ServerOptions {
  /**
   * Remove orphaned upload files on a timer (every UPLOAD_SWEEP_MINUTES, first a minute after
   * start). Only `server/main.ts` run directly asks for it, so servers started by tests never sweep.
   */
  readonly sweepUploads?: boolean;
}

/** Connects to the database and serves the app on config.host:config.port (port 0 picks a free one). */
export async function startServer(config: AppConfig, options: ServerOptions = {}): Promise<RunningServer> {
  const sequelize = createSequelize(config.db);
  initModels(sequelize);
  const { app, storage, close } = createApp({ config, sequelize });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, (err?: Error) => (err ? reject(err) : resolve(s)));
  });
  const sweeper = options.sweepUploads && config.uploadSweep.everyMs > 0
    ? scheduleUploadSweeps({ sequelize, storage, everyMs: config.uploadSweep.everyMs, graceMs: config.uploadSweep.graceMs })
    : null;
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  return {
    url: `http://${config.host}:${port}`,
    server,
    sequelize,
    async close() {
      sweeper?.stop();
      close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await sequelize.close();
    },
  };
}

// Run directly (one stateless instance, e.g. behind a load balancer): the database must be migrated
// already. WORKERS=n (or "auto", one per core) runs n such instances as cluster workers on one port.
if (require.main === module) {
  const fail = (err: unknown) => {
    console.error('Could not start:', err instanceof Error ? err.message : err);
    process.exit(1);
  };
  try {
    const count = workerCount(process.env['WORKERS'], os.availableParallelism());
    if (count > 1 && cluster.isPrimary) {
      const supervisor = superviseWorkers(count);
      void supervisor.ready.then((url) => console.log(`Slantwise: ${count} workers listening on ${url}`));
      let stopping: Promise<void> | undefined;
      const stop = () => void (stopping ??= supervisor.stop()).then(() => process.exit(0));
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    } else {
      startServer(loadConfig(), { sweepUploads: true })
        .then((running) => {
          if (cluster.isPrimary) console.log(`Slantwise instance listening on ${running.url}`);
          let closing: Promise<void> | undefined;
          const stop = () => void (closing ??= running.close()).then(() => process.exit(0));
          process.once('SIGINT', stop);
          process.once('SIGTERM', stop);
        })
        .catch(fail);
    }
  } catch (err) {
    fail(err);
  }
}
