// The Electron main process: one window per project, each showing the renderer from
// the app's own scheme, with every intent answered by the shared handlers
// (handlers.ts). Kept thin on purpose: the window options, the Content-Security-Policy,
// the scheme's answers, the permission, navigation and sender policies, the menu, the
// close prompt, the window's remembered place and the choice of window for a file are
// plain functions in shell/ that are tested without Electron; this file only wires
// them to Electron's events. Project files are chosen in Electron's dialogs
// (places/dialog-places.ts), or handed over by the system (a double-clicked project
// file); each window remembers the files its user answered.
import { app, BrowserWindow, dialog, ipcMain, Menu, protocol, screen, session, shell, type MenuItemConstructorOptions, type WebContents } from 'electron';
import { join } from 'node:path';
import { APP_NAME, APP_VERSION } from './app-identity.ts';
import { channelFor, INTENT_NAMES, MENU_COMMAND_CHANNEL, type MenuMessage, type ProjectState } from './api-contract.ts';
import { invokeHandler } from './handlers.ts';
import { HandlerError } from './handler-error.ts';
import { projectAccess, type HostContext, type ProjectAccess } from './host-context.ts';
import { dialogPlaces } from './places/dialog-places.ts';
import { appDataFolder, untitledRecoveryFolder } from './places/app-data-folder.ts';
import { RecentProjects, recentProjectsPath } from './places/recent-projects.ts';
import { PROJECT_EXTENSION } from './io/project/project-schema.ts';
import { FONT_FILE_EXTENSION } from './io/font/write-font-file.ts';
import { APP_ENTRY_URL, APP_SCHEME, APP_SCHEME_PRIVILEGES } from './shell/app-origin.ts';
import { answerAppRequest } from './shell/app-protocol.ts';
import { windowOptions } from './shell/window-options.ts';
import { placeWindow, readWindowState, windowStatePath, writeWindowState, type WindowBounds } from './shell/window-state.ts';
import { allowsNavigation, allowsRequest, allowsWebview, grantsPermission, isTrustedSender, UNTRUSTED_SENDER_MESSAGE, windowOpenAnswer } from './shell/web-policies.ts';
import { menuTemplate, type MainAction, type MenuEntry } from './shell/menu-template.ts';
import { closeAnswerFor, closeNeedsAnswer, closePromptOptions } from './shell/close-prompt.ts';
import { windowFor } from './shell/window-choice.ts';
import { projectFilesIn } from './shell/launch-files.ts';
import { userGuidePath } from './shell/user-guide.ts';

/** The file-type filter of the project dialogs. */
const PROJECT_FILTERS = [{ name: `${APP_NAME} project`, extensions: [PROJECT_EXTENSION.slice(1)] }];

/** The file-type filter of the import-scan dialog: the image types the scan decoder reads (electron/io/decode-scan.ts). */
const SCAN_FILTERS = [{ name: 'Scans', extensions: ['png', 'jpg', 'jpeg', 'tif', 'tiff', 'webp'] }];

/** The file-type filter of the font export dialog. */
const FONT_FILTERS = [{ name: 'OpenType font', extensions: [FONT_FILE_EXTENSION.slice(1)] }];

/** Where the built renderer and preload are: beside this file in build/electron, and build/renderer in the app. */
const RENDERER_DIR = join(app.getAppPath(), 'build', 'renderer');
const PRELOAD_PATH = join(import.meta.dirname, 'preload.cjs');
const ICON_PATH = join(app.getAppPath(), 'electron', 'resources', 'icon.png');

/** How far each further window opens down and right of the remembered place, in DIPs: a title bar's height, so each stays in reach (common practice). */
const CASCADE_OFFSET = 32;

/** Milliseconds a window rests after moving or resizing before its place is written (one write per drag, not one per pixel). */
const WINDOW_STATE_WRITE_DELAY_MS = 500;

/** The app's per-user folder: Electron's own data (caches, storage) goes there too, so there is one folder per user. */
const APP_FOLDER = appDataFolder();
app.setPath('userData', APP_FOLDER);

