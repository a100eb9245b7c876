import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type AuditEvent = {
  id: number;
  action: string;
  /** one readable sentence, with names, written by the server */
  sentence: string;
  subjectType: string;
  subjectId: number | null;
  details: Record<string, unknown> | null;
  createdAt: string;
  actor: { id: number; login: string; name: string } | null;
};

export const getAudit = (teamId: string) => api.get<AuditEvent[]>(`/teams/${encodeURIComponent(teamId)}/audit`);

export const auditQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: ['teams', 'detail', teamId, 'audit'], queryFn: () => getAudit(teamId) });

export const useAudit = (teamId: string, enabled = true) => useQuery({ ...auditQueryOptions(teamId), enabled });
