// Projects in the browser: the demo letters are fitted and one point moved, the
// project saved into the host's workspace through the page's own chooser, the page
// reloaded, the project opened again — and the letters are there with the moved point
// where it was left. Work autosaved after the last save, left behind by a page that
// closed without saving, is offered when the project is opened: restoring it brings
// the moved point back; keeping the saved version discards it.
import { test, expect, type Page } from '@playwright/test';
import { existsSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { openFittedDemoSheet } from '../support/demo-sheet.ts';
import { BROWSER_WORKSPACE } from '../support/browser-host-folders.ts';
import { loadProject } from '../../electron/io/project/project-file.ts';

const chromium = checkRequirement(CHROMIUM);

/** Longest wait for autosave: its two-second pause (AUTOSAVE_DELAY_MS) plus the write, with room for a loaded machine. */
const AUTOSAVE_WAIT_MS = 15_000;

const firstPoint = (page: Page) => page.getByTestId('on-curve-point').first();
const pointX = async (page: Page) => Number(await firstPoint(page).getAttribute('data-x'));

/** Opens the letter "o" from the letters at a glance. */
async function openLetterO(page: Page): Promise<void> {
  await page.getByTestId('letter-thumbnail').filter({ hasText: 'o' }).first().click();
  await expect(page.getByTestId('letter-canvas')).toBeVisible();
}

/** Selects the first on-curve point of the open letter and nudges it `units` units right; returns its new x. */
async function nudgeFirstPoint(page: Page, units: number): Promise<number> {
  const box = (await firstPoint(page).boundingBox())!;
  await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
  await expect(firstPoint(page)).toHaveAttribute('data-selected', 'true');
  const before = await pointX(page);
  for (let i = 0; i < units; i++) await page.keyboard.press('ArrowRight');
  await expect(firstPoint(page)).toHaveAttribute('data-x', String(before + units));
  return before + units;
}

/** Saves through the page's chooser under `name` (the workspace has no other way in). */
async function saveAs(page: Page, name: string): Promise<void> {
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  const chooser = page.getByTestId('project-chooser');
  await expect(chooser).toBeVisible();
  await chooser.getByLabel('File name').fill(name);
  await chooser.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByTestId('project-status')).toHaveText(`Saved ${name}.stemline`);
  await expect(page.getByTestId('unsaved-marker')).toHaveCount(0);
}

/** Opens `fileName` from the page's chooser. */
async function openFromChooser(page: Page, fileName: string): Promise<void> {
  await page.getByRole('button', { name: 'Open…' }).click();
  await page.getByTestId('project-chooser').getByTestId('project-choice').filter({ hasText: fileName }).click();
}

function removeProject(fileName: string): void {
  for (const name of [fileName, `.${fileName}.recovery`]) rmSync(join(BROWSER_WORKSPACE, name), { force: true });
}

/**
 * Fits, saves as `name`, moves the first point of "o" 3 units right and waits for
 * autosave, then closes the page without saving, as a crash would. Returns the
 * point's x as saved and as autosaved.
 */
async function leaveAutosaveNewerThanFile(page: Page, name: string): Promise<{ saved: number; autosaved: number }> {
  await openFittedDemoSheet(page);
  await openLetterO(page);
  const saved = await pointX(page);
  await saveAs(page, name);
  const autosaved = await nudgeFirstPoint(page, 3);
  await expect(page.getByTestId('unsaved-marker')).toBeVisible();
  const recovery = join(BROWSER_WORKSPACE, `.${name}.stemline.recovery`);
  await expect.poll(() => existsSync(recovery), { timeout: AUTOSAVE_WAIT_MS }).toBe(true);
  expect(statSync(recovery).mtimeMs).toBeGreaterThan(statSync(join(BROWSER_WORKSPACE, `${name}.stemline`)).mtimeMs);
  await page.close();
  return { saved, autosaved };
}

