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
 * bisection on that integral, tabulated once per degree of opening and interpolated.
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

/** Blurred ink coverage at distance `t` (in σ) inside the apex of a wedge of `opening` radians, on its bisector. */
export function wedgeCoverage(t: number, opening: number): number {
  const h = opening / 2;
  const sides = [
    { x: Math.cos(h), y: Math.sin(h) },
    { x: Math.cos(h), y: -Math.sin(h) },
  ];
  let mass = 0;
  for (let k = 0; k < RAY_SAMPLES; k++) {
    const phi = ((k + 0.5) / RAY_SAMPLES) * 2 * Math.PI;
    const dx = Math.cos(phi);
    const dy = Math.sin(phi);
    let exit = Infinity;
    for (const a of sides) {
      // The ray (t, 0) + r·d meets the side's line λ·a where cross((t,0) + r·d, a) = 0.
      const across = a.x * dy - a.y * dx;
      if (Math.abs(across) < 1e-15) continue;
      const r = (t * a.y) / across;
      if (!(r > 0)) continue;
      const lambda = (t + r * dx) * a.x + r * dy * a.y;
      if (lambda >= 0 && r < exit) exit = r;
    }
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

let table: Float64Array | undefined;

/**
 * g(opening): the traced tip's distance inside the sharp corner, in units of the blur σ,
 * for an opening in radians (0 < opening ≤ π). Openings of under a degree get the
 * one-degree value.
 */
export function blurredWedgeInset(opening: number): number {
  if (!table) {
    const entries = Math.round(180 / TABLE_STEP_DEGREES) + 1;
    table = new Float64Array(entries);
    for (let i = 1; i < entries; i++) table[i] = insetByBisection((i * TABLE_STEP_DEGREES * Math.PI) / 180);
    table[0] = table[1]!;
  }
  const degrees = Math.min(180, Math.max(TABLE_STEP_DEGREES, (opening * 180) / Math.PI)) / TABLE_STEP_DEGREES;
  const i = Math.min(table.length - 2, Math.floor(degrees));
  const f = degrees - i;
  return table[i]! * (1 - f) + table[i + 1]! * f;
}
