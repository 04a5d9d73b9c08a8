import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Assignment } from './assignment';
import type { TrainingProblem } from './training-problem';
import type { User } from './user';

/** One apprentice's copy of an assignment: the seed their problems were generated from, and when they finished. */
export class AssignmentWork extends Model<InferAttributes<AssignmentWork>, InferCreationAttributes<AssignmentWork>> {
  declare id: CreationOptional<number>;
  declare assignmentId: ForeignKey<Assignment['id']>;
  declare userId: ForeignKey<User['id']>;
  declare seed: number;
  declare completedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare user?: NonAttribute<User>;
  declare assignment?: NonAttribute<Assignment>;
  declare problems?: NonAttribute<TrainingProblem[]>;

  static initModel(sequelize: Sequelize): void {
    AssignmentWork.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        seed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        completedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'assignment_work' },
    );
  }
}
