// The sheet's tracing settings on the demo's scan. The automatic level is Otsu's
// (Otsu 1979), computed here independently from the scan's histogram. A grey level
// set by hand finds other letters: near the ink's grey the thin strokes break and
// faint marks vanish (fewer letters, each inside a letter found automatically); near
// the paper's grey all of the page is ink (one letter). The ink a level gives is laid
// over the scan while it is chosen. Going back to the automatic level finds the
// letters it found at first, every box in its place and every character back, and
// undo and redo step between the two settings. A
// higher tolerance refits the letters with fewer on-curve points, and undo puts the
// points back; a slow smooth-mode fit can be stopped, leaving the letters and the fit
// settings as they were. A letter the user edited keeps its outline through a new
// tolerance, and the settings are saved in the project and come back when it opens.
import { test, expect, type Page } from '@playwright/test';
import { join } from 'node:path';
import sharp from 'sharp';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { rmSync } from 'node:fs';
import { DEMO_SHEETS_FOLDER, readDemoManifest } from '../../electron/demo/demo-files.ts';
import { splitCharacters } from '../../core/raster/index.ts';
import { openFittedDemoSheet } from '../support/demo-sheet.ts';
import { BROWSER_WORKSPACE } from '../support/browser-host-folders.ts';
import { loadProject } from '../../electron/io/project/project-file.ts';

const chromium = checkRequirement(CHROMIUM);

/** Tracing the 600-dpi demo sheet and fitting its letters in the page's worker, on a slow shared machine. */
const SHEET_WORK_TIMEOUT_MS = 90_000;
/** Grey levels near the ink's grey (about 20–40 on the demo's scan) and near the paper's (about 235). */
const LEVEL_NEAR_INK = 30;
const LEVEL_NEAR_PAPER = 250;
/** A box found at a lower level lies inside one found at a higher level, give or take the boundary's sub-pixel smoothing. */
const BOX_SLACK_PX = 2;

interface Box { x: number; y: number; width: number; height: number; character: string }

async function letterBoxes(page: Page): Promise<Box[]> {
  return page.getByTestId('letter-box').evaluateAll((groups) =>
    groups.map((g) => {
      const rect = g.querySelector('rect')!;
      const n = (name: string) => Number(rect.getAttribute(name));
      return { x: n('x'), y: n('y'), width: n('width'), height: n('height'), character: g.getAttribute('data-character') ?? '' };
    }),
  );
}

/** Waits until the sheet is neither tracing, correcting nor fitting. */
async function settled(page: Page): Promise<void> {
  await expect(page.getByTestId('sheet-screen')).toHaveAttribute('data-phase', 'traced', { timeout: SHEET_WORK_TIMEOUT_MS });
}

/** Types a value into a settings field and commits it, then waits for the work it starts. */
async function commit(page: Page, testId: string, value: number): Promise<void> {
  const field = page.getByTestId(testId);
  await field.fill(String(value));
  await field.press('Enter');
  await settled(page);
  await expect(field).toHaveValue(String(value));
}

/**
 * Otsu's threshold (Otsu 1979, "A threshold selection method from gray-level
 * histograms"): the level t maximising the between-class variance w0·w1·(μ0 − μ1)²
 * of the classes ≤ t and > t, the first such level on a tie.
 */
async function otsuLevel(file: string): Promise<number> {
  const { data } = await sharp(file).greyscale().raw().toBuffer({ resolveWithObject: true });
  const histogram = new Array<number>(256).fill(0);
  for (const grey of data) histogram[grey]!++;
  let sum = 0;
  histogram.forEach((count, grey) => (sum += grey * count));
  let below = 0;
  let belowSum = 0;
  let best = -1;
  let level = 0;
  for (let t = 0; t < 256; t++) {
    below += histogram[t]!;
    belowSum += t * histogram[t]!;
    const above = data.length - below;
    if (below === 0 || above === 0) continue;
    const variance = below * above * (belowSum / below - (sum - belowSum) / above) ** 2;
    if (variance > best) {
      best = variance;
      level = t;
    }
  }
  return level;
}

