/**
 * `npm run bench:load`: the app against its own MariaDB seeded with 10,000 set-ups, loaded with
 * autocannon on loopback (100 connections, a bounded time per route), next to a bare Express route
 * as the ceiling. The app and the bare route run in child processes; autocannon runs here.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import bcrypt from 'bcrypt';
import { createSequelize } from '../server/db';
import { migrate } from '../server/migrate';
import { initModels, Setup, Team, User } from '../server/models';
import { startMariaDb } from '../scripts/mariadb';
import { freePort } from '../tests/support/isolated-db';
import { workerCount } from '../server/workers';

const SECONDS = Number(process.env['BENCH_SECONDS'] ?? 8);
const WARMUP_SECONDS = Number(process.env['BENCH_WARMUP_SECONDS'] ?? 2);
const CONNECTIONS = Number(process.env['BENCH_CONNECTIONS'] ?? 100);
const SETUPS = Number(process.env['BENCH_SETUPS'] ?? 10_000);
/** App processes (cluster workers), for the app and the bare route alike: one per core unless set. */
const WORKERS = workerCount(process.env['BENCH_WORKERS'] ?? 'auto', os.availableParallelism());
const PASSWORD = 'bench-password-123';

function startChild(args: string[], env: NodeJS.ProcessEnv, ready: RegExp): Promise<ChildProcess> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      if (ready.test(out)) resolve(child);
    });
    child.once('exit', (code) => reject(new Error(`child exited with ${code}: ${out}`)));
  });
}

/** CPU seconds used so far by these processes, from Linux's /proc (USER_HZ 100); 0 where unreadable. */
function cpuSeconds(pids: readonly number[]): number {
  let ticks = 0;
  for (const pid of pids) {
    try {
      const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      ticks += Number(fields[11]) + Number(fields[12]); // utime and stime: fields 14 and 15 of proc(5)
    } catch {
      // gone, or not Linux
    }
  }
  return ticks / 100;
}

