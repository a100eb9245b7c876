import { DataTypes, literal } from 'sequelize';
import type { Migration } from '../migrator';

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
  updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
};
const userRef = { model: 'users', key: 'id' };

export const up: Migration = async ({ context: { queryInterface: q } }) => {
  await q.createTable('parts', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    part_number: { type: DataTypes.STRING(40), allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false },
    description: { type: DataTypes.TEXT, allowNull: true },
    // The pinned baseline; the FK is added once revisions exist (below).
    baseline_revision_id: { type: DataTypes.INTEGER, allowNull: true },
    baseline_note: { type: DataTypes.STRING(500), allowNull: true },
    baseline_pinned_by: { type: DataTypes.INTEGER, allowNull: true, references: userRef, onDelete: 'SET NULL' },
    baseline_pinned_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await q.addIndex('parts', ['team_id', 'part_number'], { unique: true, name: 'parts_team_number' });

  await q.createTable('studies', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    team_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'teams', key: 'id' }, onDelete: 'CASCADE' },
    part_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'parts', key: 'id' }, onDelete: 'CASCADE' },
    owner_id: { type: DataTypes.INTEGER, allowNull: false, references: userRef },
    title: { type: DataTypes.STRING(160), allowNull: false },
    forked_from_revision_id: { type: DataTypes.INTEGER, allowNull: true },
    latest_revision_number: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    // Optimistic lock: bumped on every save, so two writers cannot both win.
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await q.addIndex('studies', ['team_id', 'updated_at'], { name: 'studies_team_updated' });

  await q.createTable('revisions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    study_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'studies', key: 'id' }, onDelete: 'CASCADE' },
    number: { type: DataTypes.INTEGER, allowNull: false },
    params: { type: DataTypes.JSON, allowNull: false },
    summary: { type: DataTypes.JSON, allowNull: true },
    author_id: { type: DataTypes.INTEGER, allowNull: false, references: userRef },
    message: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    // The revision number this one was saved on top of (null for the first).
    based_on_number: { type: DataTypes.INTEGER, allowNull: true },
    // Set when this revision restores an older one of the same study.
    restored_from_number: { type: DataTypes.INTEGER, allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') },
  });
  // The unique key is the last guard against two saves taking the same number.
  await q.addIndex('revisions', ['study_id', 'number'], { unique: true, name: 'revisions_study_number' });

  await q.addConstraint('parts', {
    type: 'foreign key',
    fields: ['baseline_revision_id'],
    name: 'parts_baseline_revision_fk',
    references: { table: 'revisions', field: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });
  await q.addConstraint('studies', {
    type: 'foreign key',
    fields: ['forked_from_revision_id'],
    name: 'studies_forked_from_fk',
    references: { table: 'revisions', field: 'id' },
    onDelete: 'SET NULL',
    onUpdate: 'CASCADE',
  });
};

export const down: Migration = async ({ context: { queryInterface: q } }) => {
  await q.removeConstraint('studies', 'studies_forked_from_fk');
  await q.removeConstraint('parts', 'parts_baseline_revision_fk');
  await q.dropTable('revisions');
  await q.dropTable('studies');
  await q.dropTable('parts');
};
