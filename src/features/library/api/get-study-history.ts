import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RevisionSummary } from './get-part';

export type StudyOverview = {
  id: number;
  teamId: number;
  title: string;
  latestRevisionNumber: number;
  role: 'viewer' | 'engineer' | 'lead' | null;
  owner: { id: number; login: string; name: string } | null;
  part: { id: number; partNumber: string; name: string; baselineRevisionId: number | null } | null;
  forkedFrom: { revisionId: number; number: number; studyId: number; studyTitle: string | null } | null;
};

export type RevisionEntry = {
  id: number;
  number: number;
  message: string;
  basedOnNumber: number | null;
  restoredFromNumber: number | null;
  createdAt: string;
  author: { id: number; login: string; name: string } | null;
  summary: RevisionSummary | null;
};

export const getStudyOverview = (studyId: string) => api.get<StudyOverview>(`/studies/${encodeURIComponent(studyId)}`);
export const getStudyRevisions = (studyId: string) => api.get<RevisionEntry[]>(`/studies/${encodeURIComponent(studyId)}/revisions`);

export const studyOverviewQueryOptions = (studyId: string) =>
  queryOptions({ queryKey: ['studies', 'overview', studyId], queryFn: () => getStudyOverview(studyId) });

export const studyRevisionsQueryOptions = (studyId: string) =>
  queryOptions({ queryKey: ['studies', 'revisions', studyId], queryFn: () => getStudyRevisions(studyId) });

export const useStudyOverview = (studyId: string) => useQuery(studyOverviewQueryOptions(studyId));
export const useStudyRevisions = (studyId: string) => useQuery(studyRevisionsQueryOptions(studyId));
