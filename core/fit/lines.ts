/**
 * Straight runs of the boundary: stems, bars, serif faces and straight diagonals
 * become lines, exactly straight, and exactly horizontal or vertical when they are
 * within the axis-snap angle of it.
 *
 * A stretch is a line when (1) every point lies within the tolerance of its
 * orthogonal-regression line, (2) the points do not bow: a parabola fitted to the
 * residuals along the line has a sagitta below a quarter of the tolerance over the
 * stretch, and its curvature is not statistically significant against the scatter
 * of the points (so a flat curve is not mistaken for a line just because its bow is
 * small over a short stretch), nor do they bend into an S (a cubic term of the same
 * size: a stretch through an inflection is straight to second order), (3) the residuals at each end do not drift away from
 * the line (the line stops where a tangent curve leaving it starts to bend), and
 * (4) it is long enough, or it is the whole stretch between two corners.
 *
 * Lines are grown from the straightest points outwards, each end by binary search
 * for the farthest point at which the stretch is still a line. Stretches never cross
 * a corner's rounded tip.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { arcAt, chainPoint, wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import type { DetectedCorner } from './corners.ts';
import { emptyStretchLine, fitStretchLine, rangeByArc, type StretchLine } from './local-line.ts';

/** Half-length of the window that scores how straight the chain is at a point: 4 px. */
const SEED_HALF_WINDOW_PX = 4;
/**
 * Shortest line found inside a run (not a whole run between corners): 40 px. Shorter
 * straight pieces cannot be told from flat curves at scan noise: a circular arc of
 * length L bows by L²/8R, and measured on a noisy circle of radius 200 px (σ = 0.15 px)
 * 24-px arcs passed both the bow limit and the three-sigma test, while at 40 px the
 * bow is 1 px, far outside both. A bowl's flat side therefore stays a curve.
 */
export const MIN_LINE_PX = 40;
/** Shortest line with tangent curves at both ends (px). */
export const MIN_FREE_LINE_PX = 80;
/**
 * A line with curves joining it tangentially at both ends must be twice as long. Near
 * an inflection a curve is straight to within scan noise over a long stretch (the
 * deviation grows with the cube of the length), and a very flat curve (a serif's
 * slightly cupped foot: 2 units of sag over 260 in Linux Libertine's H) is straight to
 * within the noise floor over 40–50 px; both would otherwise be cut into a line and
 * two extra on-curve points. Over 80 px such curves bow measurably.
 */
/** A line end within this many pixels of its run's end counts as touching the run's corner. */
const TOUCHES_CORNER_PX = 3;
/** The bow (sagitta of the residual parabola) may be at most this share of the tolerance. */
const BOW_SHARE_OF_TOLERANCE = 0.2;
/** A bow below this many pixels is accepted regardless of its significance: the rendering's own ripple. */
const BOW_NOISE_FLOOR_PX = 0.1;
/**
 * Curvature counts as significant beyond this many standard errors: 3, the usual
 * "three sigma" rule (common practice).
 */
const CURVATURE_SIGNIFICANCE = 3;
/** Length at each end whose mean residual is the drift: 2 px. */
const END_DRIFT_PX = 2;
/** The drift may be at most this share of the tolerance. */
const DRIFT_SHARE_OF_TOLERANCE = 0.3;

export interface DetectedLine {
  /** Unwrapped index range of the chain points on the line (first < last, 0 ≤ first < count). */
  readonly first: number;
  readonly last: number;
  /** A point of the line (the centroid of its points), font units. */
  readonly through: Point;
  /** Unit direction along the chain. */
  readonly direction: Vec;
  /** Set when the line was made exactly horizontal or vertical. */
  readonly axis: 'horizontal' | 'vertical' | null;
  /** Largest distance from its points to the line. */
  readonly maxResidual: number;
}

export interface LineSettings {
  readonly tolerance: number;
  readonly pixel: number;
  /** Axis snap angle in radians. */
  readonly axisSnap: number;
}

/** Outcome of the line test on one stretch. */
interface LineTest {
  readonly ok: boolean;
  readonly line?: DetectedLine;
}

const scratch: StretchLine = emptyStretchLine();

/**
 * Tests whether the points of [first, last] form a line (criteria 1–3 of the header),
 * and returns the line, axis-snapped where allowed.
 */
