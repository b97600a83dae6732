// Synthetic boundary chains with known answers for the fitting tests: shapes sampled
// the way a boundary tracer samples them (about one point per unit of arc, here one
// scan pixel = one font unit), with seeded noise normal to the curve so every run is
// repeatable. Each shape's exact geometry is known, so tests can compare with it.

import type { Point } from '../../core/geometry/index.ts';
import { gaussianSource, seededRandom } from '../raster/degrade.ts';

/** A closed curve given by a point function of s ∈ [0, 1) and its total length. */
interface ClosedCurve {
  readonly at: (s: number) => Point;
  readonly length: number;
}

/**
 * Samples a closed curve every `step` units of its parameter's arc (the curve's `at`
 * must be arc-length parameterised up to a constant), adding Gaussian noise of
 * `noise` units along the local normal.
 */
function sample(curve: ClosedCurve, noise: number, seed: number, step = 1): Point[] {
  const gauss = gaussianSource(seededRandom(seed));
  const count = Math.max(8, Math.round(curve.length / step));
  const points: Point[] = [];
  for (let i = 0; i < count; i++) {
    const s = i / count;
    const p = curve.at(s);
    const q = curve.at((i + 0.5) / count);
    const r = curve.at((i - 0.5 + count) / count);
    const tx = q.x - r.x;
    const ty = q.y - r.y;
    const l = Math.hypot(tx, ty) || 1;
    const e = noise * gauss();
    points.push({ x: p.x - (ty / l) * e, y: p.y + (tx / l) * e });
  }
  return points;
}

/** A closed polygon's outline, arc-length parameterised, counter-clockwise for CCW vertices. */
function polygonCurve(vertices: readonly Point[]): ClosedCurve {
  const lengths = vertices.map((v, i) => {
    const w = vertices[(i + 1) % vertices.length]!;
    return Math.hypot(w.x - v.x, w.y - v.y);
  });
  const total = lengths.reduce((a, b) => a + b, 0);
  return {
    length: total,
    at: (s) => {
      let d = (((s % 1) + 1) % 1) * total;
      for (let i = 0; i < vertices.length; i++) {
        const l = lengths[i]!;
        if (d <= l || i === vertices.length - 1) {
          const v = vertices[i]!;
          const w = vertices[(i + 1) % vertices.length]!;
          const t = l > 0 ? d / l : 0;
          return { x: v.x + (w.x - v.x) * t, y: v.y + (w.y - v.y) * t };
        }
        d -= l;
      }
      return vertices[0]!;
    },
  };
}

/** Axis-aligned square [x0, x0 + side]², counter-clockwise, starting mid-bottom edge so no corner is at the seam. */
export function squareChain(x0: number, y0: number, side: number, noise: number, seed = 1): Point[] {
  const curve = polygonCurve([
    { x: x0 + side / 2, y: y0 },
    { x: x0 + side, y: y0 },
    { x: x0 + side, y: y0 + side },
    { x: x0, y: y0 + side },
    { x: x0, y: y0 },
  ]);
  return sample(curve, noise, seed);
}

/** Polygon outline (counter-clockwise vertices), noisy. */
export function polygonChain(vertices: readonly Point[], noise: number, seed = 1): Point[] {
  return sample(polygonCurve(vertices), noise, seed);
}

/** Circle of radius r about c, counter-clockwise, starting at angle `phase`. */
export function circleChain(c: Point, r: number, noise: number, seed = 1, phase = 0.3): Point[] {
  return sample({ length: 2 * Math.PI * r, at: (s) => ({ x: c.x + r * Math.cos(phase + 2 * Math.PI * s), y: c.y + r * Math.sin(phase + 2 * Math.PI * s) }) }, noise, seed);
}

/** Ellipse with semi-axes a, b rotated by `rotation` radians about c, counter-clockwise (not arc-length parameterised; step varies by ≤ a/b). */
export function ellipsePoint(c: Point, a: number, b: number, rotation: number, angle: number): Point {
  const x = a * Math.cos(angle);
  const y = b * Math.sin(angle);
  return { x: c.x + x * Math.cos(rotation) - y * Math.sin(rotation), y: c.y + x * Math.sin(rotation) + y * Math.cos(rotation) };
}

