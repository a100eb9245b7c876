/**
 * `npm run bench:api`: the library API under load, on loopback, against the
 * built server (production mode) and the real MariaDB holding 10 000
 * revisions. autocannon drives a study read (GET /api/studies/:id, the latest
 * revision with its params) and a save (POST a new revision, which validates
 * the params and recomputes the summary with the shared solver), each at 64
 * connections. Target: read p99 ≤ 20 ms. A benchmark, not a test.
 *
 * Uses its own database (dwellform_test_bench, recreated each run unless
 * BENCH_REUSE_DB=1 finds a complete one) and ports
 * (API 5195, fake OAuth on a free port), so a running instance is left alone.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import autocannon from 'autocannon';
import { loadConfig } from '../server/config/index';
import { createSequelize } from '../server/db/sequelize';
import { createMigrator } from '../server/db/migrator';
import { initModels } from '../server/models/index';
import { seedDemo } from '../server/db/seed/seed';
import { closeSummaryPool, summarizeStudy } from '../server/services/revision-summary.service';
import { startFakeOAuth } from '../tools/dev/fake-oauth';
import { referenceStudy } from '../shared/solver/demo-cards';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const DB_NAME = process.env.BENCH_DB_NAME ?? 'dwellform_test_bench';
const PORT = Number(process.env.BENCH_PORT ?? 5195);
const REVISIONS = 10_000;
const STUDIES = 200; // 50 revisions each
const CONNECTIONS = 64;
const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 10);
const base = `http://127.0.0.1:${PORT}`;

type Figures = Record<string, number | string>;

/** With BENCH_REUSE_DB=1, a bench database from an earlier run is used as it is. */
async function reuseDatabase(): Promise<number[] | null> {
  if (process.env.BENCH_REUSE_DB !== '1') return null;
  const sequelize = createSequelize(loadConfig({ ...process.env, DB_NAME }).db);
  try {
    const { Study, Revision } = initModels(sequelize);
    if ((await Revision.count()) < REVISIONS) return null;
    const studies = await Study.findAll({ where: { ownerId: (await Study.findOne({ where: { title: 'Load study 1' } }))?.ownerId ?? -1 }, attributes: ['id', 'title'] });
    const ids = studies.filter((st) => st.title.startsWith('Load study')).map((st) => st.id);
    return ids.length === STUDIES ? ids : null;
  } catch {
    return null;
  } finally {
    await sequelize.close();
  }
}

