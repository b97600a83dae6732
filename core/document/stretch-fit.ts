/**
 * Fitting new segments to a stretch of existing outline: the stretch is sampled
 * densely (points and exact tangents of the old segments), and cubics are fitted to
 * the samples by least squares with the fitter's Schneider solver
 * (core/fit/least-squares.ts; Schneider 1990, "An Algorithm for Automatically Fitting
 * Digitized Curves", Graphics Gems). Used by delete-and-refit (one cubic between the
 * deleted point's neighbours), refit-stretch (fewest cubics within a tolerance) and
 * force-corner.
 *
 * The solver works on a closed BoundaryChain; an open stretch is given to it as the
 * chain of its interior samples and fitted over indices 0…count−1, which never cross
 * the chain's seam, so the closing edge plays no part.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { cross, distance, normalize, sub } from '../geometry/vector.ts';
import { cubic, derivative, evaluate, line } from '../geometry/segment.ts';
import { nearestPoint } from '../geometry/nearest.ts';
import { prepareChain } from '../fit/boundary-chain.ts';
import { fitCubic } from '../fit/least-squares.ts';
import type { OutlineSegment } from '../outline/index.ts';
import { endTangent, startTangent } from './contour-edit.ts';

/**
 * Samples per old segment. Breakpoints of a refit fall on samples, so this also sets
 * how finely a refit can place its new on-curve points (1/32 of a segment; common
 * practice for flattening, chosen so a glyph-sized segment gives samples a few units apart).
 */
export const FIT_SAMPLES_PER_SEGMENT = 32;

/**
 * A stretch whose samples all lie within this share of its chord from the chord is
 * straight and becomes a line (rounding-level; not a tolerance).
 */
const STRAIGHT_SHARE = 1e-9;

/** Schneider's fallback handle length, a third of the chord. */
const FALLBACK_HANDLE_SHARE = 1 / 3;

/** A point on the old outline with its unit direction of travel. */
export interface StretchSample {
  readonly point: Point;
  readonly tangent: Vec;
}

/**
 * Samples of consecutive segments, both ends included: sample k·perSegment is exactly
 * the start of segment k, and the last sample is exactly the end of the last segment.
 */
export function sampleStretch(segments: readonly OutlineSegment[], perSegment = FIT_SAMPLES_PER_SEGMENT): StretchSample[] {
  const samples: StretchSample[] = [];
  segments.forEach((segment, i) => {
    for (let k = 0; k < perSegment; k++) {
      const t = k / perSegment;
      const tangent = k === 0 ? startTangent(segment) : normalize(derivative(segment, t));
      samples.push({ point: k === 0 ? segment.p0 : evaluate(segment, t), tangent });
    }
    if (i === segments.length - 1) {
      samples.push({ point: segment.kind === 'line' ? segment.p1 : segment.p3, tangent: endTangent(segment) });
    }
  });
  return samples;
}

/** A fitted piece and the largest distance from its samples to it. */
export interface PieceFit {
  readonly segment: OutlineSegment;
  readonly maxError: number;
}

function isZero(v: Vec | null): boolean {
  return v !== null && v.x === 0 && v.y === 0;
}

/**
 * One segment from sample `i` to sample `j` fitted to the samples between them. The
 * tangents fix the handle directions at the ends (null leaves a handle free). A
 * stretch that is straight to rounding, with any fixed tangents along it, becomes a line.
 * Guarantee: the segment starts exactly at sample i and ends exactly at sample j.
 */
