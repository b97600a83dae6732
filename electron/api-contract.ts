// The narrow API between the renderer and the host (Electron main process or the
// browser-mode host). One entry per user intent; the renderer imports only these
// types, never host code. Both hosts route every call through `invokeHandler`
// (handlers.ts), so the same plain, tested functions answer in either mode.

/** Which host is serving the renderer. */
export type HostKind = 'electron' | 'browser';

/** What the about screen and the title bar show. */
export interface AppInfo {
  name: string;
  version: string;
  host: HostKind;
  /** Platform string of the machine running the host (e.g. 'linux'). */
  platform: string;
}

/**
 * Every intent the renderer may ask of the host, with its argument and result.
 * Later capabilities add entries here; each must validate its own arguments.
 */
export interface HostIntents {
  appInfo: { args: Record<string, never>; result: AppInfo };
}

export type IntentName = keyof HostIntents;

/** The object the preload script exposes as `window.stemline`. */
export type StemlineHostApi = {
  [K in IntentName]: (args: HostIntents[K]['args']) => Promise<HostIntents[K]['result']>;
};

/** Names of every intent, in one list both hosts and the preload agree on. */
export const INTENT_NAMES = ['appInfo'] as const satisfies readonly IntentName[];

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
