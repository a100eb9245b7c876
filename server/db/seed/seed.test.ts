import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openTestDb, truncateAll, type TestDb } from '../../test/test-db';
import { seedDemo } from './seed';
import { DEMO_USERS } from './demo-users';
import { studyParamsSchema } from '../../../shared/schemas/index';

let db: TestDb;

beforeAll(async () => {
  db = openTestDb();
  await truncateAll(db.sequelize);
});
afterAll(async () => {
  await truncateAll(db.sequelize);
  await db.sequelize.close();
});

async function counts() {
  const { User, Team, Membership, Part, Study, Revision } = db.models;
  return {
    users: await User.count(),
    teams: await Team.count(),
    memberships: await Membership.count(),
    parts: await Part.count(),
    studies: await Study.count(),
    revisions: await Revision.count(),
  };
}

describe('demo seed', () => {
  it('inserts a team with a viewer, an engineer, a lead, a site admin, two parts and several studies', async () => {
    expect((await seedDemo(db.sequelize, db.models)).created).toBe(true);
    const c = await counts();
    expect(c).toMatchObject({ users: DEMO_USERS.length, teams: 1, parts: 2 });
    expect(c.studies).toBeGreaterThanOrEqual(3);
    expect(c.revisions).toBeGreaterThan(c.studies);
    const roles = (await db.models.Membership.findAll()).map((m) => m.role).sort();
    expect(roles).toEqual(['engineer', 'lead', 'viewer']);
    expect(await db.models.User.count({ where: { isAdmin: true } })).toBe(1);
    const pinned = await db.models.Part.findAll({ where: { baselineRevisionId: { [Op.ne]: null } } });
    expect(pinned.length).toBeGreaterThanOrEqual(1);
  });

  it('stores only study params the shared schema accepts', async () => {
    const revisions = await db.models.Revision.findAll();
    for (const r of revisions) expect(studyParamsSchema.safeParse(r.params).success).toBe(true);
  });

  it('does nothing on a second run', async () => {
    const before = await counts();
    expect((await seedDemo(db.sequelize, db.models)).created).toBe(false);
    expect(await counts()).toEqual(before);
  });
});
