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
 * bisection on that integral, tabulated once per degree of opening and interpolated; the
 * table is written out below (computing it costs about a third of a second, which every
 * worker and command-line run would pay), and the tests recompute it from the integral.
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

export function insetByBisection(opening: number): number {
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

/**
 * g at openings 0°, 1°, …, 180° (entry 0 repeats entry 1), from insetByBisection
 * (test/fit/blurred-wedge.test.ts recomputes every entry).
 */
export const BLURRED_WEDGE_INSET_TABLE: readonly number[] = [
  29.999999999986358, 29.999999999986358, 29.999999999986358, 25.766553926127926, 19.326632585730295, 15.463072522020411,
  12.88769325366502, 11.048417461511235, 9.66920651223063, 8.596705632894555, 7.738901980897026, 7.037241948241899,
  6.452689813945653, 5.958220864272334, 5.534531745383902, 5.167466664393032, 4.846408726457412, 4.563238945406738,
  4.311642104316888, 4.086631648119692, 3.8842169740792087, 3.7011657333505354, 3.5348310141989714, 3.3830237460779244,
  3.2439171853866355, 3.1159745090872093, 2.99789327387316, 2.8885623288215356, 2.787028024972642, 2.692467438314452,
  2.6041669391224787, 2.521504879046006, 2.4439374832627436, 2.370987262415838, 2.302233425129998, 2.2373038935393197,
  2.1758686147359185, 2.1176339277326406, 2.0623377965830514, 2.009745758691679, 1.9596474675518039, 1.9118537312215267,
  1.866193967275649, 1.8225140082586222, 1.7806742038601442, 1.7405477747388431, 1.7020193807775286, 1.6649838726925736,
  1.6293452004219944, 1.5950154565189223, 1.5619140358330696, 1.529966895382131, 1.4991059013436825, 1.469268251489666,
  1.4403959631317775, 1.412435418556015, 1.3853369601974919, 1.3590545299621226, 1.3335453466379477, 1.3087696175216479,
  1.2846902794854032, 1.2612727665373313, 1.2384848007104665, 1.216296203388083, 1.1946787250735724, 1.1736058914220848,
  1.153052863760422, 1.1329963124853748, 1.1134143023036813, 1.0942861874309529, 1.075592516422148, 1.0573149452147845,
  1.0394361575936273, 1.021939792694866, 1.0048103782673934, 0.9880332697457561, 0.9715945940433812, 0.9554811982025058,
  0.9396806017275594, 0.9241809530112732, 0.9089709890076847, 0.8940399978246205, 0.8793777844266515, 0.864974638793683,
  0.8508213061804781, 0.8369089599682411, 0.8232291761260058, 0.8097739095819634, 0.7965354722864504, 0.7835065128301721,
  0.7706799972356748, 0.7580491913859078, 0.7456076442713311, 0.7333491726831198, 0.7212678465612044, 0.7093579755974133,
  0.6976140964661681, 0.6860309609828619, 0.6746035249170745, 0.663326937678903, 0.6521965323327095, 0.6412078164021295,
  0.6303564633026326, 0.6196383040742148, 0.6090493197416436, 0.5985856340294049, 0.5882435065132086, 0.5780193263171896,
  0.5679096058111099, 0.5579109750442512, 0.5480201761793069, 0.5382340584446865, 0.5285495732232448, 0.5189637694138582,
  0.5094737891204204, 0.5000768635591157, 0.49077030893840856, 0.4815515229392986, 0.4724179810591522, 0.4633672332556671,
  0.45439690083640016, 0.4455046732664414, 0.4366883054126447, 0.4279456146787197, 0.41927447844045673, 0.4106728315628061,
  0.40213866386238806, 0.3936700180338448, 0.3852649873306291, 0.37692171349135606, 0.3686383848571495, 0.36041323429799377,
  0.3522445375483585, 0.3441306114063991, 0.336069811987727, 0.3280605333065978, 0.32010120552968147, 0.31219029366639006,
  0.3043262960682114, 0.2965077431190366, 0.28873319584363344, 0.2810012447889676, 0.27331050865996076, 0.2656596333372363,
  0.25804729059473175, 0.25047217703559, 0.24293301319175953, 0.23542854235074628, 0.22795752968249872, 0.2205187612298687,
  0.21311104311735107, 0.20573320048697497, 0.19838407689803716, 0.19106253318113886, 0.1837674469470585, 0.17649771152264293,
  0.16925223543239554, 0.1620299415799309, 0.15482976672956283, 0.14765066087875311, 0.14049158603029355, 0.13335151504634268,
  0.12622943006590504, 0.1191243231869521, 0.11203520050457882, 0.10496108789538994, 0.09790102714305249, 0.09085404390589247,
  0.08381909516629094, 0.07679508876663022, 0.06978114280627778, 0.06277700037117029, 0.05578256511853397, 0.048794987965266046,
  0.041806608746810525, 0.03481910927348508, 0.027871804190908733, 0.02097061073527584, 0.013762831026724598, 0.006928804746166861,
  0.0,
];

/**
 * g(opening): the traced tip's distance inside the sharp corner, in units of the blur σ,
 * for an opening in radians (0 < opening ≤ π). Openings of under a degree get the
 * one-degree value.
 */
export function blurredWedgeInset(opening: number): number {
  const table = BLURRED_WEDGE_INSET_TABLE;
  const degrees = Math.min(180, Math.max(TABLE_STEP_DEGREES, (opening * 180) / Math.PI)) / TABLE_STEP_DEGREES;
  const i = Math.min(table.length - 2, Math.floor(degrees));
  const f = degrees - i;
  return table[i]! * (1 - f) + table[i + 1]! * f;
}
