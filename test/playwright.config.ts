// Browser tests: the real renderer build served by the real browser-mode host,
// driven in Debian's headless Chromium (Playwright cannot download its own browser
// here). `npm test` builds the renderer before this runs.
import { defineConfig } from '@playwright/test';
import { CHROMIUM } from './support/require-tool.ts';

/** Port for the test host; away from the `npm start` default so both can run. */
const TEST_HOST_PORT = 5742;

export default defineConfig({
  testDir: './browser',
  testMatch: '**/*.spec.ts',
  outputDir: '../test-results/browser-artifacts',
  fullyParallel: false,
  workers: 1,
  timeout: 30_000,
  reporter: [['list'], ['junit', { outputFile: '../test-results/browser-junit.xml' }]],
  use: {
    baseURL: `http://127.0.0.1:${TEST_HOST_PORT}/`,
    headless: true,
    launchOptions: {
      executablePath: CHROMIUM.path,
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
  webServer: {
    command: `npx tsx electron/serve-browser.ts --port ${TEST_HOST_PORT}`,
    cwd: '..',
    url: `http://127.0.0.1:${TEST_HOST_PORT}/`,
    reuseExistingServer: false,
    timeout: 30_000,
  },
});
