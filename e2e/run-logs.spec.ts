import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { demoRunLogCsv } from '../shared/run-log/demo-run-log';
import { parseStudy } from '../shared/schemas/study';

// The run-log flow on the seeded demo library: an engineer uploads a run of the 24-ply panel whose 180 °C
// hold ran long, confirms the column mapping, sees the excursion flagged and the replay; a viewer cannot
// record a decision; the lead records one, which then shows on the printable review record.
const PART_NUMBER = 'TB-2407';
const STUDY_TITLE = 'Two-dwell cycle for the 24-ply panel';

async function signedIn(browser: Browser, login: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await page.goto('/api/auth/github?next=/');
  await page.locator(`a[data-login="${login}"]`).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/login') && !url.pathname.startsWith('/api'));
  return page;
}

async function demoStudy(page: Page): Promise<{ studyId: number; partId: number; params: unknown }> {
  const teams = (await (await page.request.get('/api/teams')).json()) as { id: number }[];
  for (const team of teams) {
    const parts = (await (await page.request.get(`/api/teams/${team.id}/parts`)).json()) as { id: number; partNumber: string }[];
    const part = parts.find((p) => p.partNumber === PART_NUMBER);
    if (!part) continue;
    const detail = (await (await page.request.get(`/api/parts/${part.id}`)).json()) as { studies: { id: number; title: string; latestRevisionNumber: number }[] };
    const study = detail.studies.find((s) => s.title === STUDY_TITLE)!;
    const revision = (await (await page.request.get(`/api/studies/${study.id}/revisions/${study.latestRevisionNumber}`)).json()) as { params: unknown };
    return { studyId: study.id, partId: part.id, params: revision.params };
  }
  throw new Error(`the seeded part ${PART_NUMBER} was not found`);
}

