// Proofing and exporting the font in the browser: the demo letters are fitted, the
// proof opened, a word typed — and it is set in the font the host built (the page's
// font set holds that family, loaded, and the word's ink and width differ from the
// fallback type's), at four sizes, with a letter the font lacks listed. A point moved
// in the one-letter editor changes the proof within two seconds. Exporting writes an
// OpenType font into the host's workspace and says where.
import { test, expect, type Page } from '@playwright/test';
import { join } from 'node:path';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { DEMO_CHARACTERS, openFittedDemoSheet } from '../support/demo-sheet.ts';
import { BROWSER_WORKSPACE } from '../support/browser-host-folders.ts';
import { expectAcceptedCffFont } from './exported-font.ts';

const chromium = checkRequirement(CHROMIUM);

/** The proof's promise is to follow an edit within a second; two leave room for this shared two-core machine. */
const PROOF_FOLLOW_LIMIT_MS = 2000;
/** The first build (host build plus the browser's load) on a loaded machine. */
const FIRST_BUILD_WAIT_MS = 10_000;
/** The proof sizes the panel sets, CSS pixels. */
const PROOF_SIZES = ['12', '24', '48', '96'];
/**
 * Least relative difference between the word's width in the proof font and in the
 * fallback type for the test to believe they are different fonts: the demo letters
 * are far from any system sans (a ring, a bar, a chevron), so the widths differ by
 * much more; equal widths within 5% would mean the fallback was used.
 */
const MIN_WIDTH_DIFFERENCE = 0.05;

const proofLine = (page: Page, size: string) => page.locator(`[data-testid="proof-line"][data-size="${size}"]`);

async function openProof(page: Page): Promise<void> {
  await page.getByTestId('proof-toggle').click();
  await expect(page.getByTestId('proof-panel')).toBeVisible();
  await expect(page.getByTestId('proof-state')).toHaveAttribute('data-phase', 'ready', { timeout: FIRST_BUILD_WAIT_MS });
}

/** How `text` renders at 96 px in `family` and in the page's fallback sans: widths and whether the canvas ink differs. */
async function compareWithFallback(page: Page, family: string, text: string) {
  return page.evaluate(
    ({ family, text }) => {
      const draw = (font: string) => {
        const canvas = document.createElement('canvas');
        canvas.width = 400;
        canvas.height = 140;
        const g = canvas.getContext('2d')!;
        g.font = font;
        g.fillText(text, 10, 110);
        return { width: g.measureText(text).width, ink: g.getImageData(0, 0, canvas.width, canvas.height).data };
      };
      const proof = draw(`96px "${family}"`);
      const fallback = draw('96px sans-serif');
      let differing = 0;
      for (let i = 3; i < proof.ink.length; i += 4) if (proof.ink[i] !== fallback.ink[i]) differing++;
      const face = [...document.fonts].find((f) => f.family === family || f.family === `"${family}"`);
      return { proofWidth: proof.width, fallbackWidth: fallback.width, differing, status: face?.status ?? 'absent', check: document.fonts.check(`96px "${family}"`, text) };
    },
    { family, text },
  );
}

