// The desktop app's project places: the operating system's open and save dialogs
// (a save dialog of its own for exporting the font, an open dialog for importing a scan).
// The dialogs themselves are passed in (electron/main.ts wires Electron's `dialog`),
// so this logic runs and is tested in plain Node. A file name sent by the page is
// refused: in the desktop app only a dialog the user answered names a file.
import { isAbsolute } from 'node:path';
import { HandlerError } from '../handler-error.ts';
import { PROJECT_EXTENSION } from '../io/project/project-schema.ts';
import type { ProjectPlaces } from './project-places.ts';
import { hasProjectExtension } from './workspace-files.ts';
import { FONT_FILE_EXTENSION } from '../io/font/write-font-file.ts';

/** The file dialogs: each resolves to the absolute path the user answered, or null when they cancelled. */
export interface ProjectDialogs {
  showOpen(): Promise<string | null>;
  showSave(suggestedName: string): Promise<string | null>;
  /** The save dialog for exporting the font (its file-type filter: OpenType fonts). */
  showExportFont(suggestedName: string): Promise<string | null>;
  /** The open dialog for a scan (its file-type filter: the image types Stemline reads). */
  showOpenScan(): Promise<string | null>;
}

export function dialogPlaces(dialogs: ProjectDialogs): ProjectPlaces {
  const refuseName = (name: string | undefined): void => {
    if (name !== undefined) {
      throw new HandlerError('path-refused', 'In the desktop app files are chosen in the file dialog, but the app sent a file name instead. This is a bug in the app: please report it.');
    }
  };
  const answered = (path: string | null): string | null => {
    if (path !== null && !isAbsolute(path)) throw new HandlerError('path-refused', `The file dialog answered "${path}", which is not a full path. Choose the file again.`);
    return path;
  };
  return {
    list: async () => ({ kind: 'dialog' }),
    mayReopen: async (path) => isAbsolute(path) && hasProjectExtension(path),
    chooseScanToImport: async () => answered(await dialogs.showOpenScan()),
    chooseToOpen: async (name) => {
      refuseName(name);
      return answered(await dialogs.showOpen());
    },
    chooseToSave: async (name, suggestedName) => {
      refuseName(name);
      const path = answered(await dialogs.showSave(suggestedName));
      return path === null || hasProjectExtension(path) ? path : `${path}${PROJECT_EXTENSION}`;
    },
    chooseToExportFont: async (name, suggestedName) => {
      refuseName(name);
      const path = answered(await dialogs.showExportFont(suggestedName));
      return path === null || path.toLowerCase().endsWith(FONT_FILE_EXTENSION) ? path : `${path}${FONT_FILE_EXTENSION}`;
    },
  };
}
