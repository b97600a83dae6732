// The preload script: exposes `window.stemline`, one function per user intent and
// nothing else (never raw IPC). Sandboxed preloads can require only 'electron' and
// have no module system, so this file stays a plain script: the intent names are
// repeated here and the `satisfies` check keeps them in step with the contract
// (api-contract.ts) at compile time.
const { contextBridge, ipcRenderer } = require('electron') as typeof import('electron');

type IntentName = import('./api-contract.ts').IntentName;

interface HostReply {
  result?: unknown;
  error?: { kind: string; message: string };
}

/** Sends one intent; a host error comes back as a rejected promise with the host's message. */
function callHost(intent: IntentName, args: unknown): Promise<never> {
  return ipcRenderer.invoke(`stemline:${intent}`, args).then((reply: HostReply) => {
    if (reply.error) throw Object.assign(new Error(reply.error.message), { kind: reply.error.kind });
    return reply.result as never;
  });
}

const stemlineHostApi = {
  appInfo: (args) => callHost('appInfo', args),
  listProjects: (args) => callHost('listProjects', args),
  openProject: (args) => callHost('openProject', args),
  saveProject: (args) => callHost('saveProject', args),
  saveProjectAs: (args) => callHost('saveProjectAs', args),
  autosaveProject: (args) => callHost('autosaveProject', args),
  findRecoveredWork: (args) => callHost('findRecoveredWork', args),
  discardRecoveredWork: (args) => callHost('discardRecoveredWork', args),
  buildProofFont: (args) => callHost('buildProofFont', args),
  exportFont: (args) => callHost('exportFont', args),
  openDemo: (args) => callHost('openDemo', args),
} satisfies import('./api-contract.ts').StemlineHostApi;

contextBridge.exposeInMainWorld('stemline', stemlineHostApi);
