import { csrfSync } from 'csrf-sync';

/**
 * Synchroniser-token CSRF protection kept in the session. Every POST, PUT,
 * PATCH and DELETE under /api must carry the token in `X-CSRF-Token`; the
 * client gets it from GET /api/auth/csrf or GET /api/me.
 */
export const csrf = csrfSync({
  getTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
  size: 32,
});
