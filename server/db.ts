import { ConnectionError, DatabaseError, Sequelize } from 'sequelize';
import type { AppConfig } from './config';

/** One Sequelize instance per process, on the mariadb driver, over TCP to the configured host. */
export function createSequelize(config: AppConfig['db']): Sequelize {
  return new Sequelize(config.name, config.user, config.password, {
    host: config.host,
    port: config.port,
    dialect: 'mariadb',
    logging: false,
    pool: { max: Number(process.env['DB_POOL_MAX'] ?? 10) || 10, min: 0, idle: 10_000, acquire: 10_000 },
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 5_000 },
    define: { underscored: false },
  });
}

/** The slice of a pooled driver connection that `selectRows` uses. */
interface DriverConnection {
  query(sql: string): Promise<unknown[]>;
  /** The driver's own escaping of one value, as it does for `?` placeholders (strings quoted). */
  escape(value: string | number | null): string;
}
interface PoolAccess {
  getConnection(options: { type: 'read' | 'write' }): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): Promise<void>;
}

/** SQL text split at its `?` placeholders, by text (the callers' statements are a fixed few). */
const splitCache = new Map<string, string[]>();

/**
 * The pieces of `sql` around its `?` placeholders. A `?` inside a quoted string or name is text,
 * not a placeholder. Kept per statement, so each request skips the driver's scan of the text.
 */
export function splitPlaceholders(sql: string): string[] {
  const known = splitCache.get(sql);
  if (known) return known;
  const parts: string[] = [];
  let from = 0;
  let quote: string | null = null;
  for (let i = 0; i < sql.length; i += 1) {
    const ch = sql[i]!;
    if (quote) {
      if (ch === '\\' && quote !== '`') i += 1;
      else if (ch === quote) quote = null;
    } else if (ch === "'" || ch === '"' || ch === '`') {
      quote = ch;
    } else if (ch === '?') {
      parts.push(sql.slice(from, i));
      from = i + 1;
    }
  }
  parts.push(sql.slice(from));
  if (splitCache.size >= 1_000) splitCache.clear();
  splitCache.set(sql, parts);
  return parts;
}

/**
 * A plain SELECT with `?` parameters on a connection of Sequelize's own pool, through the driver.
 * Each value (text, a number or null) goes in with the driver's own escaping, as its placeholders
 * would put it. For the few
 * reads on every request (session, library page, set-up): it skips Sequelize's per-query work
 * (replacement parsing, a stack trace, result shaping), about half of the query's cost in this
 * process. Values are typed as Sequelize types them (dates as Date). Errors come back as
 * Sequelize's, so a lost database still answers 503.
 */
export async function selectRows<T>(sequelize: Sequelize, sql: string, values: ReadonlyArray<string | number | null>): Promise<T[]> {
  const parts = splitPlaceholders(sql);
  if (parts.length - 1 !== values.length) throw new Error(`selectRows: ${parts.length - 1} placeholders but ${values.length} values`);
  const pool = sequelize.connectionManager as unknown as PoolAccess;
  const connection = await pool.getConnection({ type: 'read' });
  try {
    let text = parts[0]!;
    for (let i = 0; i < values.length; i += 1) text += connection.escape(values[i]) + parts[i + 1]!;
    return (await connection.query(text)) as T[];
  } catch (err) {
    const e = err as Error & { fatal?: boolean };
    throw e.fatal ? new ConnectionError(e) : new DatabaseError(e as Error & { sql: string; parameters: object });
  } finally {
    await pool.releaseConnection(connection);
  }
}
