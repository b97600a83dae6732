/**
 * Corner detection on noisy traced boundaries.
 *
 * A corner is a point where the drawn outline's tangent jumps. On a scan the jump is
 * blurred twice: anti-aliasing and optical blur round the tip by half a pixel to a
 * pixel or two, and pixel noise makes every two-point direction unreliable. The
 * detector therefore works with tangents fitted over stretches several pixels long
 * (local-line.ts) and in two steps, in the spirit of dominant-point detection with
 * regions of support (Teh & Chin 1989, "On the detection of dominant points on digital
 * curves", IEEE PAMI 11(8)), whose support regions end where the next dominant point
 * begins:
 *
 * 1. Candidates. At every point the turn between the line fitted to the stretch of
 *    length L just before it and the one just after it is measured. On a curve of
 *    radius R this turn is about L/R; at a corner it is the corner's angle, whatever
 *    the rounding of the tip, once L is a few times the rounding. Local maxima of the
 *    turn above a fraction of the corner angle are candidates (non-maximum suppression
 *    over ±L).
 * 2. Verification. Each candidate's two sides are fitted separately, starting beyond
 *    the rounded tip and ending before the neighbouring candidates' tips (the adaptive
 *    region of support), with a parabola in the side's own frame, and extrapolated to
 *    the apex. A tight curve gives the same tangent from both sides and is rejected; a
 *    rounded corner gives the two sides' tangents, whose turn must exceed the corner
 *    angle. The intersection of the two extrapolated tangent lines is the sharp corner
 *    the designer drew (anti-aliasing and blur round the ink, so the corner is
 *    recovered from its two sides, not followed); corner-sharpening.ts refines it.
 *    Where both sides are straight (sidesStraight), whose turn does not scatter as a
 *    curve's does, 0.8 of the corner angle suffices.
 *
 * When the scan's blur is known (fit-options.ts `scanBlurPx`), a candidate whose sides
 * meet farther from the traced tip than that blur can round a sharp corner
 * (blurred-wedge.ts), or than the tracer cuts a thin wedge, is a rounding the designer
 * drew (the crotch of n, the flat top of A) and is left to the curve fit rather than
 * sharpened. Measured on the round trip of Linux Libertine at 0.5 px per unit: the
 * Hausdorff p95 fell from 5.9 to 3.8 units. So is a candidate whose two sides both
 * keep curling the way it turns just beyond the rounded tip (sideCurls): blur rounds a
 * sharp corner only within that tip, so a boundary still turning there on both sides
 * is a round the designer drew a few pixels across, such as the crotches of Linux
 * Libertine's x, whose sides the parabolas see half round and half straight. It takes
 * with it a neighbouring corner that is another peak of the same round (step 3).
 *
 * 3. Rounds. Corners a few pixels apart that turn the same way by less than a right
 *    angle are pieces of one drawn round, which the support-length turn measure cuts
 *    into peaks; they are dropped and the round is left to the curve fit
 *    (round-pieces.ts).
 *
 * User-forced corners are always corners; forced smooth points never are.
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { arcAt, chainPoint, wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import { emptyStretchLine, fitStretchLine, rangeByArc, turnBetween } from './local-line.ts';
import { blurredWedgeInset } from './blurred-wedge.ts';
import { withoutRoundPieces } from './round-pieces.ts';

/**
 * Support length of the candidate turn measure: 4 px. Long enough that a tip rounded
 * by up to a pixel leaves most of each one-sided stretch straight, and that pixel noise
 * in the stretch's direction stays near a degree; short enough that two corners 4 px
 * apart (a serif's end at 0.5 px per unit) still get separate peaks.
 */
export const CORNER_SUPPORT_PX = 4;
/**
 * Candidates need a turn of at least this share of the corner angle: the one-sided
 * stretches include part of the rounded tip, which lowers the measured turn of a real
 * corner, so the threshold is applied in full only at verification.
 */
const CANDIDATE_SHARE = 0.6;
/**
 * Length of each side fitted at verification: 12 px, or up to the neighbouring
 * corner's rounded tip when that is nearer (the adaptive support region). The
 * parabola's tangent extrapolated to the apex scatters as noise/length^1.5 or so; at
 * 8 px a single 4σ noise point near the apex turned it by 30° on a noisy arc (measured
 * on a synthetic stadium, σ = 0.15 px), at 12 px by under 5°.
 */
