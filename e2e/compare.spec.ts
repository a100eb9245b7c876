import fs from 'node:fs';
import Papa from 'papaparse';
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';

// Compare a fork with its part's pinned baseline, hand the results on as CSV, and open the printable report.
// Runs against the seeded demo library (server/db/seed/demo-studies.ts): part TB-2407 has a pinned baseline.
const PART_NUMBER = 'TB-2407';

async function signInAs(page: Page, login: string) {
  await page.goto('/api/auth/github?next=/');
  await page.locator(`a[data-login="${login}"]`).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/login') && !url.pathname.startsWith('/api'));
}

type Baseline = { revisionId: number; studyId: number; number: number };

async function baselineOf(request: APIRequestContext, partNumber: string): Promise<Baseline> {
  const teams = (await (await request.get('/api/teams')).json()) as { id: number }[];
  for (const team of teams) {
    const parts = (await (await request.get(`/api/teams/${team.id}/parts`)).json()) as { id: number; partNumber: string }[];
    const part = parts.find((p) => p.partNumber === partNumber);
    if (!part) continue;
    const detail = (await (await request.get(`/api/parts/${part.id}`)).json()) as { baseline: Baseline | null };
    if (!detail.baseline) throw new Error(`part ${partNumber} has no pinned baseline`);
    return detail.baseline;
  }
  throw new Error(`the seeded part ${partNumber} was not found`);
}