protocol.registerSchemesAsPrivileged([{ scheme: APP_SCHEME, privileges: { ...APP_SCHEME_PRIVILEGES } }]);

const recent = new RecentProjects(recentProjectsPath(APP_FOLDER), (error) => console.error(`Stemline could not update its recent projects: ${String(error)}`));

/** What the shell keeps for each window. */
interface ShellWindow {
  window: BrowserWindow;
  access: ProjectAccess;
  context: HostContext;
  /** What the page last reported (null until its first report: the page is not ready). */
  state: ProjectState | null;
  /** The project file the window shows, once it opened or saved one. */
  projectPath: string | null;
  /** Messages for the page waiting for it to be ready. */
  pending: MenuMessage[];
  /** Set once the user answered the close prompt (or the page saved and asked to close). */
  closeConfirmed: boolean;
  /** Set when the close prompt's Save was chosen while quitting: once the window closes, quitting goes on. */
  quitAfterClose: boolean;
}

const windows = new Map<number, ShellWindow>();
/** Set while the user is quitting: each window's close is part of it, and a cancelled prompt ends it. */
let quitting = false;

function dialogsFor(contents: WebContents) {
  const parent = () => BrowserWindow.fromWebContents(contents) ?? undefined;
  const show = async <T extends { canceled: boolean }>(withParent: (w: BrowserWindow) => Promise<T>, alone: () => Promise<T>) => {
    const window = parent();
    return window ? withParent(window) : alone();
  };
  return dialogPlaces({
    showOpen: async () => {
      const options = { properties: ['openFile' as const], filters: PROJECT_FILTERS };
      const answer = await show((w) => dialog.showOpenDialog(w, options), () => dialog.showOpenDialog(options));
      return answer.canceled ? null : (answer.filePaths[0] ?? null);
    },
    showSave: async (suggestedName) => {
      const options = { defaultPath: suggestedName, filters: PROJECT_FILTERS };
      const answer = await show((w) => dialog.showSaveDialog(w, options), () => dialog.showSaveDialog(options));
      return answer.canceled ? null : answer.filePath || null;
    },
    showOpenScan: async () => {
      const options = { title: 'Import a scan', properties: ['openFile' as const], filters: SCAN_FILTERS };
      const answer = await show((w) => dialog.showOpenDialog(w, options), () => dialog.showOpenDialog(options));
      return answer.canceled ? null : (answer.filePaths[0] ?? null);
    },
    showExportFont: async (suggestedName) => {
      const options = { title: 'Export the font', defaultPath: suggestedName, filters: FONT_FILTERS };
      const answer = await show((w) => dialog.showSaveDialog(w, options), () => dialog.showSaveDialog(options));
      return answer.canceled ? null : answer.filePath || null;
    },
  });
}

function shellWindowOf(contents: WebContents): ShellWindow | undefined {
  const window = BrowserWindow.fromWebContents(contents);
  return window ? windows.get(window.id) : undefined;
}

function focusedShellWindow(): ShellWindow | undefined {
  const window = BrowserWindow.getFocusedWindow();
  return window ? windows.get(window.id) : undefined;
}

/** Sends `message` to the window's page, or keeps it until the page is ready. */
function sendToPage(target: ShellWindow, message: MenuMessage): void {
  if (target.state === null) target.pending.push(message);
  else target.window.webContents.send(MENU_COMMAND_CHANNEL, message);
}

