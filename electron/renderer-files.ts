// The files of the renderer build as both hosts serve them: a request path resolved
// inside the build folder (anything leading out is refused), and the content type of
// each kind of file. The browser-mode host serves them over HTTP, the desktop shell
// through its own scheme (shell/app-protocol.ts).
import { extname, join, normalize, sep } from 'node:path';

const CONTENT_TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.json': 'application/json',
  '.woff2': 'font/woff2',
  '.otf': 'font/otf',
  '.ico': 'image/x-icon',
  '.wasm': 'application/wasm',
};

/** The content type a file of the build is served with. */
export function contentTypeOf(path: string): string {
  return CONTENT_TYPES[extname(path).toLowerCase()] ?? 'application/octet-stream';
}

/**
 * The file of the build `root` (an absolute, normalised folder) that the URL path
 * `pathname` names ("/" is index.html), or null when the path is malformed or would
 * lead outside the build.
 */
export function rendererFileFor(root: string, pathname: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(pathname);
  } catch {
    return null;
  }
  if (decoded.includes('\u0000')) return null;
  const relative = decoded === '/' || decoded === '' ? 'index.html' : decoded.replace(/^\/+/, '');
  const filePath = normalize(join(root, relative));
  return filePath.startsWith(root + sep) ? filePath : null;
}