export function testLine(chain: BoundaryChain, first: number, last: number, settings: LineSettings): LineTest {
  // Straightness is judged on the regression line; snapping is then allowed when the
  // snapped line still holds every point within the tolerance.
  const test = testLineOnce(chain, first, last, settings, -1);
  if (!test.ok || !test.line) return test;
  const { direction } = test.line;
  const offAxis = Math.abs(Math.atan(direction.y / direction.x));
  const axis = offAxis <= settings.axisSnap ? 'horizontal' : Math.PI / 2 - offAxis <= settings.axisSnap ? 'vertical' : null;
  if (axis === null) return test;
  const snappedDirection = axis === 'horizontal' ? { x: Math.sign(direction.x), y: 0 } : { x: 0, y: Math.sign(direction.y) };
  const cx = test.line.through.x - chain.origin.x;
  const cy = test.line.through.y - chain.origin.y;
  let worst = 0;
  const xs = chain.xs;
  const ys = chain.ys;
  let i = wrapIndex(chain, first);
  for (let k = first; k <= last; k++) {
    worst = Math.max(worst, Math.abs(-(xs[i]! - cx) * snappedDirection.y + (ys[i]! - cy) * snappedDirection.x));
    if (++i === chain.count) i = 0;
  }
  if (worst > settings.tolerance) return test;
  return { ok: true, line: { ...test.line, direction: snappedDirection, axis, maxResidual: worst } };
}

/** The line test with the given axis snap (radians; negative: none) in place of the settings' own. */
function testLineOnce(chain: BoundaryChain, first: number, last: number, settings: LineSettings, axisSnap: number): LineTest {
  const m = last - first + 1;
  if (m < 3) return { ok: false };
  const fit = fitStretchLine(chain, first, last, scratch);
  let dx = Math.cos(fit.angle);
  let dy = Math.sin(fit.angle);
  const cx = fit.centreX;
  const cy = fit.centreY;
  let axis: 'horizontal' | 'vertical' | null = null;
  const angleToHorizontal = Math.abs(Math.atan(dy / dx));
  if (angleToHorizontal <= axisSnap) {
    axis = 'horizontal';
    dx = Math.sign(dx);
    dy = 0;
  } else if (Math.PI / 2 - angleToHorizontal <= axisSnap) {
    axis = 'vertical';
    dx = 0;
    dy = Math.sign(dy);
  }
  const length = arcAt(chain, last) - arcAt(chain, first);
  const endLength = Math.min(END_DRIFT_PX * settings.pixel, length / 4);
  const arcFirst = arcAt(chain, first);
  const arcLast = arcAt(chain, last);
  // Residuals v along u; power sums for the parabola v ≈ c0 + c1·w + c2·w², w = u scaled to [−1, 1].
  // The points are visited by a running index and lap, which give the same index and
  // arc length as wrapIndex and arcAt without a division per point.
  const xs = chain.xs;
  const ys = chain.ys;
  const n = chain.count;
  const firstLap = Math.floor(first / n);
  const firstIndex = first - firstLap * n;
  let uMin = Infinity;
  let uMax = -Infinity;
  for (let k = first, i = firstIndex; k <= last; k++) {
    const u = (xs[i]! - cx) * dx + (ys[i]! - cy) * dy;
    if (u < uMin) uMin = u;
    if (u > uMax) uMax = u;
    if (++i === n) i = 0;
  }
  const uMid = (uMin + uMax) / 2;
  const uHalf = Math.max((uMax - uMin) / 2, 1e-9);
  let maxResidual = 0;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, s5 = 0, s6 = 0, t0 = 0, t1 = 0, t2 = 0, t3 = 0, vv = 0;
  let headSum = 0, headCount = 0, tailSum = 0, tailCount = 0;
  const arc = chain.arc;
  const perimeter = chain.perimeter;
  let lap = firstLap;
  let i = firstIndex;
  for (let k = first; k <= last; k++) {
    const px = xs[i]! - cx;
    const py = ys[i]! - cy;
    const w = (px * dx + py * dy - uMid) / uHalf;
    const v = -px * dy + py * dx;
    const av = Math.abs(v);
    if (av > maxResidual) maxResidual = av;
    const w2 = w * w;
    s0 += 1; s1 += w; s2 += w2; s3 += w2 * w; s4 += w2 * w2; s5 += w2 * w2 * w; s6 += w2 * w2 * w2;
    t0 += v; t1 += w * v; t2 += w2 * v; t3 += w2 * w * v; vv += v * v;
    const s = lap * perimeter + arc[i]!;
    if (s - arcFirst <= endLength) { headSum += v; headCount++; }
    if (arcLast - s <= endLength) { tailSum += v; tailCount++; }
    if (++i === n) {
      i = 0;
      lap++;
    }
  }
  if (maxResidual > settings.tolerance) return { ok: false };
  // Least-squares parabola by Cramer's rule, and the standard error of c2.
  const det = s0 * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s3 * s2) + s2 * (s1 * s3 - s2 * s2);
  if (Math.abs(det) > 1e-12 * s0 * s0 * s0) {
    const c0 = (t0 * (s2 * s4 - s3 * s3) - s1 * (t1 * s4 - s3 * t2) + s2 * (t1 * s3 - s2 * t2)) / det;
    const c1 = (s0 * (t1 * s4 - s3 * t2) - t0 * (s1 * s4 - s3 * s2) + s2 * (s1 * t2 - t1 * s2)) / det;
    const c2 = (s0 * (s2 * t2 - t1 * s3) - s1 * (s1 * t2 - t1 * s2) + t0 * (s1 * s3 - s2 * s2)) / det;
    const bow = Math.abs(c2); // sagitta over the half-length, since w spans [−1, 1]
    if (bow > BOW_NOISE_FLOOR_PX * settings.pixel) {
      if (bow > BOW_SHARE_OF_TOLERANCE * settings.tolerance) return { ok: false };
      const residualSquares = Math.max(0, vv - (c0 * t0 + c1 * t1 + c2 * t2));
      const variance = m > 3 ? residualSquares / (m - 3) : 0;
      const inverse22 = (s0 * s2 - s1 * s1) / det;
      const standardError = Math.sqrt(Math.max(0, variance * inverse22));
      if (bow > CURVATURE_SIGNIFICANCE * standardError) return { ok: false };
    }
  }
  // S-shaped residuals (a stretch through an inflection): the cubic term of the residual.
  const sBend = cubicTerm(s0, s1, s2, s3, s4, s5, s6, t0, t1, t2, t3);
  if (sBend !== undefined && S_BEND_PEAK * Math.abs(sBend) > BOW_SHARE_OF_TOLERANCE * settings.tolerance) return { ok: false };
  const driftLimit = DRIFT_SHARE_OF_TOLERANCE * settings.tolerance;
  if (headCount > 0 && Math.abs(headSum / headCount) > driftLimit) return { ok: false };
  if (tailCount > 0 && Math.abs(tailSum / tailCount) > driftLimit) return { ok: false };
  // A snapped line keeps passing through the centroid, only its direction changes.
  const through = { x: cx + chain.origin.x, y: cy + chain.origin.y };
  return { ok: true, line: { first, last, through, direction: { x: dx, y: dy }, axis, maxResidual } };
}

