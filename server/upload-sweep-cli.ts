/**
 * One sweep of orphaned upload files, by hand: `node --import tsx server/upload-sweep-cli.ts`.
 * Reads the same settings as the server (database, STORAGE_DRIVER / UPLOAD_DIR or S3_*, and
 * UPLOAD_SWEEP_GRACE_MINUTES as the age below which nothing is removed) and prints what it removed.
 * Exit code 0 on success, 1 when the sweep could not run.
 */
import { loadConfig } from './config';
import { createSequelize } from './db';
import { initModels } from './models';
import { createStorage } from './services/storage/create-storage';
import { S3Storage } from './services/storage/s3-storage';
import { sweepOrphanUploads } from './services/upload-sweep';

async function main(): Promise<number> {
  const config = loadConfig();
  const sequelize = createSequelize(config.db);
  initModels(sequelize);
  const storage = createStorage(config.uploads);
  try {
    const graceMinutes = Math.round(config.uploadSweep.graceMs / 60_000);
    const result = await sweepOrphanUploads({ sequelize, storage, olderThanMs: config.uploadSweep.graceMs });
    for (const key of result.removed) console.log(`removed ${key}`);
    console.log(`Checked ${result.checked} stored file(s); removed ${result.removed.length} orphaned file(s) older than ${graceMinutes} min.`);
    return 0;
  } finally {
    if (storage instanceof S3Storage) storage.close();
    await sequelize.close();
  }
}

if (require.main === module) {
  main().then(
    (code) => process.exit(code),
    (err: unknown) => {
      console.error('Upload sweep failed:', err instanceof Error ? err.message : err);
      process.exit(1);
    },
  );
}
