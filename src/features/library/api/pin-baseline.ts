import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type PinInput = { partId: number; revisionId: number; note: string };

export const pinBaseline = ({ partId, revisionId, note }: PinInput) => api.put(`/parts/${partId}/baseline`, { revisionId, note });

export function usePinBaseline() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: pinBaseline,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: ['parts'] });
      void queryClient.invalidateQueries({ queryKey: ['teams'] });
      void queryClient.invalidateQueries({ queryKey: ['studies'] });
    },
  });
}
