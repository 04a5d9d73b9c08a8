import cluster, { type Worker } from 'node:cluster';

/** How many app processes one `server/main.ts` runs: WORKERS (default 1), or one per core for "auto". */
export function workerCount(value: string | undefined, cores: number): number {
  if (value === undefined || value.trim() === '') return 1;
  if (value.trim() === 'auto') return Math.max(1, cores);
  const n = /^\d{1,3}$/.test(value.trim()) ? Number(value.trim()) : NaN;
  if (!Number.isInteger(n) || n < 1 || n > 64) throw new Error(`WORKERS must be a whole number from 1 to 64, or "auto" (got "${value}").`);
  return n;
}

export interface Supervisor {
  /** Resolves once every worker listens, with the address they share. */
  readonly ready: Promise<string>;
  /**
   * Stops every worker (SIGTERM, so each closes its connections; SIGKILL for one still running
   * after `graceMs`) and resolves when all have exited.
   */
  stop(graceMs?: number): Promise<void>;
}

/**
 * Runs `count` copies of this script as cluster workers sharing one port (Node's cluster module:
 * the primary hands new connections to the workers in turn). The workers are the same stateless
 * instances as separate machines would be — sessions, data and uploads live outside them — so this
 * only uses more cores of one machine. A worker that dies unexpectedly is replaced after a pause;
 * if a worker fails before any has listened (a port in use, a wrong setting), the primary gives up
 * and exits 1 instead of restarting it for ever.
 */
export function superviseWorkers(count: number, log: (line: string) => void = console.log): Supervisor {
  let stopping = false;
  let listening = 0;
  let resolveReady!: (url: string) => void;
  const ready = new Promise<string>((resolve) => (resolveReady = resolve));

  const fork = (): Worker => {
    const worker = cluster.fork();
    worker.once('listening', (address) => {
      listening += 1;
      const host = address.address ?? '127.0.0.1';
      if (listening === count) resolveReady(`http://${host.includes(':') ? `[${host}]` : host}:${address.port}`);
    });
    return worker;
  };
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) return;
    if (listening === 0) {
      log(`worker ${worker.process.pid} failed before any worker listened (${signal ?? `exit code ${code}`}); stopping`);
      stopping = true;
      for (const w of Object.values(cluster.workers ?? {})) w?.process.kill('SIGTERM');
      process.exit(1);
    }
    log(`worker ${worker.process.pid} stopped (${signal ?? `exit code ${code}`}); starting a new one in 1 s`);
    setTimeout(() => {
      if (!stopping) fork();
    }, 1_000).unref();
  });
  for (let i = 0; i < count; i += 1) fork();

  return {
    ready,
    stop: async (graceMs = 10_000) => {
      stopping = true;
      const workers = Object.values(cluster.workers ?? {}).filter((w): w is Worker => w !== undefined);
      await Promise.all(
        workers.map(
          (w) =>
            new Promise<void>((resolve) => {
              if (w.isDead()) return resolve();
              const kill = setTimeout(() => w.process.kill('SIGKILL'), graceMs);
              w.once('exit', () => {
                clearTimeout(kill);
                resolve();
              });
              w.process.kill('SIGTERM');
            }),
        ),
      );
    },
  };
}