export const CORNER_SIDE_PX = 12;
/**
 * Least rounded-tip length excluded on each side of a corner: 2 px. Anti-aliasing
 * rounds a corner by 0.5–1 px (measured in this project's round trips) and a scan blur of σ ≈ 1.2 px by about
 * twice that; the boundary there follows the ink, not the drawn corner.
 */
export const CORNER_ROUNDING_PX = 2;
/**
 * Half the width below which a wedge of ink or paper is not resolved: 0.5 px. The
 * tracer cuts across a wedge where it is narrower than about one pixel
 * (test/raster/glyph-round-trip.test.ts), i.e. within 0.5/tan(opening/2) px of the apex.
 */
const UNRESOLVED_WEDGE_HALF_WIDTH_PX = 0.5;
/**
 * With the scan's blur σ known, the rounded tip extends 2.5 σ each way: a Gaussian's
 * mass beyond 2.5 σ is 0.6 %, so the boundary there follows the drawn sides.
 */
const ROUNDING_ZONE_SIGMAS = 2.5;
/** Cap on the excluded tip length (px): beyond this a wedge is too thin to be a corner of a drawn letter. */
const MAX_ROUNDING_ZONE_PX = 8;
/**
 * How far the sharp corner may lie from the traced tip. A tip rounded with radius r
 * lies r·(1/sin(opening/2) − 1) inside the sharp corner; anti-aliasing and moderate
 * blur round by up to about 1.5 px, and 1 px more covers noise in the apex. A drawn
 * corner rounded more than that is the designer's rounding and is kept (measured: with
 * a reach of 2.5 px/sin(opening/2), the rounded crotch of Linux Libertine's n was cut
 * 6 units too deep at 0.5 px per unit). The whole reach stays in pixels: capped at 1.5
 * font units it took true pen corners of the demo sheet, where a pixel is more than 1.5
 * units, for roundings (warnings 3 → 8); only the margin follows the units
 * ({@link DRAWN_ROUNDING_UNITS}).
 */
export const CORNER_ROUNDING_RADIUS_PX = 1.5;
const CORNER_REACH_MARGIN_PX = 1;
/**
 * With the scan's blur known (and so the tip it predicts, blurred-wedge.ts), the margin
 * for a scan that resolves less than {@link DRAWN_ROUNDING_UNITS} per pixel shrinks to
 * that many font units, never below {@link MIN_MEASURED_REACH_MARGIN_PX}, and never
 * below {@link REACH_NOISE_SIGMAS} σ of the scan's noise.
 * Measured on the round trip of Linux Libertine (A–Z a–z 0–9, rendered with
 * anti-aliasing at 0.5 px per unit), as the slack between where a candidate's sides meet
 * and the tip the blur predicts: true corners reach 0.75 px; the brackets about 5 units
 * round where bowls meet stems (b, m, n, p, w), which the full 1 px margin took for
 * corners, start at 0.82 px. With the margin at 1.5 units (0.75 px there) the
 * Hausdorff p95 went from 3.77 to 2.80 units, corner precision from .886 to .910 and
 * recall from .949 to .954; at 1 px per unit nothing changed.
 */
const DRAWN_ROUNDING_UNITS = 1.5;
/**
 * The least margin with a measured blur: 0.6 px. Below it the sides' extrapolation
 * across the tip (about half a pixel on curved sides, measured as above) and the
 * tracer's own error would turn true corners into roundings. The demo sheet, whose
 * pixel is more than 1.5 units, keeps all its pen corners at 0.6 px, and lost them at a
 * total reach of 1.5 units.
 */
const MIN_MEASURED_REACH_MARGIN_PX = 0.6;
/**
 * A noisy scan's tip and sides scatter by its noise σ each: four σ keep nearly every
 * true corner. On a smoothed 1-bit scan (σ = 1/√12 px, the 1-bit staircase) this keeps
 * the full 1 px margin: measured, corner recall on the 1-bit copy of Linux Libertine fell
 * from .86 to .69 when its margin followed the smoothed boundaries' own scatter.
 */