async function prepareDatabase(): Promise<number[]> {
  const reused = await reuseDatabase();
  if (reused) {
    console.log(`bench database ${DB_NAME}: reused`);
    return reused;
  }
  const config = loadConfig({ ...process.env, DB_NAME });
  const admin = createSequelize({ ...config.db, name: '' });
  await admin.query(`DROP DATABASE IF EXISTS \`${DB_NAME}\``);
  await admin.query(`CREATE DATABASE \`${DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();

  const sequelize = createSequelize(config.db);
  await createMigrator(sequelize, { quiet: true }).up();
  const models = initModels(sequelize);
  const params = referenceStudy();
  // One real summary, reused: filling 10 000 rows is setup, not what is measured.
  const summary = await summarizeStudy(params);
  await seedDemo(sequelize, models, { summarize: () => summary });
  await closeSummaryPool();

  const { Part, Study, Revision, User } = models;
  const part = (await Part.findOne({ where: { partNumber: 'TB-2407' } }))!;
  const author = (await User.findOne({ where: { login: 'tomas.reed' } }))!;
  const existing = await Revision.count();
  const perStudy = Math.ceil((REVISIONS - existing) / STUDIES);
  const ids: number[] = [];
  for (let s = 0; s < STUDIES; s++) {
    const study = await Study.create({ teamId: part.teamId, partId: part.id, ownerId: author.id, title: `Load study ${s + 1}`, forkedFromRevisionId: null, latestRevisionNumber: perStudy });
    ids.push(study.id);
    const rows = Array.from({ length: perStudy }, (_, i) => ({
      studyId: study.id,
      number: i + 1,
      params,
      summary,
      authorId: author.id,
      message: `load revision ${i + 1}`,
      basedOnNumber: i === 0 ? null : i,
      restoredFromNumber: null,
    }));
    await Revision.bulkCreate(rows);
  }
  const total = await Revision.count();
  await sequelize.close();
  console.log(`bench database ${DB_NAME}: ${total} revisions in ${STUDIES} load studies (+ demo)`);
  return ids;
}

/** Sign in as the demo engineer through the real OAuth redirect flow; returns the cookie and CSRF token. */
async function signIn(oauthUrl: string): Promise<{ cookie: string; csrf: string }> {
  const cookieOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const start = await fetch(`${base}/api/auth/github`, { redirect: 'manual' });
  let cookie = cookieOf(start);
  const authorize = new URL(start.headers.get('location')!);
  const choose = new URL('/login/oauth/choose', oauthUrl);
  choose.searchParams.set('login', 'tomas.reed');
  choose.searchParams.set('redirect_uri', authorize.searchParams.get('redirect_uri')!);
  choose.searchParams.set('state', authorize.searchParams.get('state')!);
  const back = await fetch(choose, { redirect: 'manual' });
  const callback = new URL(back.headers.get('location')!);
  const done = await fetch(`${base}${callback.pathname}${callback.search}`, { redirect: 'manual', headers: { cookie } });
  cookie = cookieOf(done) || cookie;
  const me = (await (await fetch(`${base}/api/me`, { headers: { cookie } })).json()) as { csrfToken: string; user: unknown };
  if (!me.user) throw new Error(`bench sign-in failed: callback answered ${done.status} → ${done.headers.get('location')}`);
  return { cookie, csrf: me.csrfToken };
}

async function waitForHealth(timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`server did not answer at ${base}`);
}

/** Polls each study until a save on top of `latest` shows up (or gives up after `timeoutMs`). */
async function waitForSaves(ids: number[], headers: Record<string, string>, latest: Map<number, number>, timeoutMs = 10_000) {
  const until = Date.now() + timeoutMs;
  let pending = ids;
  while (pending.length > 0 && Date.now() < until) {
    const landed = await Promise.all(
      pending.map(async (id) => {
        const res = await fetch(`${base}/api/studies/${id}`, { headers });
        return ((await res.json()) as { latestRevisionNumber: number }).latestRevisionNumber > latest.get(id)!;
      }),
    );
    pending = pending.filter((_, i) => !landed[i]);
    if (pending.length > 0) await new Promise((r) => setTimeout(r, 200));
  }
}

function figuresOf(name: string, r: autocannon.Result): Figures {
  return {
    [`${name} requests/s (mean)`]: Math.round(r.requests.average),
    [`${name} latency p50 ms`]: r.latency.p50,
    [`${name} latency p99 ms`]: r.latency.p99,
    [`${name} 2xx`]: r['2xx'],
    [`${name} non-2xx`]: r.non2xx,
    [`${name} errors`]: r.errors + r.timeouts,
  };
}

export async function runApiBench(): Promise<Figures> {
  spawnSync('bash', ['tools/dev/db.sh', 'start'], { cwd: root, stdio: 'inherit' });
  if (!existsSync(path.join(root, 'dist', 'index.html'))) spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  const studyIds = await prepareDatabase();
  if (await fetch(`${base}/api/health`).then(() => true, () => false)) {
    throw new Error(`something already listens on ${base}; stop it or set BENCH_PORT`);
  }
  const oauth = await startFakeOAuth(0);
  // Its own process group, so the whole server tree stops with it.
  const server = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
    cwd: root,
    detached: true,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, NODE_ENV: 'production', PORT: String(PORT), DB_NAME, FAKE_OAUTH_PORT: String(oauth.port), AUTH_RATE_LIMIT: '1000' },
  });
  try {
    await waitForHealth();
    const { cookie, csrf } = await signIn(oauth.url);
    const headers = { cookie, 'x-csrf-token': csrf, 'content-type': 'application/json', accept: 'application/json' };

    // warm-up: JIT, connection pool, the summary worker
    await autocannon({ url: base, connections: 8, duration: 2, headers, requests: [{ method: 'GET', path: `/api/studies/${studyIds[0]}` }] });

    let next = 0;
    // One connection: the cost of a single read with no queueing.
    const single = await autocannon({
      url: base,
      connections: 1,
      duration: Math.min(5, DURATION_S),
      headers,
      requests: [{ method: 'GET', setupRequest: (req) => ({ ...req, path: `/api/studies/${studyIds[next++ % studyIds.length]}` }) }],
    });
    const read = await autocannon({
      url: base,
      connections: CONNECTIONS,
      duration: DURATION_S,
      headers,
      requests: [{ method: 'GET', setupRequest: (req) => ({ ...req, path: `/api/studies/${studyIds[next++ % studyIds.length]}` }) }],
    });

    // Saves: each request takes a study nobody else is saving, on top of its latest revision.
    const latest = new Map(studyIds.map((id) => [id, 0]));
    const free = [...studyIds];
    for (const id of studyIds) {
      const res = await fetch(`${base}/api/studies/${id}`, { headers });
      latest.set(id, ((await res.json()) as { latestRevisionNumber: number }).latestRevisionNumber);
    }
    const body = (id: number) => JSON.stringify({ baseRevision: latest.get(id), message: 'bench save', params: referenceStudy() });
    let conflicts = 0;
    const save = await autocannon({
      url: base,
      connections: CONNECTIONS,
      duration: DURATION_S,
      headers,
      requests: [
        {
          method: 'POST',
          setupRequest: (req, context) => {
            const id = free.shift()!;
            context.studyId = id;
            return { ...req, path: `/api/studies/${id}/revisions`, body: body(id) };
          },
          onResponse: (status, resBody, context) => {
            const id = context.studyId as number;
            if (status === 201) latest.set(id, (JSON.parse(resBody) as { number: number }).number);
            else if (status === 409) {
              conflicts++;
              latest.set(id, (JSON.parse(resBody) as { latestRevision: number }).latestRevision);
            }
            free.push(id);
          },
        },
      ],
    });

    // autocannon drops its sockets when the time is up, but the server still
    // finishes the saves it took; let them land before the server is stopped,
    // or they reach a closed connection pool.
    const inFlight = studyIds.filter((id) => !free.includes(id));
    await waitForSaves(inFlight, headers, latest);

    const figures: Figures = {
      revisions: REVISIONS,
      connections: CONNECTIONS,
      'duration s': DURATION_S,
      'read latency p50 ms (1 connection)': single.latency.p50,
      'read latency p99 ms (1 connection)': single.latency.p99,
      ...figuresOf('read', read),
      ...figuresOf('save', save),
      'save 409 conflicts': conflicts,
      'read p99 target ≤ 20 ms': read.latency.p99 <= 20 ? 'met' : 'NOT met',
    };
    mkdirSync(path.join(root, 'bench', 'out'), { recursive: true });
    writeFileSync(path.join(root, 'bench', 'out', 'api.json'), JSON.stringify({ at: new Date().toISOString(), figures }, null, 2));
    return figures;
  } finally {
    if (server.pid) process.kill(-server.pid, 'SIGTERM');
    await oauth.close();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  runApiBench().then(
    (figures) => {
      console.table(figures);
      process.exit(0);
    },
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
