/**
 * `npm test` after the install step: a throwaway MariaDB (own data dir and port), migrations,
 * the demo seed, the SMTP catcher and the built app on a free port; then type checks and every
 * jest project (unit, web, api, e2e). Extra arguments go to jest, e.g. `npm test -- --selectProjects unit`.
 */
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { startServer } from '../server/main';
import { migrate } from '../server/migrate';
import { initModels } from '../server/models';
import { seedDemo } from '../server/seed/demo';
import { startMailCatcher } from '../server/services/mail-catcher';
import { startMariaDb } from './mariadb';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

function step(name: string, cmd: string, args: string[]): boolean {
  const started = Date.now();
  console.log(`\n=== ${name}`);
  const r = spawnSync(cmd, args, { stdio: 'inherit', env: process.env });
  console.log(`=== ${name}: ${r.status === 0 ? 'ok' : 'FAILED'} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return r.status === 0;
}

/** Like `step`, but keeps this process's event loop free: the SMTP catcher and the app answer jest meanwhile. */
function stepAsync(name: string, cmd: string, args: string[]): Promise<boolean> {
  const started = Date.now();
  console.log(`\n=== ${name}`);
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', env: process.env });
    child.on('close', (code) => {
      console.log(`=== ${name}: ${code === 0 ? 'ok' : 'FAILED'} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
      resolve(code === 0);
    });
  });
}

/** The plain closing line of the run: "tests: N passed, N failed[, N skipped]". */
function jestSummary(file: string): string {
  if (!fs.existsSync(file)) return '';
  const r = JSON.parse(fs.readFileSync(file, 'utf8')) as { numPassedTests: number; numFailedTests: number; numPendingTests: number; numRuntimeErrorTestSuites: number };
  const failed = r.numFailedTests + r.numRuntimeErrorTestSuites;
  return `tests: ${r.numPassedTests} passed, ${failed} failed${r.numPendingTests ? `, ${r.numPendingTests} skipped` : ''}`;
}

async function main(): Promise<number> {
  const jestArgs = process.argv.slice(2);
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-test-'));
  const env = process.env;
  env['DB_PORT'] = String(await freePort());
  env['DB_NAME'] = 'slantwise_test';
  env['DB_USER'] = 'slantwise_test';
  env['DB_PASSWORD'] = 'test-' + Math.random().toString(36).slice(2);
  env['SMTP_PORT'] = String(await freePort());
  // The app for end-to-end tests gets a port of its own now, so links in captured e-mails point at it.
  const appPort = await freePort();
  env['PUBLIC_URL'] = `http://127.0.0.1:${appPort}`;
  env['MAIL_FAKE'] = 'true';
  env['UPLOAD_DIR'] = path.join(tmp, 'uploads');
  env['DEMO_PASSWORD'] ??= 'kestrel-demo-2026';
  env['TEST_ARTIFACTS'] ??= path.resolve('test-artifacts');
  const config = loadConfig(env);

  console.log(`[test] throwaway MariaDB on 127.0.0.1:${config.db.port} in ${tmp}`);
  const db = await startMariaDb({ dataDir: path.join(tmp, 'db'), port: config.db.port, database: config.db.name, user: config.db.user, password: config.db.password });
  const stops: Array<() => Promise<void>> = [() => db.stop()];
  let ok = true;
  let summary = '';
  try {
    const sequelize = createSequelize(config.db);
    initModels(sequelize);
    await migrate(sequelize);
    await seedDemo(config.demoPassword);
    await sequelize.close();
    const catcher = await startMailCatcher({ config });
    stops.push(() => catcher.stop());

    const skipSlow = env['TEST_QUICK'] === '1';
    if (!skipSlow) {
      ok = step('type check (app, server, specs)', process.execPath, ['node_modules/typescript/bin/tsc', '--noEmit', '-p', 'tsconfig.app.json']) && ok;
      ok = step('type check (server)', process.execPath, ['node_modules/typescript/bin/tsc', '--noEmit', '-p', 'tsconfig.server.json']) && ok;
      ok = step('type check (specs)', process.execPath, ['node_modules/typescript/bin/tsc', '--noEmit', '-p', 'tsconfig.spec.json']) && ok;
      ok = step('production build', process.execPath, ['node_modules/@angular/cli/bin/ng.js', 'build', '--configuration', 'production']) && ok;
    }

    const server = await startServer({ ...config, port: appPort, calcRateLimitPerMinute: 100_000 });
    stops.push(() => server.close());
    env['E2E_BASE_URL'] = server.url;
    console.log(`[test] app for end-to-end tests at ${server.url}`);

    const report = path.join(tmp, 'jest-report.json');
    ok = (await stepAsync('jest (unit, web, api, e2e)', process.execPath, ['node_modules/jest/bin/jest.js', '--ci', '--json', `--outputFile=${report}`, ...jestArgs])) && ok;
    summary = jestSummary(report);
  } catch (err) {
    console.error('[test] set-up failed:', err);
    ok = false;
  } finally {
    for (const stop of stops.reverse()) await stop().catch((e: unknown) => console.error(e));
    fs.rmSync(tmp, { recursive: true, force: true });
  }
  if (summary) console.log(`\n${summary}`);
  return ok ? 0 : 1;
}

main().then((code) => process.exit(code), (err: unknown) => {
  console.error(err);
  process.exit(1);
});
