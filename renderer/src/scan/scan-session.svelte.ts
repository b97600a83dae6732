// The state of opening one scan in the page: decoding, tracing in the worker with
// progress, the traced sheet and the user's corrections of it, the scan and fit
// settings (with undo and redo of both), fitting the assigned letters a few at a time
// so it can be cancelled, and any problem to show. Components render it and call its
// methods; nothing else changes it.
import { readScan } from './read-scan.ts';
import { TraceClient } from './trace-client.ts';
import type { FittedSheet, TracedSheet } from './trace-protocol.ts';
import type { SheetEdit } from '../../../core/raster/index.ts';
import { DEFAULT_PIPELINE_SETTINGS, sameFitSettings, sameScanSettings, type FitSettings, type PipelineSettings, type ScanSettings } from '../../../core/pipeline/index.ts';

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

/** One change of the settings, with the corrections before and after it (a scan setting carries them over to the letters found again). */
export interface SettingsStep {
  readonly from: { readonly settings: PipelineSettings; readonly edits: readonly SheetEdit[] };
  readonly to: { readonly settings: PipelineSettings; readonly edits: readonly SheetEdit[] };
  /** The user's last corrections before the change, which the next scan settings are carried over from (see ScanSession.anchor). */
  readonly anchor: Anchor;
}

/** Corrections the user made, with the scan settings of the sheet they were made on. */
interface Anchor {
  readonly settings: ScanSettings;
  readonly edits: readonly SheetEdit[];
}

/** What an undo or redo changed: a correction, the scan settings (the letters were found again), or the fit settings (the letters need fitting again). */
export type HistoryStep = 'correction' | 'scan-settings' | 'fit-settings';

/**
 * Letters fitted per request to the worker: the page can stop between requests, so a
 * fit is cancelled within one letter's time (about 2 s per letter in smooth mode on
 * the demo sheet, measured).
 */
export const LETTERS_PER_FIT_REQUEST = 1;

function sameEdits(a: readonly SheetEdit[], b: readonly SheetEdit[]): boolean {
  return a === b || JSON.stringify(a) === JSON.stringify(b);
}

