import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type CreatePartInput = { teamId: string; partNumber: string; name: string; description?: string };
export type CreatedPart = { id: number; partNumber: string; name: string };

export const createPart = ({ teamId, ...body }: CreatePartInput) => api.post<CreatedPart>(`/teams/${encodeURIComponent(teamId)}/parts`, body);

export function useCreatePart() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createPart, onSuccess: (_r, input) => queryClient.invalidateQueries({ queryKey: ['teams', 'detail', input.teamId] }) });
}
