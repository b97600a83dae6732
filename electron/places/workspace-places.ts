// Browser mode's project places: the workspace folder the browser host was started
// in (`npm start` passes the current directory or a folder named on the command
// line). The page lists its project files and sends back a chosen name, which is
// resolved inside the folder (workspace-files.ts); fonts are exported there too, under
// a name the page chooses. There are no other places.
import { realpath, stat } from 'node:fs/promises';
import { basename, dirname } from 'node:path';
import { HandlerError } from '../handler-error.ts';
import type { ProjectPlaces } from './project-places.ts';
import { checkedFileName, checkedProjectName, listWorkspaceProjects, resolveWorkspaceFile, type WorkspaceFileKind } from './workspace-files.ts';
import { FONT_FILE_EXTENSION } from '../io/font/write-font-file.ts';

/** An exported font in the workspace. */
const FONT_FILE: WorkspaceFileKind = { extension: FONT_FILE_EXTENSION, noun: 'font file' };

/** Checks that `folder` is a folder and returns its real path; the message says what to pass instead. */
export async function realWorkspace(folder: string): Promise<string> {
  let real: string;
  try {
    real = await realpath(folder);
  } catch {
    throw new Error(`The workspace folder ${folder} does not exist. Start Stemline in the folder that holds your projects, or name one: npm start -- /path/to/folder`);
  }
  if (!(await stat(real)).isDirectory()) throw new Error(`The workspace ${folder} is not a folder. Name the folder that holds your projects.`);
  return real;
}

/** The places of a workspace whose real path is `workspace` (see realWorkspace). */
export function workspacePlaces(workspace: string): ProjectPlaces {
  const folderName = basename(workspace);
  const requireName = (name: string | undefined, what: string): string => {
    if (name === undefined) throw new HandlerError('bad-arguments', `In the browser, ${what} needs a file name chosen in the page. This is a bug in the app: please report it.`);
    return name;
  };
  return {
    list: async () => ({ kind: 'workspace', folderName, projects: await listWorkspaceProjects(workspace) }),
    chooseToOpen: async (name) => resolveWorkspaceFile(workspace, checkedProjectName(requireName(name, 'opening a project'), folderName, false), true),
    chooseToSave: async (name) => resolveWorkspaceFile(workspace, checkedProjectName(requireName(name, 'saving a project'), folderName, true), false),
    mayReopen: async (path) => {
      if (dirname(path) !== workspace) return false;
      try {
        checkedProjectName(basename(path), folderName, false);
        await resolveWorkspaceFile(workspace, basename(path), false);
        return true;
      } catch {
        return false;
      }
    },
    chooseScanToImport: async () => {
      throw new HandlerError('path-refused', 'In the browser, scans are chosen in the page: use its "Open a scan…" button. This is a bug in the app: please report it.');
    },
    chooseToExportFont: async (name) => resolveWorkspaceFile(workspace, checkedFileName(requireName(name, 'exporting the font'), folderName, true, FONT_FILE), false, FONT_FILE),
  };
}
