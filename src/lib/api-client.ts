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

let csrfToken: string | null = null;

/** Set by the auth feature after sign-in; sent on every state-changing request. */
export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export async function apiRequest<T>(method: Method, path: string, body?: unknown, init?: RequestInit): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined && !(body instanceof FormData)) headers['Content-Type'] = 'application/json';
  if (method !== 'GET' && csrfToken) headers['X-CSRF-Token'] = csrfToken;
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
