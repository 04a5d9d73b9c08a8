/**
 * WORKERS=2: `server/main.ts` run directly as a primary with two cluster workers on one port,
 * tested from outside as an operator and a user see it (fresh connections, signals, process list).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import net from 'node:net';
import path from 'node:path';
import { createSequelize } from '../../server/db';
import { initModels } from '../../server/models';
import { makeTeam, PASSWORD, type Members } from '../support/api';
import { freePort, isolatedDb, type IsolatedDb } from '../support/isolated-db';

const ROOT = path.resolve(__dirname, '../..');
const HOST = '127.0.0.1';

let db: IsolatedDb;
let m: Members;
let port: number;
let primary: ChildProcess;
let output = '';
/** Every worker pid seen, so afterAll can kill them all even when a test fails midway. */
const seenWorkers = new Set<number>();

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/** Polls `check` every 100 ms until it returns a value (not undefined), or fails naming `what` after `ms`. */
async function until<T>(what: string, ms: number, check: () => T | undefined): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const value = check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`Timed out after ${ms} ms waiting for ${what}. Primary output so far:\n${output}`);
    await sleep(100);
  }
}

interface Reply {
  readonly status: number;
  readonly headers: http.IncomingHttpHeaders;
  readonly body: string;
  /** Client-side port of the connection that carried the request. */
  readonly clientPort: number;
}

/**
 * One request on a connection of its own (no shared agent). With `hold`, the connection stays open
 * after the answer until `release` is called, so the serving process can be looked up in /proc.
 */
function send(method: string, urlPath: string, headers: Record<string, string> = {}, body?: string, hold?: http.Agent): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: HOST,
        port,
        method,
        path: urlPath,
        agent: hold ?? false,
        timeout: 5_000,
        headers: { ...(hold ? {} : { Connection: 'close' }), ...(body === undefined ? {} : { 'Content-Type': 'application/json', 'Content-Length': String(Buffer.byteLength(body)) }), ...headers },
      },
      (res) => {
        const clientPort = res.socket.localPort ?? 0;
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks).toString('utf8'), clientPort }));
        res.on('error', reject);
      },
    );
    req.on('timeout', () => req.destroy(new Error(`${method} ${urlPath} got no answer within 5 s`)));
    req.on('error', reject);
    req.end(body);
  });
}

function cookieOf(reply: Reply): string {
  const set = reply.headers['set-cookie'];
  if (!set?.[0]) throw new Error(`No Set-Cookie in the answer (status ${reply.status}): ${reply.body}`);
  return set[0].split(';')[0]!;
}

/** Parent pid and state of a process from /proc/<pid>/stat, or undefined once it is gone. */
function procStat(pid: number): { ppid: number; state: string } | undefined {
  let text: string;
  try {
    text = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  } catch {
    return undefined;
  }
  // "pid (comm) state ppid ...": comm may hold spaces and parentheses, so split after the last ')'.
  const [state, ppid] = text.slice(text.lastIndexOf(')') + 2).split(' ');
  return { ppid: Number(ppid), state: state! };
}

const alive = (pid: number) => {
  const stat = procStat(pid);
  return stat !== undefined && stat.state !== 'Z';
};

/** The command line of a process ('' once it is gone). */
function commandLine(pid: number): string {
  try {
    return fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8').replace(/\0/g, ' ');
  } catch {
    return '';
  }
}

/** Live child processes of the primary that run the app, i.e. its cluster workers (not a helper such as tsx's compiler service). */
function workerPids(): number[] {
  const pids = fs
    .readdirSync('/proc')
    .filter((name) => /^\d+$/.test(name))
    .map(Number)
    .filter((pid) => {
      const stat = procStat(pid);
      return stat !== undefined && stat.ppid === primary.pid && stat.state !== 'Z' && commandLine(pid).includes('server/main.ts');
    })
    .sort((a, b) => a - b);
  for (const pid of pids) seenWorkers.add(pid);
  return pids;
}

/** Socket inodes of TCP connections whose server side is 127.0.0.1:port and client side is `clientPort`. */
function serverSocketInode(clientPort: number): string | undefined {
  const hex = (n: number) => n.toString(16).toUpperCase().padStart(4, '0');
  for (const table of ['/proc/net/tcp', '/proc/net/tcp6']) {
    let lines: string[];
    try {
      lines = fs.readFileSync(table, 'utf8').trim().split('\n').slice(1);
    } catch {
      continue;
    }
    for (const line of lines) {
      const f = line.trim().split(/\s+/);
      if (f[1]?.endsWith(`:${hex(port)}`) && f[2]?.endsWith(`:${hex(clientPort)}`)) return f[9];
    }
  }
  return undefined;
}

