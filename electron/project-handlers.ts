// The project intents' handlers: list, open, save, save as, autosave, find or
// discard recovered work, and the recent projects (each file opened or saved is put
// first on the list; a recent file is reopened through the handle the host gives it). Plain functions over the host's ProjectAccess, so both
// hosts and the tests run the same code. Paths come only from the host's places (a
// dialog the user answered, or the browser workspace) and from the handles given for
// them; a project's scans are read from its own folder or its embedded copies.
import { mkdir, readdir, stat, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import type { HostIntents, OpenedProject, ProjectHandle, ProjectListing, RecentProject, RecoveredWork, SavedProject } from './api-contract.ts';
import type { HostContext } from './host-context.ts';
import { HandlerError } from './handler-error.ts';
import { fileFailure } from './file-failure.ts';
import { UNTITLED_PREFIX, type ProjectPlace } from './places/project-handles.ts';
import { autosaveProject as writeRecovery, findRecovery, loadProject, recoveryPathFor, saveProject as writeProject } from './io/project/project-file.ts';
import { withEmbeddedScans } from './io/project/project-scans.ts';
import { PROJECT_EXTENSION, type ProjectData } from './io/project/project-schema.ts';

type Args<K extends keyof HostIntents> = HostIntents[K]['args'];

/** The name shown for a place: the project file's name, or null for a project never saved. */
function placeName(place: ProjectPlace): string | null {
  return place.kind === 'file' ? basename(place.path) : null;
}

/** `project` with every scan's bytes embedded, read from the project's folder or its own copies. */
async function withScanBytes(projectPath: string, project: ProjectData, action: 'open' | 'read the recovered work of'): Promise<ProjectData> {
  try {
    return await withEmbeddedScans(projectPath, project);
  } catch (error) {
    throw fileFailure(error, action, basename(projectPath));
  }
}

/** The name a save dialog suggests: the font's family name as a file name. */
function suggestedFileName(project: ProjectData): string {
  const base = project.font.familyName.replace(/[/\\:*?"<>|\u0000-\u001f]+/g, ' ').trim() || 'Untitled';
  return `${base}${PROJECT_EXTENSION}`;
}

async function removeRecovery(projectPath: string): Promise<boolean> {
  try {
    await unlink(recoveryPathFor(projectPath));
    return true;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false;
    throw error;
  }
}

/** The place the user chose, with a file-system failure while checking it turned into a message. */
async function chosen(choose: () => Promise<string | null>, action: 'open' | 'save'): Promise<string | null> {
  try {
    return await choose();
  } catch (error) {
    throw fileFailure(error, action, 'the chosen project');
  }
}

export async function listProjects(_args: Args<'listProjects'>, context: HostContext): Promise<ProjectListing> {
  try {
    return await context.projects.places.list();
  } catch (error) {
    throw fileFailure(error, 'open', 'the workspace folder');
  }
}

export async function openProject(args: Args<'openProject'>, context: HostContext): Promise<OpenedProject | null> {
  const path = await chosen(() => context.projects.places.chooseToOpen(args.name), 'open');
  if (path === null) return null;
  return openAt(path, context);
}

/** Reads the project at `path` (a place the user chose), remembers it and puts it first among the recent projects. */
async function openAt(path: string, context: HostContext): Promise<OpenedProject> {
  const name = basename(path);
  let project: ProjectData;
  try {
    project = await loadProject(path);
  } catch (error) {
    throw fileFailure(error, 'open', name);
  }
  project = await withScanBytes(path, project, 'open');
  await context.recent.add(path);
  return { handle: context.projects.handles.remember({ kind: 'file', path }), name, project };
}

export async function listRecentProjects(_args: Args<'listRecentProjects'>, context: HostContext): Promise<{ projects: RecentProject[] }> {
  const projects: RecentProject[] = [];
  for (const path of await context.recent.list()) {
    if (!(await context.projects.places.mayReopen(path))) continue;
    const info = await stat(path).catch(() => null);
    if (info === null || !info.isFile()) continue; // moved, deleted or on a drive not attached now: not offered, but kept
    projects.push({ handle: context.projects.handles.remember({ kind: 'file', path }), name: basename(path), folderName: basename(dirname(path)) });
  }
  return { projects };
}

export async function openRecentProject(args: Args<'openRecentProject'>, context: HostContext): Promise<OpenedProject> {
  const place = context.projects.handles.place(args.handle);
  if (place.kind !== 'file') {
    throw new HandlerError('bad-arguments', 'This project has not been saved to a file yet, so it cannot be opened from the recent list. This is a bug in the app: please report it.');
  }
  if (!(await context.projects.places.mayReopen(place.path))) {
    throw new HandlerError('path-refused', `${basename(place.path)} is not in the workspace folder, so it cannot be opened here. Use Open… to choose a project of the workspace.`);
  }
  const info = await stat(place.path).catch(() => null);
  if (info === null || !info.isFile()) {
    await context.recent.remove(place.path);
    throw new HandlerError('project-file', `${basename(place.path)} is no longer in the folder “${basename(dirname(place.path))}” (it was moved, renamed or deleted), so it was taken off the recent projects. Use Open… to find it.`);
  }
  return openAt(place.path, context);
}

export async function saveProject(args: Args<'saveProject'>, context: HostContext): Promise<SavedProject> {
  const place = context.projects.handles.place(args.handle);
  if (place.kind !== 'file') {
    throw new HandlerError('bad-arguments', 'This project has not been saved to a file yet: use Save as… to choose where to keep it.');
  }
  const name = basename(place.path);
  try {
    await writeProject(place.path, args.project);
  } catch (error) {
    throw fileFailure(error, 'save', name);
  }
  return { handle: args.handle, name };
}

export async function saveProjectAs(args: Args<'saveProjectAs'>, context: HostContext): Promise<SavedProject | null> {
  const path = await chosen(() => context.projects.places.chooseToSave(args.name, suggestedFileName(args.project)), 'save');
  if (path === null) return null;
  const name = basename(path);
  try {
    await writeProject(path, args.project);
  } catch (error) {
    throw fileFailure(error, 'save', name);
  }
  await context.recent.add(path);
  // The work now lives in the new file: the autosaved copy of where it came from is superseded.
  const previous = args.replacing === undefined ? undefined : context.projects.handles.find(args.replacing);
  if (previous !== undefined && previous.path !== path) await removeRecovery(previous.path).catch(() => false);
  return { handle: context.projects.handles.remember({ kind: 'file', path }), name };
}

export async function autosaveProject(args: Args<'autosaveProject'>, context: HostContext): Promise<{ handle: ProjectHandle }> {
  const { handles, untitledFolder } = context.projects;
  const handle = args.handle ?? handles.newUntitled(untitledFolder);
  const place = handles.place(handle);
  try {
    if (place.kind === 'untitled') await mkdir(untitledFolder, { recursive: true });
    await writeRecovery(place.path, args.project);
  } catch (error) {
    throw fileFailure(error, 'autosave', placeName(place) ?? 'the unsaved project');
  }
  return { handle };
}

/** The untitled places in `folder` that hold a recovery copy, as project paths. */
async function untitledPlacesIn(folder: string): Promise<string[]> {
  const names = await readdir(folder).catch(() => [] as string[]);
  const prefix = `.${UNTITLED_PREFIX}`;
  const suffix = `${PROJECT_EXTENSION}.recovery`;
  return names.filter((n) => n.startsWith(prefix) && n.endsWith(suffix)).map((n) => join(folder, n.slice(1, -'.recovery'.length)));
}

export async function findRecoveredWork(args: Args<'findRecoveredWork'>, context: HostContext): Promise<RecoveredWork | null> {
  const { handles, untitledFolder } = context.projects;
  let place: ProjectPlace;
  let found: Awaited<ReturnType<typeof findRecovery>> = null;
  if (args.handle !== undefined) {
    place = handles.place(args.handle);
    found = await findRecovery(place.path);
  } else {
    // The latest work of any project never saved: the newest valid copy in the recovery folder.
    place = { kind: 'untitled', path: '' };
    for (const path of await untitledPlacesIn(untitledFolder)) {
      const candidate = await findRecovery(path);
      if (candidate !== null && (found === null || candidate.savedAt > found.savedAt)) {
        found = candidate;
        place = { kind: 'untitled', path };
      }
    }
  }
  if (found === null) return null;
  const project = await withScanBytes(place.path, found.project, 'read the recovered work of');
  return { handle: args.handle ?? handles.remember(place), name: placeName(place), savedAt: found.savedAt.toISOString(), project };
}

export async function discardRecoveredWork(args: Args<'discardRecoveredWork'>, context: HostContext): Promise<{ discarded: boolean }> {
  const place = context.projects.handles.place(args.handle);
  try {
    return { discarded: await removeRecovery(place.path) };
  } catch (error) {
    throw fileFailure(error, 'discard the recovered work of', placeName(place) ?? 'the unsaved project');
  }
}
