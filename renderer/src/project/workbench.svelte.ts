// Everything the user has made in the window, in one place: the scan session (the
// traced sheet and its assigned characters), the editing of the fitted letters, and
// what an opened project holds that the window does not edit. It builds the project
// file's contents from that state, and restores that state from an opened project.
import { ScanSession } from '../scan/scan-session.svelte.ts';
import { LetterEditing } from '../editor/letter-editing.svelte.ts';
import type { ProjectData, ProjectGlyph } from '../../../electron/io/project/project-schema.ts';
import type { DemoProject, FontContent } from '../../../electron/api-contract.ts';
import { embeddedCopyOf, fileFromCopy } from './scan-copy.ts';
import { projectContent } from './project-content.ts';
import { restoredLetters } from './restored-letters.ts';
import { keptOutlines } from './kept-outlines.ts';
import { fontMetricsOf, letterDocument } from '../editor/letter-document.ts';
import { newProject } from '../../../electron/io/project/new-project.ts';
import { DEFAULT_PIPELINE_SETTINGS } from '../../../core/pipeline/index.ts';
import { projectSettings } from './saved-settings.ts';

/** The last part of a project's relative scan path ("scans/capitals.png" → "capitals.png"). */
function baseName(path: string): string {
  return path.split('/').pop() || path;
}

export class Workbench {
  scan = $state.raw(new ScanSession());
  editing = $state.raw<LetterEditing | null>(null);
  /** Glyphs of the opened project not drawn from its scan (imported from a font): kept as they are. */
  carried = $state.raw<readonly ProjectGlyph[]>([]);
  /** The project last opened, whose settings the window keeps (for the demo, a new project under its family name); null for a new project. */
  base = $state.raw<ProjectData | null>(null);
  /** While a project is being opened: the session tracing its scan, shown for progress. */
  restoring = $state.raw<ScanSession | null>(null);
  /** The scan file restored from `base`, to tell it from a scan opened since. */
  private baseScanFile: File | null = null;
  /** Counts the times the window's project was replaced, so a demo still loading knows it was overtaken. */
  private generation = 0;

  /** How many letters the user edited kept their outlines at the last fit (they were not refitted), or null before a fit again. */
  keptEdited = $state<number | null>(null);

  /**
   * Fits the assigned letters in the worker, with the session's fit settings, and
   * starts editing them. Letters the user edited whose ink and place on the scan
   * did not change keep their edited outlines; every other letter takes its fresh
   * fit (kept-outlines.ts). False when fitting failed or was cancelled (the session
   * says why); the letters being edited then stay as they were.
   */
  async fitLetters(): Promise<boolean> {
    const session = this.scan;
    const previous = this.editing;
    if (!(await session.fit()) || !session.fitted || session !== this.scan) return false;
    const fitted = session.fitted;
    const fresh = letterDocument(fitted);
    if (!previous) {
      this.editing = new LetterEditing(fitted, fresh);
      this.keptEdited = null;
      return true;
    }
    const asFitted = letterDocument(previous.sheet).document;
    const result = keptOutlines({ document: previous.state.document, letters: previous.letters }, { ...asFitted, metrics: fontMetricsOf(previous.sheet) }, fresh);
    this.editing = new LetterEditing(fitted, result);
    this.keptEdited = result.kept;
    return true;
  }

  /**
   * What the project consists of now, by identity: any change the user makes
   * replaces one of these (edits make a new glyph table), so comparing the stamp
   * with the one taken at the last save tells whether there are unsaved changes.
   */
  get stamp(): readonly unknown[] {
    const document = this.editing?.state.document;
    return [this.scan, this.scan.file, this.scan.characters, this.scan.edits, this.scan.settings, this.editing, document?.glyphs, document?.metrics, this.carried, this.base];
  }

  /** The project file's contents for the current state. */
  async project(): Promise<ProjectData> {
    const file = this.scan.file;
    const editing = this.editing;
    return projectContent({
      scan: file ? { fileName: file.name, copy: await embeddedCopyOf(file), characters: this.scan.characters, edits: this.scan.edits, settings: this.scan.settings.scan } : null,
      fit: this.scan.settings.fit,
      scanFromBase: file !== null && file === this.baseScanFile,
      editing: editing ? { document: editing.state.document, letters: editing.letters } : null,
      carried: this.carried,
      base: this.base,
    });
  }

  /**
   * The font the project in the window makes, for the proof and the export: the
   * project's font settings and glyphs exactly as `project()` gives them, without
   * reading or embedding the scan, so it is cheap enough to take after every edit.
   * Null before any letter is fitted or carried.
   */
  fontContent(): FontContent | null {
    const file = this.scan.file;
    const editing = this.editing;
    if (editing === null && this.carried.length === 0) return null;
    const project = projectContent({
      scan: null,
      fit: this.scan.settings.fit,
      scanFromBase: file !== null && file === this.baseScanFile,
      editing: editing ? { document: editing.state.document, letters: editing.letters } : null,
      carried: this.carried,
      base: this.base,
    });
    return { font: project.font, glyphs: project.glyphs };
  }

