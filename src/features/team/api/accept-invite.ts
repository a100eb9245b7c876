import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type InvitePreview = { teamId: number; teamName: string; role: 'viewer' | 'engineer' | 'lead'; email: string; expiresAt: string };

export const getInvitePreview = (token: string) => api.get<InvitePreview>(`/invites/${encodeURIComponent(token)}`);

export const invitePreviewQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['invites', token], queryFn: () => getInvitePreview(token), staleTime: 0 });

export const useInvitePreview = (token: string) => useQuery(invitePreviewQueryOptions(token));

export function useAcceptInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api.post<{ teamId: number; teamName: string; role: string }>(`/invites/${encodeURIComponent(token)}/accept`),
    // The preview would now answer 410 (used); refresh only who-is-in-what.
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: ['me'] });
      void queryClient.invalidateQueries({ queryKey: ['teams'] });
    },
  });
}