const REACH_NOISE_SIGMAS = 4;
const MAX_CORNER_REACH_PX = 8;
/** Sides shorter than this many points are fitted with a line rather than a parabola. */
const MIN_POINTS_FOR_PARABOLA = 6;
/** A forced smooth index within this many px of arc cancels a detected corner. */
const FORCED_SMOOTH_MATCH_PX = 2;

export interface DetectedCorner {
  /** Chain index of the apex (the most turning point). */
  readonly index: number;
  /** Signed turn of the tangent in radians, positive to the left (counter-clockwise, y-up). */
  readonly turn: number;
  /** Unit tangents of the incoming and outgoing sides at the corner, along the chain. */
  readonly incoming: Vec;
  readonly outgoing: Vec;
  /** Arc length on each side of the apex occupied by the rounded tip (excluded from fitting). */
  readonly roundingZone: number;
  /** Largest distance from the apex at which the sharp corner is believed. */
  readonly reach: number;
  /** The sharp corner: where the sides' tangent lines meet (or the apex if they meet too far away). */
  readonly estimate: Point;
  /** True when the user forced this corner. */
  readonly forced: boolean;
}

export interface CornerSettings {
  /** Corner angle in radians. */
  readonly cornerAngle: number;
  /** One scan pixel in font units. */
  readonly pixel: number;
  readonly forcedCorners: readonly number[];
  readonly forcedSmooth: readonly number[];
  /** The scan's edge blur σ in px, when known (fit-options.ts `scanBlurPx`). */
  readonly blurPx?: number;
  /** The scan's noise σ across the boundary in px: declared (fit-options.ts `scanNoisePx`) or measured on the chain (local-line.ts estimateNoise). */
  readonly noisePx?: number;
}

/**
 * The rounded-tip length (font units) for a corner with the given turn: the wedge the
 * tracer cuts, and at least {@link CORNER_ROUNDING_PX}, or {@link ROUNDING_ZONE_SIGMAS}
 * blur σ when the scan's blur is known and that is shorter (a sharp scan's sides are
 * followed closer to the tip, so that a short flat between two corners keeps data).
 */
export function roundingZoneFor(turn: number, pixel: number, blurPx?: number): number {
  const opening = Math.PI - Math.abs(turn);
  const wedge = UNRESOLVED_WEDGE_HALF_WIDTH_PX / Math.tan(Math.max(opening, 1e-3) / 2);
  const rounding = blurPx === undefined ? CORNER_ROUNDING_PX : Math.min(CORNER_ROUNDING_PX, ROUNDING_ZONE_SIGMAS * blurPx);
  return Math.min(MAX_ROUNDING_ZONE_PX, Math.max(rounding, wedge)) * pixel;
}

/**
 * The reach (font units) for a corner with the given turn: how far inside the sharp
 * corner the traced tip may lie. With the scan's blur σ known, the tip of a corner
 * blurred by a Gaussian of σ lies σ·g(opening) inside it (blurredWedgeInset); without
 * it, a tip rounded with radius {@link CORNER_ROUNDING_RADIUS_PX} is assumed. Both
 * get a margin for noise (cornerReachMarginPx).
 */
export function cornerReachFor(turn: number, pixel: number, blurPx?: number, noisePx?: number): number {
  const opening = Math.PI - Math.abs(turn);
  const inset =
    blurPx === undefined
      ? CORNER_ROUNDING_RADIUS_PX * (1 / Math.max(Math.sin(opening / 2), 1e-3) - 1)
      : Math.max(blurPx * blurredWedgeInset(opening), UNRESOLVED_WEDGE_HALF_WIDTH_PX / Math.tan(Math.max(opening, 1e-3) / 2));
  return Math.min(MAX_CORNER_REACH_PX, inset + cornerReachMarginPx(pixel, blurPx, noisePx)) * pixel;
}

/**
 * The margin (px) added to the predicted tip's inset, for a scan pixel of `pixel` font
 * units: {@link CORNER_REACH_MARGIN_PX} without a measured blur (the tip's rounding is
 * then assumed, and the margin must cover any scan); with one, as much as
 * {@link DRAWN_ROUNDING_UNITS} allows, within {@link MIN_MEASURED_REACH_MARGIN_PX} and
 * the blind margin, and at least {@link REACH_NOISE_SIGMAS} σ of the noise.
 */
