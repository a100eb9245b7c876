import { DataTypes, literal } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
  updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
};

export const up: Migration = async ({ context: { queryInterface: q } }) => {
  await q.createTable('users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    // Identity at the OAuth provider; null until the person first signs in.
    provider_id: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    login: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: true, unique: true },
    avatar_url: { type: DataTypes.STRING(500), allowNull: true },
    is_admin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  });

  await q.createTable('teams', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    slug: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });

  await q.createTable('memberships', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    role: { type: DataTypes.ENUM('viewer', 'engineer', 'lead'), allowNull: false },
    ...timestamps,
  });
  await q.addIndex('memberships', ['team_id', 'user_id'], { unique: true, name: 'memberships_team_user' });

  await q.createTable('invites', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM('viewer', 'engineer', 'lead'), allowNull: false },
    // SHA-256 of the token in the link; the token itself is never stored.
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    accepted_at: { type: DataTypes.DATE(3), allowNull: true },
    accepted_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    invited_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    mail_status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
    mail_error: { type: DataTypes.STRING(500), allowNull: true },
    ...timestamps,
  });
};

export const down: Migration = async ({ context: { queryInterface: q } }) => {
  await q.dropTable('invites');
  await q.dropTable('memberships');
  await q.dropTable('teams');
  await q.dropTable('users');
};
