/**
 * A transaction: one user action as a list of changes and a tag saying what the user
 * did, applied to a document by the pure `apply`. The tag (our own names, in the
 * manner of CodeMirror's "input.type" / "select.pointer") lets history merge a drag
 * into one undo step and lets tests and the UI ask what kind of edit happened.
 */
import type { Change } from './change.ts';
import { applyChange, invertChange, isSelectionChange } from './change.ts';
import type { GlyphDocument } from './glyph-document.ts';

/** What the user did. */
export type UserEvent =
  | 'point.drag'
  | 'point.nudge'
  | 'point.insert'
  | 'point.delete'
  | 'point.smooth-toggle'
  | 'point.force-corner'
  | 'point.snap'
  | 'stretch.refit'
  | 'stretch.draw'
  | 'stretch.replace'
  | 'metrics.sidebearing'
  | 'metrics.advance'
  | 'metrics.font'
  | 'warning.fix'
  | 'selection.set';

/**
 * What a fitting command measured: the largest distance between the outline before
 * and after the edit (both ways, sampled; see shape-deviation.ts) and the tolerance it
 * was asked to keep. Not part of the state; the UI shows it.
 */
export interface EditReport {
  readonly maxDeviation: number;
  readonly tolerance: number;
}

export interface Transaction {
  readonly userEvent: UserEvent;
  readonly changes: readonly Change[];
  /**
   * Identifies one continuous gesture (a drag from pointer-down to pointer-up).
   * Consecutive transactions with the same tag and gesture form one undo step.
   */
  readonly gesture?: string;
  readonly report?: EditReport;
}

/** A transaction with the given tag and changes. */
export function transaction(userEvent: UserEvent, changes: readonly Change[], extra: { gesture?: string; report?: EditReport } = {}): Transaction {
  return { userEvent, changes, ...extra };
}

/**
 * The document after the transaction: its changes applied in order. Pure; throws
 * DocumentError('stale-change') when the transaction was built from another state.
 */
export function apply(document: GlyphDocument, tr: Transaction): GlyphDocument {
  return tr.changes.reduce(applyChange, document);
}

/** The transaction that undoes `tr`: the inverses of its changes in reverse order. */
export function invertTransaction(tr: Transaction): Transaction {
  return { ...tr, changes: tr.changes.map(invertChange).reverse() };
}

/** True when the transaction changes only the selection (no outline or metrics). */
export function isSelectionOnly(tr: Transaction): boolean {
  return tr.changes.every(isSelectionChange);
}
