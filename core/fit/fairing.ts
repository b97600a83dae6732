/**
 * Fairing: curvature continuity (G2) across smooth joins, without leaving the tolerance.
 *
 * The fitter makes every smooth join G1 (one tangent shared by both handles), but the
 * curvature generally jumps there, which shows as a step in a curvature comb. The
 * natural cubic spline is the model of a fair curve: among all C² interpolants it
 * minimises ∫ f″² (Holladay's theorem, 1957; see de Boor 1978, "A Practical Guide to
 * Splines", ch. V), the linearised strain energy ∫κ² ds, and it is curvature
 * continuous at every knot. This stage gives the fitted contour the property the
 * spline has at its knots, G2 at the chosen smooth joins, while keeping what the
 * earlier stages fixed: on-curve points and tangent directions are not touched, only
 * handle lengths along their tangents change.
 *
 * The curvature of a cubic Bézier at its ends (Farin 2002, "Curves and Surfaces for
 * CAGD", 5th ed., the end-point curvature of Bézier curves; section not cited, from
 * memory: κ(0) = (2/3)·|(P1 − P0) × (P2 − P1)| / |P1 − P0|³, here signed; derived again
 * from κ = B′ × B″ / |B′|³ in curvature.ts) becomes, with P1 = P0 + s·D0 and
 * P2 = P3 − e·D1 (D0, D1 the unit handle directions, c = P3 − P0, k = D0 × D1),
 *   κ(0) = (2/3)·(D0 × c − e·k) / s²,   κ(1) = (2/3)·(c × D1 − s·k) / e²,
 * so each end's curvature depends on both handle lengths of its cubic. G2 at a join
 * with a shared tangent is κ_in = κ_out (Barsky & DeRose 1989, "Geometric continuity of
 * parametric curves: three equivalent characterizations", IEEE CG&A 9(6): with G1 in
 * place, G2 is equality of the curvature vectors, i.e. of the signed curvatures); next
 * to a line, whose curvature is 0, it is κ = 0 on the curved side. Because a cubic's
 * two handles meet at its two ends, the conditions at neighbouring joins interact, and
 * they are solved jointly round the contour.
 *
 * Method: the unknowns are the handle lengths of the cubics next to the chosen joins.
 * The objective is the least-squares distance of the chain points to the cubics (at
 * parameters taken from the nearest points, as in Schneider's fit, least-squares.ts),
 * in tolerance units, plus a penalty W·Σ ((κ_in − κ_out)/scale)² whose weight W is
 * raised step by step (a penalty continuation; Nocedal & Wright 2006, "Numerical
 * Optimization", §17.1), each step minimised by Levenberg–Marquardt (§10.3). The data
 * term picks, among the G2 solutions, the one nearest the chain; the strain energy is
 * not in the objective, only measured (test/fit/fairing.test.ts: between −0.4 % and
 * +0.7 % on the test shapes), so this is G2 in the natural spline's spirit, not its
 * minimum-energy optimum. Afterwards every changed span is measured again against the chain
 * (span-error.ts). A span that leaves the tolerance, whose handles would cross or
 * reach backwards (finishing.ts), that gains an inflection or much strain energy, or
 * that worsens the step at a neighbouring join left out, marks one of its joins failed; failed joins keep
 * their original handles and the rest are solved again, until every span holds.
 *
 * Limits: a local method (Gauss–Newton from the fitted handles), so a G2 solution far
 * from them is not found; the target is G2 within {@link G2_RELATIVE_TOLERANCE}, not
 * exactly. Grid rounding (grid-rounding.ts), which runs after this stage, moves
 * handles by a cell or so to keep joins collinear, and end curvature is sensitive to
 * that (κ ∝ the far handle's offset from the tangent / s²). The rounding weighs the
 * curvature step among its collinear candidates; measured on this stage's test shapes
 * (250–600 units) the step at G2 joins comes back to a median of 4.2 %, worst 56 %
 * (before that weighing: 7.0 % and 130 %).
 */
import type { Point, Vec } from '../geometry/vector.ts';
import { cubic, derivative, type CubicSegment } from '../geometry/segment.ts';
import { curvature, inflectionParameters } from '../geometry/curvature.ts';
import { gaussLegendreRule, integrateWithRule } from '../geometry/gauss-legendre.ts';
import { nearestPoint } from '../geometry/nearest.ts';
import { wrapIndex, type BoundaryChain } from './boundary-chain.ts';
import { handleReachesBackwards, handlesCross } from './finishing.ts';
import type { FitNode, FitSpan, FittedContour } from './fitted-contour.ts';
import { measureSpanError } from './span-error.ts';

/**
 * A join counts as G2 when its curvature step is at most 2 % of the curvature there
 * (see {@link joinCurvatures} for the scale). Our own choice: a 2 % step is below what
 * a curvature comb at editor zoom shows (the comb's teeth are a few dozen pixels long,
 * so 2 % is under a pixel), and grid rounding alone reopens steps of that order.
 */
