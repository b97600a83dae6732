// The preload script exposes exactly the contract's intents and never raw IPC: a
// renderer script must not be able to send arbitrary messages to the main process.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { INTENT_NAMES } from '../../electron/api-contract.ts';

const preloadSource = readFileSync(new URL('../../electron/preload.cts', import.meta.url), 'utf8');

describe('preload bridge', () => {
  it('exposes one function per intent in the contract, and only those', () => {
    const exposed = [...preloadSource.matchAll(/^\s+(\w+): \(args\) => callHost\('(\w+)', args\)/gm)];
    expect(exposed.map((m) => m[1]).sort()).toEqual([...INTENT_NAMES].sort());
    for (const m of exposed) expect(m[1]).toBe(m[2]);
  });

  it('never hands the renderer ipcRenderer itself or a generic send', () => {
    expect(preloadSource).toMatch(/exposeInMainWorld\('stemline', stemlineHostApi\)/);
    expect(preloadSource).not.toMatch(/exposeInMainWorld\([^)]*ipcRenderer/);
    expect(preloadSource).not.toMatch(/ipcRenderer\.(send|on|sendSync)\b/);
  });
});
