import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError, csrfTokenForWrite } from '../../../lib/api-client';
import type { RunLogInspection, RunLogMapping, RunLogRecord } from '../../../../shared/run-log/index';

// Every run-log endpoint the client uses: fetchers, their query options (one source of key + fetcher) and
// hooks. Uploads go through XMLHttpRequest, the one browser API that reports upload progress.

type Person = { id: number; login: string; name: string } | null;

export type ReviewDecision = 'use-as-is' | 'rework' | 'scrap';

export interface ReviewView {
  id: number;
  decision: ReviewDecision;
  rationale: string;
  decidedBy: Person;
  decidedAt: string;
}

export interface RunLogListItem {
  id: number;
  studyId: number;
  fileName: string;
  sizeBytes: number;
  checksumSha256: string;
  uploadedAt: string;
  uploadedBy: Person;
  rows: number;
  durationMin: number;
  findings: { violations: number; warnings: number };
  review: ReviewView | null;
}

export interface RunLogDetail extends RunLogListItem {
  study: { id: number; title: string } | null;
  part: { id: number; partNumber: string; name: string } | null;
  /** the part's baseline the replay is compared with, by name */
  baseline: { studyId: number; studyTitle: string | null; number: number; part: { id: number; partNumber: string; name: string } | null } | null;
  record: RunLogRecord;
  role: 'viewer' | 'engineer' | 'lead' | null;
}

/** A refused file: the server names the line, the column and why. */
export interface Refusal {
  error: string;
  line: number | null;
  column: string | null;
  reason: string;
}

export function refusalOf(error: unknown): Refusal | null {
  if (!(error instanceof ApiError) || typeof error.body !== 'object' || error.body === null) return null;
  const b = error.body as Partial<Refusal>;
  return typeof b.reason === 'string' ? { error: error.message, line: b.line ?? null, column: b.column ?? null, reason: b.reason } : null;
}

export const runLogKeys = {
  all: ['run-logs'] as const,
  study: (studyId: string) => ['run-logs', 'study', studyId] as const,
  part: (partId: string) => ['run-logs', 'part', partId] as const,
  detail: (id: string) => ['run-logs', 'detail', id] as const,
};

export const studyRunLogsQuery = (studyId: string) =>
  queryOptions({ queryKey: runLogKeys.study(studyId), queryFn: () => api.get<RunLogListItem[]>(`/studies/${encodeURIComponent(studyId)}/run-logs`) });

export const partRunLogsQuery = (partId: string) =>
  queryOptions({ queryKey: runLogKeys.part(partId), queryFn: () => api.get<RunLogListItem[]>(`/parts/${encodeURIComponent(partId)}/run-logs`) });

export const runLogQuery = (id: string) =>
  queryOptions({ queryKey: runLogKeys.detail(id), queryFn: () => api.get<RunLogDetail>(`/run-logs/${encodeURIComponent(id)}`) });

/** The caller's role in the study's team (from the study itself), to offer the upload only to engineers and leads. */
export const studyRoleQuery = (studyId: string) =>
  queryOptions({
    queryKey: ['run-logs', 'study-role', studyId] as const,
    queryFn: async () => (await api.get<{ role: RunLogDetail['role'] }>(`/studies/${encodeURIComponent(studyId)}`)).role,
  });

export const useStudyRunLogs = (studyId: string) => useQuery(studyRunLogsQuery(studyId));
export const useStudyRole = (studyId: string) => useQuery(studyRoleQuery(studyId));
export const usePartRunLogs = (partId: string) => useQuery(partRunLogsQuery(partId));
export const useRunLog = (id: string) => useQuery(runLogQuery(id));

const HEAD_BYTES = 1024 * 1024;
const TAIL_BYTES = 64 * 1024;

/**
 * Proposes a mapping from the file's first megabyte and its last 64 kB, read in the browser with the same
 * shared code the server uses, so a 50 MB file is sent once (with the confirmed mapping), not twice.
 * Throws the same RunLogParseError the server would answer with.
 */
export async function inspectRunLogLocally(file: File): Promise<RunLogInspection> {
  const { inspectRunLog } = await import('../../../../shared/run-log/parse-run-log');
  if (file.size <= HEAD_BYTES + TAIL_BYTES) return inspectRunLog(await file.text(), { byteLength: file.size });
  const head = await file.slice(0, HEAD_BYTES).text();
  const tail = await file.slice(file.size - TAIL_BYTES).text();
  // whole lines only: the head up to its last line break, the tail from its first
  const text = `${head.slice(0, head.lastIndexOf('\n'))}\n${tail.slice(tail.indexOf('\n') + 1)}`;
  return inspectRunLog(text, { byteLength: file.size });
}

/** Sends the file to be read by the server (nothing is stored) and returns the proposed mapping and a preview. */
export async function inspectRunLogFile(studyId: string, file: File): Promise<RunLogInspection> {
  const form = new FormData();
  form.append('file', file);
  return api.post<RunLogInspection>(`/studies/${encodeURIComponent(studyId)}/run-logs/inspect`, form);
}

/** Uploads the file with the confirmed mapping; `onProgress` gets the share of bytes sent (0..1). */
export async function uploadRunLog(studyId: string, file: File, mapping: RunLogMapping, onProgress: (fraction: number) => void): Promise<RunLogDetail> {
  // sent outside apiRequest for its upload progress, so it takes the token from the one place that keeps it
  const csrf = await csrfTokenForWrite();
  const form = new FormData();
  form.append('mapping', JSON.stringify(mapping));
  form.append('file', file);
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/studies/${encodeURIComponent(studyId)}/run-logs`);
    xhr.setRequestHeader('X-CSRF-Token', csrf);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError(0, 'The upload could not reach the server.', null));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = xhr.responseText;
      }
      if (xhr.status === 201) return resolve(body as RunLogDetail);
      const message = body && typeof body === 'object' && 'error' in body ? String((body as { error: unknown }).error) : `${xhr.status} ${xhr.statusText}`;
      reject(new ApiError(xhr.status, message, body));
    };
    xhr.send(form);
  });
}

export function useDecideReview(runLogId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: { decision: ReviewDecision; rationale: string }) => {
      return api.post<ReviewView>(`/run-logs/${encodeURIComponent(runLogId)}/review`, body);
    },
    onSuccess: () => client.invalidateQueries({ queryKey: runLogKeys.all }),
  });
}
