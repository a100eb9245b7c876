import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type Person = { id: number; login: string; name: string } | null;
export type Baseline = {
  revisionId: number;
  studyId: number | null;
  studyTitle: string | null;
  number: number | null;
  summary: { finalCureMin?: number; peakOvershootC?: number; warpageMm?: number; cycleMin?: number } | null;
  note: string | null;
  pinnedAt: string | null;
  pinnedBy: Person;
};
export type ForkOrigin = { revisionId: number; studyId: number; studyTitle: string; number: number; author: { id: number; name: string } | null };
export type ActivityItem = { id: number; action: string; sentence: string; createdAt: string; actor: Person; studyId: number | null };
export type TeamHome = {
  team: { id: number; slug: string; name: string; description: string | null };
  role: 'viewer' | 'engineer' | 'lead' | null;
  parts: { id: number; partNumber: string; name: string; description: string | null; studyCount: number; baseline: Baseline | null }[];
  recentStudies: {
    id: number;
    title: string;
    latestRevisionNumber: number;
    updatedAt: string;
    forkedFromRevisionId: number | null;
    forkedFrom: ForkOrigin | null;
    owner: Person;
    part: { id: number; partNumber: string; name: string } | null;
  }[];
  recentRevisions: { id: number; studyId: number; studyTitle: string; number: number; message: string; restoredFromNumber: number | null; createdAt: string; author: Person }[];
  /** who changed what: the last audited changes of every kind */
  activity: ActivityItem[];
};

export const getTeamHome = (teamId: string) => api.get<TeamHome>(`/teams/${encodeURIComponent(teamId)}`);

export const teamHomeQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: ['teams', 'detail', teamId], queryFn: () => getTeamHome(teamId) });

export const useTeamHome = (teamId: string) => useQuery(teamHomeQueryOptions(teamId));
