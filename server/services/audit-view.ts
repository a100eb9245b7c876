import { Op, type WhereOptions } from 'sequelize';
import { AuditEvent, Study, User } from '../models/index';
import { auditSentence } from './audit-sentence';

type Details = Record<string, unknown>;

/** Study ids an event's details mention (its own, a fork's source, a pin's previous baseline). */
function studyIdsOf(details: unknown): number[] {
  if (!details || typeof details !== 'object') return [];
  const d = details as Details;
  const prev = (d.previous && typeof d.previous === 'object' ? d.previous : {}) as Details;
  return [d.studyId, d.fromStudyId, prev.studyId].filter((v): v is number => typeof v === 'number');
}

/**
 * Audit events as the pages show them: who, when, and one sentence saying
 * what changed, with names (titles missing from older or run-log events are
 * looked up in one query).
 */
export async function auditEvents(where: WhereOptions<AuditEvent>, limit: number) {
  const events = await AuditEvent.findAll({
    where,
    include: [{ model: User, as: 'actor', attributes: ['id', 'login', 'name'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  const ids = [...new Set(events.flatMap((e) => studyIdsOf(e.details)))];
  const studies = ids.length ? await Study.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'title'] }) : [];
  const titleOf = new Map(studies.map((s) => [s.id, s.title]));
  return events.map((e) => {
    const actor = (e as AuditEvent & { actor?: User }).actor;
    return {
      id: e.id,
      action: e.action,
      sentence: auditSentence(e, { studyTitle: (id) => titleOf.get(id) }),
      subjectType: e.subjectType,
      subjectId: e.subjectId,
      details: e.details,
      createdAt: e.createdAt,
      actor: actor ? { id: actor.id, login: actor.login, name: actor.name } : null,
      studyId: studyIdsOf(e.details)[0] ?? null,
    };
  });
}