/** The worker process holding the server end of the connection from `clientPort`, if any. */
function servedBy(clientPort: number, workers: readonly number[]): number | undefined {
  const inode = serverSocketInode(clientPort);
  if (!inode) return undefined;
  return workers.find((pid) => {
    try {
      return fs.readdirSync(`/proc/${pid}/fd`).some((fd) => {
        try {
          return fs.readlinkSync(`/proc/${pid}/fd/${fd}`) === `socket:[${inode}]`;
        } catch {
          return false;
        }
      });
    } catch {
      return false;
    }
  });
}

/** Makes `count` requests, each on a new connection held open until it is looked up, and returns who served each. */
async function whoServes(count: number, urlPath: string, headers: Record<string, string> = {}): Promise<{ reply: Reply; pid: number | undefined }[]> {
  const workers = workerPids();
  const out: { reply: Reply; pid: number | undefined }[] = [];
  for (let i = 0; i < count; i++) {
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    try {
      const reply = await send('GET', urlPath, headers, undefined, agent);
      out.push({ reply, pid: servedBy(reply.clientPort, workers) });
    } finally {
      agent.destroy();
    }
  }
  return out;
}

function portOpen(): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: HOST, port });
    socket.setTimeout(2_000);
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('timeout', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

beforeAll(async () => {
  db = await isolatedDb();
  // makeTeam writes through the models: bind them to the isolated database for this process only.
  const sequelize = createSequelize(db.config.db);
  initModels(sequelize);
  try {
    m = await makeTeam('workers');
  } finally {
    await sequelize.close();
  }

  port = await freePort();
  const c = db.config;
  primary = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      PORT: String(port),
      HOST,
      DB_HOST: c.db.host,
      DB_PORT: String(c.db.port),
      DB_NAME: c.db.name,
      DB_USER: c.db.user,
      DB_PASSWORD: c.db.password,
      STATIC_DIR: '',
      WORKERS: '2',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  primary.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  primary.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  await until('the "2 workers listening" line', 60_000, () => {
    if (primary.exitCode !== null || primary.signalCode !== null) throw new Error(`The primary exited early (${primary.exitCode ?? primary.signalCode}):\n${output}`);
    return output.includes(`Slantwise: 2 workers listening on http://${HOST}:${port}`) ? true : undefined;
  });
}, 120_000);

afterAll(async () => {
  if (primary && primary.exitCode === null && primary.signalCode === null) {
    workerPids();
    primary.kill('SIGKILL');
  }
  for (const pid of seenWorkers) {
    try {
      process.kill(pid, 'SIGKILL');
    } catch {
      // already gone
    }
  }
  await db?.destroy();
});

describe('WORKERS=2: two cluster workers on one port', () => {
  it('runs exactly two worker processes under the primary, and answers health on every fresh connection', async () => {
    expect(workerPids()).toHaveLength(2);
    const replies = await Promise.all(Array.from({ length: 24 }, () => send('GET', '/api/health')));
    expect(replies.map((r) => r.status)).toEqual(Array(24).fill(200));
    expect(JSON.parse(replies[0]!.body)).toEqual({ status: 'ok', db: 'up' });
  });

  it('keeps a sign-in made on one connection valid on later connections, whichever worker serves them', async () => {
    const csrf = await send('GET', '/api/auth/csrf');
    expect(csrf.status).toBe(200);
    const { token } = JSON.parse(csrf.body) as { token: string };
    const login = await send('POST', '/api/auth/login', { Cookie: cookieOf(csrf), 'X-CSRF-Token': token }, JSON.stringify({ email: m.lead.email, password: PASSWORD }));
    expect(login.status).toBe(200);
    const cookie = cookieOf(login);

    const served = await whoServes(8, '/api/auth/me', { Cookie: cookie });
    for (const { reply } of served) {
      expect(reply.status).toBe(200);
      expect((JSON.parse(reply.body) as { id: number }).id).toBe(m.lead.id);
    }
    // Both workers answered some of them (the primary hands connections to the workers in turn).
    expect(new Set(served.map((s) => s.pid))).toEqual(new Set(workerPids()));
  });

  it('keeps answering while a worker is killed, and replaces it with a new process within seconds', async () => {
    const before = workerPids();
    expect(before).toHaveLength(2);
    const victim = before[0]!;
    const survivor = before[1]!;

    // Health checks one after another on fresh connections. The kill happens between two of them, so no
    // request is in flight on the victim (that one would be lost with its process, as on any machine).
    // Until the primary has seen the worker die it may still hand it a new connection (Node's cluster
    // does, and that connection is lost too), so the checks pause until the primary reports the death;
    // from then on every connection must reach the survivor, or the replacement once it listens.
    const statuses: (number | string)[] = [];
    let killed = false;
    let polling = true;
    const stoppedLine = `worker ${victim} stopped (SIGKILL); starting a new one in 1 s`;
    const poll = (async () => {
      while (polling) {
        statuses.push(await send('GET', '/api/health').then((r) => r.status, (e: Error) => e.message));
        if (statuses.length === 6) {
          process.kill(victim, 'SIGKILL');
          killed = true;
          await until('the primary to see the worker die', 10_000, () => (output.includes(stoppedLine) ? true : undefined));
        }
        await sleep(50);
      }
    })();
    try {
      await until('the kill', 5_000, () => (killed ? true : undefined));
      await until('the primary to see the worker die', 10_000, () => (output.includes(stoppedLine) ? true : undefined));
      // The primary waits 1 s before forking a replacement: these are answered by the survivor alone.
      const alone = await whoServes(3, '/api/health');
      expect(alone.map((s) => [s.reply.status, s.pid])).toEqual([[200, survivor], [200, survivor], [200, survivor]]);
      const after = await until('a replacement worker', 10_000, () => {
        const now = workerPids();
        return now.length === 2 && !now.includes(victim) && now.includes(survivor) ? now : undefined;
      });
      const replacement = after.find((pid) => pid !== survivor)!;
      expect(alive(victim)).toBe(false);
      // The replacement takes connections too, once it listens.
      const deadline = Date.now() + 15_000;
      let servedByReplacement = false;
      while (!servedByReplacement && Date.now() < deadline) {
        servedByReplacement = (await whoServes(2, '/api/health')).some((s) => s.pid === replacement && s.reply.status === 200);
        if (!servedByReplacement) await sleep(200);
      }
      expect(servedByReplacement).toBe(true);
    } finally {
      polling = false;
      await poll;
    }
    expect(statuses.length).toBeGreaterThan(10);
    expect(statuses.filter((s) => s !== 200)).toEqual([]);
    expect(output).toContain(stoppedLine);
  }, 40_000);

  it('on SIGTERM stops both workers and exits 0 within 10 s, closing the port', async () => {
    const workers = workerPids();
    expect(workers).toHaveLength(2);
    const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => primary.once('exit', (code, signal) => resolve({ code, signal })));
    const started = Date.now();
    primary.kill('SIGTERM');
    let timer: NodeJS.Timeout | undefined;
    const result = await Promise.race([exited, new Promise<string>((resolve) => (timer = setTimeout(() => resolve('still running after 10 s'), 10_000)))]);
    clearTimeout(timer);
    expect(result).toEqual({ code: 0, signal: null });
    expect(Date.now() - started).toBeLessThan(10_000);
    await until('the workers to be gone', 2_000, () => (workers.some(alive) ? undefined : true));
    expect(await portOpen()).toBe(false);
  });

  it('gives up and exits 1 when no worker can listen (the port is taken), instead of restarting them for ever', async () => {
    const blocker = net.createServer();
    const taken = await freePort();
    await new Promise<void>((resolve) => blocker.listen(taken, HOST, resolve));
    const c = db.config;
    let text = '';
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
      cwd: ROOT,
      env: { ...process.env, PORT: String(taken), HOST, DB_HOST: c.db.host, DB_PORT: String(c.db.port), DB_NAME: c.db.name, DB_USER: c.db.user, DB_PASSWORD: c.db.password, STATIC_DIR: '', WORKERS: '2' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout?.on('data', (chunk: Buffer) => (text += chunk.toString()));
    child.stderr?.on('data', (chunk: Buffer) => (text += chunk.toString()));
    try {
      const code = await new Promise<number | null>((resolve) => {
        const timer = setTimeout(() => resolve(-1), 30_000);
        child.once('exit', (exitCode) => {
          clearTimeout(timer);
          resolve(exitCode);
        });
      });
      expect(text).toContain('EADDRINUSE');
      expect(text).toContain('failed before any worker listened');
      expect(code).toBe(1);
    } finally {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
      blocker.close();
    }
  }, 40_000);
});
