/**
 * How we launch Debian's Chromium for tests and benches: Playwright cannot
 * download a browser here, and without the background-networking flags the
 * browser keeps trying hosts this machine cannot reach.
 */
export const chromiumLaunchOptions = {
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  args: [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-dev-shm-usage',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    '--no-first-run',
    '--disable-quic',
  ],
};
