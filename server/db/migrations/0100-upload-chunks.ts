import { DataTypes } from 'sequelize';
import type { Migration } from '../migrator';

// Bytes of an upload kept in the database beside its row, so one transaction stores or drops everything:
// the raw file as sent (its SHA-256 is on the upload row) and the parsed series in binary. Files are cut into
// pieces below MariaDB's default 16 MB max_allowed_packet.
export const up: Migration = async ({ context: { queryInterface: q } }) => {
  await q.createTable('upload_chunks', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    upload_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'uploads', key: 'id' }, onDelete: 'CASCADE' },
    part: { type: DataTypes.ENUM('raw', 'series'), allowNull: false },
    seq: { type: DataTypes.INTEGER, allowNull: false },
    data: { type: DataTypes.BLOB('medium'), allowNull: false },
  });
  await q.addIndex('upload_chunks', ['upload_id', 'part', 'seq'], { name: 'upload_chunks_order', unique: true });
};

export const down: Migration = async ({ context: { queryInterface: q } }) => {
  await q.dropTable('upload_chunks');
};
