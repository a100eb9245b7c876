import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client';

export type TeamRole = 'viewer' | 'engineer' | 'lead';
export type Me = {
  user: { id: number; login: string; name: string; email: string | null; avatarUrl: string | null; isAdmin: boolean } | null;
  memberships: { teamId: number; teamSlug: string; teamName: string; role: TeamRole }[];
  /** null for anonymous visitors (the API client fetches one when it needs it) */
  csrfToken: string | null;
};

/** Who is signed in; also hands the session's CSRF token to the API client. */
export async function getMe(): Promise<Me> {
  const me = await api.get<Me>('/me');
  setCsrfToken(me.csrfToken);
  return me;
}

export const meQueryOptions = () => queryOptions({ queryKey: ['me'], queryFn: getMe, staleTime: 60_000 });

export const useMe = () => useQuery(meQueryOptions());

/** The provider's sign-in, returning to `next` (a path on this site) afterwards. */
export const signInHref = (next: string) => `/api/auth/github?next=${encodeURIComponent(next)}`;