  /**
   * Replaces the window's state with `project`: its scan traced again, its characters
   * assigned, its letters fitted for their place on the scan and given the saved
   * outlines. Throws an Error for the user when it cannot; the window's state is then
   * left exactly as it was.
   */
  async restore(project: ProjectData, projectName: string): Promise<void> {
    this.generation++;
    if (project.scans.length > 1) {
      throw new Error(`${projectName} holds ${project.scans.length} scans; this version of Stemline edits one scan per project. The file has not been changed.`);
    }
    const scan = project.scans[0];
    const sourced = project.glyphs.filter((g) => g.source !== undefined);
    const carried = project.glyphs.filter((g) => g.source === undefined);
    if (sourced.some((g) => g.source?.scan !== scan?.id)) {
      throw new Error(`${projectName}: a glyph belongs to a scan the project does not list. The file has not been changed; fix it by hand or open its recovery copy.`);
    }
    const next = new ScanSession();
    let editing: LetterEditing | null = null;
    let file: File | null = null;
    this.restoring = next;
    try {
      // The project's settings, also when it has no scan (one made from a font), so a save keeps them.
      try {
        next.settings = projectSettings(project, scan);
      } catch (error) {
        throw new Error(`${projectName}: ${error instanceof Error ? error.message : String(error)} Fix the setting in the file by hand; the file has not been changed.`);
      }
      if (scan) {
        if (!scan.embedded) throw new Error(`${projectName}: the host sent the project without its scan. Please report this.`);
        file = fileFromCopy(scan.embedded, baseName(scan.path));
        if (!(await next.open(file, next.settings))) throw new Error(`${projectName}: its scan could not be opened: ${next.problem ?? 'unknown problem'}`);
        if (scan.sheetEdits !== undefined) {
          if (!(await next.restoreEdits(scan.sheetEdits))) throw new Error(`${projectName}: the corrections of its scan's letters could not be made again: ${next.problem ?? 'unknown problem'} The file has not been changed.`);
          if (scan.characters !== undefined) next.characters = scan.characters;
        } else if (scan.characters !== undefined && !(await next.assign(scan.characters))) {
          throw new Error(`${projectName}: the characters of its scan could not be assigned: ${next.problem ?? 'unknown problem'}`);
        }
        if (sourced.length > 0) {
          if (!(await next.fit()) || !next.fitted) throw new Error(`${projectName}: its letters could not be placed on the scan: ${next.problem ?? 'unknown problem'}`);
          const restored = restoredLetters(next.fitted, sourced, project.font, projectName);
          editing = new LetterEditing(restored.sheet, restored);
        }
      }
    } catch (error) {
      next.dispose();
      throw error;
    } finally {
      this.restoring = null;
    }
    const previous = this.scan;
    this.scan = next;
    this.editing = editing;
    this.carried = carried;
    this.base = project;
    this.baseScanFile = file;
    this.keptEdited = null;
    previous.dispose();
  }

  /**
   * Opens the demo project the way a user starts one: its scan opened, its characters
   * assigned and its letters fitted, with the progress shown as for a project being
   * opened, and its font named with the demo's family name (so the proof, a save and
   * an export carry it, not "Untitled"). True when the window now shows it; false when it was overtaken (a new
   * project started, a project or a scan opened meanwhile), leaving the window as
   * the user made it. Throws an Error for the user when the demo cannot be opened.
   */
  async openDemo(demo: DemoProject): Promise<boolean> {
    const sheet = demo.sheets[0];
    if (sheet === undefined) throw new Error('The demo project came without its sheet. Start a new project from your own scans instead.');
    const mine = ++this.generation;
    const untouched = this.scan;
    const next = new ScanSession();
    this.restoring = next;
    const overtaken = () => mine !== this.generation || this.scan !== untouched || untouched.file !== null;
    try {
      const file = new File([Uint8Array.from(atob(sheet.base64), (c) => c.charCodeAt(0))], sheet.name, { type: 'image/png' });
      if (!(await next.open(file, DEFAULT_PIPELINE_SETTINGS))) throw new Error(`The demo's scan could not be opened: ${next.problem ?? 'unknown problem'}`);
      if (overtaken()) return this.dropDemo(next);
      if (!(await next.assign(sheet.characters))) throw new Error(`The demo's characters could not be assigned: ${next.problem ?? 'unknown problem'}`);
      if (overtaken()) return this.dropDemo(next);
      if (!(await next.fit()) || !next.fitted) throw new Error(`The demo's letters could not be fitted: ${next.problem ?? 'unknown problem'}`);
      if (overtaken()) return this.dropDemo(next);
    } catch (error) {
      next.dispose();
      throw error;
    } finally {
      if (this.restoring === next) this.restoring = null;
    }
    const previous = this.scan;
    this.scan = next;
    this.editing = new LetterEditing(next.fitted);
    this.carried = [];
    this.base = newProject(demo.familyName);
    this.baseScanFile = null;
    this.keptEdited = null;
    previous.dispose();
    return true;
  }

  private dropDemo(session: ScanSession): false {
    session.dispose();
    return false;
  }

  /** Empties the window for a new project (a demo still loading is dropped). */
  startNew(): void {
    this.generation++;
    this.restoring = null;
    const previous = this.scan;
    this.scan = new ScanSession();
    this.editing = null;
    this.carried = [];
    this.base = null;
    this.baseScanFile = null;
    this.keptEdited = null;
    previous.dispose();
  }
}
