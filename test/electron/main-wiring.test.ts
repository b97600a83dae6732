// electron/main.ts itself, run against a stand-in for Electron (Electron cannot start
// here): it must hand Electron exactly the tested policies — the window options, the
// app's own scheme registered before ready and serving with the CSP header, the page
// loaded from that scheme and never file://, every permission denied, requests
// outside the app cancelled, navigation, new windows and webviews refused, the IPC
// sender checked on every intent — and carry out the menu and the close prompt.
// Checklist items (https://www.electronjs.org/docs/latest/tutorial/security) are named
// beside the assertions that cover their wiring.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { APP_ENTRY_URL, APP_SCHEME, APP_SCHEME_PRIVILEGES } from '../../electron/shell/app-origin.ts';
import { windowOptions } from '../../electron/shell/window-options.ts';
import { contentSecurityPolicyHeader } from '../../electron/shell/content-security-policy.ts';
import { INTENT_NAMES, MENU_COMMAND_CHANNEL, channelFor, type ProjectState } from '../../electron/api-contract.ts';

type Listener = (...args: unknown[]) => unknown;

/** A stand-in for the parts of Electron main.ts uses, recording what it is given. */
const electron = vi.hoisted(() => {
  // vi.hoisted runs before the imports, so the stand-in brings its own small event emitter.
  class Emitter {
    private readonly listeners = new Map<string, ((...args: any[]) => unknown)[]>();
    on(event: string, listener: (...args: any[]) => unknown) {
      this.listeners.set(event, [...(this.listeners.get(event) ?? []), listener]);
      return this;
    }
    once(event: string, listener: (...args: any[]) => unknown) {
      const wrapped = (...args: unknown[]) => {
        this.listeners.set(event, (this.listeners.get(event) ?? []).filter((l) => l !== wrapped));
        return listener(...args);
      };
      return this.on(event, wrapped);
    }
    emit(event: string, ...args: unknown[]) {
      for (const listener of [...(this.listeners.get(event) ?? [])]) listener(...args);
      return true;
    }
  }
  const calls: { name: string; args: unknown[] }[] = [];
  const record = (name: string) => (...args: unknown[]) => {
    calls.push({ name, args });
  };
  let nextId = 1;
  const windows: FakeWindow[] = [];
  let focused: FakeWindow | null = null;
  let messageBoxAnswer = 2;

  class FakeContents extends Emitter {
    id = nextId++;
    sent: unknown[][] = [];
    mainFrame: { url: string; parent: unknown } = { url: '', parent: null };
    openHandler: ((details: { url: string }) => unknown) | null = null;
    send(...args: unknown[]) {
      this.sent.push(args);
    }
    setWindowOpenHandler(handler: (details: { url: string }) => unknown) {
      this.openHandler = handler;
    }
    getURL() {
      return this.mainFrame.url;
    }
  }

  class FakeWindow extends Emitter {
    static fromWebContents(contents: unknown) {
      return windows.find((w) => w.webContents === contents) ?? null;
    }
    static getFocusedWindow() {
      return focused;
    }
    static getAllWindows() {
      return windows.filter((w) => !w.destroyed);
    }
    id = nextId++;
    webContents = new FakeContents();
    options: unknown;
    title = '';
    edited = false;
    destroyed = false;
    loaded: string[] = [];
    constructor(options: unknown) {
      super();
      this.options = options;
      windows.push(this);
      focused = this;
    }
    loadURL(url: string) {
      this.loaded.push(url);
      this.webContents.mainFrame.url = url;
      return Promise.resolve();
    }
    loadFile(path: string) {
      this.loaded.push(`file:${path}`);
      return Promise.resolve();
    }
    close() {
      let prevented = false;
      this.emit('close', { preventDefault: () => (prevented = true) });
      if (!prevented) {
        this.destroyed = true;
        if (focused === this) focused = null;
        this.emit('closed');
      }
    }
    setTitle(title: string) {
      this.title = title;
    }
    setDocumentEdited(edited: boolean) {
      this.edited = edited;
    }
    show() {}
    focus() {
      focused = this;
    }
    maximize() {}
    restore() {}
    isDestroyed() {
      return this.destroyed;
    }
    isMinimized() {
      return false;
    }
    isMaximized() {
      return false;
    }
    getBounds() {
      return { x: 10, y: 20, width: 1000, height: 700 };
    }
    getNormalBounds() {
      return this.getBounds();
    }
  }

  const app = Object.assign(new Emitter(), {
    isPackaged: true,
    appPath: '',
    setPath: record('app.setPath'),
    getAppPath: () => app.appPath,
    whenReady: () => Promise.resolve(),
    isReady: () => true,
    quit: record('app.quit'),
    requestSingleInstanceLock: () => {
      calls.push({ name: 'app.requestSingleInstanceLock', args: [] });
      return true;
    },
  });
  const display = { workArea: { x: 0, y: 0, width: 1920, height: 1040 } };
  const handlers = new Map<string, Listener>();
  const permission: { request?: Listener; check?: Listener; beforeRequest?: Listener } = {};
  const schemes = new Map<string, Listener>();
  const menus: unknown[] = [];
  return {
    calls,
    windows,
    handlers,
    permission,
    schemes,
    menus,
    FakeContents,
    setMessageBoxAnswer: (answer: number) => (messageBoxAnswer = answer),
    module: {
      app,
      BrowserWindow: FakeWindow,
      dialog: {
        showOpenDialog: async () => ({ canceled: true, filePaths: [] }),
        showSaveDialog: async () => ({ canceled: true, filePath: '' }),
        showMessageBox: async (...args: unknown[]) => {
          calls.push({ name: 'dialog.showMessageBox', args });
          return { response: messageBoxAnswer };
        },
      },
      ipcMain: { handle: (channel: string, handler: Listener) => handlers.set(channel, handler) },
      Menu: {
        buildFromTemplate: (template: unknown) => template,
        setApplicationMenu: (menu: unknown) => menus.push(menu),
      },
      protocol: {
        registerSchemesAsPrivileged: record('protocol.registerSchemesAsPrivileged'),
        handle: (scheme: string, handler: Listener) => {
          calls.push({ name: 'protocol.handle', args: [scheme] });
          schemes.set(scheme, handler);
        },
      },
      screen: { getAllDisplays: () => [display], getPrimaryDisplay: () => display },
      session: {
        defaultSession: {
          setPermissionRequestHandler: (handler: Listener) => (permission.request = handler),
          setPermissionCheckHandler: (handler: Listener) => (permission.check = handler),
          webRequest: { onBeforeRequest: (handler: Listener) => (permission.beforeRequest = handler) },
        },
      },
      shell: {
        openPath: async (...args: unknown[]) => {
          calls.push({ name: 'shell.openPath', args });
          return '';
        },
        openExternal: record('shell.openExternal'),
      },
    },
  };
});

