// The narrow API between the renderer and the host (Electron main process or the
// browser-mode host). One entry per user intent; the renderer imports only these
// types, never host code. Both hosts route every call through `invokeHandler`
// (handlers.ts), so the same plain, tested functions answer in either mode.
//
// Project files are never named by path from the renderer: a project is chosen in
// the host's file dialog (desktop) or by its file name from the workspace listing
// (browser mode), and is afterwards referred to by the opaque handle the host gave
// for it.
import type { ProjectData } from './io/project/project-schema.ts';

/** Which host is serving the renderer. */
export type HostKind = 'electron' | 'browser';

/** What the about screen and the title bar show. */
export interface AppInfo {
  name: string;
  version: string;
  host: HostKind;
  /** Platform string of the machine running the host (e.g. 'linux'). */
  platform: string;
  /** Whether this host offers the demo project (openDemo answers with it), so an empty project can offer the way back to it. */
  demoOffered: boolean;
}

/**
 * The host's name for a project place the user chose (a file they opened or saved,
 * or the recovery place of a project never saved): opaque, valid while the host runs.
 */
export type ProjectHandle = string;

/** How the user chooses project files in this host. */
export type ProjectListing =
  /** The host shows its own file dialog; there is nothing to list in the page. */
  | { kind: 'dialog' }
  /** Browser mode: the page lists the project files of the workspace folder the host was started in. */
  | { kind: 'workspace'; folderName: string; projects: WorkspaceProject[] };

export interface WorkspaceProject {
  /** File name inside the workspace, e.g. "harbour.stemline". */
  name: string;
  /** When it was last saved, ISO 8601. */
  modifiedAt: string;
}

/**
 * A project the host read. Every scan carries its bytes in `embedded` (from the
 * scan's file beside the project, or the project's own copy when the file is missing).
 */
export interface OpenedProject {
  handle: ProjectHandle;
  /** The project file's name, for the title bar. */
  name: string;
  project: ProjectData;
}

/** Where a project was saved. */
export interface SavedProject {
  handle: ProjectHandle;
  name: string;
}

/** Autosaved work newer than its project file (or of a project never saved). */
export interface RecoveredWork {
  /** The project the work belongs to: its file's handle, or a never-saved project's recovery handle. */
  handle: ProjectHandle;
  /** The project file's name, or null for a project never saved. */
  name: string | null;
  /** When the work was autosaved, ISO 8601. */
  savedAt: string;
  /** The work, with scan bytes as in OpenedProject. */
  project: ProjectData;
}

/**
 * A font as the renderer assembles it from the project in the window: the font's
 * settings and its glyphs exactly as a project file holds them (no scans).
 */
export interface FontContent {
  font: ProjectData['font'];
  glyphs: ProjectData['glyphs'];
}

/** The proof font the host built in memory. */
export interface ProofFont {
  /** The OpenType (CFF) font file's bytes, in standard base64. */
  base64: string;
  /** Every character the font maps, each once, in code point order (the space always among them). */
  characters: string[];
}

/** A project the user opened or saved lately, as the renderer may show it: never its path. */
export interface RecentProject {
  /** The host's handle for the file, for openRecentProject. */
  handle: ProjectHandle;
  /** The project file's name, e.g. "harbour.stemline". */
  name: string;
  /** The name of the folder holding it (not its path), to tell projects of the same name apart. */
  folderName: string;
}

/**
 * What the window tells its host about its project, whenever it changes: the desktop
 * shell titles the window with it, enables its menu items by it and asks before closing
 * a window with unsaved changes.
 */
export interface ProjectState {
  /** The project's title ("harbour", "Untitled project"). */
  title: string;
  /** Whether the window holds a project with something in it (a scan or letters). */
  hasProject: boolean;
  hasUnsavedChanges: boolean;
  canUndo: boolean;
  canRedo: boolean;
}