export const G2_RELATIVE_TOLERANCE = 0.02;

/**
 * Floor of the curvature scale, as a share of the largest |κ| on the two adjacent
 * spans: where both sides are nearly straight at the join (an inflection at the
 * join), max(|κ_in|, |κ_out|) is close to 0 and a relative step would be meaningless.
 * Our own choice.
 */
export const LOW_CURVATURE_SHARE = 0.1;

/** Parameters sampled per span for its largest |κ| (the curvature scale). 33 samples resolve a cubic's at most two curvature peaks. */
const SPAN_CURVATURE_SAMPLES = 33;

/**
 * Shortest handle allowed, as a share of its cubic's chord: the end curvature grows
 * as 1/s², so a handle near zero length makes a cusp-like spike. Schneider's
 * degenerate-handle test (least-squares.ts) uses 1e-3; 1 % keeps the solve well away
 * from it.
 */
const MIN_HANDLE_SHARE = 0.01;

/** Rounds of refreshed chain-point parameters (Schneider's alternation); the handles move little, so 3 suffice. */
const PARAMETER_ROUNDS = 3;
/** SQP steps per round; from the fitted handles it typically converges in 3–6. */
const MAX_SOLVER_STEPS = 25;
/** Step halvings tried by the line search before the iteration gives up. */
const MAX_STEP_HALVINGS = 30;
/** A step shorter than this share of the chord, with every relative step below it too, ends the iteration. */
const STEP_CONVERGED_SHARE = 1e-10;
/**
 * −ε on the constraint block of the KKT matrix: keeps the system solvable where two
 * curvature conditions depend on the same lengths in the same way, at the price of a
 * residual step of about ε·λ, far below {@link G2_RELATIVE_TOLERANCE}.
 */
const CONSTRAINT_SOFTENING = 1e-9;
/** The merit weight is this many times the largest multiplier (it must exceed it; Nocedal & Wright §15.4). */
const MERIT_MULTIPLIER_FACTOR = 2;
/**
 * Weight of the pull towards the original handle lengths (per squared chord), tiny:
 * it only makes the system definite where a cubic has no chain points.
 */
const ORIGINAL_LENGTH_WEIGHT = 1e-6;

/** Curvature on each side of one node. */
export interface JoinCurvature {
  /** Index of the node in `contour.nodes`. */
  readonly node: number;
  readonly smooth: boolean;
  /** Signed curvature (left turns positive, y up) at the end of the arriving span; 0 for a line. */
  readonly kappaIn: number;
  /** Signed curvature at the start of the leaving span; 0 for a line. */
  readonly kappaOut: number;
  /**
   * |κ_in − κ_out| / scale. The scale is max(|κ_in|, |κ_out|), at least
   * {@link LOW_CURVATURE_SHARE} of the largest |κ| on the two adjacent spans; next to a
   * line it is the largest |κ| on the curved span (the line's 0 would make every step
   * 100 %). 0 between two lines. Meaningful at smooth joins only.
   */
  readonly relativeJump: number;
}

/** What fairing did at one chosen join. */
export type FairingOutcome =
  /** G2 within {@link G2_RELATIVE_TOLERANCE} (it may already have been). */
  | 'g2'
  /**
   * G2 here would take a span out of the tolerance or make it less fair (handles that
   * cross or reach backwards, a new inflection, much more strain energy, a larger step at
   * a neighbouring join): original handles kept.
   */
  | 'outside-tolerance'
  /** The solve did not reach G2 within its tolerance (handle bounds, or no nearby solution): original handles kept. */
  | 'not-reached'
  /** Not a smooth join with one shared tangent and a cubic on at least one side: left alone. */
  | 'not-eligible';

export interface JoinFairing {
  readonly node: number;
  readonly outcome: FairingOutcome;
  readonly relativeJumpBefore: number;
  readonly relativeJumpAfter: number;
}

export interface FairingResult {
  readonly contour: FittedContour;
  /** One entry per chosen node, in node order. */
  readonly joins: readonly JoinFairing[];
}

export interface FairingOptions {
  /**
   * Indices into `contour.nodes` to make G2. Default: every smooth node with a shared
   * tangent and a cubic on at least one side.
   */
  readonly nodes?: readonly number[];
}

/**
 * The contour with G2 at the chosen smooth joins wherever the tolerance allows (see the
 * header). On-curve points, tangents and node records are unchanged; handle lengths
 * change; span errors are measured again. Inputs are not modified.
 */
export function fairSmoothJoins(chain: BoundaryChain, contour: FittedContour, tolerance: number, options: FairingOptions = {}): FittedContour {
  return fairSmoothJoinsWithReport(chain, contour, tolerance, options).contour;
}