export function cornerReachMarginPx(pixel: number, blurPx?: number, noisePx = 0): number {
  if (blurPx === undefined) return CORNER_REACH_MARGIN_PX;
  return Math.min(CORNER_REACH_MARGIN_PX, Math.max(MIN_MEASURED_REACH_MARGIN_PX, DRAWN_ROUNDING_UNITS / pixel, REACH_NOISE_SIGMAS * noisePx));
}

/**
 * The turn measure of step 1 at every point: signed angle between the regression
 * lines of the stretches [s − L, s] and [s, s + L]. O(n log n).
 */
export function supportTurns(chain: BoundaryChain, support: number): Float64Array {
  const turns = new Float64Array(chain.count);
  const back = emptyStretchLine();
  const ahead = emptyStretchLine();
  for (let i = 0; i < chain.count; i++) {
    const s = chain.arc[i]!;
    const [backFirst] = rangeByArc(chain, s - support, s);
    const [, aheadLast] = rangeByArc(chain, s, s + support);
    fitStretchLine(chain, Math.min(backFirst, i - 1), i, back);
    fitStretchLine(chain, i, Math.max(aheadLast, i + 1), ahead);
    turns[i] = turnBetween(back.angle, ahead.angle);
  }
  return turns;
}

/** Cyclic arc distance between two chain indices. */
function arcDistance(chain: BoundaryChain, i: number, j: number): number {
  const d = Math.abs(chain.arc[wrapIndex(chain, i)]! - chain.arc[wrapIndex(chain, j)]!);
  return Math.min(d, chain.perimeter - d);
}

/** A side of a corner fitted and extrapolated to the apex. */
interface SideFit {
  readonly point: Point;
  readonly tangent: Vec;
}

/**
 * Fits the points of the unwrapped range [first, last] with a parabola v = a + b·u + c·u²
 * in the frame of their chord (u along the chain), and returns the parabola's point and
 * unit tangent (oriented along the chain) at the apex's u. Lines for short sides.
 */
export function fitSideAtApex(chain: BoundaryChain, first: number, last: number, apex: Point): SideFit | undefined {
  const m = last - first + 1;
  if (m < 2) return undefined;
  const a0 = wrapIndex(chain, first);
  const a1 = wrapIndex(chain, last);
  const ox = chain.xs[a0]!;
  const oy = chain.ys[a0]!;
  let dx = chain.xs[a1]! - ox;
  let dy = chain.ys[a1]! - oy;
  const chord = Math.hypot(dx, dy);
  if (chord === 0) return undefined;
  dx /= chord;
  dy /= chord;
  // Normal equations of the least-squares polynomial in u (power sums up to u⁴).
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, t0 = 0, t1 = 0, t2 = 0;
  for (let k = first; k <= last; k++) {
    const i = wrapIndex(chain, k);
    const px = chain.xs[i]! - ox;
    const py = chain.ys[i]! - oy;
    const u = (px * dx + py * dy) / chord; // scaled to [0, 1] for conditioning
    const v = -px * dy + py * dx;
    const u2 = u * u;
    s0 += 1; s1 += u; s2 += u2; s3 += u2 * u; s4 += u2 * u2;
    t0 += v; t1 += u * v; t2 += u2 * v;
  }
  let a = 0, b = 0, c = 0;
  const quadratic = m >= MIN_POINTS_FOR_PARABOLA ? solve3(s0, s1, s2, s1, s2, s3, s2, s3, s4, t0, t1, t2) : undefined;
  if (quadratic) {
    [a, b, c] = quadratic;
  } else {
    const det = s0 * s2 - s1 * s1;
    if (Math.abs(det) < 1e-12) return undefined;
    a = (t0 * s2 - s1 * t1) / det;
    b = (s0 * t1 - s1 * t0) / det;
  }
  const ax = apex.x - chain.origin.x - ox;
  const ay = apex.y - chain.origin.y - oy;
  const ua = (ax * dx + ay * dy) / chord;
  const v = a + b * ua + c * ua * ua;
  const slope = (b + 2 * c * ua) / chord; // dv/du in font units
  const tl = Math.hypot(1, slope);
  const tangent = { x: (dx - slope * dy) / tl, y: (dy + slope * dx) / tl };
  const pu = ua * chord;
  return { point: { x: ox + pu * dx - v * dy + chain.origin.x, y: oy + pu * dy + v * dx + chain.origin.y }, tangent };
}