/** A scan the user chose in the host's dialog, for the page to decode and trace. */
export interface ImportedScan {
  /** The scan file's name, e.g. "sheet-1.png". */
  name: string;
  /** The file's bytes (carried as they are over the desktop app's IPC). */
  bytes: Uint8Array;
}

/**
 * A scan the host decoded for the page (decodeScan): its 8-bit greys as a lossless
 * greyscale PNG, which the page decodes to exactly these values and shows as the sheet.
 */
export interface DecodedScanImage {
  width: number;
  height: number;
  /** The resolution the file records, in dots per inch; absent when it records none. */
  dpi?: number;
  /** The file's format as the decoder names it, e.g. 'tiff'. */
  format: string;
  /** Whether the file stores one bit per pixel. */
  bilevel: boolean;
  /** Things the user should know about how the file was read (e.g. only the first of several pages). */
  notes: string[];
  /** The greys as a PNG file, in standard base64. */
  pngBase64: string;
}

/** Where an exported font was written. */
export interface ExportedFont {
  /** The font file's name, e.g. "Harbour Signs.otf". */
  name: string;
  /** The full path of the file written. */
  path: string;
  /** Whether a file of that name was there before and has been replaced. */
  replaced: boolean;
}

/**
 * The demo project Stemline opens on: sheets drawn for an invented client (electron/demo/),
 * each as PNG bytes for the page to decode, with the characters drawn on it.
 */
export interface DemoProject {
  /** What the window calls the project, e.g. "Demo: the Pellworth & Daughters sign alphabet". */
  title: string;
  /** The story behind it, in a sentence. */
  description: string;
  /** The font family its letters make. */
  familyName: string;
  sheets: DemoSheet[];
}

export interface DemoSheet {
  /** The scan's file name, e.g. "pellworth-alphabet.png". */
  name: string;
  /** The PNG file's bytes, in standard base64. */
  base64: string;
  /** The characters drawn, in reading order (rows separated by spaces). */
  characters: string;
}

/**
 * Every intent the renderer may ask of the host, with its argument and result.
 * Later capabilities add entries here; each must validate its own arguments.
 */
export interface HostIntents {
  appInfo: { args: Record<string, never>; result: AppInfo };
  /** The project files the user can choose from in the page (browser mode), or that the host uses dialogs. */
  listProjects: { args: Record<string, never>; result: ProjectListing };
  /** Opens a project: `name` from the workspace listing in browser mode, the file dialog otherwise. Null: the user cancelled. */
  openProject: { args: { name?: string }; result: OpenedProject | null };
  /** Saves over the project file `handle` names (one the user opened or saved). */
  saveProject: { args: { handle: ProjectHandle; project: ProjectData }; result: SavedProject };
  /**
   * Saves to a file the user chooses now: `name` in the workspace in browser mode,
   * the save dialog otherwise. `replacing`: the project's previous handle, whose
   * autosaved copy the save supersedes. Null: the user cancelled.
   */
  saveProjectAs: { args: { project: ProjectData; name?: string; replacing?: ProjectHandle }; result: SavedProject | null };
  /** Writes the recovery copy of the project `handle` names; without one, of a project never saved (the result names its place). */
  autosaveProject: { args: { handle?: ProjectHandle; project: ProjectData }; result: { handle: ProjectHandle } };
  /** Autosaved work newer than the project file `handle` names; without a handle, the latest work of a project never saved. */
  findRecoveredWork: { args: { handle?: ProjectHandle }; result: RecoveredWork | null };
  /** Deletes the autosaved copy of the project `handle` names. */
  discardRecoveredWork: { args: { handle: ProjectHandle }; result: { discarded: boolean } };
  /** Builds the font for `font` and `glyphs` in memory, for the proof; nothing is written. */
  buildProofFont: { args: FontContent; result: ProofFont };
  /**
   * Writes the font as an .otf file the user chooses now: `name` in the workspace in
   * browser mode, the save dialog otherwise. Null: the user cancelled.
   */
  exportFont: { args: FontContent & { name?: string }; result: ExportedFont | null };
  /** The demo project to open when the window starts with no project; null where this host offers none. */
  openDemo: { args: Record<string, never>; result: DemoProject | null };
  /** The projects the user opened or saved lately that this host can open again, most recent first. */
  listRecentProjects: { args: Record<string, never>; result: { projects: RecentProject[] } };
  /** Opens the project file `handle` names: one from listRecentProjects, or a file the system asked the app to open. */
  openRecentProject: { args: { handle: ProjectHandle }; result: OpenedProject };
  /** Desktop app: asks for a scan in the open dialog and returns its bytes. Null: the user cancelled. Browser mode refuses (the page takes scans itself). */
  importScan: { args: Record<string, never>; result: ImportedScan | null };
  /**
   * Decodes a scan file the page cannot decode itself (TIFF, including 1-bit Group 4),
   * with the command line's decoder and limits: `name` for messages, the file's bytes in base64.
   */
  decodeScan: { args: { name: string; base64: string }; result: DecodedScanImage };
  /** The window's project state changed (title, unsaved changes, undo and redo). */
  reportProjectState: { args: ProjectState; result: Record<string, never> };
  /** Closes the window now, once its work is saved (after the close prompt's Save). False where the host has no window to close (browser mode). */
  closeWindow: { args: Record<string, never>; result: { closed: boolean } };
}

