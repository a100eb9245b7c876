import type { Sequelize } from 'sequelize';
import type { StudyParams } from '../../shared/schemas/index';
import { Part, Revision, Study, User } from '../models/index';
import { conflict, notFound } from '../middleware/http-error';
import { recordAudit } from './audit.service';
import { summarizeStudy } from './revision-summary.service';

export interface SaveRequest {
  studyId: number;
  authorId: number;
  /** the revision number the editor started from; must still be the latest */
  baseRevision: number;
  params: StudyParams;
  message: string;
  restoredFromNumber?: number | null;
}

/**
 * Creates a study with its first revision (the summary is computed before the
 * transaction so the solver's CPU time holds no locks).
 */
export async function createStudy(
  sequelize: Sequelize,
  input: { part: Part; ownerId: number; title: string; params: StudyParams; message: string; forkedFrom?: Revision | null },
) {
  const summary = await summarizeStudy(input.params);
  return sequelize.transaction(async (transaction) => {
    // names go into the audit event as they are now, so the trail reads the same after a rename
    const source = input.forkedFrom ? await Study.findByPk(input.forkedFrom.studyId, { attributes: ['title'], transaction }) : null;
    const study = await Study.create(
      {
        teamId: input.part.teamId,
        partId: input.part.id,
        ownerId: input.ownerId,
        title: input.title,
        forkedFromRevisionId: input.forkedFrom?.id ?? null,
        latestRevisionNumber: 1,
      },
      { transaction },
    );
    const revision = await Revision.create(
      {
        studyId: study.id,
        number: 1,
        params: input.params,
        summary,
        authorId: input.ownerId,
        message: input.message,
        basedOnNumber: null,
        restoredFromNumber: null,
      },
      { transaction },
    );
    await recordAudit(
      {
        teamId: study.teamId,
        actorId: input.ownerId,
        action: input.forkedFrom ? 'study.fork' : 'study.create',
        subjectType: 'study',
        subjectId: study.id,
        details: input.forkedFrom
          ? {
              studyId: study.id,
              title: study.title,
              partNumber: input.part.partNumber,
              partName: input.part.name,
              fromRevisionId: input.forkedFrom.id,
              fromStudyId: input.forkedFrom.studyId,
              fromStudyTitle: source?.title ?? null,
              fromNumber: input.forkedFrom.number,
            }
          : { studyId: study.id, title: study.title, partNumber: input.part.partNumber, partName: input.part.name },
      },
      transaction,
    );
    return { study, revision };
  });
}

/**
 * Saves a new immutable revision on top of `baseRevision`. The study row is
 * locked for the check-and-insert, so of two saves on the same base exactly
 * one wins; the other gets 409 naming the newer revision. The unique key
 * (study, number) and the study's version column guard the same rule again.
 */
export async function saveRevision(sequelize: Sequelize, req: SaveRequest) {
  const summary = await summarizeStudy(req.params);
  return sequelize.transaction(async (transaction) => {
    const study = await Study.findByPk(req.studyId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!study) throw notFound('Study not found.');
    if (study.latestRevisionNumber !== req.baseRevision) {
      throw conflict(
        `Revision ${study.latestRevisionNumber} was saved after revision ${req.baseRevision}, which your change is based on. Reload it, reapply your change and save again.`,
        { latestRevision: study.latestRevisionNumber, baseRevision: req.baseRevision },
      );
    }
    const number = study.latestRevisionNumber + 1;
    const revision = await Revision.create(
      {
        studyId: study.id,
        number,
        params: req.params,
        summary,
        authorId: req.authorId,
        message: req.message,
        basedOnNumber: req.baseRevision,
        restoredFromNumber: req.restoredFromNumber ?? null,
      },
      { transaction },
    );
    study.latestRevisionNumber = number;
    study.changed('updatedAt', true);
    await study.save({ transaction });
    await recordAudit(
      {
        teamId: study.teamId,
        actorId: req.authorId,
        action: req.restoredFromNumber ? 'revision.restore' : 'revision.save',
        subjectType: 'revision',
        subjectId: revision.id,
        details: { studyId: study.id, studyTitle: study.title, number, message: req.message, ...(req.restoredFromNumber ? { restoredFrom: req.restoredFromNumber } : {}) },
      },
      transaction,
    );
    return revision;
  });
}

const authorAttrs = ['id', 'login', 'name', 'avatarUrl'];

export function revisionView(r: Revision & { author?: User }, withParams: boolean) {
  return {
    id: r.id,
    studyId: r.studyId,
    number: r.number,
    message: r.message,
    basedOnNumber: r.basedOnNumber,
    restoredFromNumber: r.restoredFromNumber,
    createdAt: r.createdAt,
    author: r.author ? { id: r.author.id, login: r.author.login, name: r.author.name } : null,
    summary: r.summary,
    ...(withParams ? { params: r.params } : {}),
  };
}

export async function studyDetail(studyId: number) {
  const study = await Study.findByPk(studyId, {
    include: [
      { model: User, as: 'owner', attributes: authorAttrs },
      { model: Part, as: 'part', attributes: ['id', 'partNumber', 'name', 'teamId', 'baselineRevisionId'] },
      {
        model: Revision,
        as: 'forkedFrom',
        attributes: ['id', 'number', 'studyId'],
        include: [
          { model: Study, as: 'study', attributes: ['id', 'title', 'teamId'] },
          { model: User, as: 'author', attributes: ['id', 'name'] },
        ],
      },
    ],
  });
  if (!study) throw notFound('Study not found.');
  const latest = await Revision.findOne({
    where: { studyId, number: study.latestRevisionNumber },
    include: [{ model: User, as: 'author', attributes: authorAttrs }],
  });
  const s = study as Study & { owner?: User; part?: Part; forkedFrom?: Revision & { study?: Study; author?: User } };
  return {
    id: s.id,
    teamId: s.teamId,
    title: s.title,
    latestRevisionNumber: s.latestRevisionNumber,
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
    owner: s.owner ? { id: s.owner.id, login: s.owner.login, name: s.owner.name } : null,
    part: s.part ? { id: s.part.id, partNumber: s.part.partNumber, name: s.part.name, baselineRevisionId: s.part.baselineRevisionId } : null,
    forkedFrom: s.forkedFrom
      ? {
          revisionId: s.forkedFrom.id,
          number: s.forkedFrom.number,
          studyId: s.forkedFrom.studyId,
          studyTitle: s.forkedFrom.study?.title ?? null,
          teamId: s.forkedFrom.study?.teamId ?? null,
          author: s.forkedFrom.author ? { id: s.forkedFrom.author.id, name: s.forkedFrom.author.name } : null,
        }
      : null,
    // client paths, so the workspace header can link to the history, the part and the fork's origin
    links: {
      history: `/studies/${s.id}/history`,
      part: s.part ? `/parts/${s.part.id}` : null,
      forkedFrom: s.forkedFrom ? `/studies/${s.forkedFrom.studyId}/history` : null,
    },
    latest: latest ? revisionView(latest as Revision & { author?: User }, true) : null,
  };
}
