/**
 * One readable sentence per audit event, e.g. "pinned “Two-dwell cycle” r2 as
 * baseline of TB-1 · Hinge fairing (was “Single dwell” r1)". The names come
 * from the event's own details, written when the change happened (so renaming
 * or deleting something later does not rewrite history); `names` fills in
 * study titles for events whose writers stored only ids (run-log uploads and
 * review decisions, older events).
 */
export interface AuditLike {
  action: string;
  details: unknown;
}

export interface AuditNames {
  studyTitle: (studyId: number) => string | undefined;
}

type Details = Record<string, unknown>;

const str = (v: unknown) => (typeof v === 'string' && v.trim() ? v : undefined);
const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
const quoted = (title: string | undefined, id: unknown) => (title ? `“${title}”` : num(id) !== undefined ? `study ${String(id)}` : 'a study');

function studyRef(d: Details, names: AuditNames, titleKey = 'studyTitle', idKey = 'studyId') {
  const id = num(d[idKey]);
  return quoted(str(d[titleKey]) ?? (id !== undefined ? names.studyTitle(id) : undefined), d[idKey]);
}

function partRef(d: Details) {
  const number = str(d.partNumber);
  const name = str(d.partName);
  if (number && name) return `${number} · ${name}`;
  return number ?? name ?? 'a part';
}

const DECISION: Record<string, string> = { 'use-as-is': 'use as is', rework: 'rework', scrap: 'scrap' };

export function auditSentence(event: AuditLike, names: AuditNames = { studyTitle: () => undefined }): string {
  const d: Details = event.details && typeof event.details === 'object' ? (event.details as Details) : {};
  switch (event.action) {
    case 'study.create':
      return `created study ${quoted(str(d.title), d.studyId)}${d.partNumber || d.partName ? ` in ${partRef(d)}` : ''}`;
    case 'study.fork':
      return `forked ${studyRef(d, names, 'fromStudyTitle', 'fromStudyId')} r${String(d.fromNumber ?? '?')} into ${quoted(str(d.title), undefined)}`;
    case 'revision.save':
      return `saved ${studyRef(d, names)} r${String(d.number ?? '?')}${str(d.message) ? ` — ${String(d.message)}` : ''}`;
    case 'revision.restore':
      return `restored r${String(d.restoredFrom ?? '?')} of ${studyRef(d, names)} as r${String(d.number ?? '?')}`;
    case 'part.create':
      return `created part ${partRef(d)}`;
    case 'baseline.pin': {
      const prev = (d.previous && typeof d.previous === 'object' ? d.previous : {}) as Details;
      const was = num(prev.revisionId) !== undefined ? ` (was ${studyRef(prev, names)} r${String(prev.number ?? '?')})` : ' (none pinned before)';
      return `pinned ${studyRef(d, names)} r${String(d.number ?? '?')} as baseline of ${partRef(d)}${was}`;
    }
    case 'member.role':
      return `changed ${str(d.userName) ?? 'a member'}'s role from ${String(d.from)} to ${String(d.to)}`;
    case 'member.remove':
      return `removed ${str(d.userName) ?? 'a member'} (${String(d.role)}) from the team`;
    case 'invite.create':
      return `invited ${String(d.email)} as ${String(d.role)}`;
    case 'invite.resend':
      return `sent the invitation to ${String(d.email)} again`;
    case 'invite.accept':
      return `accepted the invitation for ${String(d.email)} and joined as ${String(d.role)}`;
    case 'team.create':
      return `created the team ${str(d.name) ?? str(d.slug) ?? ''}`.trim();
    case 'run-log.upload':
      return `uploaded run log ${str(d.fileName) ?? ''} to ${studyRef(d, names)}`.replace('  ', ' ');
    case 'review.decide':
      return `decided ${DECISION[String(d.decision)] ?? String(d.decision)} on run log ${String(d.runLogId ?? '?')} of ${studyRef(d, names)}`;
    case 'seed.demo':
      return 'loaded the demo data';
    default:
      return event.action;
  }
}
