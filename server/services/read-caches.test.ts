/**
 * The read caches against the real database: every change that shows in a
 * study read shows on the very next request, including when a read runs
 * while the change is still uncommitted (it sees, and might keep, the old rows).
 */
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { call, resetToDemoTeam, startHarness, type Harness, type SignedIn } from '../test/harness';
import { referenceStudy } from '../../shared/solver/demo-cards';

let h: Harness;
let engineer: SignedIn;
let lead: SignedIn;
let viewer: SignedIn;
let studyId: number;
let partId: number;

beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h.close());

beforeEach(async () => {
  ({ engineer, lead, viewer, studyId, partId } = await resetToDemoTeam(h));
});

const readStudy = (who: SignedIn) => call(who, 'get', `/api/studies/${studyId}`).expect(200);

describe('a cached study read', () => {
  it('shows a new baseline pin at once', async () => {
    const before = await readStudy(viewer);
    const r1 = (await h.db.models.Revision.findOne({ where: { studyId, number: 1 } }))!;
    expect(before.body.part.baselineRevisionId).not.toBe(r1.id);
    await call(lead, 'put', `/api/parts/${partId}/baseline`, { revisionId: r1.id, note: 'trial lot' }).expect(200);
    expect((await readStudy(viewer)).body.part.baselineRevisionId).toBe(r1.id);
  });

  it("shows a person's new name at once", async () => {
    const before = await readStudy(viewer);
    const owner = (await h.db.models.User.findByPk(before.body.owner.id))!;
    await owner.update({ name: 'Amara Okafor-Lind' });
    const after = await readStudy(viewer);
    expect(after.body.owner.name).toBe('Amara Okafor-Lind');
    expect(after.body.latest.author.name).toBe('Amara Okafor-Lind');
  });

  it('does not keep a save that a read saw uncommitted', async () => {
    const { Study, Revision } = h.db.models;
    expect((await readStudy(viewer)).body.latestRevisionNumber).toBe(2);
    await h.db.sequelize.transaction(async (transaction) => {
      const study = (await Study.findByPk(studyId, { transaction, lock: transaction.LOCK.UPDATE }))!;
      await Revision.create(
        { studyId, number: 3, params: referenceStudy(), summary: null, authorId: engineer.userId!, message: 'in flight', basedOnNumber: 2, restoredFromNumber: null },
        { transaction },
      );
      await study.update({ latestRevisionNumber: 3 }, { transaction });
      // another connection still reads revision 2 as the latest, and the cache is empty again
      expect((await readStudy(viewer)).body.latestRevisionNumber).toBe(2);
    });
    const after = await readStudy(viewer);
    expect(after.body.latestRevisionNumber).toBe(3);
    expect(after.body.latest.message).toBe('in flight');
  });
});

describe('cached roles', () => {
  it('do not keep a role that a read saw before the change committed', async () => {
    const teamId = (await readStudy(engineer)).body.teamId as number;
    await h.db.sequelize.transaction(async (transaction) => {
      const membership = (await h.db.models.Membership.findOne({ where: { teamId, userId: engineer.userId! }, transaction }))!;
      await membership.update({ role: 'viewer' }, { transaction });
      expect((await readStudy(engineer)).body.role).toBe('engineer');
    });
    expect((await readStudy(engineer)).body.role).toBe('viewer');
    await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'no longer allowed', params: referenceStudy() }).expect(403);
  });
});

describe('cached sessions', () => {
  it('are gone on sign-out: the old cookie, sent again, reads nothing', async () => {
    const read = await readStudy(viewer); // the session is now cached
    const cookie = (read.request as unknown as { cookies: string }).cookies;
    expect(cookie).toMatch(/dwellform\.sid=/);
    await request(h.app).get(`/api/studies/${studyId}`).set('Cookie', cookie).expect(200);
    await call(viewer, 'post', '/api/auth/logout').expect(204);
    await request(h.app).get(`/api/studies/${studyId}`).set('Cookie', cookie).expect(401);
  });
});