/** Curvatures on both sides of every node (see {@link JoinCurvature} for the step's scale). */
export function joinCurvatures(contour: FittedContour): JoinCurvature[] {
  const { nodes, spans } = contour;
  const n = nodes.length;
  return nodes.map((node, i) => {
    const before = spans[(i - 1 + n) % n]!.segment;
    const after = spans[i]!.segment;
    const kappaIn = before.kind === 'cubic' ? curvature(before, 1) : 0;
    const kappaOut = after.kind === 'cubic' ? curvature(after, 0) : 0;
    const scale = curvatureScale(kappaIn, kappaOut, before.kind === 'cubic' ? before : undefined, after.kind === 'cubic' ? after : undefined);
    const relativeJump = scale > 0 ? Math.abs(kappaIn - kappaOut) / scale : 0;
    return { node: i, smooth: node.smooth, kappaIn, kappaOut, relativeJump };
  });
}

function curvatureScale(kappaIn: number, kappaOut: number, before: CubicSegment | undefined, after: CubicSegment | undefined): number {
  const peak = Math.max(before ? largestCurvature(before) : 0, after ? largestCurvature(after) : 0);
  if (!before || !after) return peak;
  return Math.max(Math.abs(kappaIn), Math.abs(kappaOut), LOW_CURVATURE_SHARE * peak);
}

function largestCurvature(segment: CubicSegment): number {
  let peak = 0;
  for (let k = 0; k < SPAN_CURVATURE_SAMPLES; k++) {
    const value = Math.abs(curvature(segment, k / (SPAN_CURVATURE_SAMPLES - 1)));
    if (value > peak) peak = value;
  }
  return peak;
}

/**
 * A changed cubic whose strain energy ∫κ² ds grows by more than this factor counts as
 * broken, like one that gains an inflection: G2 bought with a wiggle is not fairer.
 * Our own choice; on the test shapes the spans G2 leaves fair change by under 5 %,
 * while the wiggles seen grew by 25 % to 10×.
 */
const MAX_SPAN_STRAIN_GROWTH = 1.2;
/** A step at a join left out of the solve may grow by this share (rounding-level changes) before it counts as worsened. */
const WORSENED_STEP_SLACK = 0.05;
/** 16-point Gauss–Legendre: ∫κ² ds of a fair cubic is smooth in t, and this resolves it to well under 1 %. */
const STRAIN_RULE = gaussLegendreRule(16);

/** One cubic span as the solver sees it: fixed ends and directions, two lengths. */
interface CubicUnknowns {
  readonly span: number;
  readonly segment: CubicSegment;
  /** The span's unwrapped chain range. */
  readonly first: number;
  readonly last: number;
  /** Unit handle directions: P1 = P0 + s·d0, P2 = P3 − e·d1. */
  readonly d0: Vec;
  readonly d1: Vec;
  readonly s0: number;
  readonly e0: number;
  readonly minLength: number;
  readonly chord: number;
}

/** A join the solver makes G2. */
interface JoinTerm {
  readonly node: number;
  /** Cubic arriving / leaving (index into the unknowns), or −1 for a line. */
  readonly arriving: number;
  readonly leaving: number;
  /** Fixed scale of the step (from the original curvatures). */
  readonly scale: number;
}

/**
 * {@link fairSmoothJoins} with the outcome at every chosen node. Throws a RangeError
 * for a node index outside the contour.
 */
