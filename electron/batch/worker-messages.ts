// The messages between a batch build and its worker threads: a numbered task out,
// and for each one reply with the same number, carrying the result or the error.
import type { PortableError } from './batch-tasks.ts';

export interface WorkerRequest<T> {
  readonly id: number;
  readonly task: T;
}

export type WorkerReply =
  | { readonly id: number; readonly ok: true; readonly result: unknown }
  | { readonly id: number; readonly ok: false; readonly error: PortableError };
