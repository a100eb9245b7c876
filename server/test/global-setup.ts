/**
 * Once per `vitest --project server` run: make sure the local MariaDB runs
 * (tools/dev/db.sh is idempotent), recreate the test database from nothing
 * and apply every migration, so each run starts from the real schema.
 */
import { execFileSync } from 'node:child_process';
import { loadConfig } from '../config/index';
import { createSequelize } from '../db/sequelize';
import { createMigrator } from '../db/migrator';
import { testEnv, TEST_DB_NAME } from './test-env';

export default async function setup() {
  execFileSync('bash', ['tools/dev/db.sh', 'start'], { stdio: ['ignore', 'ignore', 'inherit'] });
  const config = loadConfig({ ...process.env, ...testEnv });

  // Connect without a default database to drop and create the test one.
  const admin = createSequelize({ ...config.db, name: '' });
  await admin.query(`DROP DATABASE IF EXISTS \`${TEST_DB_NAME}\``);
  await admin.query(`CREATE DATABASE \`${TEST_DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();

  const sequelize = createSequelize(config.db);
  await createMigrator(sequelize, { quiet: true }).up();
  await sequelize.close();
}
