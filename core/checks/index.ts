/** Public API of the outline checks: what a designer would flag in an outline. */
export { checkOutline, contourDepths, TINY_SEGMENT_UNITS, type OutlineWarning, type OutlineWarningKind } from './outline-checks.ts';
