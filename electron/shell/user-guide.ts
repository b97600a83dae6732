// Where Help ▸ user guide leads: the user guide (docs/guide/README.md, its chapters and
// the pictures they show) shipped with the app, opened in the system's viewer. A fixed
// file of the app, never an address the page supplied (Electron security checklist,
// item 15: do not use shell.openExternal with untrusted content,
// https://www.electronjs.org/docs/latest/tutorial/security).
//
// In an installed app, app.getAppPath() is the app.asar archive, which only Electron
// can read into; electron-builder.yml unpacks the guide beside it into
// app.asar.unpacked (electron-builder's asarUnpack), where the system's viewer and
// the guide's links between chapters and to docs/images/ work as in the source tree.
import path, { type PlatformPath } from 'node:path';

/** The guide's contents page, from the app's root. */
export const USER_GUIDE_PATH = ['docs', 'guide', 'README.md'] as const;

/** The archive electron-builder packs the app into, and the folder beside it holding what is unpacked. */
const ASAR_ARCHIVE_SUFFIX = '.asar';
const UNPACKED_SUFFIX = '.unpacked';

/**
 * The user guide's contents page for the app at `appPath` (Electron's app.getAppPath()):
 * inside the folder of a development run, or in the unpacked folder beside an
 * installed app's archive. `paths` is the platform's path rules (a test passes
 * another platform's).
 */
export function userGuidePath(appPath: string, paths: PlatformPath = path): string {
  const root = appPath.endsWith(ASAR_ARCHIVE_SUFFIX) ? paths.join(paths.dirname(appPath), `${paths.basename(appPath)}${UNPACKED_SUFFIX}`) : appPath;
  return paths.join(root, ...USER_GUIDE_PATH);
}
