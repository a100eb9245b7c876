import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { call, resetToDemoTeam, startHarness, type Harness, type SignedIn } from '../test/harness';
import { referenceStudy } from '../../shared/solver/demo-cards';
import type { StudyParams } from '../../shared/schemas/index';

let h: Harness;
let engineer: SignedIn;
let lead: SignedIn;
let viewer: SignedIn;
let studyId: number; // the lead's study, revisions 1–2
let partId: number;

function withFirstHold(holdMin: number): StudyParams {
  const p = referenceStudy();
  if (p.cycle.kind === 'segments') {
    const hold = p.cycle.segments[1];
    if (hold.kind === 'hold') hold.holdMin = holdMin;
  }
  return p;
}

beforeAll(async () => {
  h = await startHarness();
});
afterAll(() => h.close());

beforeEach(async () => {
  ({ engineer, lead, viewer, studyId, partId } = await resetToDemoTeam(h));
});

const revisionCount = () => h.db.models.Revision.count({ where: { studyId } });

describe('saving revisions', () => {
  it('appends an immutable revision with author, message and based-on number', async () => {
    const before = (await h.db.models.Revision.findOne({ where: { studyId, number: 2 } }))!.toJSON();
    const res = await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'First dwell 75 min', params: withFirstHold(75) }).expect(201);
    expect(res.body).toMatchObject({ number: 3, basedOnNumber: 2, message: 'First dwell 75 min', author: null });
    const saved = await call(viewer, 'get', `/api/studies/${studyId}/revisions/3`).expect(200);
    expect(saved.body.author.login).toBe('tomas.reed');
    expect(saved.body.params.cycle.segments[1].holdMin).toBe(75);
    // revision 2 is untouched
    expect((await h.db.models.Revision.findOne({ where: { studyId, number: 2 } }))!.toJSON()).toEqual(before);
    const history = await call(viewer, 'get', `/api/studies/${studyId}/revisions`).expect(200);
    expect(history.body.map((r: { number: number }) => r.number)).toEqual([3, 2, 1]);
    expect(history.body[0]).not.toHaveProperty('params');
  });

  it('refuses a stale base with 409 naming the newer revision, and keeps both people\'s work', async () => {
    await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'mine', params: withFirstHold(70) }).expect(201);
    const stale = await call(lead, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'theirs', params: withFirstHold(80) }).expect(409);
    expect(stale.body).toMatchObject({ latestRevision: 3, baseRevision: 2 });
    expect(stale.body.error).toContain('Revision 3');
    expect(await revisionCount()).toBe(3);
    // reapplied on the new base, it goes through
    await call(lead, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 3, message: 'theirs', params: withFirstHold(80) }).expect(201);
    expect(await revisionCount()).toBe(4);
  });

  it('lets exactly one of several concurrent saves on the same base win', async () => {
    const attempts = [engineer, lead, engineer, lead, engineer, lead, engineer, lead].map((who, i) =>
      call(who, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: `concurrent ${i}`, params: withFirstHold(61 + i) }),
    );
    const statuses = (await Promise.all(attempts)).map((r) => r.status).sort();
    expect(statuses).toEqual([201, 409, 409, 409, 409, 409, 409, 409]);
    const revisions = await h.db.models.Revision.findAll({ where: { studyId }, order: [['number', 'ASC']] });
    expect(revisions.map((r) => r.number)).toEqual([1, 2, 3]);
    expect((await h.db.models.Study.findByPk(studyId))!.latestRevisionNumber).toBe(3);
  });

  it('answers a schema failure with 400 naming the field and its limit, and changes nothing', async () => {
    const params = referenceStudy() as unknown as { cycle: { segments: { rateCPerMin?: number }[] } };
    params.cycle.segments[0].rateCPerMin = 45; // allowed ≤ 20 °C/min by the shared schema
    const countsBefore = [await revisionCount(), await h.db.models.AuditEvent.count()];
    const res = await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'too fast', params }).expect(400);
    expect(res.body.field).toBe('params.cycle.segments.0.rateCPerMin');
    expect(res.body.error).toContain('params.cycle.segments.0.rateCPerMin');
    expect(res.body.error).toMatch(/20/);
    expect([await revisionCount(), await h.db.models.AuditEvent.count()]).toEqual(countsBefore);
    expect((await h.db.models.Study.findByPk(studyId))!.latestRevisionNumber).toBe(2);
  });

  it('ignores numbers a client sends as its own summary', async () => {
    const res = await call(engineer, 'post', `/api/studies/${studyId}/revisions`, {
      baseRevision: 2,
      message: 'with a forged summary',
      params: referenceStudy(),
      summary: { finalCureMin: 1, warpageMm: 0 },
    }).expect(201);
    const stored = (await h.db.models.Revision.findByPk(res.body.id))!.summary as { finalCureMin: number; modelVersion: string };
    // recomputed by the shared solver: the reference two-dwell cycle cures well short of 1.0 and is not the client's value
    expect(stored.modelVersion).toMatch(/dwellform-solver/);
    expect(stored.finalCureMin).toBeGreaterThan(0.5);
    expect(stored.finalCureMin).toBeLessThan(1);
    expect(res.body.summary).toEqual(stored);
  });

  it('restores an old revision as a new one, leaving history intact', async () => {
    await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'detour', params: withFirstHold(30) }).expect(201);
    const res = await call(engineer, 'post', `/api/studies/${studyId}/revisions/1/restore`, { baseRevision: 3 }).expect(201);
    expect(res.body).toMatchObject({ number: 4, restoredFromNumber: 1, basedOnNumber: 3 });
    const r1 = await call(viewer, 'get', `/api/studies/${studyId}/revisions/1`).expect(200);
    const r4 = await call(viewer, 'get', `/api/studies/${studyId}/revisions/4`).expect(200);
    expect(r4.body.params).toEqual(r1.body.params);
    expect(await revisionCount()).toBe(4);
  });

  it('records every save in the append-only audit trail', async () => {
    await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'audited', params: withFirstHold(65) }).expect(201);
    const audit = await call(lead, 'get', `/api/teams/${(await h.db.models.Study.findByPk(studyId))!.teamId}/audit`).expect(200);
    expect(audit.body[0]).toMatchObject({ action: 'revision.save', actor: { login: 'tomas.reed' }, details: { number: 3, message: 'audited' } });
    const event = await h.db.models.AuditEvent.findByPk(audit.body[0].id);
    await expect(event!.update({ action: 'tampered' })).rejects.toThrow(/append-only/);
  });
});

