import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type Invite = {
  id: number;
  email: string;
  role: 'viewer' | 'engineer' | 'lead';
  expiresAt: string;
  acceptedAt: string | null;
  status: 'open' | 'accepted' | 'expired';
  mailStatus: 'pending' | 'sent' | 'failed';
  mailError: string | null;
  createdAt: string;
};

export const getInvites = (teamId: string) => api.get<Invite[]>(`/teams/${encodeURIComponent(teamId)}/invites`);

export const invitesQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: ['teams', 'detail', teamId, 'invites'], queryFn: () => getInvites(teamId) });

export const useInvites = (teamId: string, enabled = true) => useQuery({ ...invitesQueryOptions(teamId), enabled });

export type CreateInviteInput = { teamId: string; email: string; role: Invite['role'] };

export function useCreateInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ teamId, email, role }: CreateInviteInput) => api.post<Invite>(`/teams/${encodeURIComponent(teamId)}/invites`, { email, role }),
    onSuccess: (_r, input) => queryClient.invalidateQueries({ queryKey: ['teams', 'detail', input.teamId] }),
  });
}

export function useResendInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ teamId, inviteId }: { teamId: string; inviteId: number }) =>
      api.post<Invite>(`/teams/${encodeURIComponent(teamId)}/invites/${inviteId}/resend`),
    onSuccess: (_r, input) => queryClient.invalidateQueries({ queryKey: ['teams', 'detail', input.teamId, 'invites'] }),
  });
}
