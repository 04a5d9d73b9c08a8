/**
 * `npm start`: the private MariaDB (data kept in .data/db), migrations, the demo seed, the local
 * SMTP catcher, a production build of the Angular app, then one Express process for app and API.
 * Ctrl-C stops everything cleanly.
 */
import { execFileSync } from 'node:child_process';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { startServer } from '../server/main';
import { migrate } from '../server/migrate';
import { initModels } from '../server/models';
import { seedDemo } from '../server/seed/demo';
import { startMariaDb } from './mariadb';
import { startMailCatcher } from '../server/services/mail-catcher';

async function main(): Promise<void> {
  const config = loadConfig();
  const stops: Array<() => Promise<void>> = [];
  let stopping = false;
  const shutdown = async (code: number) => {
    if (stopping) return;
    stopping = true;
    console.log('\nStopping Slantwise…');
    for (const stop of stops.reverse()) await stop().catch((e: unknown) => console.error(e));
    process.exit(code);
  };
  process.once('SIGINT', () => void shutdown(0));
  process.once('SIGTERM', () => void shutdown(0));

  try {
    console.log(`[db] MariaDB on 127.0.0.1:${config.db.port} (data in .data/db)`);
    const db = await startMariaDb({ dataDir: process.env['DB_DIR'] ?? '.data/db', port: config.db.port, database: config.db.name, user: config.db.user, password: config.db.password });
    stops.push(() => db.stop());

    const sequelize = createSequelize(config.db);
    initModels(sequelize);
    const applied = await migrate(sequelize);
    console.log(`[db] migrations applied: ${applied.length ? applied.join(', ') : 'none pending'}`);
    const seeded = await seedDemo(config.demoPassword);
    console.log(`[db] demo data: ${seeded.created} record(s) added`);
    await sequelize.close();

    if (config.mailFake) {
      const catcher = await startMailCatcher({ config });
      stops.push(() => catcher.stop());
      console.log(`[mail] SMTP catcher on 127.0.0.1:${config.smtp.port} (messages on the Team › Mailbox page)`);
    }

    if (process.env['SKIP_BUILD'] !== '1') {
      console.log('[build] building the Angular app (production)…');
      execFileSync(process.execPath, ['node_modules/@angular/cli/bin/ng.js', 'build', '--configuration', 'production'], { stdio: 'inherit' });
    }

    const server = await startServer(config, { sweepUploads: true });
    stops.push(() => server.close());
    console.log(`\nSlantwise is running at ${server.url}/`);
    console.log(`Demo sign-ins (password: ${process.env['DEMO_PASSWORD'] ? 'the DEMO_PASSWORD you set' : config.demoPassword}):`);
    for (const email of ['admin@demo.test', 'lead@demo.test', 'machinist@demo.test', 'apprentice@demo.test']) console.log(`  ${email}`);
    console.log('Press Ctrl-C to stop.');
  } catch (err) {
    console.error('Slantwise could not start:', err instanceof Error ? err.message : err);
    await shutdown(1);
  }
}

void main();
