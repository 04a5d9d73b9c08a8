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

const SECONDS = Number(process.env['BENCH_SECONDS'] ?? 6);
const WARMUP_SECONDS = Number(process.env['BENCH_WARMUP_SECONDS'] ?? 2);
/** Warm-up before a route in the second and later rounds (the code is warm by then). */
const REWARM_SECONDS = Math.min(1, WARMUP_SECONDS);
/** Each route is measured once per round; the targets are judged on the median of the rounds. */
const ROUNDS = Math.max(1, Math.floor(Number(process.env['BENCH_ROUNDS'] ?? 3)));
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

/** The whole machine's CPU ticks from /proc/stat: all of them, and those idle (idle + iowait) and stolen by the host. */
function machineTicks(): { total: number; idle: number; steal: number } {
  try {
    const f = fs.readFileSync('/proc/stat', 'utf8').split('\n')[0]!.trim().split(/\s+/).slice(1).map(Number);
    // user nice system idle iowait irq softirq steal (guest time is already counted in user)
    const total = f.slice(0, 8).reduce((a, b) => a + b, 0);
    return { total, idle: f[3]! + f[4]!, steal: f[7]! };
  } catch {
    return { total: 0, idle: 0, steal: 0 };
  }
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
  /** The same for autocannon itself (this process): the load generator's share of the two cores. */
  loadUs: number;
  /** Share of the machine's CPU time that was idle, and that the hypervisor took, while measuring (%). */
  idlePct: number;
  stealPct: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  s5xx: number;
}

const ONLY = process.env['BENCH_ROUTES']?.split(',');

interface Route {
  name: string;
  /** 'bare': the ceiling; 'calc' and 'list': routes with targets; 'info': measured, no target. */
  kind: 'bare' | 'calc' | 'list' | 'info';
  opts: autocannon.Options;
}

