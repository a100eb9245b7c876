import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { HttpError } from './http-error';

export interface ErrorBody {
  error: string;
  field?: string;
  fields?: { field: string; message: string }[];
  [extra: string]: unknown;
}

/** Dotted path of a zod issue, e.g. `cycle.segments.2.holdMin`; `(body)` for the root. */
function fieldPath(path: readonly PropertyKey[]): string {
  return path.length ? path.map(String).join('.') : '(body)';
}

/**
 * The one converter: turns anything thrown into a status and a body the client
 * may see. Validation errors name the field and the broken limit; unknown
 * errors become a bare 500 with no stack or internals.
 */
export function toHttpError(err: unknown): { status: number; body: ErrorBody; log: boolean } {
  if (err instanceof ZodError) {
    const fields = err.issues.map((issue) => ({ field: fieldPath(issue.path), message: issue.message }));
    const first = fields[0];
    return {
      status: 400,
      body: { error: `Invalid ${first.field}: ${first.message}`, field: first.field, fields },
      log: false,
    };
  }
  if (err instanceof HttpError) {
    return { status: err.status, body: { error: err.message, ...err.details }, log: false };
  }
  const e = err as { type?: string; status?: number; name?: string; code?: string };
  // body-parser: malformed JSON and oversized bodies
  if (e?.type === 'entity.parse.failed') {
    return { status: 400, body: { error: 'Request body is not valid JSON.', field: '(body)' }, log: false };
  }
  if (e?.type === 'entity.too.large') {
    return { status: 413, body: { error: 'Request body is too large.', field: '(body)' }, log: false };
  }
  if (e?.name === 'SequelizeOptimisticLockError') {
    return { status: 409, body: { error: 'Someone else saved this first; reload and try again.' }, log: false };
  }
  if (e?.name === 'MulterError') {
    const status = e.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
    return { status, body: { error: (err as Error).message, field: (err as { field?: string }).field }, log: false };
  }
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    // e.g. csrf-sync's 403, whose message is written for clients
    return { status: e.status, body: { error: (err as Error).message || 'Request refused.' }, log: false };
  }
  return { status: 500, body: { error: 'Internal server error.' }, log: true };
}

export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: `No API route for ${req.method} ${req.originalUrl.split('?')[0]}.` });
};

export function errorHandler(log: (err: unknown) => void = (err) => console.error(err)): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    const { status, body, log: shouldLog } = toHttpError(err);
    if (shouldLog) log(err);
    res.status(status).json(body);
  };
}