export function fairSmoothJoinsWithReport(chain: BoundaryChain, contour: FittedContour, tolerance: number, options: FairingOptions = {}): FairingResult {
  const { nodes, spans } = contour;
  const n = nodes.length;
  const before = joinCurvatures(contour);
  const chosen = options.nodes ? [...new Set(options.nodes)].sort((a, b) => a - b) : nodes.map((_, i) => i).filter((i) => defaultChoice(contour, i));
  for (const i of chosen) if (!Number.isInteger(i) || i < 0 || i >= n) throw new RangeError(`fairing node ${i} is not a node of the contour (0 to ${n - 1})`);

  // Unknowns: both handle lengths of every cubic (fixed ones simply never move).
  const unknowns: (CubicUnknowns | undefined)[] = spans.map((span, i) => cubicUnknowns(span, i, nodes[i]!, nodes[(i + 1) % n]!));
  const outcome = new Map<number, FairingOutcome>();
  for (const i of chosen) if (!eligible(contour, unknowns, i)) outcome.set(i, 'not-eligible');

  const firstTerms = new Map<number, DataTerm>();
  const failedNodes = (): Set<number> => new Set(chosen.filter((i) => outcome.get(i) === 'outside-tolerance' || outcome.get(i) === 'not-reached'));
  // Solves with every chosen join that has not failed (nor been found ineligible) made G2.
  const attempt = (failed: ReadonlySet<number>): Attempt => {
    const active = chosen.filter((i) => !failed.has(i) && outcome.get(i) !== 'not-eligible');
    if (active.length === 0) return { active, spans: spans.slice(), broken: [] };
    const terms = active.map((i) => joinTerm(contour, unknowns, before[i]!, i));
    const lengths = solve(chain, unknowns, terms, freeLengths(unknowns, nodes, new Set(active), failed), tolerance, firstTerms);
    const result = rebuiltSpans(chain, spans, unknowns, lengths, tolerance);
    return { active, spans: result, broken: [...brokenSpans(spans, result, tolerance), ...spansNextToWorsenedJoins(contour, result, active, before)] };
  };
  let state = attempt(failedNodes());
  for (let round = 0; round <= chosen.length && state.active.length > 0; round++) {
    if (state.broken.length > 0) {
      // The span furthest outside: one of its active ends keeps its original handles,
      // whichever leaves fewer spans broken (then the smaller excess).
      const worst = state.broken.reduce((w, b) => (b.excess > w.excess ? b : w));
      const ends = [worst.span, (worst.span + 1) % n].filter((i, k, all) => state.active.includes(i) && all.indexOf(i) === k);
      if (ends.length === 0) break; // cannot happen: a span with no active end keeps its handles
      const trials = ends.map((node) => ({ node, next: attempt(new Set([...failedNodes(), node])) }));
      const best = trials.reduce((x, y) => (better(y.next, x.next) ? y : x));
      outcome.set(best.node, 'outside-tolerance');
      state = best.next;
      continue;
    }
    // Joins the solve could not bring within the G2 tolerance keep their handles too.
    const after = joinCurvatures({ nodes, spans: state.spans });
    const missed = state.active.filter((i) => after[i]!.relativeJump > G2_RELATIVE_TOLERANCE);
    if (missed.length === 0) break;
    for (const i of missed) outcome.set(i, 'not-reached');
    state = attempt(failedNodes());
  }
  // Failing greedily can fail a join that a later failure made reachable again: retry
  // each failed join on its own, smallest step first, and keep it where all still holds.
  const allReached = (a: Attempt): boolean => {
    const curvatures = joinCurvatures({ nodes, spans: a.spans });
    return a.broken.length === 0 && a.active.every((i) => curvatures[i]!.relativeJump <= G2_RELATIVE_TOLERANCE);
  };
  if (allReached(state)) {
    const retry = [...failedNodes()].sort((a, b) => before[a]!.relativeJump - before[b]!.relativeJump);
    for (const i of retry) {
      const failed = failedNodes();
      failed.delete(i);
      const next = attempt(failed);
      if (!allReached(next)) continue;
      outcome.delete(i);
      state = next;
    }
  }
  const result = state.broken.length > 0 ? spans.slice() : state.spans;
  const faired: FittedContour = { nodes: nodes.slice(), spans: result };
  const after = joinCurvatures(faired);
  const joins = chosen.map((i) => ({ node: i, outcome: outcome.get(i) ?? (after[i]!.relativeJump <= G2_RELATIVE_TOLERANCE ? 'g2' : 'not-reached'), relativeJumpBefore: before[i]!.relativeJump, relativeJumpAfter: after[i]!.relativeJump }));
  return { contour: faired, joins };
}

/** One solve: the joins it made G2, the spans, and the spans it broke. */
interface Attempt {
  readonly active: readonly number[];
  readonly spans: readonly FitSpan[];
  readonly broken: readonly { span: number; excess: number }[];
}

/**
 * Spans the solve took outside the tolerance (or past their original error, where that
 * was already larger), or whose handles now cross or reach backwards; `excess` is the
 * error over the limit (Infinity for handles).
 */
function brokenSpans(original: readonly FitSpan[], result: readonly FitSpan[], tolerance: number): { span: number; excess: number }[] {
  const broken: { span: number; excess: number }[] = [];
  result.forEach((span, i) => {
    const before = original[i]!;
    if (span === before || span.segment.kind !== 'cubic' || before.segment.kind !== 'cubic') return;
    const limit = Math.max(tolerance, before.maxError);
    const handlesBad = (handlesCross(span.segment) && !handlesCross(before.segment)) || (handleReachesBackwards(span.segment) && !handleReachesBackwards(before.segment));
    const newInflection = inflectionParameters(span.segment).length > inflectionParameters(before.segment).length;
    if (handlesBad || newInflection) broken.push({ span: i, excess: Infinity });
    else if (span.maxError > limit) broken.push({ span: i, excess: span.maxError / limit });
    else {
      const growth = strainEnergy(span.segment) / strainEnergy(before.segment);
      if (growth > MAX_SPAN_STRAIN_GROWTH) broken.push({ span: i, excess: growth });
    }
  });
  return broken;
}

