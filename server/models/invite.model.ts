import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { TEAM_ROLES, type TeamRole } from './membership.model';

export type MailStatus = 'pending' | 'sent' | 'failed';

export class Invite extends Model<InferAttributes<Invite>, InferCreationAttributes<Invite>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare email: string;
  declare role: TeamRole;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: Date | null;
  declare acceptedBy: number | null;
  declare invitedBy: number | null;
  declare mailStatus: CreationOptional<MailStatus>;
  declare mailError: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineInvite(sequelize: Sequelize) {
  Invite.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.ENUM(...TEAM_ROLES), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE(3), allowNull: false },
      acceptedAt: { type: DataTypes.DATE(3), allowNull: true },
      acceptedBy: { type: DataTypes.INTEGER, allowNull: true },
      invitedBy: { type: DataTypes.INTEGER, allowNull: true },
      mailStatus: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
      mailError: { type: DataTypes.STRING(500), allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'invites', modelName: 'Invite' },
  );
  return Invite;
}
