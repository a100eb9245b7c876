import { DataTypes, literal } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
  updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
};
const teamRef = { model: 'teams', key: 'id' };
const userRef = { model: 'users', key: 'id' };

export const up: Migration = async ({ context: { queryInterface: q } }) => {
  await q.createTable('materials', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: false, references: teamRef, onDelete: 'CASCADE' },
    kind: { type: DataTypes.ENUM('resin', 'ply'), allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false },
    params: { type: DataTypes.JSON, allowNull: false },
    // Who fitted the card, from which upload, with what fit quality.
    provenance: { type: DataTypes.JSON, allowNull: true },
    created_by: { type: DataTypes.INTEGER, allowNull: true, references: userRef, onDelete: 'SET NULL' },
    ...timestamps,
  });

  await q.createTable('uploads', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: false, references: teamRef, onDelete: 'CASCADE' },
    kind: { type: DataTypes.ENUM('run-log', 'dsc', 'dma', 'other'), allowNull: false },
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    mime_type: { type: DataTypes.STRING(120), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    checksum_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    parsed: { type: DataTypes.JSON, allowNull: true },
    uploaded_by: { type: DataTypes.INTEGER, allowNull: true, references: userRef, onDelete: 'SET NULL' },
    study_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'studies', key: 'id' }, onDelete: 'SET NULL' },
    ...timestamps,
  });
  await q.addIndex('uploads', ['team_id', 'checksum_sha256'], { name: 'uploads_team_checksum' });

  await q.createTable('reviews', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: false, references: teamRef, onDelete: 'CASCADE' },
    upload_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'uploads', key: 'id' }, onDelete: 'CASCADE' },
    decision: { type: DataTypes.ENUM('use-as-is', 'rework', 'scrap'), allowNull: false },
    rationale: { type: DataTypes.TEXT, allowNull: false },
    decided_by: { type: DataTypes.INTEGER, allowNull: true, references: userRef, onDelete: 'SET NULL' },
    ...timestamps,
  });
};

export const down: Migration = async ({ context: { queryInterface: q } }) => {
  await q.dropTable('reviews');
  await q.dropTable('uploads');
  await q.dropTable('materials');
};
