import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { api, resetCsrfToken } from './api-client';

// The client's CSRF handling, against a stand-in for the server's two answers
// that matter here: GET /api/auth/csrf and csrf-sync's 403 "invalid csrf token".
// (The real server's CSRF refusal is tested in server/routes/auth.routes.test.ts.)
function fakeServer() {
  let issued = 0;
  let valid = 'none';
  const calls: { url: string; token: string | null }[] = [];
  const fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
    const token = (init?.headers as Record<string, string> | undefined)?.['X-CSRF-Token'] ?? null;
    calls.push({ url, token });
    const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
    if (url === '/api/auth/csrf') {
      valid = `t${++issued}`;
      return json(200, { csrfToken: valid });
    }
    if (init?.method !== 'GET' && token !== valid) return json(403, { error: 'invalid csrf token' });
    return json(200, { ok: true });
  });
  return { fetchMock, calls, rotate: () => (valid = 'rotated'), issued: () => issued };
}

let server: ReturnType<typeof fakeServer>;
beforeEach(() => {
  resetCsrfToken();
  server = fakeServer();
  vi.stubGlobal('fetch', server.fetchMock);
});
afterEach(() => vi.unstubAllGlobals());

describe('the API client keeps the CSRF token in one place', () => {
  it('fetches it lazily, once, before the first state-changing request', async () => {
    await api.get('/teams');
    expect(server.issued()).toBe(0);
    await Promise.all([api.post('/a'), api.put('/b'), api.delete('/c')]);
    expect(server.issued()).toBe(1);
    expect(server.calls.filter((c) => c.url !== '/api/auth/csrf').slice(1).every((c) => c.token === 't1')).toBe(true);
  });

  it('fetches a fresh one and retries once when the server refuses a stale token', async () => {
    await api.post('/a');
    server.rotate(); // e.g. signed in again in another tab
    await expect(api.post('/b')).resolves.toEqual({ ok: true });
    // refused once with the stale token, then sent again with a fresh one
    expect(server.issued()).toBe(2);
    expect(server.calls.filter((c) => c.url === '/api/b')).toHaveLength(2);
  });

  it('forgets the token on reset (sign-in, sign-out)', async () => {
    await api.post('/a');
    resetCsrfToken();
    await api.post('/b');
    expect(server.issued()).toBe(2);
  });
});