/**
 * The cubics next to joins the solve does not make G2 (failed or not chosen smooth
 * joins) whose curvature step it made larger than before: moving a far handle for
 * one join must not worsen its neighbour. `excess` is the growth of the step.
 */
function spansNextToWorsenedJoins(contour: FittedContour, result: readonly FitSpan[], active: readonly number[], before: readonly JoinCurvature[]): { span: number; excess: number }[] {
  const n = contour.nodes.length;
  const after = joinCurvatures({ nodes: contour.nodes, spans: result });
  const broken: { span: number; excess: number }[] = [];
  contour.nodes.forEach((node, i) => {
    if (!node.smooth || active.includes(i)) return;
    const was = Math.max(before[i]!.relativeJump, G2_RELATIVE_TOLERANCE);
    const now = after[i]!.relativeJump;
    if (!(now > was * (1 + WORSENED_STEP_SLACK))) return;
    for (const span of [(i - 1 + n) % n, i]) if (result[span] !== contour.spans[span]) broken.push({ span, excess: now / was });
  });
  return broken;
}

/** ∫κ² ds over one cubic, by Gauss–Legendre (curvature.ts gives κ, the speed |B′| gives ds). */
function strainEnergy(segment: CubicSegment): number {
  return integrateWithRule(
    (t) => {
      const k = curvature(segment, t);
      const d = derivative(segment, t);
      return Number.isFinite(k) ? k * k * Math.hypot(d.x, d.y) : 0;
    },
    0,
    1,
    STRAIN_RULE,
  );
}

/** True when attempt a is better than b: fewer broken spans, then a smaller worst excess, then more G2 joins. */
function better(a: Attempt, b: Attempt): boolean {
  if (a.broken.length !== b.broken.length) return a.broken.length < b.broken.length;
  const worstA = Math.max(0, ...a.broken.map((x) => x.excess));
  const worstB = Math.max(0, ...b.broken.map((x) => x.excess));
  return worstA < worstB;
}

function defaultChoice(contour: FittedContour, i: number): boolean {
  const { nodes, spans } = contour;
  const n = nodes.length;
  const node = nodes[i]!;
  return node.smooth && (spans[(i - 1 + n) % n]!.segment.kind === 'cubic' || spans[i]!.segment.kind === 'cubic');
}

function eligible(contour: FittedContour, unknowns: readonly (CubicUnknowns | undefined)[], i: number): boolean {
  const { nodes, spans } = contour;
  const n = nodes.length;
  const node = nodes[i]!;
  if (!node.smooth || !node.tangentIn || !node.tangentOut) return false;
  if (node.tangentIn.x !== node.tangentOut.x || node.tangentIn.y !== node.tangentOut.y) return false;
  const arriving = spans[(i - 1 + n) % n]!.segment.kind === 'cubic';
  const leaving = spans[i]!.segment.kind === 'cubic';
  if (!arriving && !leaving) return false;
  // Both handles of each adjacent cubic must have a length to vary.
  if (arriving && !unknowns[(i - 1 + n) % n]) return false;
  if (leaving && !unknowns[i]) return false;
  return true;
}

function cubicUnknowns(span: FitSpan, i: number, start: FitNode, end: FitNode): CubicUnknowns | undefined {
  const segment = span.segment;
  if (segment.kind !== 'cubic') return undefined;
  const { p0, p1, p2, p3 } = segment;
  const s0 = Math.hypot(p1.x - p0.x, p1.y - p0.y);
  const e0 = Math.hypot(p3.x - p2.x, p3.y - p2.y);
  const chord = Math.hypot(p3.x - p0.x, p3.y - p0.y);
  if (!(s0 > 0) || !(e0 > 0) || !(chord > 0)) return undefined;
  // The node's tangent where there is one (the fitter built the handle along it), else the handle's own direction.
  const d0 = start.tangentOut ?? { x: (p1.x - p0.x) / s0, y: (p1.y - p0.y) / s0 };
  const d1 = end.tangentIn ?? { x: (p3.x - p2.x) / e0, y: (p3.y - p2.y) / e0 };
  return { span: i, segment, first: span.first, last: span.last, d0, d1, s0, e0, minLength: MIN_HANDLE_SHARE * chord, chord };
}

function initialLengths(unknowns: readonly (CubicUnknowns | undefined)[]): Float64Array {
  const lengths = new Float64Array(2 * unknowns.length);
  unknowns.forEach((u, i) => {
    if (!u) return;
    lengths[2 * i] = u.s0;
    lengths[2 * i + 1] = u.e0;
  });
  return lengths;
}