test('upload a run log, map its columns, see the long hold flagged, open the replay, and decide as the lead', async ({ browser }) => {
  test.setTimeout(180_000);
  const engineer = await signedIn(browser, 'tomas.reed');
  const { studyId, partId, params } = await demoStudy(engineer);

  // A run of the study's own cycle whose second hold ran 170 min; a start time of its own keeps it unique.
  const csv = demoRunLogCsv(parseStudy(params), { start: `2026-05-${String(1 + (Date.now() % 28)).padStart(2, '0')}T0${Date.now() % 10}:00:00` });
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'dwellform-run-log-')), 'autoclave-2-job-5120.csv');
  fs.writeFileSync(file, csv);

  await engineer.goto(`/studies/${studyId}/run-logs`);

  // A file broken past the rows the mapping step reads: the server refuses it, naming line and column.
  const brokenRows = ['Time (min),Air (°C),TC1 (°C)'];
  for (let i = 0; i < 400; i++) brokenRows.push(`${i},${20 + i * 0.4},${i === 298 ? 'OPEN' : 19 + i * 0.4}`);
  const broken = path.join(path.dirname(file), 'broken.csv');
  fs.writeFileSync(broken, brokenRows.join('\n'));
  await engineer.getByLabel('Run log file').setInputFiles(broken);
  await engineer.getByRole('button', { name: 'Upload and check' }).click();
  const refusal = engineer.getByTestId('upload-refusal');
  await expect(refusal).toContainText('"OPEN" is not a number');
  await expect(refusal).toContainText('Line 300');
  await expect(refusal).toContainText('Column “TC1 (°C)”');
  await expect(refusal).toContainText('Nothing was stored');

  // A short log whose time column names no unit: allowed, but only after the engineer confirms the warnings.
  const short = path.join(path.dirname(file), 'short.csv');
  fs.writeFileSync(short, ['Elapsed,Air (°C),TC1 (°C)', ...Array.from({ length: 12 }, (_, i) => `${i * 60},${20 + i},${19 + i}`)].join('\n'));
  await engineer.getByLabel('Run log file').setInputFiles(short);
  const warnings = engineer.getByTestId('upload-warnings');
  await expect(warnings).toContainText('“Elapsed” names no unit; it is read as');
  await expect(warnings).toContainText('Only 12 data rows');
  await expect(engineer.getByRole('button', { name: 'Upload and check' })).toBeDisabled();
  await warnings.getByRole('checkbox').check();
  await expect(engineer.getByRole('button', { name: 'Upload and check' })).toBeEnabled();

  await engineer.getByLabel('Run log file').setInputFiles(file);
  await expect(engineer.getByTestId('upload-warnings')).toHaveCount(0);

  // The mapping step proposes every column; the engineer confirms it and renames one thermocouple.
  const mapping = engineer.getByTestId('mapping-step');
  await expect(mapping).toBeVisible();
  await expect(engineer.getByLabel('Role of Timestamp')).toHaveValue('time');
  await expect(engineer.getByLabel('Role of Vessel pressure (psi)')).toHaveValue('pressure');
  await expect(engineer.getByLabel('Unit of Vessel pressure (psi)')).toHaveValue('psi');
  await expect(engineer.getByLabel('Unit of Bag vacuum (inHg)')).toHaveValue('inHg');
  await expect(engineer.getByLabel('Role of Controller step')).toHaveValue('ignore');
  await expect(engineer.getByLabel('Position of TC3 lagging tool-side (°C)')).toHaveValue('tool-side');
  await engineer.getByLabel('Label of TC2 mid (°C)').fill('TC2 mid-plane');
  await engineer.getByRole('button', { name: 'Upload and check' }).click();

  // The run's page: the excursion flagged with its channel and time, nothing wrong with the data itself.
  await engineer.waitForURL(/\/run-logs\/\d+$/, { timeout: 60_000 });
  const runLogUrl = new URL(engineer.url()).pathname;
  await expect(engineer.getByTestId('hygiene-findings')).toContainText('Every channel reads plausibly');
  const excursion = engineer.getByTestId('spec-findings').locator('tr[data-rule="spec.hold-long"]');
  await expect(excursion).toHaveCount(1);
  await expect(excursion).toContainText('Hold ran long');
  await expect(excursion).toContainText('TC3 lagging tool-side');
  await expect(excursion).toContainText(/hold 2 at 180 °C lasted 1[67]\d(\.\d+)? min/);

  // The replay: measured TCs against the prediction at their places and the baseline's prediction.
  await expect(engineer.getByTestId('replay-chart').locator('path[data-series="part:TC2 mid-plane"]')).toHaveCount(1);
  await expect(engineer.getByTestId('replay-chart').locator('path[data-series="replay-tool-side"]')).toHaveCount(1);
  await expect(engineer.getByTestId('replay-chart').locator('path[data-series^="baseline-"]')).toHaveCount(1);
  await expect(engineer.getByTestId('replay-at-tcs')).toContainText('TC2 mid-plane');
  await expect(engineer.getByTestId('baseline-name')).toContainText(/^Baseline: “.+”, revision \d+, part TB-2407$/);
  await expect(engineer.getByTestId('gauge-pressure').locator('path[data-series="pressure"]')).toHaveCount(1);
  await expect(engineer.getByTestId('gauge-vacuum').locator('path[data-series="vacuum"]')).toHaveCount(1);
  await expect(engineer.getByTestId('spec-summary').locator('tr[data-check="hold-time-2"]')).toHaveAttribute('data-pass', 'false');
  await expect(engineer.getByTestId('spec-summary').locator('tr[data-check="hold-time-1"]')).toHaveAttribute('data-pass', 'true');
  await expect(engineer.getByTestId('review-not-allowed')).toContainText('Only a lead');

  // A viewer sees the run but cannot decide, not in the page and not through the API.
  const viewer = await signedIn(browser, 'ines.varga');
  // no upload flow to walk through only to be refused at the end
  await viewer.goto(`/studies/${studyId}/run-logs`);
  await expect(viewer.getByTestId('upload-not-allowed')).toContainText('your role: viewer');
  await expect(viewer.getByTestId('run-log-list')).toBeVisible();
  await expect(viewer.getByTestId('upload-panel')).toHaveCount(0);
  await viewer.goto(runLogUrl);
  await expect(viewer.getByTestId('review-not-allowed')).toContainText('your role: viewer');
  await expect(viewer.getByTestId('review-form')).toHaveCount(0);
  const csrf = ((await (await viewer.request.get('/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
  const refused = await viewer.request.post(`/api${runLogUrl}/review`, {
    headers: { 'X-CSRF-Token': csrf },
    data: { decision: 'scrap', rationale: 'A viewer trying to decide a run they may only read.' },
  });
  expect(refused.status()).toBe(403);

  // The lead decides; the decision is then final and on the printable record with the cautions.
  const lead = await signedIn(browser, 'amara.okafor');
  // the record-to-be is a draft until decided
  await lead.goto(`${runLogUrl}/record`);
  await expect(lead.getByTestId('record-draft')).toContainText('No decision yet — draft');
  await expect(lead.getByTestId('record-mapping')).toContainText('TC2 mid-plane');
  await expect(lead.getByTestId('record-mapping')).toContainText('psi');
  await lead.goto(runLogUrl);
  await lead.getByLabel(/Use as is/).check();
  await lead.getByLabel(/^Rationale/).fill('Hold 2 ran 50 min long at 180 °C. Replay: cure and Tg at every TC at or above the baseline; no new exotherm. Travelling coupons to confirm Tg.');
  // an irreversible step asks first; going back records nothing
  await lead.getByRole('button', { name: 'Record the decision…' }).click();
  await expect(lead.getByTestId('review-confirm')).toContainText('cannot be changed');
  await lead.getByRole('button', { name: 'Go back' }).click();
  await expect(lead.getByTestId('review-confirm')).toHaveCount(0);
  await lead.getByRole('button', { name: 'Record the decision…' }).click();
  await lead.getByRole('button', { name: 'Yes, record it' }).click();
  await expect(lead.getByTestId('review-decision')).toContainText('Use as is');
  await expect(lead.getByTestId('review-decision')).toContainText('Amara Okafor');
  await expect(lead.getByTestId('review-form')).toHaveCount(0);

  await lead.goto(`/parts/${partId}/run-logs`);
  await expect(lead.getByTestId('run-log-list')).toContainText('Decided: Use as is');

  await lead.goto(`${runLogUrl}/record`);
  await expect(lead.getByTestId('record-decision')).toContainText('Use as is');
  await expect(lead.getByTestId('record-draft')).toHaveCount(0);
  await expect(lead.getByTestId('record-spec')).toContainText('Hold ran long');
  await expect(lead.getByTestId('record-cautions')).toContainText('does not replace coupon tests');
  await expect(lead.getByTestId('record-cautions')).toContainText('review board');
});