/** A process and its children (the cluster primary and its workers). */
function withChildren(pid: number): number[] {
  try {
    const children = fs.readFileSync(`/proc/${pid}/task/${pid}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number);
    return [pid, ...children];
  } catch {
    return [pid];
  }
}

/** Whose CPU time a route's rows report: the processes serving it, and MariaDB. */
let serving: number[] = [];
let database: number[] = [];

interface Row {
  name: string;
  rps: number;
  /** CPU time per request, in microseconds, of the serving processes and of MariaDB. */
  appUs: number;
  dbUs: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  s5xx: number;
}

const ONLY = process.env['BENCH_ROUTES']?.split(',');

async function load(name: string, opts: autocannon.Options): Promise<Row> {
  if (ONLY && !name.startsWith('bare') && !ONLY.some((part) => name.includes(part))) return { name, rps: 0, appUs: 0, dbUs: 0, p50: 0, p99: 0, errors: 0, non2xx: 0, s5xx: 0 };
  // A short unmeasured run first, so every route is measured with warm JIT code, pools and caches.
  await autocannon({ connections: CONNECTIONS, duration: WARMUP_SECONDS, ...opts });
  const [app0, db0] = [cpuSeconds(serving), cpuSeconds(database)];
  const r = await autocannon({ connections: CONNECTIONS, duration: SECONDS, ...opts });
  const [app1, db1] = [cpuSeconds(serving), cpuSeconds(database)];
  const perRequest = (seconds: number) => Math.round((seconds * 1e6) / Math.max(1, r.requests.total));
  const row: Row = {
    name,
    rps: Math.round(r.requests.average),
    appUs: perRequest(app1 - app0),
    dbUs: perRequest(db1 - db0),
    p50: r.latency.p50,
    p99: r.latency.p99,
    errors: r.errors + r.timeouts,
    non2xx: r.non2xx,
    s5xx: (r as unknown as { '5xx': number })['5xx'],
  };
  console.log(
    `  ${name.padEnd(38)} ${String(row.rps).padStart(6)} req/s  p50 ${String(row.p50).padStart(3)} ms  p99 ${String(row.p99).padStart(3)} ms` +
      `  CPU/req app ${String(row.appUs).padStart(4)} µs db ${String(row.dbUs).padStart(3)} µs  errors ${row.errors}  non-2xx ${row.non2xx}  5xx ${row.s5xx}`,
  );
  return row;
}

async function main(): Promise<void> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-bench-'));
  const dbPort = await freePort();
  const db = { host: '127.0.0.1', port: dbPort, name: 'slantwise_bench', user: 'slantwise_bench', password: 'bench-db-password' };
  const children: ChildProcess[] = [];
  const mariadb = await startMariaDb({ dataDir: dir, port: dbPort, database: db.name, user: db.user, password: db.password });
  try {
    const sequelize = createSequelize(db);
    initModels(sequelize);
    await migrate(sequelize);
    const team = await Team.create({ name: 'Bench shop' });
    const user = await User.create({ teamId: team.id, email: 'bench@example.test', name: 'Bench Lead', role: 'lead', passwordHash: await bcrypt.hash(PASSWORD, 12) });
    const kinds = ['taper', 'sine-bar', 'gauge-blocks', 'angle-blocks', 'lathe-taper', 'pins-rolls'];
    const started = Date.now();
    for (let i = 0; i < SETUPS; i += 1000) {
      const rows = Array.from({ length: Math.min(1000, SETUPS - i) }, (_, k) => ({
        teamId: team.id,
        ownerId: user.id,
        name: `Bench set-up ${i + k}`,
        kind: kinds[(i + k) % kinds.length]!,
        inputs: { unit: 'in', thickness: '0.750', angle: '7.5', taperLength: '1.250' },
        notes: 'Seeded for the load benchmark.',
        job: `JOB-${(i + k) % 200}`,
        // Status changes every six rows, so each kind has set-ups in every status (the list's filter
        // below matches about 1 in 18, i.e. ~555 rows: page 3 is a full page).
        status: (['draft', 'released', 'archived'] as const)[Math.floor((i + k) / kinds.length) % 3],
      }));
      await Setup.bulkCreate(rows);
    }
    const sample = await Setup.findOne({ where: { teamId: team.id }, order: [['id', 'DESC']] });
    await sequelize.close();
    console.log(`Seeded ${SETUPS} set-ups in ${((Date.now() - started) / 1000).toFixed(1)} s`);

    const appPort = await freePort();
    const profile = process.env['BENCH_PROFILE'] ? ['--cpu-prof', `--cpu-prof-dir=${process.env['BENCH_PROFILE']}`] : [];
    const env = { ...process.env, PORT: String(appPort), DB_HOST: db.host, DB_PORT: String(db.port), DB_NAME: db.name, DB_USER: db.user, DB_PASSWORD: db.password, STATIC_DIR: '', CALC_RATE_LIMIT: '100000000', WORKERS: String(WORKERS) };
    const app = await startChild([...profile, '--import', 'tsx', 'server/main.ts'], env, /listening/);
    children.push(app);
    const barePort = await freePort();
    const bareServer = await startChild(['--import', 'tsx', 'bench/bare-server.ts'], { PORT: String(barePort), WORKERS: String(WORKERS) }, /LISTENING/);
    children.push(bareServer);
    database = [Number(fs.readFileSync(path.join(dir, 'mysqld.pid'), 'utf8').trim())];
    const base = `http://127.0.0.1:${appPort}`;

    const csrfRes = await fetch(`${base}/api/auth/csrf`);
    const cookie0 = (csrfRes.headers.get('set-cookie') ?? '').split(';')[0]!;
    const { token } = (await csrfRes.json()) as { token: string };
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie: cookie0 }, body: JSON.stringify({ email: 'bench@example.test', password: PASSWORD }) });
    if (login.status !== 200) throw new Error(`bench sign-in failed: ${login.status}`);
    const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0]!;

    console.log(`\nautocannon: ${CONNECTIONS} connections, ${SECONDS} s per route, loopback; app and bare route ${WORKERS} worker(s) each, ${os.availableParallelism()} cores`);
    const json = { 'content-type': 'application/json' };
    console.log('CPU/req: CPU time of the serving processes and of MariaDB per request answered (autocannon\'s own not counted).');
    serving = withChildren(bareServer.pid!);
    const bare = await load('bare Express route (ceiling)', { url: `http://127.0.0.1:${barePort}/bare` });
    serving = withChildren(app.pid!);
    const calc = [
      await load('POST /api/calc/taper', { url: `${base}/api/calc/taper`, method: 'POST', headers: json, body: JSON.stringify({ unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250', depthPerPass: '0.040' }) }),
      await load('POST /api/calc/sine-bar', { url: `${base}/api/calc/sine-bar`, method: 'POST', headers: json, body: JSON.stringify({ unit: 'in', barLength: '5', angle: "14°30'", set: 'inch-81' }) }),
      await load('POST /api/calc/gauge-stack', { url: `${base}/api/calc/gauge-stack`, method: 'POST', headers: json, body: JSON.stringify({ target: '3.9762', set: 'inch-81' }) }),
      await load('POST /api/calc/lathe-taper', { url: `${base}/api/calc/lathe-taper`, method: 'POST', headers: json, body: JSON.stringify({ unit: 'in', taperPerFoot: '0.60235', workLength: '6' }) }),
    ];
    // Every request a new body: the engine's own cost, with no help from the answer cache.
    let n = 0;
    const fresh = await load('POST /api/calc/taper (all bodies new)', {
      url: `${base}/api/calc/taper`,
      requests: [{
        method: 'POST',
        headers: json,
        setupRequest: (req) => ({ ...req, body: JSON.stringify({ unit: 'in', thickness: '0.750', angle: (1 + (n++ % 100_000) / 10_000).toFixed(4), taperLength: '1.250', depthPerPass: '0.040' }) }),
      }],
    });
    const me = await load('GET /api/auth/me (session only)', { url: `${base}/api/auth/me`, headers: { cookie } });
    const list = await load('GET /api/setups (paged, filtered)', { url: `${base}/api/setups?page=3&pageSize=25&kind=taper&status=released`, headers: { cookie } });
    const detail = await load('GET /api/setups/:id', { url: `${base}/api/setups/${sample!.id}`, headers: { cookie } });

    const rows = [...calc, fresh, me, list, detail];
    console.log('\nAgainst the targets:');
    const check = (ok: boolean, text: string) => console.log(`  ${ok ? 'met ' : 'MISS'}  ${text}`);
    check(rows.every((r) => r.errors === 0 && r.s5xx === 0) && bare.errors === 0, 'zero errors and zero 5xx on every route');
    for (const r of calc) check(r.rps >= 0.5 * bare.rps, `${r.name}: ${(r.rps / bare.rps).toFixed(2)}× the bare route (≥ 0.5×)`);
    console.log(`  info  ${fresh.name}: ${(fresh.rps / bare.rps).toFixed(2)}× the bare route, p99 ${fresh.p99} ms (the engine's cost without the answer cache)`);
    for (const r of calc) check(r.p99 < 50, `${r.name}: p99 ${r.p99} ms (< 50 ms)`);
    check(list.p99 < 100, `${list.name}: p99 ${list.p99} ms (< 100 ms)`);
    check(rows.every((r) => r.non2xx === 0), 'every answer was 2xx');
  } finally {
    for (const c of children) {
      const exited = new Promise((r) => c.once('exit', r));
      c.kill('SIGTERM');
      await exited;
    }
    await mariadb.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

main().then(() => process.exit(0), (err: unknown) => {
  console.error(err);
  process.exit(1);
});