export function fitPiece(samples: readonly StretchSample[], i: number, j: number, startDirection: Vec | null, endDirection: Vec | null, tolerance: number): PieceFit {
  const start = (samples[i] as StretchSample).point;
  const end = (samples[j] as StretchSample).point;
  const interior: Point[] = [];
  for (let k = i + 1; k < j; k++) {
    const p = (samples[k] as StretchSample).point;
    const previous = interior[interior.length - 1];
    if (!previous || previous.x !== p.x || previous.y !== p.y) interior.push(p);
  }
  const chord = distance(start, end);
  const t0 = isZero(startDirection) ? null : startDirection;
  const t1 = isZero(endDirection) ? null : endDirection;
  const chordDirection = chord === 0 ? null : normalize(sub(end, start));
  const alongChord = (d: Vec | null) => d === null || (chordDirection !== null && Math.abs(cross(chordDirection, d)) <= STRAIGHT_SHARE && d.x * chordDirection.x + d.y * chordDirection.y > 0);
  const straight = chordDirection !== null && interior.every((p) => Math.abs(cross(chordDirection, sub(p, start))) <= STRAIGHT_SHARE * chord);
  if (straight && alongChord(t0) && alongChord(t1)) {
    const segment = line(start, end);
    return { segment, maxError: maxDistance(segment, interior) };
  }
  // Four consecutive-distinct points leave at least three after the chain drops a closing repeat.
  if (interior.length >= 4 && chord > 0) {
    const { chain } = prepareChain(interior);
    const fit = fitCubic({ chain, first: 0, last: chain.count - 1, start, end, startTangent: t0, endTangent: t1 }, tolerance);
    return { segment: fit.segment, maxError: fit.maxError };
  }
  // Too few samples for the solver (a piece one or two samples long): Schneider's fallback.
  const d0 = t0 ?? chordDirection ?? { x: 0, y: 0 };
  const d1 = t1 ?? chordDirection ?? { x: 0, y: 0 };
  const h = chord * FALLBACK_HANDLE_SHARE;
  const segment = cubic(start, { x: start.x + d0.x * h, y: start.y + d0.y * h }, { x: end.x - d1.x * h, y: end.y - d1.y * h }, end);
  return { segment, maxError: maxDistance(segment, interior) };
}

function maxDistance(segment: OutlineSegment, points: readonly Point[]): number {
  let worst = 0;
  for (const p of points) worst = Math.max(worst, nearestPoint(segment, p).distance);
  return worst;
}

/** The result of fitting the fewest segments. */
export interface StretchRefit {
  readonly segments: readonly OutlineSegment[];
  /** Sample indices of the new on-curve points inside the stretch (smooth joins). */
  readonly breaks: readonly number[];
  /** Largest sample-to-fit distance over the pieces. */
  readonly maxError: number;
}

/**
 * The fewest segments from sample `i` to sample `j` whose samples lie within
 * `tolerance`, joined smoothly at samples (each join takes the old curve's tangent
 * there, so the joins are G1 and lie exactly on the old curve). Greedy: each piece
 * reaches as far as a fit within tolerance allows, found by binary search; when
 * feasibility is monotone (a stretch that fits has sub-stretches that fit, true up to
 * the solver's local optimum) greedy reach gives the fewest pieces over breakpoints
 * restricted to samples.
 * Limit: a piece one sample long is accepted whatever its error (the tolerance is then
 * below what the sampling can resolve).
 */
export function fitFewestPieces(samples: readonly StretchSample[], i: number, j: number, startDirection: Vec | null, endDirection: Vec | null, tolerance: number): StretchRefit {
  const segments: OutlineSegment[] = [];
  const breaks: number[] = [];
  let maxError = 0;
  let current = i;
  const directionAt = (k: number): Vec | null => (k === i ? startDirection : k === j ? endDirection : (samples[k] as StretchSample).tangent);
  while (current < j) {
    const attempt = (end: number): PieceFit => fitPiece(samples, current, end, directionAt(current), directionAt(end), tolerance);
    let best = attempt(j);
    let reach = j;
    if (best.maxError > tolerance) {
      let lo = current + 1;
      let loFit = attempt(lo);
      let hi = j;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        const fit = attempt(mid);
        if (fit.maxError <= tolerance) {
          lo = mid;
          loFit = fit;
        } else {
          hi = mid;
        }
      }
      best = loFit;
      reach = lo;
    }
    segments.push(best.segment);
    maxError = Math.max(maxError, best.maxError);
    if (reach < j) breaks.push(reach);
    current = reach;
  }
  return { segments, breaks, maxError };
}
