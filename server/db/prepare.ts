import { loadConfig, type Config } from '../config/index';
import { createSequelize } from './sequelize';
import { createMigrator } from './migrator';
import { initModels } from '../models/index';
import { seedDemo, type SeedOptions } from './seed/seed';
import { closeSummaryPool } from '../services/revision-summary.service';

/**
 * What `npm start` and `npm run dev` do before serving: apply pending
 * migrations, then insert the demo scenario if it is not there yet.
 */
export async function prepareDatabase(config: Config = loadConfig(), options: SeedOptions & { seed?: boolean } = {}) {
  const sequelize = createSequelize(config.db);
  try {
    const applied = await createMigrator(sequelize).up();
    console.log(applied.length ? `database: applied ${applied.length} migration(s)` : 'database: schema up to date');
    if (options.seed !== false) {
      const { created } = await seedDemo(sequelize, initModels(sequelize), options);
      console.log(created ? 'database: demo scenario seeded' : 'database: demo scenario already present');
    }
  } finally {
    await closeSummaryPool();
    await sequelize.close();
  }
}
