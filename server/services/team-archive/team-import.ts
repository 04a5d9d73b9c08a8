/**
 * Import of a team archive into an empty instance: every row inside one transaction with new ids
 * (references remapped), files stored under new server-made keys. Any failure rolls the rows back
 * and removes the files already written, so an import is all or nothing.
 */
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { ObjectStorage } from '../storage/object-storage';
import type { ArchiveFile, TeamArchiveManifest, TeamRow } from './team-export';
import { readTarGz, type TarEntry } from './tar-reader';
import { TEAM_ARCHIVE_FORMAT, TEAM_TABLES } from './team-tables';
import { remapInputsText, remapRevisionText } from './box-refs';

/** The archive cannot be imported as it is (damaged, another format, inconsistent). */
export class ImportInvalid extends Error {
  readonly status = 400;
  constructor(message: string) {
    super(`Team import: ${message}`);
    this.name = 'ImportInvalid';
  }
}

/** The instance is not empty: importing would mix two shops' data. */
export class ImportConflict extends Error {
  readonly status = 409;
  constructor(message: string) {
    super(`Team import: ${message}`);
    this.name = 'ImportConflict';
  }
}

/** What an import created. */
export interface ImportSummary {
  readonly teamId: number;
  readonly teamName: string;
  /** Rows inserted per table. */
  readonly rows: Readonly<Record<string, number>>;
  readonly files: number;
  /** Open invitations of the archive, now revoked (their links cannot work here). */
  readonly revokedInvitations: number;
  /** New id of each archived row, per table (old id → new id). */
  readonly ids: Readonly<Record<string, ReadonlyMap<number, number>>>;
}

