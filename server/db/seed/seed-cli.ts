/** `tsx server/db/seed/seed-cli.ts` — insert the demo scenario unless it is already there. */
import { loadConfig } from '../../config/index';
import { createSequelize } from '../sequelize';
import { initModels } from '../../models/index';
import { seedDemo } from './seed';
import { closeSummaryPool } from '../../services/revision-summary.service';

const sequelize = createSequelize(loadConfig().db);
try {
  const { created } = await seedDemo(sequelize, initModels(sequelize));
  console.log(created ? 'demo data seeded' : 'demo data already present; not seeding again');
} catch (err) {
  console.error(`seed failed: ${(err as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeSummaryPool();
  await sequelize.close();
}
