// The app boots in a real browser against the real host: the user sees Stemline's
// name, the version the host reports, and an empty project — with no script errors.
import { test, expect } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';

const chromium = checkRequirement(CHROMIUM);
const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };

test.describe('app start', () => {
  test.skip(!chromium.available, chromium.message);

  test('opens on an empty project with the product name and the host version', async ({ page }) => {
    const problems: string[] = [];
    page.on('pageerror', (error) => problems.push(error.message));
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(message.text());
    });
    await page.goto('/');
    await expect(page).toHaveTitle('Stemline');
    await expect(page.locator('.wordmark')).toHaveText('Stemline');
    await expect(page.getByTestId('host-line')).toHaveText(`version ${pkg.version} · browser mode`);
    await expect(page.getByRole('heading', { level: 1 })).toHaveText('Untitled project');
    await expect(page.getByTestId('glyph-count')).toHaveText('0');
    await expect(page.getByTestId('units-per-em')).toHaveText('1000');
    await expect(page.getByTestId('empty-note')).toBeVisible();
    expect(problems).toEqual([]);
  });

  test('shows the host’s message when the host stops answering', async ({ page }) => {
    await page.route('**/api/appInfo', (route) => route.abort());
    await page.goto('/');
    await expect(page.getByRole('alert')).toContainText('not answering');
  });
});