/** Cramer's rule for a 3 × 3 system; undefined when (nearly) singular. */
function solve3(a11: number, a12: number, a13: number, a21: number, a22: number, a23: number, a31: number, a32: number, a33: number, b1: number, b2: number, b3: number): [number, number, number] | undefined {
  const det = a11 * (a22 * a33 - a23 * a32) - a12 * (a21 * a33 - a23 * a31) + a13 * (a21 * a32 - a22 * a31);
  const scale = Math.abs(a11 * a22 * a33) + 1e-300;
  if (Math.abs(det) < 1e-12 * scale) return undefined;
  const x = (b1 * (a22 * a33 - a23 * a32) - a12 * (b2 * a33 - a23 * b3) + a13 * (b2 * a32 - a22 * b3)) / det;
  const y = (a11 * (b2 * a33 - a23 * b3) - b1 * (a21 * a33 - a23 * a31) + a13 * (a21 * b3 - b2 * a31)) / det;
  const z = (a11 * (a22 * b3 - b2 * a32) - a12 * (a21 * b3 - b2 * a31) + b1 * (a21 * a32 - a22 * a31)) / det;
  return [x, y, z];
}

/** Where the lines p + s·u and q + t·v meet, or undefined for (nearly) parallel lines. */
export function intersectLines(p: Point, u: Vec, q: Point, v: Vec): Point | undefined {
  const denominator = u.x * v.y - u.y * v.x;
  if (Math.abs(denominator) < 1e-9) return undefined;
  const s = ((q.x - p.x) * v.y - (q.y - p.y) * v.x) / denominator;
  return { x: p.x + s * u.x, y: p.y + s * u.y };
}

/**
 * The corners of a closed chain, sorted by index.
 *
 * Guarantees: every forced corner is listed (marked `forced`); no corner lies within
 * 2 px of arc of a forced smooth index; detected corners are at least L = 4 px apart;
 * every detected corner's verified turn is at least the corner angle. Limit: two
 * drawn corners closer than about 4 px merge into one, and a tip sharper than about
 * 10° of opening is reported with the tracer's cut-off tip as its apex.
 */
export function detectCorners(chain: BoundaryChain, settings: CornerSettings): DetectedCorner[] {
  const { pixel, cornerAngle } = settings;
  const support = CORNER_SUPPORT_PX * pixel;
  const turns = supportTurns(chain, support);
  const n = chain.count;
  const forced = new Set(settings.forcedCorners.map((i) => wrapIndex(chain, Math.round(i))));
  const forcedSmooth = settings.forcedSmooth.map((i) => wrapIndex(chain, Math.round(i)));

  // Step 1: candidates by non-maximum suppression of |turn|.
  const order: number[] = [];
  for (let i = 0; i < n; i++) if (Math.abs(turns[i]!) >= CANDIDATE_SHARE * cornerAngle) order.push(i);
  order.sort((a, b) => Math.abs(turns[b]!) - Math.abs(turns[a]!));
  const candidates: number[] = [...forced];
  for (const i of order) {
    if (candidates.some((j) => arcDistance(chain, i, j) < support)) continue;
    if (forcedSmooth.some((j) => arcDistance(chain, i, j) <= FORCED_SMOOTH_MATCH_PX * pixel)) continue;
    candidates.push(i);
  }

  // Step 2: verification, strongest candidate first, with side fits bounded by the
  // tips of the corners already verified (weaker neighbours do not cut a side short).
  const corners: DetectedCorner[] = [];
  const curlingRounds: DetectedCorner[] = [];
  const byStrength = [...candidates].sort((a, b) => (forced.has(b) ? 1 : 0) - (forced.has(a) ? 1 : 0) || Math.abs(turns[b]!) - Math.abs(turns[a]!));
  for (const index of byStrength) {
    const verdict = verifyCandidate(chain, settings, index, turns[index]!, forced.has(index), corners);
    // 'resolved-rounding': the tip is rounder than the scan's blur allows, a rounding
    // the designer drew (a crotch, the flat top of an apex), left to the curve fit.
    if (verdict === undefined || verdict === 'resolved-rounding') continue;
    if ('curlingRound' in verdict) curlingRounds.push(verdict.curlingRound);
    else corners.push(verdict);
  }
  // A round whose sides curl is a piece of a round too: a corner next to it that turns
  // the same way (another peak of the same round, whose far side runs straight) goes
  // with it, and the round itself is never a corner.
  const all = [...corners, ...curlingRounds].sort((a, b) => a.index - b.index);
  return withoutRoundPieces(chain, all, pixel).filter((c) => !curlingRounds.includes(c));
}

