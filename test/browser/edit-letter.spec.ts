// Editing a letter in the browser: a drawn sheet is opened, its letters assigned and
// fitted in the worker, shown at a glance, and one letter opened on the canvas. Points,
// handles and combs must be drawn; dragging an on-curve point moves it (and the comb
// is recomputed on every pointer move); Ctrl+Z puts it back in one step.
import { test, expect, type Page } from '@playwright/test';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { openFittedDemoSheet as openFittedSheet } from '../support/demo-sheet.ts';

const chromium = checkRequirement(CHROMIUM);

const numberAttribute = async (page: Page, testId: string, name: string) => Number(await page.getByTestId(testId).getAttribute(name));

test.describe('editing a letter in the browser', () => {
  test.skip(!chromium.available, chromium.message);

  test('shows every fitted letter at a glance, and sorting by warnings keeps them all', async ({ page }) => {
    await openFittedSheet(page);
    const thumbnails = page.getByTestId('letter-thumbnail');
    await expect(thumbnails).toHaveCount(3);
    await expect(thumbnails.nth(0)).toHaveAttribute('data-character', 'o');
    for (const i of [0, 1, 2]) await expect(thumbnails.nth(i).locator('path')).toHaveAttribute('d', /^M.+Z/);
    await page.getByTestId('glance-order').selectOption('warnings');
    const counts = await thumbnails.evaluateAll((buttons) => buttons.map((b) => Number(b.getAttribute('data-warnings'))));
    expect(counts).toEqual([...counts].sort((a, b) => b - a));
    expect(counts).toHaveLength(3);
  });

  test('draws points, handles and combs, drags an on-curve point with the comb following, and Ctrl+Z puts it back', async ({ page }) => {
    await openFittedSheet(page);
    await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=o') }).first().click();
    const canvas = page.getByTestId('letter-canvas');
    await expect(canvas).toBeVisible();
    // The ring "o": two contours of curves, so every on-curve point is smooth and has handles.
    const status = page.getByTestId('letter-status');
    await expect(status).toContainText('2 contours');
    const onCurve = page.getByTestId('on-curve-point');
    await expect(onCurve.first()).toBeVisible();
    expect(await numberAttribute(page, 'letter-status', 'data-on-curve')).toBeGreaterThanOrEqual(8);
    expect(await numberAttribute(page, 'letter-status', 'data-handles')).toBeGreaterThanOrEqual(16);
    await expect(page.getByTestId('handle')).toHaveCount(await numberAttribute(page, 'letter-status', 'data-handles'));
    expect(await numberAttribute(page, 'letter-canvas', 'data-comb-teeth')).toBeGreaterThan(0);
    await expect(page.getByTestId('comb-envelope')).toHaveAttribute('d', /^M.+L/);
    await expect(page.getByTestId('continuity').first()).toHaveAttribute('data-continuity', /^(corner|G1|G2)$/);
    // Descender, baseline, x-height, cap height and ascender.
    await expect(page.getByTestId('guide')).toHaveCount(5);
    await expect(page.getByTestId('sidebearing-line')).toHaveCount(2);
    await page.screenshot({ path: 'test-results/edit-letter.png' });

    // Drag the first on-curve point 40 px right and 30 px up, in steps.
    const point = onCurve.first();
    const contour = await point.getAttribute('data-contour');
    const index = await point.getAttribute('data-point');
    const the = page.locator(`[data-testid="on-curve-point"][data-contour="${contour}"][data-point="${index}"]`);
    const before = { x: Number(await the.getAttribute('data-x')), y: Number(await the.getAttribute('data-y')) };
    const box = (await the.boundingBox())!;
    const start = { x: box.x + box.width / 2, y: box.y + box.height / 2 };
    const revisionBefore = await numberAttribute(page, 'letter-canvas', 'data-comb-revision');
    const steps = 8;
    await page.mouse.move(start.x, start.y);
    await page.mouse.down();
    await page.mouse.move(start.x + 40, start.y - 30, { steps });
    await expect(the).toHaveAttribute('data-selected', 'true');
    await expect.poll(async () => Number(await the.getAttribute('data-x'))).toBeGreaterThan(before.x);
    await page.mouse.up();
    const after = { x: Number(await the.getAttribute('data-x')), y: Number(await the.getAttribute('data-y')) };
    expect(after.y).toBeGreaterThan(before.y);
    // The pointer readout (font units under the pointer) shows where the point now is, to the rounding of one move.
    const readout = page.getByTestId('pointer-readout');
    const scale = await numberAttribute(page, 'letter-canvas', 'data-scale');
    const unitsPerPixel = 1 / scale;
    expect(Math.abs(Number(await readout.getAttribute('data-x')) - after.x)).toBeLessThanOrEqual(2 + unitsPerPixel * 2);
    expect(Math.abs(Number(await readout.getAttribute('data-y')) - after.y)).toBeLessThanOrEqual(2 + unitsPerPixel * 2);
    // The moved point is drawn where the mouse let go.
    const moved = (await the.boundingBox())!;
    expect(Math.abs(moved.x + moved.width / 2 - (start.x + 40))).toBeLessThan(2 + scale);
    // Every pointer move that changed the outline redrew the comb (the first move only passes the drag threshold).
    expect(await numberAttribute(page, 'letter-canvas', 'data-comb-revision')).toBeGreaterThanOrEqual(revisionBefore + steps - 2);
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');

    await page.keyboard.press('Control+z');
    await expect(the).toHaveAttribute('data-x', String(before.x));
    await expect(the).toHaveAttribute('data-y', String(before.y));
    await expect(page.getByTestId('undo-steps')).toHaveText('0 edits to undo');
    await page.keyboard.press('Control+Shift+z');
    await expect(the).toHaveAttribute('data-x', String(after.x));
  });

  test('nudges the selected point by one unit and ten with shift, and zooms with the keys', async ({ page }) => {
    await openFittedSheet(page);
    await page.getByTestId('letter-thumbnail').first().click();
    const the = page.getByTestId('on-curve-point').first();
    const x = Number(await the.getAttribute('data-x'));
    const box = (await the.boundingBox())!;
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
    await expect(the).toHaveAttribute('data-selected', 'true');
    await page.keyboard.press('ArrowRight');
    await expect(the).toHaveAttribute('data-x', String(x + 1));
    await page.keyboard.press('Shift+ArrowLeft');
    await expect(the).toHaveAttribute('data-x', String(x - 9));
    const scale = await numberAttribute(page, 'letter-canvas', 'data-scale');
    await page.keyboard.press('+');
    await expect.poll(() => numberAttribute(page, 'letter-canvas', 'data-scale')).toBeGreaterThan(scale);
  });

  test('inserts a point with a double-click on the outline without changing the shape, and Delete takes it out again', async ({ page }) => {
    await openFittedSheet(page);
    await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=o') }).first().click();
    const onCurveCount = () => numberAttribute(page, 'letter-status', 'data-on-curve');
    const before = await onCurveCount();
    // A place on the outline: just along the first on-curve point's outgoing handle, where
    // the curve leaves the point along it (its tangent), a fraction of a pixel off it.
    const point = page.getByTestId('on-curve-point').first();
    const contour = await point.getAttribute('data-contour');
    const index = Number(await point.getAttribute('data-point'));
    const handle = page.locator(`[data-testid="handle"][data-contour="${contour}"][data-point="${index + 1}"]`);
    const p = (await point.boundingBox())!;
    const h = (await handle.boundingBox())!;
    const from = { x: p.x + p.width / 2, y: p.y + p.height / 2 };
    const to = { x: h.x + h.width / 2, y: h.y + h.height / 2 };
    const length = Math.hypot(to.x - from.x, to.y - from.y);
    const along = Math.min(12, length / 2) / length;
    const outlineBefore = await page.getByTestId('outline').getAttribute('d');
    await page.mouse.dblclick(from.x + (to.x - from.x) * along, from.y + (to.y - from.y) * along);
    await expect.poll(onCurveCount).toBe(before + 1);
    // The new point is selected; an exact split draws the same outline (to the path's rounding).
    await expect(page.locator('[data-testid="on-curve-point"][data-selected="true"]')).toHaveCount(1);
    const numbers = (d: string | null) => (d ?? '').match(/-?\d+(\.\d+)?/g)!.map(Number);
    expect(numbers(await page.getByTestId('outline').getAttribute('d')).length).toBeGreaterThan(numbers(outlineBefore).length);
    await page.keyboard.press('Delete');
    await expect.poll(onCurveCount).toBe(before);
    await expect(page.getByTestId('undo-steps')).toHaveText('2 edits to undo');
    await page.keyboard.press('Control+z');
    await expect.poll(onCurveCount).toBe(before + 1);
  });

  test('dragging the advance line sets the advance width in one undo step', async ({ page }) => {
    await openFittedSheet(page);
    await page.getByTestId('letter-thumbnail').first().click();
    const advance = page.locator('[data-testid="sidebearing-line"][data-side="right"]');
    const origin = page.locator('[data-testid="sidebearing-line"][data-side="left"]');
    const x0 = Number(await origin.getAttribute('x1'));
    const x1 = Number(await advance.getAttribute('x1'));
    const scale = await numberAttribute(page, 'letter-canvas', 'data-scale');
    const canvas = (await page.getByTestId('letter-canvas').boundingBox())!;
    const y = canvas.y + canvas.height / 2;
    await page.mouse.move(canvas.x + x1, y);
    await page.mouse.down();
    await page.mouse.move(canvas.x + x1 + 30, y, { steps: 6 });
    await page.mouse.up();
    // 30 px at the view's scale, in whole units.
    const moved = Number(await advance.getAttribute('x1'));
    expect(moved - x0).toBeGreaterThan(x1 - x0 + 25);
    expect(Math.abs(moved - (x1 + 30))).toBeLessThanOrEqual(scale + 1);
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');
    await page.keyboard.press('Control+z');
    await expect(advance).toHaveAttribute('x1', String(x1));
  });

  test('turns a smooth point into a corner, shows the kink a small handle drag makes, and fixes it in one click', async ({ page }) => {
    await openFittedSheet(page);
    await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=o') }).first().click();
    const point = page.getByTestId('on-curve-point').first();
    const contour = await point.getAttribute('data-contour');
    const index = Number(await point.getAttribute('data-point'));
    const the = page.locator(`[data-testid="on-curve-point"][data-contour="${contour}"][data-point="${index}"]`);
    await expect(the).toHaveAttribute('data-role', 'smooth');
    const p = (await the.boundingBox())!;
    await page.mouse.click(p.x + p.width / 2, p.y + p.height / 2);
    await page.getByTestId('command-smooth').click();
    await expect(the).toHaveAttribute('data-role', 'corner');
    // Turn the outgoing handle by a few degrees: neither smooth nor a corner.
    const handle = page.locator(`[data-testid="handle"][data-contour="${contour}"][data-point="${index + 1}"]`);
    const h = (await handle.boundingBox())!;
    const from = { x: p.x + p.width / 2, y: p.y + p.height / 2 };
    const at = { x: h.x + h.width / 2, y: h.y + h.height / 2 };
    const length = Math.hypot(at.x - from.x, at.y - from.y);
    const across = { x: -(at.y - from.y) / length, y: (at.x - from.x) / length };
    const shift = length * Math.tan((4 * Math.PI) / 180); // 4°, inside the 0.3°–8° kink range
    await page.mouse.click(at.x, at.y);
    await page.mouse.move(at.x, at.y);
    await page.mouse.down();
    await page.mouse.move(at.x + across.x * shift, at.y + across.y * shift, { steps: 4 });
    await page.mouse.up();
    const kinkFix = page.locator('[data-testid="warning-fix"][data-kind="near-miss-kink"]');
    await expect(kinkFix).toHaveCount(1);
    await kinkFix.click();
    await expect(page.locator('[data-testid="warning-item"][data-kind="near-miss-kink"]')).toHaveCount(0);
    await expect(the).toHaveAttribute('data-role', 'smooth');
  });

  test('sets the advance width and sidebearings from the spacing fields', async ({ page }) => {
    await openFittedSheet(page);
    await page.getByTestId('letter-thumbnail').first().click();
    const advance = page.getByTestId('spacing-advance');
    const right = page.getByTestId('spacing-right');
    const left = page.getByTestId('spacing-left');
    const a = Number(await advance.inputValue());
    const r = Number(await right.inputValue());
    const l = Number(await left.inputValue());
    await advance.fill(String(a + 20));
    await advance.press('Enter');
    await expect(right).toHaveValue(String(r + 20));
    await left.fill(String(l + 10));
    await left.press('Enter');
    // The left sidebearing moves the outline and the advance with it; the right one stays.
    await expect(advance).toHaveValue(String(a + 30));
    await expect(right).toHaveValue(String(r + 20));
    await expect(page.getByTestId('undo-steps')).toHaveText('2 edits to undo');
  });

  test('draws a new contour through clicked points, and undo takes it away', async ({ page }) => {
    await openFittedSheet(page);
    await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=o') }).first().click();
    const status = page.getByTestId('letter-status');
    await expect(status).toContainText('2 contours');
    await page.getByTestId('draw-through').click();
    await expect(page.getByTestId('letter-canvas')).toHaveAttribute('data-drawing', 'true');
    const box = (await page.getByTestId('letter-canvas').boundingBox())!;
    // A small diamond near the drawing area's top-left corner, clear of the letter; one corner (shift).
    const c = { x: box.x + 60, y: box.y + 60 };
    await page.mouse.click(c.x, c.y - 20);
    await page.mouse.click(c.x + 20, c.y);
    await page.keyboard.down('Shift');
    await page.mouse.click(c.x, c.y + 20);
    await page.keyboard.up('Shift');
    await page.mouse.click(c.x - 20, c.y);
    await expect(page.getByTestId('drawn-point')).toHaveCount(4);
    await page.keyboard.press('Enter');
    await expect(status).toContainText('3 contours');
    await expect(page.getByTestId('letter-canvas')).toHaveAttribute('data-drawing', 'false');
    await page.keyboard.press('Control+z');
    await expect(status).toContainText('2 contours');
  });
});
