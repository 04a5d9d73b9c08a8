import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import { ROLES, type Role } from '../../shared/api/auth';
import type { InvitationDto } from '../../shared/api/team-admin';
import type { Team } from './team';
import type { User } from './user';

/** An invitation to join a team with a role; only the sha256 of its single-use token is kept. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare teamId: ForeignKey<Team['id']>;
  declare invitedById: ForeignKey<User['id']> | null;
  declare email: string;
  declare role: Role;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare invitedBy?: NonAttribute<User | null>;
  declare team?: NonAttribute<Team>;

  /** Whether the link can still be used at `now`. */
  isOpen(now = new Date()): boolean {
    return !this.acceptedAt && !this.revokedAt && this.expiresAt.getTime() > now.getTime();
  }

  toDto(): InvitationDto {
    return {
      id: this.id,
      email: this.email,
      role: this.role,
      invitedBy: this.invitedBy?.name ?? null,
      expiresAt: this.expiresAt.toISOString(),
      createdAt: this.createdAt.toISOString(),
    };
  }

  static initModel(sequelize: Sequelize): void {
    Invitation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        invitedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invitations' },
    );
  }
}
