import { defineConfig } from '@playwright/test';

// Browser tests run in Debian's Chromium (never a downloaded browser) against the built app,
// which each spec starts on a free port with its own temporary database (tests/e2e/fixtures).
export default defineConfig({
  testDir: 'tests/e2e',
  timeout: 90_000,
  // A loaded 2-core machine can take several seconds to open a board; waits are for states, not speed.
  expect: { timeout: 15_000 },
  workers: 1,
  reporter: [['list']],
  use: {
    headless: true,
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
        '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
});
