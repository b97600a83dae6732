// THE ROUND TRIP, the measure of the product: glyphs of two professionally drawn
// fonts are rendered by an independent rasterizer, traced, fitted and compared with
// the fonts' own outlines (round-trip-measure.ts). This suite runs a representative
// subset — round and straight letters, serifs, bowls, an S, digits — for both fonts
// and all three variants, prints the figures, and fails if quality regresses; the
// whole A–Z a–z 0–9 set is measured by measureRoundTrip from the benchmark runner.
//
// Targets (the product's quality goals): Hausdorff p95 ≤ 2 units clean and ≤ 4 rough; on-curve
// points ≤ 1.15× the font's own; no extremum inside a segment sticking out more than
// 0.5 unit; corner recall ≥ 0.95 and precision ≥ 0.9; no kinks; contour counts equal;
// winding correct. Thresholds below sit just outside the measured figures (stated
// beside each), so that a regression fails; where a target is not met, the threshold
// says so and the README states the measured figure.

import { beforeAll, describe, expect, it } from 'vitest';
import { CANTARELL, LIBERTINE, describeWithFont, type ReferenceFont } from '../raster/require-font.ts';
import { contourSegments } from '../../core/outline/index.ts';
import { measureRoundTrip, measureRoundTripGlyph, summaryTable, type GlyphMeasurement, type RoundTripFont, type VariantSummary } from './round-trip-measure.ts';
import { MIN_TOLERANCE_PIXELS } from '../../core/pipeline/index.ts';

const SUBSET = 'aegnosBHRS28';
/** The variants held to thresholds here; the 1-bit copy is checked in test/raster/bilevel-smoothing.test.ts and measured in full by the benchmark. */
const SUBSET_VARIANTS = ['clean 1 px/unit', 'clean 0.5 px/unit', 'rough 1 px/unit'] as const;
type SubsetVariant = (typeof SUBSET_VARIANTS)[number];

interface Thresholds {
  /** Per variant: Hausdorff p95 limit (units). */
  readonly hausdorffP95: Record<SubsetVariant, number>;
  /** Per variant: on-curve ratio limit. */
  readonly onCurveRatio: Record<SubsetVariant, number>;
  readonly cornerRecall: number;
  readonly cornerPrecision: number;
  /** Kinks allowed over the subset (target 0). */
  readonly kinks: number;
  /** Extrema inside segments allowed over the subset (target 0). */
  readonly extremaInside: number;
}

const THRESHOLDS: Record<RoundTripFont, Thresholds> = {
  'Cantarell Regular': {
    // Measured (subset): p95 1.00 / 1.58 / 1.10; targets 2 / 2 / 4.
    hausdorffP95: { 'clean 1 px/unit': 1.5, 'clean 0.5 px/unit': 2, 'rough 1 px/unit': 2 },
    // Measured: 0.99 / 0.99 / 0.99; target 1.15.
    onCurveRatio: { 'clean 1 px/unit': 1.15, 'clean 0.5 px/unit': 1.15, 'rough 1 px/unit': 1.15 },
    // Measured: recall 1 / 1 / 0.987, precision 1 / 1 / 1.
    cornerRecall: 0.95,
    cornerPrecision: 0.9,
    // Measured: 0 kinks, 0 extrema over 36 glyph fits; target 0.
    kinks: 1,
    extremaInside: 1,
  },
  'Linux Libertine Regular': {
    // Measured (subset): p95 2.00 / 2.38 / 1.55. Not met at 0.5 px/unit (target 2): a's
    // and e's thin hairline joins are a pixel across there.
    hausdorffP95: { 'clean 1 px/unit': 2.5, 'clean 0.5 px/unit': 3, 'rough 1 px/unit': 2.5 },
    // Measured: 1.03 / 0.95 / 1.05; target 1.15. Libertine leaves x-extrema out of its
    // serif end faces; the fitter puts a point there, as the extremum rule requires.
    onCurveRatio: { 'clean 1 px/unit': 1.15, 'clean 0.5 px/unit': 1.15, 'rough 1 px/unit': 1.2 },
    // Measured (subset): recall 0.988 / 0.988 / 0.988, precision 0.988 / 0.988 / 0.976.
    cornerRecall: 0.95,
    cornerPrecision: 0.93,
    // Measured: 2 kinks (where e's bar, a sloped line, meets its bowl: no handle on the
    // line's direction fits, even with the join slid along the line) and 0 extrema over
    // 36 glyph fits; target 0.
    kinks: 3,
    extremaInside: 1,
  },
};

