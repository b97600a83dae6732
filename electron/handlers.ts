// The host's handlers: plain functions, one per intent, shared by the Electron main
// process, the browser-mode host and the tests. They never touch Electron, so they
// run and are tested in plain Node. Every intent has its own argument check, run
// before its handler.
import { APP_NAME, APP_VERSION } from './app-identity.ts';
import { INTENT_NAMES, type AppInfo, type HostIntents, type IntentName } from './api-contract.ts';
import { HandlerError } from './handler-error.ts';
import type { HostContext } from './host-context.ts';
import { projectArguments } from './project-arguments.ts';
import { fontArguments } from './font-arguments.ts';
import { buildProofFont, exportFont } from './font-handlers.ts';
import { openDemo } from './demo-handlers.ts';
import { autosaveProject, discardRecoveredWork, findRecoveredWork, listProjects, listRecentProjects, openProject, openRecentProject, saveProject, saveProjectAs } from './project-handlers.ts';
import { closeWindow, projectStateArguments, reportProjectState } from './window-handlers.ts';
import { importScan } from './scan-import-handler.ts';
import { decodeScan, decodeScanArguments } from './scan-decode-handler.ts';

export type { HostContext } from './host-context.ts';

type Handler<K extends IntentName> = (
  args: HostIntents[K]['args'],
  context: HostContext,
) => Promise<HostIntents[K]['result']> | HostIntents[K]['result'];

type HandlerTable = { [K in IntentName]: Handler<K> };

function appInfo(_args: Record<string, never>, context: HostContext): AppInfo {
  return { name: APP_NAME, version: APP_VERSION, host: context.host, platform: process.platform, demoOffered: context.demoFolder !== null };
}

const HANDLERS: HandlerTable = {
  appInfo,
  listProjects,
  openProject,
  saveProject,
  saveProjectAs,
  autosaveProject,
  findRecoveredWork,
  discardRecoveredWork,
  buildProofFont,
  exportFont,
  openDemo,
  listRecentProjects,
  openRecentProject,
  importScan,
  decodeScan,
  reportProjectState,
  closeWindow,
};

/** Argument checks per intent; each returns the validated arguments or throws. */
const VALIDATORS: { [K in IntentName]: (raw: unknown) => HostIntents[K]['args'] } = {
  appInfo: (raw) => expectEmptyObject('appInfo', raw),
  listProjects: (raw) => expectEmptyObject('listProjects', raw),
  openProject: (raw) => projectArguments('openProject', raw),
  saveProject: (raw) => projectArguments('saveProject', raw),
  saveProjectAs: (raw) => projectArguments('saveProjectAs', raw),
  autosaveProject: (raw) => projectArguments('autosaveProject', raw),
  findRecoveredWork: (raw) => projectArguments('findRecoveredWork', raw),
  discardRecoveredWork: (raw) => projectArguments('discardRecoveredWork', raw),
  buildProofFont: (raw) => fontArguments('buildProofFont', raw),
  exportFont: (raw) => fontArguments('exportFont', raw),
  openDemo: (raw) => expectEmptyObject('openDemo', raw),
  listRecentProjects: (raw) => expectEmptyObject('listRecentProjects', raw),
  openRecentProject: (raw) => projectArguments('openRecentProject', raw),
  importScan: (raw) => expectEmptyObject('importScan', raw),
  decodeScan: (raw) => decodeScanArguments(raw),
  reportProjectState: (raw) => projectStateArguments(raw),
  closeWindow: (raw) => expectEmptyObject('closeWindow', raw),
};

function expectEmptyObject(intent: string, raw: unknown): Record<string, never> {
  if (raw === undefined || raw === null) return {};
  if (typeof raw !== 'object' || Array.isArray(raw) || Object.keys(raw).length > 0) {
    throw new HandlerError('bad-arguments', `The request "${intent}" takes no arguments, but some were sent. This is a bug in the app: please report it.`);
  }
  return {};
}

function isIntentName(name: string): name is IntentName {
  return (INTENT_NAMES as readonly string[]).includes(name);
}

/**
 * Validates `rawArgs` for the named intent and runs its handler.
 * Throws `HandlerError` for an unknown intent or bad arguments; never runs a
 * handler on unvalidated input.
 */
export async function invokeHandler(name: string, rawArgs: unknown, context: HostContext): Promise<unknown> {
  if (!isIntentName(name)) {
    throw new HandlerError('unknown-intent', `The app asked its host for "${name}", which it does not offer. This is a bug in the app: please report it.`);
  }
  return dispatch(name, rawArgs, context);
}

async function dispatch<K extends IntentName>(name: K, rawArgs: unknown, context: HostContext): Promise<HostIntents[K]['result']> {
  const args = VALIDATORS[name](rawArgs);
  const handler = HANDLERS[name] as Handler<K>;
  return handler(args, context);
}
