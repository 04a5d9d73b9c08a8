import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ExerciseType } from '../../shared/training/exercise-types';
import type { AssignmentWork } from './assignment-work';
import type { TrainingAttempt } from './training-attempt';

/** One generated problem of an apprentice's assignment: type and seed reproduce it exactly. */
export class TrainingProblem extends Model<InferAttributes<TrainingProblem>, InferCreationAttributes<TrainingProblem>> {
  declare id: CreationOptional<number>;
  declare workId: ForeignKey<AssignmentWork['id']>;
  declare position: number;
  declare type: ExerciseType;
  declare seed: number;
  declare hintsUsed: CreationOptional<number>;
  declare closedAt: CreationOptional<Date | null>;
  declare correct: CreationOptional<boolean>;
  /** Set when a lead or admin graded the closed problem by hand (`correct` then holds their grade). */
  declare gradedById: CreationOptional<number | null>;
  declare gradedByName: CreationOptional<string | null>;
  declare gradeNote: CreationOptional<string | null>;
  declare gradedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare attempts?: NonAttribute<TrainingAttempt[]>;

  static initModel(sequelize: Sequelize): void {
    TrainingProblem.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        type: { type: DataTypes.STRING(40), allowNull: false },
        seed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        hintsUsed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        correct: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        gradedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        gradedByName: { type: DataTypes.STRING(120), allowNull: true },
        gradeNote: { type: DataTypes.STRING(500), allowNull: true },
        gradedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'training_problems' },
    );
  }
}
