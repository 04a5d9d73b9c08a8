import type { Sequelize } from 'sequelize';
import { selectRows } from '../db';
import { canSeeSetup } from './setup-access';
import type { SetupKind, SetupOwnersDto, SetupSort, SetupStatus } from '../../shared/api/setup';
import type { User } from '../models/user';

/**
 * The library's hot reads — a page of the list and one set-up — as plain SQL whose rows are the
 * API's JSON, built by MariaDB. They answer exactly what `Setup.toDto()` does with the owner and
 * releaser joined (tests/api/library compares every field), without building Sequelize instances
 * or parsing and re-encoding each row here (see docs/hardening.md, "Load"). Writes stay on the models.
 */

/** A filtered, sorted page of the library, as parsed from the query string. */
export interface SetupListFilter {
  q?: string;
  kind?: SetupKind;
  status?: SetupStatus;
  ownerId?: number;
  job?: string;
  sort?: SetupSort;
  dir?: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

const PEOPLE = 'LEFT JOIN users o ON o.id = s.ownerId LEFT JOIN users r ON r.id = s.releasedById';

/** Sort keys of the API → SQL expressions (a fixed list: nothing from the request reaches SQL text). */
const ORDER_BY: Record<SetupSort, string> = {
  name: 's.name',
  kind: 's.kind',
  status: 's.status',
  job: 's.job',
  owner: 'o.name',
  updatedAt: 's.updatedAt',
  createdAt: 's.createdAt',
};

/** Escapes LIKE wildcards so a search for "50%" means those characters. */
function likeText(word: string): string {
  return `%${escapeLike(word)}%`;
}

/** Text with LIKE's wildcards and escape taken literally. */
function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** WHERE clause of the list: the team, what this user may see, the filters and the search words. */
function listWhere(user: User, f: SetupListFilter): { sql: string; params: Array<string | number> } {
  const parts = ['s.teamId = ?'];
  const params: Array<string | number> = [user.teamId];
  // Visibility in SQL, so totals and pages count only what this user may see.
  if (user.role !== 'admin' && user.role !== 'lead') {
    parts.push("(s.status <> 'draft' OR s.releasedVersion IS NOT NULL OR s.ownerId = ?)");
    params.push(user.id);
  }
  if (f.kind) { parts.push('s.kind = ?'); params.push(f.kind); }
  if (f.status) { parts.push('s.status = ?'); params.push(f.status); }
  if (f.ownerId) { parts.push('s.ownerId = ?'); params.push(f.ownerId); }
  // A job number or its start: "KL-24" finds KL-2417 and KL-2491.
  if (f.job) { parts.push('s.job LIKE ?'); params.push(`${escapeLike(f.job)}%`); }
  for (const word of (f.q ?? '').split(/\s+/).filter(Boolean).slice(0, 8)) {
    const like = likeText(word);
    parts.push('(s.name LIKE ? OR s.job LIKE ? OR s.notes LIKE ?)');
    params.push(like, like, like);
  }
  return { sql: parts.join(' AND '), params };
}

/** A DATETIME as `Date.toISOString()` writes it (stored in UTC: Sequelize's connections use +00:00). */
function isoText(column: string): string {
  return `CONCAT(DATE_FORMAT(${column}, '%Y-%m-%dT%H:%i:%s.'), LEFT(DATE_FORMAT(${column}, '%f'), 3), 'Z')`;
}

/**
 * One set-up in the API shape as JSON text, built by MariaDB: the same fields and values as
 * `Setup.toDto()` (a test compares them on every row), so this process never parses and re-encodes
 * a row's inputs, checks and dates. Cast to text where it is selected: the driver would otherwise
 * parse a JSON column into objects.
 */
const SETUP_JSON = `JSON_OBJECT('id', s.id, 'name', s.name, 'kind', s.kind, 'inputs', JSON_EXTRACT(s.inputs, '$'),
  'notes', s.notes, 'job', s.job, 'status', s.status, 'version', s.version,
  'checks', IF(s.checks IS NULL OR s.checks = '', JSON_ARRAY(), JSON_EXTRACT(s.checks, '$')),
  'ownerId', s.ownerId, 'ownerName', o.name, 'releasedAt', ${isoText('s.releasedAt')}, 'releasedByName', r.name, 'releasedVersion', s.releasedVersion,
  'createdAt', ${isoText('s.createdAt')}, 'updatedAt', ${isoText('s.updatedAt')})`;

/** A JSON text ready to send as it is (server/routes/send-json.ts). */
export interface JsonText {
  readonly json: string;
}

/**
 * One page of the team library as this user may see it, with the total over all pages, as the
 * JSON text of a `SetupPageDto`. One query does it all: the count and the page are two derived
 * tables joined (so one round trip, and one entry in MariaDB's query cache), and each row arrives
 * as JSON built by MariaDB. docs/hardening.md ("Load") has the measurements behind this shape.
 */
export async function listSetupsJson(sequelize: Sequelize, user: User, f: SetupListFilter): Promise<JsonText> {
  const where = listWhere(user, f);
  const sort = f.sort ?? 'updatedAt';
  const dir = (f.dir ?? (sort === 'updatedAt' || sort === 'createdAt' ? 'desc' : 'asc')) === 'desc' ? 'DESC' : 'ASC';
  const rows = await selectRows<{ total: number | bigint; j: string | null }>(
    sequelize,
    `SELECT c.total, p.j FROM (SELECT COUNT(*) AS total FROM setups s WHERE ${where.sql}) c
      LEFT JOIN (SELECT CAST(${SETUP_JSON} AS CHAR) AS j, ${ORDER_BY[sort]} AS sortKey, s.id FROM setups s ${PEOPLE} WHERE ${where.sql}
        ORDER BY ${ORDER_BY[sort]} ${dir}, s.id ${dir} LIMIT ? OFFSET ?) p ON TRUE
      ORDER BY p.sortKey ${dir}, p.id ${dir}`,
    [...where.params, ...where.params, f.pageSize, (f.page - 1) * f.pageSize],
  );
  const total = Number(rows[0]?.total ?? 0);
  const setups = rows.flatMap((r) => (r.j === null ? [] : [r.j]));
  return { json: `{"setups":[${setups.join(',')}],"total":${total},"page":${f.page},"pageSize":${f.pageSize}}` };
}

/** Everyone who owns set-ups this user may see, with how many, by name (the list's owner filter). */
export async function listOwners(sequelize: Sequelize, user: User): Promise<SetupOwnersDto> {
  const where = listWhere(user, { page: 1, pageSize: 1 });
  const rows = await selectRows<{ id: number; name: string; count: number | bigint }>(
    sequelize,
    `SELECT s.ownerId AS id, o.name AS name, COUNT(*) AS count FROM setups s JOIN users o ON o.id = s.ownerId WHERE ${where.sql} GROUP BY s.ownerId, o.name ORDER BY o.name, s.ownerId`,
    where.params,
  );
  return { owners: rows.map((r) => ({ id: r.id, name: r.name, count: Number(r.count) })) };
}

/** One team set-up this user may see, as the JSON text of its `SetupDto`, or null (the caller answers 404 without a hint). */
export async function readVisibleSetupJson(sequelize: Sequelize, id: number, user: User): Promise<JsonText | null> {
  const rows = await selectRows<{ j: string; teamId: number; ownerId: number; status: SetupStatus; releasedVersion: number | null }>(
    sequelize,
    `SELECT CAST(${SETUP_JSON} AS CHAR) AS j, s.teamId, s.ownerId, s.status, s.releasedVersion FROM setups s ${PEOPLE} WHERE s.id = ? AND s.teamId = ? LIMIT 1`,
    [id, user.teamId],
  );
  const row = rows[0];
  return row && canSeeSetup(user, row) ? { json: row.j } : null;
}
