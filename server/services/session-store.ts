import connectSessionSequelize from 'connect-session-sequelize';
import session, { type SessionData, type Store } from 'express-session';
import type { Sequelize } from 'sequelize';
import { Session } from '../models/session';

export interface SessionStore {
  readonly store: Store;
  /** Stops the periodic sweep of expired rows. */
  stop(): void;
}

/**
 * Sessions in MariaDB (connect-session-sequelize on the `sessions` table, created by a migration),
 * with two changes to the library's behaviour:
 * - a session whose `expires` has passed is treated as gone at once (the library leaves that to its
 *   periodic sweep), so idle expiry holds on the server and not only in the browser;
 * - the rolling expiry is written at most once per `touchEveryMs` per session and instance, instead
 *   of one UPDATE per request (the expiry may then run up to that long early).
 */
export function createSessionStore(sequelize: Sequelize, idleMs: number, touchEveryMs = Math.min(60_000, idleMs / 10)): SessionStore {
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

  store.get = (sid: string, callback: (err: unknown, session?: SessionData | null) => void) => {
    Session.findOne({ where: { sid } })
      .then((row) => {
        if (!row || !row.data || (row.expires && row.expires.getTime() <= Date.now())) return callback(null, null);
        callback(null, JSON.parse(row.data) as SessionData);
      })
      .catch((err: unknown) => callback(err));
  };

  const touchedAt = new Map<string, number>();
  const touch = store.touch.bind(store);
  store.touch = (sid: string, data: SessionData, callback?: (err?: unknown) => void) => {
    const now = Date.now();
    const last = touchedAt.get(sid);
    if (last !== undefined && now - last < touchEveryMs) return callback?.();
    if (touchedAt.size > 100_000) touchedAt.clear();
    touchedAt.set(sid, now);
    return touch(sid, data, callback);
  };

  return { store, stop: () => (store as unknown as { stopExpiringSessions(): void }).stopExpiringSessions() };
}