async function csrfToken(request: APIRequestContext): Promise<string> {
  return ((await (await request.get('/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
}

/**
 * Fork the baseline into a study of the engineer's own, then save a revision whose first ramp runs at
 * 5 °C/min: above the seeded heat-up limit of 3 °C/min, so that limit must flip from pass to fail.
 */
async function forkWithFasterRamp(request: APIRequestContext, baseline: Baseline) {
  const headers = { 'X-CSRF-Token': await csrfToken(request) };
  const forkResponse = await request.post(`/api/studies/${baseline.studyId}/revisions/${baseline.number}/fork`, {
    headers,
    data: { title: `Faster first ramp trial ${Date.now()}` },
  });
  expect(forkResponse.status()).toBe(201);
  const fork = (await forkResponse.json()) as { id: number; title: string; latestRevisionNumber: number };
  const first = (await (await request.get(`/api/studies/${fork.id}/revisions/1`)).json()) as { params: { cycle: { segments: { kind: string; rateCPerMin?: number }[] }; limits: { maxHeatRateCPerMin: number } } };
  const params = structuredClone(first.params);
  expect(params.cycle.segments[0].kind).toBe('ramp');
  expect(params.limits.maxHeatRateCPerMin).toBeLessThan(5);
  params.cycle.segments[0].rateCPerMin = 5;
  const saved = await request.post(`/api/studies/${fork.id}/revisions`, {
    headers,
    data: { baseRevision: 1, message: 'First ramp at 5 °C/min', params },
  });
  expect(saved.status()).toBe(201);
  return { studyId: fork.id, title: fork.title, number: 2 };
}

test('a fork compared with the baseline shows deltas, the flipped limit, a CSV with its header, and the printable report', async ({ page, browser }) => {
  test.setTimeout(120_000);
  await signInAs(page, 'tomas.reed');
  const baseline = await baselineOf(page.request, PART_NUMBER);
  const fork = await forkWithFasterRamp(page.request, baseline);

  // Open the fork in the workspace and follow its Compare link: the baseline is found by itself.
  await page.goto(`/studies/${fork.studyId}`);
  await expect(page.getByRole('heading', { level: 1, name: fork.title })).toBeVisible();
  await page.getByRole('link', { name: 'Compare with baseline' }).click();
  await expect(page).toHaveURL(new RegExp(`/compare\\?a=s${baseline.studyId}r${baseline.number}&b=s${fork.studyId}r${fork.number}$`));
  await expect(page.getByTestId('run-a')).toContainText('baseline');
  await expect(page.getByTestId('run-b')).toContainText(fork.title);
  // Any two revisions of the part can be picked instead; the pinned baseline is marked in the list.
  const pickA = page.getByLabel('A (reference)');
  await expect(pickA).toHaveValue(`s${baseline.studyId}r${baseline.number}`);
  await expect(pickA.locator('option', { hasText: '(baseline)' })).toHaveCount(1);
  await expect(page.getByLabel('B (candidate)').locator('option', { hasText: fork.title })).toHaveCount(2);

  // The parameter diff names the one edit, in words with units.
  await expect(page.getByTestId('param-diff')).toContainText(/Ramp 1: rate [\d.]+ °C\/min → 5 °C\/min/);
  // The heat-up limit flips from pass to fail; the headline counts it.
  const heatUp = page.locator('[data-limit="maxHeatRateCPerMin"]');
  await expect(heatUp).toHaveAttribute('data-flip', 'now-fails');
  await expect(heatUp).toContainText('now fails');
  await expect(page.getByTestId('flip-headline')).toContainText(/now fail/);
  // A faster ramp reaches the cure dwell sooner: the cycle is shorter, a negative delta.
  await expect(page.getByTestId('delta-cycleMin')).toHaveText(/^−\d+ min$/);
  await expect(page.getByTestId('delta-maxHeatRateCPerMin')).toHaveText(/^\+[\d.]+ °C\/min$/);
  // Both runs overlaid on each chart, each with its own key.
  await expect(page.getByTestId('chart-temperatures').locator('[data-run]')).toHaveCount(2);
  // The same charts as the workspace: all four temperatures, the profiles through the thickness, the shape.
  await expect(page.getByTestId('chart-temperatures')).toContainText('part surface');
  await expect(page.getByTestId('profile-temperature').locator('[data-run]')).toHaveCount(2);
  await expect(page.getByTestId('profile-cure').locator('[data-run]')).toHaveCount(2);
  await expect(page.getByTestId('chart-shape').locator('[data-run]')).toHaveCount(2);
  // limits with their direction, at the unit's precision
  await expect(heatUp).toContainText(/≤ [\d.]+ °C\/min/);
  await expect(page.getByTestId('figures-source')).toContainText('Recomputed in this browser');

  // The link is the comparison: a viewer of the team opens it and sees the same verdicts; someone signed out is
  // asked to sign in and brought back to it.
  const shared = page.url();
  const viewer = await browser.newPage();
  await signInAs(viewer, 'ines.varga');
  await viewer.goto(shared);
  await expect(viewer.locator('[data-limit="maxHeatRateCPerMin"]')).toHaveAttribute('data-flip', 'now-fails');
  await expect(viewer.getByTestId('param-diff')).toContainText('→ 5 °C/min');
  await viewer.close();
  const stranger = await browser.newPage();
  await stranger.goto(shared);
  await expect(stranger.getByRole('alert')).toContainText('Sign in to read revisions');
  await stranger.getByRole('alert').getByRole('link', { name: 'Sign in' }).click();
  await stranger.locator('a[data-login="ines.varga"]').click();
  await expect(stranger).toHaveURL(shared);
  await expect(stranger.locator('[data-limit="maxHeatRateCPerMin"]')).toHaveAttribute('data-flip', 'now-fails');
  await stranger.close();

  // CSV of B: header block, then one row per solver step (the server's stored summary says how many steps).
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'CSV of B' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^dwellform-faster-first-ramp-trial-\d+-r2\.csv$/);
  const text = fs.readFileSync((await download.path())!, 'utf8').replace(/^\uFEFF/, '');
  const rows = Papa.parse<string[]>(text, { skipEmptyLines: false }).data;
  const header = new Map(rows.slice(1, 16).map((r) => [r[0], r[1]]));
  expect(rows[0][0]).toBe('Dwellform results');
  expect(header.get('study')).toBe(fork.title);
  expect(header.get('revision')).toBe('2');
  expect(header.get('part')).toContain(PART_NUMBER);
  expect(header.get('resin card')).toContain('DF-E180 demo epoxy');
  expect(header.get('fibre card')).toContain('DF-C230 demo carbon fibre');
  expect(header.get('model version')).toMatch(/^dwellform-solver /);
  expect(header.get('units')).toContain('temperatures in °C');
  const start = rows.findIndex((r) => r[0] === 'section' && r[1] === 'time histories');
  const end = rows.findIndex((r, k) => k > start && r.length === 1 && r[0] === '');
  const dataRows = rows.slice(start + 2, end);
  expect(rows[start + 1][0]).toBe('time [min]');
  expect(dataRows.length).toBe(Number(header.get('time history rows')));
  const stored = (await (await page.request.get(`/api/studies/${fork.studyId}/revisions/${fork.number}`)).json()) as { summary: { steps: number } };
  // One history row per accepted step plus t = 0 (the solver contract), counted by the server's own solve.
  expect(dataRows.length).toBe(stored.summary.steps + 1);
  expect(Number(dataRows[0][0])).toBe(0);

  // The printable report of B, with its own print button.
  await page.getByRole('link', { name: 'Printable report of B' }).click();
  await expect(page).toHaveURL(/\/report\?r=s\d+r2&against=s\d+r\d+$/);
  await expect(page.getByTestId('report-title')).toHaveText(`${fork.title} · r2`);
  await expect(page.getByTestId('job-summary')).toContainText('process limits fail');
  await expect(page.locator('[data-verdict="fail"]')).toContainText('Heat-up rate');
  await expect(page.getByTestId('report-cycle')).toContainText('Ramp 1: 5 °C/min');
  await expect(page.getByTestId('report-assumptions')).toContainText('one dimension');
  await expect(page.getByTestId('report-cautions')).toContainText('never replace');
  await expect(page.getByTestId('report-cautions')).toContainText('Exotherm risk');
  // four histories, two profiles through the thickness, the ply stresses and the shape after demould
  await expect(page.getByTestId('run-charts').locator('svg[role="img"]')).toHaveCount(8);
  // Count calls to the browser's print dialog instead of opening it (globalThis is the page's window there).
  await page.evaluate(() => {
    const w = globalThis as unknown as { printed: number; print: () => void };
    w.printed = 0;
    w.print = () => {
      w.printed += 1;
    };
  });
  await page.getByRole('button', { name: 'Print or save as PDF' }).click();
  expect(await page.evaluate(() => (globalThis as unknown as { printed: number }).printed)).toBe(1);
  // On paper the report carries no buttons.
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('button', { name: 'Print or save as PDF' })).toBeHidden();
});

test('a chart exports as a standalone SVG and as a PNG image', async ({ page }) => {
  await page.goto('/compare?a=demo0&b=demo2');
  await expect(page.getByTestId('chart-cure')).toBeVisible();
  const [svg] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download Degree of cure as SVG' }).click()]);
  const svgText = fs.readFileSync((await svg.path())!, 'utf8');
  expect(svgText).toMatch(/^<\?xml version="1\.0" encoding="UTF-8"\?>\s*<svg[^>]+xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
  expect(svgText).toContain('<title>Degree of cure</title>');
  expect(svgText).toContain('@font-face');
  expect(svgText).toContain('stroke-dasharray:7');
  const [png] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download Degree of cure as PNG' }).click()]);
  const bytes = fs.readFileSync((await png.path())!);
  // PNG signature (ISO/IEC 15948: 89 50 4E 47 0D 0A 1A 0A); width at twice the on-screen size.
  expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  const width = bytes.readUInt32BE(16);
  const onScreen = await page.getByTestId('chart-cure').locator('svg[role="img"]').evaluate((el) => el.getBoundingClientRect().width);
  expect(width).toBe(Math.round(Math.round(onScreen) * 2));
});