/**
 * Step 2 for one candidate: its sides fitted beyond the rounded tip (bounded by the
 * tips of `verified` corners) and extrapolated. Returns the corner, undefined when the
 * sides turn less than the corner angle, 'resolved-rounding' when the scan's blur is
 * known and the sides meet farther from the traced tip than that blur can round, or the
 * corner as a `curlingRound` when both sides still curl beyond that tip (sideCurls).
 */
function verifyCandidate(chain: BoundaryChain, settings: CornerSettings, index: number, candidateTurn: number, isForced: boolean, verified: readonly { readonly index: number; readonly roundingZone: number }[]): DetectedCorner | { readonly curlingRound: DetectedCorner } | 'resolved-rounding' | undefined {
  const { pixel, cornerAngle } = settings;
  const support = CORNER_SUPPORT_PX * pixel;
  const s = chain.arc[index]!;
  const zone = roundingZoneFor(candidateTurn, pixel, settings.blurPx);
  let before = s - zone - CORNER_SIDE_PX * pixel;
  let after = s + zone + CORNER_SIDE_PX * pixel;
  for (const c of verified) {
    let sOther = chain.arc[c.index]!;
    if (sOther - s > chain.perimeter / 2) sOther -= chain.perimeter;
    if (s - sOther > chain.perimeter / 2) sOther += chain.perimeter;
    if (sOther < s) before = Math.max(before, sOther + c.roundingZone);
    else after = Math.min(after, sOther - c.roundingZone);
  }
  const apex = chainPoint(chain, index);
  const [l0, l1] = rangeByArc(chain, before, s - zone);
  const [r0, r1] = rangeByArc(chain, s + zone, after);
  const left = l1 > l0 ? fitSideAtApex(chain, l0, Math.min(l1, index - 1), apex) : undefined;
  const right = r1 > r0 ? fitSideAtApex(chain, Math.max(r0, index + 1), r1, apex) : undefined;
  let incoming: Vec;
  let outgoing: Vec;
  if (left && right) {
    incoming = left.tangent;
    outgoing = right.tangent;
  } else {
    // Too little on a side to fit: fall back to the candidate turn's own stretches.
    const reach = Math.max(2, Math.round(support / chain.medianStep));
    const back = fitStretchLine(chain, index - reach, index, emptyStretchLine());
    const ahead = fitStretchLine(chain, index, index + reach, emptyStretchLine());
    incoming = { x: Math.cos(back.angle), y: Math.sin(back.angle) };
    outgoing = { x: Math.cos(ahead.angle), y: Math.sin(ahead.angle) };
  }
  const turn = turnBetween(Math.atan2(incoming.y, incoming.x), Math.atan2(outgoing.y, outgoing.x));
  if (!isForced && Math.abs(turn) < cornerAngle && !(Math.abs(turn) >= STRAIGHT_SIDES_SHARE * cornerAngle && sidesStraight(chain, before, after, s, zone, pixel, settings.noisePx ?? 0))) return undefined;
  const reach = cornerReachFor(turn, pixel, settings.blurPx, settings.noisePx);
  const meet = left && right ? intersectLines(left.point, left.tangent, right.point, right.tangent) : undefined;
  const meetDistance = meet ? Math.hypot(meet.x - apex.x, meet.y - apex.y) : 0;
  if (!isForced && meet && settings.blurPx !== undefined && meetDistance > reach) return 'resolved-rounding';
  const estimate = meet && meetDistance <= reach ? meet : apex;
  const corner: DetectedCorner = { index, turn, incoming, outgoing, roundingZone: roundingZoneFor(turn, pixel, settings.blurPx), reach, estimate, forced: isForced };
  if (!isForced && settings.blurPx !== undefined && sideCurls(chain, before, s - zone, turn, -1, pixel, settings.noisePx ?? 0) && sideCurls(chain, after, s + zone, turn, 1, pixel, settings.noisePx ?? 0)) return { curlingRound: corner };
  return corner;
}

