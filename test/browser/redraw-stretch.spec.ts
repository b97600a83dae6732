// Redrawing a stretch in the browser: two neighbouring on-curve points of the "o" are
// selected, "Redraw between the two points" shows the stretch it will replace (the
// shorter one; "Take the other side" switches), two clicks beside the outline and
// Enter replace the stretch by a curve through them — one undo step, and undo puts
// every point back where it was. Escape leaves the outline as it was.
import { test, expect, type Page } from '@playwright/test';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { openFittedDemoSheet } from '../support/demo-sheet.ts';

const chromium = checkRequirement(CHROMIUM);

/** How far beyond the chord between the two ends the clicks go, as a share of the distance from the contour's centre (enough to be off the outline). */
const OUTWARD_SHARE = 0.35;

type Mark = { x: number; y: number; role: string };

/** Every point of the letter as drawn: font-unit coordinates and role, in contour and point order. */
async function allPoints(page: Page): Promise<Mark[]> {
  return page.locator('[data-testid="on-curve-point"], [data-testid="handle"]').evaluateAll((elements) =>
    elements
      .map((e) => ({ c: Number(e.getAttribute('data-contour')), i: Number(e.getAttribute('data-point')), x: Number(e.getAttribute('data-x')), y: Number(e.getAttribute('data-y')), role: e.getAttribute('data-role') ?? 'handle' }))
      .sort((a, b) => a.c - b.c || a.i - b.i)
      .map(({ x, y, role }) => ({ x, y, role })),
  );
}

const centreOf = async (page: Page, selector: string) => {
  const box = (await page.locator(selector).boundingBox())!;
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
};

async function openO(page: Page) {
  await openFittedDemoSheet(page);
  await page.getByTestId('letter-thumbnail').filter({ hasText: 'o' }).first().click();
  await expect(page.getByTestId('letter-canvas')).toBeVisible();
}

/** Selects on-curve points 0 and 1 of contour 0 (click, shift-click); returns their screen centres and the contour's centre. */
async function selectTwoNeighbours(page: Page) {
  const onCurve = page.locator('[data-testid="on-curve-point"][data-contour="0"]');
  expect(await onCurve.count()).toBeGreaterThanOrEqual(4);
  const a = await onCurve.nth(0).boundingBox();
  const b = await onCurve.nth(1).boundingBox();
  const all = await onCurve.evaluateAll((elements) => elements.map((e) => e.getBoundingClientRect()).map((r) => ({ x: r.x + r.width / 2, y: r.y + r.height / 2 })));
  const centre = { x: all.reduce((s, p) => s + p.x, 0) / all.length, y: all.reduce((s, p) => s + p.y, 0) / all.length };
  const pa = { x: a!.x + a!.width / 2, y: a!.y + a!.height / 2 };
  const pb = { x: b!.x + b!.width / 2, y: b!.y + b!.height / 2 };
  await page.mouse.click(pa.x, pa.y);
  await page.keyboard.down('Shift');
  await page.mouse.click(pb.x, pb.y);
  await page.keyboard.up('Shift');
  await expect(page.getByTestId('selected-count')).toHaveText('2');
  return { pa, pb, centre };
}

/** Clicks at screen `at` in redraw mode; returns the font units the click lands on (the pointer readout, rounded as the click is). */
async function clickAt(page: Page, at: { x: number; y: number }): Promise<{ x: number; y: number }> {
  await page.mouse.move(at.x, at.y);
  const readout = page.getByTestId('pointer-readout');
  await expect(readout).not.toHaveAttribute('data-x', '');
  const units = { x: Number(await readout.getAttribute('data-x')), y: Number(await readout.getAttribute('data-y')) };
  await page.mouse.down();
  await page.mouse.up();
  return units;
}

