import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '../../../lib/api-client';
import type { StudyParams } from '../../../../shared/schemas/study';

export type SaveRevisionInput = { studyId: string; baseRevision: number; message: string; params: StudyParams };
export type SavedRevision = { id: number; studyId: number; number: number; message: string };

/** A save refused because someone saved a newer revision first. */
export class StaleRevisionError extends Error {
  readonly latestRevision: number | null;
  constructor(message: string, latestRevision: number | null) {
    super(message);
    this.name = 'StaleRevisionError';
    this.latestRevision = latestRevision;
  }
}

export async function saveRevision(input: SaveRevisionInput): Promise<SavedRevision> {
  try {
    return await api.post<SavedRevision>(`/studies/${encodeURIComponent(input.studyId)}/revisions`, {
      baseRevision: input.baseRevision,
      message: input.message,
      params: input.params,
    });
  } catch (error) {
    if (error instanceof ApiError && error.status === 409) {
      const body = error.body as { details?: { latestRevision?: number }; latestRevision?: number } | null;
      const latest = body?.details?.latestRevision ?? body?.latestRevision ?? null;
      throw new StaleRevisionError(error.message, typeof latest === 'number' ? latest : null);
    }
    throw error;
  }
}

export function useSaveRevision() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveRevision,
    onSuccess: (_saved, input) => queryClient.invalidateQueries({ queryKey: ['studies', 'detail', input.studyId], refetchType: 'none' }),
  });
}
