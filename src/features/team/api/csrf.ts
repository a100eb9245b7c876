import { api, setCsrfToken } from '../../../lib/api-client';

/** Fetches the session's CSRF token before a state-changing call (the token changes at sign-in). */
export async function withCsrf<T>(send: () => Promise<T>): Promise<T> {
  const { csrfToken } = await api.get<{ csrfToken: string }>('/auth/csrf');
  setCsrfToken(csrfToken);
  return send();
}
