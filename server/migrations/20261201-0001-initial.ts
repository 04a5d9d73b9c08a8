import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('teams', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    ...timestamps,
  });
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: DataTypes.ENUM('admin', 'lead', 'machinist', 'apprentice'), allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    ...timestamps,
  });
  await qi.createTable('setups', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    ownerId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    inputs: { type: DataTypes.TEXT, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false },
    job: { type: DataTypes.STRING(80), allowNull: true },
    status: { type: DataTypes.ENUM('draft', 'released', 'archived'), allowNull: false, defaultValue: 'draft' },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...timestamps,
  });
  await qi.addIndex('setups', ['teamId', 'updatedAt'], { name: 'setups_team_updated' });
  await qi.addIndex('setups', ['teamId', 'kind'], { name: 'setups_team_kind' });
  await qi.addIndex('setups', ['teamId', 'status'], { name: 'setups_team_status' });
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sessions', ['userId'], { name: 'sessions_user' });
  await qi.addIndex('sessions', ['expires'], { name: 'sessions_expires' });
  await qi.createTable('login_failures', {
    key: { type: DataTypes.STRING(300), primaryKey: true },
    count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    windowStart: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('login_failures');
  await qi.dropTable('sessions');
  await qi.dropTable('setups');
  await qi.dropTable('users');
  await qi.dropTable('teams');
}
