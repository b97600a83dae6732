// Correcting a sheet in the browser, the real UI against the real handlers: a scan
// whose segmentation is off in the usual ways — the dot of an i drawn too far above
// its stem (two boxes), two letters whose ink touches (one box), an apostrophe set so
// tight to a letter that it was taken for its accent (one box) — is opened; the user
// merges the i, cuts the touching pair and traces each side again, splits the
// apostrophe off by its pieces, assigns the characters, retypes one letter, and drags
// the x-height guide up. The fitted font's
// x-height is the one dragged to, the corrections are saved with the project, and
// reopening it shows the same letters and guide.
import { test, expect, type Page } from '@playwright/test';
import { createCanvas } from '@napi-rs/canvas';
import sharp from 'sharp';
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { BROWSER_WORKSPACE } from '../support/browser-host-folders.ts';
import { loadProject } from '../../electron/io/project/project-file.ts';
import { DEFAULT_CAP_HEIGHT_UNITS } from '../../core/metrics/index.ts';

const chromium = checkRequirement(CHROMIUM);

const WIDTH = 600;
const HEIGHT = 300;
/** Where the letters stand, and their heights, in scan pixels. */
const BASELINE = 160;
const CAP_HEIGHT_PX = 100;
const X_HEIGHT_PX = 60;
/** How far the x-height guide is dragged up, in scan pixels. */
const X_HEIGHT_RAISE_PX = 10;
/** The drag lands within this of where it was aimed (the pointer moves in whole screen pixels; guides snap to half pixels). */
const DRAG_TOLERANCE_PX = 1.5;

/**
 * One row, drawn by Skia (@napi-rs/canvas) on grey paper at 300 dpi, in reading order:
 * an H (flat top at the cap height), an x (flat top at the x-height), the dot of an i
 * 64 px above its stem (more than half a letter height: the segmentation keeps it
 * apart), the stem, two stems joined by a bridge at x 280–300 (touching letters), and
 * a stem with a mark 4 px above its top, overlapping it by 4 px (taken as its accent).
 */
async function sheetPng(): Promise<Buffer> {
  const canvas = createCanvas(WIDTH, HEIGHT);
  const g = canvas.getContext('2d');
  g.fillStyle = '#f2f0ea';
  g.fillRect(0, 0, WIDTH, HEIGHT);
  g.fillStyle = '#1a1a1a';
  g.fillRect(40, BASELINE - CAP_HEIGHT_PX, 60, CAP_HEIGHT_PX);
  g.fillRect(130, BASELINE - X_HEIGHT_PX, 50, X_HEIGHT_PX);
  g.fillRect(210, 20, 16, 16);
  g.fillRect(210, BASELINE - X_HEIGHT_PX, 16, X_HEIGHT_PX);
  g.fillRect(260, BASELINE - CAP_HEIGHT_PX, 20, CAP_HEIGHT_PX);
  g.fillRect(300, BASELINE - CAP_HEIGHT_PX, 20, CAP_HEIGHT_PX);
  g.fillRect(280, 140, 20, 10);
  g.fillRect(360, BASELINE - CAP_HEIGHT_PX, 16, CAP_HEIGHT_PX);
  g.fillRect(372, 40, 12, 16);
  const rgba = g.getImageData(0, 0, WIDTH, HEIGHT).data;
  const grey = Buffer.alloc(WIDTH * HEIGHT);
  for (let i = 0; i < grey.length; i++) grey[i] = rgba[i * 4] ?? 255;
  return sharp(grey, { raw: { width: WIDTH, height: HEIGHT, channels: 1 } }).png().withMetadata({ density: 300 }).toBuffer();
}

/** The screen point of scan pixel (x, y) on the sheet. */
async function screenPoint(page: Page, x: number, y: number): Promise<{ x: number; y: number }> {
  return page.getByTestId('sheet').evaluate((svg, [px, py]) => {
    const point = new DOMPoint(px, py).matrixTransform((svg as SVGSVGElement).getScreenCTM()!);
    return { x: point.x, y: point.y };
  }, [x, y] as const);
}

