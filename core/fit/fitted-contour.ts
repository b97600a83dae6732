/**
 * The contour while it is being fitted: on-curve nodes and the segments between them,
 * each segment remembering which stretch of the traced chain it stands for.
 *
 * The finishing stages (extremum insertion, merging, handle checks, grid rounding, the
 * quality report) all need to know which boundary points a segment must stay within
 * tolerance of, and which joins must stay smooth; this model carries both. It becomes
 * an OutlineContour only at the end.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import type { CubicSegment, LineSegment } from '../geometry/segment.ts';
import type { DetectedCorner } from './corners.ts';
import type { ExtremumAxis } from './extrema.ts';

export interface FitNode {
  readonly point: Point;
  /** The join here is tangent-continuous. */
  readonly smooth: boolean;
  /**
   * Unit tangents (direction of travel) the arriving and leaving segments must have,
   * or null where free. A smooth node has one tangent object in both fields, used by
   * both adjacent segments, so their handles are collinear by construction; a corner
   * has free tangents unless an extremum next to it fixed one to an axis.
   */
  readonly tangentIn: Vec | null;
  readonly tangentOut: Vec | null;
  /** Set when the node is an x or y extremum with an axis-aligned tangent. */
  readonly extremum: ExtremumAxis | null;
  /** The detection record for corners (rounding zone, reach), else null. */
  readonly corner: DetectedCorner | null;
  /** Unwrapped chain index of the node (nodes increase round the chain). */
  readonly index: number;
  /** A node that merging must keep: a corner, a line end, an extremum or a user-forced point. */
  readonly pinned: boolean;
}

export interface FitSpan {
  readonly segment: LineSegment | CubicSegment;
  /** Unwrapped range of chain points the segment must stay within tolerance of (may be empty). */
  readonly first: number;
  readonly last: number;
  /** Largest distance from those points to the segment (exact above the tolerance). */
  readonly maxError: number;
  /** For a line: the detected line it lies on (corners are moved along it, never off it). */
  readonly carrier: { readonly through: Point; readonly direction: Vec } | null;
}

/** spans[i] runs from nodes[i] to nodes[(i + 1) % n]; their end points are the node points exactly. */
export interface FittedContour {
  readonly nodes: readonly FitNode[];
  readonly spans: readonly FitSpan[];
}