export function ellipseChain(c: Point, a: number, b: number, rotation: number, noise: number, seed = 1): Point[] {
  // Arc-length reparameterisation by a dense table, so that steps are about one unit.
  const dense = 20000;
  const table = [0];
  for (let i = 1; i <= dense; i++) {
    const p = ellipsePoint(c, a, b, rotation, (2 * Math.PI * (i - 1)) / dense);
    const q = ellipsePoint(c, a, b, rotation, (2 * Math.PI * i) / dense);
    table.push(table[i - 1]! + Math.hypot(q.x - p.x, q.y - p.y));
  }
  const total = table[dense]!;
  return sample(
    {
      length: total,
      at: (s) => {
        const target = (((s % 1) + 1) % 1) * total;
        let lo = 0;
        let hi = dense;
        while (hi - lo > 1) {
          const mid = (lo + hi) >> 1;
          if (table[mid]! <= target) lo = mid;
          else hi = mid;
        }
        const f = (target - table[lo]!) / (table[lo + 1]! - table[lo]! || 1);
        return ellipsePoint(c, a, b, rotation, (2 * Math.PI * (lo + f)) / dense);
      },
    },
    noise,
    seed,
  );
}

/**
 * Stadium: a rectangle of `width` × 2r with semicircular ends of radius r, centre c,
 * counter-clockwise. Straight sides horizontal; joins tangent-continuous.
 */
export function stadiumChain(c: Point, width: number, r: number, noise: number, seed = 1): Point[] {
  const straight = width;
  const arc = Math.PI * r;
  const total = 2 * straight + 2 * arc;
  const at = (s: number): Point => {
    let d = (((s % 1) + 1) % 1) * total;
    // bottom edge left→right, right arc, top edge right→left, left arc
    if (d < straight) return { x: c.x - width / 2 + d, y: c.y - r };
    d -= straight;
    if (d < arc) {
      const a = -Math.PI / 2 + d / r;
      return { x: c.x + width / 2 + r * Math.cos(a), y: c.y + r * Math.sin(a) };
    }
    d -= arc;
    if (d < straight) return { x: c.x + width / 2 - d, y: c.y + r };
    d -= straight;
    const a = Math.PI / 2 + d / r;
    return { x: c.x - width / 2 + r * Math.cos(a), y: c.y + r * Math.sin(a) };
  };
  return sample({ length: total, at: (s) => at(s + 0.1) }, noise, seed);
}

/**
 * A closed S-shaped band: the centre line y = A·sin(x·π/L) for x ∈ [0, 2L]... offset
 * by ±w/2 vertically, closed by vertical ends. Its long sides each have one
 * inflection (at x = L).
 */
export function sCurveBandChain(length: number, amplitude: number, width: number, noise: number, seed = 1): Point[] {
  const n = 4000;
  const centre = (x: number): number => amplitude * Math.sin((x * Math.PI) / length);
  const vertices: Point[] = [];
  for (let i = 0; i <= n; i++) {
    const x = (2 * length * i) / n;
    vertices.push({ x, y: centre(x) - width / 2 });
  }
  for (let i = n; i >= 0; i--) {
    const x = (2 * length * i) / n;
    vertices.push({ x, y: centre(x) + width / 2 });
  }
  return sample(polygonCurve(vertices), noise, seed);
}

/**
 * A closed polar curve r(θ) about c, sampled about once per unit of arc, with seeded
 * radial noise of `noise` units (the smooth-fit and grid-rounding tests' brush-like
 * shapes).
 */
export function polarChain(c: Point, r: (theta: number) => number, noise: number, seed: number): Point[] {
  const gauss = gaussianSource(seededRandom(seed));
  const at = (theta: number): Point => ({ x: r(theta) * Math.cos(theta), y: r(theta) * Math.sin(theta) });
  const dense = 20000;
  const table = [0];
  for (let i = 1; i <= dense; i++) {
    const a = at((2 * Math.PI * (i - 1)) / dense);
    const b = at((2 * Math.PI * i) / dense);
    table.push(table[i - 1]! + Math.hypot(b.x - a.x, b.y - a.y));
  }
  const total = table[dense]!;
  const count = Math.round(total);
  const points: Point[] = [];
  let j = 0;
  for (let i = 0; i < count; i++) {
    const s = (i * total) / count;
    while (table[j + 1]! <= s) j++;
    const theta = (2 * Math.PI * (j + (s - table[j]!) / (table[j + 1]! - table[j]!))) / dense;
    const p = at(theta);
    const e = noise * gauss();
    const l = Math.hypot(p.x, p.y);
    points.push({ x: c.x + p.x + (p.x / l) * e, y: c.y + p.y + (p.y / l) * e });
  }
  return points;
}

/** Lamé superellipse |x/a|^e + |y/b|^e = 1 in polar form r(θ). */
export function superellipseRadius(a: number, b: number, e: number): (theta: number) => number {
  return (theta) => 1 / ((Math.abs(Math.cos(theta)) / a) ** e + (Math.abs(Math.sin(theta)) / b) ** e) ** (1 / e);
}
