// The state of opening one scan in the page: decoding, tracing in the worker with
// progress, the traced sheet and the user's corrections of it (with their undo and
// redo), and any problem to show. Components render it and call its methods;
// nothing else changes it.
import { readScan } from './read-scan.ts';
import { TraceClient } from './trace-client.ts';
import type { FittedSheet, TracedSheet } from './trace-protocol.ts';
import type { SheetEdit } from '../../../core/raster/index.ts';

export type ScanPhase = 'idle' | 'decoding' | 'tracing' | 'traced' | 'correcting' | 'fitting';

/** What undo and redo name, per kind of correction ("Undo merge"). */
export const EDIT_NAMES: Record<SheetEdit['kind'], string> = {
  assign: 'assign',
  retype: 'retype',
  merge: 'merge',
  split: 'split',
  cut: 'cut',
  baseline: 'baseline',
  height: 'guide',
};

/** Human names of the tracing steps, shown beside the progress bar. */
const STAGE_LABELS: Record<string, string> = {
  binarize: 'Separating ink from paper',
  cleanup: 'Removing specks',
  boundaries: 'Tracing boundaries',
  nesting: 'Nesting contours',
  segmentation: 'Finding letters',
  fitting: 'Fitting outlines',
  correcting: 'Correcting the letters',
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
  /** What the user should know about how the scan file was read (e.g. only the first of its pages). */
  readNotes = $state.raw<readonly string[]>([]);
  /** The assigned letters fitted into outlines, or null until "Fit" has run. */
  fitted = $state.raw<FittedSheet | null>(null);
  /** The scan file the sheet was traced from (its bytes go into the project). */
  file = $state.raw<File | null>(null);
  /** The characters last assigned to the sheet's letters, or null before any. */
  characters = $state<string | null>(null);
  /** The corrections made to the traced sheet, in order: the sheet shown is the traced one with these applied. */
  edits = $state.raw<readonly SheetEdit[]>([]);
  /** Corrections undone, the next to redo last. */
  undone = $state.raw<readonly SheetEdit[]>([]);
  private client: TraceClient | null = null;
  /** The correction running or last run: the next one waits for it. */
  private turn: Promise<unknown> = Promise.resolve();

  /** Decodes and traces `file`; on failure keeps the previous sheet and shows why. True when it opened. */
  async open(file: File): Promise<boolean> {
    this.problem = null;
    const previousPhase = this.sheet ? 'traced' : 'idle';
    this.phase = 'decoding';
    this.stageLabel = 'Reading the scan';
    this.progress = 0;
    try {
      const { scan, image, notes } = await readScan(file, file.name);
      this.phase = 'tracing';
      this.client ??= new TraceClient();
      const sheet = await this.client.trace(scan.raster, {}, (fraction, stage) => {
        this.progress = fraction;
        this.stageLabel = STAGE_LABELS[stage] ?? stage;
      });
      if (this.imageUrl) URL.revokeObjectURL(this.imageUrl);
      // A TIFF is shown as the host's PNG of it: browsers cannot show TIFF either.
      this.imageUrl = URL.createObjectURL(image);
      this.readNotes = notes;
      this.fileName = file.name;
      this.file = file;
      this.characters = null;
      this.edits = [];
      this.undone = [];
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

  /** Assigns the typed characters to the letters in reading order (one correction). True when they were assigned. */
  async assign(characters: string): Promise<boolean> {
    if (!(await this.correct({ kind: 'assign', characters }))) return false;
    this.characters = characters;
    return true;
  }

  /**
   * Makes one correction of the sheet (clearing redo). Corrections run one after
   * another in the order asked for, so letters typed quickly all land. False when it
   * cannot be made: `problem` says why and the sheet stays as it was.
   */
  correct(edit: SheetEdit): Promise<boolean> {
    return this.inTurn(async () => {
      if (!(await this.show([...this.edits, edit]))) return false;
      this.undone = [];
      return true;
    });
  }

  /** Undoes the last correction. */
  undo(): Promise<void> {
    return this.inTurn(async () => {
      const last = this.edits[this.edits.length - 1];
      if (last !== undefined && (await this.show(this.edits.slice(0, -1)))) this.undone = [...this.undone, last];
    });
  }

  /** Redoes the last correction undone. */
  redo(): Promise<void> {
    return this.inTurn(async () => {
      const next = this.undone[this.undone.length - 1];
      if (next !== undefined && (await this.show([...this.edits, next]))) this.undone = this.undone.slice(0, -1);
    });
  }

  /** Puts back the corrections of a reopened project, in order. True when every one could be made. */
  restoreEdits(edits: readonly SheetEdit[]): Promise<boolean> {
    return this.inTurn(async () => {
      if (!(await this.show(edits))) return false;
      const lastAssign = [...edits].reverse().find((e) => e.kind === 'assign');
      if (lastAssign?.kind === 'assign') this.characters = lastAssign.characters;
      this.undone = [];
      return true;
    });
  }

  /** Runs `task` after every correction asked for before it has finished. */
  private inTurn<T>(task: () => Promise<T>): Promise<T> {
    const run = this.turn.then(task, task);
    this.turn = run.catch(() => undefined);
    return run;
  }

  /** Whether a correction, undo or redo can start now. */
  get canCorrect(): boolean {
    return this.client !== null && this.sheet !== null && this.phase === 'traced';
  }

  /** Shows the sheet with `edits` applied (the worker re-traces only what is new, with progress). */
  private async show(edits: readonly SheetEdit[]): Promise<boolean> {
    if (!this.client || !this.sheet || this.phase !== 'traced') return false;
    this.problem = null;
    this.phase = 'correcting';
    this.stageLabel = STAGE_LABELS.correcting ?? 'Correcting';
    this.progress = 0;
    try {
      this.sheet = await this.client.correct(edits, (fraction) => (this.progress = fraction));
      this.edits = edits;
      return true;
    } catch (error) {
      this.problem = error instanceof Error ? error.message : String(error);
      return false;
    } finally {
      this.phase = 'traced';
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
