import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A lead's or admin's grade of a closed problem, over the checker's: who, when and why. The
 * problem's `correct` carries the grade that counts; these say it was set by hand.
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.addColumn('training_problems', 'gradedById', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' });
  await qi.addColumn('training_problems', 'gradedByName', { type: DataTypes.STRING(120), allowNull: true });
  await qi.addColumn('training_problems', 'gradeNote', { type: DataTypes.STRING(500), allowNull: true });
  await qi.addColumn('training_problems', 'gradedAt', { type: DataTypes.DATE, allowNull: true });
}

export async function down(qi: QueryInterface): Promise<void> {
  for (const column of ['gradedAt', 'gradeNote', 'gradedByName', 'gradedById']) await qi.removeColumn('training_problems', column);
}
