/**
 * Public API of the editable glyph document: immutable state, transactions tagged with
 * what the user did, undo history, and the edit commands (pure functions from a
 * document to a transaction) the editor dispatches.
 */
export {
  comparePointRefs,
  createDocument,
  DEFAULT_FONT_METRICS,
  glyphOf,
  glyphSidebearings,
  inkExtent,
  isSelected,
  normalizeSelection,
  pointOf,
  resolveMetrics,
  selectedPointsByContour,
  type DocumentGlyph,
  type FontMetrics,
  type GlyphDocument,
  type GlyphId,
  type MetricName,
  type MetricOverrides,
  type PointRef,
  type Selection,
  type Sidebearings,
} from './glyph-document.ts';
export { DocumentError, type DocumentErrorCode } from './document-error.ts';
export {
  applyChange,
  contoursEqual,
  invertChange,
  isSelectionChange,
  overridesEqual,
  selectionsEqual,
  type AdvanceSet,
  type Change,
  type ContourInsert,
  type ContourRemove,
  type ContourReplace,
  type MetricsSet,
  type SelectionSet,
} from './change.ts';
export { apply, invertTransaction, isSelectionOnly, transaction, type EditReport, type Transaction, type UserEvent } from './transaction.ts';
export { EMPTY_HISTORY, MAX_UNDO_STEPS, recordTransaction, redoStep, undoStep, type History, type HistoryStep } from './history.ts';
export { canRedo, canUndo, createEditorState, dispatch, redo, undo, type EditorState } from './editor-state.ts';
export { combineSelection, pointAt, pointsInRect, selectAt, selectInRect, selectPoints, setSelection, type Rect, type SelectionMode } from './selection-commands.ts';
export { constrainToAxis, movePoints } from './point-moves.ts';
export { beginDrag, dragTo, nudgeSelection, NUDGE_UNITS, SHIFT_NUDGE_UNITS, type DragGesture, type NudgeDirection } from './drag-commands.ts';
export {
  DEFAULT_EDIT_TOLERANCE,
  deleteSelection,
  forceCorner,
  forceCornerAt,
  insertPoint,
  insertPointNear,
  makeSmooth,
  nearestLocation,
  snapToGrid,
  toggleSmooth,
  type SegmentLocation,
} from './point-commands.ts';
export { drawContour, drawStretch, refitSelection, refitStretch, selectedStretch, type Stretch } from './stretch-commands.ts';
export { drawThrough, type DrawnStretch, type DrawPoint } from './draw-through.ts';
export { replaceStretch, selectedStretchEnds, stretchBetween, type StretchEnds, type StretchSide } from './replace-stretch.ts';
export { setAdvanceWidth, setLeftSidebearing, setRightSidebearing } from './metrics-commands.ts';
export {
  isMetricOverridden,
  MAX_UNITS_PER_EM,
  METRIC_LABELS,
  METRIC_NAMES,
  metricProblems,
  metricValueProblem,
  MIN_UNITS_PER_EM,
  setFontMetric,
  useMeasuredMetric,
  type MetricProblem,
} from './font-metrics-commands.ts';
export { fixWarning, hasFix, type FixableWarningKind } from './warning-fixes.ts';
export { DEVIATION_SAMPLES_PER_SEGMENT, oneSidedDeviation, shapeDeviation } from './shape-deviation.ts';
export { FIT_SAMPLES_PER_SEGMENT, fitFewestPieces, fitPiece, sampleStretch, type PieceFit, type StretchRefit, type StretchSample } from './stretch-fit.ts';
