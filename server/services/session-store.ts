import connectSessionSequelize from 'connect-session-sequelize';
import session, { type SessionData, type Store } from 'express-session';
import type { Sequelize } from 'sequelize';
import { selectRows } from '../db';
import { Session } from '../models/session';
import { User } from '../models/user';

export interface SessionStore {
  readonly store: Store;
  /**
   * The active user read together with session `sid` by this request's session load, once (or
   * undefined when there is none to hand over, e.g. no user, or a second request on the session
   * took it first: the caller then reads the user itself).
   */
  takeUser(sid: string): User | undefined;
  /** Stops the periodic sweep of expired rows. */
  stop(): void;
}

/**
 * Sessions in MariaDB (connect-session-sequelize on the `sessions` table, created by a migration),
 * with these changes to the library's behaviour:
 * - a session whose `expires` has passed is treated as gone at once (the library leaves that to its
 *   periodic sweep), so idle expiry holds on the server and not only in the browser;
 * - `touch` writes nothing: the expiry is renewed when `renewSessions` has the session saved, at
 *   most once a minute, instead of one UPDATE per request (so it may run up to that long early);
 *   and a save of a session read earlier only updates its row, so a destroyed session stays gone;
 * - the session row and its active user are read in one plain query, and the user is handed to
 *   `loadUser` through `takeUser`, so a signed-in request costs one round trip before its route.
 */
/** How long a user read with the session may wait for `loadUser` of the same request. */
const HAND_OVER_MS = 1_000;

const SESSION_WITH_USER = `SELECT s.data, s.expires, u.id AS uId, u.teamId AS uTeamId, u.email AS uEmail, u.name AS uName,
  u.passwordHash AS uPasswordHash, u.role AS uRole, u.createdAt AS uCreatedAt, u.updatedAt AS uUpdatedAt
  FROM sessions s LEFT JOIN users u ON u.id = s.userId AND u.active = 1 WHERE s.sid = ? LIMIT 1`;

interface SessionUserRow {
  data: string | null;
  expires: Date | string | null;
  uId: number | null;
  uTeamId: number;
  uEmail: string;
  uName: string;
  uPasswordHash: string;
  uRole: User['role'];
  uCreatedAt: Date;
  uUpdatedAt: Date;
}

function userFromRow(row: SessionUserRow): User {
  return User.build(
    { id: row.uId!, teamId: row.uTeamId, email: row.uEmail, name: row.uName, passwordHash: row.uPasswordHash, role: row.uRole, active: true, createdAt: row.uCreatedAt, updatedAt: row.uUpdatedAt },
    { isNewRecord: false, raw: true },
  );
}

export function createSessionStore(sequelize: Sequelize, idleMs: number): SessionStore {
  const SequelizeStore = connectSessionSequelize(session.Store);
  const store = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: 15 * 60_000,
    expiration: idleMs,
    extendDefaultFields: (defaults: { data: string; expires: Date }, sess: { userId?: number }) => ({
      data: defaults.data,
      expires: defaults.expires,
      userId: sess.userId ?? null,
    }),
  });

  const handOver = new Map<string, { user: User; at: number }>();
  /** Sessions this instance has read from the store (see `store.set` below). */
  const read = new Set<string>();
  store.get = (sid: string, callback: (err: unknown, session?: SessionData | null) => void) => {
    selectRows<SessionUserRow>(sequelize, SESSION_WITH_USER, [sid])
      .then(([row]) => {
        if (!row || !row.data || (row.expires && new Date(row.expires).getTime() <= Date.now())) return callback(null, null);
        if (read.size > 100_000) read.clear();
        read.add(sid);
        if (row.uId !== null) {
          if (handOver.size > 10_000) handOver.clear();
          handOver.set(sid, { user: userFromRow(row), at: Date.now() });
        }
        callback(null, JSON.parse(row.data) as SessionData);
      })
      .catch((err: unknown) => callback(err));
  };
  const takeUser = (sid: string): User | undefined => {
    const entry = handOver.get(sid);
    if (!entry) return undefined;
    handOver.delete(sid);
    // Only the read of this very request counts; anything older is read again.
    return Date.now() - entry.at < HAND_OVER_MS ? entry.user : undefined;
  };

  // Expiry is renewed by saving the session once a minute (`renewSessions`), not by a write per request.
  store.touch = (_sid: string, _data: SessionData, callback?: (err?: unknown) => void) => callback?.();

  // A session read from the store is only ever updated, never created again: a save that races a
  // sign-out (a request begun before it, renewing the session) must not bring the session back.
  // The library's own `set` (find, else create) stays for sessions this instance never read.
  const createOrUpdate = store.set.bind(store);
  const expiration = (store as unknown as { expiration(data: SessionData): Date }).expiration.bind(store);
  store.set = (sid: string, data: SessionData, callback?: (err?: unknown) => void) => {
    if (!read.has(sid)) return createOrUpdate(sid, data, callback);
    Session.update({ data: JSON.stringify(data), expires: expiration(data), userId: data.userId ?? null }, { where: { sid } }).then(
      () => callback?.(),
      (err: unknown) => callback?.(err),
    );
  };

  return { store, takeUser, stop: () => (store as unknown as { stopExpiringSessions(): void }).stopExpiringSessions() };
}
