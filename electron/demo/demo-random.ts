// The seeded random source of the demo sheet generator, so that one seed always
// draws the same sheet: Mulberry32, a small 32-bit generator (T. Ettinger, public
// domain), uniform in [0, 1) — the same generator the tests use for their cases.

export type Random = () => number;

export function seededRandom(seed: number): Random {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A uniform number in [low, high). */
export function between(random: Random, low: number, high: number): number {
  return low + (high - low) * random();
}

/**
 * Smooth value noise in about [-1, 1]: random values on a square lattice `cell`
 * pixels apart, blended with the smoothstep weight, so it varies slowly and without
 * seams — the shape of uneven paper tone and ink density.
 */
export function valueNoise(random: Random, width: number, height: number, cell: number): (x: number, y: number) => number {
  const columns = Math.ceil(width / cell) + 2;
  const rows = Math.ceil(height / cell) + 2;
  const lattice = Float64Array.from({ length: columns * rows }, () => random() * 2 - 1);
  return (x, y) => {
    const gx = x / cell;
    const gy = y / cell;
    const cx = Math.min(columns - 2, Math.max(0, Math.floor(gx)));
    const cy = Math.min(rows - 2, Math.max(0, Math.floor(gy)));
    const tx = smoothstep(Math.min(1, Math.max(0, gx - cx)));
    const ty = smoothstep(Math.min(1, Math.max(0, gy - cy)));
    const i = cy * columns + cx;
    const top = lattice[i]! + (lattice[i + 1]! - lattice[i]!) * tx;
    const bottom = lattice[i + columns]! + (lattice[i + columns + 1]! - lattice[i + columns]!) * tx;
    return top + (bottom - top) * ty;
  };
}

function smoothstep(t: number): number {
  return t * t * (3 - 2 * t);
}