describe('role changes', () => {
  it('take effect on the very next request, cached reads included', async () => {
    const study = await call(engineer, 'get', `/api/studies/${studyId}`).expect(200);
    expect(study.body.role).toBe('engineer');
    const teamId = study.body.teamId;
    const engineerId = engineer.userId!;
    await call(lead, 'patch', `/api/teams/${teamId}/members/${engineerId}`, { role: 'viewer' }).expect(200);
    const after = await call(engineer, 'get', `/api/studies/${studyId}`).expect(200);
    expect(after.body.role).toBe('viewer');
    await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'no longer allowed', params: referenceStudy() }).expect(403);
    await call(lead, 'delete', `/api/teams/${teamId}/members/${engineerId}`).expect(204);
    await call(engineer, 'get', `/api/studies/${studyId}`).expect(404);
  });

  it('a save shows in the study read at once', async () => {
    await call(viewer, 'get', `/api/studies/${studyId}`).expect(200);
    await call(engineer, 'post', `/api/studies/${studyId}/revisions`, { baseRevision: 2, message: 'fresh', params: withFirstHold(66) }).expect(201);
    const read = await call(viewer, 'get', `/api/studies/${studyId}`).expect(200);
    expect(read.body.latestRevisionNumber).toBe(3);
    expect(read.body.latest.params.cycle.segments[1].holdMin).toBe(66);
  });
});

describe('forks', () => {
  it('copies a colleague\'s revision into a study of the engineer\'s own that shows its origin', async () => {
    const res = await call(engineer, 'post', `/api/studies/${studyId}/revisions/2/fork`, { title: 'My take on the two-dwell cycle' }).expect(201);
    const fork = await call(engineer, 'get', `/api/studies/${res.body.id}`).expect(200);
    expect(fork.body).toMatchObject({
      title: 'My take on the two-dwell cycle',
      owner: { login: 'tomas.reed' },
      latestRevisionNumber: 1,
      forkedFrom: { studyId, number: 2, studyTitle: 'Two-dwell cycle for the 24-ply panel' },
      part: { id: partId },
    });
    const source = await call(engineer, 'get', `/api/studies/${studyId}/revisions/2`).expect(200);
    expect(fork.body.latest.params).toEqual(source.body.params);
    // the source study is unchanged
    expect((await h.db.models.Study.findByPk(studyId))!.latestRevisionNumber).toBe(2);
    // the origin shows on the part page and the team home, with the source revision's author
    const origin = { studyId, studyTitle: 'Two-dwell cycle for the 24-ply panel', number: 2, author: { name: source.body.author.name } };
    const part = await call(viewer, 'get', `/api/parts/${partId}`).expect(200);
    expect(part.body.studies.find((s: { id: number }) => s.id === res.body.id).forkedFrom).toMatchObject(origin);
    const home = await call(viewer, 'get', `/api/teams/${fork.body.teamId}`).expect(200);
    expect(home.body.recentStudies.find((s: { id: number }) => s.id === res.body.id).forkedFrom).toMatchObject(origin);
    expect(fork.body.links).toEqual({ history: `/studies/${res.body.id}/history`, part: `/parts/${partId}`, forkedFrom: `/studies/${studyId}/history` });
  });

  it('refuses a fork into a team where the user is only a viewer', async () => {
    await call(viewer, 'post', `/api/studies/${studyId}/revisions/1/fork`, {}).expect(403);
  });

  it('refuses a fork into a part of a team the user does not belong to', async () => {
    const other = await h.db.models.Team.create({ slug: 'radome-cell', name: 'Radome Cell', description: null });
    const foreignPart = await h.db.models.Part.create({
      teamId: other.id, partNumber: 'RC-1', name: 'Radome shell', description: null,
      baselineRevisionId: null, baselineNote: null, baselinePinnedBy: null, baselinePinnedAt: null,
    });
    const res = await call(engineer, 'post', `/api/studies/${studyId}/revisions/1/fork`, { partId: foreignPart.id }).expect(400);
    expect(res.body.field).toBe('partId');
  });
});

