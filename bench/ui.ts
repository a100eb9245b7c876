/**
 * `npm run bench:ui`: how quickly the workspace follows a drag, in real Chromium
 * against the built client.
 *
 * Builds the client into a private folder (skip with --no-build), serves it with
 * Vite's preview server on 127.0.0.1, opens the reference study offline
 * (/studies/demo: no database or sign-in involved), grabs the second dwell's
 * end handle and moves it 100 times by 5 px (25 left, 25 right, 25 left, 25
 * right), waiting after each move until the
 * charts have painted. The app records one `dwellform:input-to-paint` measure
 * per input (from the edit to the frame after the charts committed; its detail
 * says whether that paint showed a drag preview or a full solve) and one
 * `dwellform:solve` measure per worker round trip (its detail carries the
 * accuracy and the worker's own time). Reports p50/p95 of each, how many drag
 * steps painted a preview, the full solve that follows the release, and the
 * gzip size of the JavaScript the first page load needs.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { chromium } from 'playwright-core';
import { preview } from 'vite';
import { chromiumLaunchOptions } from '../tools/dev/chromium';

const STEPS = 100;
/** At the 1800 px wide layout one minute is about 2.7 px: 5 px moves the dwell end by at least one whole minute. */
const STEP_PX = 5;
const TARGET_P95_MS = 33;
const TARGET_INITIAL_JS_KB = 250;

const outDir = path.join(os.tmpdir(), 'dwellform-bench-ui-dist');
const skipBuild = process.argv.includes('--no-build');
/** `--trace <file>`: also write a Chromium trace of the measured sweep (every thread, with CPU samples). */
const traceIndex = process.argv.indexOf('--trace');
const traceFile = traceIndex > 0 ? process.argv[traceIndex + 1] : null;

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[rank];
}

const stats = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  return { n: sorted.length, p50: percentile(sorted, 50), p95: percentile(sorted, 95), max: sorted[sorted.length - 1] };
};

