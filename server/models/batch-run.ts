import { createHash } from 'node:crypto';
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { BatchPartDto, BatchRunDto, BatchStatus, PartReadings } from '../../shared/api/batch';
import type { SetupCheck } from '../../shared/api/setup';
import { jsonText } from './setup-revision';
import type { User } from './user';

/** A released set-up made on N parts; its checks are copied in when the run starts. */
export class BatchRun extends Model<InferAttributes<BatchRun>, InferCreationAttributes<BatchRun>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare setupId: number;
  declare setupVersion: number;
  declare setupName: string;
  declare label: string;
  declare partCount: number;
  declare status: CreationOptional<BatchStatus>;
  declare checks: SetupCheck[];
  declare startedById: number | null;
  declare closedById: CreationOptional<number | null>;
  declare closedAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare startedBy?: User | null;
  declare closedBy?: User | null;
  declare parts?: BatchPart[];

  /** The run without parts and statistics; `summary` comes from the loaded parts or the given counts. */
  toDto(summary?: BatchRunDto['summary']): BatchRunDto {
    const parts = this.parts ?? [];
    return {
      id: this.id,
      setupId: this.setupId,
      setupName: this.setupName,
      setupVersion: this.setupVersion,
      label: this.label,
      partCount: this.partCount,
      status: this.status,
      checks: this.checks,
      startedById: this.startedById,
      startedByName: this.startedBy?.name ?? null,
      closedAt: this.closedAt ? this.closedAt.toISOString() : null,
      closedByName: this.closedBy?.name ?? null,
      version: this.version,
      summary: summary ?? { entered: parts.length, passed: parts.filter((p) => p.pass).length, failed: parts.filter((p) => !p.pass).length },
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    BatchRun.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        setupId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        setupVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        setupName: { type: DataTypes.STRING(160), allowNull: false },
        label: { type: DataTypes.STRING(120), allowNull: false },
        partCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        status: { type: DataTypes.ENUM('open', 'closed'), allowNull: false, defaultValue: 'open' },
        checks: jsonText<SetupCheck[]>('checks', []),
        startedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        closedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'batch_runs' },
    );
  }
}

/** One part of a run: its readings, pass/fail, operator and time. */
export class BatchPart extends Model<InferAttributes<BatchPart>, InferCreationAttributes<BatchPart>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare partNo: number;
  declare touchOff: string | null;
  declare droAtStop: string | null;
  declare readings: Record<string, string>;
  declare pass: boolean;
  declare outOfBand: string;
  declare operatorId: number | null;
  declare measuredAt: Date;
  declare note: CreationOptional<string>;
  /** Who last corrected the readings, and when (null: as recorded). */
  declare correctedById: CreationOptional<number | null>;
  declare correctedAt: CreationOptional<Date | null>;
  /** The readings as first recorded, kept at the first correction. */
  declare firstRecorded: CreationOptional<PartReadings | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare operator?: User | null;
  declare correctedBy?: User | null;

  /**
   * A tag of the part as stored: its readings, note, and who last corrected it and when. Any change
   * a person can make to a part changes it, so a correction based on an older tag is known to be
   * stale (the part's own optimistic version, without a counter column).
   */
  revision(): string {
    const state = [this.touchOff, this.droAtStop, this.readings, this.note, this.correctedById ?? null, this.correctedAt ? this.correctedAt.getTime() : null, this.firstRecorded ?? null];
    return createHash('sha256').update(JSON.stringify(state)).digest('hex').slice(0, 16);
  }

  toDto(): BatchPartDto {
    return {
      id: this.id,
      partNo: this.partNo,
      touchOff: this.touchOff,
      droAtStop: this.droAtStop,
      values: this.readings,
      pass: this.pass,
      outOfBand: this.outOfBand ? this.outOfBand.split(',') : [],
      operatorId: this.operatorId,
      operatorName: this.operator?.name ?? null,
      measuredAt: this.measuredAt.toISOString(),
      note: this.note,
      correctedAt: this.correctedAt ? this.correctedAt.toISOString() : null,
      correctedByName: this.correctedAt ? (this.correctedBy?.name ?? null) : null,
      firstRecorded: this.firstRecorded ?? null,
      revision: this.revision(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    BatchPart.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        partNo: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        touchOff: { type: DataTypes.STRING(20), allowNull: true },
        droAtStop: { type: DataTypes.STRING(20), allowNull: true },
        readings: jsonText<Record<string, string>>('readings', {}),
        pass: { type: DataTypes.BOOLEAN, allowNull: false },
        outOfBand: { type: DataTypes.STRING(600), allowNull: false, defaultValue: '' },
        operatorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        measuredAt: { type: DataTypes.DATE, allowNull: false },
        note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        correctedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        correctedAt: { type: DataTypes.DATE, allowNull: true },
        firstRecorded: {
          type: DataTypes.TEXT,
          allowNull: true,
          get(this: BatchPart): PartReadings | null {
            const raw = this.getDataValue('firstRecorded') as unknown;
            return typeof raw === 'string' && raw !== '' ? (JSON.parse(raw) as PartReadings) : null;
          },
          set(this: BatchPart, value: PartReadings | null) {
            this.setDataValue('firstRecorded', (value === null ? null : JSON.stringify(value)) as unknown as PartReadings);
          },
        },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'batch_parts' },
    );
  }
}
