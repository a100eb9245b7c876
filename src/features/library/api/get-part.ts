import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

type Person = { id: number; login: string; name: string } | null;

export type PartDetail = {
  id: number;
  teamId: number;
  partNumber: string;
  name: string;
  description: string | null;
  role: 'viewer' | 'engineer' | 'lead' | null;
  baseline: {
    revisionId: number;
    studyId: number | null;
    studyTitle: string | null;
    number: number | null;
    summary: RevisionSummary | null;
    note: string | null;
    pinnedAt: string | null;
    pinnedBy: Person;
  } | null;
  studies: {
    id: number;
    title: string;
    latestRevisionNumber: number;
    forkedFromRevisionId: number | null;
    forkedFrom: { revisionId: number; studyId: number; studyTitle: string; number: number; author: { id: number; name: string } | null } | null;
    updatedAt: string;
    owner: Person;
  }[];
  /** the part's own history, newest first: baseline pins, new studies and forks, run logs and review decisions */
  history: { id: number; action: string; sentence: string; createdAt: string; actor: Person; studyId: number | null }[];
};

/** The figures a revision's summary carries (recomputed by the server's solver). */
export type RevisionSummary = {
  finalCureMin?: number;
  peakOvershootC?: number;
  maxGradientC?: number;
  warpageMm?: number;
  springInDeg?: number;
  cycleMin?: number;
  limits?: { key: string; label: string; pass: boolean }[];
};

export const getPart = (partId: string) => api.get<PartDetail>(`/parts/${encodeURIComponent(partId)}`);

export const partQueryOptions = (partId: string) => queryOptions({ queryKey: ['parts', 'detail', partId], queryFn: () => getPart(partId) });

export const usePart = (partId: string) => useQuery(partQueryOptions(partId));
