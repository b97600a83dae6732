/**
 * Total-least-squares lines through stretches of the chain, and the tangent estimates
 * built on them.
 *
 * Two-point differences of a traced boundary are dominated by its pixel-scale noise
 * (steps of about a pixel carry position errors of a tenth of a pixel and more, so
 * their directions scatter by several degrees). Fitting a line to every point of a
 * stretch several pixels long averages that noise away. The orthogonal-regression line
 * (Pearson 1901, "On lines and planes of closest fit to systems of points in space",
 * Philosophical Magazine 2(11)) passes through the centroid along the principal axis
 * of the covariance matrix; its smaller eigenvalue is the mean squared distance of the
 * points from it. On a curve of radius R a symmetric stretch gives the tangent at its
 * middle without bias, and a one-sided stretch of length L gives the tangent turned by
 * about L/(2R) towards the stretch — the corner detector relies on both facts.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { arcAt, chainPoint, emptyMoments, indexAtArc, rangeMoments, wrapIndex, type BoundaryChain, type RangeMoments } from './boundary-chain.ts';

/** A fitted line of a stretch: through `centre` (chain-relative) along `angle`. */
export interface StretchLine {
  /** Direction angle in radians, oriented along the chain (from first towards last point). */
  angle: number;
  /** Centroid, chain-relative coordinates. */
  centreX: number;
  centreY: number;
  /** Mean squared perpendicular distance of the points from the line. */
  meanSquaredResidual: number;
  count: number;
}

/** Fresh scratch record for {@link fitStretchLine}. */
export function emptyStretchLine(): StretchLine {
  return { angle: 0, centreX: 0, centreY: 0, meanSquaredResidual: 0, count: 0 };
}

const scratchMoments: RangeMoments = emptyMoments();

/**
 * The orthogonal-regression line of the points in the unwrapped index range
 * [first, last], written into `out`. The direction is oriented so that it points from
 * the first point towards the last (along the chain). O(1) thanks to the prefix sums.
 * Limit: a range of one point has no direction; its angle is then the chain step's.
 */
export function fitStretchLine(chain: BoundaryChain, first: number, last: number, out: StretchLine): StretchLine {
  if (last <= first) last = first + 1;
  const m = rangeMoments(chain, first, last, scratchMoments);
  const halfDifference = (m.cxx - m.cyy) / 2;
  let angle = 0.5 * Math.atan2(2 * m.cxy, m.cxx - m.cyy);
  const a = wrapIndex(chain, first);
  const b = wrapIndex(chain, last);
  const chordX = chain.xs[b]! - chain.xs[a]!;
  const chordY = chain.ys[b]! - chain.ys[a]!;
  if (Math.cos(angle) * chordX + Math.sin(angle) * chordY < 0) angle += Math.PI;
  if (angle > Math.PI) angle -= 2 * Math.PI;
  out.angle = angle;
  out.centreX = m.meanX;
  out.centreY = m.meanY;
  out.meanSquaredResidual = Math.max(0, (m.cxx + m.cyy) / 2 - Math.sqrt(halfDifference * halfDifference + m.cxy * m.cxy));
  out.count = m.count;
  return out;
}

/** The angle b − a wrapped into (−π, π]: the signed turn from direction a to b. */
export function turnBetween(a: number, b: number): number {
  let d = b - a;
  while (d > Math.PI) d -= 2 * Math.PI;
  while (d <= -Math.PI) d += 2 * Math.PI;
  return d;
}

/** The unwrapped index range whose arc positions lie within [from, to] (arc lengths, unwrapped). */
export function rangeByArc(chain: BoundaryChain, from: number, to: number): [number, number] {
  let first = indexAtArc(chain, from);
  if (arcAt(chain, first) < from) first += 1;
  const last = Math.max(first, indexAtArc(chain, to));
  return [first, last];
}

const scratchLine: StretchLine = emptyStretchLine();

/**
 * Tangent estimate at chain index `index`: the direction of the orthogonal-regression
 * line of the points within ±`halfWindow` arc length, and the projection of the point
 * onto that line (its position with the normal component of the noise removed).
 * Guarantees a unit tangent oriented along the chain.
 */
export function localTangent(chain: BoundaryChain, index: number, halfWindow: number): { tangent: Vec; point: Point } {
  const s = arcAt(chain, index);
  const [first, last] = rangeByArc(chain, s - halfWindow, s + halfWindow);
  const line = fitStretchLine(chain, Math.min(first, index - 1), Math.max(last, index + 1), scratchLine);
  const tx = Math.cos(line.angle);
  const ty = Math.sin(line.angle);
  const p = chainPoint(chain, index);
  const px = p.x - chain.origin.x - line.centreX;
  const py = p.y - chain.origin.y - line.centreY;
  const along = px * tx + py * ty;
  return {
    tangent: { x: tx, y: ty },
    point: { x: line.centreX + along * tx + chain.origin.x, y: line.centreY + along * ty + chain.origin.y },
  };
}

/** Half-window (px) of the stretches whose scatter measures the noise. */
const NOISE_HALF_WINDOW_PX = 2.5;
/** Every this many points one stretch is sampled for the noise estimate. */
const NOISE_SAMPLE_STEP = 3;

/**
 * The scan noise of the chain: standard deviation of the points across the boundary,
 * in font units. Estimated as the median, over stretches 5 px long, of the scatter
 * about each stretch's regression line (corrected for the two fitted degrees of
 * freedom). The median ignores the few stretches that straddle corners; over 5 px the
 * bow of any drawn curve contributes far less than scan noise.
 */
export function estimateNoise(chain: BoundaryChain, pixel: number): number {
  const residuals: number[] = [];
  const line = emptyStretchLine();
  const half = NOISE_HALF_WINDOW_PX * pixel;
  for (let i = 0; i < chain.count; i += NOISE_SAMPLE_STEP) {
    const s = chain.arc[i]!;
    const [first, last] = rangeByArc(chain, s - half, s + half);
    if (last - first < 3) continue;
    fitStretchLine(chain, first, last, line);
    const m = line.count;
    residuals.push((line.meanSquaredResidual * m) / (m - 2));
  }
  if (residuals.length === 0) return 0;
  residuals.sort((a, b) => a - b);
  return Math.sqrt(residuals[residuals.length >> 1]!);
}