function roundTripSuite(font: ReferenceFont & { label: RoundTripFont }): void {
  describeWithFont(`round trip of ${font.label}: render → trace → fit → compare with the font`, font, () => {
    let summaries: readonly VariantSummary[] = [];
    beforeAll(() => {
      summaries = measureRoundTrip({ fonts: [font.label], glyphs: SUBSET, variants: SUBSET_VARIANTS }).summaries;
      console.table(summaryTable(summaries));
    }, 180_000);
    const limits = THRESHOLDS[font.label];

    it('follows the font outline closely (Hausdorff p95 per variant)', () => {
      // Reference: the font's own outline (opentype.js glyph.path.commands).
      for (const s of summaries) expect(s.hausdorffP95, s.variant).toBeLessThanOrEqual(limits.hausdorffP95[s.variant as SubsetVariant]);
    });

    it('uses about as few on-curve points as the type designer did', () => {
      // Reference: on-curve points of the font's own contours.
      for (const s of summaries) expect(s.onCurveRatio, s.variant).toBeLessThanOrEqual(limits.onCurveRatio[s.variant as SubsetVariant]);
    });

    it('keeps the designer\'s corners sharp and invents almost none (tangent turn > 20° within 4 units)', () => {
      // Reference: the font's on-curve points whose tangent turns more than 20°.
      for (const s of summaries) {
        expect(s.cornerRecall, s.variant).toBeGreaterThanOrEqual(limits.cornerRecall);
        expect(s.cornerPrecision, s.variant).toBeGreaterThanOrEqual(limits.cornerPrecision);
      }
    });

    it('puts points at extrema and leaves no near-miss kinks', () => {
      const extrema = summaries.reduce((t, s) => t + s.extremaInside, 0);
      const kinks = summaries.reduce((t, s) => t + s.kinks, 0);
      expect(extrema).toBeLessThanOrEqual(limits.extremaInside);
      expect(kinks).toBeLessThanOrEqual(limits.kinks);
    });

    it('has the font\'s contour count and winding in every glyph', () => {
      // Reference: the font's contours (one per moveto) and their filled area.
      for (const s of summaries) {
        expect(s.contourMismatches, s.variant).toBe(0);
        expect(s.windingErrors, s.variant).toBe(0);
      }
    });
  });
}

describeWithFont('shallow curves and stems of Linux Libertine', LIBERTINE, () => {
  let glyphs: readonly GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = measureRoundTrip({ fonts: ['Linux Libertine Regular'], glyphs: 'IZ', variants: ['clean 1 px/unit'] }).glyphs;
  }, 60_000);

  it('draws the cupped serif feet of I as curves and its stem as two exact vertical lines', () => {
    const letterI = glyphs.find((g) => g.character === 'I')!;
    // Reference: the font's own I has 14 on-curve points; its four serif end faces bulge
    // about 4 units with the x-extremum inside the segment, where the fitter must add a
    // point (the extremum rule), so 18 is the count a designer following that rule gets.
    expect(letterI.onCurve).toBeLessThanOrEqual(letterI.fontOnCurve + 4);
    const verticals = letterI.outline.contours.flatMap((c) => contourSegments(c)).filter((s) => s.kind === 'line' && s.p0.x === s.p1.x && Math.abs(s.p1.y - s.p0.y) >= 300);
    expect(verticals).toHaveLength(2);
    expect(letterI.kinks).toBe(0);
  });

  it('fits the gently bowed diagonal of Z without polygon pieces or kinks', () => {
    const letterZ = glyphs.find((g) => g.character === 'Z')!;
    // Reference: the font's Z (24 on-curve points); measured 26 and no kinks.
    expect(letterZ.onCurve).toBeLessThanOrEqual(Math.ceil(1.15 * letterZ.fontOnCurve));
    expect(letterZ.kinks).toBe(0);
  });
});

describe('glyph round trip through the fitter', () => {
  roundTripSuite({ ...CANTARELL, label: 'Cantarell Regular' });
  roundTripSuite({ ...LIBERTINE, label: 'Linux Libertine Regular' });
});

describeWithFont('drawn roundings of Linux Libertine on a sharp scan at 0.5 px per unit', LIBERTINE, () => {
  let glyphs: readonly GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = measureRoundTrip({ fonts: ['Linux Libertine Regular'], glyphs: 'Amn', variants: ['clean 0.5 px/unit'] }).glyphs;
  }, 60_000);

  it('keeps the flat top of A and the rounded crotches of m and n instead of sharpening them', () => {
    // Reference: the font's outlines. With the corner reach of a moderately blurred scan
    // (no blur figure), A's apex was drawn to a point 8 units above the font's flat top and
    // m's crotch cut 6 units deep; with the scan's measured blur (≈ 0.55 px) they are
    // followed: measured 3.4 / 2.5 / 3.1 units.
    for (const g of glyphs) {
      expect(g.edgeBlurPx, g.character).not.toBeNull();
      expect(g.hausdorff, g.character).toBeLessThanOrEqual(4.5);
    }
  });
});

