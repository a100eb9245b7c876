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

export async function getStudy(studyId: string): Promise<WorkspaceStudy> {
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
    };
  }
  const body = await api.get<StudyDetailBody>(`/studies/${encodeURIComponent(studyId)}`);
  if (!body.latest) throw new Error(`Study ${studyId} has no revision to open.`);
  return {
    id: String(body.id),
    title: body.title,
    partLabel: body.part ? `${body.part.partNumber} · ${body.part.name}` : null,
    latestRevisionNumber: body.latest.number,
    params: body.latest.params,
    role: body.role,
    offline: false,
  };
}

export const studyQueryOptions = (studyId: string) =>
  queryOptions({
    queryKey: ['studies', 'detail', studyId],
    queryFn: () => getStudy(studyId),
    // The editor owns the study once opened; a background refetch must not replace unsaved edits.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useStudy = (studyId: string) => useQuery(studyQueryOptions(studyId));
