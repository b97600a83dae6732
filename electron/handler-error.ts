// The error a host handler throws when a request cannot be served. Its message is
// written for the user (what was wrong, what to do); `kind` lets the renderer and
// tests tell failures apart without parsing prose.
import type { HostErrorPayload } from './api-contract.ts';

export type HandlerErrorKind = 'unknown-intent' | 'bad-arguments';

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
