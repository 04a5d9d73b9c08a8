import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Failed sign-in counters per account and per client address, kept in MariaDB so every instance shares them. */
export class LoginFailure extends Model<InferAttributes<LoginFailure>, InferCreationAttributes<LoginFailure>> {
  declare key: string;
  declare count: number;
  declare windowStart: Date;

  static initModel(sequelize: Sequelize): void {
    LoginFailure.init(
      {
        key: { type: DataTypes.STRING(300), primaryKey: true },
        count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        windowStart: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'login_failures', timestamps: false },
    );
  }
}
