import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Invite } from './invites';

export type CreateTeamInput = { slug: string; name: string; description?: string; leadEmail?: string };
export type CreatedTeam = { id: number; slug: string; name: string; description: string | null; leadInvite: Invite | null };

/** Site admin: a new team, and (optionally) its first lead invited by e-mail in the same step. */
export const createTeam = (input: CreateTeamInput) => api.post<CreatedTeam>('/teams', input);

export function useCreateTeam() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createTeam, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['teams', 'list'] }) });
}
