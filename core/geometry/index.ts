/**
 * Public API of Stemline's curve-geometry core.
 *
 * Everything the tracer, fitter, editor and font writer need from curve geometry is
 * re-exported here, so callers import from one place and the file layout can change
 * freely. All functions are pure and take plain data (`{x, y}` points and segment
 * records); see each module for guarantees and published sources.
 */
export * from './vector.ts';
export * from './segment.ts';
export * from './polynomial.ts';
export * from './polynomial-roots.ts';
export * from './power-basis.ts';
export * from './split.ts';
export * from './elevate.ts';
export * from './extrema.ts';
export * from './bounds.ts';
export * from './area.ts';
export * from './gauss-legendre.ts';
export * from './arclength.ts';
export * from './nearest.ts';
export * from './curvature.ts';
export * from './point-sequence.ts';
export * from './catmull-rom.ts';
export * from './bspline.ts';
export * from './tridiagonal.ts';
export * from './natural-spline.ts';
