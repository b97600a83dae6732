// The options of every Stemline window, built by one plain function so a test can read
// exactly what the shell passes to Electron's BrowserWindow. The page gets no Node, runs
// sandboxed in an isolated world, keeps web security, and may not run insecure content,
// experimental features, <webview> tags or dropped-file navigations.
//
// Electron security checklist items asserted on these options (test/electron/shell-security.test.ts),
// https://www.electronjs.org/docs/latest/tutorial/security : 2 (no Node.js integration),
// 3 (context isolation), 4 (process sandboxing), 6 (webSecurity not disabled),
// 8 (no allowRunningInsecureContent), 9 (no experimental features), 10 (no enableBlinkFeatures),
// 11/12 (no <webview> at all).
import type { WindowBounds } from './window-state.ts';

/** The web preferences the shell sets; the Electron names, the safe value of each spelled out. */
export interface ShellWebPreferences {
  preload: string;
  contextIsolation: true;
  sandbox: true;
  nodeIntegration: false;
  nodeIntegrationInWorker: false;
  nodeIntegrationInSubFrames: false;
  webSecurity: true;
  allowRunningInsecureContent: false;
  experimentalFeatures: false;
  webviewTag: false;
  navigateOnDragDrop: false;
  safeDialogs: true;
  spellcheck: false;
  devTools: boolean;
}

/** The BrowserWindow options the shell uses (a subset of Electron's BrowserWindowConstructorOptions). */
export interface ShellWindowOptions {
  x?: number;
  y?: number;
  width: number;
  height: number;
  minWidth: number;
  minHeight: number;
  title: string;
  show: false;
  backgroundColor: string;
  icon?: string;
  webPreferences: ShellWebPreferences;
}

/** Smallest window in CSS pixels: a glyph canvas and its side panel still fit beside each other. */
export const MIN_WINDOW_SIZE = { width: 800, height: 560 } as const;

/** The page's paper colour (renderer/src/theme.css --paper), shown before the first paint. */
const PAPER_COLOUR = '#f4efe5';

export interface WindowOptionsInput {
  /** Absolute path of the built preload script. */
  preloadPath: string;
  title: string;
  bounds: WindowBounds;
  /** Whether the developer tools may open: in development only, not in the packaged app. */
  devTools: boolean;
  /** The window icon (Linux and Windows); macOS takes the bundle's. */
  icon?: string;
}

/** The options of a Stemline window at `bounds`; shown once its page is ready (`show: false`). */
export function windowOptions(input: WindowOptionsInput): ShellWindowOptions {
  return {
    ...(input.bounds.x === undefined || input.bounds.y === undefined ? {} : { x: input.bounds.x, y: input.bounds.y }),
    width: input.bounds.width,
    height: input.bounds.height,
    minWidth: MIN_WINDOW_SIZE.width,
    minHeight: MIN_WINDOW_SIZE.height,
    title: input.title,
    show: false,
    backgroundColor: PAPER_COLOUR,
    ...(input.icon === undefined ? {} : { icon: input.icon }),
    webPreferences: {
      preload: input.preloadPath,
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      nodeIntegrationInSubFrames: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      experimentalFeatures: false,
      webviewTag: false,
      navigateOnDragDrop: false,
      safeDialogs: true,
      spellcheck: false,
      devTools: input.devTools,
    },
  };
}
