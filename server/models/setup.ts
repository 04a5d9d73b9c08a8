import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { SetupCheck, SetupDto, SetupStatus } from '../../shared/api/setup';
import type { Team } from './team';
import type { User } from './user';

/** A saved set-up: the inputs of one calculation area, kept for the team. */
export class Setup extends Model<InferAttributes<Setup>, InferCreationAttributes<Setup>> {
  declare id: CreationOptional<number>;
  declare teamId: ForeignKey<Team['id']>;
  declare ownerId: ForeignKey<User['id']>;
  declare name: string;
  declare kind: string;
  declare inputs: Record<string, unknown>;
  declare notes: CreationOptional<string>;
  declare job: CreationOptional<string | null>;
  declare status: CreationOptional<SetupStatus>;
  declare version: CreationOptional<number>;
  declare checks: CreationOptional<SetupCheck[]>;
  declare releasedAt: CreationOptional<Date | null>;
  declare releasedById: CreationOptional<number | null>;
  /** The version last released (kept while a revision of it is a draft), or null if never released. */
  declare releasedVersion: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare owner?: User;
  declare releasedBy?: User | null;

  toDto(): SetupDto {
    return {
      id: this.id,
      name: this.name,
      kind: this.kind,
      inputs: this.inputs,
      notes: this.notes,
      job: this.job ?? null,
      status: this.status,
      version: this.version,
      checks: this.checks ?? [],
      ownerId: this.ownerId,
      ownerName: this.owner?.name ?? null,
      releasedAt: this.releasedAt ? this.releasedAt.toISOString() : null,
      releasedByName: this.releasedBy?.name ?? null,
      releasedVersion: this.releasedVersion ?? null,
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    Setup.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        inputs: {
          type: DataTypes.TEXT,
          allowNull: false,
          get(): Record<string, unknown> {
            const raw = this.getDataValue('inputs') as unknown;
            return typeof raw === 'string' ? (JSON.parse(raw) as Record<string, unknown>) : (raw as Record<string, unknown>);
          },
          set(value: Record<string, unknown>) {
            this.setDataValue('inputs', JSON.stringify(value) as unknown as Record<string, unknown>);
          },
        },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        job: { type: DataTypes.STRING(80), allowNull: true },
        status: { type: DataTypes.ENUM('draft', 'released', 'archived'), allowNull: false, defaultValue: 'draft' },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        checks: {
          type: DataTypes.TEXT,
          allowNull: true,
          get(): SetupCheck[] {
            const raw = this.getDataValue('checks') as unknown;
            if (raw === null || raw === undefined || raw === '') return [];
            return typeof raw === 'string' ? (JSON.parse(raw) as SetupCheck[]) : (raw as SetupCheck[]);
          },
          set(value: SetupCheck[]) {
            this.setDataValue('checks', JSON.stringify(value ?? []) as unknown as SetupCheck[]);
          },
        },
        releasedAt: { type: DataTypes.DATE, allowNull: true },
        releasedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        releasedVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'setups' },
    );
  }
}
