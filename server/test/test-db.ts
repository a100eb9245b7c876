import type { Sequelize } from 'sequelize';
import { loadConfig, type Config } from '../config/index';
import { createSequelize } from '../db/sequelize';
import { initModels, type Models } from '../models/index';

export interface TestDb {
  config: Config;
  sequelize: Sequelize;
  models: Models;
}

export function openTestDb(overrides: NodeJS.ProcessEnv = {}): TestDb {
  const config = loadConfig({ ...process.env, ...overrides });
  const sequelize = createSequelize(config.db);
  return { config, sequelize, models: initModels(sequelize) };
}

/** Empties every table (keeps the schema and the migration record). */
export async function truncateAll(sequelize: Sequelize) {
  const [rows] = await sequelize.query(
    "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> 'schema_migrations'",
  );
  // One connection for all statements: FOREIGN_KEY_CHECKS is per session.
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 0', { transaction });
    for (const { t } of rows as { t: string }[]) await sequelize.query(`TRUNCATE TABLE \`${t}\``, { transaction });
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 1', { transaction });
  });
}
