import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

/** Set-up library: check values and release stamp on set-ups, their revision history and attachments. */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.addColumn('setups', 'checks', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('setups', 'releasedAt', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('setups', 'releasedById', {
    type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL',
  });
  await qi.addIndex('setups', ['teamId', 'ownerId'], { name: 'setups_team_owner' });
  await qi.addIndex('setups', ['teamId', 'job'], { name: 'setups_team_job' });

  await qi.createTable('setup_revisions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    setupId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'setups', key: 'id' }, onDelete: 'CASCADE' },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    action: { type: DataTypes.ENUM('created', 'edited', 'released', 'archived', 'imported', 'attached', 'detached'), allowNull: false },
    status: { type: DataTypes.ENUM('draft', 'released', 'archived'), allowNull: false },
    userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    changes: { type: DataTypes.TEXT, allowNull: false },
    snapshot: { type: DataTypes.TEXT('medium'), allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('setup_revisions', ['setupId', 'id'], { name: 'setup_revisions_setup' });

  await qi.createTable('attachments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    setupId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'setups', key: 'id' }, onDelete: 'CASCADE' },
    storageKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    thumbnailKey: { type: DataTypes.STRING(200), allowNull: true },
    fileName: { type: DataTypes.STRING(255), allowNull: false },
    contentType: { type: DataTypes.STRING(40), allowNull: false },
    size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    uploadedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    ...timestamps,
  });
  await qi.addIndex('attachments', ['setupId'], { name: 'attachments_setup' });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('attachments');
  await qi.dropTable('setup_revisions');
  await qi.removeIndex('setups', 'setups_team_job');
  await qi.removeIndex('setups', 'setups_team_owner');
  await qi.removeColumn('setups', 'releasedById');
  await qi.removeColumn('setups', 'releasedAt');
  await qi.removeColumn('setups', 'checks');
}
