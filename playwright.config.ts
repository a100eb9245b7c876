import { defineConfig } from '@playwright/test';
import { chromiumLaunchOptions } from './tools/dev/chromium';

// End-to-end tests drive Debian's Chromium (no browser download is possible
// here) against the built app served the way `npm start` serves it, on its
// own port and its own database so a running dev instance is left alone.
const port = Number(process.env.E2E_PORT ?? 5190);
const baseURL = `http://127.0.0.1:${port}`;
// The Vite dev server (proxying /api to the server above) proves the worker
// also loads unbundled, as a developer runs it.
const devPort = Number(process.env.E2E_DEV_PORT ?? 5191);

export default defineConfig({
  testDir: 'e2e',
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 15_000 },
  reporter: 'list',
  use: {
    baseURL,
    trace: 'retain-on-failure',
    launchOptions: chromiumLaunchOptions,
  },
  projects: [
    { name: 'built', use: { browserName: 'chromium' }, testIgnore: /dev-server\.spec\.ts/ },
    {
      name: 'dev-server',
      use: { browserName: 'chromium', baseURL: `http://127.0.0.1:${devPort}` },
      testMatch: /dev-server\.spec\.ts/,
    },
  ],
  webServer: [{
    command: 'npx tsx tools/dev/start.ts --no-build',
    url: `${baseURL}/api/health`,
    timeout: 120_000,
    reuseExistingServer: false,
    stdout: 'pipe',
    stderr: 'pipe',
    env: {
      PORT: String(port),
      DB_NAME: process.env.E2E_DB_NAME ?? 'dwellform_test_e2e',
      NODE_ENV: 'production',
      // Its own fake OAuth and mail ports, next to its own app port, so a dev
      // instance on the default ports is never reused or stopped by the run.
      FAKE_OAUTH_PORT: process.env.FAKE_OAUTH_PORT ?? String(port + 2),
      SMTP_PORT: process.env.SMTP_PORT ?? String(port + 3),
      FAKE_MAIL_HTTP_PORT: process.env.FAKE_MAIL_HTTP_PORT ?? String(port + 4),
    },
  },
  {
    command: `npx vite --port ${devPort} --strictPort`,
    url: `http://127.0.0.1:${devPort}/`,
    timeout: 60_000,
    reuseExistingServer: false,
    env: { PORT: String(port) },
  }],
});
