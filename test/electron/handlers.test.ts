// The host handlers answer the renderer's intents the same way in both hosts, and
// refuse anything they do not offer or arguments they do not take.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { invokeHandler } from '../../electron/handlers.ts';
import { HandlerError } from '../../electron/handler-error.ts';
import { APP_NAME, APP_VERSION } from '../../electron/app-identity.ts';
import { INTENT_NAMES, channelFor } from '../../electron/api-contract.ts';
import { browserHostFixture, desktopHostFixture } from './project-host-fixture.ts';

const browser = browserHostFixture().context;
const desktop = desktopHostFixture({ open: [], save: [] }).context;

describe('host handlers', () => {
  it('report the product name and the version package.json declares (the about screen would lie otherwise)', async () => {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { name: string; version: string };
    const info = await invokeHandler('appInfo', {}, browser);
    expect(info).toEqual({ name: APP_NAME, version: pkg.version, host: 'browser', platform: process.platform, demoOffered: true });
    expect(APP_VERSION).toBe(pkg.version);
    expect(pkg.name).toBe('stemline');
  });

  it('tell the renderer which host serves it', async () => {
    expect(await invokeHandler('appInfo', null, desktop)).toMatchObject({ host: 'electron' });
  });

  it('tell the renderer whether the demo project is offered, so a new project shows the way back to it only when there is one', async () => {
    expect(await invokeHandler('appInfo', {}, desktop)).toMatchObject({ demoOffered: true });
    expect(await invokeHandler('appInfo', {}, { ...browser, demoFolder: null })).toMatchObject({ demoOffered: false });
  });

  it('refuse an intent that does not exist, with a message for the user', async () => {
    await expect(invokeHandler('readAnyFile', { path: '/etc/passwd' }, browser)).rejects.toSatisfy(
      (error: unknown) => error instanceof HandlerError && error.kind === 'unknown-intent' && /does not offer/.test(error.message),
    );
  });

  it('refuse arguments an intent does not take', async () => {
    for (const bad of [{ path: '/tmp/x' }, [1, 2], 'text', 42]) {
      await expect(invokeHandler('appInfo', bad, browser)).rejects.toMatchObject({ kind: 'bad-arguments' });
    }
  });

  it('refuse names inherited from Object.prototype (no prototype lookups reach a handler)', async () => {
    for (const name of ['toString', 'constructor', '__proto__', 'hasOwnProperty']) {
      await expect(invokeHandler(name, {}, browser)).rejects.toMatchObject({ kind: 'unknown-intent' });
    }
  });

  it('give every intent its own IPC channel', () => {
    const channels = INTENT_NAMES.map(channelFor);
    expect(new Set(channels).size).toBe(INTENT_NAMES.length);
    expect(channels).toContain('stemline:appInfo');
  });
});
