// The desktop menus' commands as the page runs them, in the real renderer against the
// real handlers: a stand-in for the desktop preload (the same window.stemline shape,
// its intents sent to the browser host over HTTP, its menu event driven by the test)
// is installed before the page loads, so the page takes the desktop bridge. Each
// command must do what the page's own control does; the page must report its
// project's state; and in a focused text field the Edit commands edit the text.
import { test, expect, type Page } from '@playwright/test';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { openFittedDemoSheet } from '../support/demo-sheet.ts';

const chromium = checkRequirement(CHROMIUM);

/** The stand-in bridge: every intent over HTTP (as host-api.ts's browser client does), the menu event kept for the test. */
function installBridge(): void {
  const reports: unknown[] = [];
  let menuListener: ((message: unknown) => void) | null = null;
  const call = async (intent: string, args: unknown) => {
    const response = await fetch(`./api/${intent}`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(args) });
    const reply = (await response.json()) as { result?: unknown; error?: { kind: string; message: string } };
    if (reply.error) throw Object.assign(new Error(reply.error.message), { kind: reply.error.kind });
    return reply.result;
  };
  const intents = ['appInfo', 'listProjects', 'openProject', 'saveProject', 'saveProjectAs', 'autosaveProject', 'findRecoveredWork', 'discardRecoveredWork', 'buildProofFont', 'exportFont', 'listRecentProjects', 'openRecentProject', 'importScan', 'decodeScan', 'closeWindow'];
  const bridge: Record<string, unknown> = Object.fromEntries(intents.map((name) => [name, (args: unknown) => call(name, args)]));
  bridge.reportProjectState = (state: unknown) => {
    reports.push(state);
    return call('reportProjectState', state);
  };
  bridge.onMenuCommand = (listener: (message: unknown) => void) => {
    menuListener = listener;
    return () => (menuListener = null);
  };
  Object.assign(window, { stemline: bridge, menuTest: { reports, send: (message: unknown) => menuListener?.(message) } });
}

async function menu(page: Page, command: string): Promise<void> {
  await page.evaluate((c) => (window as unknown as { menuTest: { send(m: unknown): void } }).menuTest.send({ command: c }), command);
}

async function lastReport(page: Page): Promise<Record<string, unknown> | undefined> {
  return page.evaluate(() => (window as unknown as { menuTest: { reports: Record<string, unknown>[] } }).menuTest.reports.at(-1));
}

async function openLetterO(page: Page): Promise<void> {
  await openFittedDemoSheet(page);
  await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=o') }).first().click();
  await expect(page.getByTestId('letter-canvas')).toBeVisible();
}

