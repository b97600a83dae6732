// The page's handle on the tracing worker: one promise per request, progress through
// a callback. Requests are answered in order; a new trace supersedes nothing, it
// simply queues behind the one running.
import type { FittedSheet, InkPreview, RetracedSheet, TraceReply, TraceRequest, TracedSheet } from './trace-protocol.ts';
import type { SheetEdit, TraceStage } from '../../../core/raster/index.ts';
import type { FitSettings, ScanSettings } from '../../../core/pipeline/index.ts';

/** Progress callback: share done (0–1) and the step running. */
export type ProgressCallback = (fraction: number, stage: TraceStage | 'fitting' | 'correcting') => void;

type Result = TracedSheet | FittedSheet | RetracedSheet | InkPreview;
type Pending = { resolve: (result: Result) => void; reject: (error: Error) => void; onProgress?: ProgressCallback };

export class TraceClient {
  private readonly worker = new Worker(new URL('./trace-worker.ts', import.meta.url), { type: 'module' });
  private readonly pending = new Map<number, Pending>();
  private nextId = 1;

  constructor() {
    this.worker.onmessage = (event: MessageEvent<TraceReply>) => this.receive(event.data);
  }

  /** Traces a decoded scan; the raster's pixels are handed to the worker. */
  trace(raster: { width: number; height: number; data: Uint8Array; dpi?: number }, settings: ScanSettings, onProgress?: ProgressCallback): Promise<TracedSheet> {
    return this.send({ type: 'trace', id: this.nextId++, raster, settings }, onProgress, [raster.data.buffer as ArrayBuffer]) as Promise<TracedSheet>;
  }

  /** The last traced sheet with `edits` applied in order (the whole list: undo sends it shortened). */
  correct(edits: readonly SheetEdit[], onProgress?: ProgressCallback): Promise<TracedSheet> {
    return this.send({ type: 'correct', id: this.nextId++, edits: [...edits] }, onProgress) as Promise<TracedSheet>;
  }

  /** Traces the scan again with other settings: the corrections of `from` carried over, or else `edits` applied as they are. */
  retrace(settings: ScanSettings, edits: readonly SheetEdit[], from: { settings: ScanSettings; edits: readonly SheetEdit[] } | null, onProgress?: ProgressCallback): Promise<RetracedSheet> {
    return this.send({ type: 'retrace', id: this.nextId++, settings, edits: [...edits], from: from && { settings: from.settings, edits: [...from.edits] } }, onProgress) as Promise<RetracedSheet>;
  }

  /** The ink `settings` give on the traced scan, as an image to lay over it. */
  preview(settings: ScanSettings): Promise<InkPreview> {
    return this.send({ type: 'preview', id: this.nextId++, settings }) as Promise<InkPreview>;
  }

  /** Fits assigned letters of the last traced sheet (those in `letters`, or all) into outlines in font units. */
  fit(settings: FitSettings, letters?: readonly number[], onProgress?: ProgressCallback): Promise<FittedSheet> {
    return this.send({ type: 'fit', id: this.nextId++, settings, ...(letters === undefined ? {} : { letters: [...letters] }) }, onProgress) as Promise<FittedSheet>;
  }

  dispose(): void {
    this.worker.terminate();
  }

  private send(request: TraceRequest, onProgress?: ProgressCallback, transfer: Transferable[] = []): Promise<Result> {
    return new Promise((resolve, reject) => {
      this.pending.set(request.id, onProgress ? { resolve, reject, onProgress } : { resolve, reject });
      this.worker.postMessage(request, transfer);
    });
  }

  private receive(message: TraceReply): void {
    const waiting = this.pending.get(message.id);
    if (!waiting) return;
    if (message.type === 'progress') {
      waiting.onProgress?.(message.fraction, message.stage);
      return;
    }
    this.pending.delete(message.id);
    if (message.type === 'failed') waiting.reject(new Error(message.message));
    else waiting.resolve(message.result);
  }
}
