import type { Transaction } from 'sequelize';
import { AuditEvent } from '../models/index';

export type AuditAction =
  | 'study.create'
  | 'revision.save'
  | 'revision.restore'
  | 'study.fork'
  | 'part.create'
  | 'baseline.pin'
  | 'member.role'
  | 'member.remove'
  | 'invite.create'
  | 'invite.resend'
  | 'invite.accept'
  | 'team.create';

export interface AuditEntry {
  teamId: number | null;
  actorId: number | null;
  action: AuditAction;
  subjectType: 'study' | 'revision' | 'part' | 'membership' | 'invite' | 'team';
  subjectId: number | null;
  details?: Record<string, unknown>;
}

/** Appends one event; runs inside the caller's transaction so the event and the change commit together. */
export async function recordAudit(entry: AuditEntry, transaction?: Transaction) {
  await AuditEvent.create({ ...entry, details: entry.details ?? null }, { transaction });
}
