// The preload script exposes exactly the documented surface — one function per intent
// of the contract and the one menu event — and never raw IPC: a renderer script must
// not be able to send arbitrary messages to the main process, nor get the IPC event
// (whose sender would give it the main process's side of the channel).
// Electron security checklist, item 20 ("Do not expose Electron APIs to untrusted web
// content"), https://www.electronjs.org/docs/latest/tutorial/security
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { runInNewContext } from 'node:vm';
import ts from 'typescript';
import { BRIDGE_EVENT_NAMES, INTENT_NAMES, MENU_COMMAND_CHANNEL, channelFor } from '../../electron/api-contract.ts';

const preloadSource = readFileSync(new URL('../../electron/preload.cts', import.meta.url), 'utf8');

/** The documented surface of window.stemline: the intents (api-contract.ts INTENT_NAMES) and the events (BRIDGE_EVENT_NAMES). */
const DOCUMENTED_SURFACE = [...INTENT_NAMES, ...BRIDGE_EVENT_NAMES].sort();

/** The keys of the object literal handed to exposeInMainWorld, as written in the preload. */
function exposedKeys(): string[] {
  const body = /const stemlineHostApi = \{([\s\S]*?)\n\} satisfies/.exec(preloadSource)?.[1];
  expect(body, 'the preload builds its API as one object literal').toBeDefined();
  return [...body!.matchAll(/^\s{2}(\w+)(?::|,)/gm)].map((m) => m[1]!).sort();
}

/** What the preload did with the Electron it was given: what it exposed, and its IPC calls. */
interface PreloadRun {
  exposed: Map<string, Record<string, unknown>>;
  invoked: { channel: string; args: unknown }[];
  listeners: Map<string, (...args: unknown[]) => void>;
}

/**
 * Runs the preload as Electron would (a sandboxed script whose only module is
 * 'electron'), with a stand-in contextBridge and ipcRenderer that record every call.
 */
function runPreload(reply: (channel: string) => unknown): PreloadRun {
  const run: PreloadRun = { exposed: new Map(), invoked: [], listeners: new Map() };
  const electron = {
    contextBridge: { exposeInMainWorld: (name: string, api: Record<string, unknown>) => run.exposed.set(name, api) },
    ipcRenderer: {
      invoke: async (channel: string, args: unknown) => {
        run.invoked.push({ channel, args });
        return reply(channel);
      },
      on: (channel: string, listener: (...args: unknown[]) => void) => run.listeners.set(channel, listener),
      removeListener: (channel: string) => run.listeners.delete(channel),
    },
  };
  const script = ts.transpileModule(preloadSource, { compilerOptions: { module: ts.ModuleKind.CommonJS, target: ts.ScriptTarget.ES2022 } }).outputText;
  runInNewContext(script, {
    require: (name: string) => {
      if (name !== 'electron') throw new Error(`the preload asked for ${name}`);
      return electron;
    },
    exports: {},
    module: { exports: {} },
  });
  return run;
}

describe('preload bridge, run', () => {
  it('exposes one object, window.stemline, whose keys are exactly the documented list', () => {
    const run = runPreload(() => ({ result: null }));
    expect([...run.exposed.keys()]).toEqual(['stemline']);
    expect(Object.keys(run.exposed.get('stemline')!).sort()).toEqual(DOCUMENTED_SURFACE);
    for (const value of Object.values(run.exposed.get('stemline')!)) expect(typeof value).toBe('function');
  });

  it('sends an intent on its channel and turns a host error into a rejection with the host’s message', async () => {
    const run = runPreload((channel) => (channel === 'stemline:openProject' ? { error: { kind: 'path-refused', message: 'Choose the file again.' } } : { result: { name: 'Stemline' } }));
    const api = run.exposed.get('stemline') as Record<string, (args: unknown) => Promise<unknown>>;
    expect(await api.appInfo!({})).toEqual({ name: 'Stemline' });
    await expect(api.openProject!({})).rejects.toMatchObject({ message: 'Choose the file again.', kind: 'path-refused' });
    expect(run.invoked.map((call) => call.channel)).toEqual(['stemline:appInfo', 'stemline:openProject']);
  });

  it('hands a menu listener the message alone, never the IPC event, and stops when asked', () => {
    const run = runPreload(() => ({ result: null }));
    const api = run.exposed.get('stemline') as { onMenuCommand(listener: (message: unknown) => void): () => void };
    const heard: unknown[][] = [];
    const stop = api.onMenuCommand((...args) => heard.push(args));
    const relay = run.listeners.get(MENU_COMMAND_CHANNEL)!;
    relay({ sender: { send: 'the main process side' } }, { command: 'undo' });
    expect(heard).toEqual([[{ command: 'undo' }]]);
    stop();
    expect(run.listeners.has(MENU_COMMAND_CHANNEL)).toBe(false);
  });
});

describe('preload bridge', () => {
  it('exposes exactly the documented list: one function per intent and the menu event, nothing more', () => {
    expect(exposedKeys()).toEqual(DOCUMENTED_SURFACE);
  });

  it('sends each intent on its own channel, under its own name', () => {
    const exposed = [...preloadSource.matchAll(/^\s+(\w+): \(args\) => callHost\('(\w+)', args\)/gm)];
    expect(exposed.map((m) => m[1]).sort()).toEqual([...INTENT_NAMES].sort());
    for (const m of exposed) expect(m[1]).toBe(m[2]);
    // callHost spells the channel as channelFor does.
    expect(preloadSource).toContain('ipcRenderer.invoke(`stemline:${intent}`, args)');
    expect(channelFor('appInfo')).toBe('stemline:appInfo');
  });

  it('exposes one object under one name, and never ipcRenderer, a generic send or an IPC event', () => {
    expect([...preloadSource.matchAll(/exposeInMainWorld\(/g)]).toHaveLength(1);
    expect(preloadSource).toMatch(/exposeInMainWorld\('stemline', stemlineHostApi\)/);
    expect(preloadSource).not.toMatch(/exposeInMainWorld\([^)]*ipcRenderer/);
    expect(preloadSource).not.toMatch(/ipcRenderer\.(send|sendSync|sendTo|sendToHost|postMessage)\b/);
    // The one listener is the menu channel's, and it hands the page the message alone, not the event.
    const listeners = [...preloadSource.matchAll(/ipcRenderer\.on\('([^']+)', (\w+)\)/g)];
    expect(listeners.map((m) => m[1])).toEqual([MENU_COMMAND_CHANNEL]);
    expect(preloadSource).toMatch(/const relay = \(_event: unknown, message: MenuMessage\) => listener\(message\);/);
  });
});
