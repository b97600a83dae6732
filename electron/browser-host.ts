// The browser-mode host: serves the built renderer and answers its intents over
// HTTP on the loopback interface, through the same `invokeHandler` the Electron
// shell uses. It lets the app run where no Electron binary is installed, and lets
// Playwright drive the real UI against the real handlers. Projects are read and
// written only inside its workspace folder, named when it starts (the page has no
// native file dialog: it lists the workspace's projects itself). Only this machine,
// only the page's own origin, and only holders of the run's key are answered
// (browser-access.ts); every file carries the page's Content-Security-Policy.
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { readFile, stat } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { invokeHandler } from './handlers.ts';
import { HandlerError } from './handler-error.ts';
import { projectAccess, type HostContext } from './host-context.ts';
import { realWorkspace, workspacePlaces } from './places/workspace-places.ts';
import { appDataFolder, untitledRecoveryFolder } from './places/app-data-folder.ts';
import { RecentProjects, recentProjectsPath } from './places/recent-projects.ts';
import { NO_WINDOW } from './host-context.ts';
import { checkAccess, newRunToken, TOKEN_PATTERN } from './browser-access.ts';
import { contentTypeOf, rendererFileFor } from './renderer-files.ts';
import { pageSecurityHeaders } from './shell/content-security-policy.ts';
import type { IntentName } from './api-contract.ts';
import { MAX_FONT_ARGUMENT_CHARACTERS } from './font-arguments.ts';
import { MAX_DECODE_SCAN_REQUEST_CHARACTERS } from './scan-decode-handler.ts';

/** Only the loopback interface: the host must never be reachable from another machine. */
export const LOOPBACK_ADDRESS = '127.0.0.1';

/** Largest request body accepted by the intent endpoint for intents that carry small JSON. */
const MAX_REQUEST_BYTES = 1 << 20;

/**
 * Largest body of an intent that carries a whole project (with its scan embedded:
 * tens of MiB for a 600-dpi page). 256 MiB, half the largest project file: the body
 * must become one JavaScript string (V8 caps strings near 2^29 characters) and is
 * parsed into a second copy.
 */
export const MAX_PROJECT_REQUEST_BYTES = 256 * 1024 * 1024;

/** The intents whose body is a project. */
const PROJECT_CARRYING: ReadonlySet<string> = new Set<IntentName>(['saveProject', 'saveProjectAs', 'autosaveProject']);

/** The intents whose body is a font's glyphs, taken up to MAX_FONT_ARGUMENT_CHARACTERS bytes (font-arguments.ts). */
const FONT_CARRYING: ReadonlySet<string> = new Set<IntentName>(['buildProofFont', 'exportFont']);

/** The largest request body taken for `intent`. */
function bodyLimitFor(intent: string): number {
  if (PROJECT_CARRYING.has(intent)) return MAX_PROJECT_REQUEST_BYTES;
  if (FONT_CARRYING.has(intent)) return MAX_FONT_ARGUMENT_CHARACTERS;
  // A scan file the page cannot decode, in base64 (scan-decode-handler.ts).
  if (intent === 'decodeScan') return MAX_DECODE_SCAN_REQUEST_CHARACTERS;
  return MAX_REQUEST_BYTES;
}

/** Where the browser host keeps projects. */
export interface BrowserHostPlaces {
  /** The workspace folder: the only folder projects are opened from and saved to. */
  workspace: string;
  /**
   * The host's per-user folder (the recent projects; the recovery copies unless `untitledFolder`
   * says otherwise). Default: the folder holding `untitledFolder` when that is given, else app-data-folder.ts's.
   */
  appFolder?: string;
  /** Where the autosaved copies of projects never saved go; default the app folder's (app-data-folder.ts). */
  untitledFolder?: string;
  /** The demo's sheets: absent, the ones shipped with Stemline; null, no demo (the window starts on an empty project). */
  demoFolder?: string | null;
  /** The run's key; default a new random one. Tests and the browser-test harness pass their own. */
  token?: string;
}

/** A request body over its limit. */
class BodyTooLarge extends Error {
  constructor(readonly limit: number) {
    super('request too large');
  }
}

export interface BrowserHost {
  server: Server;
  /** The page's address, key included: http://127.0.0.1:PORT/KEY/ */
  url: string;
  /** The address without the key (requests to it need the key in a header). */
  origin: string;
  /** The run's key. */
  token: string;
  close(): Promise<void>;
}

/**
 * Starts serving `rendererDir` (the output of the renderer build) and the intent
 * endpoint `POST /api/<intent>` on 127.0.0.1:`port` (0 picks a free port), with
 * projects kept in `places.workspace`. Throws, saying what to do, when the renderer
 * is not built or the workspace is not a folder.
 */