describeWithFont('near-vertical stems of Linux Libertine on the rough scan', LIBERTINE, () => {
  let glyphs: readonly GlyphMeasurement[] = [];
  beforeAll(() => {
    // The same rough copies as in the full round trip (each glyph's seed is its place in it).
    glyphs = [...'jkr'].map((c) => measureRoundTripGlyph('Linux Libertine Regular', c, 'rough 1 px/unit'));
  }, 60_000);

  it('leaves no extremum inside the gently bowed stems after rounding to the grid', () => {
    // Reference: the extremum rule (an x/y extremum sticking out more than 0.5 unit is an
    // on-curve point). The stems of j and r fit as one shallow cubic between smooth
    // joins; rounding their handles on their own made the bow stick out 0.65 units. The
    // inner side of k's stem leaned 1.9° at its join, and the join's sloped handles bowed
    // the stem 0.69 unit; a join that close to vertical now gets vertical handles.
    for (const g of glyphs) expect(g.extremaInside, g.character).toBe(0);
  });
});

describeWithFont('the serif tops of Linux Libertine y on the rough scan', LIBERTINE, () => {
  let glyph: GlyphMeasurement | undefined;
  beforeAll(() => {
    glyph = measureRoundTripGlyph('Linux Libertine Regular', 'y', 'rough 1 px/unit');
  }, 60_000);

  it('keeps the long flat top of a serif free of an extremum after rounding to the grid', () => {
    // Reference: the font's own y, whose serif tops fall gently from their outer corners
    // (no extremum inside them), and the extremum rule (an x/y extremum sticking out more
    // than 0.5 unit is an on-curve point). The blurred outer corner of the left serif is
    // fitted as a curve 3 units long, smooth with the 80-unit top; rounding that join
    // chose exactly collinear handles at 18° (the short curve's handle is a unit long, so
    // few grid directions are near), and the top bowed 1.12 units above its ends. A join
    // whose rounding would give a span an extremum its unrounded self had not is now
    // rounded otherwise where the tolerance allows: here with horizontal handles.
    expect(glyph!.extremaInside).toBe(0);
    expect(glyph!.hausdorff).toBeLessThanOrEqual(2);
  });
});

describeWithFont('drawn crotches and brackets of Linux Libertine on the rough scan', LIBERTINE, () => {
  let glyphs: readonly GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = [...'bdxz'].map((c) => measureRoundTripGlyph('Linux Libertine Regular', c, 'rough 1 px/unit'));
  }, 60_000);

  it('leaves rounds a few pixels across to the curve fit instead of putting corners in them', () => {
    // Reference: the font's own corners (tangent turn > 20°, matched within 4 units).
    // The crotches of x and the brackets of b, d and z are rounds a few units across;
    // their sides, fitted half in the round and half on the straight, turned by 35–67°
    // and the detector put a corner at each apex: 17 corners the font does not have in
    // these four letters. A candidate whose sides both still curl its way beyond the
    // rounded tip is now a drawn round: measured 7, with the same 4 corners missed.
    const fitted = glyphs.reduce((n, g) => n + g.fittedCorners, 0);
    const precise = glyphs.reduce((n, g) => n + g.preciseCorners, 0);
    const recalled = glyphs.reduce((n, g) => n + g.recalledCorners, 0);
    const font = glyphs.reduce((n, g) => n + g.fontCorners, 0);
    expect(fitted - precise).toBeLessThanOrEqual(11);
    // And no true corner lost: the 4 of 38 missed are missed with or without the rule.
    expect(font - recalled).toBeLessThanOrEqual(4);
  });
});

describeWithFont('the serif corners of Linux Libertine P on a 1-bit scan', LIBERTINE, () => {
  let glyph: GlyphMeasurement | undefined;
  beforeAll(() => {
    glyph = measureRoundTripGlyph('Linux Libertine Regular', 'P', '1-bit 1 px/unit');
  }, 60_000);

  it('keeps every corner the font has, though the staircase curls their sides', () => {
    // Reference: the font's own corners (tangent turn > 20°). The pixel staircase of a
    // 1-bit scan, smoothed, still wiggles along the sides of the serifs' corners by
    // 12–20° over 4 px, as much as a drawn round curls; with the curl test held to the
    // 12° of a grey scan, three of P's serif corners were taken for rounds. The least
    // curl now also exceeds 3 standard deviations of what the scan's noise gives.
    expect(glyph!.recalledCorners).toBe(glyph!.fontCorners);
  });
});