vi.mock('electron', () => ({ ...electron.module, default: electron.module }));

type FakeWindow = InstanceType<typeof electron.module.BrowserWindow>;

const appFolder = mkdtempSync(join(tmpdir(), 'stemline-main-'));
/** The variables app-data-folder.ts reads on each system, pointed at the temporary folder while main.ts runs. */
const HOME_VARIABLES = ['XDG_CONFIG_HOME', 'APPDATA', 'HOME'] as const;
const previousHome = Object.fromEntries(HOME_VARIABLES.map((name) => [name, process.env[name]]));

beforeAll(async () => {
  // The shell's per-user folder and the app's files, in a temporary folder.
  for (const name of HOME_VARIABLES) process.env[name] = join(appFolder, 'home');
  electron.module.app.appPath = join(appFolder, 'app');
  mkdirSync(join(appFolder, 'app', 'build', 'renderer'), { recursive: true });
  writeFileSync(join(appFolder, 'app', 'build', 'renderer', 'index.html'), '<!doctype html><title>Stemline</title>');
  await import('../../electron/main.ts');
  await vi.waitFor(() => expect(electron.windows).toHaveLength(1));
});

afterAll(() => {
  for (const name of HOME_VARIABLES) {
    if (previousHome[name] === undefined) delete process.env[name];
    else process.env[name] = previousHome[name];
  }
});

function firstWindow(): FakeWindow {
  return electron.windows[0]!;
}

/** An IPC call as Electron would deliver it from `frame` of `window`'s page. */
function invoke(intent: string, args: unknown, window: FakeWindow, frame: { url: string; parent: unknown } = window.webContents.mainFrame) {
  const handler = electron.handlers.get(channelFor(intent as never))!;
  return handler({ sender: window.webContents, senderFrame: frame }, args) as Promise<{ result?: unknown; error?: { kind: string } }>;
}

