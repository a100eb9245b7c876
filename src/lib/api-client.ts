/** The one place the client talks HTTP to /api. */

export class ApiError extends Error {
  readonly status: number;
  readonly body: unknown;
  constructor(status: number, message: string, body: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.body = body;
  }
}

// The session's CSRF (synchroniser) token lives here and nowhere else: fetched
// lazily before the first state-changing request, fetched again once when the
// server refuses a stale one, and forgotten when the session changes.
let csrfToken: string | null = null;
let csrfPending: Promise<string> | null = null;

/** Hands over a token the caller already has (GET /api/me returns one to signed-in users); null forgets it. */
export function setCsrfToken(token: string | null): void {
  csrfToken = token;
  csrfPending = null;
}

/** Forget the token: call on sign-in and sign-out (the server starts a new session then). */
export function resetCsrfToken(): void {
  setCsrfToken(null);
}

/** The current token, fetched once if there is none yet (also for uploads sent outside apiRequest). */
export function csrfTokenForWrite(): Promise<string> {
  if (csrfToken) return Promise.resolve(csrfToken);
  csrfPending ??= fetch('/api/auth/csrf', { credentials: 'same-origin', headers: { Accept: 'application/json' } })
    .then(async (res) => {
      if (!res.ok) throw new ApiError(res.status, `Could not get a CSRF token (${res.status} ${res.statusText})`, null);
      const { csrfToken: token } = (await res.json()) as { csrfToken: string };
      csrfToken = token;
      return token;
    })
    .finally(() => {
      csrfPending = null;
    });
  return csrfPending;
}

/** csrf-sync's refusal: 403 with a message about the CSRF token. */
const isCsrfRefusal = (status: number, body: unknown) =>
  status === 403 && !!body && typeof body === 'object' && 'error' in body && /csrf/i.test(String(body.error));

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export async function apiRequest<T>(method: Method, path: string, body?: unknown, init?: RequestInit): Promise<T> {
  try {
    return await send<T>(method, path, body, init);
  } catch (error) {
    // a token from an earlier session (signed in or out in another tab): fetch a fresh one and try once more
    if (method !== 'GET' && error instanceof ApiError && isCsrfRefusal(error.status, error.body)) {
      resetCsrfToken();
      return send<T>(method, path, body, init);
    }
    throw error;
  }
}

async function send<T>(method: Method, path: string, body?: unknown, init?: RequestInit): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined && !(body instanceof FormData)) headers['Content-Type'] = 'application/json';
  if (method !== 'GET') headers['X-CSRF-Token'] = await csrfTokenForWrite();
  const response = await fetch(`/api${path}`, {
    method,
    credentials: 'same-origin',
    headers,
    body: body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body),
    ...init,
  });
  const text = await response.text();
  let parsed: unknown = null;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = text;
    }
  }
  if (!response.ok) {
    const message =
      parsed && typeof parsed === 'object' && 'error' in parsed && typeof parsed.error === 'string'
        ? parsed.error
        : `${response.status} ${response.statusText}`;
    throw new ApiError(response.status, message, parsed);
  }
  return parsed as T;
}

export const api = {
  get: <T,>(path: string, init?: RequestInit) => apiRequest<T>('GET', path, undefined, init),
  post: <T,>(path: string, body?: unknown) => apiRequest<T>('POST', path, body ?? {}),
  put: <T,>(path: string, body?: unknown) => apiRequest<T>('PUT', path, body ?? {}),
  patch: <T,>(path: string, body?: unknown) => apiRequest<T>('PATCH', path, body ?? {}),
  delete: <T,>(path: string) => apiRequest<T>('DELETE', path),
};