const characters = (page: Page) => page.getByTestId('letter-box').evaluateAll((boxes) => boxes.map((b) => b.getAttribute('data-character')));

/**
 * Clicks letter box `index` three quarters of the way down (clear of the guides, which
 * take the pointer within a few pixels of their lines), with shift held when `adding`.
 */
async function clickBox(page: Page, index: number, adding = false): Promise<void> {
  const rect = (await page.getByTestId('letter-box').nth(index).locator('rect').boundingBox())!;
  if (adding) await page.keyboard.down('Shift');
  await page.mouse.click(rect.x + rect.width / 2, rect.y + rect.height * 0.75);
  if (adding) await page.keyboard.up('Shift');
}

test.describe('correcting the letters and guides of a sheet', () => {
  test.skip(!chromium.available, chromium.message);

  test('opens a scan dropped onto the project screen, and typing over the boxes retypes them one by one', async ({ page }) => {
    await page.goto('/');
    const bytes = [...(await sheetPng())];
    const transfer = await page.evaluateHandle((data) => {
      const dt = new DataTransfer();
      dt.items.add(new File([new Uint8Array(data)], 'row.png', { type: 'image/png' }));
      return dt;
    }, bytes);
    await page.getByTestId('project-overview').dispatchEvent('dragover', { dataTransfer: transfer });
    await page.getByTestId('project-overview').dispatchEvent('drop', { dataTransfer: transfer });
    await expect(page.getByTestId('letter-count')).toHaveText('6 letters in 1 row');

    // Typing over the selected box retypes it and moves on: three keys, three letters, in order.
    await clickBox(page, 0);
    await page.keyboard.type('Hxi');
    const boxes = page.getByTestId('letter-box');
    await expect(boxes.nth(2)).toHaveAttribute('data-character', 'i');
    expect(await characters(page)).toEqual(['H', 'x', 'i', '', '', '']);
    await expect(boxes.nth(3)).toHaveAttribute('data-selected', 'true');
    await page.keyboard.press('ArrowLeft');
    await expect(boxes.nth(2)).toHaveAttribute('data-selected', 'true');
  });

  test('merges, cuts, splits, retypes and moves the x-height; the fit uses the guide, and the project keeps it all', async ({ page }) => {
    const name = 'corrected-sheet';
    const file = join(BROWSER_WORKSPACE, `${name}.stemline`);
    rmSync(file, { force: true });
    await page.goto('/');
    await page.getByTestId('scan-file').setInputFiles({ name: 'row.png', mimeType: 'image/png', buffer: await sheetPng() });
    await expect(page.getByTestId('letter-count')).toHaveText('6 letters in 1 row');
    const boxes = page.getByTestId('letter-box');

    // Merge: the stem (#3) and its dot (#4, found as a letter of its own) become one "i".
    await clickBox(page, 2);
    await clickBox(page, 3, true);
    await expect(boxes.nth(2)).toHaveAttribute('data-selected', 'true');
    await expect(boxes.nth(3)).toHaveAttribute('data-selected', 'true');
    await page.getByRole('button', { name: 'Merge 2 letters' }).click();
    await expect(page.getByTestId('letter-count')).toHaveText('5 letters in 1 row');
    const i = (await boxes.nth(2).locator('rect').evaluate((r) => ['x', 'y', 'width', 'height'].map((a) => Number(r.getAttribute(a)))));
    expect(i[0]).toBeCloseTo(210, 0);
    expect(i[1]).toBeCloseTo(20, 0);
    expect(i[3]).toBeCloseTo(BASELINE - 20, 0);

    // Cut: the touching pair (#4) along x = 290, through the bridge; each side is traced again.
    await clickBox(page, 3);
    await page.getByRole('button', { name: 'Split or cut…' }).click();
    await expect(page.getByTestId('split-piece')).toHaveCount(1);
    await expect(page.getByRole('button', { name: 'Split between pieces' })).toBeDisabled();
    const cutAt = await screenPoint(page, 290, BASELINE - 40);
    await page.mouse.click(cutAt.x, cutAt.y);
    await expect(page.getByTestId('split-at')).toContainText('through the ink of 1');
    await page.getByRole('button', { name: 'Cut the ink here' }).click();
    await expect(page.getByTestId('letter-count')).toHaveText('6 letters in 1 row');
    const halves = await boxes.evaluateAll((gs) => gs.slice(3, 5).map((g) => { const r = g.querySelector('rect')!; return [Number(r.getAttribute('x')), Number(r.getAttribute('width'))]; }));
    // Left half: the stem and half the bridge, to the cut; right half from the cut (marching squares places the cut edge at the pixel edge, ± the half-pixel iso interpolation).
    expect(halves[0]![0]).toBeCloseTo(260, 0);
    expect(Math.abs(halves[0]![0]! + halves[0]![1]! - 290)).toBeLessThan(0.6);
    expect(Math.abs(halves[1]![0]! - 290)).toBeLessThan(0.6);

    // Split: the apostrophe off the last stem, by pieces, with the line between their centres (they overlap: no clean gap).
    await clickBox(page, 5);
    await page.getByRole('button', { name: 'Split or cut…' }).click();
    await expect(page.getByTestId('split-piece')).toHaveCount(2);
    await expect(page.getByTestId('split-gap')).toHaveCount(0);
    const splitAt = await screenPoint(page, 373, BASELINE - 20);
    await page.mouse.click(splitAt.x, splitAt.y);
    await expect(page.getByTestId('split-at')).toContainText('1 of 2 pieces left of it');
    await expect(page.getByTestId('split-piece').first()).toHaveAttribute('data-side', 'left');
    await expect(page.getByTestId('split-piece').last()).toHaveAttribute('data-side', 'right');
    await page.getByRole('button', { name: 'Split between pieces' }).click();
    await expect(page.getByTestId('letter-count')).toHaveText('7 letters in 1 row');
    const parts = await boxes.evaluateAll((gs) => gs.slice(5).map((g) => { const r = g.querySelector('rect')!; return ['x', 'y', 'width', 'height'].map((a) => Math.round(Number(r.getAttribute(a)))); }));
    expect(parts).toEqual([[360, BASELINE - CAP_HEIGHT_PX, 16, CAP_HEIGHT_PX], [372, 40, 12, 16]]);

    // Assign all, then retype one letter alone.
    await page.getByLabel('Characters on the sheet, in reading order').fill("Hxiltd'");
    await page.getByRole('button', { name: 'Assign' }).click();
    await expect(page.getByTestId('assigned-count')).toHaveText('7 of 7 letters assigned');
    await clickBox(page, 4);
    await page.getByLabel('Character of letter #5').fill('k');
    await page.getByRole('button', { name: 'Retype' }).click();
    await expect(boxes.nth(4)).toHaveAttribute('data-character', 'k');
    expect(await characters(page)).toEqual(['H', 'x', 'i', 'l', 'k', 'd', "'"]);
    // Undo and redo the retype from the keyboard.
    await page.getByTestId('sheet').click({ position: { x: 5, y: 5 } });
    await page.keyboard.press('Control+z');
    await expect(boxes.nth(4)).toHaveAttribute('data-character', 't');
    await page.keyboard.press('Control+Shift+z');
    await expect(boxes.nth(4)).toHaveAttribute('data-character', 'k');

    // The guides as measured: cap height on the H, x-height on the x.
    await expect(page.getByTestId('cap-height-source')).toHaveText('measured on H');
    await expect(page.getByTestId('x-height-source')).toHaveText('measured on x');
    const capPx = Number(await page.getByTestId('cap-height-pixels').inputValue());
    expect(capPx).toBeCloseTo(CAP_HEIGHT_PX, 0);
    expect(Number(await page.getByTestId('x-height-pixels').inputValue())).toBeCloseTo(X_HEIGHT_PX, 0);

    // Drag the x-height up by 10 px, grabbing it to the right of the letters.
    const from = await screenPoint(page, 520, BASELINE - X_HEIGHT_PX);
    const to = await screenPoint(page, 520, BASELINE - X_HEIGHT_PX - X_HEIGHT_RAISE_PX);
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move(to.x, (from.y + to.y) / 2, { steps: 3 });
    await page.mouse.move(to.x, to.y, { steps: 3 });
    await page.mouse.up();
    await expect(page.getByTestId('x-height-source')).toHaveText('set by hand');
    const xPx = Number(await page.getByTestId('x-height-pixels').inputValue());
    expect(Math.abs(xPx - (X_HEIGHT_PX + X_HEIGHT_RAISE_PX))).toBeLessThan(DRAG_TOLERANCE_PX);
    await expect(page.getByTestId('guide-x-height')).toHaveAttribute('data-from', 'set');

    // Fit, save, and read what the host wrote.
    await page.getByRole('button', { name: 'Fit the assigned letters' }).click();
    await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
    await expect(page.getByTestId('letter-thumbnail')).toHaveCount(7);
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    const chooser = page.getByTestId('project-chooser');
    await chooser.getByLabel('File name').fill(name);
    await chooser.getByRole('button', { name: 'Save', exact: true }).click();
    await expect(page.getByTestId('project-status')).toHaveText(`Saved ${name}.stemline`);
    const project = await loadProject(file);
    expect(project.glyphs.map((g) => g.unicodes)).toEqual([['0048'], ['0078'], ['0069'], ['006C'], ['006B'], ['0064'], ['0027']]);
    expect(project.scans[0]?.sheetEdits?.map((e) => e.kind)).toEqual(['merge', 'cut', 'split', 'assign', 'retype', 'height']);
    // The font's x-height is the dragged height at the drawing's scale (the cap height becomes 700 units), not the measured 60 px (420 units).
    expect(project.font.xHeight).toBe(Math.round((xPx * DEFAULT_CAP_HEIGHT_UNITS) / capPx));
    expect(project.font.xHeight).toBeGreaterThan(Math.round((X_HEIGHT_PX * DEFAULT_CAP_HEIGHT_UNITS) / capPx));

    // Reopen: the same letters and the guide set by hand.
    await page.reload();
    await page.getByRole('button', { name: 'Open…' }).click();
    await page.getByTestId('project-chooser').getByTestId('project-choice').filter({ hasText: `${name}.stemline` }).click();
    await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
    expect(await page.getByTestId('letter-thumbnail').evaluateAll((b) => b.map((e) => e.getAttribute('data-character')))).toEqual(['H', 'x', 'i', 'l', 'k', 'd', "'"]);
    await page.getByRole('button', { name: '← Sheet' }).click();
    await expect(page.getByTestId('letter-count')).toHaveText('7 letters in 1 row');
    expect(await characters(page)).toEqual(['H', 'x', 'i', 'l', 'k', 'd', "'"]);
    await expect(page.getByTestId('x-height-source')).toHaveText('set by hand');
    expect(Number(await page.getByTestId('x-height-pixels').inputValue())).toBe(xPx);
    await expect(page.getByTestId('unsaved-marker')).toHaveCount(0);
    // And back to the measured x-height, as one more correction.
    await page.getByRole('button', { name: 'Use the measured x-height' }).click();
    await expect(page.getByTestId('x-height-source')).toHaveText('measured on x');
    await expect(page.getByTestId('unsaved-marker')).toBeVisible();
    rmSync(file, { force: true });
  });
});
