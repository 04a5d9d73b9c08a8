import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { FieldChange, RevisionAction, RevisionDto, SetupStatus } from '../../shared/api/setup';
import type { User } from './user';

/** One stored change of a set-up: who, when, what changed, and the set-up as it was afterwards. */
export class SetupRevision extends Model<InferAttributes<SetupRevision>, InferCreationAttributes<SetupRevision>> {
  declare id: CreationOptional<number>;
  declare setupId: number;
  declare version: number;
  declare action: RevisionAction;
  declare status: SetupStatus;
  declare userId: number | null;
  declare changes: FieldChange[];
  declare snapshot: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;

  declare user?: User | null;

  toDto(): RevisionDto {
    return {
      id: this.id,
      version: this.version,
      action: this.action,
      status: this.status,
      userId: this.userId,
      userName: this.user?.name ?? null,
      createdAt: this.createdAt.toISOString(),
      changes: this.changes,
    };
  }

  static initModel(sequelize: Sequelize): void {
    SetupRevision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        setupId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        action: { type: DataTypes.ENUM('created', 'edited', 'released', 'archived', 'imported', 'attached', 'detached'), allowNull: false },
        status: { type: DataTypes.ENUM('draft', 'released', 'archived'), allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        changes: jsonText<FieldChange[]>('changes', []),
        snapshot: jsonText<Record<string, unknown>>('snapshot', {}),
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'setup_revisions', updatedAt: false },
    );
  }
}

/** A TEXT column that holds JSON, read and written as the parsed value. */
export function jsonText<T>(column: string, empty: T) {
  return {
    type: DataTypes.TEXT,
    allowNull: false,
    get(this: Model): T {
      const raw = this.getDataValue(column) as unknown;
      if (raw === null || raw === undefined || raw === '') return empty;
      return typeof raw === 'string' ? (JSON.parse(raw) as T) : (raw as T);
    },
    set(this: Model, value: T) {
      this.setDataValue(column, JSON.stringify(value));
    },
  };
}