/**
 * Length (px) of each of the two bands beyond a corner's rounded tip whose fitted lines
 * measure how much a side still curls there: 4 px, the support of the candidate turn
 * measure ({@link CORNER_SUPPORT_PX}), whose direction noise stays near a degree.
 */
const SIDE_CURL_BAND_PX = CORNER_SUPPORT_PX;
/**
 * Least curl (degrees) between the two bands, on both sides and the way the corner
 * turns, that makes the candidate a drawn round: 12°. Measured on the round trip of
 * Linux Libertine at 1 px per unit: the true serif corners of x curl the way they turn
 * by at most 4° on one of their sides (up to 16° on the bracket side), its rounded
 * crotches by 9–21° on both. Over A–Z a–z 0–9 the corner precision rose from 0.929 /
 * 0.910 / 0.889 to 0.946 / 0.934 / 0.919 (clean 1 px, clean 0.5 px per unit, rough),
 * recall unchanged; at 8° the rough copy's recall fell from 0.958 to 0.947.
 */
const SIDE_CURL_DEGREES = 12;
/**
 * …and at least this many standard deviations of the curl that the scan's noise alone
 * gives: 3. A line fitted to n points a pixel apart with noise σ across them has a
 * direction error of σ·√12 / n^1.5 radians, so the difference of two bands of 4 px
 * scatters by √2·σ·√12/8 ≈ 0.61·σ. On the clean and rough copies (σ ≈ 0.04–0.06 px)
 * that is 1.4–2.2°, under the 12° above; on a 1-bit scan the quantization's
 * σ = 1/√12 px makes it 10°, and the staircase left along a serif corner's sides curled
 * them by 12–20° (Linux Libertine's P lost three corners at 12°).
 */
const SIDE_CURL_NOISE_SIGMAS = 3;

/**
 * Standard deviation (radians) of the turn between lines fitted to two bands of
 * `bandPx` px each, from the scan's noise σ = `noisePx` px across the boundary alone: a
 * line fitted to n points a pixel apart has a direction error of σ·√12 / n^1.5, and the
 * difference of two such lines √2 times that.
 */
function bandCurlNoise(noisePx: number, bandPx: number): number {
  return (Math.SQRT2 * noisePx * Math.sqrt(12)) / bandPx ** 1.5;
}

/**
 * Whether the chain, on one side of a corner candidate, still turns the corner's way
 * by more than {@link SIDE_CURL_DEGREES} (or {@link SIDE_CURL_NOISE_SIGMAS} standard
 * deviations of the scan's noise, `noisePx` in px) between two bands of
 * {@link SIDE_CURL_BAND_PX} beyond its rounded tip. `near` is the arc position where
 * the tip ends, `limit` how far the side may run (a neighbouring corner's tip), `sense`
 * −1 for the side before the apex and +1 for the side after it. False when the side is
 * too short for both bands.
 */
function sideCurls(chain: BoundaryChain, limit: number, near: number, turn: number, sense: 1 | -1, pixel: number, noisePx: number): boolean {
  const band = SIDE_CURL_BAND_PX * pixel;
  const least = Math.max((SIDE_CURL_DEGREES * Math.PI) / 180, SIDE_CURL_NOISE_SIGMAS * bandCurlNoise(noisePx, SIDE_CURL_BAND_PX));
  const middle = near + sense * band;
  const far = near + 2 * sense * band;
  if (sense * (limit - far) < 0) return false;
  const [n0, n1] = sense > 0 ? rangeByArc(chain, near, middle) : rangeByArc(chain, middle, near);
  const [f0, f1] = sense > 0 ? rangeByArc(chain, middle, far) : rangeByArc(chain, far, middle);
  if (n1 <= n0 || f1 <= f0) return false;
  const nearLine = fitStretchLine(chain, n0, n1, emptyStretchLine());
  const farLine = fitStretchLine(chain, f0, f1, emptyStretchLine());
  // Along the chain: from the far band to the near one before the apex, near to far after it.
  const curl = sense > 0 ? turnBetween(nearLine.angle, farLine.angle) : turnBetween(farLine.angle, nearLine.angle);
  return Math.sign(curl) === Math.sign(turn) && Math.abs(curl) > least;
}

