// The broad-nib pen of the demo sheets: a flat nib of fixed edge length held at a
// fixed angle, swept along a pen path. Where the path runs across the nib's edge the
// stroke is as wide as the nib; where it runs along the edge it leaves a hairline as
// thin as the nib itself — the thick-and-thin contrast of edged-pen lettering comes
// out of the sweep, not out of any drawn outline. The swept area is filled on a
// supersampled grid (the convex hull of the nib at two consecutive samples, which is
// exactly the area the flat nib covers moving straight between them) and averaged
// down to ink coverage per sheet pixel.

/** The nib, in sheet pixels and the sheet frame (x right, y down). */
export interface BroadNib {
  /** Length of the nib's edge: the widest stroke it draws. */
  readonly width: number;
  /** Thickness of the nib: the hairline it draws moving along its own edge. */
  readonly thickness: number;
  /** Direction of the nib's edge, radians from the +x axis (turning toward +y). */
  readonly angle: number;
}

/** Where the nib passes, with how hard it is pressed: `pressure` scales the edge length (1 = the nib's width). */
export interface NibSample {
  readonly x: number;
  readonly y: number;
  readonly pressure: number;
}

/** Ink coverage on a box of sheet pixels: `data[row * width + col]` in 0–1 for pixel (x0 + col, y0 + row). */
export interface InkCoverage {
  readonly x0: number;
  readonly y0: number;
  readonly width: number;
  readonly height: number;
  readonly data: Float32Array;
}

/** Pixels of paper kept around the swept area, so later blurring (ink bleed) has room to spread. */
const COVERAGE_MARGIN_PX = 4;

interface Corner {
  x: number;
  y: number;
}

/**
 * The coverage of `strokes` (each a run of samples the pen passes in order, the pen
 * lifted between runs) swept by `nib`, filled on a grid `supersample` times finer
 * than the sheet's pixels. Coverage is exact to 1 / supersample² per pixel.
 */
export function sweepNib(strokes: readonly (readonly NibSample[])[], nib: BroadNib, supersample: number): InkCoverage {
  if (!Number.isInteger(supersample) || supersample < 1) throw new RangeError(`Supersampling takes a whole number of at least 1, not ${supersample}.`);
  if (!(nib.width > 0) || !(nib.thickness > 0)) throw new RangeError('The nib needs a positive width and thickness.');
  const samples = strokes.flat();
  if (samples.length === 0) throw new RangeError('There is nothing to draw: every stroke is empty.');
  const reach = nib.width * Math.max(...samples.map((s) => s.pressure)) / 2 + nib.thickness;
  const x0 = Math.floor(Math.min(...samples.map((s) => s.x)) - reach) - COVERAGE_MARGIN_PX;
  const y0 = Math.floor(Math.min(...samples.map((s) => s.y)) - reach) - COVERAGE_MARGIN_PX;
  const width = Math.ceil(Math.max(...samples.map((s) => s.x)) + reach) + COVERAGE_MARGIN_PX - x0;
  const height = Math.ceil(Math.max(...samples.map((s) => s.y)) + reach) + COVERAGE_MARGIN_PX - y0;
  const fineWidth = width * supersample;
  const fineHeight = height * supersample;
  const mask = new Uint8Array(fineWidth * fineHeight);
  const edge = { x: Math.cos(nib.angle), y: Math.sin(nib.angle) };
  const across = { x: -edge.y, y: edge.x };
  const corners = (s: NibSample): Corner[] => {
    const half = (nib.width * s.pressure) / 2;
    const thick = nib.thickness / 2;
    const cx = (s.x - x0) * supersample;
    const cy = (s.y - y0) * supersample;
    const result: Corner[] = [];
    for (const a of [-half, half]) {
      for (const b of [-thick, thick]) {
        result.push({ x: cx + (edge.x * a + across.x * b) * supersample, y: cy + (edge.y * a + across.y * b) * supersample });
      }
    }
    return result;
  };
  for (const stroke of strokes) {
    if (stroke.length === 1) fillConvex(mask, fineWidth, fineHeight, convexHull(corners(stroke[0]!)));
    for (let i = 1; i < stroke.length; i++) fillConvex(mask, fineWidth, fineHeight, convexHull([...corners(stroke[i - 1]!), ...corners(stroke[i]!)]));
  }
  const data = new Float32Array(width * height);
  const cell = supersample * supersample;
  for (let row = 0; row < height; row++) {
    for (let col = 0; col < width; col++) {
      let count = 0;
      for (let fy = 0; fy < supersample; fy++) {
        const base = (row * supersample + fy) * fineWidth + col * supersample;
        for (let fx = 0; fx < supersample; fx++) count += mask[base + fx]!;
      }
      data[row * width + col] = count / cell;
    }
  }
  return { x0, y0, width, height, data };
}

/** The convex hull, counter-clockwise in the y-down frame (Andrew's monotone chain, 1979). */
function convexHull(points: Corner[]): Corner[] {
  const sorted = [...points].sort((a, b) => a.x - b.x || a.y - b.y);
  const cross = (o: Corner, a: Corner, b: Corner) => (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
  const lower: Corner[] = [];
  for (const p of sorted) {
    while (lower.length >= 2 && cross(lower[lower.length - 2]!, lower[lower.length - 1]!, p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: Corner[] = [];
  for (let i = sorted.length - 1; i >= 0; i--) {
    const p = sorted[i]!;
    while (upper.length >= 2 && cross(upper[upper.length - 2]!, upper[upper.length - 1]!, p) <= 0) upper.pop();
    upper.push(p);
  }
  return [...lower.slice(0, -1), ...upper.slice(0, -1)];
}

/** Sets every fine cell whose centre lies inside the convex polygon. */
function fillConvex(mask: Uint8Array, width: number, height: number, polygon: readonly Corner[]): void {
  if (polygon.length < 3) return;
  let top = Infinity;
  let bottom = -Infinity;
  for (const p of polygon) {
    top = Math.min(top, p.y);
    bottom = Math.max(bottom, p.y);
  }
  const firstRow = Math.max(0, Math.ceil(top - 0.5));
  const lastRow = Math.min(height - 1, Math.floor(bottom - 0.5));
  for (let row = firstRow; row <= lastRow; row++) {
    const y = row + 0.5;
    let left = Infinity;
    let right = -Infinity;
    for (let i = 0; i < polygon.length; i++) {
      const a = polygon[i]!;
      const b = polygon[(i + 1) % polygon.length]!;
      if ((y < a.y && y < b.y) || (y > a.y && y > b.y) || a.y === b.y) continue;
      const x = a.x + ((y - a.y) / (b.y - a.y)) * (b.x - a.x);
      left = Math.min(left, x);
      right = Math.max(right, x);
    }
    if (left > right) continue;
    const firstCol = Math.max(0, Math.ceil(left - 0.5));
    const lastCol = Math.min(width - 1, Math.floor(right - 0.5));
    if (lastCol >= firstCol) mask.fill(1, row * width + firstCol, row * width + lastCol + 1);
  }
}
