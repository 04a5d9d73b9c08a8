/**
 * Export of everything a team has: every team table's rows in `team.json` plus every attachment
 * file and thumbnail under `files/<storage key>`, in one gzip-compressed tar archive.
 */
import { once } from 'node:events';
import { createHash } from 'node:crypto';
import type { Writable } from 'node:stream';
import { finished } from 'node:stream/promises';
import archiver from 'archiver';
import { QueryTypes, Transaction, type Sequelize } from 'sequelize';
import { migrations } from '../../migrations';
import { ObjectNotFound, type ObjectStorage } from '../storage/object-storage';
import { NOT_EXPORTED, TEAM_ARCHIVE_FORMAT, TEAM_TABLES } from './team-tables';

/** A table row as stored (dates become ISO strings in team.json). */
export type TeamRow = Record<string, unknown>;

/** One stored file in the archive. */
export interface ArchiveFile {
  /** Entry name in the archive: `files/<key>`. */
  readonly path: string;
  /** The storage key it had in the exporting instance (the importer makes new keys). */
  readonly key: string;
  readonly contentType: string;
  readonly size: number;
  readonly sha256: string;
}

/** The contents of team.json. */
export interface TeamArchiveManifest {
  readonly format: typeof TEAM_ARCHIVE_FORMAT;
  readonly exportedAt: string;
  /** Newest migration of the exporting instance. */
  readonly schema: string;
  readonly team: { readonly id: number; readonly name: string };
  /** Rows of every exported table, oldest id first. */
  readonly tables: Readonly<Record<string, readonly TeamRow[]>>;
  readonly files: readonly ArchiveFile[];
  /** Keys of attachment files the storage did not have at export time (their rows are kept). */
  readonly missingFiles: readonly string[];
  /** What is deliberately not in the archive. */
  readonly omitted: { readonly tables: Readonly<Record<string, string>>; readonly columns: Readonly<Record<string, readonly string[]>> };
}

/** The team's rows, read in one consistent snapshot, and the files they refer to. */
export interface TeamData {
  readonly team: { readonly id: number; readonly name: string };
  readonly tables: Record<string, TeamRow[]>;
  readonly files: ReadonlyArray<{ key: string; contentType: string }>;
}

/** Reads every exported table of one team inside one repeatable-read transaction. */
export async function readTeamData(sequelize: Sequelize, teamId: number): Promise<TeamData> {
  const tables: Record<string, TeamRow[]> = {};
  await sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.REPEATABLE_READ }, async (transaction) => {
    for (const spec of TEAM_TABLES) {
      const rows = await sequelize.query<TeamRow>(`SELECT * FROM \`${spec.table}\` WHERE ${spec.where} ORDER BY id`, {
        replacements: { teamId },
        type: QueryTypes.SELECT,
        transaction,
      });
      tables[spec.table] = rows.map((row) => {
        const copy: TeamRow = { ...row };
        for (const column of spec.omit ?? []) delete copy[column];
        return copy;
      });
    }
  });
  const team = tables['teams']?.[0];
  if (!team) throw new Error(`Team export: no team with id ${teamId}.`);
  const files: Array<{ key: string; contentType: string }> = [];
  for (const a of tables['attachments'] ?? []) {
    files.push({ key: String(a['storageKey']), contentType: String(a['contentType']) });
    if (a['thumbnailKey']) files.push({ key: String(a['thumbnailKey']), contentType: 'image/jpeg' });
  }
  return { team: { id: Number(team['id']), name: String(team['name']) }, tables, files };
}

/** team.json text: dates as ISO strings, big integers as numbers. */
export function manifestJson(manifest: TeamArchiveManifest): string {
  return JSON.stringify(manifest, (_key, value: unknown) => (typeof value === 'bigint' ? Number(value) : value), 1);
}

/**
 * Streams the archive into `out`: each stored file as `files/<key>` (read one at a time), then
 * team.json with every file's size and SHA-256. Rejects (and aborts the archive) on a storage error.
 */
export async function writeTeamArchive(data: TeamData, storage: ObjectStorage, out: Writable): Promise<TeamArchiveManifest> {
  const archive = archiver('tar', { gzip: true, gzipOptions: { level: 6 } });
  const state: { failure: Error | null } = { failure: null };
  archive.on('error', (err) => {
    state.failure = err;
  });
  // A warning (e.g. an entry it could not read) would make an incomplete archive: treat it as an error.
  archive.on('warning', (err) => {
    state.failure = err;
  });
  archive.pipe(out);
  const files: ArchiveFile[] = [];
  const missingFiles: string[] = [];
  const add = async (name: string, body: Buffer) => {
    const written = once(archive, 'entry');
    archive.append(body, { name, mode: 0o644, date: new Date() });
    await written;
    if (state.failure) throw state.failure;
  };
  try {
    for (const file of data.files) {
      let bytes: Buffer;
      try {
        bytes = await storage.get(file.key);
      } catch (err) {
        if (err instanceof ObjectNotFound) {
          missingFiles.push(file.key);
          continue;
        }
        throw err;
      }
      const path = `files/${file.key}`;
      await add(path, bytes);
      files.push({ path, key: file.key, contentType: file.contentType, size: bytes.length, sha256: createHash('sha256').update(bytes).digest('hex') });
    }
    const manifest: TeamArchiveManifest = {
      format: TEAM_ARCHIVE_FORMAT,
      exportedAt: new Date().toISOString(),
      schema: migrations[migrations.length - 1]?.name ?? '',
      team: data.team,
      tables: data.tables,
      files,
      missingFiles,
      omitted: {
        tables: NOT_EXPORTED,
        columns: Object.fromEntries(TEAM_TABLES.filter((t) => t.omit?.length).map((t) => [t.table, t.omit ?? []])),
      },
    };
    await add('team.json', Buffer.from(manifestJson(manifest), 'utf8'));
    const done = finished(out);
    await archive.finalize();
    await done;
    return manifest;
  } catch (err) {
    archive.abort();
    throw err;
  }
}
