import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { StudyParams } from '../../../../shared/schemas/study';

/** What the workspace needs of a study: its name, latest revision number and that revision's params. */
export type WorkspaceStudy = {
  id: string;
  title: string;
  partLabel: string | null;
  latestRevisionNumber: number | null;
  params: StudyParams;
  role: 'viewer' | 'engineer' | 'lead' | null;
  /** opened without the library (the offline demo): cannot be saved */
  offline: boolean;
  /** the earlier revision shown read-only (`?r=N`); null when the latest is open for editing */
  viewingRevision: number | null;
};

/** The study id that opens the reference study without the library (no sign-in, nothing to save). */
export const OFFLINE_DEMO_ID = 'demo';

type StudyDetailBody = {
  id: number;
  title: string;
  latestRevisionNumber: number;
  part: { partNumber: string; name: string } | null;
  latest: { number: number; params: StudyParams } | null;
  role: WorkspaceStudy['role'];
};

type RevisionBody = { number: number; params: StudyParams };

/** The study to open: its latest revision, or revision `revision` (read-only) when that is an earlier one. */
export async function getStudy(studyId: string, revision: number | null = null): Promise<WorkspaceStudy> {
  if (studyId === OFFLINE_DEMO_ID) {
    const { referenceStudy } = await import('../../../../shared/solver/demo-cards');
    return {
      id: studyId,
      title: 'Reference study (offline demo)',
      partLabel: null,
      latestRevisionNumber: null,
      params: referenceStudy(),
      role: null,
      offline: true,
      viewingRevision: null,
    };
  }
  const base = `/studies/${encodeURIComponent(studyId)}`;
  const body = await api.get<StudyDetailBody>(base);
  if (!body.latest) throw new Error(`Study ${studyId} has no revision to open.`);
  // The latest revision named by number opens for editing, like the plain link.
  const earlier = revision !== null && revision !== body.latest.number ? await api.get<RevisionBody>(`${base}/revisions/${revision}`) : null;
  return {
    id: String(body.id),
    title: body.title,
    partLabel: body.part ? `${body.part.partNumber} · ${body.part.name}` : null,
    latestRevisionNumber: body.latest.number,
    params: earlier ? earlier.params : body.latest.params,
    role: body.role,
    offline: false,
    viewingRevision: earlier ? earlier.number : null,
  };
}

/** `?r=N` → N, or null (no revision named, or not a positive whole number: the latest opens). */
export function revisionParam(text: string | null): number | null {
  if (text === null || !/^\d+$/.test(text)) return null;
  const n = Number(text);
  return n >= 1 ? n : null;
}

export const studyQueryOptions = (studyId: string, revision: number | null = null) =>
  queryOptions({
    queryKey: revision === null ? ['studies', 'detail', studyId] : ['studies', 'detail', studyId, 'revision', revision],
    queryFn: () => getStudy(studyId, revision),
    // The editor owns the study once opened; a background refetch must not replace unsaved edits.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useStudy = (studyId: string, revision: number | null = null) => useQuery(studyQueryOptions(studyId, revision));