/** Script and module-preload files index.html loads before any route runs, gzipped at level 9. */
function initialJs(dir: string) {
  const html = fs.readFileSync(path.join(dir, 'index.html'), 'utf8');
  const files = new Set<string>();
  for (const m of html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)) files.add(m[1]);
  for (const m of html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+\.js)"/g)) files.add(m[1]);
  let raw = 0;
  let gzip = 0;
  for (const f of files) {
    const body = fs.readFileSync(path.join(dir, f.replace(/^\//, '')));
    raw += body.length;
    gzip += zlib.gzipSync(body, { level: 9 }).length;
  }
  return { files: [...files], rawKB: raw / 1024, gzipKB: gzip / 1024 };
}

async function main() {
  if (!skipBuild) {
    execFileSync('npx', ['vite', 'build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'error'], { stdio: 'inherit' });
  }
  const size = initialJs(outDir);

  // configFile: false — the app's config would proxy /api to a server the offline demo does not need.
  const server = await preview({
    configFile: false,
    root: process.cwd(),
    build: { outDir },
    preview: { host: '127.0.0.1', port: 0, strictPort: false },
    logLevel: 'error',
  });
  const address = server.httpServer.address();
  if (!address || typeof address === 'string') throw new Error('preview server has no port');
  const baseURL = `http://127.0.0.1:${address.port}`;

  const browser = await chromium.launch(chromiumLaunchOptions);
  try {
    const page = await browser.newPage({ viewport: { width: 1800, height: 1200 } });
    page.on('pageerror', (e) => console.error(`page error: ${e.message}`));
    // No library server here: the health badge is answered locally so the console stays quiet.
    await page.route('**/api/**', (route) => route.fulfill({ status: 503, json: { status: 'degraded', db: 'down', version: 'bench' } }));
    await page.goto(`${baseURL}/studies/demo`);
    await page.getByTestId('final-cure-figure').waitFor({ timeout: 60_000 });

    const handle = page.getByRole('slider', { name: 'Dwell 2 end' });
    const box = (await handle.boundingBox())!;
    const x0 = box.x + box.width / 2;
    const y0 = box.y + box.height / 2;
    const measureCount = () =>
      page.evaluate(() => performance.getEntriesByName('dwellform:input-to-paint').length);

    // One warm-up drag so the first-solve and JIT costs stay out of the figures.
    await page.mouse.move(x0, y0);
    await page.mouse.down();
    await page.mouse.move(x0 - 10, y0);
    await page.waitForFunction(() => performance.getEntriesByName('dwellform:input-to-paint').length > 0, null, { timeout: 30_000 });
    await page.mouse.up();
    // The release solves in full; let that land before the measured sweep starts.
    await page.locator('[data-testid="solve-accuracy"][data-accuracy="full"]').waitFor({ state: 'attached', timeout: 30_000 });
    await page.evaluate(() => performance.clearMeasures());

    // Sweep the dwell end left and right, a whole-minute change per step.
    const start = (await handle.boundingBox())!;
    let x = start.x + start.width / 2;
    await page.mouse.move(x, y0);
    await page.mouse.down();
    if (traceFile) {
      await browser.startTracing(page, {
        categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'blink.user_timing', 'v8.execute', 'disabled-by-default-v8.cpu_profiler'],
      });
    }
    for (let i = 0; i < STEPS; i++) {
      const before = await measureCount();
      x += Math.floor(i / 25) % 2 === 0 ? -STEP_PX : STEP_PX;
      await page.mouse.move(x, y0);
      await page.waitForFunction((n) => performance.getEntriesByName('dwellform:input-to-paint').length > n, before, {
        timeout: 30_000,
      });
    }
    const released = await measureCount();
    await page.mouse.up();
    if (traceFile) fs.writeFileSync(traceFile, await browser.stopTracing());
    await page.locator('[data-testid="solve-accuracy"][data-accuracy="full"]').waitFor({ state: 'attached', timeout: 30_000 });

    type Accuracy = 'full' | 'preview';
    // One inline callback (tsx would wrap a named helper in __name, which the page does not have).
    const [paintAll, solveAll, renderAll] = (
      await page.evaluate(
        (names) => names.map((name) => performance.getEntriesByName(name).map((e) => ({ ms: e.duration, detail: (e as { detail?: unknown }).detail ?? null }))),
        ['dwellform:input-to-paint', 'dwellform:solve', 'dwellform:render'],
      )
    ).map((entries) =>
      entries.map(({ ms, detail }) => ({ ms, ...(detail as { accuracy?: Accuracy; workerMs?: number } | null) })),
    );
    const measures = { paint: paintAll, solve: solveAll, render: renderAll };
    const paint = measures.paint.slice(0, released);
    const solves = (accuracy: Accuracy) => measures.solve.filter((m) => m.accuracy === accuracy);
    const p = stats(paint.map((m) => m.ms));
    const r = stats(measures.render.map((m) => m.ms));
    const fmt = (v: number) => v.toFixed(1);
    const line = (label: string, s: ReturnType<typeof stats>) =>
      `  ${label.padEnd(34)} n=${s.n} p50=${fmt(s.p50)} ms p95=${fmt(s.p95)} ms max=${fmt(s.max)} ms`;
    const from = (accuracy: Accuracy) => paint.filter((m) => m.accuracy === accuracy).length;
    console.log(`ui drag bench, reference study, ${STEPS} drag steps of ${STEP_PX} px (headless Chromium, built client)`);
    console.log(`${line('input → repainted charts:', p)} (target p95 ≤ ${TARGET_P95_MS} ms)`);
    console.log(`    painted from: ${from('preview')} preview solves, ${from('full')} full solves`);
    console.log(line('solve round trip, preview:', stats(solves('preview').map((m) => m.ms))));
    console.log(line('  inside the worker:', stats(solves('preview').map((m) => m.workerMs ?? Number.NaN))));
    console.log(line('solve round trip, full (release):', stats(solves('full').map((m) => m.ms))));
    console.log(line('  inside the worker:', stats(solves('full').map((m) => m.workerMs ?? Number.NaN))));
    console.log(line('result → charts committed:', r));
    console.log(
      `initial JS: ${size.files.length} files, ${size.rawKB.toFixed(1)} KB raw, ${size.gzipKB.toFixed(1)} KB gzip -9 (target ≤ ${TARGET_INITIAL_JS_KB} KB)`,
    );
  } finally {
    await browser.close();
    await new Promise<void>((resolve) => server.httpServer.close(() => resolve()));
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
