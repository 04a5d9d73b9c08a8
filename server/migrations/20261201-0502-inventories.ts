import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

/** The team's gauge-block and angle-block sets, block by block. */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('inventory_sets', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    type: { type: DataTypes.ENUM('gauge-blocks', 'angle-blocks'), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    unit: { type: DataTypes.ENUM('in', 'mm', 'arcsec'), allowNull: false },
    standardSet: { type: DataTypes.STRING(40), allowNull: true },
    grade: { type: DataTypes.STRING(20), allowNull: true },
    wearBlockSize: { type: DataTypes.STRING(20), allowNull: true },
    wearBlockCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    notes: { type: DataTypes.TEXT, allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    ...timestamps,
  });
  await qi.addIndex('inventory_sets', ['teamId', 'type', 'name'], { name: 'inventory_sets_team_name', unique: true });

  await qi.createTable('inventory_blocks', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    setId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'inventory_sets', key: 'id' }, onDelete: 'CASCADE' },
    size: { type: DataTypes.STRING(20), allowNull: false },
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    missing: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    damaged: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    note: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await qi.addIndex('inventory_blocks', ['setId', 'size'], { name: 'inventory_blocks_set_size', unique: true });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('inventory_blocks');
  await qi.dropTable('inventory_sets');
}
