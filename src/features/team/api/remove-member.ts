import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type RemoveMemberInput = { teamId: string; userId: number };

export const removeMember = ({ teamId, userId }: RemoveMemberInput) => api.delete<void>(`/teams/${encodeURIComponent(teamId)}/members/${userId}`);

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: (_r, input) => queryClient.invalidateQueries({ queryKey: ['teams', 'detail', input.teamId] }),
  });
}
