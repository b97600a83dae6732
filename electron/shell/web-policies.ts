// What the shell lets the page do beyond showing itself: nothing. Every permission
// request and check is denied (the app needs no camera, location, notifications or
// clipboard reading), every navigation away from the page and every new window is
// refused, no <webview> may attach, and only the app's own main frame may call the
// host. main.ts wires each decision to its Electron event; the decisions are plain
// functions so a test can assert them.
//
// Electron security checklist, https://www.electronjs.org/docs/latest/tutorial/security :
// 5 (handle session permission requests), 13 (disable or limit navigation),
// 14 (disable or limit creation of new windows), 12 (verify <webview> options: none may attach),
// 17 (validate the sender of all IPC messages).
import { isAppUrl } from './app-origin.ts';

/** Whether a permission request is granted: never, whatever is asked. */
export function grantsPermission(_permission: string, _requestingUrl: string): false {
  return false;
}

/** Whether the page may navigate to `url`: never (the app is one page; links to elsewhere are not followed). */
export function allowsNavigation(_url: string): false {
  return false;
}

/** The answer to window.open or a link with a target: always deny (Electron's setWindowOpenHandler result). */
export function windowOpenAnswer(_url: string): { action: 'deny' } {
  return { action: 'deny' };
}

/** Whether a <webview> may attach: never (the shell enables no webview tag anyway). */
export function allowsWebview(): false {
  return false;
}

/** The frame an IPC message came from, as Electron describes it (the parts the check reads). */
export interface SenderFrame {
  url: string;
  /** Whether it is the window's top frame (not an iframe inside it). */
  isMainFrame: boolean;
}

/**
 * Whether an IPC message may be answered: it must come from the top frame of a window
 * showing the app's own page (its own scheme and host), never from a frame that is
 * gone, an iframe, or any other origin.
 */
export function isTrustedSender(frame: SenderFrame | null | undefined): boolean {
  return frame !== null && frame !== undefined && frame.isMainFrame && isAppUrl(frame.url);
}

/** The refusal sent back to a sender that is not the app's own page. */
export const UNTRUSTED_SENDER_MESSAGE = 'Requests are only taken from Stemline’s own window. Close this page and use the app.';

/**
 * URL schemes the page may load anything from: the app's own, and the page's own
 * in-memory data (decoded scans, the proof font) and the developer tools. Nothing from
 * the network, nothing from file://.
 * Electron security checklist, item 1 ("Only load secure content"): here, only the app's own content.
 */
const LOADABLE_SCHEMES = ['data:', 'blob:', 'devtools:'] as const;

/** Whether the window's session may load `url` at all (Electron's webRequest.onBeforeRequest): only the app's own scheme and in-page data. */
export function allowsRequest(url: string): boolean {
  if (isAppUrl(url)) return true;
  try {
    return (LOADABLE_SCHEMES as readonly string[]).includes(new URL(url).protocol);
  } catch {
    return false;
  }
}
