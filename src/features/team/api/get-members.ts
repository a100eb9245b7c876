import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type Member = { userId: number; login: string; name: string; email: string | null; role: 'viewer' | 'engineer' | 'lead'; since: string };

export const getMembers = (teamId: string) => api.get<Member[]>(`/teams/${encodeURIComponent(teamId)}/members`);

export const membersQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: ['teams', 'detail', teamId, 'members'], queryFn: () => getMembers(teamId) });

export const useMembers = (teamId: string) => useQuery(membersQueryOptions(teamId));
