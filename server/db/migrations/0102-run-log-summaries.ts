import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migrator';

// What a run-log list shows (rows, duration, finding counts) in columns of its own, so listing a study's or
// a part's runs no longer reads every run's stored analysis (hundreds of kB of JSON each). One row per
// run-log upload, written in the same transaction as the upload; existing uploads are filled from their JSON.
export const up: Migration = async ({ context: { queryInterface: q, sequelize } }) => {
  await q.createTable('run_log_summaries', {
    upload_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'uploads', key: 'id' }, onDelete: 'CASCADE' },
    rows: { type: DataTypes.INTEGER, allowNull: false },
    duration_min: { type: DataTypes.DOUBLE, allowNull: false },
    violations: { type: DataTypes.INTEGER, allowNull: false },
    warnings: { type: DataTypes.INTEGER, allowNull: false },
  });
  // Backfill one upload at a time: each parsed record can be large.
  const ids = await sequelize.query<{ id: number }>(`SELECT id FROM uploads WHERE kind = 'run-log'`, { type: QueryTypes.SELECT });
  for (const { id } of ids) {
    const [row] = await sequelize.query<{ parsed: unknown }>('SELECT parsed FROM uploads WHERE id = ?', { replacements: [id], type: QueryTypes.SELECT });
    const record = (typeof row.parsed === 'string' ? JSON.parse(row.parsed) : row.parsed) as {
      rows: number;
      durationMin: number;
      hygiene: { findings: { severity: string }[] };
      spec: { findings: { severity: string }[] };
    } | null;
    if (!record) continue;
    const all = [...record.hygiene.findings, ...record.spec.findings];
    await q.bulkInsert('run_log_summaries', [
      {
        upload_id: id,
        rows: record.rows,
        duration_min: record.durationMin,
        violations: all.filter((f) => f.severity === 'violation').length,
        warnings: all.filter((f) => f.severity === 'warning').length,
      },
    ]);
  }
};

export const down: Migration = async ({ context: { queryInterface: q } }) => {
  await q.dropTable('run_log_summaries');
};