test.describe('tracing settings on the sheet', () => {
  test.skip(!chromium.available, chromium.message);
  test.setTimeout(5 * SHEET_WORK_TIMEOUT_MS);

  test('a grey level finds other letters, the automatic level finds them again, and a higher tolerance fits fewer points', async ({ page }) => {
    const manifest = await readDemoManifest();
    const sheet = manifest.sheets[0]!;
    const scanFile = join(DEMO_SHEETS_FOLDER, sheet.png);
    const characters = splitCharacters(sheet.characters);
    const problems: string[] = [];
    page.on('pageerror', (error) => problems.push(error.message));
    await page.goto('/');
    const chooser = page.waitForEvent('filechooser');
    await page.getByRole('button', { name: 'Open a scan…' }).click();
    await (await chooser).setFiles(scanFile);
    await expect(page.getByTestId('letter-count')).toHaveText(`${characters.length} letters in 5 rows`, { timeout: SHEET_WORK_TIMEOUT_MS });
    await page.getByLabel('Characters on the sheet, in reading order').fill(sheet.characters);
    await page.getByRole('button', { name: 'Assign', exact: true }).click();
    await expect(page.getByTestId('assigned-count')).toHaveText(`${characters.length} of ${characters.length} letters assigned`);
    const automatic = await letterBoxes(page);

    // Otsu 1979: the level the panel reports is the one Otsu's criterion picks on the scan's histogram.
    const otsu = await otsuLevel(scanFile);
    await expect(page.getByTestId('tracing-settings')).toContainText(`the automatic level (Otsu's method): grey ≤ ${otsu}`);

    await test.step('near the ink\'s grey, strokes thin out and break: fewer letters, each inside one found automatically', async () => {
      await page.getByTestId('threshold-level').check();
      await settled(page);
      await commit(page, 'threshold-level-value', LEVEL_NEAR_INK);
      const thin = await letterBoxes(page);
      expect(thin.length).toBeLessThan(automatic.length);
      for (const box of thin) {
        const inside = automatic.some((a) => box.x >= a.x - BOX_SLACK_PX && box.y >= a.y - BOX_SLACK_PX && box.x + box.width <= a.x + a.width + BOX_SLACK_PX && box.y + box.height <= a.y + a.height + BOX_SLACK_PX);
        expect(inside, `the letter at ${box.x},${box.y} lies inside a letter found at Otsu's level`).toBe(true);
      }
      await expect(page.getByTestId('settings-notice')).toContainText('These settings find other letters');
    });

    await test.step('near the paper\'s grey, the whole page is ink: one letter', async () => {
      await commit(page, 'threshold-level-value', LEVEL_NEAR_PAPER);
      await expect(page.getByTestId('letter-count')).toHaveText('1 letters in 1 row');
    });

    await test.step('the ink a level gives is laid over the scan while the level is dragged', async () => {
      const slider = page.getByTestId('threshold-slider');
      await slider.fill('60');
      await expect(page.getByTestId('ink-preview')).toBeVisible({ timeout: SHEET_WORK_TIMEOUT_MS });
      await expect(page.getByTestId('ink-share')).toContainText('at grey ≤ 60');
      const share = async () => Number(/^([\d.]+) %/.exec((await page.getByTestId('ink-share').textContent()) ?? '')?.[1]);
      const at60 = await share();
      await slider.fill('200');
      await expect(page.getByTestId('ink-share')).toContainText('at grey ≤ 200', { timeout: SHEET_WORK_TIMEOUT_MS });
      expect(await share()).toBeGreaterThan(at60);
      await settled(page);
    });

    await test.step('the automatic level finds the same letters again, with their characters', async () => {
      await page.getByTestId('threshold-otsu').check();
      await settled(page);
      await expect(page.getByTestId('letter-count')).toHaveText(`${characters.length} letters in 5 rows`);
      expect(await letterBoxes(page)).toEqual(automatic);
      await expect(page.getByTestId('assigned-count')).toHaveText(`${characters.length} of ${characters.length} letters assigned`);
    });

    await test.step('undo takes the scan setting back to the level last set, and redo returns to the automatic level', async () => {
      await page.getByRole('button', { name: 'Undo settings' }).click();
      await settled(page);
      await expect(page.getByTestId('threshold-level')).toBeChecked();
      await expect(page.getByTestId('threshold-level-value')).toHaveValue('200');
      await expect(page.getByTestId('assigned-count')).toHaveText(`${characters.length} of ${characters.length} letters assigned`);
      await page.getByRole('button', { name: 'Redo settings' }).click();
      await settled(page);
      await expect(page.getByTestId('threshold-otsu')).toBeChecked();
      expect(await letterBoxes(page)).toEqual(automatic);
    });

    await page.getByTestId('show-ink').uncheck();
    await expect(page.getByTestId('ink-preview')).toHaveCount(0);
    await page.getByRole('button', { name: 'Fit the assigned letters' }).click();
    await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible({ timeout: SHEET_WORK_TIMEOUT_MS });
    await page.getByRole('button', { name: '← Sheet' }).click();
    const summary = page.getByTestId('fit-summary');
    await expect(summary).toHaveAttribute('data-letters', String(characters.length));
    const points = async () => Number(await summary.getAttribute('data-on-curve'));
    const atDefault = await points();

    await test.step('a higher tolerance fits the letters again with fewer on-curve points, and undo puts them back', async () => {
      await commit(page, 'fit-tolerance', 6);
      await expect.poll(points, { timeout: SHEET_WORK_TIMEOUT_MS }).toBeLessThan(atDefault);
      await page.getByRole('button', { name: 'Undo settings' }).click();
      await settled(page);
      await expect(page.getByTestId('fit-tolerance')).toHaveValue('1.5');
      await expect.poll(points, { timeout: SHEET_WORK_TIMEOUT_MS }).toBe(atDefault);
    });

    await test.step('a smooth-mode fit can be stopped, and the letters stay as they were', async () => {
      await page.getByTestId('fit-mode').selectOption('smooth');
      await expect(page.getByTestId('stop-fitting')).toBeVisible();
      await page.getByTestId('stop-fitting').click();
      await settled(page);
      await expect(page.getByTestId('scan-problem')).toContainText('Fitting stopped after');
      await expect(page.getByTestId('scan-problem')).toContainText('The fit settings are back as they were.');
      await expect(page.getByTestId('fit-mode')).toHaveValue('economy');
      expect(await points()).toBe(atDefault);
    });
    expect(problems).toEqual([]);
  });

  test('a letter the user edited keeps its outline through a new tolerance, and the settings come back with the project', async ({ page }) => {
    const name = 'tracing-settings';
    const file = join(BROWSER_WORKSPACE, `${name}.stemline`);
    for (const f of [file, join(BROWSER_WORKSPACE, `.${name}.stemline.recovery`)]) rmSync(f, { force: true });
    await openFittedDemoSheet(page);
    const firstPoint = page.getByTestId('on-curve-point').first();
    await page.getByTestId('letter-thumbnail').filter({ hasText: 'o' }).first().click();
    const box = (await firstPoint.boundingBox())!;
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
    const before = Number(await firstPoint.getAttribute('data-x'));
    for (let i = 0; i < 5; i++) await page.keyboard.press('ArrowRight');
    await expect(firstPoint).toHaveAttribute('data-x', String(before + 5));
    await page.getByRole('button', { name: /^←/ }).first().click();
    await page.getByRole('button', { name: '← Sheet' }).click();

    await commit(page, 'fit-tolerance', 4);
    await expect(page.getByTestId('fit-summary')).toContainText('1 letter you edited kept its outline');
    await commit(page, 'threshold-level-value', 100);
    await expect(page.getByTestId('threshold-level')).toBeChecked();
    await expect(page.getByTestId('letter-count')).toHaveText('3 letters in 1 row');
    await expect(page.getByTestId('assigned-count')).toHaveText('3 of 3 letters assigned');

    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByTestId('project-chooser').getByLabel('File name').fill(name);
    await page.getByTestId('project-chooser').getByRole('button', { name: 'Save', exact: true }).click();
    await expect(page.getByTestId('project-status')).toHaveText(`Saved ${name}.stemline`);
    const saved = await loadProject(file);
    expect(saved.scans[0]?.threshold).toBe(100);
    expect(saved.fit.tolerance).toBe(4);

    await page.reload();
    await page.getByRole('button', { name: 'Open…' }).click();
    await page.getByTestId('project-chooser').getByTestId('project-choice').filter({ hasText: `${name}.stemline` }).click();
    await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
    await page.getByTestId('letter-thumbnail').filter({ hasText: 'o' }).first().click();
    await expect(firstPoint).toHaveAttribute('data-x', String(before + 5));
    await page.getByRole('button', { name: /^←/ }).first().click();
    await page.getByRole('button', { name: '← Sheet' }).click();
    await expect(page.getByTestId('threshold-level')).toBeChecked();
    await expect(page.getByTestId('threshold-level-value')).toHaveValue('100');
    await expect(page.getByTestId('fit-tolerance')).toHaveValue('4');
    for (const f of [file, join(BROWSER_WORKSPACE, `.${name}.stemline.recovery`)]) rmSync(f, { force: true });
  });
});