describeWithFont('Linux Libertine e at the tightest tolerance the pipeline allows', LIBERTINE, () => {
  let glyph: GlyphMeasurement | undefined;
  beforeAll(() => {
    glyph = measureRoundTripGlyph('Linux Libertine Regular', 'e', 'clean 1 px/unit', { tolerance: MIN_TOLERANCE_PIXELS });
  }, 60_000);

  it('fits it within 2 units of the font\'s own outline, with its contours and winding', () => {
    // Reference: the font's own e. At 0.75 unit the fit of the outer contour is retried
    // at 0.375 unit to leave room for rounding, and there the one-pixel stretch between
    // the two lines of the crossbar got a handle 6·10⁸ units long: rounding that contour
    // to the grid ran out of memory. Now the handle is a fallback third of the chord.
    expect(glyph!.hausdorff).toBeLessThanOrEqual(2);
    expect(glyph!.contours).toBe(glyph!.fontContours);
    expect(glyph!.windingCorrect).toBe(true);
  });
});

describeWithFont('the right stem of Linux Libertine M', LIBERTINE, () => {
  let glyph: GlyphMeasurement | undefined;
  beforeAll(() => {
    glyph = measureRoundTripGlyph('Linux Libertine Regular', 'M', 'clean 1 px/unit');
  }, 60_000);

  it('is one straight line, not two with a tiny curve and two kinks between them', () => {
    // Reference: the font's M draws its right stem, leaning 4° from the vertical, as one
    // line of 422 units from (738.1, 121) to (708.3, 542) between the serif brackets. The
    // line search stopped short of the union of its two halves (a drift of a third of a
    // unit at one end), and the fit joined them with a 2-unit curve that rounding to the
    // grid left at 4° to both: two near-miss kinks. Now the three are one line, at least
    // as tall as the font's (measured: from (740, 100) to (707, 557)).
    const leaning = glyph!.outline.contours.flatMap((c) => contourSegments(c)).filter((s) => s.kind === 'line' && s.p0.x !== s.p1.x && s.p0.x > 650 && Math.abs(s.p1.y - s.p0.y) >= 300);
    expect(leaning).toHaveLength(1);
    expect(Math.abs(leaning[0]!.p0.y - (leaning[0]!.kind === 'line' ? leaning[0]!.p1.y : 0))).toBeGreaterThanOrEqual(542 - 121);
    expect(glyph!.kinks).toBe(0);
    expect(glyph!.hausdorff).toBeLessThanOrEqual(2);
  });
});

describeWithFont('blunted joins of Linux Libertine on a sharp scan at 0.5 px per unit', LIBERTINE, () => {
  let glyphs: readonly GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = measureRoundTrip({ fonts: ['Linux Libertine Regular'], glyphs: 'AW', variants: ['clean 0.5 px/unit'] }).glyphs;
  }, 60_000);

  it('draws the joins a unit or two across as corners, not as tiny curves that kink on the grid', () => {
    // Reference: the near-miss kink band (on-curve points turning 0.3°–8°, common
    // practice in outline checking) measured on the fitted outline. Where the serifs meet
    // the diagonals of A and W the fit drew curves 2–4 units long whose handles could not
    // follow the diagonals on the unit grid: 4 kinks; as corners, 2 remain (at A's left
    // serif, whose curve is 13 units long).
    const kinks = glyphs.reduce((t, g) => t + g.kinks, 0);
    expect(kinks).toBeLessThanOrEqual(2);
    for (const g of glyphs) expect(g.hausdorff, g.character).toBeLessThanOrEqual(4);
  });
});

describeWithFont('where the diagonal of Cantarell 7 meets its vertical', CANTARELL, () => {
  let glyphs: GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = (['clean 1 px/unit', 'clean 0.5 px/unit'] as const).map((variant) => measureRoundTripGlyph('Cantarell Regular', '7', variant));
  }, 60_000);

  it('draws the 24° corner the font has, not a smooth join that kinks on the grid', () => {
    // Reference: the font's 7, whose diagonal turns by 24° into a vertical 40 units long
    // below the top right corner. Under the corner angle of 25° that corner was a smooth
    // join into a curve taking in the vertical, and rounding left near-miss kinks of 1.9°
    // (1 px per unit) and 2.7° (0.5 px per unit) there; both sides being straight, it is
    // now a corner.
    for (const g of glyphs) {
      expect(g.recalledCorners, g.variant).toBe(g.fontCorners);
      expect(g.fittedCorners, g.variant).toBe(g.preciseCorners);
      expect(g.kinks, g.variant).toBe(0);
      expect(g.hausdorff, g.variant).toBeLessThanOrEqual(2);
    }
  });
});

