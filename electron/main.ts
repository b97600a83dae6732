// The Electron main process: one window showing the renderer, with every intent
// answered by the shared handlers (handlers.ts). Kept thin on purpose: all logic
// lives in plain functions that are tested without Electron. Project files are
// chosen in Electron's open and save dialogs (places/dialog-places.ts); each window
// remembers the files its user answered.
import { app, BrowserWindow, dialog, ipcMain, session, type WebContents } from 'electron';
import { join } from 'node:path';
import { APP_NAME } from './app-identity.ts';
import { channelFor, INTENT_NAMES } from './api-contract.ts';
import { invokeHandler } from './handlers.ts';
import { HandlerError } from './handler-error.ts';
import { projectAccess, type ProjectAccess } from './host-context.ts';
import { dialogPlaces } from './places/dialog-places.ts';
import { untitledRecoveryFolder } from './places/app-data-folder.ts';
import { PROJECT_EXTENSION } from './io/project/project-schema.ts';
import { FONT_FILE_EXTENSION } from './io/font/write-font-file.ts';

/** The file-type filter of the project dialogs. */
const PROJECT_FILTERS = [{ name: `${APP_NAME} project`, extensions: [PROJECT_EXTENSION.slice(1)] }];

/** The file-type filter of the font export dialog. */
const FONT_FILTERS = [{ name: 'OpenType font', extensions: [FONT_FILE_EXTENSION.slice(1)] }];

/** Each window's project access: its dialogs and the paths its user answered. */
const accessByWindow = new Map<number, ProjectAccess>();

function accessFor(contents: WebContents): ProjectAccess {
  let access = accessByWindow.get(contents.id);
  if (access) return access;
  const parent = () => BrowserWindow.fromWebContents(contents) ?? undefined;
  access = projectAccess(
    dialogPlaces({
      showOpen: async () => {
        const options = { properties: ['openFile' as const], filters: PROJECT_FILTERS };
        const window = parent();
        const answer = window ? await dialog.showOpenDialog(window, options) : await dialog.showOpenDialog(options);
        return answer.canceled ? null : (answer.filePaths[0] ?? null);
      },
      showSave: async (suggestedName) => {
        const options = { defaultPath: suggestedName, filters: PROJECT_FILTERS };
        const window = parent();
        const answer = window ? await dialog.showSaveDialog(window, options) : await dialog.showSaveDialog(options);
        return answer.canceled ? null : (answer.filePath || null);
      },
      showExportFont: async (suggestedName) => {
        const options = { title: 'Export the font', defaultPath: suggestedName, filters: FONT_FILTERS };
        const window = parent();
        const answer = window ? await dialog.showSaveDialog(window, options) : await dialog.showSaveDialog(options);
        return answer.canceled ? null : (answer.filePath || null);
      },
    }),
    untitledRecoveryFolder(),
  );
  accessByWindow.set(contents.id, access);
  contents.once('destroyed', () => accessByWindow.delete(contents.id));
  return access;
}

/** Opening window size in CSS pixels: room for a glyph canvas beside its panels. */
const INITIAL_WINDOW_SIZE = { width: 1280, height: 820 };

function createWindow(): BrowserWindow {
  const window = new BrowserWindow({
    ...INITIAL_WINDOW_SIZE,
    title: APP_NAME,
    webPreferences: {
      preload: join(import.meta.dirname, 'preload.cjs'),
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      webSecurity: true,
    },
  });
  window.webContents.on('will-navigate', (event) => event.preventDefault());
  window.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
  void window.loadFile(join(app.getAppPath(), 'build', 'renderer', 'index.html'));
  return window;
}

function registerIntents(): void {
  for (const intent of INTENT_NAMES) {
    ipcMain.handle(channelFor(intent), async (event, args: unknown) => {
      if (event.senderFrame?.url.startsWith('file://') !== true) {
        return { error: { kind: 'forbidden', message: 'Requests are only taken from the app’s own window.' } };
      }
      try {
        return { result: await invokeHandler(intent, args, { host: 'electron', projects: accessFor(event.sender) }) };
      } catch (error) {
        if (error instanceof HandlerError) return { error: error.toPayload() };
        throw error;
      }
    });
  }
}

app.whenReady().then(() => {
  session.defaultSession.setPermissionRequestHandler((_contents, _permission, decide) => decide(false));
  registerIntents();
  createWindow();
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) createWindow();
  });
});

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
