import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type ForkInput = { studyId: string; revision: number; title?: string };
export type Forked = { id: number; title: string; latestRevisionNumber: number };

/** A new study of one's own starting from a revision (used when a save lost the race). */
export async function forkRevision(input: ForkInput): Promise<Forked> {
  return api.post<Forked>(`/studies/${encodeURIComponent(input.studyId)}/revisions/${input.revision}/fork`, input.title ? { title: input.title } : {});
}

export const useForkRevision = () => useMutation({ mutationFn: forkRevision });
