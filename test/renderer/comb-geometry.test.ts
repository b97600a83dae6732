// Curvature combs as the canvas draws them. If these broke, the comb a designer reads
// to judge an outline's smoothness would lie: wrong tooth lengths, wrong side, or an
// envelope that does not join the teeth's ends.
import { describe, expect, it } from 'vitest';
import { Bezier } from 'bezier-js';
import { cubic, line } from '../../core/geometry/segment.ts';
import { combMaxLength, combScale, contourCombs, envelopePathData, teethPathData } from '../../renderer/src/editor/comb-geometry.ts';

const s = cubic({ x: 0, y: 0 }, { x: 120, y: 260 }, { x: 380, y: -90 }, { x: 500, y: 200 });
const reference = new Bezier(0, 0, 120, 260, 380, -90, 500, 200);

describe('curvature combs', () => {
  it('stands each tooth scale·|κ| long along the normal, κ agreeing with bezier-js', () => {
    const scale = 4000;
    const [comb] = contourCombs([s], { density: 17, scale });
    expect(comb?.teeth).toHaveLength(17);
    comb!.teeth.forEach((tooth, i) => {
      const t = i / 16;
      // Reference: bezier-js 6.1.4 Bezier.curvature(t).k, (x′y″ − y′x″)/|B′|³ — the same sign
      // convention as core (κ > 0 turning left, y up) — and the left unit normal (−y′, x′)/|B′|
      // from Bezier.derivative(t), as bezier-js's own normal(t) builds it (src/bezier.js __normal2).
      const k = reference.curvature(t).k;
      const d = reference.derivative(t);
      const n = { x: -d.y / Math.hypot(d.x, d.y), y: d.x / Math.hypot(d.x, d.y) };
      expect(tooth.curvature).toBeCloseTo(k, 10);
      const dx = tooth.tip.x - tooth.foot.x;
      const dy = tooth.tip.y - tooth.foot.y;
      expect(Math.hypot(dx, dy)).toBeCloseTo(scale * Math.abs(k), 8);
      // Along the normal, on the convex side: tip = foot − N·κ·scale.
      expect(dx).toBeCloseTo(-n.x * k * scale, 8);
      expect(dy).toBeCloseTo(-n.y * k * scale, 8);
      const foot = reference.compute(t);
      expect(tooth.foot.x).toBeCloseTo(foot.x, 9);
      expect(tooth.foot.y).toBeCloseTo(foot.y, 9);
    });
  });

  it('gives straight segments no comb and keeps each comb tied to its segment', () => {
    const combs = contourCombs([line({ x: 500, y: 200 }, { x: 0, y: 0 }), s], { density: 8, scale: 1 });
    expect(combs.map((c) => c.segment)).toEqual([1]);
  });

  it('runs the envelope through the outer ends of the teeth, in order', () => {
    const [comb] = contourCombs([s], { density: 5, scale: 1000 });
    expect(comb!.envelope).toEqual(comb!.teeth.map((t) => t.tip));
    const view = { scale: 1, originX: 0, originY: 0 };
    expect(envelopePathData([comb!], view).match(/[ML]/g)).toHaveLength(5);
    expect(teethPathData([comb!], view).match(/M/g)).toHaveLength(5);
  });

  it('makes 1× combs on a circle as tall as the letter a fortieth of its height long', () => {
    const height = 700;
    // κ of a circle of diameter h is 2/h; the tooth is scale·κ.
    expect(combScale(height, 1) * (2 / height)).toBeCloseTo(height / 40, 9);
    expect(combScale(height, 2)).toBeCloseTo(2 * combScale(height, 1), 9);
  });

  it('draws a tooth longer than the limit at the limit, along its own direction, and leaves shorter ones alone', () => {
    const scale = 4000;
    const [free] = contourCombs([s], { density: 17, scale });
    const lengths = free!.teeth.map((t) => Math.hypot(t.tip.x - t.foot.x, t.tip.y - t.foot.y));
    const limit = (Math.min(...lengths) + Math.max(...lengths)) / 2;
    const [limited] = contourCombs([s], { density: 17, scale, maxLength: limit });
    limited!.teeth.forEach((tooth, i) => {
      const was = free!.teeth[i]!;
      const length = lengths[i]!;
      const drawn = Math.hypot(tooth.tip.x - tooth.foot.x, tooth.tip.y - tooth.foot.y);
      expect(drawn).toBeCloseTo(Math.min(length, limit), 9);
      // The same direction: the limited tooth is the free one shortened.
      expect((tooth.tip.x - tooth.foot.x) * length).toBeCloseTo((was.tip.x - was.foot.x) * drawn, 6);
      expect((tooth.tip.y - tooth.foot.y) * length).toBeCloseTo((was.tip.y - was.foot.y) * drawn, 6);
      expect(tooth.curvature).toBe(was.curvature);
    });
    expect(limited!.envelope).toEqual(limited!.teeth.map((t) => t.tip));
    expect(lengths.some((l) => l > limit) && lengths.some((l) => l < limit)).toBe(true);
  });

  it('limits 1× teeth to a sixth of the height, and the limit grows with the comb length', () => {
    expect(combMaxLength(700, 1)).toBeCloseTo(700 / 6, 9);
    // A 1× tooth reaches the limit on a turn of radius 3/40 of the height.
    expect(combScale(700, 1) / ((700 * 3) / 40)).toBeCloseTo(combMaxLength(700, 1), 9);
    expect(combMaxLength(700, 3)).toBeCloseTo(3 * combMaxLength(700, 1), 9);
    // A circle as tall as the letter keeps its true 1× teeth under the limit.
    expect(combScale(700, 1) * (2 / 700)).toBeLessThan(combMaxLength(700, 1));
  });
});
