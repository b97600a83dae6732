// Browser tests: the real renderer build served by the real browser-mode host,
// driven in Debian's headless Chromium (Playwright cannot download its own browser
// here). `npm test` builds the renderer before this runs.
import { defineConfig } from '@playwright/test';
import { mkdirSync, rmSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { CHROMIUM } from './support/require-tool.ts';
import { BROWSER_HOST_FOLDER, BROWSER_UNTITLED_FOLDER, BROWSER_WORKSPACE } from './support/browser-host-folders.ts';

/**
 * Port for the test host; away from the `npm start` default so both can run.
 * STEMLINE_TEST_PORT moves it, so that two checkouts can run their browser tests at once.
 */
const TEST_HOST_PORT = Number(process.env.STEMLINE_TEST_PORT ?? 5742);

/**
 * The browser host's key for this run (electron/browser-access.ts), sent by the test
 * browser in the x-stemline-token header on every request. Made once in the main
 * process; the workers inherit it through the environment.
 */
const RUN_TOKEN = (process.env.STEMLINE_BROWSER_TOKEN ||= randomBytes(32).toString('base64url'));

// The host's workspace and recovery folder start empty on every run. Playwright loads
// this file again in each worker (TEST_WORKER_INDEX set), where nothing is removed.
if (process.env.TEST_WORKER_INDEX === undefined) rmSync(BROWSER_HOST_FOLDER, { recursive: true, force: true });
mkdirSync(BROWSER_WORKSPACE, { recursive: true });
mkdirSync(BROWSER_UNTITLED_FOLDER, { recursive: true });

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
    extraHTTPHeaders: { 'x-stemline-token': RUN_TOKEN },
    headless: true,
    launchOptions: {
      executablePath: CHROMIUM.path,
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
  // The specs start from an empty project, as after "Start a new project from your own
  // scans": this host offers no demo (--no-demo). demo.spec.ts starts its own host with it.
  webServer: {
    command: `npx tsx electron/serve-browser.ts --port ${TEST_HOST_PORT} --workspace "${BROWSER_WORKSPACE}" --untitled-folder "${BROWSER_UNTITLED_FOLDER}" --no-demo`,
    cwd: '..',
    url: `http://127.0.0.1:${TEST_HOST_PORT}/${RUN_TOKEN}/`,
    env: { STEMLINE_BROWSER_TOKEN: RUN_TOKEN },
    reuseExistingServer: false,
    timeout: 30_000,
  },
});