describe('baselines', () => {
  it('lets a lead pin a revision with a note, shows it on the part page, and audits the change', async () => {
    const r1 = (await h.db.models.Revision.findOne({ where: { studyId, number: 1 } }))!;
    const pinned = await call(lead, 'put', `/api/parts/${partId}/baseline`, { revisionId: r1.id, note: 'Back to the shop sheet for the trial lot' }).expect(200);
    expect(pinned.body).toMatchObject({ revisionId: r1.id, number: 1, note: 'Back to the shop sheet for the trial lot', pinnedBy: { login: 'amara.okafor' } });
    const part = await call(viewer, 'get', `/api/parts/${partId}`).expect(200);
    expect(part.body.baseline).toMatchObject({ revisionId: r1.id, studyId, number: 1 });
    const audit = await call(lead, 'get', `/api/teams/${part.body.teamId}/audit`).expect(200);
    const pin = audit.body.find((e: { action: string }) => e.action === 'baseline.pin');
    expect(pin.details).toMatchObject({ revisionId: r1.id, note: 'Back to the shop sheet for the trial lot' });
    expect(pin.details.previous.revisionId).not.toBe(r1.id);
  });

  it('writes the pin as one sentence with names, keeping the replaced pin, on the team trail, team home and part history', async () => {
    const before = (await h.db.models.Part.findByPk(partId))!;
    const old = (await h.db.models.Revision.findByPk(before.baselineRevisionId!))!;
    const oldStudy = (await h.db.models.Study.findByPk(old.studyId))!;
    const r1 = (await h.db.models.Revision.findOne({ where: { studyId, number: 1 } }))!;
    await call(lead, 'put', `/api/parts/${partId}/baseline`, { revisionId: r1.id, note: 'Trial lot' }).expect(200);
    const want = `pinned “Two-dwell cycle for the 24-ply panel” r1 as baseline of ${before.partNumber} · ${before.name} (was “${oldStudy.title}” r${old.number})`;
    const audit = await call(lead, 'get', `/api/teams/${before.teamId}/audit`).expect(200);
    expect(audit.body[0]).toMatchObject({ action: 'baseline.pin', sentence: want, actor: { name: 'Amara Okafor' } });
    expect(audit.body[0].details.previous).toMatchObject({ revisionId: old.id, studyTitle: oldStudy.title, number: old.number });
    const home = await call(viewer, 'get', `/api/teams/${before.teamId}`).expect(200);
    expect(home.body.activity[0].sentence).toBe(want);
    const part = await call(viewer, 'get', `/api/parts/${partId}`).expect(200);
    expect(part.body.history.map((e: { sentence: string }) => e.sentence)).toContain(want);
  });

  it('names the member and both roles when a lead changes a role', async () => {
    const team = (await h.db.models.Team.findOne({ where: { slug: 'tail-structures' } }))!;
    await call(lead, 'patch', `/api/teams/${team.id}/members/${viewer.userId}`, { role: 'engineer' }).expect(200);
    const audit = await call(lead, 'get', `/api/teams/${team.id}/audit`).expect(200);
    expect(audit.body[0].sentence).toBe("changed Ines Varga's role from viewer to engineer");
  });

  it('refuses a pin without a note, or of a revision from another part', async () => {
    const r1 = (await h.db.models.Revision.findOne({ where: { studyId, number: 1 } }))!;
    const noNote = await call(lead, 'put', `/api/parts/${partId}/baseline`, { revisionId: r1.id, note: '' }).expect(400);
    expect(noNote.body.field).toBe('note');
    const otherStudy = (await h.db.models.Study.findOne({ where: { title: 'Thick-section exotherm check' } }))!;
    const foreign = (await h.db.models.Revision.findOne({ where: { studyId: otherStudy.id, number: 1 } }))!;
    const wrongPart = await call(lead, 'put', `/api/parts/${partId}/baseline`, { revisionId: foreign.id, note: 'x' }).expect(400);
    expect(wrongPart.body.field).toBe('revisionId');
  });

  it('refuses the pin to an engineer', async () => {
    const r1 = (await h.db.models.Revision.findOne({ where: { studyId, number: 1 } }))!;
    await call(engineer, 'put', `/api/parts/${partId}/baseline`, { revisionId: r1.id, note: 'not mine to pin' }).expect(403);
  });
});
