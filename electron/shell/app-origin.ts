// Where the desktop window's page comes from: a scheme of the app's own, served from
// the renderer build inside the app, never file:// and never the network. One origin
// is the app; every check of "is this the app's own page" (the IPC sender check, the
// navigation policy) compares against it.
//
// Electron security checklist, item 18 ("Avoid usage of the file:// protocol and
// prefer usage of custom protocols"): https://www.electronjs.org/docs/latest/tutorial/security

/** The app's own URL scheme; a name no other program registers. */
export const APP_SCHEME = 'stemline-app';

/** The one host under the scheme: the renderer build. */
export const APP_HOST = 'renderer';

/** The origin of the app's page, as a browser spells it. */
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;

/** The page the window loads. */
export const APP_ENTRY_URL = `${APP_ORIGIN}/index.html`;

/**
 * The privileges the scheme is registered with (Electron's protocol.registerSchemesAsPrivileged):
 * standard, so relative URLs and the origin work as for https; secure, so the page is
 * a secure context; fetch and module workers allowed from it. It does not bypass the
 * Content-Security-Policy, and service workers and extensions stay off.
 */
export const APP_SCHEME_PRIVILEGES = {
  standard: true,
  secure: true,
  supportFetchAPI: true,
  corsEnabled: false,
  bypassCSP: false,
  allowServiceWorkers: false,
  stream: false,
  codeCache: true,
} as const;

/** Whether `url` is a page of the app itself (its scheme and host exactly); anything unparsable is not. */
export function isAppUrl(url: string): boolean {
  try {
    const parsed = new URL(url);
    return parsed.protocol === `${APP_SCHEME}:` && parsed.host === APP_HOST && parsed.username === '' && parsed.password === '';
  } catch {
    return false;
  }
}
