// The editing session over the fitted letters: the editor state (core/document: the
// glyph document and its history), changed only by dispatching transactions, undo and
// redo. Components render it and call these methods; nothing else changes it.
import { canRedo, canUndo, createDocument, createEditorState, dispatch, glyphOf, redo, undo, type EditorState, type GlyphDocument, type GlyphId, type Transaction } from '../../../core/document/index.ts';
import type { GlyphOutline } from '../../../core/outline/index.ts';
import type { FittedSheet } from '../scan/trace-protocol.ts';
import { letterDocument, letterWarnings, type EditableLetter, type LetterWarning } from './letter-document.ts';

export class LetterEditing {
  /** The editor state; starts empty and is set from the sheet in the constructor. */
  state = $state.raw<EditorState>(createEditorState(createDocument([])));
  readonly letters: readonly EditableLetter[];
  readonly sheet: FittedSheet;

  /** Editing starts from `start`: by default the fitted letters as fitted; a reopened project passes its saved glyphs. */
  constructor(sheet: FittedSheet, start: { document: GlyphDocument; letters: EditableLetter[] } = letterDocument(sheet)) {
    const { document, letters } = start;
    this.sheet = sheet;
    this.letters = letters;
    this.state = createEditorState(document);
  }

  get document() {
    return this.state.document;
  }

  letter(id: GlyphId): EditableLetter | undefined {
    return this.letters.find((l) => l.id === id);
  }

  outline(id: GlyphId): GlyphOutline {
    return glyphOf(this.state.document, id).outline;
  }

  warnings(id: GlyphId): LetterWarning[] {
    const letter = this.letter(id);
    return letter ? letterWarnings(this.outline(id), letter) : [];
  }

  /** Applies a transaction (null: a command with nothing to do). */
  dispatch(tr: Transaction | null): void {
    this.state = dispatch(this.state, tr);
  }

  undo(): void {
    this.state = undo(this.state);
  }

  redo(): void {
    this.state = redo(this.state);
  }

  get canUndo(): boolean {
    return canUndo(this.state);
  }

  get canRedo(): boolean {
    return canRedo(this.state);
  }
}
