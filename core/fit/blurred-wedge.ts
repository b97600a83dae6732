/**
 * How far a blurred corner's traced tip lies inside the sharp corner.
 *
 * A sharp wedge of ink with opening θ, blurred by an isotropic Gaussian of standard
 * deviation σ and traced at the half-way grey level, has its traced tip on the
 * bisector where the blurred ink coverage falls to one half: a distance σ·g(θ) inside
 * the apex, with g independent of σ (the blur is scale-free). The coverage at a point
 * inside a convex region is the Gaussian's probability mass over the region; seen from
 * the point, each ray leaves the region once, at distance R(φ), and the mass is
 * (1/2π)∫(1 − exp(−R(φ)²/2σ²)) dφ (the radial law of the two-dimensional normal
 * distribution, whose distance from the centre is Rayleigh-distributed). g is found by
 * bisection on that integral, tabulated per degree of opening (each degree when first
 * needed) and interpolated.
 *
 * Values (for reference; the test recomputes them by sampling): g(90°) ≈ 0.77,
 * g(60°) ≈ 1.29, g(30°) ≈ 2.60, g(180°) = 0 (a straight edge is not moved).
 */

/** Directions sampled round the point when integrating the coverage. */
const RAY_SAMPLES = 720;
/** Bisection steps on the inset (in σ): 2⁻⁴⁰ of the bracket, far below any use. */
const BISECTION_STEPS = 40;
/** Largest inset searched, in σ: beyond it the tip is no corner a letter has (openings under about 5°). */
const MAX_INSET_SIGMAS = 30;
/** Table step, degrees of opening. */
const TABLE_STEP_DEGREES = 1;

let rayDirections: { readonly xs: Float64Array; readonly ys: Float64Array } | undefined;

/** The unit directions of the RAY_SAMPLES rays, computed once. */
function rays(): { readonly xs: Float64Array; readonly ys: Float64Array } {
  if (!rayDirections) {
    const xs = new Float64Array(RAY_SAMPLES);
    const ys = new Float64Array(RAY_SAMPLES);
    for (let k = 0; k < RAY_SAMPLES; k++) {
      const phi = ((k + 0.5) / RAY_SAMPLES) * 2 * Math.PI;
      xs[k] = Math.cos(phi);
      ys[k] = Math.sin(phi);
    }
    rayDirections = { xs, ys };
  }
  return rayDirections;
}

/**
 * Where the ray (t, 0) + r·d leaves the wedge side along the unit direction (ax, ay)
 * from the apex: the smallest r > 0 with cross((t,0) + r·d, a) = 0 on the side's
 * half-line (λ ≥ 0), or `exit` when that is nearer or there is none.
 */
function exitThroughSide(t: number, dx: number, dy: number, ax: number, ay: number, exit: number): number {
  const across = ax * dy - ay * dx;
  if (Math.abs(across) < 1e-15) return exit;
  const r = (t * ay) / across;
  if (!(r > 0)) return exit;
  const lambda = (t + r * dx) * ax + r * dy * ay;
  return lambda >= 0 && r < exit ? r : exit;
}

/** Blurred ink coverage at distance `t` (in σ) inside the apex of a wedge of `opening` radians, on its bisector. */
export function wedgeCoverage(t: number, opening: number): number {
  const h = opening / 2;
  // The wedge's two sides, as unit directions from the apex: (cos h, ±sin h).
  const sideX = Math.cos(h);
  const upperY = Math.sin(h);
  const lowerY = -Math.sin(h);
  const { xs, ys } = rays();
  let mass = 0;
  for (let k = 0; k < RAY_SAMPLES; k++) {
    const dx = xs[k]!;
    const dy = ys[k]!;
    const exit = exitThroughSide(t, dx, dy, sideX, lowerY, exitThroughSide(t, dx, dy, sideX, upperY, Infinity));
    mass += exit === Infinity ? 1 : 1 - Math.exp(-(exit * exit) / 2);
  }
  return mass / RAY_SAMPLES;
}

function insetByBisection(opening: number): number {
  if (opening >= Math.PI) return 0;
  let low = 0;
  let high = MAX_INSET_SIGMAS;
  for (let step = 0; step < BISECTION_STEPS; step++) {
    const middle = (low + high) / 2;
    if (wedgeCoverage(middle, opening) < 0.5) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}

/** Entries of the table, one per TABLE_STEP_DEGREES from 0° to 180°. */
const TABLE_ENTRIES = Math.round(180 / TABLE_STEP_DEGREES) + 1;
/** g per degree of opening, each entry computed the first time it is needed (NaN until then): a glyph meets a few dozen openings, not all 181. */
const table = new Float64Array(TABLE_ENTRIES).fill(Number.NaN);

/** The table's entry `i` (entry 0 is entry 1: openings under a degree get the one-degree value). */
function tableEntry(i: number): number {
  const entry = i === 0 ? 1 : i;
  let value = table[entry]!;
  if (Number.isNaN(value)) {
    value = insetByBisection((entry * TABLE_STEP_DEGREES * Math.PI) / 180);
    table[entry] = value;
  }
  return value;
}

/**
 * g(opening): the traced tip's distance inside the sharp corner, in units of the blur σ,
 * for an opening in radians (0 < opening ≤ π). Openings of under a degree get the
 * one-degree value.
 */
export function blurredWedgeInset(opening: number): number {
  const degrees = Math.min(180, Math.max(TABLE_STEP_DEGREES, (opening * 180) / Math.PI)) / TABLE_STEP_DEGREES;
  const i = Math.min(TABLE_ENTRIES - 2, Math.floor(degrees));
  const f = degrees - i;
  return tableEntry(i) * (1 - f) + tableEntry(i + 1) * f;
}
