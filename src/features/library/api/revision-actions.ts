import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const restoreRevision = ({ studyId, number, baseRevision }: { studyId: number; number: number; baseRevision: number }) =>
  api.post<{ number: number }>(`/studies/${studyId}/revisions/${number}/restore`, { baseRevision });

export const forkFromRevision = ({ studyId, number, title }: { studyId: number; number: number; title?: string }) =>
  api.post<{ id: number; title: string }>(`/studies/${studyId}/revisions/${number}/fork`, title ? { title } : {});

export function useRestoreRevision() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: restoreRevision, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['studies'] }) });
}

export function useForkFromRevision() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: forkFromRevision, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['parts'] }) });
}
