// Who may use the browser-mode host: only a page of its own origin, on this machine,
// holding this run's key. The host listens on the loopback interface only (no other
// machine can connect); on top of that every request must
//  - name the host as 127.0.0.1:<port> (a page whose domain was re-pointed at
//    127.0.0.1, "DNS rebinding", sends its own name and is refused),
//  - come from no other origin (a page elsewhere sends its Origin, and its browser
//    says "cross-site" or "same-site" in Sec-Fetch-Site: both refused), and
//  - carry the run's key, a random token made at start: as the first segment of the
//    path (the address `npm start` prints, http://127.0.0.1:PORT/KEY/) or in the
//    x-stemline-token header (scripts and the browser tests). Other programs and
//    users of the machine can reach the port but do not know the key.
import { randomBytes, timingSafeEqual } from 'node:crypto';

/** Random bytes in a run's key: 256 bits, far beyond guessing (OWASP's Session Management Cheat Sheet asks at least 64 bits of entropy; from memory). */
const TOKEN_BYTES = 32;

/** How a key is spelled: base64url of TOKEN_BYTES bytes (43 characters), or a key given to the host of at least 32 such characters. */
export const TOKEN_PATTERN = /^[A-Za-z0-9_-]{32,128}$/;

/** The header scripts send the key in. */
export const TOKEN_HEADER = 'x-stemline-token';

/** A new key for one run of the host. */
export function newRunToken(): string {
  return randomBytes(TOKEN_BYTES).toString('base64url');
}

/** The parts of a request the check reads. */
export interface RequestFacts {
  /** The request's path and query, as sent. */
  url: string;
  headers: Record<string, string | string[] | undefined>;
}

export type AccessVerdict =
  /** Served: `path` is the request path with the key taken off (always starting with "/"). */
  | { allowed: true; path: string }
  | { allowed: false; status: 403 | 421; message: string };

function single(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

function sameKey(presented: string, expected: string): boolean {
  const a = Buffer.from(presented);
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b);
}

/** The message a refused request gets: what was wrong and what to do. */
const NO_KEY_MESSAGE = 'This address needs the key of this run of Stemline. Open the full address "npm start" printed in its terminal (it ends in the key).';

/**
 * Whether the request may be served by the host at `authority` ("127.0.0.1:5731") whose
 * run key is `token`. Misdirected (421, RFC 9110 §15.5.20) when the Host header names
 * another host; forbidden (403) for another origin or a missing or wrong key.
 */
export function checkAccess(request: RequestFacts, authority: string, token: string): AccessVerdict {
  const host = single(request.headers.host);
  if (host !== authority) {
    return { allowed: false, status: 421, message: `Stemline answers only at http://${authority}/ (this request named ${JSON.stringify(host ?? '')}). Open the address "npm start" printed.` };
  }
  const origin = single(request.headers.origin);
  if (origin !== undefined && origin !== `http://${authority}`) {
    return { allowed: false, status: 403, message: 'Stemline answers only its own page, not pages of other sites or ports.' };
  }
  const fetchSite = single(request.headers['sec-fetch-site']);
  if (fetchSite === 'cross-site' || fetchSite === 'same-site') {
    return { allowed: false, status: 403, message: 'Stemline answers only its own page, not pages of other sites or ports.' };
  }
  const path = request.url.split('?')[0] ?? '/';
  const header = single(request.headers[TOKEN_HEADER]);
  if (header !== undefined) {
    return sameKey(header, token) ? { allowed: true, path } : { allowed: false, status: 403, message: NO_KEY_MESSAGE };
  }
  const match = /^\/([^/]+)(\/.*)?$/.exec(path);
  if (match === null || !sameKey(match[1] ?? '', token)) return { allowed: false, status: 403, message: NO_KEY_MESSAGE };
  // The page's address is /KEY/: without the trailing slash its relative asset URLs would lose the key.
  return { allowed: true, path: match[2] ?? '' };
}
