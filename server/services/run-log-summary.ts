import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A run log's list figures (migration 0102): listing reads these, never the stored analysis JSON. */
export class RunLogSummary extends Model<InferAttributes<RunLogSummary>, InferCreationAttributes<RunLogSummary>> {
  declare uploadId: number;
  declare rows: number;
  declare durationMin: number;
  declare violations: number;
  declare warnings: number;
}

/** Binds the model to this connection (again when a test opens a new one). */
export function defineRunLogSummary(sequelize: Sequelize) {
  if (RunLogSummary.sequelize === sequelize) return RunLogSummary;
  RunLogSummary.init(
    {
      uploadId: { type: DataTypes.INTEGER, primaryKey: true },
      rows: { type: DataTypes.INTEGER, allowNull: false },
      durationMin: { type: DataTypes.DOUBLE, allowNull: false },
      violations: { type: DataTypes.INTEGER, allowNull: false },
      warnings: { type: DataTypes.INTEGER, allowNull: false },
    },
    { sequelize, tableName: 'run_log_summaries', modelName: 'RunLogSummary', timestamps: false, underscored: true },
  );
  return RunLogSummary;
}