export type IntentName = keyof HostIntents;

/** One function per intent. */
export type HostIntentApi = {
  [K in IntentName]: (args: HostIntents[K]['args']) => Promise<HostIntents[K]['result']>;
};

/**
 * The commands the desktop shell's menus send to the page, a closed set: each maps to
 * one of the page's own actions (renderer/src/menu-commands.ts). 'save-and-close' is
 * sent by the close prompt's Save button: the page saves, then asks to close.
 */
export const MENU_COMMANDS = [
  'save-project',
  'save-project-as',
  'import-scans',
  'export-font',
  'undo',
  'redo',
  'select-all',
  'delete-selection',
  'zoom-in',
  'zoom-out',
  'toggle-combs',
  'toggle-scan-backdrop',
  'toggle-proof',
  'save-and-close',
] as const;

export type MenuCommand = (typeof MENU_COMMANDS)[number];

/** What the shell sends the page: a command, or a project to open (File ▸ Open recent, or a file the system handed the app). */
export type MenuMessage = { command: MenuCommand } | { command: 'open-recent'; handle: ProjectHandle };

/** The object the preload script exposes as `window.stemline`: the intents, and the one event of the shell's menus. */
export type StemlineHostApi = HostIntentApi & {
  /** Calls `listener` with each menu command; returns the function that stops listening. Browser mode has no menu: it never calls. */
  onMenuCommand(listener: (message: MenuMessage) => void): () => void;
};

/** The events the preload exposes beside the intents. */
export const BRIDGE_EVENT_NAMES = ['onMenuCommand'] as const satisfies readonly (keyof StemlineHostApi)[];

/** The channel the shell's menu commands travel on. */
export const MENU_COMMAND_CHANNEL = 'stemline:menu-command';

/** Names of every intent, in one list both hosts and the preload agree on. */
export const INTENT_NAMES = [
  'appInfo',
  'listProjects',
  'openProject',
  'saveProject',
  'saveProjectAs',
  'autosaveProject',
  'findRecoveredWork',
  'discardRecoveredWork',
  'buildProofFont',
  'exportFont',
  'openDemo',
  'listRecentProjects',
  'openRecentProject',
  'importScan',
  'decodeScan',
  'reportProjectState',
  'closeWindow',
] as const satisfies readonly IntentName[];

/** The IPC channel an intent travels on in the Electron shell. */
export function channelFor(intent: IntentName): string {
  return `stemline:${intent}`;
}

/**
 * A failure the renderer can show the user as is: `message` says what was wrong
 * and what to do. Hosts send it across as `{ error: { kind, message } }`.
 */
export interface HostErrorPayload {
  kind: string;
  message: string;
}
