/**
 * A revision to compare or report on, by reference, as the URL carries it:
 *   s12r3  — study 12, revision 3, from the team library (the server's revisions API)
 *   demo0  — the first demo study of shared/solver/demo-cards, for use without a server or sign-in
 * The compare view and the printable report both read revisions through `revisionQueryOptions`, so where
 * a revision comes from is decided here and nowhere else.
 */
import { queryOptions } from '@tanstack/react-query';
import type { CsvMeta } from '../../shared/export/results-csv';
import { parseStudy, type StudyParams } from '../../shared/schemas/study';
import { demoStudies } from '../../shared/solver/demo-cards';
import type { StudySummary } from '../../shared/solver/simulation-result';
import { api, ApiError } from './api-client';

export type RevisionRef = { source: 'library'; studyId: number; number: number } | { source: 'demo'; index: number };

export function parseRevisionRef(text: string | null | undefined): RevisionRef | null {
  if (!text) return null;
  const library = /^s(\d{1,9})r(\d{1,9})$/.exec(text.trim());
  if (library) return { source: 'library', studyId: Number(library[1]), number: Number(library[2]) };
  const demo = /^demo(\d{1,2})$/.exec(text.trim());
  if (demo) return { source: 'demo', index: Number(demo[1]) };
  return null;
}

export function formatRevisionRef(ref: RevisionRef): string {
  return ref.source === 'library' ? `s${ref.studyId}r${ref.number}` : `demo${ref.index}`;
}

export interface RevisionData {
  ref: string;
  source: RevisionRef['source'];
  studyId: number | null;
  studyTitle: string;
  /** revision number; null for a demo study */
  number: number | null;
  /** "Two-dwell cycle · r2" */
  label: string;
  part: { id: number; label: string } | null;
  params: StudyParams;
  /** the summary the server stored with the revision (null for demo studies): the table's first paint */
  summary: StudySummary | null;
  message: string;
  author: string | null;
  createdAt: string | null;
  /** the part's pinned baseline, as a reference; null when none is pinned */
  baselineRef: string | null;
  isBaseline: boolean;
  forkedFrom: { ref: string; label: string } | null;
}

// --- server shapes (server/services/study.service.ts, server/routes/parts.routes.ts) -------------------------

interface StudyDetailDto {
  id: number;
  title: string;
  latestRevisionNumber: number;
  part: { id: number; partNumber: string; name: string; baselineRevisionId: number | null } | null;
  forkedFrom: { revisionId: number; number: number; studyId: number; studyTitle: string | null } | null;
}

interface RevisionDto {
  id: number;
  studyId: number;
  number: number;
  message: string;
  createdAt: string;
  author: { login: string; name: string | null } | null;
  summary: StudySummary | null;
  params: unknown;
}

interface PartDto {
  baseline: { revisionId: number; studyId: number | null; number: number | null } | null;
}

function label(title: string, number: number | null): string {
  return number === null ? title : `${title} · r${number}`;
}

async function fetchLibraryRevision(studyId: number, number: number): Promise<RevisionData> {
  const [study, revision] = await Promise.all([
    api.get<StudyDetailDto>(`/studies/${studyId}`),
    api.get<RevisionDto>(`/studies/${studyId}/revisions/${number}`),
  ]);
  const baselineId = study.part?.baselineRevisionId ?? null;
  let baselineRef: string | null = null;
  if (study.part && baselineId !== null) {
    const part = await api.get<PartDto>(`/parts/${study.part.id}`);
    const b = part.baseline;
    if (b?.studyId != null && b.number != null) baselineRef = formatRevisionRef({ source: 'library', studyId: b.studyId, number: b.number });
  }
  return {
    ref: formatRevisionRef({ source: 'library', studyId, number }),
    source: 'library',
    studyId,
    studyTitle: study.title,
    number,
    label: label(study.title, number),
    part: study.part ? { id: study.part.id, label: `${study.part.partNumber} ${study.part.name}` } : null,
    params: parseStudy(revision.params),
    summary: revision.summary ?? null,
    message: revision.message,
    author: revision.author ? (revision.author.name ?? revision.author.login) : null,
    createdAt: revision.createdAt,
    baselineRef,
    isBaseline: baselineId !== null && baselineId === revision.id,
    forkedFrom: study.forkedFrom
      ? {
          ref: formatRevisionRef({ source: 'library', studyId: study.forkedFrom.studyId, number: study.forkedFrom.number }),
          label: label(study.forkedFrom.studyTitle ?? `Study ${study.forkedFrom.studyId}`, study.forkedFrom.number),
        }
      : null,
  };
}

