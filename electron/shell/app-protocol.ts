// Answers the requests of the app's own scheme (app-origin.ts): files of the renderer
// build, each with the page's security headers; any other host, a method other than
// GET, or a path leading out of the build is refused. Nothing is ever fetched from the
// network. The file reading is passed in, so this runs and is tested in plain Node;
// electron/main.ts hands the answer to Electron's protocol.handle.
import { readFile as readFileFromDisk } from 'node:fs/promises';
import { resolve } from 'node:path';
import { APP_HOST, APP_SCHEME } from './app-origin.ts';
import { pageSecurityHeaders } from './content-security-policy.ts';
import { contentTypeOf, rendererFileFor } from '../renderer-files.ts';

/** What the scheme answers: a status, headers, and the body bytes (empty for a refusal). */
export interface AppResponse {
  status: number;
  headers: Record<string, string>;
  body: Uint8Array;
}

/** HTTP statuses of the answers (RFC 9110). */
const STATUS = { ok: 200, forbidden: 403, notFound: 404, methodNotAllowed: 405 } as const;

function refusal(status: number, message: string): AppResponse {
  return { status, headers: { 'content-type': 'text/plain; charset=utf-8', ...pageSecurityHeaders() }, body: new TextEncoder().encode(message) };
}

/**
 * The answer to a request for `url` with `method`, served from the renderer build
 * `rendererDir`. `readFile` reads a file's bytes (a test may stand in for the disk).
 */
export async function answerAppRequest(
  rendererDir: string,
  method: string,
  url: string,
  readFile: (path: string) => Promise<Uint8Array> = readFileFromDisk,
): Promise<AppResponse> {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return refusal(STATUS.forbidden, 'Not an address of the app.');
  }
  if (parsed.protocol !== `${APP_SCHEME}:` || parsed.host !== APP_HOST) return refusal(STATUS.forbidden, 'Not an address of the app.');
  if (method !== 'GET' && method !== 'HEAD') return refusal(STATUS.methodNotAllowed, 'The app’s files are only read.');
  const filePath = rendererFileFor(resolve(rendererDir), parsed.pathname);
  if (filePath === null) return refusal(STATUS.forbidden, 'Outside the app.');
  let body: Uint8Array;
  try {
    body = await readFile(filePath);
  } catch {
    return refusal(STATUS.notFound, `The app has no file ${parsed.pathname}. Reinstall Stemline if this persists.`);
  }
  return {
    status: STATUS.ok,
    headers: { 'content-type': contentTypeOf(filePath), 'cache-control': 'no-store', ...pageSecurityHeaders() },
    body: method === 'HEAD' ? new Uint8Array() : body,
  };
}
