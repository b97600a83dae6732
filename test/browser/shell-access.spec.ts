// Browser mode as a user meets it: the address `npm start` prints carries the run's
// key as its first path segment, and the whole app works from it with no header
// added; without the key, nothing of the app is served. These run in a browser
// context of their own, without the x-stemline-token header the other specs send.
import { expect, test } from '@playwright/test';

const token = process.env.STEMLINE_BROWSER_TOKEN ?? '';

test.describe('browser mode’s key', () => {
  test('the printed address, key included, opens the app and reaches its host', async ({ browser, baseURL }) => {
    const context = await browser.newContext({ extraHTTPHeaders: {} });
    try {
      const page = await context.newPage();
      await page.goto(new URL(`/${token}/`, baseURL).href);
      await expect(page.getByTestId('host-line')).toContainText('browser mode');
    } finally {
      await context.close();
    }
  });

  test('without the key the page is refused, saying which address to open', async ({ browser, baseURL }) => {
    const context = await browser.newContext({ extraHTTPHeaders: {} });
    try {
      const page = await context.newPage();
      const response = await page.goto(new URL('/', baseURL).href);
      expect(response?.status()).toBe(403);
      await expect(page.locator('body')).toContainText('Open the full address "npm start" printed');
      await expect(page.getByTestId('host-line')).toHaveCount(0);
    } finally {
      await context.close();
    }
  });
});
