/**
 * MariaDB replication as the app's standby: a replica follows the primary (GTID), keeps every
 * committed set-up and every session, and after a failover (replica promoted, instances pointed at
 * it) signed-in people stay signed in and nothing committed is lost.
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import request from 'supertest';
import { loadConfig, type AppConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { startServer, type RunningServer } from '../../server/main';
import { migrate } from '../../server/migrate';
import { initModels } from '../../server/models';
import { startMariaDb, type RunningMariaDb } from '../../scripts/mariadb';
import { freePort } from '../support/isolated-db';
import { makeTeam, PASSWORD, type Members } from '../support/api';

const run = promisify(execFile);
const DB = { name: 'slantwise_repl', user: 'slantwise_repl', password: 'repl-app-password' };

let dir: string;
let primary: RunningMariaDb;
let replica: RunningMariaDb;
let app: RunningServer | null = null;
let m: Members;

function sqlAsRoot(server: RunningMariaDb, sql: string): Promise<{ stdout: string }> {
  return run('mariadb', ['--no-defaults', `--socket=${server.socket}`, '-uroot', '-N', '-e', sql]);
}

function configFor(port: number): AppConfig {
  return { ...loadConfig(), staticDir: null, port: 0, db: { host: '127.0.0.1', port, ...DB } };
}

async function until(what: string, check: () => Promise<boolean>): Promise<void> {
  for (let i = 0; i < 100; i++) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`timed out waiting for ${what}`);
}

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-repl-'));
  const [p1, p2] = [await freePort(), await freePort()];
  primary = await startMariaDb({ dataDir: path.join(dir, 'primary'), port: p1, ...dbOpts(), extraArgs: ['--server-id=1', '--log-bin=primary-bin', '--binlog-format=ROW'] });
  await sqlAsRoot(primary, "CREATE USER 'repl'@'127.0.0.1' IDENTIFIED BY 'repl-password'; GRANT REPLICATION SLAVE ON *.* TO 'repl'@'127.0.0.1'");
  replica = await startMariaDb({ dataDir: path.join(dir, 'replica'), port: p2, ...dbOpts(), extraArgs: ['--server-id=2', '--log-bin=replica-bin', '--read-only=1'] });
  await sqlAsRoot(replica, `CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=${p1}, MASTER_USER='repl', MASTER_PASSWORD='repl-password', MASTER_USE_GTID=slave_pos; START SLAVE`);

  const sequelize = createSequelize(configFor(p1).db);
  initModels(sequelize);
  await migrate(sequelize);
  await sequelize.close();
  app = await startServer(configFor(p1));
  m = await makeTeam('replication');
}, 120_000);

function dbOpts() {
  return { database: DB.name, user: DB.user, password: DB.password };
}

afterAll(async () => {
  await app?.close();
  await replica?.stop();
  await primary?.stop();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('a replica of the primary', () => {
  it('holds committed data and sessions, and takes over after a failover without signing anyone out', async () => {
    const csrf = await request(app!.url).get('/api/auth/csrf').expect(200);
    const login = await request(app!.url).post('/api/auth/login').set('Cookie', String(csrf.headers['set-cookie']).split(';')[0]!).set('X-CSRF-Token', csrf.body.token).send({ email: m.lead.email, password: PASSWORD }).expect(200);
    const cookie = String(login.headers['set-cookie']).split(';')[0]!;
    const token = csrf.body.token as string;
    const created = await request(app!.url).post('/api/setups').set('Cookie', cookie).set('X-CSRF-Token', token).send({ name: 'Replicated wedge', kind: 'taper', inputs: { unit: 'in' } }).expect(201);

    // The replica catches up with the set-up and the session.
    await until('the set-up on the replica', async () => (await sqlAsRoot(replica, `SELECT COUNT(*) FROM ${DB.name}.setups WHERE id = ${created.body.id}`)).stdout.trim() === '1');
    await until('the session on the replica', async () => (await sqlAsRoot(replica, `SELECT COUNT(*) FROM ${DB.name}.sessions WHERE userId = ${m.lead.id}`)).stdout.trim() !== '0');
    // The replica refuses writes from the application while it is a replica.
    await expect(run('mariadb', ['--no-defaults', '-h127.0.0.1', `-P${replica.port}`, `-u${DB.user}`, `-p${DB.password}`, DB.name, '-e', "UPDATE setups SET name = 'x'"])).rejects.toThrow(/read-only/);

    // Failover: the primary goes away, the replica is promoted, the app is pointed at it.
    await app!.close();
    app = null;
    await primary.stop();
    await sqlAsRoot(replica, 'STOP SLAVE; RESET SLAVE ALL; SET GLOBAL read_only = 0');
    app = await startServer(configFor(replica.port));

    const me = await request(app.url).get('/api/auth/me').set('Cookie', cookie).expect(200);
    expect(me.body.email).toBe(m.lead.email);
    const kept = await request(app.url).get(`/api/setups/${created.body.id}`).set('Cookie', cookie).expect(200);
    expect(kept.body.name).toBe('Replicated wedge');
    const edited = await request(app.url).put(`/api/setups/${created.body.id}`).set('Cookie', cookie).set('X-CSRF-Token', token).send({ name: 'Edited after failover', kind: 'taper', inputs: { unit: 'in' }, version: kept.body.version }).expect(200);
    expect(edited.body.version).toBe(kept.body.version + 1);
  }, 120_000);
});
