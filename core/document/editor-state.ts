/**
 * The editor's whole state: the glyph document and its undo history, changed only by
 * dispatching transactions (or undo and redo). The renderer renders `document` and
 * dispatches what the edit commands return.
 */
import type { GlyphDocument } from './glyph-document.ts';
import type { History } from './history.ts';
import { EMPTY_HISTORY, recordTransaction, redoStep, undoStep } from './history.ts';
import type { Transaction } from './transaction.ts';
import { apply } from './transaction.ts';

export interface EditorState {
  readonly document: GlyphDocument;
  readonly history: History;
}

/** A fresh editor on `document` with empty history. */
export function createEditorState(document: GlyphDocument): EditorState {
  return { document, history: EMPTY_HISTORY };
}

/** The state after `tr`: the document with it applied and the history recording it. Null transactions (a command with nothing to do) leave the state as it is. */
export function dispatch(state: EditorState, tr: Transaction | null): EditorState {
  if (tr === null) return state;
  const document = apply(state.document, tr);
  return { document, history: recordTransaction(state.history, tr, state.document, document) };
}

/** The state with the last step undone, or the same state when there is none. */
export function undo(state: EditorState): EditorState {
  return undoStep(state.document, state.history) ?? state;
}

/** The state with the last undone step redone, or the same state when there is none. */
export function redo(state: EditorState): EditorState {
  return redoStep(state.document, state.history) ?? state;
}

export function canUndo(state: EditorState): boolean {
  return state.history.done.length > 0;
}

export function canRedo(state: EditorState): boolean {
  return state.history.undone.length > 0;
}
