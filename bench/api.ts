/**
 * `npm run bench:api`: the library API under load, on loopback, against the
 * built server (production mode) and the real MariaDB holding 10 000
 * revisions. autocannon drives a study read (GET /api/studies/:id, the latest
 * revision with its params) and a save (POST a new revision, which validates
 * the params and recomputes the summary with the shared solver), each at 64
 * connections. Target: read p99 ≤ 20 ms. A benchmark, not a test.
 *
 * The same run measures this machine's floor: a bare Express app (the same
 * express, no middleware, its own process like the server) answering every
 * request with the bytes of a real study read, driven by the same autocannon
 * settings. With 64 requests always in flight, Little's law makes the mean
 * latency 64 / throughput, so no read can beat 64 / (floor requests/s) on
 * average; the p99 sits above the mean.
 *
 * Uses its own database (dwellform_test_bench, recreated each run unless
 * BENCH_REUSE_DB=1 finds a complete one) and ports
 * (API 5195, floor 5196, fake OAuth on a free port), so a running instance is left alone.
 */
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
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
const FLOOR_PORT = PORT + 1;
const REVISIONS = 10_000;
const STUDIES = 200; // 50 revisions each
const CONNECTIONS = 64;
const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 10);
const TARGET_P99_MS = 20;
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

async function waitForUrl(url: string, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`nothing answered at ${url}`);
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

/** Starts a command in its own process group, so the whole tree (tsx spawns node) stops with it. */
function startGroup(command: string, args: string[], env: NodeJS.ProcessEnv) {
  const child = spawn(command, args, { cwd: root, detached: true, stdio: ['ignore', 'inherit', 'inherit'], env: { ...process.env, ...env } });
  return {
    pid: child.pid!,
    stop: () => {
      if (child.pid) process.kill(-child.pid, 'SIGTERM');
    },
  };
}

/** The floor: bare Express (no middleware) sending the same bytes as a study read, with the type a study read has. */
const FLOOR_APP = `
const express = require('express');
const body = process.env.FLOOR_BODY;
const app = express();
app.get('/api/studies/:id', (_req, res) => { res.type('application/json').send(body); });
app.listen(Number(process.env.FLOOR_PORT), '127.0.0.1');
`;

/** CPU time (user + system, ms) of every process in a process group so far; null where /proc is missing. */
function groupCpuMs(pgid: number): number | null {
  if (!existsSync('/proc/self/stat')) return null;
  const tickMs = 1000 / Number(spawnSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).stdout || 100);
  let ticks = 0;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' '); // fields from 3 (state) on
      if (Number(fields[2]) === pgid) ticks += Number(fields[11]) + Number(fields[12]); // pgrp; utime, stime
    } catch {
      /* the process ended meanwhile */
    }
  }
  return ticks * tickMs;
}

/** Runs autocannon and notes the server's CPU time per completed request over the run. */
async function measure(pgid: number, options: autocannon.Options) {
  const cpuBefore = groupCpuMs(pgid);
  const result = await autocannon(options);
  const cpuAfter = groupCpuMs(pgid);
  const cpuMsPerRequest = cpuBefore === null || cpuAfter === null || result.requests.total === 0 ? null : (cpuAfter - cpuBefore) / result.requests.total;
  return { result, cpuMsPerRequest };
}

const round1 = (x: number) => Math.round(x * 10) / 10;
const cpuFigure = (ms: number | null) => (ms === null ? 'n/a' : Math.round(ms * 100) / 100);

function figuresOf(name: string, { result: r, cpuMsPerRequest }: Awaited<ReturnType<typeof measure>>): Figures {
  return {
    [`${name} requests/s (mean)`]: Math.round(r.requests.average),
    [`${name} latency mean ms`]: round1(r.latency.average),
    [`${name} latency p50 ms`]: r.latency.p50,
    [`${name} latency p99 ms`]: r.latency.p99,
    [`${name} server CPU ms per request`]: cpuFigure(cpuMsPerRequest),
    [`${name} 2xx`]: r['2xx'],
    [`${name} non-2xx`]: r.non2xx,
    [`${name} errors`]: r.errors + r.timeouts,
  };
}

/** Little's law with CONNECTIONS always in flight: the mean latency a throughput allows. */
const littleMs = (r: autocannon.Result) => round1((CONNECTIONS / r.requests.average) * 1000);