async function createWindow(): Promise<ShellWindow> {
  const displays = screen.getAllDisplays().map((d) => d.workArea);
  const saved = await readWindowState(windowStatePath(APP_FOLDER));
  // A second window opens beside the first rather than over it.
  const cascade = windows.size === 0 || saved === null ? saved : { ...saved, x: (saved.x ?? 0) + CASCADE_OFFSET * windows.size, y: (saved.y ?? 0) + CASCADE_OFFSET * windows.size };
  const bounds = placeWindow(cascade, displays, screen.getPrimaryDisplay().workArea);
  const window = new BrowserWindow(windowOptions({ preloadPath: PRELOAD_PATH, title: APP_NAME, bounds, devTools: !app.isPackaged, icon: ICON_PATH }));
  const access = projectAccess(dialogsFor(window.webContents), untitledRecoveryFolder(APP_FOLDER));
  const entry: ShellWindow = {
    window,
    access,
    context: {
      host: 'electron',
      projects: access,
      recent,
      window: {
        projectStateChanged: (state) => projectStateChanged(entry, state),
        close: () => {
          entry.closeConfirmed = true;
          window.close();
          return true;
        },
      },
    },
    state: null,
    projectPath: null,
    pending: [],
    closeConfirmed: false,
    quitAfterClose: false,
  };
  windows.set(window.id, entry);
  if (bounds.maximized === true) window.maximize();
  window.once('ready-to-show', () => window.show());
  rememberPlace(window);
  window.on('close', (event) => closeRequested(entry, event));
  window.on('closed', () => {
    windows.delete(window.id);
    refreshMenu();
    // Quitting goes on window by window: each close may ask first.
    if (quitting || entry.quitAfterClose) app.quit();
  });
  window.on('focus', refreshMenu);
  void window.loadURL(APP_ENTRY_URL);
  return entry;
}

/** Writes the window's place a moment after it stops moving, and when it closes. */
function rememberPlace(window: BrowserWindow): void {
  let timer: NodeJS.Timeout | undefined;
  const write = () => {
    if (window.isDestroyed() || window.isMinimized()) return;
    const bounds: WindowBounds = { ...(window.isMaximized() ? window.getNormalBounds() : window.getBounds()), maximized: window.isMaximized() };
    void writeWindowState(windowStatePath(APP_FOLDER), bounds).catch(() => undefined);
  };
  const later = () => {
    clearTimeout(timer);
    timer = setTimeout(write, WINDOW_STATE_WRITE_DELAY_MS);
  };
  window.on('resize', later);
  window.on('move', later);
  window.on('close', () => {
    clearTimeout(timer);
    write();
  });
}

function projectStateChanged(entry: ShellWindow, state: ProjectState): void {
  const first = entry.state === null;
  entry.state = state;
  entry.window.setTitle(`${state.title}${state.hasUnsavedChanges ? ' •' : ''} — ${APP_NAME}`);
  entry.window.setDocumentEdited(state.hasUnsavedChanges);
  if (first) for (const message of entry.pending.splice(0)) entry.window.webContents.send(MENU_COMMAND_CHANNEL, message);
  refreshMenu();
}

function closeRequested(entry: ShellWindow, event: Electron.Event): void {
  if (!closeNeedsAnswer(entry.state, entry.closeConfirmed)) return;
  event.preventDefault();
  const state = entry.state!;
  void dialog.showMessageBox(entry.window, closePromptOptions(state, quitting)).then(({ response }) => {
    const answer = closeAnswerFor(response);
    if (answer === 'stay-open') {
      quitting = false;
      return;
    }
    if (answer === 'close-without-saving') {
      entry.closeConfirmed = true;
      entry.window.close();
      return;
    }
    // Save: the page saves (asking where, if never saved) and then closes through closeWindow;
    // if the user cancels that save, the window stays and the quit ends here.
    entry.quitAfterClose = quitting;
    quitting = false;
    sendToPage(entry, { command: 'save-and-close' });
  });
}

/** Opens `path` in the window one-window-per-project chooses (shell/window-choice.ts). */
async function openInWindow(path: string): Promise<void> {
  const facts = [...windows.values()].map((w) => ({
    id: w.window.id,
    projectPath: w.projectPath,
    empty: w.projectPath === null && w.state !== null && !w.state.hasProject && !w.state.hasUnsavedChanges,
  }));
  const choice = windowFor(path, facts, BrowserWindow.getFocusedWindow()?.id ?? null);
  if (choice.kind === 'focus') {
    windows.get(choice.id)?.window.focus();
    return;
  }
  const target = choice.kind === 'open-in' ? windows.get(choice.id)! : await createWindow();
  sendToPage(target, { command: 'open-recent', handle: target.access.handles.remember({ kind: 'file', path }) });
}

