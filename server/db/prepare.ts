import { loadConfig, type Config } from '../config/index';
import { createSequelize } from './sequelize';
import { createMigrator } from './migrator';
import { initModels } from '../models/index';
import { seedDemo, type SeedOptions } from './seed/seed';
import { closeSummaryPool, summarizeStudy } from '../services/revision-summary.service';
import { studyParamsSchema } from '../../shared/schemas/index';

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
      const models = initModels(sequelize);
      const { created } = await seedDemo(sequelize, models, options);
      console.log(created ? 'database: demo scenario seeded' : 'database: demo scenario already present');
      await backfillSummaries(models);
    }
  } finally {
    await closeSummaryPool();
    await sequelize.close();
  }
}

/**
 * A revision saved while the solver could not finish keeps a null summary.
 * The summary is derived data (the params are the record), so it is filled
 * in here once the solver can compute it. Bounded per start.
 */
async function backfillSummaries(models: ReturnType<typeof initModels>, limit = 200) {
  const missing = await models.Revision.findAll({ where: { summary: null }, limit, attributes: ['id', 'params'] });
  let filled = 0;
  for (const revision of missing) {
    const parsed = studyParamsSchema.safeParse(revision.params);
    if (!parsed.success) continue;
    const summary = await summarizeStudy(parsed.data, () => {});
    if (summary) {
      await models.Revision.update({ summary }, { where: { id: revision.id } });
      filled++;
    }
  }
  if (filled) console.log(`database: computed ${filled} missing revision summar${filled === 1 ? 'y' : 'ies'}`);
}