function sameSettings(a: PipelineSettings, b: PipelineSettings): boolean {
  return sameScanSettings(a.scan, b.scan) && sameFitSettings(a.fit, b.fit);
}

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
  /** The scan and fit settings the sheet was traced with and its letters are fitted with. */
  settings = $state.raw<PipelineSettings>(DEFAULT_PIPELINE_SETTINGS);
  /** Settings changes made, the last last; undo takes one back when nothing was corrected since. */
  settingsDone = $state.raw<readonly SettingsStep[]>([]);
  /** Settings changes undone, the next to redo last. */
  settingsUndone = $state.raw<readonly SettingsStep[]>([]);
  /** What the last scan-settings change did to the corrections, for the user; null when there is nothing to say. */
  notice = $state<string | null>(null);
  private client: TraceClient | null = null;
  /** Set to stop the fit running after the letter it is on. */
  private cancelling = false;
  /** Whether the last fit was stopped by the user (not failed). */
  stopped = $state(false);
  /**
   * The corrections as the user last made them, and the scan settings of the sheet
   * they made them on. Scan settings tried since are carried over from these, not
   * from the last setting tried, so trying a level that loses letters and then
   * another that finds them again gives every letter back its character.
   */
  private anchor: Anchor = { settings: DEFAULT_PIPELINE_SETTINGS.scan, edits: [] };
  /** The correction running or last run: the next one waits for it. */
  private turn: Promise<unknown> = Promise.resolve();

  /** Decodes and traces `file`; on failure keeps the previous sheet and shows why. True when it opened. */
  async open(file: File, settings: PipelineSettings = this.settings): Promise<boolean> {
    this.problem = null;
    const previousPhase = this.sheet ? 'traced' : 'idle';
    this.phase = 'decoding';
    this.stageLabel = 'Reading the scan';
    this.progress = 0;
    try {
      const { scan, image, notes } = await readScan(file, file.name);
      this.phase = 'tracing';
      this.client ??= new TraceClient();
      const sheet = await this.client.trace(scan.raster, settings.scan, (fraction, stage) => {
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
      this.settings = settings;
      this.anchor = { settings: settings.scan, edits: [] };
      this.settingsDone = [];
      this.settingsUndone = [];
      this.notice = null;
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
      this.settingsUndone = [];
      this.notice = null;
      this.anchorHere();
      return true;
    });
  }

  /** The settings change undo would take back now: the last one, when every correction made since has been undone. */
  private get settingsToUndo(): SettingsStep | null {
    const step = this.settingsDone[this.settingsDone.length - 1];
    return step && sameEdits(step.to.edits, this.edits) && sameSettings(step.to.settings, this.settings) ? step : null;
  }

  /** The settings change redo would make again now: the last undone, when nothing has changed since. */
  private get settingsToRedo(): SettingsStep | null {
    const step = this.settingsUndone[this.settingsUndone.length - 1];
    return step && this.undone.length === 0 && sameEdits(step.from.edits, this.edits) && sameSettings(step.from.settings, this.settings) ? step : null;
  }

  /** What undo would take back: names the Undo button. */
  get undoName(): string | null {
    if (this.settingsToUndo) return 'settings';
    const last = this.edits[this.edits.length - 1];
    return last ? EDIT_NAMES[last.kind] : null;
  }

  /** What redo would make again: names the Redo button. */
  get redoName(): string | null {
    const next = this.undone[this.undone.length - 1];
    if (next) return EDIT_NAMES[next.kind];
    return this.settingsToRedo ? 'settings' : null;
  }

  /** Undoes the last correction or settings change; says which it was (null: nothing undone). */
  undo(): Promise<HistoryStep | null> {
    return this.inTurn(async () => {
      const step = this.settingsToUndo;
      if (step) {
        const undone = await this.moveSettings(step.to, step.from);
        if (undone === null) return null;
        this.anchor = step.anchor;
        this.settingsDone = this.settingsDone.slice(0, -1);
        this.settingsUndone = [...this.settingsUndone, step];
        return undone;
      }
      const last = this.edits[this.edits.length - 1];
      if (last === undefined || !(await this.show(this.edits.slice(0, -1)))) return null;
      this.undone = [...this.undone, last];
      this.anchorHere();
      return 'correction';
    });
  }

  /** Redoes the last correction or settings change undone; says which it was (null: nothing redone). */
  redo(): Promise<HistoryStep | null> {
    return this.inTurn(async () => {
      const next = this.undone[this.undone.length - 1];
      if (next !== undefined) {
        if (!(await this.show([...this.edits, next]))) return null;
        this.undone = this.undone.slice(0, -1);
        this.anchorHere();
        return 'correction';
      }
      const step = this.settingsToRedo;
      if (!step) return null;
      const redone = await this.moveSettings(step.from, step.to);
      if (redone === null) return null;
      this.anchor = step.anchor;
      this.settingsUndone = this.settingsUndone.slice(0, -1);
      this.settingsDone = [...this.settingsDone, step];
      return redone;
    });
  }

  /** Goes from one settings state to another exactly (tracing again if the scan settings differ); null when it could not. */
  private async moveSettings(from: SettingsStep['from'], to: SettingsStep['to']): Promise<HistoryStep | null> {
    this.notice = null;
    if (sameScanSettings(from.settings.scan, to.settings.scan)) {
      this.settings = to.settings;
      return 'fit-settings';
    }
    if (!(await this.retrace(to.settings, to.edits, null))) return null;
    return 'scan-settings';
  }

  /**
   * Traces the scan again with other scan settings, carrying the corrections over to
   * the letters found now (core/raster rebase-sheet-edits.ts); one undo step. False
   * when the settings find nothing (no ink, say): `problem` says why and the sheet
   * stays as it was.
   */
  changeScanSettings(scan: ScanSettings): Promise<boolean> {
    return this.inTurn(async () => {
      if (sameScanSettings(scan, this.settings.scan)) return true;
      const from = { settings: this.settings, edits: this.edits };
      const anchor = this.anchor;
      const settings = { ...this.settings, scan };
      const result = await this.retrace(settings, this.edits, anchor);
      if (result === null) return false;
      this.notice = result.kept === 'all' ? null : carriedNotice(result.lostCharacters, result.droppedCorrections);
      this.record({ from, to: { settings, edits: this.edits }, anchor });
      return true;
    });
  }

  /** Sets the fit settings the letters are fitted with (one undo step); fitting again is the caller's. */
  changeFitSettings(fit: FitSettings): Promise<boolean> {
    return this.inTurn(async () => {
      if (sameFitSettings(fit, this.settings.fit)) return false;
      const from = { settings: this.settings, edits: this.edits };
      this.settings = { ...this.settings, fit };
      this.record({ from, to: { settings: this.settings, edits: this.edits }, anchor: this.anchor });
      return true;
    });
  }

  /** The corrections as they are now become the ones later scan settings are carried over from. */
  private anchorHere(): void {
    this.anchor = { settings: this.settings.scan, edits: this.edits };
  }

  private record(step: SettingsStep): void {
    this.settingsDone = [...this.settingsDone, step];
    this.settingsUndone = [];
    this.undone = [];
  }

  /** Traces again in the worker with progress; on success the sheet, edits and settings are the new ones. */
  private async retrace(settings: PipelineSettings, edits: readonly SheetEdit[], from: Anchor | null) {
    if (!this.client || !this.sheet || this.phase !== 'traced') return null;
    this.problem = null;
    this.phase = 'tracing';
    this.progress = 0;
    this.stageLabel = STAGE_LABELS.binarize ?? '';
    try {
      const result = await this.client.retrace(settings.scan, edits, from, (fraction, stage) => {
        this.progress = fraction;
        this.stageLabel = STAGE_LABELS[stage] ?? stage;
      });
      this.sheet = result.sheet;
      this.edits = result.edits;
      this.settings = settings;
      const lastAssign = [...result.edits].reverse().find((e) => e.kind === 'assign');
      if (lastAssign?.kind === 'assign') this.characters = lastAssign.characters;
      return result;
    } catch (error) {
      this.problem = error instanceof Error ? error.message : String(error);
      return null;
    } finally {
      this.phase = 'traced';
    }
  }

  /** The ink `scan` settings give on this scan, to lay over the sheet while choosing them; null when there is no sheet. */
  async previewInk(scan: ScanSettings) {
    if (!this.client || !this.sheet) return null;
    return this.client.preview(scan);
  }

  /** Puts back the corrections of a reopened project, in order. True when every one could be made. */
  restoreEdits(edits: readonly SheetEdit[]): Promise<boolean> {
    return this.inTurn(async () => {
      if (!(await this.show(edits))) return false;
      const lastAssign = [...edits].reverse().find((e) => e.kind === 'assign');
      if (lastAssign?.kind === 'assign') this.characters = lastAssign.characters;
      this.undone = [];
      this.anchorHere();
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
    const client = this.client;
    const settings = this.settings.fit;
    const assigned = this.sheet.sheet.letters.filter((l) => l.character !== null).map((l) => l.index);
    this.problem = null;
    this.phase = 'fitting';
    this.stageLabel = STAGE_LABELS.fitting ?? 'Fitting';
    this.progress = 0;
    this.cancelling = false;
    this.stopped = false;
    try {
      if (assigned.length === 0) {
        this.fitted = await client.fit(settings);
        return true;
      }
      const parts: FittedSheet[] = [];
      for (let done = 0; done < assigned.length; done += LETTERS_PER_FIT_REQUEST) {
        if (this.cancelling) {
          this.problem = `Fitting stopped after ${done} of ${assigned.length} letters; the fitted letters are as they were.`;
          this.stopped = true;
          return false;
        }
        const letters = assigned.slice(done, done + LETTERS_PER_FIT_REQUEST);
        parts.push(await client.fit(settings, letters, (fraction) => {
          this.progress = (done + fraction * letters.length) / assigned.length;
        }));
        this.progress = (done + letters.length) / assigned.length;
      }
      const first = parts[0]!;
      this.fitted = { ...first, letters: parts.flatMap((p) => p.letters), notes: [...new Set(parts.flatMap((p) => p.notes))] };
      return true;
    } catch (error) {
      this.problem = error instanceof Error ? error.message : String(error);
      return false;
    } finally {
      this.cancelling = false;
      this.phase = 'traced';
    }
  }

  /** Stops the fit running after the letter it is on; the letters already fitted stay as they were before it started. */
  cancelFit(): void {
    if (this.phase === 'fitting') this.cancelling = true;
  }
}

/** What carrying the corrections over to letters found again did, for the user. */
function carriedNotice(lostCharacters: number, droppedCorrections: number): string {
  const parts = ['These settings find other letters: each letter kept the character of the letter in its place, and the guides you set were kept.'];
  if (lostCharacters > 0) parts.push(`${lostCharacters} ${lostCharacters === 1 ? 'character has' : 'characters have'} no letter in the same place now: type ${lostCharacters === 1 ? 'it' : 'them'} again.`);
  if (droppedCorrections > 0) parts.push(`${droppedCorrections} ${droppedCorrections === 1 ? 'merge, split or cut' : 'merges, splits and cuts'} could not be carried over: make ${droppedCorrections === 1 ? 'it' : 'them'} again, or undo to go back.`);
  return parts.join(' ');
}