export async function runApiBench(): Promise<Figures> {
  spawnSync('bash', ['tools/dev/db.sh', 'start'], { cwd: root, stdio: 'inherit' });
  if (!existsSync(path.join(root, 'dist', 'index.html'))) spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  const studyIds = await prepareDatabase();
  for (const url of [base, `http://127.0.0.1:${FLOOR_PORT}`]) {
    if (await fetch(url).then(() => true, () => false)) throw new Error(`something already listens on ${url}; stop it or set BENCH_PORT`);
  }
  const oauth = await startFakeOAuth(0);
  const server = startGroup(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
    NODE_ENV: 'production',
    PORT: String(PORT),
    DB_NAME,
    FAKE_OAUTH_PORT: String(oauth.port),
    AUTH_RATE_LIMIT: '1000',
  });
  let floor: ReturnType<typeof startGroup> | null = null;
  try {
    const loadBefore = os.loadavg()[0];
    await waitForUrl(`${base}/api/health`);
    const { cookie, csrf } = await signIn(oauth.url);
    const headers = { cookie, 'x-csrf-token': csrf, 'content-type': 'application/json', accept: 'application/json' };
    let next = 0;
    const readEach = (ids: number[]) => [{ method: 'GET', setupRequest: (req: autocannon.RawRequest) => ({ ...req, path: `/api/studies/${ids[next++ % ids.length]}` }) }];

    // warm-up on one study: JIT, connection pool, the session
    await autocannon({ url: base, connections: 8, duration: 2, headers, requests: [{ method: 'GET', path: `/api/studies/${studyIds[0]}` }] });
    // Each other study once, one connection: a read that finds nothing cached and goes to MariaDB.
    const others = studyIds.slice(1);
    const cold = await autocannon({ url: base, connections: 1, amount: others.length, headers, requests: readEach(others) });
    // One connection: the cost of a single (warm) read with no queueing.
    const single = await measure(server.pid, { url: base, connections: 1, duration: Math.min(5, DURATION_S), headers, requests: readEach(studyIds) });
    const read = await measure(server.pid, { url: base, connections: CONNECTIONS, duration: DURATION_S, headers, requests: readEach(studyIds) });

    // The floor, with the bytes of a real read.
    const readBody = await (await fetch(`${base}/api/studies/${studyIds[0]}`, { headers })).text();
    floor = startGroup(process.execPath, ['-e', FLOOR_APP], { NODE_ENV: 'production', FLOOR_PORT: String(FLOOR_PORT), FLOOR_BODY: readBody });
    const floorUrl = `http://127.0.0.1:${FLOOR_PORT}/api/studies/1`;
    await waitForUrl(floorUrl);
    await autocannon({ url: floorUrl, connections: 8, duration: 2, headers });
    const floorRun = await measure(floor.pid, { url: floorUrl, connections: CONNECTIONS, duration: DURATION_S, headers });
    floor.stop();
    floor = null;

    // Saves: each request takes a study nobody else is saving, on top of its latest revision.
    const latest = new Map(studyIds.map((id) => [id, 0]));
    const free = [...studyIds];
    for (const id of studyIds) {
      const res = await fetch(`${base}/api/studies/${id}`, { headers });
      latest.set(id, ((await res.json()) as { latestRevisionNumber: number }).latestRevisionNumber);
    }
    const body = (id: number) => JSON.stringify({ baseRevision: latest.get(id), message: 'bench save', params: referenceStudy() });
    let conflicts = 0;
    const save = await measure(server.pid, {
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
      'CPU cores': os.cpus().length,
      'load average (1 min) at start': round1(loadBefore),
      'read body bytes': Buffer.byteLength(readBody),
      'cold read p50 ms (first read of a study, 1 connection)': cold.latency.p50,
      'cold read p99 ms (first read of a study, 1 connection)': cold.latency.p99,
      'read latency mean ms (1 connection)': round1(single.result.latency.average),
      'read latency p50 ms (1 connection)': single.result.latency.p50,
      'read latency p99 ms (1 connection)': single.result.latency.p99,
      'read server CPU ms per request (1 connection)': cpuFigure(single.cpuMsPerRequest),
      ...figuresOf('read', read),
      "read Little's-law mean ms (64 / requests/s)": littleMs(read.result),
      ...figuresOf('floor (bare Express, same body)', floorRun),
      "floor Little's-law mean ms (64 / requests/s)": littleMs(floorRun.result),
      [`requests/s a ${TARGET_P99_MS} ms mean needs at ${CONNECTIONS} connections`]: (CONNECTIONS * 1000) / TARGET_P99_MS,
      ...figuresOf('save', save),
      'save 409 conflicts': conflicts,
      [`read p99 target ≤ ${TARGET_P99_MS} ms`]: read.result.latency.p99 <= TARGET_P99_MS ? 'met' : 'NOT met',
      [`floor p99 ≤ ${TARGET_P99_MS} ms (is the target within reach here?)`]: floorRun.result.latency.p99 <= TARGET_P99_MS ? 'yes' : 'no',
    };
    mkdirSync(path.join(root, 'bench', 'out'), { recursive: true });
    writeFileSync(path.join(root, 'bench', 'out', 'api.json'), JSON.stringify({ at: new Date().toISOString(), figures }, null, 2));
    return figures;
  } finally {
    floor?.stop();
    server.stop();
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
