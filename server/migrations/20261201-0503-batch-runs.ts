import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

/** Batch runs of a released set-up and the readings of each part. */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('batch_runs', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    // A set-up with runs cannot be deleted: the runs are the shop's record.
    setupId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'setups', key: 'id' }, onDelete: 'RESTRICT' },
    setupVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    setupName: { type: DataTypes.STRING(160), allowNull: false },
    label: { type: DataTypes.STRING(120), allowNull: false },
    partCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    status: { type: DataTypes.ENUM('open', 'closed'), allowNull: false, defaultValue: 'open' },
    checks: { type: DataTypes.TEXT, allowNull: false },
    startedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    closedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    closedAt: { type: DataTypes.DATE, allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...timestamps,
  });
  await qi.addIndex('batch_runs', ['teamId', 'status'], { name: 'batch_runs_team_status' });
  await qi.addIndex('batch_runs', ['setupId'], { name: 'batch_runs_setup' });

  await qi.createTable('batch_parts', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'batch_runs', key: 'id' }, onDelete: 'CASCADE' },
    partNo: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    touchOff: { type: DataTypes.STRING(20), allowNull: true },
    droAtStop: { type: DataTypes.STRING(20), allowNull: true },
    readings: { type: DataTypes.TEXT, allowNull: false },
    pass: { type: DataTypes.BOOLEAN, allowNull: false },
    outOfBand: { type: DataTypes.STRING(600), allowNull: false, defaultValue: '' },
    operatorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    measuredAt: { type: DataTypes.DATE, allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await qi.addIndex('batch_parts', ['runId', 'partNo'], { name: 'batch_parts_run_part', unique: true });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('batch_parts');
  await qi.dropTable('batch_runs');
}
