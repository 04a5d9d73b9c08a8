import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The version a set-up was last released at. A released set-up that is being revised stays
 * readable by the whole team (its runs and its sheet are in use) while the new draft waits for a
 * lead. Filled in from the status and the history already kept.
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.addColumn('setups', 'releasedVersion', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  await qi.sequelize.query(
    `UPDATE setups s SET s.releasedVersion = IF(s.status = 'released', s.version,
       (SELECT MAX(r.version) FROM setup_revisions r WHERE r.setupId = s.id AND r.action = 'released'))`,
  );
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.removeColumn('setups', 'releasedVersion');
}
