import { useEffect } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { parseRevisionRef, revisionQueryOptions } from '../../../lib/revision-query';

/** The demo pair shown when the URL names no revision: the reference study against the single fast ramp. */
export const DEFAULT_PAIR = { a: 'demo0', b: 'demo2' } as const;

/**
 * Which two revisions to compare, from the URL: `?a=<ref>&b=<ref>`. With one side only, that one is the
 * candidate (B) and A is its part's pinned baseline; when it is the baseline itself, A is where it was forked
 * from, else the previous revision. Once resolved the URL names both, so the link shared is the comparison
 * seen, even after the baseline moves.
 */
export function useComparePair() {
  const [search, setSearch] = useSearchParams();
  const aParam = search.get('a');
  const bParam = search.get('b');
  const single = aParam && !bParam ? aParam : !aParam && bParam ? bParam : null;
  const neither = !aParam && !bParam;

  const candidate = useQuery({ ...revisionQueryOptions(single ?? ''), enabled: single !== null });
  let resolvedA: string | null = null;
  let unresolved: string | null = null;
  if (single && candidate.data) {
    const c = candidate.data;
    const parsed = parseRevisionRef(c.ref);
    const previous = parsed?.source === 'library' && parsed.number > 1 ? `s${parsed.studyId}r${parsed.number - 1}` : null;
    resolvedA = c.baselineRef && c.baselineRef !== c.ref ? c.baselineRef : (c.forkedFrom?.ref ?? previous);
    if (!resolvedA) unresolved = `${c.label} has no pinned baseline, no origin and no earlier revision to compare with.`;
  }

  useEffect(() => {
    if (neither) setSearch(DEFAULT_PAIR, { replace: true });
    else if (single && resolvedA) setSearch({ a: resolvedA, b: single }, { replace: true });
  }, [neither, single, resolvedA, setSearch]);

  return {
    a: aParam && bParam ? aParam : null,
    b: aParam && bParam ? bParam : null,
    resolving: single !== null && !resolvedA && !unresolved && !candidate.isError,
    error: candidate.isError ? candidate.error : unresolved ? new Error(unresolved) : null,
    choose: (a: string, b: string) => setSearch({ a, b }),
  };
}
