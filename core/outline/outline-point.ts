/**
 * The points a type designer edits: on-curve points (where segments meet) and
 * off-curve points (the Bézier handles between them), each on-curve point marked
 * smooth (its two handles are collinear, the join is tangent-continuous) or not (a
 * corner). This is the model the editor, the checks and the font writer share.
 */

/** On-curve (a segment end) or off-curve (a cubic control point, a "handle"). */
export type PointKind = 'on' | 'off';

export interface OutlinePoint {
  readonly x: number;
  readonly y: number;
  readonly kind: PointKind;
  /**
   * For an on-curve point: the join is smooth (the incoming and outgoing tangents are
   * collinear and point the same way). Always false for off-curve points.
   */
  readonly smooth: boolean;
}

export function onCurve(x: number, y: number, smooth = false): OutlinePoint {
  return { x, y, kind: 'on', smooth };
}

export function offCurve(x: number, y: number): OutlinePoint {
  return { x, y, kind: 'off', smooth: false };
}
