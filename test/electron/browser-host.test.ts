// The browser-mode host serves the renderer and the same handlers over HTTP on the
// loopback interface only, and never serves files outside the renderer build.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { request } from 'node:http';
import { startBrowserHost, type BrowserHost } from '../../electron/browser-host.ts';
import { APP_VERSION } from '../../electron/app-identity.ts';

let host: BrowserHost;
let rendererDir: string;
let workspace: string;

beforeAll(async () => {
  const folder = mkdtempSync(join(tmpdir(), 'stemline-host-'));
  rendererDir = join(folder, 'renderer');
  mkdirSync(join(rendererDir, 'assets'), { recursive: true });
  writeFileSync(join(rendererDir, 'index.html'), '<!doctype html><title>Stemline</title>');
  writeFileSync(join(rendererDir, 'assets', 'app.js'), 'console.log(1)');
  writeFileSync(join(folder, 'secret.txt'), 'not for the page');
  workspace = join(folder, 'workspace');
  mkdirSync(workspace);
  host = await startBrowserHost(rendererDir, 0, { workspace, untitledFolder: join(folder, 'recovery') });
});
afterAll(() => host.close());

/** Raw request so that "../" is sent as typed, not normalised by a URL parser. */
function rawGet(path: string): Promise<{ status: number; body: string }> {
  const url = new URL(host.url);
  return new Promise((resolve, reject) => {
    const req = request({ host: url.hostname, port: url.port, path, method: 'GET' }, (res) => {
      let body = '';
      res.on('data', (chunk: Buffer) => (body += chunk.toString()));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('browser-mode host', () => {
  it('listens on 127.0.0.1 only', () => {
    expect(host.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/$/);
  });

  it('serves the renderer page and its assets with the right types', async () => {
    const page = await fetch(host.url);
    expect(page.status).toBe(200);
    expect(page.headers.get('content-type')).toMatch(/text\/html/);
    const script = await fetch(new URL('assets/app.js', host.url));
    expect(script.headers.get('content-type')).toMatch(/text\/javascript/);
  });

  it('answers intents through the shared handlers', async () => {
    const reply = await fetch(new URL('api/appInfo', host.url), { method: 'POST', body: '{}' });
    expect(await reply.json()).toMatchObject({ result: { name: 'Stemline', version: APP_VERSION, host: 'browser' } });
  });

  it('reports an unknown intent as a user-readable error, not a crash', async () => {
    const reply = await fetch(new URL('api/deleteEverything', host.url), { method: 'POST', body: '{}' });
    expect(reply.status).toBe(400);
    expect(await reply.json()).toMatchObject({ error: { kind: 'unknown-intent' } });
  });

  it('rejects a body that is not JSON', async () => {
    const reply = await fetch(new URL('api/appInfo', host.url), { method: 'POST', body: '{not json' });
    expect(reply.status).toBe(400);
  });

  it('never serves a file outside the renderer build', async () => {
    for (const path of ['/../secret.txt', '/%2e%2e/secret.txt', '/assets/../../secret.txt']) {
      const reply = await rawGet(path);
      expect(reply.body).not.toContain('not for the page');
      expect([403, 404]).toContain(reply.status);
    }
  });

  it('refuses to start when the renderer has not been built, saying what to run', async () => {
    await expect(startBrowserHost(join(rendererDir, 'missing'), 0, { workspace })).rejects.toThrow(/npm run build/);
  });

  it('refuses to start without a workspace folder, saying how to name one', async () => {
    await expect(startBrowserHost(rendererDir, 0, { workspace: join(workspace, 'missing') })).rejects.toThrow(/does not exist.*npm start -- \/path\/to\/folder/);
  });

  it('lists the projects of its workspace folder', async () => {
    writeFileSync(join(workspace, 'harbour.stemline'), '{}');
    const reply = await fetch(new URL('api/listProjects', host.url), { method: 'POST', body: '{}' });
    expect(await reply.json()).toMatchObject({ result: { kind: 'workspace', folderName: 'workspace', projects: [{ name: 'harbour.stemline' }] } });
  });

  it('refuses a request body beyond its limit with a message, not a crash', async () => {
    const reply = await fetch(new URL('api/appInfo', host.url), { method: 'POST', body: JSON.stringify({ padding: 'x'.repeat(2 << 20) }) });
    expect(reply.status).toBe(413);
    expect(await reply.json()).toMatchObject({ error: { kind: 'bad-arguments', message: expect.stringMatching(/larger than the 1 MiB the browser host takes/) } });
  });

  it('refuses a project name leading out of the workspace over HTTP too', async () => {
    const reply = await fetch(new URL('api/openProject', host.url), { method: 'POST', body: JSON.stringify({ name: '../secret.txt' }) });
    expect(reply.status).toBe(400);
    expect(await reply.json()).toMatchObject({ error: { kind: 'path-refused' } });
  });
});
