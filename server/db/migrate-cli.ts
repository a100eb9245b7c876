/**
 * `npm run db:migrate` — apply (or with `down`, revert the last) migration.
 * Usage: tsx server/db/migrate-cli.ts up|down|status
 */
import { loadConfig } from '../config/index';
import { createSequelize } from './sequelize';
import { createMigrator } from './migrator';

const command = process.argv[2] ?? 'up';
const sequelize = createSequelize(loadConfig().db);
const migrator = createMigrator(sequelize);

try {
  if (command === 'up') {
    const done = await migrator.up();
    console.log(done.length ? `migrated: ${done.map((m) => m.name).join(', ')}` : 'database schema is up to date');
  } else if (command === 'down') {
    const undone = await migrator.down();
    console.log(undone.length ? `reverted: ${undone.map((m) => m.name).join(', ')}` : 'nothing to revert');
  } else if (command === 'status') {
    const pending = await migrator.pending();
    const executed = await migrator.executed();
    console.log(`executed: ${executed.length}, pending: ${pending.map((m) => m.name).join(', ') || 'none'}`);
  } else {
    console.error('usage: migrate-cli.ts up|down|status');
    process.exitCode = 2;
  }
} catch (err) {
  console.error(`migration failed: ${(err as Error).message}`);
  process.exitCode = 1;
} finally {
  await sequelize.close();
}
