// Font heights in the browser: on the one-letter screen the designer types an
// x-height over the measured one and the x-height guide moves there; a descender above
// the baseline is refused with a message and nothing changes; undo brings the
// measured value back. A typed ascender reaches the proof font (the browser reads the
// new ascent from it), and after saving, reloading the page and opening the project
// again the typed values are still there, marked as typed.
import { test, expect, type Page } from '@playwright/test';
import { join } from 'node:path';
import { rmSync } from 'node:fs';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { openFittedDemoSheet } from '../support/demo-sheet.ts';
import { BROWSER_WORKSPACE } from '../support/browser-host-folders.ts';
import { loadProject } from '../../electron/io/project/project-file.ts';

const chromium = checkRequirement(CHROMIUM);

/** The first build (host build plus the browser's load) on a loaded machine (as proof.spec.ts). */
const FIRST_BUILD_WAIT_MS = 10_000;
/** How far the test raises the x-height, units: far enough that the guide must move several pixels at the whole-letter zoom. */
const X_HEIGHT_RAISE = 40;

const field = (page: Page, name: string) => page.getByTestId(`font-height-${name}`);
const guide = (page: Page, name: string) => page.locator(`[data-testid="guide"][data-guide="${name}"]`);

async function openLetterO(page: Page): Promise<void> {
  await page.getByTestId('letter-thumbnail').filter({ hasText: 'o' }).first().click();
  await expect(page.getByTestId('letter-canvas')).toBeVisible();
}

async function typeMetric(page: Page, name: string, value: number): Promise<void> {
  await field(page, name).fill(String(value));
  await field(page, name).press('Enter');
}

/**
 * The ascent the browser reads from the proof font, in CSS pixels at a font size of
 * `size` px: TextMetrics.fontBoundingBoxAscent (HTML Living Standard, canvas text
 * metrics), which comes from the font's own ascender.
 */
async function proofAscent(page: Page, size: number): Promise<number> {
  const family = await page.getByTestId('proof-line').first().getAttribute('data-family');
  return page.evaluate(({ family, size }) => {
    const g = document.createElement('canvas').getContext('2d')!;
    g.font = `${size}px "${family}"`;
    return g.measureText('o').fontBoundingBoxAscent;
  }, { family, size });
}

