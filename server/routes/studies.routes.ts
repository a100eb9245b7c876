import { Router, type Request } from 'express';
import type { Sequelize } from 'sequelize';
import { currentUser, requireTeamRole, roleAllows, roleIn } from '../auth/access';
import { Part, Revision, Study, User } from '../models/index';
import { badRequest, forbidden, notFound } from '../middleware/http-error';
import type { StudyParams } from '../../shared/schemas/index';
import { createStudy, revisionView, saveRevision, studyDetail } from '../services/study.service';
import { forkBody, idParam, restoreBody, saveRevisionBody } from './request-schemas';
import { cachedTeamOf, studyDetailCache, studyTeamCache } from '../services/read-caches';

export const teamOfStudy = async (req: Request) => {
  const id = idParam(req.params.studyId);
  if (!id) return null;
  return cachedTeamOf(studyTeamCache, id, async () => (await Study.findByPk(id, { attributes: ['teamId'] }))?.teamId ?? null);
};

async function findRevision(req: Request) {
  const studyId = idParam(req.params.studyId)!;
  const number = idParam(req.params.number);
  const revision = number ? await Revision.findOne({ where: { studyId, number }, include: [{ model: User, as: 'author', attributes: ['id', 'login', 'name'] }] }) : null;
  if (!revision) throw notFound(`Study ${studyId} has no revision ${req.params.number}.`);
  return revision;
}

export function studyRoutes(sequelize: Sequelize): Router {
  const router = Router();
  const canRead = requireTeamRole('read', teamOfStudy);
  const canWrite = requireTeamRole('write', teamOfStudy);

  router.get('/studies/:studyId', canRead, async (req, res) => {
    const id = idParam(req.params.studyId)!;
    // Kept serialised: turning the params into JSON on every read was the largest cost of a warm read
    // (profiled at 64 connections); only the caller's role is added per request.
    const json = await studyDetailCache.getOrLoad(id, async () => JSON.stringify(await studyDetail(id)));
    res.type('application/json').send(`{"role":${JSON.stringify(req.teamAccess!.role)},${json.slice(1)}`);
  });

  router.get('/studies/:studyId/revisions', canRead, async (req, res) => {
    const revisions = await Revision.findAll({
      where: { studyId: idParam(req.params.studyId)! },
      attributes: { exclude: ['params'] },
      include: [{ model: User, as: 'author', attributes: ['id', 'login', 'name'] }],
      order: [['number', 'DESC']],
    });
    res.json(revisions.map((r) => revisionView(r, false)));
  });

  router.get('/studies/:studyId/revisions/:number', canRead, async (req, res) => {
    res.json(revisionView(await findRevision(req), true));
  });

  router.post('/studies/:studyId/revisions', canWrite, async (req, res) => {
    const body = saveRevisionBody.parse(req.body);
    const revision = await saveRevision(sequelize, {
      studyId: idParam(req.params.studyId)!,
      authorId: currentUser(req).id,
      baseRevision: body.baseRevision,
      params: body.params,
      message: body.message,
    });
    res.status(201).json(revisionView(revision, false));
  });

  /** Restoring never rewrites history: the old params become a new revision on top of the latest. */
  router.post('/studies/:studyId/revisions/:number/restore', canWrite, async (req, res) => {
    const body = restoreBody.parse(req.body);
    const old = await findRevision(req);
    const revision = await saveRevision(sequelize, {
      studyId: old.studyId,
      authorId: currentUser(req).id,
      baseRevision: body.baseRevision,
      params: old.params as StudyParams,
      message: body.message || `Restored revision ${old.number}`,
      restoredFromNumber: old.number,
    });
    res.status(201).json(revisionView(revision, false));
  });

  /**
   * Fork: any revision the caller can read, into a new study they own, under
   * a part of a team where they are engineer or lead (default: the same part).
   */
  router.post('/studies/:studyId/revisions/:number/fork', canRead, async (req, res) => {
    const body = forkBody.parse(req.body);
    const user = currentUser(req);
    const source = await findRevision(req);
    const sourceStudy = (await Study.findByPk(source.studyId))!;
    const part = await Part.findByPk(body.partId ?? sourceStudy.partId);
    if (!part) throw badRequest(`Invalid partId: part ${body.partId} does not exist.`, { field: 'partId' });
    const role = await roleIn(user.id, part.teamId);
    if (!roleAllows(role, 'write')) {
      if (role === null && body.partId) throw badRequest(`Invalid partId: you are not a member of the team that owns part ${body.partId}.`, { field: 'partId' });
      throw forbidden(`Forking into this part needs engineer or lead; your role there is ${role ?? 'none'}.`);
    }
    const { study, revision } = await createStudy(sequelize, {
      part,
      ownerId: user.id,
      title: body.title ?? `${sourceStudy.title} (fork of r${source.number})`,
      params: source.params as StudyParams,
      message: `Forked from “${sourceStudy.title}” revision ${source.number}`,
      forkedFrom: source,
    });
    res.status(201).json({ id: study.id, title: study.title, latestRevisionNumber: 1, revisionId: revision.id, forkedFromRevisionId: source.id });
  });

  return router;
}
