// The Electron main process: one window showing the renderer, with every intent
// answered by the shared handlers (handlers.ts). Kept thin on purpose: all logic
// lives in plain functions that are tested without Electron.
import { app, BrowserWindow, ipcMain, session } from 'electron';
import { join } from 'node:path';
import { APP_NAME } from './app-identity.ts';
import { channelFor, INTENT_NAMES } from './api-contract.ts';
import { invokeHandler } from './handlers.ts';
import { HandlerError } from './handler-error.ts';

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
        return { result: await invokeHandler(intent, args, { host: 'electron' }) };
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
