import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Member } from './get-members';

export type ChangeRoleInput = { teamId: string; userId: number; role: Member['role'] };

export const changeRole = ({ teamId, userId, role }: ChangeRoleInput) =>
  api.patch<{ userId: number; role: Member['role'] }>(`/teams/${encodeURIComponent(teamId)}/members/${userId}`, { role });

export function useChangeRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeRole,
    onSuccess: (_r, input) => queryClient.invalidateQueries({ queryKey: ['teams', 'detail', input.teamId] }),
  });
}
