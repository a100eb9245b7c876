/**
 * A whole library stack for integration tests: the app factory on the real
 * test database, the local fake OAuth provider and fake mail server on free
 * ports, and sign-in through the real OAuth redirect flow (passport-github2
 * → fake authorize page → callback → token exchange over HTTP → verify).
 */
import request from 'supertest';
import { createApp, type DwellformApp } from '../app';
import { startFakeOAuth } from '../../tools/dev/fake-oauth';
import { startFakeMail } from '../../tools/dev/fake-mail';
import { openTestDb, truncateAll, type TestDb } from './test-db';
import { seedDemo } from '../db/seed/seed';
import type { Mailer } from '../mail/mailer';
import { summarizeStudy } from '../services/revision-summary.service';
import { clearReadCaches } from '../services/read-caches';
import type { StudyParams } from '../../shared/schemas/index';

export type Agent = ReturnType<typeof request.agent>;

export interface Harness {
  app: DwellformApp;
  db: TestDb;
  oauthUrl: string;
  mail: Awaited<ReturnType<typeof startFakeMail>>;
  close: () => Promise<void>;
}

export async function startHarness(options: { env?: NodeJS.ProcessEnv; mailer?: Mailer } = {}): Promise<Harness> {
  const oauth = await startFakeOAuth(0);
  const mail = await startFakeMail({ smtp: 0, http: 0 });
  const db = openTestDb({
    FAKE_OAUTH_PORT: String(oauth.port),
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(mail.smtpPort),
    FAKE_MAIL_HTTP_PORT: String(mail.httpPort),
    PUBLIC_URL: 'http://127.0.0.1:5180',
    ...options.env,
  });
  const app = createApp({ config: db.config, sequelize: db.sequelize, mailer: options.mailer, logError: () => {} });
  return {
    app,
    db,
    oauthUrl: oauth.url,
    mail,
    close: async () => {
      await app.locals.shutdown();
      await db.sequelize.close();
      await oauth.close();
      await mail.close();
    },
  };
}

const summaryCache = new Map<string, Promise<unknown>>();
/** The seed's summaries come from the real solver, computed once per distinct study and reused across resets. */
const cachedSummary = (params: StudyParams) => {
  const key = JSON.stringify(params);
  if (!summaryCache.has(key)) summaryCache.set(key, summarizeStudy(params));
  return summaryCache.get(key)!;
};

/** Empties the test database and inserts the demo scenario. */
export async function resetToDemo(db: TestDb) {
  await truncateAll(db.sequelize);
  clearReadCaches();
  await seedDemo(db.sequelize, db.models, { summarize: cachedSummary });
}

/**
 * The demo team signed in after a reset: engineer, lead and viewer, and the lead's seeded
 * two-dwell study (revisions 1–2) with its part.
 */
export async function resetToDemoTeam(h: Harness) {
  await resetToDemo(h.db);
  const [engineer, lead, viewer] = [await signIn(h, 'tomas.reed'), await signIn(h, 'amara.okafor'), await signIn(h, 'ines.varga')];
  const study = (await h.db.models.Study.findOne({ where: { title: 'Two-dwell cycle for the 24-ply panel' } }))!;
  return { engineer, lead, viewer, study, studyId: study.id as number, partId: study.partId as number };
}

export interface SignedIn {
  agent: Agent;
  csrf: string;
  userId: number | null;
}

async function csrfFor(agent: Agent): Promise<{ csrf: string; userId: number | null }> {
  const me = await agent.get('/api/me').expect(200);
  return { csrf: me.body.csrfToken as string, userId: me.body.user?.id ?? null };
}

/** An anonymous visitor who asked for a CSRF token (GET /api/me hands none to anonymous callers). */
export async function anonymous(app: DwellformApp): Promise<SignedIn> {
  const agent = request.agent(app);
  const res = await agent.get('/api/auth/csrf').expect(200);
  return { agent, csrf: res.body.csrfToken as string, userId: null };
}

type Who = string | { login: string; name: string; email: string };

/**
 * Signs in as a demo person (by login, picked from the fake's sign-in page)
 * or as someone new (login + name + email typed into its form).
 */
export async function signIn(h: Harness, who: Who, options: { next?: string } = {}): Promise<SignedIn & { landedOn: string }> {
  const { agent, landedOn } = await signInSession(h, who, options);
  const { csrf, userId } = await csrfFor(agent);
  if (userId === null) throw new Error('sign-in did not create a session');
  return { agent, csrf, userId, landedOn };
}

/** The sign-in up to the callback's redirect: the session exists, and nothing has been asked of it yet. */
export async function signInSession(h: Harness, who: Who, options: { next?: string } = {}): Promise<{ agent: Agent; landedOn: string }> {
  const agent = request.agent(h.app);
  const start = await agent.get(`/api/auth/github${options.next ? `?next=${encodeURIComponent(options.next)}` : ''}`).expect(302);
  const authorize = new URL(start.headers.location);
  if (!authorize.href.startsWith(h.oauthUrl)) throw new Error(`sign-in went to ${authorize.href}, not the fake provider`);
  const page = await fetch(authorize);
  const html = await page.text();
  let choose: URL;
  if (typeof who === 'string') {
    const href = html.match(new RegExp(`data-login="${who.replace(/\./g, '\\.')}" href="([^"]+)"`))?.[1];
    if (!href) throw new Error(`${who} is not offered on the fake sign-in page`);
    choose = new URL(href.replace(/&amp;/g, '&'), h.oauthUrl);
  } else {
    choose = new URL('/login/oauth/choose', h.oauthUrl);
    for (const name of ['redirect_uri', 'state']) choose.searchParams.set(name, authorize.searchParams.get(name) ?? '');
    for (const [k, v] of Object.entries(who)) choose.searchParams.set(k, v);
  }
  const back = await fetch(choose, { redirect: 'manual' });
  if (back.status !== 302) throw new Error(`fake provider answered ${back.status}`);
  const callback = new URL(back.headers.get('location')!);
  const landed = await agent.get(callback.pathname + callback.search).expect(302);
  return { agent, landedOn: landed.headers.location as string };
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** A request as the browser client makes it: JSON, with the session's CSRF token. */
export function call(who: SignedIn, method: Method, path: string, body?: unknown) {
  const req = who.agent[method](path).set('X-CSRF-Token', who.csrf).set('Accept', 'application/json');
  return body === undefined ? req : req.send(body as object);
}
