// Where Help ▸ user guide leads: the README shipped inside the app (electron-builder.yml
// packs it), opened in the system's viewer. A fixed file of the app, never an address
// the page supplied (Electron security checklist, item 15: do not use shell.openExternal
// with untrusted content, https://www.electronjs.org/docs/latest/tutorial/security).
import { join } from 'node:path';

/** The guide's file name at the app's root. */
export const USER_GUIDE_FILE_NAME = 'README.md';

/** The user guide inside the app at `appPath` (Electron's app.getAppPath()). */
export function userGuidePath(appPath: string): string {
  return join(appPath, USER_GUIDE_FILE_NAME);
}
