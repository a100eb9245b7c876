import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type RestoreInput = { studyId: string; revision: number; baseRevision: number };

/** Save an earlier revision's inputs again as the study's newest revision (history is never rewritten). */
export async function restoreRevision(input: RestoreInput): Promise<{ number: number }> {
  return api.post<{ number: number }>(`/studies/${encodeURIComponent(input.studyId)}/revisions/${input.revision}/restore`, {
    baseRevision: input.baseRevision,
  });
}

export function useRestoreRevision() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: restoreRevision,
    onSuccess: (_restored, input) => queryClient.invalidateQueries({ queryKey: ['studies', 'detail', input.studyId] }),
  });
}
