import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A message caught by the local SMTP catcher; shown to admins on the dev mailbox page. */
export class CapturedMail extends Model<InferAttributes<CapturedMail>, InferCreationAttributes<CapturedMail>> {
  declare id: CreationOptional<number>;
  declare sender: string;
  declare recipients: string;
  declare subject: string;
  declare text: string;
  declare html: string | null;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize): void {
    CapturedMail.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        sender: { type: DataTypes.STRING(320), allowNull: false },
        recipients: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.STRING(500), allowNull: false },
        text: { type: DataTypes.TEXT('medium'), allowNull: false },
        html: { type: DataTypes.TEXT('medium'), allowNull: true },
        receivedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'captured_mails', timestamps: false },
    );
  }
}
