// Where the browser tests' host keeps projects: a workspace folder and a recovery
// folder for projects never saved, under test-results/ so a run leaves them to look
// at. The Playwright config empties them at the start of each run; specs read and
// write project files there directly to set up and check what the page did.
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';

const root = fileURLToPath(new URL('../..', import.meta.url));

export const BROWSER_HOST_FOLDER = join(root, 'test-results', 'browser-host');
export const BROWSER_WORKSPACE = join(BROWSER_HOST_FOLDER, 'workspace');
export const BROWSER_UNTITLED_FOLDER = join(BROWSER_HOST_FOLDER, 'recovery');
