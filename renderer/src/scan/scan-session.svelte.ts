// The state of opening one scan in the page: decoding, tracing in the worker with
// progress, the traced sheet, and any problem to show. Components render it and
// call its methods; nothing else changes it.
import { decodeScanInPage } from './decode-in-page.ts';
import { TraceClient } from './trace-client.ts';
import type { FittedSheet, TracedSheet } from './trace-protocol.ts';

export type ScanPhase = 'idle' | 'decoding' | 'tracing' | 'traced' | 'fitting';

/** Human names of the tracing steps, shown beside the progress bar. */
const STAGE_LABELS: Record<string, string> = {
  binarize: 'Separating ink from paper',
  cleanup: 'Removing specks',
  boundaries: 'Tracing boundaries',
  nesting: 'Nesting contours',
  segmentation: 'Finding letters',
  fitting: 'Fitting outlines',
  done: 'Done',
};

export class ScanSession {
  phase = $state<ScanPhase>('idle');
  fileName = $state('');
  imageUrl = $state<string | null>(null);
  progress = $state(0);
  stageLabel = $state('');
  sheet = $state<TracedSheet | null>(null);
  problem = $state<string | null>(null);
  /** The assigned letters fitted into outlines, or null until "Fit" has run. */
  fitted = $state.raw<FittedSheet | null>(null);
  /** The scan file the sheet was traced from (its bytes go into the project). */
  file = $state.raw<File | null>(null);
  /** The characters last assigned to the sheet's letters, or null before any. */
  characters = $state<string | null>(null);
  private client: TraceClient | null = null;

  /** Decodes and traces `file`; on failure keeps the previous sheet and shows why. True when it opened. */
  async open(file: File): Promise<boolean> {
    this.problem = null;
    const previousPhase = this.sheet ? 'traced' : 'idle';
    this.phase = 'decoding';
    this.stageLabel = 'Reading the scan';
    this.progress = 0;
    try {
      const scan = await decodeScanInPage(file, file.name);
      this.phase = 'tracing';
      this.client ??= new TraceClient();
      const sheet = await this.client.trace(scan.raster, {}, (fraction, stage) => {
        this.progress = fraction;
        this.stageLabel = STAGE_LABELS[stage] ?? stage;
      });
      if (this.imageUrl) URL.revokeObjectURL(this.imageUrl);
      this.imageUrl = URL.createObjectURL(file);
      this.fileName = file.name;
      this.file = file;
      this.characters = null;
      this.sheet = sheet;
      this.fitted = null;
      this.phase = 'traced';
      return true;
    } catch (error) {
      this.problem = error instanceof Error ? error.message : String(error);
      this.phase = previousPhase;
      return false;
    }
  }

  /** Assigns the typed characters to the letters in reading order. True when they were assigned. */
  async assign(characters: string): Promise<boolean> {
    if (!this.client || !this.sheet) return false;
    try {
      this.sheet = await this.client.assign(characters);
      this.characters = characters;
      return true;
    } catch (error) {
      this.problem = error instanceof Error ? error.message : String(error);
      return false;
    }
  }

  /** Stops the tracing worker and releases the scan's image; the session is not used afterwards. */
  dispose(): void {
    this.client?.dispose();
    this.client = null;
    if (this.imageUrl) URL.revokeObjectURL(this.imageUrl);
  }

  /**
   * Fits the assigned letters in the worker, with progress; on success `fitted` holds
   * the outlines. On failure the sheet stays and the problem is shown.
   */
  async fit(): Promise<boolean> {
    if (!this.client || !this.sheet) return false;
    this.problem = null;
    this.phase = 'fitting';
    this.stageLabel = STAGE_LABELS.fitting ?? 'Fitting';
    this.progress = 0;
    try {
      this.fitted = await this.client.fit((fraction, stage) => {
        this.progress = fraction;
        this.stageLabel = STAGE_LABELS[stage] ?? stage;
      });
      return true;
    } catch (error) {
      this.problem = error instanceof Error ? error.message : String(error);
      return false;
    } finally {
      this.phase = 'traced';
    }
  }
}
