import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { AttachmentDto } from '../../shared/api/setup';
import type { User } from './user';

/** A drawing or photo of a set-up. The bytes live in object storage under `storageKey`. */
export class Attachment extends Model<InferAttributes<Attachment>, InferCreationAttributes<Attachment>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare setupId: number;
  /** Storage key made by the server (never from the user's file name). */
  declare storageKey: string;
  declare thumbnailKey: string | null;
  declare fileName: string;
  declare contentType: AttachmentDto['contentType'];
  declare size: number;
  declare sha256: string;
  declare width: number | null;
  declare height: number | null;
  declare uploadedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare uploadedBy?: User | null;

  toDto(): AttachmentDto {
    return {
      id: this.id,
      setupId: this.setupId,
      fileName: this.fileName,
      contentType: this.contentType,
      size: this.size,
      sha256: this.sha256,
      hasThumbnail: this.thumbnailKey !== null,
      width: this.width,
      height: this.height,
      uploadedById: this.uploadedById,
      uploadedByName: this.uploadedBy?.name ?? null,
      createdAt: this.createdAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    Attachment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        teamId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        setupId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        storageKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        thumbnailKey: { type: DataTypes.STRING(200), allowNull: true },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        contentType: { type: DataTypes.STRING(40), allowNull: false },
        size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        width: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        height: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        uploadedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'attachments' },
    );
  }
}