/**
 * Share of the corner angle from which a candidate whose two sides are both straight is
 * a corner: 0.8, so 20° at the default 25°. The corner angle stands above the least
 * turn a designer draws as a corner (the round trip counts corners from 20°) because
 * the turn of a candidate on curved sides scatters: the parabolas extrapolated across
 * the rounded tip see part of the curve (measured: at 20° for every candidate, Linux
 * Libertine's rough copy lost corner recall, .958 → .947, and its 1-bit copy .86 → .81).
 * Two straight sides have no such scatter, and two straight strokes meeting at 20° or
 * more are a corner in any drawing: no curve can join two lines smoothly. Measured on
 * the round trip of Cantarell: the 24° corner where the diagonal of 7 meets its
 * vertical was fitted as a smooth join into a curve, and rounding left a near-miss kink
 * of 1.9° there (2.7° at 0.5 px per unit); now it is the corner the font has.
 */
const STRAIGHT_SIDES_SHARE = 0.8;
/**
 * A side is straight when the lines fitted to its near and far halves turn by at most
 * 1.5°, or by three standard deviations of what the scan's noise gives, if more.
 */
const STRAIGHT_SIDE_CURL_DEGREES = 1.5;
/**
 * …and only where the noise lets that be told: where three standard deviations of the
 * noise's curl exceed 5°, no side counts as straight. With 6-px halves that is
 * 3.3–3.8° on the clean and rough copies of the round trip (σ ≈ 0.058–0.066 px) and 17°
 * on a 1-bit scan (σ = 1/√12 px), whose staircase can hide a gentle curve.
 */
const MAX_STRAIGHT_NOISE_CURL_DEGREES = 5;
/** Shortest side tested for straightness: two bands of {@link SIDE_CURL_BAND_PX}. */
const STRAIGHT_SIDE_MIN_PX = 2 * SIDE_CURL_BAND_PX;

/**
 * Whether both sides of a candidate, from the ends of its rounded tip (arc s ∓ zone)
 * out to `before` and `after`, are straight (see {@link STRAIGHT_SIDE_CURL_DEGREES}).
 */
function sidesStraight(chain: BoundaryChain, before: number, after: number, s: number, zone: number, pixel: number, noisePx: number): boolean {
  const straight = (limit: number, near: number, sense: 1 | -1): boolean => {
    const length = sense * (limit - near);
    if (length < STRAIGHT_SIDE_MIN_PX * pixel) return false;
    const noiseCurl = SIDE_CURL_NOISE_SIGMAS * bandCurlNoise(noisePx, length / 2 / pixel);
    if (noiseCurl > (MAX_STRAIGHT_NOISE_CURL_DEGREES * Math.PI) / 180) return false;
    const middle = (near + limit) / 2;
    const [n0, n1] = sense > 0 ? rangeByArc(chain, near, middle) : rangeByArc(chain, middle, near);
    const [f0, f1] = sense > 0 ? rangeByArc(chain, middle, limit) : rangeByArc(chain, limit, middle);
    if (n1 <= n0 || f1 <= f0) return false;
    const nearLine = fitStretchLine(chain, n0, n1, emptyStretchLine());
    const farLine = fitStretchLine(chain, f0, f1, emptyStretchLine());
    return Math.abs(turnBetween(nearLine.angle, farLine.angle)) <= Math.max((STRAIGHT_SIDE_CURL_DEGREES * Math.PI) / 180, noiseCurl);
  };
  return straight(before, s - zone, -1) && straight(after, s + zone, 1);
}

/** Arc length from corner apex `index` to unwrapped index `k` (signed, the short way round). */
export function arcOffset(chain: BoundaryChain, index: number, k: number): number {
  let d = arcAt(chain, k) - arcAt(chain, index);
  const half = chain.perimeter / 2;
  while (d > half) d -= chain.perimeter;
  while (d < -half) d += chain.perimeter;
  return d;
}