function joinTerm(contour: FittedContour, unknowns: readonly (CubicUnknowns | undefined)[], curvatures: JoinCurvature, i: number): JoinTerm {
  const n = contour.nodes.length;
  const arriving = contour.spans[(i - 1 + n) % n]!.segment.kind === 'cubic' ? (i - 1 + n) % n : -1;
  const leaving = contour.spans[i]!.segment.kind === 'cubic' ? i : -1;
  const scale = curvatureScale(curvatures.kappaIn, curvatures.kappaOut, arriving >= 0 ? unknowns[arriving]!.segment : undefined, leaving >= 0 ? unknowns[leaving]!.segment : undefined);
  return { node: i, arriving, leaving, scale: scale > 0 ? scale : 1 };
}

/**
 * Which lengths may move: both handles of every cubic next to an active join, except
 * the handles sitting at a failed join (those keep their original lengths).
 */
function freeLengths(unknowns: readonly (CubicUnknowns | undefined)[], nodes: readonly FitNode[], active: ReadonlySet<number>, failed: ReadonlySet<number>): Uint8Array {
  const n = nodes.length;
  const free = new Uint8Array(2 * unknowns.length);
  unknowns.forEach((u, i) => {
    if (!u) return;
    const end = (i + 1) % n;
    if (!active.has(i) && !active.has(end)) return;
    if (!failed.has(i)) free[2 * i] = 1;
    if (!failed.has(end)) free[2 * i + 1] = 1;
  });
  return free;
}

/** The cubic with the given handle lengths; the original segment object when neither changed. */
function cubicWithLengths(u: CubicUnknowns, s: number, e: number): CubicSegment {
  if (s === u.s0 && e === u.e0) return u.segment;
  const { p0, p3, p1: q1, p2: q2 } = u.segment;
  const p1: Point = s === u.s0 ? q1 : { x: p0.x + s * u.d0.x, y: p0.y + s * u.d0.y };
  const p2: Point = e === u.e0 ? q2 : { x: p3.x - e * u.d1.x, y: p3.y - e * u.d1.y };
  return cubic(p0, p1, p2, p3);
}

function rebuiltSpans(chain: BoundaryChain, spans: readonly FitSpan[], unknowns: readonly (CubicUnknowns | undefined)[], lengths: Float64Array, tolerance: number): FitSpan[] {
  return spans.map((span, i) => {
    const u = unknowns[i];
    if (!u) return span;
    const segment = cubicWithLengths(u, lengths[2 * i]!, lengths[2 * i + 1]!);
    if (segment === u.segment) return span;
    return { ...span, segment, maxError: measureSpanError(chain, segment, span.first, span.last, tolerance) };
  });
}

/**
 * End curvatures of a cubic from its handle lengths (header formulas), with their
 * partial derivatives: [κ(0), ∂κ(0)/∂s, ∂κ(0)/∂e, κ(1), ∂κ(1)/∂s, ∂κ(1)/∂e].
 */
function endCurvatures(u: CubicUnknowns, s: number, e: number): [number, number, number, number, number, number] {
  const { p0, p3 } = u.segment;
  const cx = p3.x - p0.x;
  const cy = p3.y - p0.y;
  const k = u.d0.x * u.d1.y - u.d0.y * u.d1.x;
  const startCross = u.d0.x * cy - u.d0.y * cx;
  const endCross = cx * u.d1.y - cy * u.d1.x;
  const k0 = ((2 / 3) * (startCross - e * k)) / (s * s);
  const k1 = ((2 / 3) * (endCross - s * k)) / (e * e);
  return [k0, (-2 * k0) / s, ((-2 / 3) * k) / (s * s), k1, ((-2 / 3) * k) / (e * e), (-2 * k1) / e];
}

/** The data term of one cubic: F(s, e) = [s e]·M·[s e]ᵀ + 2·v·[s e] + c, summed squared distances at fixed parameters. */
interface DataTerm {
  m11: number;
  m12: number;
  m22: number;
  v1: number;
  v2: number;
  c: number;
}

/** Parameters of the span's chain points at their nearest points on the current cubic, and the resulting quadratic in (s, e). */
function dataTerm(chain: BoundaryChain, u: CubicUnknowns, s: number, e: number): DataTerm {
  const term: DataTerm = { m11: 0, m12: 0, m22: 0, v1: 0, v2: 0, c: 0 };
  const segment = cubicWithLengths(u, s, e);
  const { p0, p3 } = segment;
  const ox = chain.origin.x;
  const oy = chain.origin.y;
  for (let k = u.first; k <= u.last; k++) {
    const i = wrapIndex(chain, k);
    const px = chain.xs[i]! + ox;
    const py = chain.ys[i]! + oy;
    const t = nearestPoint(segment, { x: px, y: py }).t;
    const w = 1 - t;
    const b0 = w * w * w;
    const b1 = 3 * w * w * t;
    const b2 = 3 * w * t * t;
    const b3 = t * t * t;
    // B(t) − P = q + s·a + e·b.
    const qx = (b0 + b1) * p0.x + (b2 + b3) * p3.x - px;
    const qy = (b0 + b1) * p0.y + (b2 + b3) * p3.y - py;
    const ax = b1 * u.d0.x;
    const ay = b1 * u.d0.y;
    const bx = -b2 * u.d1.x;
    const by = -b2 * u.d1.y;
    term.m11 += ax * ax + ay * ay;
    term.m12 += ax * bx + ay * by;
    term.m22 += bx * bx + by * by;
    term.v1 += ax * qx + ay * qy;
    term.v2 += bx * qx + by * qy;
    term.c += qx * qx + qy * qy;
  }
  return term;
}

