import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A corrected part keeps its trace: who corrected it and when, and the readings as first recorded
 * (JSON of touchOff, droAtStop and values), so a batch record shows what was changed.
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.addColumn('batch_parts', 'correctedById', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' });
  await qi.addColumn('batch_parts', 'correctedAt', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('batch_parts', 'firstRecorded', { type: DataTypes.TEXT, allowNull: true });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.removeColumn('batch_parts', 'firstRecorded');
  await qi.removeColumn('batch_parts', 'correctedAt');
  await qi.removeColumn('batch_parts', 'correctedById');
}
