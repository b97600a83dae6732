// The browser-mode host serves the renderer and the same handlers over HTTP on the
// loopback interface only, never serves files outside the renderer build, and answers
// only its own page holding this run's key: plain HTTP requests without the key, from
// another origin or naming another host are refused before any handler runs.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { request } from 'node:http';
import sharp from 'sharp';
import { startBrowserHost, type BrowserHost } from '../../electron/browser-host.ts';
import { APP_VERSION } from '../../electron/app-identity.ts';
import { contentSecurityPolicyHeader } from '../../electron/shell/content-security-policy.ts';
import { sampleProject } from './project-host-fixture.ts';

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
  host = await startBrowserHost(rendererDir, 0, { workspace, appFolder: join(folder, 'app-data') });
});
afterAll(() => host.close());

interface RawReply {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

/**
 * A plain HTTP request, exactly as given: "../" is sent as typed (no URL parser
 * normalises it), and Host, Origin and Sec-Fetch-Site are whatever the test sets.
 */
function raw(path: string, options: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<RawReply> {
  const url = new URL(host.url);
  return new Promise((resolve, reject) => {
    const req = request({ host: url.hostname, port: url.port, path, method: options.method ?? 'GET', headers: options.headers ?? {} }, (res) => {
      let body = '';
      res.on('data', (chunk: Buffer) => (body += chunk.toString()));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
    });
    req.on('error', reject);
    req.end(options.body);
  });
}

/** The page's path with this run's key: /KEY/ */
function keyed(path: string): string {
  return `/${host.token}/${path.replace(/^\//, '')}`;
}

function rawGet(path: string): Promise<RawReply> {
  return raw(keyed(path));
}

describe('browser-mode host', () => {
  it('listens on 127.0.0.1 only, at an address carrying the run’s key', () => {
    expect((host.server.address() as AddressInfo).address).toBe('127.0.0.1');
    expect(host.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/[A-Za-z0-9_-]{43}\/$/);
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
    for (const path of ['/../secret.txt', '/%2e%2e/secret.txt', '/assets/../../secret.txt', '/%2e%2e%2fsecret.txt', '/%00']) {
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

  it('takes a TIFF to decode well beyond the small requests’ limit: an uncompressed grey page of a few MiB', async () => {
    const side = 1500;
    const tiff = await sharp(Buffer.alloc(side * side, 200), { raw: { width: side, height: side, channels: 1 } }).tiff({ compression: 'none' }).toBuffer();
    expect(tiff.length).toBeGreaterThan(2 << 20);
    const reply = await fetch(new URL('api/decodeScan', host.url), { method: 'POST', body: JSON.stringify({ name: 'flat.tif', base64: tiff.toString('base64') }) });
    const body = (await reply.json()) as { result: { width: number; height: number }; error?: unknown };
    expect(body.error).toBeUndefined();
    expect(reply.status).toBe(200);
    expect(body.result).toMatchObject({ width: side, height: side, format: 'tiff' });
  });

  it('refuses a project name leading out of the workspace over HTTP too', async () => {
    const reply = await fetch(new URL('api/openProject', host.url), { method: 'POST', body: JSON.stringify({ name: '../secret.txt' }) });
    expect(reply.status).toBe(400);
    expect(await reply.json()).toMatchObject({ error: { kind: 'path-refused' } });
  });
});

describe('browser mode is not reachable from other origins or without the run’s key', () => {
  const appInfoBody = '{}';

  it('refuses the page and every intent without the key, saying which address to open', async () => {
    for (const [path, method] of [['/', 'GET'], ['/index.html', 'GET'], ['/assets/app.js', 'GET'], ['/api/appInfo', 'POST']] as const) {
      const reply = await raw(path, { method, ...(method === 'POST' ? { body: appInfoBody } : {}) });
      expect(reply.status).toBe(403);
      expect(reply.body).not.toContain('<title>Stemline');
      // A page gets the message as text; an intent gets it as the renderer's error.
      const message = method === 'GET' ? reply.body : (JSON.parse(reply.body) as { error: { kind: string; message: string } }).error.message;
      expect(message).toMatch(/Open the full address "npm start" printed/);
      if (method === 'POST') expect(JSON.parse(reply.body)).toMatchObject({ error: { kind: 'forbidden' } });
    }
  });

  it('refuses a wrong key, in the path or in the header', async () => {
    const wrong = 'A'.repeat(host.token.length);
    expect((await raw(`/${wrong}/api/appInfo`, { method: 'POST', body: appInfoBody })).status).toBe(403);
    expect((await raw('/api/appInfo', { method: 'POST', body: appInfoBody, headers: { 'x-stemline-token': wrong } })).status).toBe(403);
    expect((await raw(`/${host.token.slice(0, -1)}/`)).status).toBe(403);
  });

  it('answers the key in the path (the printed address) and in the x-stemline-token header (scripts, the browser tests)', async () => {
    expect((await raw(keyed('api/appInfo'), { method: 'POST', body: appInfoBody })).status).toBe(200);
    const byHeader = await raw('/api/appInfo', { method: 'POST', body: appInfoBody, headers: { 'x-stemline-token': host.token } });
    expect(JSON.parse(byHeader.body)).toMatchObject({ result: { host: 'browser' } });
  });

  it('sends the key without its slash on to /KEY/, so the page’s relative addresses keep it', async () => {
    const reply = await raw(`/${host.token}`);
    expect(reply.status).toBe(308);
    expect(reply.headers.location).toBe(`/${host.token}/`);
  });

  it('refuses a request from another origin even with the key: another site, another port of this machine', async () => {
    const port = new URL(host.url).port;
    for (const origin of ['http://evil.example', `http://127.0.0.1:${Number(port) + 1}`, `http://localhost:${port}`, 'null']) {
      const reply = await raw(keyed('api/appInfo'), { method: 'POST', body: appInfoBody, headers: { origin } });
      expect(reply.status, origin).toBe(403);
      expect(JSON.parse(reply.body)).toMatchObject({ error: { message: expect.stringMatching(/only its own page/) } });
    }
    const own = await raw(keyed('api/appInfo'), { method: 'POST', body: appInfoBody, headers: { origin: `http://127.0.0.1:${port}` } });
    expect(own.status).toBe(200);
  });

  it('refuses what the browser marks as coming from another site or port (Sec-Fetch-Site), even a plain GET', async () => {
    for (const site of ['cross-site', 'same-site']) {
      expect((await raw(keyed('index.html'), { headers: { 'sec-fetch-site': site } })).status, site).toBe(403);
    }
    expect((await raw(keyed('index.html'), { headers: { 'sec-fetch-site': 'same-origin' } })).status).toBe(200);
    expect((await raw(keyed('index.html'), { headers: { 'sec-fetch-site': 'none' } })).status).toBe(200);
  });

  it('refuses a request naming another host, as a page re-pointed at 127.0.0.1 would send (DNS rebinding)', async () => {
    const port = new URL(host.url).port;
    for (const name of [`attacker.example:${port}`, `localhost:${port}`, '127.0.0.1', `127.0.0.1:${Number(port) + 1}`]) {
      const reply = await raw(keyed('api/appInfo'), { method: 'POST', body: appInfoBody, headers: { host: name } });
      // RFC 9110 §15.5.20: 421 Misdirected Request, for a request this server is not configured to answer.
      expect(reply.status, name).toBe(421);
    }
  });

  it('runs no handler for a refused request: a save without the key writes nothing', async () => {
    const before = readdirSync(workspace);
    const reply = await raw('/api/saveProjectAs', { method: 'POST', body: JSON.stringify({ project: sampleProject(), name: 'intruder' }) });
    expect(reply.status).toBe(403);
    expect(readdirSync(workspace)).toEqual(before);
  });

  it('gives each run a key of its own', async () => {
    const other = await startBrowserHost(rendererDir, 0, { workspace, appFolder: join(rendererDir, '..', 'app-data') });
    try {
      expect(other.token).not.toBe(host.token);
      expect((await raw(`/${other.token}/index.html`)).status).toBe(403);
    } finally {
      await other.close();
    }
  });

  it('refuses to start with a key too short to be secret', async () => {
    await expect(startBrowserHost(rendererDir, 0, { workspace, token: 'short' })).rejects.toThrow(/32 to 128 letters/);
  });

  it('sends the page’s Content-Security-Policy and no-sniff with every file, and with refusals', async () => {
    for (const reply of [await rawGet('index.html'), await rawGet('assets/app.js'), await raw('/')]) {
      expect(reply.headers['content-security-policy']).toBe(contentSecurityPolicyHeader());
      expect(reply.headers['x-content-type-options']).toBe('nosniff');
    }
  });
});