async function showOpenDialog(): Promise<void> {
  const parent = BrowserWindow.getFocusedWindow();
  const options = { properties: ['openFile' as const], filters: PROJECT_FILTERS };
  const answer = parent ? await dialog.showOpenDialog(parent, options) : await dialog.showOpenDialog(options);
  const path = answer.canceled ? undefined : answer.filePaths[0];
  if (path !== undefined) await openInWindow(path);
}

function runAction(action: MainAction): void {
  switch (action) {
    case 'new-window':
      void createWindow();
      return;
    case 'open-dialog':
      void showOpenDialog();
      return;
    case 'close-window':
      BrowserWindow.getFocusedWindow()?.close();
      return;
    case 'quit':
      app.quit();
      return;
    case 'open-user-guide':
      // A fixed file of the app, never an address the page supplied (shell/user-guide.ts).
      void shell.openPath(userGuidePath(app.getAppPath())).then((problem) => {
        if (problem !== '') void dialog.showMessageBox({ type: 'info', title: APP_NAME, message: 'The user guide could not be opened.', detail: `${problem}. It is the file ${userGuidePath(app.getAppPath())}.` });
      });
      return;
    case 'about': {
      const options = { type: 'info' as const, title: `About ${APP_NAME}`, message: `${APP_NAME} ${APP_VERSION}`, detail: 'Turns scans of hand-drawn letters into type-quality outlines and an OpenType font.' };
      const parent = BrowserWindow.getFocusedWindow();
      void (parent ? dialog.showMessageBox(parent, options) : dialog.showMessageBox(options));
      return;
    }
    case 'clear-recent':
      void recent.clear();
      return;
  }
}

let recentPaths: string[] = [];

function toElectron(entries: readonly MenuEntry[]): MenuItemConstructorOptions[] {
  return entries.map((entry): MenuItemConstructorOptions => {
    switch (entry.kind) {
      case 'separator':
        return { type: 'separator' };
      case 'role':
        return { role: entry.role };
      case 'submenu':
        return { label: entry.label, submenu: toElectron(entry.entries), enabled: entry.enabled ?? true };
      case 'recent':
        return { label: entry.label, click: () => void openRecent(entry.index) };
      case 'action':
        return { label: entry.label, enabled: entry.enabled, ...(entry.accelerator ? { accelerator: entry.accelerator } : {}), click: () => runAction(entry.action) };
      case 'command':
        return {
          label: entry.label,
          enabled: entry.enabled,
          ...(entry.accelerator ? { accelerator: entry.accelerator, registerAccelerator: entry.pageHandlesKey !== true } : {}),
          click: () => {
            const target = focusedShellWindow();
            if (target) sendToPage(target, { command: entry.command });
          },
        };
    }
  });
}

async function openRecent(index: number): Promise<void> {
  const path = recentPaths[index];
  if (path !== undefined) await openInWindow(path);
}

function refreshMenu(): void {
  const focused = focusedShellWindow();
  const state = focused?.state;
  const template = menuTemplate({
    hasWindow: focused !== undefined,
    hasProject: state?.hasProject ?? false,
    hasUnsavedChanges: state?.hasUnsavedChanges ?? false,
    canUndo: state?.canUndo ?? false,
    canRedo: state?.canRedo ?? false,
    recent: recentPaths.map((path) => ({ name: path.split(/[\\/]/).pop() ?? path, folder: path.split(/[\\/]/).slice(-2, -1)[0] ?? '' })),
    platform: process.platform,
  });
  Menu.setApplicationMenu(Menu.buildFromTemplate(template.map((section) => ({ label: section.label, submenu: toElectron(section.entries) }))));
}

