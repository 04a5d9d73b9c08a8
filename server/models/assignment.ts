import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { AssignmentItem } from '../../shared/api/training';
import type { AssignmentWork } from './assignment-work';
import type { Team } from './team';
import type { User } from './user';

/** A set of exercises a lead hands to chosen apprentices, with a due date. */
export class Assignment extends Model<InferAttributes<Assignment>, InferCreationAttributes<Assignment>> {
  declare id: CreationOptional<number>;
  declare teamId: ForeignKey<Team['id']>;
  declare createdById: ForeignKey<User['id']> | null;
  declare title: string;
  declare instructions: string;
  declare items: AssignmentItem[];
  declare dueAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare createdBy?: NonAttribute<User | null>;
  declare work?: NonAttribute<AssignmentWork[]>;

  static initModel(sequelize: Sequelize): void {
    Assignment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        title: { type: DataTypes.STRING(160), allowNull: false },
        instructions: { type: DataTypes.TEXT, allowNull: false },
        items: {
          type: DataTypes.TEXT,
          allowNull: false,
          get(): AssignmentItem[] {
            const raw = this.getDataValue('items') as unknown;
            return typeof raw === 'string' ? (JSON.parse(raw) as AssignmentItem[]) : (raw as AssignmentItem[]);
          },
          set(value: AssignmentItem[]) {
            this.setDataValue('items', JSON.stringify(value) as unknown as AssignmentItem[]);
          },
        },
        dueAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'assignments' },
    );
  }
}
