// The renderer's one way to reach its host. In the Electron window the preload
// script provides `window.stemline`; in browser mode the same intents travel as
// JSON over HTTP to the browser-mode host. Either way the renderer sees one
// typed object and host errors arrive as `HostError` with the user-facing message.
import type { HostErrorPayload, HostIntents, IntentName, StemlineHostApi } from '../../electron/api-contract.ts';

/** A failure the host reported; `message` is written for the user. */
export class HostError extends Error {
  readonly kind: string;
  constructor(payload: HostErrorPayload) {
    super(payload.message);
    this.name = 'HostError';
    this.kind = payload.kind;
  }
}

declare global {
  interface Window {
    stemline?: StemlineHostApi;
  }
}

async function postIntent<K extends IntentName>(intent: K, args: HostIntents[K]['args']): Promise<HostIntents[K]['result']> {
  let response: Response;
  try {
    response = await fetch(`./api/${intent}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(args),
    });
  } catch {
    throw new HostError({ kind: 'host-unreachable', message: 'Stemline’s host is not answering. Is the "npm start" terminal still running?' });
  }
  let reply: { result?: HostIntents[K]['result']; error?: HostErrorPayload };
  try {
    reply = (await response.json()) as typeof reply;
  } catch {
    throw new HostError({ kind: 'host-unreadable', message: `Stemline’s host gave an answer that could not be read (HTTP ${response.status}). Try again; if it persists, restart "npm start".` });
  }
  if (reply.error) throw new HostError(reply.error);
  return reply.result as HostIntents[K]['result'];
}

const browserHostApi: StemlineHostApi = {
  appInfo: (args) => postIntent('appInfo', args),
  listProjects: (args) => postIntent('listProjects', args),
  openProject: (args) => postIntent('openProject', args),
  saveProject: (args) => postIntent('saveProject', args),
  saveProjectAs: (args) => postIntent('saveProjectAs', args),
  autosaveProject: (args) => postIntent('autosaveProject', args),
  findRecoveredWork: (args) => postIntent('findRecoveredWork', args),
  discardRecoveredWork: (args) => postIntent('discardRecoveredWork', args),
  buildProofFont: (args) => postIntent('buildProofFont', args),
  exportFont: (args) => postIntent('exportFont', args),
  openDemo: (args) => postIntent('openDemo', args),
  listRecentProjects: (args) => postIntent('listRecentProjects', args),
  openRecentProject: (args) => postIntent('openRecentProject', args),
  importScan: (args) => postIntent('importScan', args),
  decodeScan: (args) => postIntent('decodeScan', args),
  reportProjectState: (args) => postIntent('reportProjectState', args),
  closeWindow: (args) => postIntent('closeWindow', args),
  // A browser tab has no application menu: nothing ever arrives.
  onMenuCommand: () => () => undefined,
};

/** The host API for this window: the preload bridge in Electron, HTTP in a browser. */
export const host: StemlineHostApi = window.stemline ?? browserHostApi;
