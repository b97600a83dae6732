// Project files (and exported fonts) inside the browser-mode workspace: the one
// folder the browser host was started in. The page names a file by its bare name;
// this resolves the name inside the workspace and refuses anything that would leave it — folders,
// "..", absolute paths, and symlinks whose target lies outside — with a message
// saying what to do instead. The checks run just before each use; a file swapped for
// a link in the instant between check and write is not guarded against (the
// workspace is the user's own folder on their own machine).
import { lstat, readdir, realpath, stat } from 'node:fs/promises';
import { basename, isAbsolute, join, relative } from 'node:path';
import { HandlerError } from '../handler-error.ts';
import { PROJECT_EXTENSION } from '../io/project/project-schema.ts';

/** Longest file name taken: NAME_MAX of ext4, APFS and NTFS (255). */
export const MAX_FILE_NAME_LENGTH = 255;

/** At most this many projects are listed: a page-sized list; a folder with more is not a lettering workspace. */
export const MAX_LISTED_PROJECTS = 1000;

/** Characters a bare file name may not hold: separators of every system, the Windows drive colon, and control characters. */
const FORBIDDEN_IN_NAME = /[/\\:\u0000-\u001f\u007f]/;

/** Whether `name` is spelled like a file with `extension` (in any case), with something before it. */
function hasExtension(name: string, extension: string): boolean {
  return name.toLowerCase().endsWith(extension) && name.length > extension.length;
}

/** Whether `name` is spelled like a project file (the extension in any case). */
export function hasProjectExtension(name: string): boolean {
  return hasExtension(name, PROJECT_EXTENSION);
}

/** A kind of file the page may name in the workspace: how it ends, and what to call it in messages. */
export interface WorkspaceFileKind {
  readonly extension: string;
  /** "project file", "font file". */
  readonly noun: string;
}

export const PROJECT_FILE: WorkspaceFileKind = { extension: PROJECT_EXTENSION, noun: 'project file' };

/**
 * `name` checked as a bare project file name, with the extension added when
 * `addExtension` is set and it has none. Throws HandlerError 'path-refused'.
 */
export function checkedProjectName(name: string, folderName: string, addExtension: boolean): string {
  return checkedFileName(name, folderName, addExtension, PROJECT_FILE);
}

/**
 * `name` checked as a bare file name of `kind`, with its extension added when
 * `addExtension` is set and it has none. Throws HandlerError 'path-refused'.
 */
export function checkedFileName(name: string, folderName: string, addExtension: boolean, kind: WorkspaceFileKind): string {
  const refuse = (why: string) =>
    new HandlerError('path-refused', `"${name.length > 80 ? `${name.slice(0, 80)}…` : name}" was refused: ${why}. Choose a ${kind.noun} directly inside the workspace folder "${folderName}".`);
  if (name.length === 0) throw refuse('the name is empty');
  if (name.length > MAX_FILE_NAME_LENGTH) throw refuse(`a file name has at most ${MAX_FILE_NAME_LENGTH} characters`);
  if (isAbsolute(name) || FORBIDDEN_IN_NAME.test(name)) throw refuse('it names a path or a folder, not a file in the workspace');
  if (name === '.' || name === '..' || name.startsWith('.')) throw refuse('names starting with "." are hidden or lead out of the folder');
  const withExtension = hasExtension(name, kind.extension) ? name : addExtension ? `${name}${kind.extension}` : null;
  if (withExtension === null) throw refuse(`a ${kind.noun}'s name ends in "${kind.extension}"`);
  if (withExtension.length > MAX_FILE_NAME_LENGTH) throw refuse(`a file name has at most ${MAX_FILE_NAME_LENGTH} characters`);
  return withExtension;
}

/** Whether `path` lies inside (or is) the folder `folder`; both real paths. */
function isInside(folder: string, path: string): boolean {
  const rel = relative(folder, path);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/**
 * The real path of the workspace file `name` (already checked). For `mustExist`,
 * the file must be there and be a file. A symlink is followed only when its target
 * is inside the workspace. Throws HandlerError 'path-refused'.
 */
export async function resolveWorkspaceFile(workspace: string, name: string, mustExist: boolean, kind: WorkspaceFileKind = PROJECT_FILE): Promise<string> {
  const folderName = basename(workspace);
  const path = join(workspace, name);
  const outside = () =>
    kind === PROJECT_FILE
      ? new HandlerError('path-refused', `"${name}" is a link to a file outside the workspace folder "${folderName}", and Stemline opens and saves projects only inside it. Copy the project into the folder instead.`)
      : new HandlerError('path-refused', `"${name}" is a link to a file outside the workspace folder "${folderName}", and Stemline writes files only inside it. Choose another name.`);
  let link;
  try {
    link = await lstat(path);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw error;
    if (mustExist) throw new HandlerError('path-refused', `There is no project "${name}" in the workspace folder "${folderName}" (it may have been moved or deleted). Choose one from the list again.`);
    return path;
  }
  let target = path;
  if (link.isSymbolicLink()) {
    try {
      target = await realpath(path);
    } catch {
      throw new HandlerError('path-refused', `"${name}" is a link to a file that does not exist. Remove the link or choose another name.`);
    }
    if (!isInside(workspace, target)) throw outside();
  }
  const info = await stat(target);
  if (!info.isFile()) throw new HandlerError('path-refused', `"${name}" in the workspace folder "${folderName}" is not a file. Choose a ${kind.noun}.`);
  return target;
}

/**
 * The project files directly inside `workspace` (a real path), by name: hidden files
 * (recovery copies among them) and links leading outside are left out.
 */
export async function listWorkspaceProjects(workspace: string): Promise<{ name: string; modifiedAt: string }[]> {
  const entries = await readdir(workspace, { withFileTypes: true });
  const projects: { name: string; modifiedAt: string }[] = [];
  for (const entry of entries) {
    if (entry.name.startsWith('.') || !hasProjectExtension(entry.name) || entry.name.length > MAX_FILE_NAME_LENGTH) continue;
    if (!entry.isFile() && !entry.isSymbolicLink()) continue;
    try {
      const path = await resolveWorkspaceFile(workspace, entry.name, true);
      projects.push({ name: entry.name, modifiedAt: (await stat(path)).mtime.toISOString() });
    } catch {
      continue; // refused (a link leading out) or gone since the listing: not offered
    }
  }
  return projects.sort((a, b) => a.name.localeCompare(b.name)).slice(0, MAX_LISTED_PROJECTS);
}