/**
 * Minimises the data term (plus a tiny pull to the original lengths) over the free
 * lengths subject to a zero curvature step at every join term, by sequential
 * quadratic programming: each step solves the KKT system of the quadratic data term
 * with the linearised constraints (Nocedal & Wright 2006, "Numerical Optimization",
 * §18.1), and a backtracking line search on the ℓ1 merit function D + μ·Σ|step|
 * (§15.4, μ above the largest multiplier) keeps it from overshooting. The parameters
 * of the chain points are refreshed from the nearest points between rounds, as in
 * Schneider's alternation. Returns all lengths (fixed ones at their original values).
 */
function solve(chain: BoundaryChain, unknowns: readonly (CubicUnknowns | undefined)[], terms: readonly JoinTerm[], free: Uint8Array, tolerance: number, firstTerms: Map<number, DataTerm>): Float64Array {
  const x = initialLengths(unknowns);
  const index: number[] = [];
  free.forEach((f, k) => {
    if (f) index.push(k);
  });
  const size = index.length;
  if (size === 0) return x;
  const position = new Int32Array(free.length).fill(-1);
  index.forEach((k, p) => (position[k] = p));
  const original = x.slice();
  const inverseTolerance2 = 1 / (tolerance * tolerance);
  const spanIndices = [...new Set(index.map((k) => k >> 1))];
  const constraints = terms.length;
  const total = size + constraints;

  for (let round = 0; round < PARAMETER_ROUNDS; round++) {
    const data = new Map<number, DataTerm>();
    for (const i of spanIndices) {
      // The first round starts from the original lengths in every attempt: computed once.
      let term = round === 0 ? firstTerms.get(i) : undefined;
      if (!term) term = dataTerm(chain, unknowns[i]!, x[2 * i]!, x[2 * i + 1]!);
      if (round === 0) firstTerms.set(i, term);
      data.set(i, term);
    }
    const dataValue = (lengths: Float64Array): number => {
      let sum = 0;
      for (const [i, d] of data) {
        const s = lengths[2 * i]!;
        const e = lengths[2 * i + 1]!;
        sum += (d.m11 * s * s + 2 * d.m12 * s * e + d.m22 * e * e + 2 * (d.v1 * s + d.v2 * e) + d.c) * inverseTolerance2;
      }
      for (const k of index) {
        const dk = (lengths[k]! - original[k]!) / unknowns[k >> 1]!.chord;
        sum += ORIGINAL_LENGTH_WEIGHT * dk * dk;
      }
      return sum;
    };
    const violation = (lengths: Float64Array): number => {
      let sum = 0;
      for (const t of terms) sum += Math.abs(stepResidual(unknowns, t, lengths));
      return sum;
    };
    for (let step = 0; step < MAX_SOLVER_STEPS; step++) {
      // KKT system [H Jᵀ; J −εI][δ; λ] = [−g; −r], row-major.
      const kkt = new Float64Array(total * total);
      const rhs = new Float64Array(total);
      for (const [i, d] of data) {
        const ps = position[2 * i]!;
        const pe = position[2 * i + 1]!;
        const s = x[2 * i]!;
        const e = x[2 * i + 1]!;
        if (ps >= 0) {
          rhs[ps]! -= 2 * (d.m11 * s + d.m12 * e + d.v1) * inverseTolerance2;
          kkt[ps * total + ps]! += 2 * d.m11 * inverseTolerance2;
        }
        if (pe >= 0) {
          rhs[pe]! -= 2 * (d.m12 * s + d.m22 * e + d.v2) * inverseTolerance2;
          kkt[pe * total + pe]! += 2 * d.m22 * inverseTolerance2;
        }
        if (ps >= 0 && pe >= 0) {
          kkt[ps * total + pe]! += 2 * d.m12 * inverseTolerance2;
          kkt[pe * total + ps]! += 2 * d.m12 * inverseTolerance2;
        }
      }
      for (const k of index) {
        const p = position[k]!;
        const chord2 = unknowns[k >> 1]!.chord ** 2;
        rhs[p]! -= (2 * ORIGINAL_LENGTH_WEIGHT * (x[k]! - original[k]!)) / chord2;
        kkt[p * total + p]! += (2 * ORIGINAL_LENGTH_WEIGHT) / chord2;
      }
      let largestResidual = 0;
      for (let c = 0; c < constraints; c++) {
        const t = terms[c]!;
        const row = size + c;
        const { residual, partials } = stepResidualWithPartials(unknowns, t, x);
        largestResidual = Math.max(largestResidual, Math.abs(residual));
        rhs[row] = -residual;
        for (const [k, dk] of partials) {
          const p = position[k]!;
          if (p < 0) continue;
          kkt[row * total + p] = dk;
          kkt[p * total + row] = dk;
        }
        kkt[row * total + row] = -CONSTRAINT_SOFTENING;
      }
      const solution = solveDense(kkt, rhs, total);
      if (!solution) break;
      let largestMultiplier = 0;
      for (let c = 0; c < constraints; c++) largestMultiplier = Math.max(largestMultiplier, Math.abs(solution[size + c]!));
      const meritWeight = MERIT_MULTIPLIER_FACTOR * largestMultiplier + 1;
      const merit = (lengths: Float64Array): number => dataValue(lengths) + meritWeight * violation(lengths);
      const current = merit(x);
      let fraction = 1;
      let moved = 0;
      let accepted = false;
      for (let halving = 0; halving < MAX_STEP_HALVINGS; halving++, fraction /= 2) {
        const trial = x.slice();
        moved = 0;
        for (let p = 0; p < size; p++) {
          const k = index[p]!;
          const u = unknowns[k >> 1]!;
          trial[k] = Math.max(u.minLength, x[k]! + fraction * solution[p]!);
          moved = Math.max(moved, Math.abs(trial[k]! - x[k]!) / u.chord);
        }
        if (merit(trial) <= current) {
          x.set(trial);
          accepted = true;
          break;
        }
      }
      if (!accepted || (moved < STEP_CONVERGED_SHARE && largestResidual < STEP_CONVERGED_SHARE)) break;
    }
  }
  return x;
}

