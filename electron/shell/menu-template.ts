// The application menu, described as plain data from the state of the focused window
// (is a project open, does it have unsaved changes, can it undo or redo) and the recent
// projects: File, Edit, View and Help, plus the app menu on macOS. Each item either
// sends one command of the closed set (api-contract.ts MENU_COMMANDS) to the page,
// runs an action of the main process (a new project's window, the open dialog, a
// recent project, close, quit, the user guide), or is one of Electron's standard roles for the macOS app menu.
// electron/main.ts turns the description into Electron's menu; a test reads it.
import type { MenuCommand } from '../api-contract.ts';
import { APP_NAME } from '../app-identity.ts';

/** What the menu shows depends on: the focused window's project, and the recent projects. */
export interface MenuState {
  /** Whether a window is focused that shows the app (false: no window, e.g. on macOS after closing the last). */
  hasWindow: boolean;
  /** Whether the focused window holds a project with something in it (a scan or letters). */
  hasProject: boolean;
  hasUnsavedChanges: boolean;
  canUndo: boolean;
  canRedo: boolean;
  /** Recent project files, most recent first, as the menu names them. */
  recent: readonly { name: string; folder: string }[];
  platform: NodeJS.Platform;
}

/** Actions the main process carries out itself. */
export type MainAction = 'new-window' | 'open-dialog' | 'close-window' | 'quit' | 'open-user-guide' | 'about' | 'clear-recent';

export type MenuEntry =
  | { kind: 'command'; label: string; command: MenuCommand; accelerator?: string; enabled: boolean; pageHandlesKey?: true }
  | { kind: 'action'; label: string; action: MainAction; accelerator?: string; enabled: boolean }
  | { kind: 'recent'; label: string; index: number }
  | { kind: 'role'; role: 'services' | 'hide' | 'hideOthers' | 'unhide' | 'quit' }
  | { kind: 'separator' }
  | { kind: 'submenu'; label: string; entries: MenuEntry[]; enabled?: boolean };

export interface MenuSection {
  label: string;
  entries: MenuEntry[];
}

/** At most this many recent projects are listed in Open Recent (as recent-projects.ts keeps). */
export const RECENT_MENU_LENGTH = 10;

const SEPARATOR: MenuEntry = { kind: 'separator' };

/**
 * The menu for `state`. Items that need a window are disabled without one; Save is
 * enabled while there are unsaved changes; Undo and Redo follow the editor. Keys the
 * page answers itself (Ctrl+S, Ctrl+Z, +, −, Delete) are marked `pageHandlesKey`, so
 * the shell shows them without taking them from the page — one key press never acts twice.
 */
