// The preload script: exposes `window.stemline`, one function per user intent and one
// event (the shell's menu commands), and nothing else — never ipcRenderer itself, never
// a generic send, and never an IPC event object (which would hand the page the sender).
// Sandboxed preloads can require only 'electron' and have no module system, so this
// file stays a plain script: the intent names and channels are repeated here and the
// `satisfies` check keeps them in step with the contract (api-contract.ts) at compile
// time; test/electron/preload.test.ts checks the exposed names are exactly the contract's.
const { contextBridge, ipcRenderer } = require('electron') as typeof import('electron');

type IntentName = import('./api-contract.ts').IntentName;
type MenuMessage = import('./api-contract.ts').MenuMessage;

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

/** Passes each menu command to `listener`, the message alone; returns the function that stops it. */
function onMenuCommand(listener: (message: MenuMessage) => void): () => void {
  const relay = (_event: unknown, message: MenuMessage) => listener(message);
  ipcRenderer.on('stemline:menu-command', relay);
  return () => {
    ipcRenderer.removeListener('stemline:menu-command', relay);
  };
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
  listRecentProjects: (args) => callHost('listRecentProjects', args),
  openRecentProject: (args) => callHost('openRecentProject', args),
  importScan: (args) => callHost('importScan', args),
  decodeScan: (args) => callHost('decodeScan', args),
  reportProjectState: (args) => callHost('reportProjectState', args),
  closeWindow: (args) => callHost('closeWindow', args),
  onMenuCommand,
} satisfies import('./api-contract.ts').StemlineHostApi;

contextBridge.exposeInMainWorld('stemline', stemlineHostApi);
