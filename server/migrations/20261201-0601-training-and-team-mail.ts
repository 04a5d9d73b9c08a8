import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const ROLES = ['admin', 'lead', 'machinist', 'apprentice'];

/**
 * Invitations and password resets (only the sha256 of each token is stored), and training:
 * assignments, each apprentice's work on one (with the seed of their problems), problems and attempts.
 */
export async function up(qi: QueryInterface): Promise<void> {
  const t = await qi.sequelize.transaction();
  try {
    await qi.createTable('invitations', {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
      invitedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction: t });
    await qi.addIndex('invitations', ['teamId', 'email'], { name: 'invitations_team_email', transaction: t });

    await qi.createTable('password_resets', {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction: t });
    await qi.addIndex('password_resets', ['userId'], { name: 'password_resets_user', transaction: t });

    await qi.createTable('assignments', {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
      createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      title: { type: DataTypes.STRING(160), allowNull: false },
      instructions: { type: DataTypes.TEXT, allowNull: false },
      items: { type: DataTypes.TEXT, allowNull: false },
      dueAt: { type: DataTypes.DATE, allowNull: false },
      ...timestamps,
    }, { transaction: t });
    await qi.addIndex('assignments', ['teamId', 'dueAt'], { name: 'assignments_team_due', transaction: t });

    await qi.createTable('assignment_work', {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      assignmentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'assignments', key: 'id' }, onDelete: 'CASCADE' },
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      seed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      completedAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction: t });
    await qi.addIndex('assignment_work', ['assignmentId', 'userId'], { name: 'assignment_work_unique', unique: true, transaction: t });
    await qi.addIndex('assignment_work', ['userId'], { name: 'assignment_work_user', transaction: t });

    await qi.createTable('training_problems', {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      workId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'assignment_work', key: 'id' }, onDelete: 'CASCADE' },
      position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      type: { type: DataTypes.STRING(40), allowNull: false },
      seed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      hintsUsed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      closedAt: { type: DataTypes.DATE, allowNull: true },
      correct: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      ...timestamps,
    }, { transaction: t });
    await qi.addIndex('training_problems', ['workId', 'position'], { name: 'training_problems_work_position', unique: true, transaction: t });

    await qi.createTable('training_attempts', {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      problemId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'training_problems', key: 'id' }, onDelete: 'CASCADE' },
      answer: { type: DataTypes.STRING(60), allowNull: false },
      correct: { type: DataTypes.BOOLEAN, allowNull: false },
      createdAt: { type: DataTypes.DATE, allowNull: false },
    }, { transaction: t });
    await qi.addIndex('training_attempts', ['problemId'], { name: 'training_attempts_problem', transaction: t });
    await t.commit();
  } catch (err) {
    await t.rollback();
    throw err;
  }
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('training_attempts');
  await qi.dropTable('training_problems');
  await qi.dropTable('assignment_work');
  await qi.dropTable('assignments');
  await qi.dropTable('password_resets');
  await qi.dropTable('invitations');
}
