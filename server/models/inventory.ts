import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { InventoryBlockDto, InventorySetDto, InventoryType, InventoryUnit } from '../../shared/api/inventory';

/** A team's gauge-block or angle-block set. */
export class InventorySet extends Model<InferAttributes<InventorySet>, InferCreationAttributes<InventorySet>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare type: InventoryType;
  declare name: string;
  declare unit: InventoryUnit;
  declare standardSet: string | null;
  declare grade: string | null;
  declare wearBlockSize: string | null;
  declare wearBlockCount: CreationOptional<number>;
  declare notes: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare blocks?: InventoryBlock[];

  /** The set as the API shows it; blocks are included when they were loaded. */
  toDto(label: (block: InventoryBlock) => string): InventorySetDto {
    const blocks = [...(this.blocks ?? [])].sort((a, b) => a.position - b.position);
    const sum = (f: (b: InventoryBlock) => number) => blocks.reduce((a, b) => a + f(b), 0);
    return {
      id: this.id,
      type: this.type,
      name: this.name,
      unit: this.unit,
      standardSet: this.standardSet,
      grade: this.grade,
      wearBlockSize: this.wearBlockSize,
      wearBlockCount: this.wearBlockCount,
      notes: this.notes,
      version: this.version,
      totals: { sizes: blocks.length, blocks: sum((b) => b.count), missing: sum((b) => b.missing), damaged: sum((b) => b.damaged), available: sum((b) => b.available) },
      blocks: this.blocks ? blocks.map((b) => b.toDto(label(b))) : undefined,
      createdAt: this.createdAt.toISOString(),
      updatedAt: this.updatedAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    InventorySet.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        type: { type: DataTypes.ENUM('gauge-blocks', 'angle-blocks'), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        unit: { type: DataTypes.ENUM('in', 'mm', 'arcsec'), allowNull: false },
        standardSet: { type: DataTypes.STRING(40), allowNull: true },
        grade: { type: DataTypes.STRING(20), allowNull: true },
        wearBlockSize: { type: DataTypes.STRING(20), allowNull: true },
        wearBlockCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'inventory_sets' },
    );
  }
}

/** One size of block in a set: how many the box holds and how many are missing or damaged. */
export class InventoryBlock extends Model<InferAttributes<InventoryBlock>, InferCreationAttributes<InventoryBlock>> {
  declare id: CreationOptional<number>;
  declare setId: number;
  declare size: string;
  declare position: number;
  declare count: number;
  declare missing: CreationOptional<number>;
  declare damaged: CreationOptional<number>;
  declare note: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** Blocks the solver may use. */
  get available(): NonAttribute<number> {
    return Math.max(0, this.count - this.missing - this.damaged);
  }

  toDto(label: string): InventoryBlockDto {
    return { id: this.id, size: this.size, label, count: this.count, missing: this.missing, damaged: this.damaged, available: this.available, note: this.note };
  }

  static initModel(sequelize: Sequelize): void {
    InventoryBlock.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        setId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        size: { type: DataTypes.STRING(20), allowNull: false },
        position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        missing: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        damaged: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        note: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'inventory_blocks' },
    );
  }
}
