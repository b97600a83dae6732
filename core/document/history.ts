/**
 * Undo and redo: stacks of steps, each step one or more transactions' outline and
 * metrics changes plus the selection before and after it.
 *
 * Rules (after CodeMirror 6's @codemirror/commands history):
 * - a transaction that changes the outline or metrics becomes a new step and clears
 *   the redo stack;
 * - it merges into the previous step instead when both carry the same user-event tag
 *   and the same gesture id, so a drag of any number of pointer moves is one step;
 * - a selection-only transaction makes no step and leaves both stacks alone; undoing
 *   a step restores the selection from before it, redoing restores the one after.
 */
import type { Change } from './change.ts';
import { applyChange, composeChanges, invertChange, isSelectionChange } from './change.ts';
import type { GlyphDocument, Selection } from './glyph-document.ts';
import type { Transaction, UserEvent } from './transaction.ts';

/**
 * Steps kept on the undo stack; older ones are dropped. A bound so a long session's
 * memory stays bounded, generous beyond any real undo run (common practice; CodeMirror
 * keeps at least 100 by default, from memory).
 */
export const MAX_UNDO_STEPS = 1000;

export interface HistoryStep {
  readonly userEvent: UserEvent;
  readonly gesture?: string;
  /** Outline and metrics changes only; selection is kept separately. */
  readonly changes: readonly Change[];
  readonly selectionBefore: Selection;
  readonly selectionAfter: Selection;
}

export interface History {
  /** Oldest first; the last step is the one undo reverts. */
  readonly done: readonly HistoryStep[];
  /** Most recently undone last; the last step is the one redo replays. */
  readonly undone: readonly HistoryStep[];
}

export const EMPTY_HISTORY: History = { done: [], undone: [] };

/**
 * The history after `tr` took the document from `before` to `after`.
 */
export function recordTransaction(history: History, tr: Transaction, before: GlyphDocument, after: GlyphDocument): History {
  const changes = tr.changes.filter((c) => !isSelectionChange(c));
  if (changes.length === 0) return history;
  const last = history.done[history.done.length - 1];
  if (last !== undefined && tr.gesture !== undefined && last.gesture === tr.gesture && last.userEvent === tr.userEvent) {
    const merged: HistoryStep = { ...last, changes: composeChanges(last.changes, changes), selectionAfter: after.selection };
    return { done: [...history.done.slice(0, -1), merged], undone: [] };
  }
  const step: HistoryStep = {
    userEvent: tr.userEvent,
    ...(tr.gesture !== undefined ? { gesture: tr.gesture } : {}),
    changes,
    selectionBefore: before.selection,
    selectionAfter: after.selection,
  };
  const done = [...history.done, step];
  return { done: done.length > MAX_UNDO_STEPS ? done.slice(done.length - MAX_UNDO_STEPS) : done, undone: [] };
}

/**
 * Reverts the last step: its changes' inverses in reverse order, then the selection
 * from before it. Null when there is nothing to undo. The step moves to the redo stack
 * remembering the selection at the moment of undoing, so redo brings that back.
 */
export function undoStep(document: GlyphDocument, history: History): { document: GlyphDocument; history: History } | null {
  const step = history.done[history.done.length - 1];
  if (step === undefined) return null;
  const reverted = step.changes.map(invertChange).reverse().reduce(applyChange, document);
  return {
    document: { ...reverted, selection: step.selectionBefore },
    history: { done: history.done.slice(0, -1), undone: [...history.undone, { ...step, selectionAfter: document.selection }] },
  };
}

/**
 * Replays the last undone step and restores the selection from after it. Null when
 * there is nothing to redo. The step returns to the undo stack remembering the
 * selection at the moment of redoing, so undo brings that back.
 */
export function redoStep(document: GlyphDocument, history: History): { document: GlyphDocument; history: History } | null {
  const step = history.undone[history.undone.length - 1];
  if (step === undefined) return null;
  const replayed = step.changes.reduce(applyChange, document);
  return {
    document: { ...replayed, selection: step.selectionAfter },
    history: { done: [...history.done, { ...step, selectionBefore: document.selection }], undone: history.undone.slice(0, -1) },
  };
}
