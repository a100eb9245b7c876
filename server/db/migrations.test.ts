import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Sequelize } from 'sequelize';
import { loadConfig } from '../config/index';
import { createSequelize } from './sequelize';
import { createMigrator } from './migrator';
import { TEST_DB_NAME } from '../test/test-env';

// A scratch database of its own, so reverting migrations never disturbs the shared test schema.
const SCRATCH = `${TEST_DB_NAME}_migrations`;
// The library's tables; later migrations may add more.
const EXPECTED_TABLES = [
  'audit_events', 'invites', 'materials', 'memberships', 'parts', 'reviews',
  'revisions', 'sessions', 'studies', 'teams', 'uploads', 'users',
];

let admin: Sequelize;
let sequelize: Sequelize;

async function tables(): Promise<string[]> {
  const [rows] = await sequelize.query(
    "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> 'schema_migrations' ORDER BY table_name",
  );
  return (rows as { t: string }[]).map((r) => r.t);
}

beforeAll(async () => {
  const config = loadConfig();
  admin = createSequelize({ ...config.db, name: '' });
  await admin.query(`DROP DATABASE IF EXISTS \`${SCRATCH}\``);
  await admin.query(`CREATE DATABASE \`${SCRATCH}\``);
  sequelize = createSequelize({ ...config.db, name: SCRATCH });
});

afterAll(async () => {
  await sequelize.close();
  await admin.query(`DROP DATABASE IF EXISTS \`${SCRATCH}\``);
  await admin.close();
});

describe('migrations', () => {
  it('create the whole data model on an empty database', async () => {
    const applied = await createMigrator(sequelize, { quiet: true }).up();
    expect(applied.length).toBeGreaterThanOrEqual(4);
    expect(await tables()).toEqual(expect.arrayContaining(EXPECTED_TABLES));
  });

  it('refuse a second revision with the same number in one study', async () => {
    await sequelize.query("INSERT INTO users (login, name) VALUES ('m.test', 'M Test')");
    await sequelize.query("INSERT INTO teams (slug, name) VALUES ('t', 'T')");
    await sequelize.query("INSERT INTO parts (team_id, part_number, name) VALUES (1, 'P-1', 'Part')");
    await sequelize.query("INSERT INTO studies (team_id, part_id, owner_id, title) VALUES (1, 1, 1, 'S')");
    const insert = "INSERT INTO revisions (study_id, number, params, author_id) VALUES (1, 1, '{}', 1)";
    await sequelize.query(insert);
    await expect(sequelize.query(insert)).rejects.toMatchObject({ name: 'SequelizeUniqueConstraintError' });
  });

  it('revert every step back to an empty database, and apply again', async () => {
    const migrator = createMigrator(sequelize, { quiet: true });
    await migrator.down({ to: 0 });
    expect(await tables()).toEqual([]);
    expect(await migrator.executed()).toEqual([]);
    await migrator.up();
    expect(await tables()).toEqual(expect.arrayContaining(EXPECTED_TABLES));
    expect(await migrator.pending()).toEqual([]);
  });
});
