import { DataTypes, literal } from 'sequelize';
import type { Migration } from '../migrator';

export const up: Migration = async ({ context: { queryInterface: q } }) => {
  // Append-only: the app has no update or delete path for these rows.
  await q.createTable('audit_events', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    actor_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    action: { type: DataTypes.STRING(64), allowNull: false },
    subject_type: { type: DataTypes.STRING(32), allowNull: false },
    subject_id: { type: DataTypes.INTEGER, allowNull: true },
    details: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
  });
  await q.addIndex('audit_events', ['team_id', 'created_at'], { name: 'audit_events_team_time' });

  // The shape connect-session-sequelize expects (sid, expires, data + timestamps).
  await q.createTable('sessions', {
    sid: { type: DataTypes.STRING(36), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP') },
  });
  await q.addIndex('sessions', ['expires'], { name: 'sessions_expires' });
};

export const down: Migration = async ({ context: { queryInterface: q } }) => {
  await q.dropTable('sessions');
  await q.dropTable('audit_events');
};
