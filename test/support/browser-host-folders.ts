// Where the browser tests' host keeps projects: a workspace folder and a recovery
// folder for projects never saved, under test-results/ so a run leaves them to look
// at. The Playwright config empties them at the start of each run; specs read and
// write project files there directly to set up and check what the page did.
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { readdirSync, rmSync } from 'node:fs';

const root = fileURLToPath(new URL('../..', import.meta.url));

export const BROWSER_HOST_FOLDER = join(root, 'test-results', 'browser-host');
export const BROWSER_WORKSPACE = join(BROWSER_HOST_FOLDER, 'workspace');
export const BROWSER_UNTITLED_FOLDER = join(BROWSER_HOST_FOLDER, 'recovery');

/**
 * Removes the autosaved work of projects never saved, for a spec whose unsaved work
 * outlived the autosave delay: the next spec's page would otherwise be offered it.
 * Close the spec's page first, so no autosave lands after.
 */
export function discardUntitledWork(): void {
  for (const name of readdirSync(BROWSER_UNTITLED_FOLDER)) rmSync(join(BROWSER_UNTITLED_FOLDER, name), { recursive: true, force: true });
}