export function menuTemplate(state: MenuState): MenuSection[] {
  const mac = state.platform === 'darwin';
  const inWindow = state.hasWindow;
  const recentEntries: MenuEntry[] =
    state.recent.length === 0
      ? [{ kind: 'action', label: 'No recent projects', action: 'clear-recent', enabled: false }]
      : [
          ...state.recent.slice(0, RECENT_MENU_LENGTH).map((entry, index): MenuEntry => ({ kind: 'recent', label: `${entry.name} — ${entry.folder}`, index })),
          SEPARATOR,
          { kind: 'action', label: 'Clear the list', action: 'clear-recent', enabled: true },
        ];
  const file: MenuSection = {
    label: 'File',
    entries: [
      // One window per project: a new project is a new window, and Open… shows the file in a window of its own.
      { kind: 'action', label: 'New project', action: 'new-window', accelerator: 'CmdOrCtrl+N', enabled: true },
      { kind: 'action', label: 'Open…', action: 'open-dialog', accelerator: 'CmdOrCtrl+O', enabled: true },
      { kind: 'submenu', label: 'Open recent', entries: recentEntries },
      SEPARATOR,
      { kind: 'command', label: 'Save', command: 'save-project', accelerator: 'CmdOrCtrl+S', enabled: inWindow && state.hasUnsavedChanges, pageHandlesKey: true },
      { kind: 'command', label: 'Save as…', command: 'save-project-as', accelerator: 'CmdOrCtrl+Shift+S', enabled: inWindow, pageHandlesKey: true },
      SEPARATOR,
      { kind: 'command', label: 'Import scans…', command: 'import-scans', accelerator: 'CmdOrCtrl+I', enabled: inWindow },
      { kind: 'command', label: 'Export font…', command: 'export-font', accelerator: 'CmdOrCtrl+E', enabled: inWindow && state.hasProject },
      SEPARATOR,
      { kind: 'action', label: 'Close window', action: 'close-window', accelerator: 'CmdOrCtrl+W', enabled: inWindow },
      ...(mac ? [] : [{ kind: 'action', label: 'Quit', action: 'quit', accelerator: 'Ctrl+Q', enabled: true } satisfies MenuEntry]),
    ],
  };
  const edit: MenuSection = {
    label: 'Edit',
    entries: [
      { kind: 'command', label: 'Undo', command: 'undo', accelerator: 'CmdOrCtrl+Z', enabled: inWindow && state.canUndo, pageHandlesKey: true },
      { kind: 'command', label: 'Redo', command: 'redo', accelerator: mac ? 'Cmd+Shift+Z' : 'Ctrl+Y', enabled: inWindow && state.canRedo, pageHandlesKey: true },
      SEPARATOR,
      { kind: 'command', label: 'Select all', command: 'select-all', accelerator: 'CmdOrCtrl+A', enabled: inWindow },
      { kind: 'command', label: 'Delete', command: 'delete-selection', accelerator: 'Delete', enabled: inWindow, pageHandlesKey: true },
    ],
  };
  const view: MenuSection = {
    label: 'View',
    entries: [
      { kind: 'command', label: 'Zoom in', command: 'zoom-in', accelerator: 'Plus', enabled: inWindow, pageHandlesKey: true },
      { kind: 'command', label: 'Zoom out', command: 'zoom-out', accelerator: '-', enabled: inWindow, pageHandlesKey: true },
      SEPARATOR,
      { kind: 'command', label: 'Curvature combs', command: 'toggle-combs', accelerator: 'CmdOrCtrl+Shift+C', enabled: inWindow },
      { kind: 'command', label: 'Scan backdrop', command: 'toggle-scan-backdrop', accelerator: 'CmdOrCtrl+Shift+B', enabled: inWindow },
      SEPARATOR,
      { kind: 'command', label: 'Proof', command: 'toggle-proof', accelerator: 'CmdOrCtrl+P', enabled: inWindow && state.hasProject },
    ],
  };
  const help: MenuSection = {
    label: 'Help',
    entries: [
      { kind: 'action', label: `${APP_NAME} user guide`, action: 'open-user-guide', enabled: true },
      ...(mac ? [] : [SEPARATOR, { kind: 'action', label: `About ${APP_NAME}`, action: 'about', enabled: true } satisfies MenuEntry]),
    ],
  };
  const appMenu: MenuSection = {
    label: APP_NAME,
    entries: [
      { kind: 'action', label: `About ${APP_NAME}`, action: 'about', enabled: true },
      SEPARATOR,
      { kind: 'role', role: 'services' },
      SEPARATOR,
      { kind: 'role', role: 'hide' },
      { kind: 'role', role: 'hideOthers' },
      { kind: 'role', role: 'unhide' },
      SEPARATOR,
      { kind: 'role', role: 'quit' },
    ],
  };
  return mac ? [appMenu, file, edit, view, help] : [file, edit, view, help];
}

/** Every command the menu can send, in menu order (a test checks the set is the contract's). */
export function commandsIn(sections: readonly MenuSection[]): MenuCommand[] {
  const found: MenuCommand[] = [];
  const walk = (entries: readonly MenuEntry[]) => {
    for (const entry of entries) {
      if (entry.kind === 'command' && !found.includes(entry.command)) found.push(entry.command);
      if (entry.kind === 'submenu') walk(entry.entries);
    }
  };
  for (const section of sections) walk(section.entries);
  return found;
}