/** Demo studies stand in for a part's library: the first one plays the pinned baseline. */
function demoRevision(index: number): RevisionData {
  const demos = demoStudies();
  const demo = demos[index];
  if (!demo) throw new Error(`There is no demo study ${index}: choose demo0 to demo${demos.length - 1}.`);
  return {
    ref: formatRevisionRef({ source: 'demo', index }),
    source: 'demo',
    studyId: null,
    studyTitle: demo.name,
    number: null,
    label: demo.name,
    part: { id: 0, label: 'Demo part' },
    params: demo.params,
    summary: null,
    message: demo.description,
    author: null,
    createdAt: null,
    baselineRef: 'demo0',
    isBaseline: index === 0,
    forkedFrom: index === 0 ? null : { ref: 'demo0', label: demos[0].name },
  };
}

export const revisionKeys = {
  all: ['revisions'] as const,
  detail: (ref: string) => ['revisions', 'detail', ref] as const,
};

export function revisionQueryOptions(ref: string) {
  return queryOptions({
    queryKey: revisionKeys.detail(ref),
    queryFn: async (): Promise<RevisionData> => {
      const parsed = parseRevisionRef(ref);
      if (!parsed) throw new Error(`"${ref}" is not a revision reference: expected s<study>r<revision>, e.g. s12r3`);
      return parsed.source === 'library' ? fetchLibraryRevision(parsed.studyId, parsed.number) : demoRevision(parsed.index);
    },
    // Revisions are immutable; only the part's baseline pin can move, and a minute is fresh enough for it.
    staleTime: 60_000,
  });
}

/** Why a revision could not be read, in words for whoever opened the link (the compare view and the report). */
export function revisionErrorText(error: unknown): string {
  if (error instanceof ApiError && error.status === 401) return 'Sign in to read revisions from the team library.';
  if (error instanceof ApiError && error.status === 403) return 'You are not a member of the team that owns this study.';
  if (error instanceof ApiError && error.status === 404) return `Not found: ${error.message}`;
  return error instanceof Error ? error.message : String(error);
}

/** The request failed only for want of a session: offer to sign in. */
export const needsSignIn = (error: unknown): boolean => error instanceof ApiError && error.status === 401;

/** Sign in and come back to this page (a shared link opened before signing in). */
export function signInHref(): string {
  const here = typeof window === 'undefined' ? '/' : `${window.location.pathname}${window.location.search}`;
  return `/api/auth/github?next=${encodeURIComponent(here)}`;
}

/** What the CSV header block says about where a revision came from. */
export function csvMetaOf(rev: RevisionData): Omit<CsvMeta, 'exportedAt'> {
  return {
    study: rev.studyTitle,
    revision: rev.number,
    revisionLabel: rev.source === 'demo' ? 'demo study (not in the team library)' : undefined,
    part: rev.part?.label,
    params: rev.params,
  };
}

interface PartStudiesDto {
  partNumber: string;
  name: string;
  baseline: { revisionId: number } | null;
  studies: { id: number; title: string }[];
}

interface RevisionListItemDto {
  id: number;
  number: number;
  message: string;
}

export interface RevisionChoice {
  ref: string;
  label: string;
}

/** Every revision of every study of a part, newest first per study, the pinned baseline marked. */
export function partRevisionChoicesQueryOptions(partId: number | null) {
  return queryOptions({
    queryKey: ['parts', 'revision-choices', partId] as const,
    queryFn: async (): Promise<RevisionChoice[]> => {
      const part = await api.get<PartStudiesDto>(`/parts/${partId}`);
      const lists = await Promise.all(part.studies.map((s) => api.get<RevisionListItemDto[]>(`/studies/${s.id}/revisions`)));
      return part.studies.flatMap((study, k) =>
        lists[k].map((r) => ({
          ref: formatRevisionRef({ source: 'library', studyId: study.id, number: r.number }),
          label: `${study.title} · r${r.number}${r.id === part.baseline?.revisionId ? ' (baseline)' : ''}${r.message ? ` — ${r.message}` : ''}`,
        })),
      );
    },
    enabled: partId !== null && partId > 0,
    staleTime: 30_000,
  });
}

/** The demo studies a user can compare without signing in. */
export function demoRevisionChoices(): { ref: string; label: string }[] {
  return demoStudies().map((d, index) => ({ ref: formatRevisionRef({ source: 'demo', index }), label: d.name }));
}
