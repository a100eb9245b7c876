/**
 * Results of an immutable revision, solved in the worker and cached by its reference: the compare view and
 * the printable report ask for the same revision and get one solve. Results are not stored on the server;
 * they are cheap to recompute and the worker is the one place that computes them in the browser.
 */
import { queryOptions } from '@tanstack/react-query';
import type { StudyParams } from '../../shared/schemas/study';
import { solver } from './solver-client';

export function solvedRevisionQueryOptions(ref: string, params: StudyParams | undefined) {
  return queryOptions({
    queryKey: ['revisions', 'solved', ref] as const,
    queryFn: async () => {
      if (!params) throw new Error(`revision ${ref} has no params to solve`);
      return (await solver().simulate(params)).result;
    },
    enabled: params !== undefined,
    staleTime: Infinity,
    gcTime: 5 * 60_000,
    // A solver error (invalid input, non-convergence) is deterministic: retrying gives the same answer.
    retry: false,
  });
}