describeWithFont('where the diagonals of Linux Libertine K and W run into their serif brackets', LIBERTINE, () => {
  let glyphs: GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = [measureRoundTripGlyph('Linux Libertine Regular', 'K', 'clean 1 px/unit'), measureRoundTripGlyph('Linux Libertine Regular', 'W', 'clean 1 px/unit'), measureRoundTripGlyph('Linux Libertine Regular', 'W', 'rough 1 px/unit')];
  }, 60_000);

  it('continues each diagonal smoothly into its bracket on the unit grid, with no near-miss kink', () => {
    // Reference: the near-miss kink band of outline checking (on-curve points turning
    // 0.3°–8°, common practice), on the outlines traced from the fonts' glyphs. W's
    // diagonals run at slopes such as 122:−353, whose lattice points lie 373 units apart,
    // into brackets whose handles are 6–25 units long: no grid point near the handle
    // continued the line within 0.25°, and the joins kinked by 0.6–0.7° (2 on the clean
    // copy, 3 on the rough one; K 1). Slid back along the line by a few units, the join
    // finds a longer handle on the line's direction that the bracket's cubic can take.
    for (const g of glyphs) {
      expect(g.kinks, `${g.character} ${g.variant}`).toBe(0);
      expect(g.hausdorff, `${g.character} ${g.variant}`).toBeLessThanOrEqual(g.variant.startsWith('rough') ? 4 : 2);
    }
  });
});

describeWithFont('brackets where the bowls of Linux Libertine meet their stems, on a sharp scan at 0.5 px per unit', LIBERTINE, () => {
  let glyphs: readonly GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = measureRoundTrip({ fonts: ['Linux Libertine Regular'], glyphs: 'bmnw', variants: ['clean 0.5 px/unit'] }).glyphs;
  }, 60_000);

  it('follows the brackets about 5 units round instead of sharpening them into corners', () => {
    // Reference: the font's outlines. Where b's bowl, the arches of m and n and the
    // middle strokes of w meet their stems, the font draws brackets about 5 units round
    // (2.5 px here). With a 1 px margin beyond the tip the scan's blur predicts, their
    // sides' meeting point was taken for a sharp corner: Hausdorff 3.93 / 3.77 / 3.30 /
    // 4.04 units. With the margin at 1.5 units (0.75 px here): 1.12 / 1.01 / 1.07 / 2.27.
    for (const g of glyphs) {
      expect(g.hausdorff, g.character).toBeLessThanOrEqual(2.5);
      // Every corner fitted is one of the font's (within 4 units).
      if (g.character !== 'w') expect(g.preciseCorners, g.character).toBe(g.fittedCorners);
    }
  });
});

describeWithFont('the blunted apex of Cantarell 4 on the rough scan', CANTARELL, () => {
  let glyph: GlyphMeasurement | undefined;
  beforeAll(() => {
    glyph = measureRoundTripGlyph('Cantarell Regular', '4', 'rough 1 px/unit');
  }, 60_000);

  it('is drawn as the corner the font has, with no extremum left inside a segment', () => {
    // Reference: the font's own 4, whose diagonal meets the top of the stem at a corner.
    // The scan's blur rounds it into a curve 5 units long; fitted as that curve, its top
    // stuck out 0.9 unit between two points (the extremum rule allows 0.5).
    expect(glyph!.extremaInside).toBe(0);
    expect(glyph!.recalledCorners).toBe(glyph!.fontCorners);
  });
});

describeWithFont('the narrow stroke ends of Linux Libertine M and W on the rough scan', LIBERTINE, () => {
  let glyphs: readonly GlyphMeasurement[] = [];
  beforeAll(() => {
    glyphs = [...'MW'].map((c) => measureRoundTripGlyph('Linux Libertine Regular', c, 'rough 1 px/unit'));
  }, 60_000);

  it('end in flats between corners, with no extremum inside a segment', () => {
    // Reference: the font's own M and W, whose thin strokes end in flats 2–3 units wide
    // where they meet the serifs. Fitted as curves 2–3 units long, their tops stuck out
    // 0.75 and 1.15 units between two points (the extremum rule allows 0.5).
    for (const g of glyphs) expect(g.extremaInside, g.character).toBe(0);
  });
});
