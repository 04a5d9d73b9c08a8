import { Sequelize } from 'sequelize';
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
