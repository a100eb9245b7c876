import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '../../../lib/api-client';

export type Health = { status: 'ok' | 'degraded'; db: 'up' | 'down'; version: string };

/** A 503 still carries a health body; read it instead of failing the query. */
export async function getHealth(): Promise<Health> {
  try {
    return await api.get<Health>('/health');
  } catch (error) {
    if (error instanceof ApiError && error.status === 503 && error.body && typeof error.body === 'object') {
      return error.body as Health;
    }
    throw error;
  }
}

export const healthQueryOptions = () =>
  queryOptions({ queryKey: ['health'], queryFn: getHealth, refetchInterval: 10_000 });

export const useHealth = () => useQuery(healthQueryOptions());