async function load(name: string, opts: autocannon.Options, warmupSeconds: number): Promise<Row> {
  // A short unmeasured run first, so every route is measured with warm JIT code, pools and caches.
  await autocannon({ connections: CONNECTIONS, duration: warmupSeconds, ...opts });
  const [app0, db0, m0, own0] = [cpuSeconds(serving), cpuSeconds(database), machineTicks(), process.cpuUsage()];
  const r = await autocannon({ connections: CONNECTIONS, duration: SECONDS, ...opts });
  const [app1, db1, m1, own1] = [cpuSeconds(serving), cpuSeconds(database), machineTicks(), process.cpuUsage(own0)];
  const share = (a: number, b: number) => Math.round((100 * (b - a)) / Math.max(1, m1.total - m0.total));
  const perRequest = (seconds: number) => Math.round((seconds * 1e6) / Math.max(1, r.requests.total));
  const row: Row = {
    name,
    rps: Math.round(r.requests.average),
    appUs: perRequest(app1 - app0),
    dbUs: perRequest(db1 - db0),
    loadUs: perRequest((own1.user + own1.system) / 1e6),
    idlePct: share(m0.idle, m1.idle),
    stealPct: share(m0.steal, m1.steal),
    p50: r.latency.p50,
    p99: r.latency.p99,
    errors: r.errors + r.timeouts,
    non2xx: r.non2xx,
    s5xx: (r as unknown as { '5xx': number })['5xx'],
  };
  console.log(
    `  ${name.padEnd(38)} ${String(row.rps).padStart(6)} req/s  p50 ${String(row.p50).padStart(3)} ms  p99 ${String(row.p99).padStart(3)} ms` +
      `  CPU/req app ${String(row.appUs).padStart(4)} µs db ${String(row.dbUs).padStart(3)} µs autocannon ${String(row.loadUs).padStart(3)} µs  idle ${String(row.idlePct).padStart(2)} % steal ${row.stealPct} %  errors ${row.errors}  non-2xx ${row.non2xx}  5xx ${row.s5xx}`,
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
    // Extra V8/Node flags for the app and the bare route alike (for trying runtime settings).
    const flags = (process.env['BENCH_NODE_FLAGS'] ?? '').split(/\s+/).filter(Boolean);
    const app = await startChild([...flags, ...profile, '--import', 'tsx', 'server/main.ts'], env, /listening/);
    children.push(app);
    const barePort = await freePort();
    const bareServer = await startChild([...flags, '--import', 'tsx', 'bench/bare-server.ts'], { PORT: String(barePort), WORKERS: String(WORKERS) }, /LISTENING/);
    children.push(bareServer);
    database = [Number(fs.readFileSync(path.join(dir, 'mysqld.pid'), 'utf8').trim())];
    const base = `http://127.0.0.1:${appPort}`;

    const csrfRes = await fetch(`${base}/api/auth/csrf`);
    const cookie0 = (csrfRes.headers.get('set-cookie') ?? '').split(';')[0]!;
    const { token } = (await csrfRes.json()) as { token: string };
    const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie: cookie0 }, body: JSON.stringify({ email: 'bench@example.test', password: PASSWORD }) });
    if (login.status !== 200) throw new Error(`bench sign-in failed: ${login.status}`);
    const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0]!;

    console.log(`\nautocannon: ${CONNECTIONS} connections, ${SECONDS} s per route, ${ROUNDS} round(s), loopback; app and bare route ${WORKERS} worker(s) each, ${os.availableParallelism()} cores`);
    const json = { 'content-type': 'application/json' };
    console.log('CPU/req: CPU time of the serving processes, of MariaDB and of autocannon (this process) per request answered;');
    console.log('idle, steal: share of the whole machine\'s CPU time left idle, and taken by the hypervisor, while the route was measured.');
    const bareUrl = `http://127.0.0.1:${barePort}/bare`;
    const calcRoute = (name: string, path: string, body: object): Route => ({ name, kind: 'calc', opts: { url: `${base}${path}`, method: 'POST', headers: json, body: JSON.stringify(body) } });
    // Every request a new body: the engine's own cost, with no help from the answer cache.
    let n = 0;
    const allRoutes: Route[] = [
      { name: 'bare Express route (ceiling)', kind: 'bare', opts: { url: bareUrl } },
      calcRoute('POST /api/calc/taper', '/api/calc/taper', { unit: 'in', thickness: '0.750', angle: "7°30'", taperLength: '1.250', depthPerPass: '0.040' }),
      calcRoute('POST /api/calc/sine-bar', '/api/calc/sine-bar', { unit: 'in', barLength: '5', angle: "14°30'", set: 'inch-81' }),
      calcRoute('POST /api/calc/gauge-stack', '/api/calc/gauge-stack', { target: '3.9762', set: 'inch-81' }),
      calcRoute('POST /api/calc/lathe-taper', '/api/calc/lathe-taper', { unit: 'in', taperPerFoot: '0.60235', workLength: '6' }),
      {
        name: 'POST /api/calc/taper (all bodies new)',
        kind: 'info',
        opts: {
          url: `${base}/api/calc/taper`,
          requests: [{
            method: 'POST',
            headers: json,
            setupRequest: (req: autocannon.Request) => ({ ...req, body: JSON.stringify({ unit: 'in', thickness: '0.750', angle: (1 + (n++ % 100_000) / 10_000).toFixed(4), taperLength: '1.250', depthPerPass: '0.040' }) }),
          }],
        },
      },
      { name: 'GET /api/auth/me (session only)', kind: 'info', opts: { url: `${base}/api/auth/me`, headers: { cookie } } },
      { name: 'GET /api/setups (paged, filtered)', kind: 'list', opts: { url: `${base}/api/setups?page=3&pageSize=25&kind=taper&status=released`, headers: { cookie } } },
      { name: 'GET /api/setups/:id', kind: 'info', opts: { url: `${base}/api/setups/${sample!.id}`, headers: { cookie } } },
    ];
    const routes = allRoutes.filter((r) => r.kind === 'bare' || !ONLY || ONLY.some((part) => r.name.includes(part)));

    // Each round measures every route once, the ceiling first, so each ratio compares routes
    // measured within the same minute; the host's speed drifts between rounds.
    const rounds: Row[][] = [];
    const appPids = withChildren(app.pid!);
    const barePids = withChildren(bareServer.pid!);
    for (let round = 1; round <= ROUNDS; round += 1) {
      console.log(`\nRound ${round} of ${ROUNDS}:`);
      const rows: Row[] = [];
      for (const route of routes) {
        serving = route.kind === 'bare' ? barePids : appPids;
        rows.push(await load(route.name, route.opts, round === 1 ? WARMUP_SECONDS : REWARM_SECONDS));
      }
      rounds.push(rows);
    }

    const median = (values: number[]) => {
      const sorted = [...values].sort((a, b) => a - b);
      const mid = Math.floor(sorted.length / 2);
      return sorted.length % 2 ? sorted[mid]! : Math.round(((sorted[mid - 1]! + sorted[mid]!) / 2) * 100) / 100;
    };
    const column = (i: number, pick: (r: Row) => number) => rounds.map((rows) => pick(rows[i]!));
    const ratios = (i: number) => rounds.map((rows) => rows[i]!.rps / rows[0]!.rps);
    if (ROUNDS > 1) {
      console.log(`\nMedian of the ${ROUNDS} rounds (the ratio is the median of each round's ratio to that round's ceiling):`);
      routes.forEach((route, i) => {
        const m = (pick: (r: Row) => number) => median(column(i, pick));
        console.log(
          `  ${route.name.padEnd(38)} ${String(Math.round(m((r) => r.rps))).padStart(6)} req/s  p50 ${String(m((r) => r.p50)).padStart(3)} ms  p99 ${String(m((r) => r.p99)).padStart(3)} ms` +
            `  CPU/req app ${String(Math.round(m((r) => r.appUs))).padStart(4)} µs db ${String(Math.round(m((r) => r.dbUs))).padStart(3)} µs autocannon ${String(Math.round(m((r) => r.loadUs))).padStart(3)} µs` +
            (route.kind === 'bare' ? '' : `  ${median(ratios(i)).toFixed(2)}× the ceiling`),
        );
      });
    }

    console.log(`\nAgainst the targets (medians of ${ROUNDS} round(s); in brackets, the rounds that met it):`);
    const check = (ok: boolean, text: string) => console.log(`  ${ok ? 'met ' : 'MISS'}  ${text}`);
    const all = rounds.flat();
    check(all.every((r) => r.errors === 0 && r.s5xx === 0), `zero errors and zero 5xx on every route of every round (${all.reduce((s, r) => s + r.errors, 0)} errors, ${all.reduce((s, r) => s + r.s5xx, 0)} 5xx)`);
    const of = (values: number[], ok: (v: number) => boolean) => `${values.filter(ok).length} of ${values.length}`;
    routes.forEach((route, i) => {
      if (route.kind !== 'calc') return;
      const r = ratios(i);
      check(median(r) >= 0.5, `${route.name}: ${median(r).toFixed(2)}× the bare route (≥ 0.5×) [${of(r, (v) => v >= 0.5)}]`);
    });
    routes.forEach((route, i) => {
      if (route.kind !== 'info' || !route.name.includes('bodies new')) return;
      console.log(`  info  ${route.name}: ${median(ratios(i)).toFixed(2)}× the bare route, p99 ${median(column(i, (r) => r.p99))} ms (the engine's cost without the answer cache)`);
    });
    routes.forEach((route, i) => {
      const p99 = column(i, (r) => r.p99);
      if (route.kind === 'calc') check(median(p99) < 50, `${route.name}: p99 ${median(p99)} ms (< 50 ms) [${of(p99, (v) => v < 50)}]`);
      if (route.kind === 'list') check(median(p99) < 100, `${route.name}: p99 ${median(p99)} ms (< 100 ms) [${of(p99, (v) => v < 100)}]`);
    });
    check(all.every((r) => r.non2xx === 0), 'every answer was 2xx');
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
