/**
 * Removal of orphaned upload files. An upload stores its file (and thumbnail) before the
 * attachment row commits, and a disk write goes through a `.part` temp file: a process killed in
 * between leaves files no row refers to. The sweep removes those once they are older than a grace
 * period, so an upload still in flight is never touched. Running it on several instances at once
 * is harmless (removing a file twice is not an error).
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { ObjectStorage, StoredObject } from './storage/object-storage';

export interface SweepResult {
  /** Objects and temp files listed in the storage. */
  readonly checked: number;
  /** Keys removed (orphaned objects and stale temp files). */
  readonly removed: string[];
}

/** Keys looked up in one query: bounded memory and statement size whatever the storage holds. */
const CHUNK = 500;
const THUMB = '-thumb';

/** The keys among `keys` that an attachment refers to, as its file or its thumbnail. */
async function referenced(sequelize: Sequelize, keys: readonly string[]): Promise<Set<string>> {
  const found = new Set<string>();
  const wanted = new Set(keys);
  // storageKey has a unique index; a thumbnail is stored as "<storageKey>-thumb", so asking for
  // the stems too finds both columns of those rows through the index.
  const stems = keys.filter((k) => k.endsWith(THUMB)).map((k) => k.slice(0, -THUMB.length));
  const rows = await sequelize.query<{ storageKey: string; thumbnailKey: string | null }>('SELECT storageKey, thumbnailKey FROM attachments WHERE storageKey IN (:keys)', {
    replacements: { keys: [...new Set([...keys, ...stems])] },
    type: QueryTypes.SELECT,
  });
  for (const row of rows) {
    if (wanted.has(row.storageKey)) found.add(row.storageKey);
    if (row.thumbnailKey !== null && wanted.has(row.thumbnailKey)) found.add(row.thumbnailKey);
  }
  // Whatever is left may still be a thumbnail under another name: ask that column directly (rare).
  const left = keys.filter((k) => !found.has(k));
  if (left.length > 0) {
    const thumbs = await sequelize.query<{ thumbnailKey: string }>('SELECT thumbnailKey FROM attachments WHERE thumbnailKey IN (:keys)', {
      replacements: { keys: left },
      type: QueryTypes.SELECT,
    });
    for (const row of thumbs) found.add(row.thumbnailKey);
  }
  return found;
}

/**
 * Removes every object (and stale temp file) older than `olderThanMs` that no
 * `attachments.storageKey` or `attachments.thumbnailKey` refers to. Logs one line when it removed
 * something; errors (database, storage) reject the promise.
 */
export async function sweepOrphanUploads(opts: { sequelize: Sequelize; storage: ObjectStorage; olderThanMs: number; now?: Date }): Promise<SweepResult> {
  const { sequelize, storage, olderThanMs } = opts;
  if (typeof olderThanMs !== 'number' || !Number.isFinite(olderThanMs) || olderThanMs < 0) {
    throw new Error(`sweepOrphanUploads: olderThanMs must be a number of milliseconds, 0 or more (got ${String(olderThanMs)}).`);
  }
  const now = opts.now ?? new Date();
  if (Number.isNaN(now.getTime())) throw new Error('sweepOrphanUploads: now is not a valid date.');
  const cutoff = now.getTime() - olderThanMs;

  const listed = await storage.list('');
  const old = listed.filter((o) => o.lastModified.getTime() <= cutoff);
  const temps = old.filter((o) => o.temp === true);
  const objects = old.filter((o) => o.temp !== true);

  const orphans: StoredObject[] = [...temps];
  for (let i = 0; i < objects.length; i += CHUNK) {
    const chunk = objects.slice(i, i + CHUNK);
    const inUse = await referenced(sequelize, chunk.map((o) => o.key));
    orphans.push(...chunk.filter((o) => !inUse.has(o.key)));
  }

  const removed: string[] = [];
  for (const orphan of orphans) {
    await storage.delete(orphan.key);
    removed.push(orphan.key);
  }
  if (removed.length > 0) {
    console.log(
      `Upload sweep: removed ${removed.length} orphaned file(s) older than ${Math.round(olderThanMs / 60_000)} min ` +
        `(${temps.length} temp) of ${listed.length} checked.`,
    );
  }
  return { checked: listed.length, removed };
}

export interface UploadSweeper {
  /** Stops the timer; a sweep already running finishes on its own. */
  stop(): void;
}

/**
 * Runs {@link sweepOrphanUploads} on a timer: first after `firstDelayMs`, then `everyMs` after the
 * previous sweep ended (never two at once). The timer does not keep the process alive, and a
 * failing sweep (say the database is down) is logged, never thrown.
 */
export function scheduleUploadSweeps(opts: {
  sequelize: Sequelize;
  storage: ObjectStorage;
  everyMs: number;
  graceMs: number;
  firstDelayMs?: number;
  log?: (line: string) => void;
}): UploadSweeper {
  const { sequelize, storage, everyMs, graceMs, firstDelayMs = 60_000, log = console.error } = opts;
  let timer: NodeJS.Timeout | undefined;
  let stopped = false;
  const run = async () => {
    try {
      await sweepOrphanUploads({ sequelize, storage, olderThanMs: graceMs });
    } catch (err) {
      log(`Upload sweep failed (will try again in ${Math.round(everyMs / 60_000)} min): ${err instanceof Error ? err.message : String(err)}`);
    }
    if (!stopped) arm(everyMs);
  };
  const arm = (delay: number) => {
    timer = setTimeout(() => void run(), delay);
    timer.unref();
  };
  if (everyMs > 0) arm(firstDelayMs);
  return {
    stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
    },
  };
}