test.describe('proofing and exporting the font', () => {
  test.skip(!chromium.available, chromium.message);

  test('sets typed text in the built font at four sizes and lists the letters it does not have', async ({ page }) => {
    await openFittedDemoSheet(page);
    await openProof(page);
    // The first text uses only the letters drawn.
    const first = await page.getByTestId('proof-text').inputValue();
    expect(first.length).toBeGreaterThan(0);
    expect([...first].every((c) => c === ' ' || DEMO_CHARACTERS.includes(c))).toBe(true);
    await expect(page.getByTestId('missing-characters')).toHaveCount(0);

    await page.getByTestId('proof-text').fill('vol lol');
    const lines = page.getByTestId('proof-line');
    await expect(lines).toHaveCount(PROOF_SIZES.length);
    expect(await lines.evaluateAll((ps) => ps.map((p) => p.getAttribute('data-size')))).toEqual(PROOF_SIZES);
    await expect(proofLine(page, '96')).toHaveText('vol lol');
    const family = (await proofLine(page, '96').getAttribute('data-family'))!;
    expect(await proofLine(page, '96').evaluate((p) => getComputedStyle(p).fontFamily)).toContain(family);

    const rendered = await compareWithFallback(page, family, 'vol');
    expect(rendered.status).toBe('loaded');
    expect(rendered.check).toBe(true);
    expect(rendered.differing).toBeGreaterThan(500);
    expect(Math.abs(rendered.proofWidth - rendered.fallbackWidth) / rendered.fallbackWidth).toBeGreaterThan(MIN_WIDTH_DIFFERENCE);
    // The line on screen is as wide as the word set in the proof font, not in the fallback.
    const onScreen = await proofLine(page, '96').locator('span').first().evaluate((s) => s.getBoundingClientRect().width);
    expect(Math.abs(onScreen - (await page.evaluate(({ family }) => {
      const g = document.createElement('canvas').getContext('2d')!;
      g.font = `96px "${family}"`;
      return g.measureText('vol lol').width;
    }, { family })))).toBeLessThan(2);

    await page.getByTestId('proof-text').fill('love vol');
    await expect(page.getByTestId('missing-characters')).toHaveAttribute('data-missing', 'e');
    await expect(page.getByTestId('missing-characters')).toContainText('Not in the font yet: e');
    await expect(page.getByTestId('proof-missing')).toHaveCount(PROOF_SIZES.length);
    await expect(page.getByTestId('proof-missing').first()).toHaveText('e');
    await page.screenshot({ path: 'test-results/proof.png' });
  });

  test('follows a point moved in the one-letter editor within two seconds', async ({ page }) => {
    await openFittedDemoSheet(page);
    await page.getByTestId('letter-thumbnail').filter({ hasText: 'o' }).first().click();
    await expect(page.getByTestId('letter-canvas')).toBeVisible();
    await openProof(page);
    await page.getByTestId('proof-text').fill('olo ovo');
    const line = proofLine(page, '96');
    await expect(line).toHaveText('olo ovo');
    const family = (await line.getAttribute('data-family'))!;
    const before = await line.screenshot();
    // The rendering is steady while nothing changes, so a difference below comes from the edit.
    expect((await line.screenshot()).equals(before)).toBe(true);

    const point = page.getByTestId('on-curve-point').first();
    const box = (await point.boundingBox())!;
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
    await expect(point).toHaveAttribute('data-selected', 'true');
    const x = Number(await point.getAttribute('data-x'));
    for (let i = 0; i < 4; i++) await page.keyboard.press('Shift+ArrowRight');
    await expect(point).toHaveAttribute('data-x', String(x + 40));
    const edited = Date.now();

    await expect.poll(() => line.getAttribute('data-family'), { timeout: PROOF_FOLLOW_LIMIT_MS, intervals: [50] }).not.toBe(family);
    const followedMs = Date.now() - edited;
    test.info().annotations.push({ type: 'proof followed the edit after', description: `${followedMs} ms` });
    expect((await line.screenshot()).equals(before)).toBe(false);
    await page.screenshot({ path: 'test-results/proof-after-edit.png' });

    // Undoing the four nudges puts the letter back, and the proof with it.
    for (let i = 0; i < 4; i++) await page.keyboard.press('Control+z');
    await expect(point).toHaveAttribute('data-x', String(x));
    await expect.poll(async () => (await line.screenshot()).equals(before), { timeout: PROOF_FOLLOW_LIMIT_MS * 2 }).toBe(true);
  });

  test('exports the font into the workspace and says where it went', async ({ page }) => {
    await openFittedDemoSheet(page);
    await openProof(page);
    await page.getByTestId('export-font').click();
    const chooser = page.getByTestId('font-export-chooser');
    await expect(chooser).toBeVisible();
    await expect(chooser.getByLabel('File name')).toHaveValue('Untitled.otf');
    await chooser.getByLabel('File name').fill('demo-proof');
    await chooser.getByRole('button', { name: 'Export', exact: true }).click();
    const path = join(BROWSER_WORKSPACE, 'demo-proof.otf');
    await expect(page.getByTestId('export-status')).toHaveText(`Exported demo-proof.otf to ${path}`);
    expectAcceptedCffFont(path, test.info());

    // Exporting again under the same name says the file was replaced.
    await page.getByTestId('export-font').click();
    await chooser.getByLabel('File name').fill('demo-proof.otf');
    await chooser.getByRole('button', { name: 'Export', exact: true }).click();
    await expect(page.getByTestId('export-status')).toHaveText(`Exported demo-proof.otf to ${path} (it replaced the file of that name)`);
  });
});
