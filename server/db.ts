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
  query(sql: string, values: readonly unknown[]): Promise<unknown[]>;
}
interface PoolAccess {
  getConnection(options: { type: 'read' | 'write' }): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): Promise<void>;
}

/**
 * A plain SELECT with `?` parameters on a connection of Sequelize's own pool, through the driver
 * (which escapes the values). For the few reads on every request (session, library page, set-up):
 * it skips Sequelize's per-query work (replacement parsing, a stack trace, result shaping), about
 * half of the query's cost in this process. Values are typed as Sequelize types them (dates as Date).
 * Errors come back as Sequelize's, so a lost database still answers 503.
 */
export async function selectRows<T>(sequelize: Sequelize, sql: string, values: readonly unknown[]): Promise<T[]> {
  const pool = sequelize.connectionManager as unknown as PoolAccess;
  const connection = await pool.getConnection({ type: 'read' });
  try {
    return (await connection.query(sql, values)) as T[];
  } catch (err) {
    const e = err as Error & { fatal?: boolean };
    throw e.fatal ? new ConnectionError(e) : new DatabaseError(e as Error & { sql: string; parameters: object });
  } finally {
    await pool.releaseConnection(connection);
  }
}