export async function startBrowserHost(rendererDir: string, port: number, places: BrowserHostPlaces): Promise<BrowserHost> {
  const root = resolve(rendererDir);
  await assertRendererBuilt(root);
  const workspace = await realWorkspace(places.workspace);
  const token = places.token ?? newRunToken();
  if (!TOKEN_PATTERN.test(token)) throw new Error('The browser host\'s key must be 32 to 128 letters, digits, "-" or "_". Leave it unset to get a random one.');
  const appFolder = resolve(places.appFolder ?? (places.untitledFolder === undefined ? appDataFolder() : dirname(resolve(places.untitledFolder))));
  const context: HostContext = {
    host: 'browser',
    projects: projectAccess(workspacePlaces(workspace), resolve(places.untitledFolder ?? untitledRecoveryFolder(appFolder))),
    ...(places.demoFolder === undefined ? {} : { demoFolder: places.demoFolder }),
    recent: new RecentProjects(recentProjectsPath(appFolder)),
    window: NO_WINDOW,
  };
  let authority = '';
  const server = createServer((request, response) => {
    const verdict = checkAccess({ url: request.url ?? '/', headers: request.headers }, authority, token);
    if (!verdict.allowed) {
      request.resume();
      // A page asked for by a browser gets the message as text, an intent as the renderer's error.
      if (request.method === 'GET' || request.method === 'HEAD') sendText(response, verdict.status, verdict.message);
      else sendJson(response, verdict.status, { error: { kind: 'forbidden', message: verdict.message } });
      return;
    }
    if (verdict.path === '') {
      // The key without its slash: the page's relative addresses need /KEY/ (308 Permanent Redirect, RFC 9110 §15.4.9).
      response.writeHead(308, { location: `/${token}/`, 'cache-control': 'no-store' });
      response.end();
      return;
    }
    route(root, context, verdict.path, request, response).catch((error: unknown) => {
      sendJson(response, 500, { error: { kind: 'internal', message: `The host failed: ${String(error)}` } });
    });
  });
  await new Promise<void>((resolveListen, rejectListen) => {
    server.once('error', rejectListen);
    server.listen(port, LOOPBACK_ADDRESS, () => resolveListen());
  });
  const address = server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;
  authority = `${LOOPBACK_ADDRESS}:${boundPort}`;
  return {
    server,
    url: `http://${authority}/${token}/`,
    origin: `http://${authority}/`,
    token,
    close: () => new Promise((done) => server.close(() => done())),
  };
}

async function assertRendererBuilt(root: string): Promise<void> {
  try {
    await stat(join(root, 'index.html'));
  } catch {
    throw new Error(`The renderer has not been built (no ${join(root, 'index.html')}). Run "npm run build" first.`);
  }
}

/** Serves `path` (the request path, the run's key taken off). */
async function route(root: string, context: HostContext, path: string, request: IncomingMessage, response: ServerResponse): Promise<void> {
  if (path.startsWith('/api/')) {
    await answerIntent(path.slice('/api/'.length), context, request, response);
    return;
  }
  if (request.method !== 'GET' && request.method !== 'HEAD') {
    sendJson(response, 405, { error: { kind: 'method', message: 'Only GET is served here.' } });
    return;
  }
  await serveFile(root, path, response);
}

async function answerIntent(intent: string, context: HostContext, request: IncomingMessage, response: ServerResponse): Promise<void> {
  if (request.method !== 'POST') {
    sendJson(response, 405, { error: { kind: 'method', message: 'Intents are sent with POST.' } });
    return;
  }
  let args: unknown;
  try {
    args = JSON.parse((await readBody(request, bodyLimitFor(intent))) || 'null');
  } catch (error) {
    if (error instanceof BodyTooLarge) {
      sendJson(response, 413, { error: { kind: 'bad-arguments', message: `The request is larger than the ${error.limit / 2 ** 20} MiB the browser host takes, so it was refused. ${FONT_CARRYING.has(intent) ? 'A font this large needs fewer points: refit its most detailed glyphs with a larger tolerance.' : intent === 'decodeScan' ? 'Save the scan compressed (Group 4 for a 1-bit scan, LZW or Deflate for grey), at a lower resolution, or cropped.' : 'A project this large needs smaller scans (a lower resolution or a cropped sheet).'}` } });
      return;
    }
    sendJson(response, 400, { error: { kind: 'bad-arguments', message: 'The request body was not valid JSON.' } });
    return;
  }
  try {
    const result = await invokeHandler(intent, args, context);
    sendJson(response, 200, { result });
  } catch (error) {
    if (error instanceof HandlerError) {
      sendJson(response, 400, { error: error.toPayload() });
      return;
    }
    throw error;
  }
}

function readBody(request: IncomingMessage, limit: number): Promise<string> {
  return new Promise((resolveBody, rejectBody) => {
    const chunks: Buffer[] = [];
    let size = 0;
    let refused = false;
    request.on('data', (chunk: Buffer) => {
      if (refused) return;
      size += chunk.length;
      if (size > limit) {
        // Stop keeping the body but let it drain, so the refusal reaches the page.
        refused = true;
        chunks.length = 0;
        rejectBody(new BodyTooLarge(limit));
        return;
      }
      chunks.push(chunk);
    });
    request.on('end', () => resolveBody(Buffer.concat(chunks).toString('utf8')));
    request.on('error', rejectBody);
  });
}

async function serveFile(root: string, pathname: string, response: ServerResponse): Promise<void> {
  const filePath = rendererFileFor(root, pathname);
  if (filePath === null) {
    sendJson(response, 403, { error: { kind: 'forbidden', message: 'Outside the app.' } });
    return;
  }
  try {
    const body = await readFile(filePath);
    response.writeHead(200, { ...pageSecurityHeaders(), 'content-type': contentTypeOf(filePath), 'cache-control': 'no-store' });
    response.end(body);
  } catch {
    sendJson(response, 404, { error: { kind: 'not-found', message: `No such file: ${pathname}` } });
  }
}

function sendText(response: ServerResponse, status: number, message: string): void {
  response.writeHead(status, { ...pageSecurityHeaders(), 'content-type': 'text/plain; charset=utf-8', 'cache-control': 'no-store' });
  response.end(`${message}\n`);
}

function sendJson(response: ServerResponse, status: number, body: unknown): void {
  response.writeHead(status, { ...pageSecurityHeaders(), 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' });
  response.end(JSON.stringify(body));
}
