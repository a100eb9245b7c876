import { expect, test } from '@playwright/test';

test('under the Vite dev server the solver worker loads as a module and answers', async ({ page }) => {
  const workers: string[] = [];
  page.on('worker', (w) => workers.push(w.url()));
  await page.goto('/');
  // 350 °F = 176.7 °C (exact conversion; common practice, no source).
  await expect(page.getByTestId('worker-check')).toContainText('176.7 °C');
  expect(workers.some((url) => url.includes('solver.worker.ts'))).toBe(true);
});
