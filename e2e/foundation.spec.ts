import { expect, test } from '@playwright/test';

test('home page shows the product, a live database and a value computed in the solver worker', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1, name: 'Dwellform' })).toBeVisible();
  await expect(page.getByRole('main').getByTestId('health')).toContainText('database up');
  // 350 °F = 176.7 °C (exact: (350 − 32) × 5/9 = 176.666…; common practice, no source).
  await expect(page.getByTestId('worker-check')).toContainText('176.7 °C');
});

test('the built bundle ships the solver as a separate module worker', async ({ page }) => {
  const workers: string[] = [];
  page.on('worker', (w) => workers.push(w.url()));
  await page.goto('/');
  await expect(page.getByTestId('worker-check')).toContainText('°C');
  expect(workers.some((url) => /\/assets\/solver\.worker-[\w-]+\.js$/.test(url))).toBe(true);
});

test('an unknown page shows the 404 page inside the app, and unknown API routes answer JSON 404', async ({
  page,
  request,
}) => {
  await page.goto('/no/such/page');
  await expect(page.getByRole('heading', { name: 'No page here' })).toBeVisible();
  const api = await request.get('/api/no-such-route');
  expect(api.status()).toBe(404);
  expect(await api.json()).toHaveProperty('error');
});

test('the page loads no font or script from another origin and breaks no CSP rule', async ({ page, baseURL }) => {
  const foreign: string[] = [];
  const violations: string[] = [];
  page.on('request', (r) => {
    if (!r.url().startsWith(baseURL!) && !r.url().startsWith('data:') && !r.url().startsWith('blob:')) foreign.push(r.url());
  });
  page.on('console', (m) => {
    if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
  });
  await page.goto('/');
  await expect(page.getByTestId('worker-check')).toContainText('°C');
  expect(foreign).toEqual([]);
  expect(violations).toEqual([]);
});
