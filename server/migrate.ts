import type { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { migrations } from './migrations';

/** Applies every pending migration (schema changes only ever happen here, never through sync). */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const qi = sequelize.getQueryInterface();
  const umzug = new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: () => m.up(qi), down: () => m.down(qi) })),
    storage: new SequelizeStorage({ sequelize, tableName: 'migrations' }),
    logger: undefined,
  });
  const done = await umzug.up();
  return done.map((m) => m.name);
}
