import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { TrainingProblem } from './training-problem';

/** One answer given to an assignment problem, graded on the server. */
export class TrainingAttempt extends Model<InferAttributes<TrainingAttempt>, InferCreationAttributes<TrainingAttempt>> {
  declare id: CreationOptional<number>;
  declare problemId: ForeignKey<TrainingProblem['id']>;
  declare answer: string;
  declare correct: boolean;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    TrainingAttempt.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        answer: { type: DataTypes.STRING(60), allowNull: false },
        correct: { type: DataTypes.BOOLEAN, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'training_attempts', updatedAt: false },
    );
  }
}