test.describe('redrawing a stretch in the browser', () => {
  test.skip(!chromium.available, chromium.message);

  test('replaces the stretch between two selected points by a curve through two clicks, and undo puts it back', async ({ page }) => {
    await openO(page);
    const before = await allPoints(page);
    const onCurveBefore = before.filter((p) => p.role !== 'handle').length;
    const { pa, pb, centre } = await selectTwoNeighbours(page);

    await page.getByTestId('command-redraw').click();
    const bar = page.getByTestId('redraw-bar');
    await expect(bar).toHaveAttribute('data-side', 'shorter');
    await expect(page.getByTestId('redraw-stretch')).toHaveAttribute('d', /^M.+C/);
    const shorter = await page.getByTestId('redraw-stretch').getAttribute('d');
    await page.getByTestId('redraw-other-side').click();
    await expect(bar).toHaveAttribute('data-side', 'longer');
    expect(await page.getByTestId('redraw-stretch').getAttribute('d')).not.toBe(shorter);
    // The other side of a ring runs over every other on-curve point: a longer path.
    expect((await page.getByTestId('redraw-stretch').getAttribute('d'))!.length).toBeGreaterThan(shorter!.length);
    await page.getByTestId('redraw-other-side').click();
    await expect(bar).toHaveAttribute('data-side', 'shorter');

    // Two clicks a third and two thirds along the chord, pushed out from the ring's centre.
    const along = (t: number) => {
      const m = { x: pa.x + (pb.x - pa.x) * t, y: pa.y + (pb.y - pa.y) * t };
      return { x: m.x + (m.x - centre.x) * OUTWARD_SHARE, y: m.y + (m.y - centre.y) * OUTWARD_SHARE };
    };
    const first = await clickAt(page, along(1 / 3));
    await expect(page.getByTestId('redraw-preview')).toHaveAttribute('d', /^M.+Z$/);
    const second = await clickAt(page, along(2 / 3));
    await expect(page.getByTestId('drawn-point')).toHaveCount(2);
    await page.screenshot({ path: 'test-results/redraw-stretch.png' });
    await page.keyboard.press('Enter');
    await expect(bar).toHaveCount(0);

    // The two clicks are on-curve points now, the rest of the ring is as it was, and it is one edit.
    await expect(page.getByTestId('letter-status')).toHaveAttribute('data-on-curve', String(onCurveBefore + 2));
    for (const p of [first, second]) {
      await expect(page.locator(`[data-testid="on-curve-point"][data-x="${p.x}"][data-y="${p.y}"]`)).toHaveCount(1);
    }
    const after = await allPoints(page);
    const key = (p: Mark) => `${p.x},${p.y},${p.role}`;
    const kept = new Set(after.map(key));
    // Every on-curve point of the letter survives (the stretch had none inside it), with its role.
    for (const p of before.filter((q) => q.role !== 'handle')) expect(kept.has(key(p))).toBe(true);
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');

    await page.keyboard.press('Control+z');
    await expect(page.getByTestId('letter-status')).toHaveAttribute('data-on-curve', String(onCurveBefore));
    expect(await allPoints(page)).toEqual(before);
    await expect(page.getByTestId('undo-steps')).toHaveText('0 edits to undo');
  });

  test('Escape leaves the outline as it was', async ({ page }) => {
    await openO(page);
    const before = await allPoints(page);
    const { pa, pb, centre } = await selectTwoNeighbours(page);
    await page.getByTestId('command-redraw').click();
    await expect(page.getByTestId('redraw-bar')).toBeVisible();
    const mid = { x: (pa.x + pb.x) / 2, y: (pa.y + pb.y) / 2 };
    await clickAt(page, { x: mid.x + (mid.x - centre.x) * OUTWARD_SHARE, y: mid.y + (mid.y - centre.y) * OUTWARD_SHARE });
    await page.keyboard.press('Escape');
    await expect(page.getByTestId('redraw-bar')).toHaveCount(0);
    await expect(page.getByTestId('drawn-point')).toHaveCount(0);
    expect(await allPoints(page)).toEqual(before);
    await expect(page.getByTestId('undo-steps')).toHaveText('0 edits to undo');
  });

  test('the command waits for exactly two on-curve points of one contour', async ({ page }) => {
    await openO(page);
    await expect(page.getByTestId('command-redraw')).toBeDisabled();
    const onCurve = page.locator('[data-testid="on-curve-point"][data-contour="0"]');
    const p = await centreOf(page, '[data-testid="on-curve-point"][data-contour="0"] >> nth=0');
    await page.mouse.click(p.x, p.y);
    await expect(onCurve.nth(0)).toHaveAttribute('data-selected', 'true');
    await expect(page.getByTestId('command-redraw')).toBeDisabled();
  });
});
