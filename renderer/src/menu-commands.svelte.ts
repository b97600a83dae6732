// The desktop shell's menu commands in the page: each command of the closed set
// (api-contract.ts MENU_COMMANDS) runs the page's own action — save, save as, undo,
// the proof, the export — exactly as the page's buttons and keys do (Undo and Redo on
// the history of the screen showing: the sheet's corrections, or the letters' edits); and the page
// tells its host its project's state whenever that changes, so the shell can title
// the window, enable its menus and ask before closing unsaved work. A command that
// edits (undo, redo, select all, delete) acts on a focused text field instead when
// one is focused, as a menu's Edit commands do everywhere. Browser mode has no menu:
// nothing arrives there, and the state reports are simply taken.
//
// The View commands change the window's view settings (editor/view-settings.svelte.ts),
// the same state the one-letter editor's sliders and zoom buttons are bound to; they do
// nothing while no letter is open.
import { host, HostError } from './host-api.ts';
import type { MenuCommand, MenuMessage, ProjectHandle, ProjectState } from '../../electron/api-contract.ts';
import type { GlyphDocument, GlyphId, PointRef } from '../../core/document/index.ts';
import { deleteSelection, glyphOf, selectPoints } from '../../core/document/index.ts';
import type { LetterEditing } from './editor/letter-editing.svelte.ts';
import type { ViewSettings } from './editor/view-settings.svelte.ts';

/** What Edit ▸ Undo and Redo act on: the history of the screen showing. */
export interface UndoTarget {
  undo(): unknown;
  redo(): unknown;
  readonly canUndo: boolean;
  readonly canRedo: boolean;
}

/** What the page does for each command; App.svelte supplies these from its own actions. */
export interface MenuActions {
  save(): Promise<void>;
  saveAs(): Promise<void>;
  /** Whether the window still has unsaved changes (after a save: whether it failed or was cancelled). */
  isDirty(): boolean;
  openRecent(handle: ProjectHandle): Promise<void>;
  /** Opens a scan's file as if chosen in the page. */
  openScan(file: File): Promise<void>;
  exportFont(): Promise<void>;
  /** The fitted letters' editing (Select all and Delete act on it), or null before any are fitted. */
  editing(): LetterEditing | null;
  /**
   * The history Undo and Redo act on: on the sheet, its corrections; with the letters
   * showing, their edits; null when neither is showing.
   */
  history(): UndoTarget | null;
  /** The letter open in the one-letter editor (Select all and Delete act on its points), or null. */
  openLetter(): GlyphId | null;
  toggleProof(): void;
  /** How the open letter is shown: what Zoom, Curvature combs and Scan backdrop change. */
  readonly view: ViewSettings;
}

/** The Edit commands a focused text field answers itself, and the editing command each stands for. */
const TEXT_FIELD_COMMANDS: Partial<Record<MenuCommand, string>> = {
  undo: 'undo',
  redo: 'redo',
  'select-all': 'selectAll',
  'delete-selection': 'delete',
};

/** Input types whose value is text a user edits (a range or a checkbox is not). */
const TEXT_INPUT_TYPES = new Set(['text', 'search', 'number', 'email', 'url', 'tel', 'password']);

function focusedTextField(): boolean {
  const element = document.activeElement;
  if (element instanceof HTMLTextAreaElement) return true;
  if (element instanceof HTMLInputElement) return TEXT_INPUT_TYPES.has(element.type);
  return element instanceof HTMLElement && element.isContentEditable;
}

/** Every point of glyph `id`, for Select all. */
export function allPointsOf(document: GlyphDocument, id: GlyphId): PointRef[] {
  return glyphOf(document, id).outline.contours.flatMap((contour, c) => contour.points.map((_, p) => ({ glyph: id, contour: c, point: p })));
}

/** What a failed command says in the window. */
function messageOf(error: unknown): string {
  return error instanceof HostError || error instanceof Error ? error.message : String(error);
}

export class MenuCommands {
  /** A problem a command ran into, for the window to show; null when there is none. */
  problem = $state<string | null>(null);
  private lastReport = '';

  constructor(private readonly actions: MenuActions) {}

  /** Starts taking the shell's commands; returns the function that stops. */
  listen(): () => void {
    return host.onMenuCommand((message) => void this.run(message));
  }

  /** Runs one message from the shell. */
  async run(message: MenuMessage): Promise<void> {
    this.problem = null;
    try {
      if (message.command === 'open-recent') {
        await this.actions.openRecent(message.handle);
        return;
      }
      const textCommand = TEXT_FIELD_COMMANDS[message.command];
      if (textCommand !== undefined && focusedTextField()) {
        document.execCommand(textCommand);
        return;
      }
      await this.command(message.command);
    } catch (error) {
      this.problem = messageOf(error);
    }
  }

  private async command(command: MenuCommand): Promise<void> {
    const a = this.actions;
    switch (command) {
      case 'save-project':
        return a.save();
      case 'save-project-as':
        return a.saveAs();
      case 'save-and-close':
        await a.save();
        if (!a.isDirty()) await host.closeWindow({});
        return;
      case 'import-scans': {
        const scan = await host.importScan({});
        if (scan !== null) await a.openScan(new File([scan.bytes as Uint8Array<ArrayBuffer>], scan.name));
        return;
      }
      case 'export-font':
        return a.exportFont();
      case 'undo':
        await a.history()?.undo();
        return;
      case 'redo':
        await a.history()?.redo();
        return;
      case 'select-all': {
        const editing = a.editing();
        const id = a.openLetter();
        if (editing && id !== null) editing.dispatch(selectPoints(editing.state.document, allPointsOf(editing.state.document, id), 'replace'));
        return;
      }
      case 'delete-selection': {
        const editing = a.editing();
        // As the canvas's Delete key: the selected points go and their neighbours are refitted (core point-commands.ts).
        const change = editing && a.openLetter() !== null ? deleteSelection(editing.state.document) : null;
        if (editing && change) editing.dispatch(change);
        return;
      }
      case 'zoom-in':
        return a.view.zoomIn();
      case 'zoom-out':
        return a.view.zoomOut();
      case 'toggle-combs':
        if (a.openLetter() !== null) a.view.toggleCombs();
        return;
      case 'toggle-scan-backdrop':
        if (a.openLetter() !== null) a.view.toggleScan();
        return;
      case 'toggle-proof':
        return a.toggleProof();
    }
  }

  /** Tells the host the project's state when it differs from what was told last. */
  report(state: ProjectState): void {
    const key = JSON.stringify(state);
    if (key === this.lastReport) return;
    this.lastReport = key;
    host.reportProjectState(state).catch(() => {
      // The title and menus are a convenience: a failed report is retried with the next change.
      this.lastReport = '';
    });
  }
}