test.describe('the desktop menus’ commands in the page', () => {
  test.skip(!chromium.available, chromium.message);
  test.beforeEach(async ({ page }) => {
    await page.addInitScript(installBridge);
  });

  test('the page reports its project’s state from the start and as it changes', async ({ page }) => {
    await page.goto('/');
    await expect.poll(() => lastReport(page)).toEqual({ title: 'Untitled project', hasProject: false, hasUnsavedChanges: false, canUndo: false, canRedo: false });
    await openLetterO(page);
    await expect.poll(() => lastReport(page)).toMatchObject({ hasProject: true, hasUnsavedChanges: true });
  });

  test('Select all, Delete and Undo act on the letter’s points as the canvas keys do', async ({ page }) => {
    await openLetterO(page);
    const points = page.getByTestId('on-curve-point');
    const count = await points.count();
    await menu(page, 'select-all');
    await expect(page.locator('[data-testid="on-curve-point"][data-selected="true"]')).toHaveCount(count);
    await menu(page, 'delete-selection');
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');
    await expect.poll(() => lastReport(page)).toMatchObject({ canUndo: true });
    await menu(page, 'undo');
    await expect(page.getByTestId('undo-steps')).toHaveText('0 edits to undo');
    await expect(page.getByTestId('letter-status')).toContainText('2 contours');
    await menu(page, 'redo');
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');
  });

  test('on the sheet, Undo and Redo and their keys act on the sheet’s corrections, not on the letters’ edits', async ({ page }) => {
    await openLetterO(page);
    await menu(page, 'select-all');
    await menu(page, 'delete-selection');
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');
    await page.getByRole('button', { name: '← All letters' }).click();
    await page.getByRole('button', { name: '← Sheet' }).click();
    const chevron = page.getByTestId('letter-box').nth(2);
    await chevron.click();
    await page.keyboard.press('x');
    await expect(chevron).toHaveAttribute('data-character', 'x');
    await expect.poll(() => lastReport(page)).toMatchObject({ canUndo: true, canRedo: false });

    await menu(page, 'undo');
    await expect(chevron).toHaveAttribute('data-character', 'v');
    await expect.poll(() => lastReport(page)).toMatchObject({ canRedo: true });
    await menu(page, 'redo');
    await expect(chevron).toHaveAttribute('data-character', 'x');
    // The keys the menu lists: Ctrl+Z, and Ctrl+Y for Redo on Windows and Linux (Shift+Ctrl+Z too).
    await page.keyboard.press('Control+z');
    await expect(chevron).toHaveAttribute('data-character', 'v');
    await page.keyboard.press('Control+y');
    await expect(chevron).toHaveAttribute('data-character', 'x');
    await page.keyboard.press('Control+z');
    await expect(chevron).toHaveAttribute('data-character', 'v');
    await page.keyboard.press('Shift+Control+z');
    await expect(chevron).toHaveAttribute('data-character', 'x');

    // The letter's own edit is still there, to undo in the editor.
    await page.getByRole('button', { name: 'Back to the fitted letters' }).click();
    await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=o') }).first().click();
    await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');
    await expect.poll(() => lastReport(page)).toMatchObject({ canUndo: true, canRedo: false });
  });

  test('on the sheet, Edit ▸ Undo and Redo take back and make again a change of the fit settings, fitting the letters again', async ({ page }) => {
    await openFittedDemoSheet(page);
    /** The fitted letters' outlines, read at a glance, coming back to the sheet. */
    const outlines = async () => {
      await page.getByRole('button', { name: 'Back to the fitted letters' }).click();
      const paths = await page.getByTestId('letter-thumbnail').locator('path').evaluateAll((all) => all.map((p) => p.getAttribute('d') ?? ''));
      await page.getByRole('button', { name: '← Sheet' }).click();
      return paths;
    };
    await page.getByRole('button', { name: '← Sheet' }).click();
    const settled = () => expect(page.getByTestId('sheet-screen')).toHaveAttribute('data-phase', 'traced');
    const economy = await outlines();
    const mode = page.getByTestId('fit-mode');
    await mode.selectOption('smooth');
    await settled();
    const smooth = await outlines();
    expect(smooth).not.toEqual(economy);
    // No correction was made: the settings change alone enables Undo.
    await expect.poll(() => lastReport(page)).toMatchObject({ canUndo: true, canRedo: false });

    await menu(page, 'undo');
    await expect(mode).toHaveValue('economy');
    await settled();
    expect(await outlines()).toEqual(economy);
    await expect.poll(() => lastReport(page)).toMatchObject({ canRedo: true });
    await page.keyboard.press('Control+y');
    await expect(mode).toHaveValue('smooth');
    await settled();
    expect(await outlines()).toEqual(smooth);
  });

  test('Zoom, combs, scan backdrop and the proof change what the editor’s own controls show', async ({ page }) => {
    await openLetterO(page);
    const canvas = page.getByTestId('letter-canvas');
    const scale = Number(await canvas.getAttribute('data-scale'));
    await menu(page, 'zoom-in');
    await expect.poll(async () => Number(await canvas.getAttribute('data-scale'))).toBeGreaterThan(scale);
    await menu(page, 'zoom-out');
    await expect.poll(async () => Number(await canvas.getAttribute('data-scale'))).toBeCloseTo(scale, 3);
    // The menu and the slider change one setting: the combs hide at the menu and come back at the length set on the slider.
    const combLength = page.getByTestId('comb-length');
    await combLength.fill('2.5');
    const teeth = Number(await canvas.getAttribute('data-comb-teeth'));
    expect(teeth).toBeGreaterThan(0);
    await menu(page, 'toggle-combs');
    await expect(combLength).toHaveValue('0');
    await expect(canvas).toHaveAttribute('data-comb-teeth', '0');
    await expect(page.getByTestId('comb-envelope')).toHaveAttribute('d', '');
    await menu(page, 'toggle-combs');
    await expect(combLength).toHaveValue('2.5');
    await expect(canvas).toHaveAttribute('data-comb-teeth', String(teeth));
    const scan = page.getByTestId('scan-opacity');
    await menu(page, 'toggle-scan-backdrop');
    await expect(scan).toHaveValue('0');
    await expect(page.getByTestId('scan-under')).toHaveAttribute('opacity', '0');
    await menu(page, 'toggle-scan-backdrop');
    await expect(scan).toHaveValue('0.35');
    // The settings stay as they were set when another letter is opened.
    await menu(page, 'toggle-scan-backdrop');
    await page.getByRole('button', { name: '← All letters' }).click();
    await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=l') }).first().click();
    await expect(page.getByRole('heading', { level: 1 })).toHaveText('l');
    await expect(combLength).toHaveValue('2.5');
    await expect(scan).toHaveValue('0');
    await menu(page, 'toggle-proof');
    await expect(page.getByTestId('proof-panel')).toBeVisible();
  });

  test('View commands change nothing while no letter is open', async ({ page }) => {
    await openLetterO(page);
    await page.getByRole('button', { name: '← All letters' }).click();
    await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
    await menu(page, 'toggle-combs');
    await menu(page, 'toggle-scan-backdrop');
    await menu(page, 'zoom-in');
    await page.getByTestId('letter-thumbnail').filter({ has: page.locator('text=o') }).first().click();
    await expect(page.getByTestId('comb-length')).toHaveValue('1');
    await expect(page.getByTestId('scan-opacity')).toHaveValue('0.35');
  });

  test('in a focused text field, Select all selects its text, not the letter’s points', async ({ page }) => {
    await openLetterO(page);
    await menu(page, 'toggle-proof');
    const text = page.getByTestId('proof-text');
    await text.fill('Harbour');
    await text.focus();
    await menu(page, 'select-all');
    expect(await text.evaluate((input: HTMLInputElement) => [input.selectionStart, input.selectionEnd])).toEqual([0, 'Harbour'.length]);
    await expect(page.locator('[data-testid="on-curve-point"][data-selected="true"]')).toHaveCount(0);
  });
});