/**
 * Peak of |w³ − (3/5)·w| on [−1, 1] (at w = 1): how far a unit cubic term bends the
 * residuals from the best line through them, 0.4. The cubic term is tested like the bow.
 */
const S_BEND_PEAK = 0.4;

/** Scratch space of cubicTerm: the 4 × 4 normal matrix (row-major) and its right-hand side. */
const cubicMatrix = new Float64Array(16);
const cubicRhs = new Float64Array(4);

/**
 * The w³ coefficient of the least-squares cubic in w (4 × 4 normal equations of the
 * power sums s₀…s₆ of w and t₀…t₃ of wᵏ·v), or undefined if singular.
 */
function cubicTerm(s0: number, s1: number, s2: number, s3: number, s4: number, s5: number, s6: number, t0: number, t1: number, t2: number, t3: number): number | undefined {
  const a = cubicMatrix;
  const b = cubicRhs;
  a[0] = s0; a[1] = s1; a[2] = s2; a[3] = s3;
  a[4] = s1; a[5] = s2; a[6] = s3; a[7] = s4;
  a[8] = s2; a[9] = s3; a[10] = s4; a[11] = s5;
  a[12] = s3; a[13] = s4; a[14] = s5; a[15] = s6;
  b[0] = t0; b[1] = t1; b[2] = t2; b[3] = t3;
  for (let col = 0; col < 4; col++) {
    let pivot = col;
    for (let row = col + 1; row < 4; row++) if (Math.abs(a[row * 4 + col]!) > Math.abs(a[pivot * 4 + col]!)) pivot = row;
    if (Math.abs(a[pivot * 4 + col]!) < 1e-12 * Math.abs(a[0]!)) return undefined;
    for (let k = 0; k < 4; k++) {
      const swap = a[col * 4 + k]!;
      a[col * 4 + k] = a[pivot * 4 + k]!;
      a[pivot * 4 + k] = swap;
    }
    const swap = b[col]!;
    b[col] = b[pivot]!;
    b[pivot] = swap;
    for (let row = col + 1; row < 4; row++) {
      const f = a[row * 4 + col]! / a[col * 4 + col]!;
      for (let k = col; k < 4; k++) a[row * 4 + k]! -= f * a[col * 4 + k]!;
      b[row]! -= f * b[col]!;
    }
  }
  return b[3]! / a[15]!;
}