interface ColumnInfo {
  readonly type: string;
  readonly allowNull: boolean;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Parses and checks team.json and the files it lists (size and SHA-256 of each). */
export function readArchive(archive: Buffer): { manifest: TeamArchiveManifest; files: Map<string, Buffer> } {
  let entries: TarEntry[];
  try {
    entries = readTarGz(archive);
  } catch (err) {
    throw new ImportInvalid(err instanceof Error ? err.message : String(err));
  }
  const byName = new Map<string, Buffer>();
  for (const e of entries) {
    if (byName.has(e.name)) throw new ImportInvalid(`the archive holds "${e.name}" twice.`);
    byName.set(e.name, e.body);
  }
  const json = byName.get('team.json');
  if (!json) throw new ImportInvalid('the archive has no team.json; is it a Slantwise team export?');
  let parsed: unknown;
  try {
    parsed = JSON.parse(json.toString('utf8'));
  } catch {
    throw new ImportInvalid('team.json is not valid JSON.');
  }
  if (!isRecord(parsed) || parsed['format'] !== TEAM_ARCHIVE_FORMAT) {
    throw new ImportInvalid(`team.json must have format "${TEAM_ARCHIVE_FORMAT}".`);
  }
  if (!isRecord(parsed['tables']) || !Array.isArray(parsed['files'])) throw new ImportInvalid('team.json lacks its tables or its file list.');
  for (const [table, rows] of Object.entries(parsed['tables'])) {
    if (!TEAM_TABLES.some((t) => t.table === table)) throw new ImportInvalid(`team.json has a table "${table}" this version does not know.`);
    if (!Array.isArray(rows) || !rows.every(isRecord)) throw new ImportInvalid(`table "${table}" must be a list of rows.`);
  }
  const manifest = parsed as unknown as TeamArchiveManifest;
  if ((manifest.tables['teams'] ?? []).length !== 1) throw new ImportInvalid('the archive must hold exactly one team.');
  const files = new Map<string, Buffer>();
  for (const f of manifest.files as readonly unknown[]) {
    if (!isRecord(f) || typeof f['key'] !== 'string' || typeof f['path'] !== 'string' || typeof f['sha256'] !== 'string') {
      throw new ImportInvalid('an entry of the file list lacks its key, path or sha256.');
    }
    const file = f as unknown as ArchiveFile;
    const body = byName.get(file.path);
    if (!body) throw new ImportInvalid(`the file ${file.path} listed in team.json is not in the archive.`);
    const sha = createHash('sha256').update(body).digest('hex');
    if (body.length !== file.size || sha !== file.sha256) throw new ImportInvalid(`the file ${file.path} does not match its checksum (damaged archive).`);
    files.set(file.key, body);
  }
  return { manifest, files };
}

async function describe(sequelize: Sequelize, table: string): Promise<Map<string, ColumnInfo>> {
  const raw = (await sequelize.getQueryInterface().describeTable(table)) as Record<string, { type: string; allowNull: boolean }>;
  return new Map(Object.entries(raw).map(([name, c]) => [name, { type: c.type.toUpperCase(), allowNull: c.allowNull }]));
}

function toDate(value: unknown, where: string): Date {
  const d = typeof value === 'string' || typeof value === 'number' ? new Date(value) : null;
  if (!d || Number.isNaN(d.getTime())) throw new ImportInvalid(`${where} is not a date.`);
  return d;
}

/** Refuses unless the instance holds no team and no user. */
export async function assertEmptyInstance(sequelize: Sequelize, transaction?: Transaction): Promise<void> {
  const [row] = await sequelize.query<{ teams: number | bigint; users: number | bigint }>(
    'SELECT (SELECT COUNT(*) FROM teams) AS teams, (SELECT COUNT(*) FROM users) AS users',
    { type: QueryTypes.SELECT, transaction },
  );
  const teams = Number(row?.teams ?? 0);
  const users = Number(row?.users ?? 0);
  if (teams > 0 || users > 0) {
    throw new ImportConflict(`this instance already holds ${teams} team(s) and ${users} user(s); import only into an empty instance (a fresh database).`);
  }
}

/** Imports a .tar.gz team archive into an empty instance: all rows and files, or nothing. */
export async function importTeamArchive(sequelize: Sequelize, storage: ObjectStorage, archive: Buffer): Promise<ImportSummary> {
  const { manifest, files } = readArchive(archive);
  await assertEmptyInstance(sequelize);
  const columns = new Map<string, Map<string, ColumnInfo>>();
  for (const spec of TEAM_TABLES) columns.set(spec.table, await describe(sequelize, spec.table));

  const ids: Record<string, Map<number, number>> = {};
  const counts: Record<string, number> = {};
  const pending: Array<{ key: string; body: Buffer; contentType: string }> = [];
  const written: string[] = [];
  let revokedInvitations = 0;
  const now = new Date();

  try {
    await sequelize.transaction(async (transaction) => {
      // Checked again inside the transaction: two imports at once cannot both pass.
      await assertEmptyInstance(sequelize, transaction);
      for (const spec of TEAM_TABLES) {
        const target = columns.get(spec.table)!;
        const map = new Map<number, number>();
        ids[spec.table] = map;
        const rows = [...(manifest.tables[spec.table] ?? [])].sort((a, b) => Number(a['id']) - Number(b['id']));
        for (const source of rows) {
          const oldId = Number(source['id']);
          const where = `${spec.table} row ${source['id']}`;
          if (!Number.isSafeInteger(oldId) || oldId < 1) throw new ImportInvalid(`${where}: the id is not a positive whole number.`);
          const row: TeamRow = {};
          for (const [column, value] of Object.entries(source)) {
            if (column === 'id') continue;
            const info = target.get(column);
            if (!info) throw new ImportInvalid(`${where}: column "${column}" does not exist here (the archive comes from a newer version; update this instance first).`);
            const ref = spec.refs[column];
            if (ref && value !== null && value !== undefined) {
              const mapped = ids[ref]?.get(Number(value));
              if (mapped === undefined) {
                if (!info.allowNull) throw new ImportInvalid(`${where}: ${column} ${String(value)} refers to a ${ref} row that is not in the archive.`);
                row[column] = null;
              } else row[column] = mapped;
            } else if (value !== null && /^(DATETIME|TIMESTAMP|DATE)\b/.test(info.type)) {
              row[column] = toDate(value, `${where}: ${column}`);
            } else if (isRecord(value) || Array.isArray(value)) {
              throw new ImportInvalid(`${where}: ${column} holds an object; every stored value is text, a number or null.`);
            } else row[column] = value ?? null;
          }
          if (spec.table === 'setups') row['inputs'] = remapInputsText(row['inputs'], ids['inventory_sets']!);
          if (spec.table === 'setup_revisions') {
            for (const column of ['snapshot', 'changes'] as const) row[column] = remapRevisionText(column, row[column], ids['inventory_sets']!);
          }
          if (spec.table === 'attachments') {
            const oldKey = String(source['storageKey']);
            const key = `teams/${String(row['teamId'])}/setups/${String(row['setupId'])}/${randomUUID()}`;
            row['storageKey'] = key;
            const body = files.get(oldKey);
            if (body) pending.push({ key, body, contentType: String(row['contentType']) });
            const oldThumb = source['thumbnailKey'];
            const thumb = typeof oldThumb === 'string' ? files.get(oldThumb) : undefined;
            row['thumbnailKey'] = thumb ? `${key}-thumb` : null;
            if (thumb) pending.push({ key: `${key}-thumb`, body: thumb, contentType: 'image/jpeg' });
          }
          if (spec.table === 'invitations') {
            // A token nobody knows: the archived links cannot be used on this instance.
            row['tokenHash'] = createHash('sha256').update(randomBytes(32)).digest('hex');
            if (row['acceptedAt'] === null && row['revokedAt'] === null) {
              row['revokedAt'] = now;
              revokedInvitations++;
            }
          }
          const names = Object.keys(row);
          const sql = `INSERT INTO \`${spec.table}\` (${names.map((n) => `\`${n}\``).join(', ')}) VALUES (${names.map(() => '?').join(', ')})`;
          const [insertId] = (await sequelize.query(sql, { replacements: names.map((n) => row[n]), type: QueryTypes.INSERT, transaction })) as unknown as [number | bigint, number];
          map.set(oldId, Number(insertId));
        }
        counts[spec.table] = rows.length;
      }
      // Files last, still inside the transaction: a storage failure rolls the rows back too.
      for (const file of pending) {
        written.push(file.key);
        await storage.put(file.key, file.body, file.contentType);
      }
    });
  } catch (err) {
    for (const key of written) await storage.delete(key).catch(() => undefined);
    throw err;
  }
  const teamId = ids['teams']!.values().next().value as number;
  return { teamId, teamName: String(manifest.tables['teams']![0]!['name']), rows: counts, files: pending.length, revokedInvitations, ids };
}