const CLEAN: ProjectState = { title: 'harbour', hasProject: true, hasUnsavedChanges: false, canUndo: false, canRedo: false };

describe('the main process as wired to Electron', () => {
  it('registers the app’s own scheme as privileged before the app is ready, and serves it with the CSP header (items 7 and 18)', async () => {
    const order = electron.calls.map((c) => c.name);
    expect(order.indexOf('protocol.registerSchemesAsPrivileged')).toBeLessThan(order.indexOf('protocol.handle'));
    expect(electron.calls.find((c) => c.name === 'protocol.registerSchemesAsPrivileged')!.args[0]).toEqual([{ scheme: APP_SCHEME, privileges: { ...APP_SCHEME_PRIVILEGES } }]);
    const response = (await electron.schemes.get(APP_SCHEME)!(new Request(APP_ENTRY_URL))) as Response;
    expect(response.status).toBe(200);
    expect(response.headers.get('content-security-policy')).toBe(contentSecurityPolicyHeader());
    expect(await response.text()).toContain('<title>Stemline');
  });

  it('takes the single-instance lock, so a second start hands its files to the running app', () => {
    expect(electron.calls.some((c) => c.name === 'app.requestSingleInstanceLock')).toBe(true);
  });

  it('opens the window with exactly the tested options, and loads the page from the app’s scheme, never file:// (items 2–4, 6, 8–10, 18)', () => {
    const window = firstWindow();
    const expected = windowOptions({ preloadPath: '/x', title: 'Stemline', bounds: { width: 1, height: 1 }, devTools: false }).webPreferences;
    const given = (window.options as { webPreferences: Record<string, unknown> }).webPreferences;
    expect({ ...given, preload: '/x' }).toEqual(expected);
    expect(given.preload).toMatch(/[\\/]preload\.cjs$/);
    expect(window.loaded).toEqual([APP_ENTRY_URL]);
  });

  it('denies every permission request and check (item 5)', () => {
    for (const permission of ['media', 'geolocation', 'notifications', 'clipboard-read', 'openExternal']) {
      const decide = vi.fn();
      electron.permission.request!(firstWindow().webContents, permission, decide);
      expect(decide).toHaveBeenCalledWith(false);
      expect(electron.permission.check!(firstWindow().webContents, permission, 'stemline-app://renderer')).toBe(false);
    }
  });

  it('cancels every request for anything but the app’s own content (item 1)', () => {
    const answer = vi.fn();
    electron.permission.beforeRequest!({ url: 'https://example.com/track.js' }, answer);
    electron.permission.beforeRequest!({ url: `${APP_ENTRY_URL}` }, answer);
    electron.permission.beforeRequest!({ url: 'file:///etc/passwd' }, answer);
    expect(answer.mock.calls).toEqual([[{ cancel: true }], [{ cancel: false }], [{ cancel: true }]]);
  });

  it('refuses navigation, redirects, new windows and webviews in every web contents (items 12–14)', () => {
    const contents = new electron.FakeContents();
    electron.module.app.emit('web-contents-created', {}, contents);
    for (const event of ['will-navigate', 'will-redirect']) {
      const preventDefault = vi.fn();
      contents.emit(event, { preventDefault }, 'https://example.com/');
      expect(preventDefault, event).toHaveBeenCalled();
    }
    const webview = vi.fn();
    contents.emit('will-attach-webview', { preventDefault: webview }, {}, {});
    expect(webview).toHaveBeenCalled();
    expect(contents.openHandler!({ url: 'https://example.com/' })).toEqual({ action: 'deny' });
  });

  it('answers every intent of the contract on its channel, and only from the app’s own top frame (item 17)', async () => {
    expect([...electron.handlers.keys()].sort()).toEqual(INTENT_NAMES.map(channelFor).sort());
    const window = firstWindow();
    expect(await invoke('appInfo', {}, window)).toMatchObject({ result: { name: 'Stemline', host: 'electron' } });
    const top = window.webContents.mainFrame;
    for (const frame of [{ url: 'https://example.com/', parent: null }, { url: APP_ENTRY_URL, parent: top } /* an iframe of the app's page */, { url: 'file:///x/index.html', parent: null }]) {
      expect(await invoke('appInfo', {}, window, frame)).toMatchObject({ error: { kind: 'forbidden' } });
    }
    const stranger = { sender: new electron.FakeContents(), senderFrame: { url: APP_ENTRY_URL, parent: null } };
    stranger.sender.mainFrame = stranger.senderFrame;
    expect(await electron.handlers.get(channelFor('appInfo'))!(stranger, {})).toMatchObject({ error: { kind: 'forbidden' } });
  });

  it('builds the File, Edit, View and Help menus, leaving to the page the keys it answers', () => {
    const menu = electron.menus.at(-1) as { label: string; submenu: { label?: string; registerAccelerator?: boolean }[] }[];
    expect(menu.map((m) => m.label)).toEqual(process.platform === 'darwin' ? ['Stemline', 'File', 'Edit', 'View', 'Help'] : ['File', 'Edit', 'View', 'Help']);
    const save = menu.find((m) => m.label === 'File')!.submenu.find((i) => i.label === 'Save')!;
    expect(save.registerAccelerator).toBe(false);
  });

  it('opens the user guide from the app’s own files, never an outside address (item 15: no shell.openExternal with untrusted content)', async () => {
    const help = (electron.menus.at(-1) as { label: string; submenu: { label?: string; click?: () => void }[] }[]).find((m) => m.label === 'Help')!;
    help.submenu.find((i) => i.label === 'Stemline user guide')!.click!();
    await vi.waitFor(() => expect(electron.calls.filter((c) => c.name === 'shell.openPath')).toHaveLength(1));
    expect(electron.calls.find((c) => c.name === 'shell.openPath')!.args).toEqual([join(appFolder, 'app', 'docs', 'guide', 'README.md')]);
    expect(electron.calls.some((c) => c.name === 'shell.openExternal')).toBe(false);
    const { readFileSync } = await import('node:fs');
    expect(readFileSync(new URL('../../electron/main.ts', import.meta.url), 'utf8')).not.toMatch(/openExternal\(/);
  });

  it('keeps menu commands until the page is ready, then delivers them; titles the window from the page’s state', async () => {
    const window = firstWindow();
    const undo = () => (electron.menus.at(-1) as { label: string; submenu: { label?: string; click?: () => void }[] }[]).find((m) => m.label === 'Edit')!.submenu.find((i) => i.label === 'Undo')!.click!();
    undo();
    expect(window.webContents.sent).toEqual([]);
    await invoke('reportProjectState', { ...CLEAN, hasUnsavedChanges: true, canUndo: true }, window);
    expect(window.webContents.sent).toEqual([[MENU_COMMAND_CHANNEL, { command: 'undo' }]]);
    expect(window.title).toBe('harbour • — Stemline');
    expect(window.edited).toBe(true);
  });

  it('asks before closing with unsaved changes; Cancel keeps the window, Save asks the page to save and close', async () => {
    const window = firstWindow();
    window.webContents.sent.length = 0;
    electron.setMessageBoxAnswer(2);
    window.close();
    await vi.waitFor(() => expect(electron.calls.filter((c) => c.name === 'dialog.showMessageBox')).toHaveLength(1));
    expect(window.destroyed).toBe(false);
    const prompt = electron.calls.find((c) => c.name === 'dialog.showMessageBox')!.args[1] as { message: string; buttons: string[] };
    expect(prompt.message).toBe('Save the changes to “harbour” before closing?');
    electron.setMessageBoxAnswer(0);
    window.close();
    await vi.waitFor(() => expect(window.webContents.sent).toEqual([[MENU_COMMAND_CHANNEL, { command: 'save-and-close' }]]));
    expect(window.destroyed).toBe(false);
    // The page saved, and asks to close: no second prompt.
    expect(await invoke('closeWindow', {}, window)).toEqual({ result: { closed: true } });
    expect(window.destroyed).toBe(true);
    expect(electron.calls.filter((c) => c.name === 'dialog.showMessageBox')).toHaveLength(2);
  });

  it('closes a window without asking when nothing is unsaved', async () => {
    electron.module.app.emit('second-instance', {}, ['/opt/stemline'], appFolder);
    await vi.waitFor(() => expect(electron.windows).toHaveLength(2));
    const window = electron.windows[1]!;
    await invoke('reportProjectState', CLEAN, window);
    const asked = electron.calls.filter((c) => c.name === 'dialog.showMessageBox').length;
    window.close();
    expect(window.destroyed).toBe(true);
    expect(electron.calls.filter((c) => c.name === 'dialog.showMessageBox')).toHaveLength(asked);
  });
});
