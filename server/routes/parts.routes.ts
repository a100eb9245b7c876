import { Router, type Request } from 'express';
import { Op, type Sequelize } from 'sequelize';
import { currentUser, requireTeamRole } from '../auth/access';
import { Part, Revision, Study, User } from '../models/index';
import { badRequest } from '../middleware/http-error';
import { recordAudit } from '../services/audit.service';
import { createStudy } from '../services/study.service';
import { baselineView } from './teams.routes';
import { auditEvents } from '../services/audit-view';
import { forkOrigins } from '../services/fork-origin';
import { createStudyBody, idParam, pinBaselineBody } from './request-schemas';
import { cachedTeamOf, partTeamCache } from '../services/read-caches';

export const teamOfPart = async (req: Request) => {
  const id = idParam(req.params.partId);
  if (!id) return null;
  return cachedTeamOf(partTeamCache, id, async () => (await Part.findByPk(id, { attributes: ['teamId'] }))?.teamId ?? null);
};

/** The part's own history: its baseline pins, and the studies, run logs and review decisions under it. */
async function partHistory(part: Part, studyIds: number[]) {
  const events = await auditEvents(
    {
      teamId: part.teamId,
      [Op.or]: [
        { subjectType: 'part', subjectId: part.id },
        { action: { [Op.in]: ['run-log.upload', 'review.decide', 'study.create', 'study.fork'] } },
      ],
    },
    300,
  );
  const ofPart = new Set(studyIds);
  return events.filter((e) => (e.subjectType === 'part' && e.subjectId === part.id) || (e.studyId !== null && ofPart.has(e.studyId))).slice(0, 50);
}

export function partRoutes(sequelize: Sequelize): Router {
  const router = Router();

  router.get('/parts/:partId', requireTeamRole('read', teamOfPart), async (req, res) => {
    const part = (await Part.findByPk(idParam(req.params.partId)!))!;
    const studies = await Study.findAll({
      where: { partId: part.id },
      include: [{ model: User, as: 'owner', attributes: ['id', 'login', 'name'] }],
      order: [['updatedAt', 'DESC']],
    });
    const origins = await forkOrigins(studies);
    res.json({
      id: part.id,
      teamId: part.teamId,
      partNumber: part.partNumber,
      name: part.name,
      description: part.description,
      role: req.teamAccess!.role,
      baseline: await baselineView(part),
      studies: studies.map((s) => {
        const owner = (s as Study & { owner?: User }).owner;
        return {
          id: s.id,
          title: s.title,
          latestRevisionNumber: s.latestRevisionNumber,
          forkedFromRevisionId: s.forkedFromRevisionId,
          forkedFrom: origins.get(s.id) ?? null,
          updatedAt: s.updatedAt,
          owner: owner ? { id: owner.id, login: owner.login, name: owner.name } : null,
        };
      }),
      history: await partHistory(part, studies.map((s) => s.id)),
    });
  });

  router.post('/parts/:partId/studies', requireTeamRole('write', teamOfPart), async (req, res) => {
    const body = createStudyBody.parse(req.body);
    const part = (await Part.findByPk(idParam(req.params.partId)!))!;
    const { study, revision } = await createStudy(sequelize, {
      part,
      ownerId: currentUser(req).id,
      title: body.title,
      params: body.params,
      message: body.message,
    });
    res.status(201).json({ id: study.id, title: study.title, latestRevisionNumber: 1, revisionId: revision.id });
  });

  /** Pins a revision of one of this part's studies as its baseline; each change is audited with the previous pin. */
  router.put('/parts/:partId/baseline', requireTeamRole('pinBaseline', teamOfPart), async (req, res) => {
    const body = pinBaselineBody.parse(req.body);
    const part = (await Part.findByPk(idParam(req.params.partId)!))!;
    const revision = (await Revision.findByPk(body.revisionId, { include: [{ model: Study, as: 'study', attributes: ['partId', 'title'] }] })) as
      | (Revision & { study: Study })
      | null;
    if (!revision || revision.study.partId !== part.id) {
      throw badRequest(`Invalid revisionId: revision ${body.revisionId} is not a revision of a study of this part.`, { field: 'revisionId' });
    }
    // the replaced pin is kept, with names, in the event itself
    const old = part.baselineRevisionId
      ? await Revision.findByPk(part.baselineRevisionId, { attributes: ['id', 'studyId', 'number'], include: [{ model: Study, as: 'study', attributes: ['title'] }] })
      : null;
    const previous = {
      revisionId: part.baselineRevisionId,
      studyId: old?.studyId ?? null,
      studyTitle: (old as (Revision & { study?: Study }) | null)?.study?.title ?? null,
      number: old?.number ?? null,
      note: part.baselineNote,
    };
    const user = currentUser(req);
    await sequelize.transaction(async (transaction) => {
      await part.update({ baselineRevisionId: revision.id, baselineNote: body.note, baselinePinnedBy: user.id, baselinePinnedAt: new Date() }, { transaction });
      await recordAudit(
        {
          teamId: part.teamId,
          actorId: user.id,
          action: 'baseline.pin',
          subjectType: 'part',
          subjectId: part.id,
          details: {
            revisionId: revision.id,
            studyId: revision.studyId,
            studyTitle: revision.study.title,
            number: revision.number,
            partNumber: part.partNumber,
            partName: part.name,
            note: body.note,
            previous,
          },
        },
        transaction,
      );
    });
    res.json(await baselineView(part));
  });

  return router;
}