test.describe('font heights in the browser', () => {
  test.skip(!chromium.available, chromium.message);

  test('a typed x-height moves the guide, a descender above the baseline is refused, undo brings the measured one back', async ({ page }) => {
    await openFittedDemoSheet(page);
    await openLetterO(page);
    const measured = Number(await field(page, 'xHeight').inputValue());
    await expect(guide(page, 'x-height')).toHaveAttribute('data-units', String(measured));
    const yBefore = Number(await guide(page, 'x-height').getAttribute('y1'));

    await typeMetric(page, 'xHeight', measured + X_HEIGHT_RAISE);
    await expect(guide(page, 'x-height')).toHaveAttribute('data-units', String(measured + X_HEIGHT_RAISE));
    // Screen y grows downward: a higher x-height is drawn higher up.
    expect(Number(await guide(page, 'x-height').getAttribute('y1'))).toBeLessThan(yBefore - 1);
    await expect(field(page, 'xHeight')).toHaveAttribute('data-overridden', 'true');
    await expect(page.getByRole('button', { name: `Use the measured x-height, ${measured}` })).toHaveText(`↺ ${measured}`);
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');
    await page.screenshot({ path: 'test-results/font-heights.png' });

    const descender = await field(page, 'descender').inputValue();
    await typeMetric(page, 'descender', 30);
    await expect(page.getByTestId('font-heights-problem')).toHaveText('The descender is 30; it must be at or below the baseline. Type 0 or a negative number.');
    await expect(field(page, 'descender')).toHaveValue(descender);
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');

    await page.getByTestId('undo').click();
    await expect(guide(page, 'x-height')).toHaveAttribute('data-units', String(measured));
    await expect(field(page, 'xHeight')).toHaveValue(String(measured));
    await expect(field(page, 'xHeight')).toHaveAttribute('data-overridden', 'false');
    expect(Number(await guide(page, 'x-height').getAttribute('y1'))).toBeCloseTo(yBefore, 5);

    // Typed again, then given back its measured value with the button beside it: a step of its own.
    await typeMetric(page, 'xHeight', measured + X_HEIGHT_RAISE);
    await page.getByTestId('font-height-measured-xHeight').click();
    await expect(guide(page, 'x-height')).toHaveAttribute('data-units', String(measured));
    await expect(field(page, 'xHeight')).toHaveAttribute('data-overridden', 'false');
    await expect(page.getByTestId('undo-steps')).toHaveText('2 edits to undo');
  });

  test('a typed ascender reaches the proof font', async ({ page }) => {
    await openFittedDemoSheet(page);
    await openLetterO(page);
    await page.getByTestId('proof-toggle').click();
    await expect(page.getByTestId('proof-state')).toHaveAttribute('data-phase', 'ready', { timeout: FIRST_BUILD_WAIT_MS });
    const unitsPerEm = Number(await field(page, 'unitsPerEm').inputValue());
    const measured = Number(await field(page, 'ascender').inputValue());
    // At a font size of one em in pixels, one unit is one pixel.
    expect(Math.abs((await proofAscent(page, unitsPerEm)) - measured)).toBeLessThanOrEqual(1);

    const builds = Number(await page.getByTestId('proof-state').getAttribute('data-builds'));
    const typed = measured + 250;
    await typeMetric(page, 'ascender', typed);
    await expect.poll(async () => Number(await page.getByTestId('proof-state').getAttribute('data-builds')), { timeout: FIRST_BUILD_WAIT_MS }).toBeGreaterThan(builds);
    await expect(page.getByTestId('proof-state')).toHaveAttribute('data-phase', 'ready');
    await expect.poll(() => proofAscent(page, unitsPerEm)).toBeGreaterThanOrEqual(typed - 1);
    expect(await proofAscent(page, unitsPerEm)).toBeLessThanOrEqual(typed + 1);
  });

  test('typed heights are saved with the project and are there, marked as typed, after a reload', async ({ page }) => {
    const name = 'typed-heights';
    rmSync(join(BROWSER_WORKSPACE, `${name}.stemline`), { force: true });
    await openFittedDemoSheet(page);
    await openLetterO(page);
    const xHeight = Number(await field(page, 'xHeight').inputValue()) + X_HEIGHT_RAISE;
    await typeMetric(page, 'xHeight', xHeight);
    await typeMetric(page, 'lineGap', 0);
    await expect(guide(page, 'x-height')).toHaveAttribute('data-units', String(xHeight));

    await page.getByRole('button', { name: 'Save', exact: true }).click();
    const chooser = page.getByTestId('project-chooser');
    await chooser.getByLabel('File name').fill(name);
    await chooser.getByRole('button', { name: 'Save', exact: true }).click();
    await expect(page.getByTestId('project-status')).toHaveText(`Saved ${name}.stemline`);
    const saved = await loadProject(join(BROWSER_WORKSPACE, `${name}.stemline`));
    expect(saved.font).toMatchObject({ xHeight, lineGap: 0, metricsSetByUser: ['xHeight', 'lineGap'] });

    await page.reload();
    await page.getByRole('button', { name: 'Open…' }).click();
    await page.getByTestId('project-chooser').getByTestId('project-choice').filter({ hasText: `${name}.stemline` }).click();
    await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
    await openLetterO(page);
    await expect(field(page, 'xHeight')).toHaveValue(String(xHeight));
    await expect(field(page, 'xHeight')).toHaveAttribute('data-overridden', 'true');
    await expect(field(page, 'lineGap')).toHaveValue('0');
    await expect(field(page, 'ascender')).toHaveAttribute('data-overridden', 'false');
    await expect(guide(page, 'x-height')).toHaveAttribute('data-units', String(xHeight));
    rmSync(join(BROWSER_WORKSPACE, `${name}.stemline`), { force: true });
  });
});
