import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export type TeamSummary = { id: number; slug: string; name: string; description: string | null; role: 'viewer' | 'engineer' | 'lead' | null };

export const getTeams = () => api.get<TeamSummary[]>('/teams');

export const teamsQueryOptions = () => queryOptions({ queryKey: ['teams', 'list'], queryFn: getTeams });

export const useTeams = () => useQuery(teamsQueryOptions());