/** (κ_in − κ_out)/scale at a join for the given lengths. */
function stepResidual(unknowns: readonly (CubicUnknowns | undefined)[], t: JoinTerm, lengths: Float64Array): number {
  return stepResidualWithPartials(unknowns, t, lengths).residual;
}

function stepResidualWithPartials(unknowns: readonly (CubicUnknowns | undefined)[], t: JoinTerm, lengths: Float64Array): { residual: number; partials: Map<number, number> } {
  const partials = new Map<number, number>();
  let kappaIn = 0;
  let kappaOut = 0;
  if (t.arriving >= 0) {
    const i = t.arriving;
    const c = endCurvatures(unknowns[i]!, lengths[2 * i]!, lengths[2 * i + 1]!);
    kappaIn = c[3];
    addPartial(partials, 2 * i, c[4] / t.scale);
    addPartial(partials, 2 * i + 1, c[5] / t.scale);
  }
  if (t.leaving >= 0) {
    const i = t.leaving;
    const c = endCurvatures(unknowns[i]!, lengths[2 * i]!, lengths[2 * i + 1]!);
    kappaOut = c[0];
    addPartial(partials, 2 * i, -c[1] / t.scale);
    addPartial(partials, 2 * i + 1, -c[2] / t.scale);
  }
  return { residual: (kappaIn - kappaOut) / t.scale, partials };
}

function addPartial(partials: Map<number, number>, k: number, value: number): void {
  partials.set(k, (partials.get(k) ?? 0) + value);
}

/** Gaussian elimination with partial pivoting on a dense row-major n × n system; undefined when singular. */
function solveDense(matrix: Float64Array, rhs: Float64Array, n: number): Float64Array | undefined {
  const a = matrix.slice();
  const b = rhs.slice();
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(a[row * n + col]!) > Math.abs(a[pivot * n + col]!)) pivot = row;
    const value = a[pivot * n + col]!;
    if (!(Math.abs(value) > 0) || !Number.isFinite(value)) return undefined;
    if (pivot !== col) {
      for (let k = 0; k < n; k++) {
        const tmp = a[col * n + k]!;
        a[col * n + k] = a[pivot * n + k]!;
        a[pivot * n + k] = tmp;
      }
      const tmp = b[col]!;
      b[col] = b[pivot]!;
      b[pivot] = tmp;
    }
    for (let row = col + 1; row < n; row++) {
      const f = a[row * n + col]! / a[col * n + col]!;
      if (f === 0) continue;
      for (let k = col; k < n; k++) a[row * n + k]! -= f * a[col * n + k]!;
      b[row]! -= f * b[col]!;
    }
  }
  const x = new Float64Array(n);
  for (let row = n - 1; row >= 0; row--) {
    let sum = b[row]!;
    for (let k = row + 1; k < n; k++) sum -= a[row * n + k]! * x[k]!;
    x[row] = sum / a[row * n + row]!;
  }
  return x;
}