test.describe('project files in the browser', () => {
  test.skip(!chromium.available, chromium.message);

  test('saves the fitted letters, and after a reload opens them again as they were left', async ({ page }) => {
    const name = 'demo-letters';
    removeProject(`${name}.stemline`);
    await openFittedDemoSheet(page);
    await openLetterO(page);
    const moved = await nudgeFirstPoint(page, 7);
    await expect(page.getByTestId('unsaved-marker')).toBeVisible();
    await saveAs(page, name);

    // What the host wrote: the three letters, their characters, the edit, and the scan itself.
    const project = await loadProject(join(BROWSER_WORKSPACE, `${name}.stemline`));
    expect(project.glyphs.map((g) => g.unicodes)).toEqual([['006F'], ['006C'], ['0076']]);
    expect(project.glyphs[0]?.outline.contours[0]?.[0]?.[0]).toBe(moved);
    expect(project.scans).toHaveLength(1);
    expect(project.scans[0]).toMatchObject({ path: 'sheet.png', characters: 'olv' });
    expect(project.scans[0]?.embedded?.sha256).toMatch(/^[0-9a-f]{64}$/);

    await page.reload();
    await expect(page.getByRole('heading', { level: 1 })).toHaveText('Untitled project');
    await openFromChooser(page, `${name}.stemline`);
    await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
    const thumbnails = page.getByTestId('letter-thumbnail');
    await expect(thumbnails).toHaveCount(3);
    expect(await thumbnails.evaluateAll((buttons) => buttons.map((b) => b.getAttribute('data-character')))).toEqual(['o', 'l', 'v']);
    for (const i of [0, 1, 2]) await expect(thumbnails.nth(i).locator('path')).toHaveAttribute('d', /^M.+Z/);
    await expect(page.getByTestId('project-name')).toHaveText(`${name}.stemline`);
    await expect(page.getByTestId('unsaved-marker')).toHaveCount(0);
    await expect(page.getByTestId('recovery-prompt')).toHaveCount(0);
    await openLetterO(page);
    await expect(firstPoint(page)).toHaveAttribute('data-x', String(moved));
    removeProject(`${name}.stemline`);
  });

  test('offers work autosaved after the last save, and restoring it brings the edit back', async ({ page, context }) => {
    const name = 'recovered-letters';
    removeProject(`${name}.stemline`);
    const { saved, autosaved } = await leaveAutosaveNewerThanFile(page, name);
    expect(autosaved).not.toBe(saved);

    const reopened = await context.newPage();
    await reopened.goto('/');
    await openFromChooser(reopened, `${name}.stemline`);
    const prompt = reopened.getByTestId('recovery-prompt');
    await expect(prompt).toHaveAttribute('data-kind', 'project');
    await expect(prompt).toContainText(`Recovered work for ${name}.stemline`);
    await prompt.getByRole('button', { name: 'Restore the recovered work' }).click();
    await expect(prompt).toHaveCount(0);
    await expect(reopened.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible();
    await expect(reopened.getByTestId('letter-thumbnail')).toHaveCount(3);
    // The recovered work is not in the file yet: it shows as unsaved until saved.
    await expect(reopened.getByTestId('unsaved-marker')).toBeVisible();
    await openLetterO(reopened);
    await expect(firstPoint(reopened)).toHaveAttribute('data-x', String(autosaved));
    removeProject(`${name}.stemline`);
  });

  test('keeping the saved version opens the file as saved and discards the recovered copy', async ({ page, context }) => {
    const name = 'kept-letters';
    removeProject(`${name}.stemline`);
    const { saved } = await leaveAutosaveNewerThanFile(page, name);

    const reopened = await context.newPage();
    await reopened.goto('/');
    await openFromChooser(reopened, `${name}.stemline`);
    const prompt = reopened.getByTestId('recovery-prompt');
    await prompt.getByRole('button', { name: 'Keep the saved version' }).click();
    await expect(prompt).toHaveCount(0);
    await expect(reopened.getByTestId('unsaved-marker')).toHaveCount(0);
    await openLetterO(reopened);
    await expect(firstPoint(reopened)).toHaveAttribute('data-x', String(saved));
    await expect.poll(() => existsSync(join(BROWSER_WORKSPACE, `.${name}.stemline.recovery`))).toBe(false);
    removeProject(`${name}.stemline`);
  });

  test('shows the host’s message when a listed project has gone, and keeps the work in the window', async ({ page }) => {
    const name = 'gone-letters';
    removeProject(`${name}.stemline`);
    await openFittedDemoSheet(page);
    await saveAs(page, name);
    await page.getByRole('button', { name: 'Open…' }).click();
    const choice = page.getByTestId('project-chooser').getByTestId('project-choice').filter({ hasText: `${name}.stemline` });
    await expect(choice).toBeVisible();
    removeProject(`${name}.stemline`); // deleted by another program while the chooser is open
    await choice.click();
    await expect(page.getByTestId('project-problem')).toHaveText(`There is no project "${name}.stemline" in the workspace folder "workspace" (it may have been moved or deleted). Choose one from the list again.`);
    await expect(page.getByTestId('letter-thumbnail')).toHaveCount(3);
    await expect(page.getByTestId('project-name')).toHaveText(`${name}.stemline`);
  });
});