/** Records which file a window shows after an intent that opened or saved one. */
function noteProjectFile(entry: ShellWindow, intent: string, result: unknown): void {
  if (intent !== 'openProject' && intent !== 'openRecentProject' && intent !== 'saveProjectAs') return;
  const handle = (result as { handle?: string } | null)?.handle;
  const place = handle === undefined ? undefined : entry.access.handles.find(handle);
  if (place?.kind === 'file') entry.projectPath = place.path;
}

function registerIntents(): void {
  for (const intent of INTENT_NAMES) {
    ipcMain.handle(channelFor(intent), async (event, args: unknown) => {
      const frame = event.senderFrame;
      const entry = shellWindowOf(event.sender);
      // A frame without a parent is its window's top frame; an iframe has one.
      if (!isTrustedSender(frame ? { url: frame.url, isMainFrame: frame.parent === null } : null) || entry === undefined) {
        return { error: { kind: 'forbidden', message: UNTRUSTED_SENDER_MESSAGE } };
      }
      try {
        const result = await invokeHandler(intent, args, entry.context);
        noteProjectFile(entry, intent, result);
        return { result };
      } catch (error) {
        if (error instanceof HandlerError) return { error: error.toPayload() };
        throw error;
      }
    });
  }
}

function lockDownSession(): void {
  const ses = session.defaultSession;
  ses.setPermissionRequestHandler((contents, permission, decide) => decide(grantsPermission(permission, contents.getURL())));
  ses.setPermissionCheckHandler((_contents, permission, origin) => grantsPermission(permission, origin));
  ses.webRequest.onBeforeRequest((details, answer) => answer({ cancel: !allowsRequest(details.url) }));
  protocol.handle(APP_SCHEME, async (request) => {
    const answer = await answerAppRequest(RENDERER_DIR, request.method, request.url);
    return new Response(answer.body.length > 0 ? Buffer.from(answer.body) : null, { status: answer.status, headers: answer.headers });
  });
}

app.on('web-contents-created', (_event, contents) => {
  contents.on('will-navigate', (event, url) => {
    if (!allowsNavigation(url)) event.preventDefault();
  });
  contents.on('will-redirect', (event, url) => {
    if (!allowsNavigation(url)) event.preventDefault();
  });
  contents.on('will-attach-webview', (event) => {
    if (!allowsWebview()) event.preventDefault();
  });
  contents.setWindowOpenHandler(({ url }) => windowOpenAnswer(url));
});

/** Project files the system asked to open before the app was ready (macOS open-file, or the first start's arguments). */
const filesBeforeReady: string[] = projectFilesIn(process.argv.slice(1), process.cwd());

if (!app.requestSingleInstanceLock()) {
  // Another Stemline is running: it has been handed this start's arguments (second-instance) and opens them.
  app.quit();
} else {
  app.on('second-instance', (_event, argv, workingDirectory) => {
    const files = projectFilesIn(argv.slice(1), workingDirectory);
    if (files.length === 0) {
      const window = BrowserWindow.getAllWindows()[0];
      if (window) {
        if (window.isMinimized()) window.restore();
        window.focus();
      } else void createWindow();
    }
    for (const path of files) void openInWindow(path);
  });

  app.on('open-file', (event, path) => {
    event.preventDefault();
    const files = projectFilesIn([path], process.cwd());
    if (app.isReady()) for (const file of files) void openInWindow(file);
    else filesBeforeReady.push(...files);
  });

  app.on('before-quit', () => {
    quitting = true;
  });

  app.whenReady().then(async () => {
    lockDownSession();
    registerIntents();
    recentPaths = await recent.list();
    recent.onChange((paths) => {
      recentPaths = [...paths];
      refreshMenu();
    });
    refreshMenu();
    if (filesBeforeReady.length === 0) await createWindow();
    for (const path of filesBeforeReady.splice(0)) await openInWindow(path);
    app.on('activate', () => {
      if (BrowserWindow.getAllWindows().length === 0) void createWindow();
    });
  });

  app.on('window-all-closed', () => {
    if (process.platform !== 'darwin' || quitting) app.quit();
  });
}
