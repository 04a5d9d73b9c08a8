/**
 * Restores a team archive (from GET /api/team/export) into an EMPTY instance:
 *   node --import tsx scripts/import-team.ts slantwise-team-1-2026-12-01.tar.gz
 * Uses the same environment as the app (DB_*, STORAGE_DRIVER, UPLOAD_DIR, S3_*); applies pending
 * migrations first. Exit codes: 0 imported, 1 failed (nothing kept), 2 the instance is not empty.
 */
import fs from 'node:fs';
import { loadConfig } from '../server/config';
import { createSequelize } from '../server/db';
import { migrate } from '../server/migrate';
import { createStorage } from '../server/services/storage/create-storage';
import { ImportConflict, importTeamArchive } from '../server/services/team-archive/team-import';

async function main(): Promise<number> {
  const file = process.argv[2];
  if (!file || process.argv.length > 3) {
    console.error('Usage: node --import tsx scripts/import-team.ts <team archive .tar.gz>');
    return 1;
  }
  if (!fs.existsSync(file)) {
    console.error(`Team import: no file at ${file}.`);
    return 1;
  }
  const config = loadConfig();
  const sequelize = createSequelize(config.db);
  const storage = createStorage(config.uploads);
  try {
    await migrate(sequelize);
    const summary = await importTeamArchive(sequelize, storage, fs.readFileSync(file));
    console.log(`Imported team "${summary.teamName}" as team ${summary.teamId}: ${summary.files} file(s).`);
    for (const [table, n] of Object.entries(summary.rows)) console.log(`  ${table}: ${n}`);
    if (summary.revokedInvitations) console.log(`  ${summary.revokedInvitations} open invitation(s) were revoked: send them again from the Team page.`);
    return 0;
  } catch (err) {
    console.error(err instanceof Error ? err.message : err);
    return err instanceof ImportConflict ? 2 : 1;
  } finally {
    await sequelize.close();
  }
}

main().then((code) => process.exit(code), (err: unknown) => {
  console.error(err);
  process.exit(1);
});
