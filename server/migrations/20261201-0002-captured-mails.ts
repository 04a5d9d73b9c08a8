import { DataTypes, type QueryInterface } from 'sequelize';

/** Messages caught by the local SMTP catcher (development and tests only). */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('captured_mails', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    sender: { type: DataTypes.STRING(320), allowNull: false },
    recipients: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.STRING(500), allowNull: false },
    text: { type: DataTypes.TEXT('medium'), allowNull: false },
    html: { type: DataTypes.TEXT('medium'), allowNull: true },
    receivedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('captured_mails', ['receivedAt'], { name: 'captured_mails_received' });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('captured_mails');
}