/** The farthest `last` in [from, limit] for which [first, last] is a line (binary search; assumes [first, from] is). */
function growForward(chain: BoundaryChain, first: number, from: number, limit: number, settings: LineSettings): number {
  let good = from;
  let step = 1;
  // Exponential search, then bisection.
  let bad = -1;
  while (good + step <= limit) {
    if (testLine(chain, first, good + step, settings).ok) {
      good += step;
      step *= 2;
    } else {
      bad = good + step;
      break;
    }
  }
  if (bad === -1) bad = limit + 1;
  while (bad - good > 1) {
    const mid = (good + bad) >> 1;
    if (testLine(chain, first, mid, settings).ok) good = mid;
    else bad = mid;
  }
  return good;
}

function growBackward(chain: BoundaryChain, last: number, from: number, limit: number, settings: LineSettings): number {
  let good = from;
  let step = 1;
  let bad = -1;
  while (good - step >= limit) {
    if (testLine(chain, good - step, last, settings).ok) {
      good -= step;
      step *= 2;
    } else {
      bad = good - step;
      break;
    }
  }
  if (bad === -1) bad = limit - 1;
  while (good - bad > 1) {
    const mid = (good + bad) >> 1;
    if (testLine(chain, mid, last, settings).ok) good = mid;
    else bad = mid;
  }
  return good;
}

/** A stretch of the chain between corners (unwrapped, first ≤ last), or the whole chain. */
export interface ChainRun {
  readonly first: number;
  readonly last: number;
  /** True when both ends are corners (so the whole run may be a short line). */
  readonly betweenCorners: boolean;
}

/**
 * The runs between consecutive corners (outside their rounded tips); with no corners,
 * one run round the whole chain starting at `seamHint`.
 */
export function runsBetweenCorners(chain: BoundaryChain, corners: readonly DetectedCorner[], seamHint: number): ChainRun[] {
  if (corners.length === 0) return [{ first: seamHint, last: seamHint + chain.count - 1, betweenCorners: false }];
  const runs: ChainRun[] = [];
  for (let k = 0; k < corners.length; k++) {
    const a = corners[k] as DetectedCorner;
    const b = corners[(k + 1) % corners.length] as DetectedCorner;
    const sa = chain.arc[a.index]!;
    let sb = chain.arc[b.index]!;
    if (sb <= sa) sb += chain.perimeter;
    const [first, last] = rangeByArc(chain, sa + a.roundingZone, sb - b.roundingZone);
    runs.push({ first, last: Math.min(last, a.index + chain.count - 1), betweenCorners: true });
  }
  return runs;
}

/**
 * The lines of every run, in chain order.
 *
 * Guarantees: each line passes the line test of the header; lines do not overlap;
 * a snapped line's direction is exactly (±1, 0) or (0, ±1).
 */
