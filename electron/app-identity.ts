// The product's name and version as the shell, the CLI and the renderer report them.
// Kept as constants so the Electron main process, the CLI and the browser-mode host
// need no file IO to say who they are; a test keeps the version equal to package.json.

/** The product name shown in window titles, the CLI and the about screen. */
export const APP_NAME = 'Stemline';

/** The release version; must equal `version` in package.json (checked by a test). */
export const APP_VERSION = '0.1.0';
