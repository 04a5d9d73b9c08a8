/** `npm run migrate`: applies pending migrations to the database the DB_* settings name (for deployments). */
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { migrate } from '../server/migrate';

async function main(): Promise<void> {
  const sequelize = createSequelize(loadConfig().db);
  try {
    const applied = await migrate(sequelize);
    console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'No migrations pending.');
  } finally {
    await sequelize.close();
  }
}

main().catch((err: unknown) => {
  console.error('Migration failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
