// The Content-Security-Policy of the app's page, in one place: the desktop shell sends
// it as a response header with every file of its own scheme, the browser-mode host
// with every file it serves, and renderer/index.html carries the same directives in
// its meta tag (a test keeps them equal). Scripts only from the app itself, no eval,
// no remote hosts at all: every source is 'self', 'none', or the page's own data:
// and blob: URLs (decoded scans, the proof font).
//
// Electron security checklist, item 7 ("Define a Content Security Policy"):
// https://www.electronjs.org/docs/latest/tutorial/security

/** The directives the page's meta tag holds too, in its order. */
export const PAGE_CSP_DIRECTIVES: readonly (readonly [string, readonly string[]])[] = [
  ['default-src', ["'self'"]],
  ['script-src', ["'self'"]],
  // Svelte sets style attributes on elements (style: directives); no style sheet comes from elsewhere.
  ['style-src', ["'self'", "'unsafe-inline'"]],
  // Scans decoded in the page and glyph thumbnails are shown through data: and blob: URLs.
  ['img-src', ["'self'", 'data:', 'blob:']],
  // The proof font is loaded from memory.
  ['font-src', ["'self'", 'data:', 'blob:']],
  ['connect-src', ["'self'"]],
  ['worker-src', ["'self'", 'blob:']],
  ['object-src', ["'none'"]],
  ['base-uri', ["'none'"]],
  ['form-action', ["'none'"]],
];

/**
 * Directives a meta tag cannot carry (CSP Level 3, "frame-ancestors": ignored in
 * <meta>), sent only as a header: nothing may frame the app.
 */
export const HEADER_ONLY_CSP_DIRECTIVES: readonly (readonly [string, readonly string[]])[] = [['frame-ancestors', ["'none'"]]];

function spell(directives: readonly (readonly [string, readonly string[]])[]): string {
  return directives.map(([name, sources]) => `${name} ${sources.join(' ')}`).join('; ');
}

/** The policy as the page's meta tag spells it. */
export function pageContentSecurityPolicy(): string {
  return spell(PAGE_CSP_DIRECTIVES);
}

/** The policy as the response header the hosts send. */
export function contentSecurityPolicyHeader(): string {
  return spell([...PAGE_CSP_DIRECTIVES, ...HEADER_ONLY_CSP_DIRECTIVES]);
}

/** Headers every page file carries, in either host: the policy and the hardening that goes with it. */
export function pageSecurityHeaders(): Record<string, string> {
  return {
    'content-security-policy': contentSecurityPolicyHeader(),
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'no-referrer',
    'cross-origin-opener-policy': 'same-origin',
    'cross-origin-resource-policy': 'same-origin',
  };
}
