import { Router, type Request } from 'express';
import rateLimit from 'express-rate-limit';
import type { PassportStatic } from 'passport';
import type { Config } from '../config/index';
import { csrf } from '../auth/csrf';
import { Membership, Team, type User } from '../models/index';

/** Only same-site paths are followed after sign-in (no open redirect). */
function safeNext(value: unknown): string {
  return typeof value === 'string' && /^\/(?!\/)[^\s\\]*$/.test(value) ? value : '/';
}

declare module 'express-session' {
  interface SessionData {
    afterSignIn?: string;
  }
}

export async function meView(req: Request) {
  const user = req.user as User | undefined;
  // An anonymous visitor gets no token: storing one would write a session row
  // for every page view by anyone (GET /api/auth/csrf hands one out on demand).
  if (!user) return { user: null, memberships: [], csrfToken: null };
  const csrfToken = csrf.generateToken(req);
  const memberships = await Membership.findAll({
    where: { userId: user.id },
    include: [{ model: Team, as: 'team', attributes: ['id', 'slug', 'name'] }],
    order: [['teamId', 'ASC']],
  });
  return {
    user: { id: user.id, login: user.login, name: user.name, email: user.email, avatarUrl: user.avatarUrl, isAdmin: user.isAdmin },
    memberships: memberships.map((m) => {
      const team = (m as Membership & { team: Team }).team;
      return { teamId: m.teamId, teamSlug: team.slug, teamName: team.name, role: m.role };
    }),
    csrfToken,
  };
}

export function authRoutes(config: Config, passport: PassportStatic): Router {
  const router = Router();
  const authLimiter = rateLimit({
    windowMs: 60_000,
    limit: config.authRateLimit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    message: { error: 'Too many sign-in attempts; wait a minute and try again.' },
  });

  router.get('/auth/github', authLimiter, (req, res, next) => {
    req.session.afterSignIn = safeNext(req.query.next);
    passport.authenticate('github')(req, res, next);
  });

  router.get('/auth/github/callback', authLimiter, (req, res, next) => {
    const next_ = req.session.afterSignIn ?? '/';
    passport.authenticate('github', (err: unknown, user: User | false) => {
      if (err) return next(err);
      if (!user) return res.redirect('/sign-in?error=denied');
      // req.login regenerates the session (fixation defence). Its CSRF token is made here, before any other
      // request of the new session: the page's first requests run side by side, and each would otherwise mint a
      // token of its own, the last session save winning and the other token refused.
      req.login(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        csrf.generateToken(req);
        res.redirect(next_);
      });
    })(req, res, next);
  });

  router.post('/auth/logout', (req, res, next) => {
    req.logout((err) => {
      if (err) return next(err);
      req.session.destroy(() => {
        res.clearCookie('dwellform.sid');
        res.status(204).end();
      });
    });
  });

  router.get('/auth/csrf', (req, res) => {
    res.set('Cache-Control', 'no-store').json({ csrfToken: csrf.generateToken(req) });
  });

  // Every page load asks who is signed in; the limit only stops a client (or script) hammering it.
  const meLimiter = rateLimit({
    windowMs: 60_000,
    limit: config.meRateLimit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    message: { error: 'Too many requests for /api/me; wait a minute and try again.' },
  });

  router.get('/me', meLimiter, async (req, res) => {
    res.set('Cache-Control', 'no-store').json(await meView(req));
  });

  return router;
}
