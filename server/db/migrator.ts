import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Umzug, SequelizeStorage, type MigrationFn } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

/** A migration file exports `up` and `down` of this type. */
export type Migration = MigrationFn<{ queryInterface: QueryInterface; sequelize: Sequelize }>;

const migrationsDir = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

// One line per migration step instead of umzug's default object dumps.
const lineLogger = {
  info: (e: Record<string, unknown>) => {
    if (e.event === 'migrated' || e.event === 'reverted') console.log(`  ${String(e.event)} ${String(e.name)}`);
  },
  warn: (e: Record<string, unknown>) => console.warn(e),
  error: (e: Record<string, unknown>) => console.error(e),
  debug: () => {},
};

/**
 * Umzug over `server/db/migrations/*.ts`, applied in file-name order and
 * recorded in the `schema_migrations` table. Files are loaded with a dynamic
 * import, so they run under tsx and under Vitest alike.
 */
export function createMigrator(sequelize: Sequelize, options: { quiet?: boolean } = {}) {
  return new Umzug({
    migrations: {
      glob: ['*.ts', { cwd: migrationsDir, ignore: ['*.test.ts', '*.d.ts'] }],
      resolve: ({ name, path: file, context }) => {
        const load = () => import(pathToFileURL(file!).href) as Promise<{ up: Migration; down: Migration }>;
        return {
          name,
          up: async () => (await load()).up({ name, context }),
          down: async () => (await load()).down({ name, context }),
        };
      },
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: options.quiet ? undefined : lineLogger,
  });
}
