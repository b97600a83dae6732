// Where the app's own files live relative to the installed project, for the
// launcher, the browser-mode host and the tests.
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';

/** The project root (the folder holding package.json). */
export const PROJECT_ROOT = fileURLToPath(new URL('..', import.meta.url));

/** Output of the renderer build (`vite build --config renderer/vite.config.ts`). */
export const RENDERER_BUILD_DIR = join(PROJECT_ROOT, 'build', 'renderer');

/** Output of the Electron main/preload build (`tsc -p electron/tsconfig.json`). */
export const ELECTRON_BUILD_DIR = join(PROJECT_ROOT, 'build', 'electron');
