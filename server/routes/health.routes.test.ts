import { execFileSync } from 'node:child_process';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../app';
import { openTestDb, type TestDb } from '../test/test-db';

/**
 * The "down" case stops a real mariadbd. So as not to pull the database from
 * under anything else using the shared instance, it runs a second private
 * instance through the same script (own data dir and port), stops it, and
 * starts it again.
 */
const SECOND = {
  DB_DATA_DIR: path.resolve('.data/mariadb-health-test'),
  // Beside the shared instance's port, so two checkouts with their own DB_PORT never collide.
  DB_PORT: String(Number(process.env.DB_PORT ?? 3307) + 10),
};
const dbScript = (command: 'start' | 'stop') =>
  execFileSync('bash', ['tools/dev/db.sh', command], { env: { ...process.env, ...SECOND }, stdio: 'pipe' }).toString();

let shared: TestDb;
let second: TestDb;

beforeAll(() => {
  shared = openTestDb();
  dbScript('start');
  second = openTestDb({ DB_PORT: SECOND.DB_PORT });
}, 120_000);

afterAll(async () => {
  await shared.sequelize.close();
  await second.sequelize.close();
  dbScript('stop');
});

describe('GET /api/health', () => {
  it('says the database is up on the shared test instance', async () => {
    const app = createApp({ config: shared.config, sequelize: shared.sequelize });
    const res = await request(app).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up', version: shared.config.version });
  });

  it('says down with 503 while mariadbd is stopped, and up again once restarted', async () => {
    const app = createApp({ config: second.config, sequelize: second.sequelize });
    await request(app).get('/api/health').expect(200);

    expect(dbScript('stop')).toMatch(/stopped/);
    const down = await request(app).get('/api/health').expect(503);
    expect(down.body).toMatchObject({ db: 'down', status: 'degraded' });

    expect(dbScript('start')).toMatch(/started/);
    const up = await request(app).get('/api/health').expect(200);
    expect(up.body.db).toBe('up');
  }, 90_000);
});