export function detectLines(chain: BoundaryChain, runs: readonly ChainRun[], settings: LineSettings): DetectedLine[] {
  const lines: DetectedLine[] = [];
  const minLength = MIN_LINE_PX * settings.pixel;
  const halfWindow = SEED_HALF_WINDOW_PX * settings.pixel;
  const line = emptyStretchLine();
  for (const run of runs) {
    if (run.last - run.first < 2) continue;
    const runLength = arcAt(chain, run.last) - arcAt(chain, run.first);
    if (run.betweenCorners) {
      const whole = testLine(chain, run.first, run.last, settings);
      if (whole.ok && whole.line) {
        lines.push(whole.line);
        continue;
      }
    }
    if (runLength < minLength) continue;
    // Straightness score of each point: mean squared residual of its window.
    const seeds: { index: number; score: number; first: number; last: number }[] = [];
    for (let k = run.first; k <= run.last; k++) {
      const s = arcAt(chain, k);
      if (s - halfWindow < arcAt(chain, run.first) || s + halfWindow > arcAt(chain, run.last)) continue;
      const [first, last] = rangeByArc(chain, s - halfWindow, s + halfWindow);
      fitStretchLine(chain, first, last, line);
      seeds.push({ index: k, score: line.meanSquaredResidual, first, last });
    }
    seeds.sort((a, b) => a.score - b.score);
    const taken: [number, number][] = [];
    // Stretches grown from a seed but too short: seeds inside them would grow the same way.
    const tried: [number, number][] = [];
    // The same spans as masks over the run's points, so that each of the thousands of
    // seeds is checked in O(1); a point outside the run is checked against the lists.
    const runSize = run.last - run.first + 1;
    const takenMask = new Uint8Array(runSize);
    const triedMask = new Uint8Array(runSize);
    const mark = (mask: Uint8Array, a: number, b: number): void => {
      mask.fill(1, Math.max(0, a - run.first), Math.max(0, Math.min(runSize, b - run.first + 1)));
    };
    const inside = (spans: readonly [number, number][], mask: Uint8Array, k: number): boolean =>
      k >= run.first && k <= run.last ? mask[k - run.first] === 1 : spans.some(([a, b]) => k >= a && k <= b);
    for (const seed of seeds) {
      if (inside(taken, takenMask, seed.first) || inside(taken, takenMask, seed.last) || inside(tried, triedMask, seed.index)) continue;
      if (!testLine(chain, seed.first, seed.last, settings).ok) continue;
      // Grow within the run and outside lines already found.
      let limitForward = run.last;
      let limitBackward = run.first;
      for (const [a, b] of taken) {
        if (a > seed.last) limitForward = Math.min(limitForward, a - 1);
        if (b < seed.first) limitBackward = Math.max(limitBackward, b + 1);
      }
      let last = growForward(chain, seed.first, seed.last, limitForward, settings);
      const first = growBackward(chain, last, seed.first, limitBackward, settings);
      last = growForward(chain, first, last, limitForward, settings);
      const length = arcAt(chain, last) - arcAt(chain, first);
      if (length < minLength) {
        tried.push([first, last]);
        mark(triedMask, first, last);
        continue;
      }
      const found = testLine(chain, first, last, settings);
      if (!found.ok || !found.line) continue;
      const touchesCorner =
        run.betweenCorners &&
        (arcAt(chain, first) - arcAt(chain, run.first) <= TOUCHES_CORNER_PX * settings.pixel || arcAt(chain, run.last) - arcAt(chain, last) <= TOUCHES_CORNER_PX * settings.pixel);
      if (!touchesCorner && length < MIN_FREE_LINE_PX * settings.pixel) {
        tried.push([first, last]);
        mark(triedMask, first, last);
        continue;
      }
      taken.push([first, last]);
      mark(takenMask, first, last);
      lines.push(found.line);
    }
  }
  return mergeTouchingLines(chain, normaliseOrder(chain, lines), settings);
}

/** Lines separated by at most this many pixels of chain are merged when their union is a line. */
const MERGE_GAP_PX = 3;

/**
 * Merges consecutive lines (the last and the first too, across the chain's seam) that
 * nearly touch and together still pass the line test: a run's seam, or a noise spike
 * that stopped a line's growth, must not cut one stem in two.
 */
function mergeTouchingLines(chain: BoundaryChain, lines: DetectedLine[], settings: LineSettings): DetectedLine[] {
  const merged = lines.slice();
  let changed = true;
  while (changed && merged.length > 1) {
    changed = false;
    for (let i = 0; i < merged.length; i++) {
      const a = merged[i]!;
      const j = (i + 1) % merged.length;
      const b = merged[j]!;
      const bFirst = j === 0 ? b.first + chain.count : b.first;
      const bLast = j === 0 ? b.last + chain.count : b.last;
      if (bFirst <= a.last || arcAt(chain, bFirst) - arcAt(chain, a.last) > MERGE_GAP_PX * settings.pixel) continue;
      if (bLast - a.first >= chain.count) continue;
      // Grow a over b; the far end may have to stop a little short of b's (the
      // union's regression line sits differently where a tangent curve leaves).
      const reach = growForward(chain, a.first, a.last, bLast, settings);
      if (reach < (bFirst + bLast) / 2) continue;
      const union = testLine(chain, a.first, reach, settings);
      if (!union.ok || !union.line) continue;
      merged.splice(i, 1, union.line);
      merged.splice(j > i ? j : 0, 1);
      changed = true;
      break;
    }
  }
  return normaliseOrder(chain, merged);
}

/** Lines with first wrapped into [0, count) and sorted by it. */
function normaliseOrder(chain: BoundaryChain, lines: DetectedLine[]): DetectedLine[] {
  return lines
    .map((l) => {
      const shift = wrapIndex(chain, l.first) - l.first;
      return shift === 0 ? l : { ...l, first: l.first + shift, last: l.last + shift };
    })
    .sort((a, b) => a.first - b.first);
}

/** The foot of the perpendicular from chain point `index` onto the line. */
export function projectOntoLine(chain: BoundaryChain, line: DetectedLine, index: number): Point {
  const p = chainPoint(chain, index);
  const along = (p.x - line.through.x) * line.direction.x + (p.y - line.through.y) * line.direction.y;
  return { x: line.through.x + along * line.direction.x, y: line.through.y + along * line.direction.y };
}
