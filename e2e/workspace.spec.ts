import { expect, test, type Locator, type Page } from '@playwright/test';

// The seeded demo library (server/db/seed/demo-studies.ts): part TB-2407 holds the study
// "Two-dwell cycle for the 24-ply panel", owned by the lead amara.okafor.
const STUDY_TITLE = 'Two-dwell cycle for the 24-ply panel';

async function signInAs(page: Page, login: string) {
  await page.goto('/api/auth/github?next=/');
  await page.locator(`a[data-login="${login}"]`).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/login') && !url.pathname.startsWith('/api'));
}

/** Press on a handle and move the pointer left by `moves` steps of 8 px, leaving the button down. */
async function dragLeft(page: Page, handle: Locator, moves: number) {
  const box = (await handle.boundingBox())!;
  const x = box.x + box.width / 2;
  const y = box.y + box.height / 2;
  await page.mouse.move(x, y);
  await page.mouse.down();
  for (let i = 1; i <= moves; i++) await page.mouse.move(x - i * 8, y);
}

async function demoStudyId(page: Page): Promise<number> {
  const teams = (await (await page.request.get('/api/teams')).json()) as { id: number }[];
  for (const team of teams) {
    const parts = (await (await page.request.get(`/api/teams/${team.id}/parts`)).json()) as { id: number }[];
    for (const part of parts) {
      const detail = (await (await page.request.get(`/api/parts/${part.id}`)).json()) as { studies: { id: number; title: string }[] };
      const study = detail.studies.find((s) => s.title === STUDY_TITLE);
      if (study) return study.id;
    }
  }
  throw new Error(`the seeded study "${STUDY_TITLE}" was not found`);
}

async function openDemoStudy(page: Page) {
  await signInAs(page, 'amara.okafor');
  const id = await demoStudyId(page);
  await page.goto(`/studies/${id}`);
  await expect(page.getByRole('heading', { level: 1, name: STUDY_TITLE })).toBeVisible();
  await expect(page.getByTestId('final-cure-figure')).toHaveText(/^\d\.\d{3}$/);
}

test('dragging the second dwell’s end with the mouse shortens it and the final cure and warpage follow', async ({ page }) => {
  await openDemoStudy(page);
  const cure = page.getByTestId('final-cure-figure');
  const warpage = page.getByTestId('warpage-figure');
  const cureBefore = await cure.textContent();
  const warpageBefore = await warpage.textContent();

  const handle = page.getByRole('slider', { name: 'Dwell 2 end' });
  const lengthBefore = Number(await handle.getAttribute('aria-valuenow'));
  await dragLeft(page, handle, 20);
  await page.mouse.up();

  const lengthAfter = Number(await handle.getAttribute('aria-valuenow'));
  expect(lengthAfter).toBeLessThan(lengthBefore - 20);
  await expect(page.getByTestId('unsaved-marker')).toHaveText(/unsaved/);
  // A shorter final dwell leaves the laminate less cured; the residual-stress state, and so the warpage, moves with it.
  await expect(cure).not.toHaveText(cureBefore!);
  expect(Number(await cure.textContent())).toBeLessThan(Number(cureBefore));
  await expect(warpage).not.toHaveText(warpageBefore!);
});

test('while a handle is dragged the figures are a marked quick look; once it is let go the full solve is on screen', async ({ page }) => {
  await openDemoStudy(page);
  const accuracy = page.getByTestId('solve-accuracy');
  const keyFigures = page.locator('dl[data-steps]');
  const verdicts = page.getByTestId('limits-verdicts');
  const csv = page.getByRole('button', { name: 'CSV' });
  await expect(accuracy).toHaveAttribute('data-accuracy', 'full');
  await expect(csv).toBeEnabled();

  const handle = page.getByRole('slider', { name: 'Dwell 2 end' });
  await dragLeft(page, handle, 10);

  // Held: a quick look, said so; the verdicts and ply stresses stay on the last full solve and the CSV waits.
  await expect(accuracy).toHaveAttribute('data-accuracy', 'preview');
  await expect(accuracy).toHaveText(/quick look/i);
  await expect(verdicts).toContainText('cycle before this drag');
  await expect(page.getByTestId('ply-stresses')).toContainText('Cycle before this drag');
  await expect(csv).toBeDisabled();
  const previewSteps = Number(await keyFigures.getAttribute('data-steps'));

  await page.mouse.up();
  await expect(accuracy).toHaveAttribute('data-accuracy', 'full');
  await expect(verdicts).not.toContainText('cycle before this drag');
  await expect(page.getByTestId('ply-stresses')).not.toContainText('Cycle before this drag');
  await expect(csv).toBeEnabled();
  // The same study, now solved with the default (finer) time steps.
  const fullSteps = Number(await keyFigures.getAttribute('data-steps'));
  expect(fullSteps).toBeGreaterThan(previewSteps * 1.3);
});

