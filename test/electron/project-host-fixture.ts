// A project host for the handler tests: real folders in a fresh temporary directory —
// a workspace, a folder outside it holding a file that must never be reached, and the
// host's own folder for projects never saved — with the browser host's project access
// (workspace places) or the desktop's (dialog places answering what the test scripts),
// and the host's own folder for its recent projects.
import { mkdtempSync, mkdirSync, realpathSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { invokeHandler, type HostContext } from '../../electron/handlers.ts';
import { NO_WINDOW, projectAccess } from '../../electron/host-context.ts';
import { RecentProjects, recentProjectsPath } from '../../electron/places/recent-projects.ts';
import { workspacePlaces } from '../../electron/places/workspace-places.ts';
import { dialogPlaces } from '../../electron/places/dialog-places.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { embedScan } from '../../electron/io/project/embedded-scan.ts';
import type { ProjectData } from '../../electron/io/project/project-schema.ts';
import type { HostIntents, IntentName } from '../../electron/api-contract.ts';

export interface ProjectHostFixture {
  /** The temporary directory holding everything below. */
  root: string;
  workspace: string;
  /** A folder beside the workspace; `secret` is a project file in it. */
  outside: string;
  secret: string;
  untitledFolder: string;
  /** The host's per-user folder (recent projects). */
  appFolder: string;
  context: HostContext;
  call<K extends IntentName>(intent: K, args: unknown): Promise<HostIntents[K]['result']>;
}

/** Text of the project file outside the workspace, so a test can see it was never read or replaced. */
export const SECRET_TEXT = '{"format":"stemline-project","formatVersion":2,"secret":true}';

function folders(): Omit<ProjectHostFixture, 'context' | 'call'> {
  const root = realpathSync(mkdtempSync(join(tmpdir(), 'stemline-handlers-')));
  const workspace = join(root, 'workspace');
  const outside = join(root, 'outside');
  const appFolder = join(root, 'app-data');
  const untitledFolder = join(appFolder, 'Recovery');
  mkdirSync(workspace);
  mkdirSync(outside);
  const secret = join(outside, 'secret.stemline');
  writeFileSync(secret, SECRET_TEXT);
  return { root, workspace, outside, secret, untitledFolder, appFolder };
}

function withCall(base: Omit<ProjectHostFixture, 'call'>): ProjectHostFixture {
  return { ...base, call: (intent, args) => invokeHandler(intent, args, base.context) as never };
}

/** Browser mode: projects by name inside `workspace`. */
export function browserHostFixture(): ProjectHostFixture {
  const base = folders();
  return withCall({ ...base, context: { host: 'browser', projects: projectAccess(workspacePlaces(base.workspace), base.untitledFolder), recent: new RecentProjects(recentProjectsPath(base.appFolder)), window: NO_WINDOW } });
}

/** Desktop mode: each dialog call takes the next scripted answer (null: the user cancelled). */
export function desktopHostFixture(answers: { open: (string | null)[]; save: (string | null)[]; exportFont?: (string | null)[]; scan?: (string | null)[] }): ProjectHostFixture & { suggested: string[] } {
  const base = folders();
  const suggested: string[] = [];
  const places = dialogPlaces({
    showOpen: async () => answers.open.shift() ?? null,
    showSave: async (name) => {
      suggested.push(name);
      return answers.save.shift() ?? null;
    },
    showExportFont: async (name) => {
      suggested.push(name);
      return answers.exportFont?.shift() ?? null;
    },
    showOpenScan: async () => answers.scan?.shift() ?? null,
  });
  return { ...withCall({ ...base, context: { host: 'electron', projects: projectAccess(places, base.untitledFolder), recent: new RecentProjects(recentProjectsPath(base.appFolder)), window: NO_WINDOW } }), suggested };
}

/** Bytes standing in for a scan: the handlers only move them, never decode them. */
export const SCAN_BYTES = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 1, 2, 3, 4, 5]);

/** A small project as the app sends it: one scan embedded (no file for it), one glyph traced from it. */
export function sampleProject(advanceWidth = 300): ProjectData {
  return {
    ...newProject('Harbour Signs'),
    scans: [{ id: 'scan-1', path: 'sheet.png', embedded: embedScan(SCAN_BYTES), characters: 'I' }],
    glyphs: [
      {
        unicodes: ['0049'],
        advanceWidth,
        outline: { contours: [[[50, 0, 'on'], [250, 0, 'on'], [250, 700, 'on'], [50, 700, 'on']]] },
        source: { scan: 'scan-1', letter: 0 },
      },
    ],
  };
}

/** The project as read back, without the "savedBy" stamp a save adds. */
export function withoutStamp(project: ProjectData): ProjectData {
  const { savedBy: _savedBy, ...rest } = project;
  return rest;
}
