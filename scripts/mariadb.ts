/**
 * Runs a private MariaDB server as a child of this process: its own data directory, bound to
 * 127.0.0.1 on its own port, never the system service. Used by `npm start` and `npm test`.
 */
import { execFile, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);

export interface MariaDbOptions {
  readonly dataDir: string;
  readonly port: number;
  readonly database: string;
  readonly user: string;
  readonly password: string;
  /** More mariadbd options (e.g. server-id and log-bin for replication tests). */
  readonly extraArgs?: readonly string[];
}

export interface RunningMariaDb {
  readonly port: number;
  /** The server's Unix socket, for root access (`mariadb --socket=… -uroot`). */
  readonly socket: string;
  stop(): Promise<void>;
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

async function waitFor(check: () => Promise<boolean> | boolean, timeoutMs: number, what: string): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`Timed out waiting for ${what}`);
}

/** A server left running by a run that was killed: stop it, then clear its pid file and socket. */
async function clearStale(dir: string): Promise<void> {
  const pidFile = path.join(dir, 'mysqld.pid');
  if (fs.existsSync(pidFile)) {
    const pid = Number(fs.readFileSync(pidFile, 'utf8').trim());
    if (Number.isInteger(pid) && pid > 0 && alive(pid)) {
      let cmd = '';
      try {
        cmd = fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8');
      } catch {
        /* not readable: treat as not ours */
      }
      if (cmd.includes(path.join(dir, 'data'))) {
        console.log(`[db] stopping a MariaDB left running by an earlier run (pid ${pid})`);
        process.kill(pid, 'SIGTERM');
        await waitFor(() => !alive(pid), 30_000, 'the old MariaDB to stop');
      }
    }
    fs.rmSync(pidFile, { force: true });
  }
  fs.rmSync(path.join(dir, 'mysqld.sock'), { force: true });
  fs.rmSync(path.join(dir, 'mysqld.sock.lock'), { force: true });
}

function sql(text: string): string {
  return text.replace(/\\/g, '\\\\').replace(/'/g, "\\'");
}

export async function startMariaDb(opts: MariaDbOptions): Promise<RunningMariaDb> {
  const dir = path.resolve(opts.dataDir);
  const dataDir = path.join(dir, 'data');
  const socket = path.join(dir, 'mysqld.sock');
  // A temp folder of this server's own (see mariadb-install-db below).
  const tmpDir = path.join(dir, 'tmp');
  fs.mkdirSync(tmpDir, { recursive: true });
  await clearStale(dir);

  if (!fs.existsSync(path.join(dataDir, 'mysql'))) {
    fs.rmSync(dataDir, { recursive: true, force: true });
    await run('mariadb-install-db', [
      '--no-defaults', `--datadir=${dataDir}`, '--user=root', '--auth-root-authentication-method=socket', '--skip-test-db',
      // `--tmpdir` reaches the bootstrap server: its temp tables are named after its pid, and a file
      // left in the shared /tmp by an earlier server with the same pid made the bootstrap abort.
      `--tmpdir=${tmpDir}`,
    ]);
  }

  const child: ChildProcess = spawn(
    'mariadbd',
    [
      '--no-defaults', '--user=root', `--datadir=${dataDir}`, `--tmpdir=${tmpDir}`, `--socket=${socket}`, `--pid-file=${path.join(dir, 'mysqld.pid')}`,
      '--bind-address=127.0.0.1', `--port=${opts.port}`, '--skip-name-resolve', `--log-error=${path.join(dir, 'mysqld.err')}`,
      '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci', '--innodb-buffer-pool-size=128M',
      '--max-connections=300', '--thread-handling=pool-of-threads', '--innodb-flush-log-at-trx-commit=2',
      // The query cache answers a repeated SELECT (a session, a library page) without running it again;
      // MariaDB drops every cached result of a table on any write to it, so answers stay exact.
      '--query-cache-type=1', '--query-cache-size=32M',
      ...(opts.extraArgs ?? []),
    ],
    { stdio: 'ignore' },
  );
  let exited = false;
  child.on('exit', () => (exited = true));

  const admin = (...args: string[]) => run('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', ...args]);
  await waitFor(async () => {
    if (exited) throw new Error(`MariaDB exited at start; see ${path.join(dir, 'mysqld.err')} (is port ${opts.port} free?)`);
    try {
      await admin('ping');
      return true;
    } catch {
      return false;
    }
  }, 60_000, 'MariaDB to answer');

  const db = opts.database.replace(/[^A-Za-z0-9_]/g, '');
  const user = sql(opts.user);
  const pass = sql(opts.password);
  const statements = [
    `CREATE DATABASE IF NOT EXISTS \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    ...['127.0.0.1', 'localhost'].flatMap((host) => [
      `CREATE USER IF NOT EXISTS '${user}'@'${host}' IDENTIFIED BY '${pass}'`,
      `ALTER USER '${user}'@'${host}' IDENTIFIED BY '${pass}'`,
      `GRANT ALL PRIVILEGES ON \`${db}\`.* TO '${user}'@'${host}'`,
    ]),
  ];
  await run('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-e', statements.join(';\n')]);

  return {
    port: opts.port,
    socket,
    async stop() {
      if (exited) return;
      try {
        await admin('shutdown');
      } catch {
        child.kill('SIGTERM');
      }
      await waitFor(() => exited, 30_000, 'MariaDB to stop').catch(() => child.kill('SIGKILL'));
    },
  };
}
