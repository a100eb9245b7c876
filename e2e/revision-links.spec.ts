import { expect, test } from '@playwright/test';

// A link names one revision of a study: the history page offers it for every revision, and an earlier
// revision opens in the workspace read-only. Demo data: server/db/seed/demo-studies.ts.
const LEAD_STUDY = 'Two-dwell cycle for the 24-ply panel';

test('the history links each revision; an earlier one opens read-only with the way back to the latest', async ({ page }) => {
  test.setTimeout(60_000);
  await page.goto('/sign-in?next=/team');
  await page.getByRole('link', { name: 'Continue to sign-in' }).click();
  await page.locator('a[data-login="tomas.reed"]').click();
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  await page.waitForURL(/\/teams\/\d+$/);
  await page.getByRole('link', { name: /TB-2407/ }).first().click();
  await page.getByRole('link', { name: LEAD_STUDY }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: LEAD_STUDY })).toBeVisible();
  const studyId = page.url().match(/\/studies\/(\d+)\/history$/)![1];

  const r2 = page.getByTestId('revision-2');
  await expect(r2.getByRole('link', { name: 'Compare with r1' })).toHaveAttribute('href', `/compare?a=s${studyId}r1&b=s${studyId}r2`);
  await expect(r2.getByRole('link', { name: 'Report' })).toHaveAttribute('href', `/report?r=s${studyId}r2`);
  await expect(page.getByTestId('revision-1').getByRole('link', { name: 'Compare with r0' })).toHaveCount(0);

  await page.getByTestId('revision-1').getByRole('link', { name: 'Open r1' }).click();
  await page.waitForURL(new RegExp(`/studies/${studyId}\\?r=1$`));
  await expect(page.getByTestId('revision-banner')).toContainText(/Revision 1 of \d+ — read only/);
  await expect(page.getByRole('button', { name: 'Restore as new revision' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Save revision…' })).toBeDisabled();
  // an arrow key on a handle changes nothing here, and says why
  await page.getByRole('slider', { name: 'Dwell 1 end' }).press('ArrowRight');
  await expect(page.getByTestId('cycle-refusal')).toContainText('read only');
  await expect(page.getByTestId('unsaved-marker')).toHaveText('saved');

  await page.getByRole('link', { name: /Open latest/ }).click();
  await page.waitForURL(new RegExp(`/studies/${studyId}$`));
  await expect(page.getByTestId('workspace')).toBeVisible();
  await expect(page.getByTestId('revision-banner')).toHaveCount(0);
});
