// The per-user folder the host owns, where the autosaved copies of projects never
// saved are kept (a project that has a file keeps its copy beside it). Both hosts use
// the same folder, the one Electron's app.getPath('appData') names on each system
// with the product's name under it, so work autosaved in one mode is found in the other.
import { homedir } from 'node:os';
import { join } from 'node:path';
import { APP_NAME } from '../app-identity.ts';

/** Subfolder holding the recovery copies of projects never saved. */
export const RECOVERY_FOLDER_NAME = 'Recovery';

/**
 * The app's per-user folder: %APPDATA%\Stemline on Windows, ~/Library/Application
 * Support/Stemline on macOS, $XDG_CONFIG_HOME/Stemline (default ~/.config) elsewhere
 * — Electron's documented appData locations.
 */
export function appDataFolder(env: NodeJS.ProcessEnv = process.env, platform: NodeJS.Platform = process.platform, home: string = homedir()): string {
  if (platform === 'win32') return join(env.APPDATA ?? join(home, 'AppData', 'Roaming'), APP_NAME);
  if (platform === 'darwin') return join(home, 'Library', 'Application Support', APP_NAME);
  return join(env.XDG_CONFIG_HOME || join(home, '.config'), APP_NAME);
}

/** Where the recovery copies of projects never saved go. */
export function untitledRecoveryFolder(appFolder: string = appDataFolder()): string {
  return join(appFolder, RECOVERY_FOLDER_NAME);
}