test('an invalid ramp rate is marked with its reason and never reaches the solver', async ({ page }) => {
  await openDemoStudy(page);
  const solves = page.getByTestId('solve-count');
  await expect(solves).not.toHaveText('0');
  // Let the opening solve settle so the count is stable.
  await expect(page.getByTestId('final-cure-figure')).toBeVisible();
  const countBefore = await solves.textContent();
  const cureBefore = await page.getByTestId('final-cure-figure').textContent();

  const rate = page.getByLabel('Ramp 1 rate');
  await rate.fill('25');
  const row = page.getByTestId('segment-row-0');
  // The shared schema allows ramp rates above 0 and up to 20 °C/min.
  await expect(row.getByRole('alert')).toHaveText(/25 °C\/min is out of range: allowed .*≤ 20 °C\/min/);
  await expect(rate).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByTestId('invalid-marker')).toBeVisible();
  await page.waitForTimeout(1500);
  await expect(solves).toHaveText(countBefore!);
  await expect(page.getByTestId('final-cure-figure')).toHaveText(cureBefore!);

  // Back to a valid rate: the solver runs again.
  await rate.fill('1.5');
  await expect(solves).not.toHaveText(countBefore!);
});

test('saving writes a new revision; a save on a stale base says so and offers the newer revision', async ({ page }) => {
  await signInAs(page, 'amara.okafor');
  const sourceId = await demoStudyId(page);
  // Work on a fork so the seeded study other specs read stays as seeded.
  const token = async () => ((await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
  const source = (await (await page.request.get(`/api/studies/${sourceId}`)).json()) as { latestRevisionNumber: number };
  const forkResponse = await page.request.post(`/api/studies/${sourceId}/revisions/${source.latestRevisionNumber}/fork`, {
    headers: { 'X-CSRF-Token': await token() },
    data: { title: `Save check ${Date.now()}` },
  });
  expect(forkResponse.status()).toBe(201);
  const fork = (await forkResponse.json()) as { id: number; title: string };

  await page.goto(`/studies/${fork.id}`);
  await expect(page.getByRole('heading', { level: 1, name: fork.title })).toBeVisible();
  await expect(page.getByTestId('final-cure-figure')).toHaveText(/^\d\.\d{3}$/);
  await expect(page.getByTestId('unsaved-marker')).toHaveText('saved');

  // Lengthen the first dwell by 5 min from the keyboard, then save with a message.
  await page.getByRole('slider', { name: 'Dwell 1 end' }).focus();
  for (let i = 0; i < 5; i++) await page.keyboard.press('ArrowRight');
  await expect(page.getByTestId('unsaved-marker')).toHaveText(/unsaved/);
  await page.getByRole('button', { name: 'Save revision…' }).click();
  await page.getByLabel('What changed and why').fill('First dwell 5 min longer');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByTestId('unsaved-marker')).toHaveText('saved');
  await expect(page.getByText('revision 2', { exact: true })).toBeVisible();
  const saved = (await (await page.request.get(`/api/studies/${fork.id}`)).json()) as {
    latestRevisionNumber: number;
    latest: { message: string; params: { cycle: { segments: { holdMin?: number }[] } } };
  };
  expect(saved.latestRevisionNumber).toBe(2);
  expect(saved.latest.message).toBe('First dwell 5 min longer');

  // Someone else saves revision 3 meanwhile.
  const other = await page.request.post(`/api/studies/${fork.id}/revisions`, {
    headers: { 'X-CSRF-Token': await token() },
    data: { baseRevision: 2, message: 'Saved elsewhere', params: saved.latest.params },
  });
  expect(other.status()).toBe(201);

  await page.getByRole('slider', { name: 'Dwell 1 end' }).focus();
  await page.keyboard.press('ArrowRight');
  await page.getByRole('button', { name: 'Save revision…' }).click();
  await page.getByLabel('What changed and why').fill('One more minute');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  const conflict = page.getByRole('alert').filter({ hasText: 'newer revision' });
  await expect(conflict).toContainText('A newer revision (3) was saved while you were editing');
  await conflict.getByRole('button', { name: 'Open the newer revision (drops your changes)' }).click();
  await expect(page.getByText('revision 3', { exact: true })).toBeVisible();
  await expect(page.getByTestId('unsaved-marker')).toHaveText('saved');
});
