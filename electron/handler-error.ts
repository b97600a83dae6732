// The error a host handler throws when a request cannot be served. Its message is
// written for the user (what was wrong, what to do); `kind` lets the renderer and
// tests tell failures apart without parsing prose.
import type { HostErrorPayload } from './api-contract.ts';

export type HandlerErrorKind =
  /** The renderer asked for an intent the host does not offer. */
  | 'unknown-intent'
  /** The arguments are not what the intent takes. */
  | 'bad-arguments'
  /** A file the user did not choose, or one outside the place the host may use. */
  | 'path-refused'
  /** A project handle the host never gave, or has forgotten (it restarted). */
  | 'project-unknown'
  /** A project file (or an exported font) could not be read or written; the message says why. */
  | 'project-file'
  /** The project's glyphs cannot make a valid font; the message names the glyph or value to change. */
  | 'font-build'
  /** A scan the page sent to be decoded is not an image Stemline reads, is damaged, or is too large; the message says what to do. */
  | 'scan-unreadable'
  /** The demo project's sheets are missing or damaged; the message says how to draw them again. */
  | 'demo-missing';

export class HandlerError extends Error {
  readonly kind: HandlerErrorKind;

  constructor(kind: HandlerErrorKind, message: string) {
    super(message);
    this.name = 'HandlerError';
    this.kind = kind;
  }

  /** The form that crosses IPC or HTTP to the renderer. */
  toPayload(): HostErrorPayload {
    return { kind: this.kind, message: this.message };
  }
}
