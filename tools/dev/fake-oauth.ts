/**
 * A local stand-in for GitHub's OAuth endpoints, for dev, demo and tests.
 * passport-github2 is pointed here through its URL options, so the real
 * sign-in code path runs end to end; with real credentials set, the same code
 * talks to GitHub and this fake is not used. Bound to 127.0.0.1 only.
 *
 *   GET  /login/oauth/authorize     sign-in page listing the demo people (and a form for a new one)
 *   GET  /login/oauth/choose        issues a code and redirects back to the app
 *   POST /login/oauth/access_token  code → access token
 *   GET  /user, /user/emails        profile for a token
 */
import crypto from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { pathToFileURL } from 'node:url';
import express from 'express';
import { DEMO_USERS } from '../../server/db/seed/demo-users';

export interface FakeProfile {
  id: number;
  login: string;
  name: string;
  email: string;
}

export const FAKE_OAUTH_SIGNATURE = 'dwellform-fake-oauth';

/** A stable numeric id for a login typed into the "new person" form. */
function idForLogin(login: string): number {
  return 800_000 + (crypto.createHash('sha256').update(login).digest().readUInt32BE(0) % 100_000);
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function isLoopbackUrl(value: unknown): value is string {
  if (typeof value !== 'string') return false;
  try {
    const u = new URL(value);
    return u.protocol === 'http:' && (u.hostname === '127.0.0.1' || u.hostname === 'localhost');
  } catch {
    return false;
  }
}

export function createFakeOAuthApp() {
  const codes = new Map<string, FakeProfile>();
  const tokens = new Map<string, FakeProfile>();
  const demo: FakeProfile[] = DEMO_USERS.map((u) => ({ id: Number(u.providerId), login: u.login, name: u.name, email: u.email }));

  const app = express();
  app.use(express.urlencoded({ extended: false }));
  app.use(express.json());

  // Browsers ask any page's origin for /favicon.ico; answering "no content" keeps a 404 out of every sign-in.
  app.get('/favicon.ico', (_req, res) => {
    res.status(204).end();
  });

  app.get('/health', (_req, res) => {
    res.json({ service: FAKE_OAUTH_SIGNATURE });
  });

  app.get('/login/oauth/authorize', (req, res) => {
    const { redirect_uri, state } = req.query;
    if (!isLoopbackUrl(redirect_uri)) return res.status(400).send('redirect_uri must be an http://127.0.0.1 URL');
    const base = `redirect_uri=${encodeURIComponent(redirect_uri)}&state=${encodeURIComponent(String(state ?? ''))}`;
    const rows = DEMO_USERS.map(
      (u) =>
        `<li><a data-login="${escapeHtml(u.login)}" href="/login/oauth/choose?login=${encodeURIComponent(u.login)}&${base}">` +
        `<strong>${escapeHtml(u.name)}</strong> <span>${escapeHtml(u.login)} · ${u.isAdmin ? 'site admin' : escapeHtml(u.role ?? '')}</span></a></li>`,
    ).join('');
    res.type('html').send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Local sign-in (fake provider)</title><link rel="icon" href="data:,">
<style>body{font:15px system-ui,sans-serif;max-width:34rem;margin:3rem auto;color:#1d2430}li{margin:.4rem 0}a{display:block;padding:.6rem .8rem;border:1px solid #c9d1dc;border-radius:6px;text-decoration:none;color:inherit}a:hover{background:#eef3f8}span{color:#5b6675;font-size:13px}label{display:block;margin:.4rem 0}input{font:inherit;padding:.3rem;width:100%}</style></head>
<body><h1>Local sign-in</h1><p>This page stands in for the OAuth provider on this machine. Pick a demo person:</p><ul>${rows}</ul>
<h2>Someone new</h2><form method="get" action="/login/oauth/choose">
<input type="hidden" name="redirect_uri" value="${escapeHtml(redirect_uri)}"><input type="hidden" name="state" value="${escapeHtml(String(state ?? ''))}">
<label>Login <input name="login" required pattern="[a-z0-9][a-z0-9.\\-]{1,38}"></label>
<label>Name <input name="name" required></label><label>E-mail <input name="email" type="email" required></label>
<button type="submit">Sign in as this person</button></form></body></html>`);
  });

  app.get('/login/oauth/choose', (req, res) => {
    const { redirect_uri, state, login, name, email } = req.query as Record<string, string | undefined>;
    if (!isLoopbackUrl(redirect_uri)) return res.status(400).send('redirect_uri must be an http://127.0.0.1 URL');
    if (!login || !/^[a-z0-9][a-z0-9.-]{1,38}$/.test(login)) return res.status(400).send('login: 2–39 lowercase letters, digits, dots or dashes');
    const profile =
      demo.find((u) => u.login === login) ??
      ({ id: idForLogin(login), login, name: name?.trim() || login, email: email?.trim() || `${login}@example.test` } satisfies FakeProfile);
    const code = crypto.randomBytes(16).toString('hex');
    codes.set(code, profile);
    const target = new URL(redirect_uri);
    target.searchParams.set('code', code);
    if (state) target.searchParams.set('state', state);
    res.redirect(302, target.toString());
  });

  app.post('/login/oauth/access_token', (req, res) => {
    const code = String(req.body?.code ?? '');
    const profile = codes.get(code);
    codes.delete(code); // single use, like the real thing
    if (!profile) return res.status(400).json({ error: 'bad_verification_code' });
    const token = crypto.randomBytes(20).toString('hex');
    tokens.set(token, profile);
    res.json({ access_token: token, token_type: 'bearer', scope: 'read:user,user:email' });
  });

  const profileFor = (req: express.Request) => {
    const token = (req.headers.authorization ?? '').replace(/^(token|bearer)\s+/i, '');
    return tokens.get(token);
  };

  app.get('/user', (req, res) => {
    const p = profileFor(req);
    if (!p) return res.status(401).json({ message: 'Bad credentials' });
    res.json({ id: p.id, login: p.login, name: p.name, email: p.email, avatar_url: null, html_url: null });
  });

  app.get('/user/emails', (req, res) => {
    const p = profileFor(req);
    if (!p) return res.status(401).json({ message: 'Bad credentials' });
    res.json([{ email: p.email, primary: true, verified: true, visibility: 'private' }]);
  });

  return app;
}

export async function startFakeOAuth(port = Number(process.env.FAKE_OAUTH_PORT ?? 5181)) {
  const app = createFakeOAuthApp();
  return new Promise<{ url: string; port: number; close: () => Promise<void> }>((resolve, reject) => {
    const server = app.listen(port, '127.0.0.1', (err?: Error) => {
      if (err) return reject(err);
      const actual = (server.address() as AddressInfo).port;
      resolve({
        url: `http://127.0.0.1:${actual}`,
        port: actual,
        close: () => new Promise((done) => server.close(() => done())),
      });
    });
    server.on('error', reject);
  });
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  startFakeOAuth().then(
    ({ url }) => console.log(`fake OAuth provider at ${url}`),
    (err: NodeJS.ErrnoException) => {
      console.error(
        err.code === 'EADDRINUSE'
          ? `fake OAuth: port ${process.env.FAKE_OAUTH_PORT ?? 5181} on 127.0.0.1 is in use; set FAKE_OAUTH_PORT to a free port.`
          : `fake OAuth: ${err.message}`,
      );
      process.exit(1);
    },
  );
}
