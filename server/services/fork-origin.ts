import { Op } from 'sequelize';
import { Revision, Study, User } from '../models/index';

export interface ForkOrigin {
  revisionId: number;
  studyId: number;
  studyTitle: string;
  number: number;
  /** who wrote the revision the fork started from */
  author: { id: number; name: string } | null;
}

/** Where each forked study came from, for lists of studies (one query for all of them). */
export async function forkOrigins(studies: { id: number; forkedFromRevisionId: number | null }[]): Promise<Map<number, ForkOrigin>> {
  const ids = [...new Set(studies.map((s) => s.forkedFromRevisionId).filter((id): id is number => id !== null))];
  if (!ids.length) return new Map();
  const revisions = await Revision.findAll({
    where: { id: { [Op.in]: ids } },
    attributes: ['id', 'studyId', 'number'],
    include: [
      { model: Study, as: 'study', attributes: ['id', 'title'] },
      { model: User, as: 'author', attributes: ['id', 'name'] },
    ],
  });
  const byRevision = new Map(
    revisions.map((r) => {
      const x = r as Revision & { study?: Study; author?: User };
      return [x.id, { revisionId: x.id, studyId: x.studyId, studyTitle: x.study?.title ?? `study ${x.studyId}`, number: x.number, author: x.author ? { id: x.author.id, name: x.author.name } : null }];
    }),
  );
  const out = new Map<number, ForkOrigin>();
  for (const s of studies) {
    const origin = s.forkedFromRevisionId !== null ? byRevision.get(s.forkedFromRevisionId) : undefined;
    if (origin) out.set(s.id, origin);
  }
  return out;
}
