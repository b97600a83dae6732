// `stemline trace`: the contract other tools rely on. SVG on the image's pixel frame
// (viewBox = the image), one <path> per letter with absolute M/L/C/Z only, fill rule
// nonzero, outer contours and holes of opposite winding; `--json` prints the quality
// report; exit 1 for bad input, 2 for usage mistakes. Shapes are drawn by an
// independent rasterizer (Skia through @napi-rs/canvas).
import { describe, expect, it } from 'vitest';
import { createCanvas } from '@napi-rs/canvas';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCaptured as run } from './run-captured.ts';

const folder = mkdtempSync(join(tmpdir(), 'stemline-trace-'));

/** A square, a ring and a disc on one row, bottoms on y = 260. */
function drawShapes(): string {
  const canvas = createCanvas(720, 320);
  const g = canvas.getContext('2d');
  g.fillStyle = '#fff';
  g.fillRect(0, 0, 720, 320);
  g.fillStyle = '#000';
  g.fillRect(40, 60, 200, 200);
  g.beginPath();
  g.arc(380, 160, 100, 0, 2 * Math.PI);
  g.arc(380, 160, 50, 0, 2 * Math.PI, true);
  g.fill();
  g.beginPath();
  g.arc(600, 200, 60, 0, 2 * Math.PI);
  g.fill();
  const path = join(folder, 'shapes.png');
  writeFileSync(path, canvas.toBuffer('image/png'));
  return path;
}


/** Signed area (shoelace, y down) of each subpath, using all points of M/L/C commands as a polygon. */
function subpathAreas(d: string): number[] {
  return d
    .split('Z')
    .filter((s) => s.trim().length > 0)
    .map((sub) => {
      const numbers = (sub.match(/-?\d+(\.\d+)?/g) ?? []).map(Number);
      let area = 0;
      for (let i = 0; i < numbers.length; i += 2) {
        const j = (i + 2) % numbers.length;
        area += (numbers[i] ?? 0) * (numbers[j + 1] ?? 0) - (numbers[j] ?? 0) * (numbers[i + 1] ?? 0);
      }
      return area / 2;
    });
}

describe('stemline trace', () => {
  const shapes = drawShapes();

  it('writes one path per letter with absolute M/L/C/Z in the image frame, holes winding the other way', async () => {
    const output = join(folder, 'shapes.svg');
    const result = await run(['trace', shapes, '-o', output, '--dpi', '600']);
    expect(result).toMatchObject({ code: 0, err: '' });
    const svg = readFileSync(output, 'utf8');
    expect(svg).toMatch(/viewBox="0 0 720 320"/);
    const paths = [...svg.matchAll(/<path [^>]*fill-rule="nonzero" d="([^"]*)"/g)].map((m) => m[1] ?? '');
    expect(paths).toHaveLength(3);
    for (const d of paths) expect(d).toMatch(/^M[-\d. ]+(?: [LC][-\d. ]+| Z| M[-\d. ]+)*$/);
    const [square, ring, disc] = paths.map(subpathAreas);
    expect(square).toHaveLength(1);
    expect(disc).toHaveLength(1);
    expect(ring).toHaveLength(2);
    // The hole winds opposite to the outer contour, so nonzero fill leaves it open.
    expect(Math.sign(ring?.[0] ?? 0)).toBe(-Math.sign(ring?.[1] ?? 0));
    expect(Math.sign(square?.[0] ?? 0)).toBe(Math.sign(ring?.[0] ?? 0));
  });

  it('fits a square with four straight sides and a disc with four curves', async () => {
    const result = await run(['trace', shapes, '--json', '--dpi', '600']);
    expect(result.code).toBe(0);
    const report = JSON.parse(result.out) as { letters: Array<{ segments: number; lines: number; corners: number; onCurvePoints: number; contours: number }>; tolerance: number; unitsPerPixel: number };
    const [square, ring, disc] = report.letters;
    expect(square).toMatchObject({ segments: 4, lines: 4, corners: 4 });
    expect(disc).toMatchObject({ segments: 4, lines: 0, corners: 0, onCurvePoints: 4 });
    expect(ring?.contours).toBe(2);
    expect(report.tolerance).toBeGreaterThan(0);
  });

  it('fits the ring and disc curvature-continuously in smooth mode, with points at their extremes', async () => {
    const result = await run(['trace', shapes, '--json', '--dpi', '600', '--fit-mode', 'smooth']);
    expect(result.code).toBe(0);
    const report = JSON.parse(result.out) as { letters: Array<{ segments: number; corners: number; onCurvePoints: number; maxDeviation: number; warnings: unknown[] }>; tolerance: number };
    const [square, ring, disc] = report.letters;
    // A circle has four axis extremes, each an on-curve point (common practice), and no corners.
    expect(disc).toMatchObject({ corners: 0, onCurvePoints: 4 });
    expect(ring).toMatchObject({ corners: 0, onCurvePoints: 8 });
    // The square keeps its four corners in smooth mode too.
    expect(square?.corners).toBe(4);
    for (const letter of [square, ring, disc]) expect(letter?.maxDeviation).toBeLessThanOrEqual(report.tolerance);
  });

  it('exits 2 naming the option for an unknown fit mode', async () => {
    const result = await run(['trace', shapes, '--json', '--fit-mode', 'wavy']);
    expect(result.code).toBe(2);
    expect(result.err).toMatch(/--fit-mode takes economy or smooth, not "wavy"/);
  });

  it('exits 1 naming the file for a scan it cannot read', async () => {
    const broken = join(folder, 'broken.jpg');
    writeFileSync(broken, 'not really a jpeg');
    const result = await run(['trace', broken, '-o', join(folder, 'broken.svg')]);
    expect(result.code).toBe(1);
    expect(result.err).toMatch(/^stemline trace: broken\.jpg: /);
  });

  it('exits 2 for a tolerance out of range or a missing output', async () => {
    expect((await run(['trace', shapes, '--json', '--tolerance', '0'])).err).toMatch(/--tolerance takes a number from 0\.1 to 50/);
    expect((await run(['trace', shapes, '--json', '--corner-angle', 'sharp'])).code).toBe(2);
    expect((await run(['trace', shapes])).code).toBe(2);
  });
});
