// How far a blurred corner's traced tip lies inside the sharp corner
// (core/fit/blurred-wedge.ts), checked by an independent method: Monte Carlo sampling
// of the two-dimensional normal distribution (Box–Muller transform, Box & Muller 1958),
// counting the share of samples centred at the predicted tip that fall inside the
// wedge. At the tip the share must be one half.
import { describe, expect, it } from 'vitest';
import { BLURRED_WEDGE_INSET_TABLE, blurredWedgeInset, insetByBisection } from '../../core/fit/blurred-wedge.ts';
import { cornerReachFor } from '../../core/fit/corners.ts';
import { seededRandom } from '../support/seeded-random.ts';

/** Share of N(0, 1)² samples centred at (t, 0) inside the wedge |angle| < opening/2 with apex at the origin. */
function sampledCoverage(t: number, opening: number, samples: number): number {
  const random = seededRandom(1958);
  let inside = 0;
  for (let k = 0; k < samples; k++) {
    const r = Math.sqrt(-2 * Math.log(1 - random())); // 1 − u lies in (0, 1]
    const phi = 2 * Math.PI * random();
    const x = t + r * Math.cos(phi);
    const y = r * Math.sin(phi);
    if (x > 0 && Math.abs(Math.atan2(y, x)) < opening / 2) inside++;
  }
  return inside / samples;
}

const DEGREES = Math.PI / 180;

describe('blurred corner inset', () => {
  for (const opening of [20, 45, 90, 135]) {
    it(`puts the half-coverage point of a ${opening}° wedge where sampling finds it`, () => {
      const t = blurredWedgeInset(opening * DEGREES);
      // 200 000 samples: the share's standard error is 0.0011.
      expect(sampledCoverage(t, opening * DEGREES, 200_000)).toBeCloseTo(0.5, 2);
    });
  }

  it('has a written-out table equal to the integral solved again at every degree', () => {
    expect(BLURRED_WEDGE_INSET_TABLE).toHaveLength(181);
    expect(BLURRED_WEDGE_INSET_TABLE[0]).toBe(BLURRED_WEDGE_INSET_TABLE[1]);
    for (let degrees = 1; degrees <= 180; degrees++) expect(BLURRED_WEDGE_INSET_TABLE[degrees], `${degrees}°`).toBe(insetByBisection((degrees * Math.PI) / 180));
  });

  it('does not move a straight edge, and moves sharper corners farther', () => {
    expect(blurredWedgeInset(Math.PI)).toBeLessThan(0.01);
    expect(blurredWedgeInset(30 * DEGREES)).toBeGreaterThan(blurredWedgeInset(60 * DEGREES));
    expect(blurredWedgeInset(60 * DEGREES)).toBeGreaterThan(blurredWedgeInset(120 * DEGREES));
  });

  it('gives a sharp scan a shorter corner reach than a blurred one', () => {
    const turn = 120 * DEGREES;
    expect(cornerReachFor(turn, 1, 0.4)).toBeLessThan(cornerReachFor(turn, 1, 1.5));
    expect(cornerReachFor(turn, 1, 0.4)).toBeLessThan(cornerReachFor(turn, 1));
  });
});
