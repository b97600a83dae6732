// `stemline boundaries`: the contract other tools rely on. SVG in the image's pixel
// frame, one <path> per letter with its holes, absolute M/L/Z polylines; `--json`
// gives letters, rows and baselines; exit 1 for bad input, 2 for usage mistakes.
import { describe, expect, it } from 'vitest';
import { createCanvas } from '@napi-rs/canvas';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCaptured as run } from './run-captured.ts';

const folder = mkdtempSync(join(tmpdir(), 'stemline-boundaries-'));

/**
 * A two-row sheet drawn by an independent rasterizer (Skia through @napi-rs/canvas):
 * row 1 "o i" — a ring (outline + hole) and a stem with a dot above it; row 2 a bar.
 * Baselines are at y = 100 and y = 220 by construction.
 */
function drawSheet(): string {
  const canvas = createCanvas(300, 260);
  const g = canvas.getContext('2d');
  g.fillStyle = '#fff';
  g.fillRect(0, 0, 300, 260);
  g.fillStyle = '#000';
  g.beginPath();
  g.arc(60, 70, 30, 0, 2 * Math.PI);
  g.arc(60, 70, 14, 0, 2 * Math.PI, true);
  g.fill();
  g.fillRect(130, 40, 16, 60); // stem of "i", bottom on the baseline y = 100
  g.beginPath();
  g.arc(138, 24, 9, 0, 2 * Math.PI); // its dot
  g.fill();
  g.fillRect(40, 160, 120, 60); // row 2, bottom on y = 220
  const path = join(folder, 'sheet.png');
  writeFileSync(path, canvas.toBuffer('image/png'));
  return path;
}


describe('stemline boundaries', () => {
  const sheet = drawSheet();

  it('writes one closed polyline path per letter, holes included, in the pixel frame', async () => {
    const output = join(folder, 'sheet.svg');
    const result = await run(['boundaries', sheet, '-o', output, '--dpi', '300']);
    expect(result).toMatchObject({ code: 0, err: '' });
    const svg = readFileSync(output, 'utf8');
    expect(svg).toMatch(/viewBox="0 0 300 260"/);
    const paths = [...svg.matchAll(/<path [^>]*d="([^"]*)"/g)].map((m) => m[1] ?? '');
    expect(paths).toHaveLength(3); // ring, "i" with its dot, bar
    const subpaths = paths.map((d) => d.split('Z').filter((s) => s.trim().length > 0).length);
    expect(subpaths).toEqual([2, 2, 1]); // ring: outline + hole; i: stem + dot
    for (const d of paths) {
      expect(d).toMatch(/^(?:[MLZ][-\d. ]*)+$/); // absolute M, L, Z only
      const numbers = d.match(/-?\d+(\.\d+)?/g)?.map(Number) ?? [];
      for (let i = 0; i < numbers.length; i += 2) {
        expect(numbers[i]).toBeGreaterThanOrEqual(0);
        expect(numbers[i]).toBeLessThanOrEqual(300);
        expect(numbers[i + 1]).toBeGreaterThanOrEqual(0);
        expect(numbers[i + 1]).toBeLessThanOrEqual(260);
      }
    }
  });

  it('prints letters in reading order with rows, baselines and assigned characters', async () => {
    const result = await run(['boundaries', sheet, '--json', '--characters', 'oi -', '--dpi', '300']);
    expect(result.code).toBe(0);
    const report = JSON.parse(result.out) as {
      width: number; height: number; dpi: number;
      rows: Array<{ baseline: number }>;
      letters: Array<{ character: string | null; row: number; contours: Array<{ depth: number }> }>;
    };
    expect([report.width, report.height, report.dpi]).toEqual([300, 260, 300]);
    expect(report.letters.map((l) => [l.character, l.row])).toEqual([['o', 0], ['i', 0], ['-', 1]]);
    expect(report.letters[0]?.contours.map((c) => c.depth)).toEqual([0, 1]);
    expect(report.rows).toHaveLength(2);
    expect(Math.abs((report.rows[0]?.baseline ?? 0) - 100)).toBeLessThan(1.5);
    expect(Math.abs((report.rows[1]?.baseline ?? 0) - 220)).toBeLessThan(1.5);
  });

  it('exits 1 with one line naming the file when the scan will not decode', async () => {
    const broken = join(folder, 'broken.png');
    writeFileSync(broken, readFileSync(sheet).subarray(0, 60));
    const result = await run(['boundaries', broken, '-o', join(folder, 'broken.svg')]);
    expect(result.code).toBe(1);
    expect(result.err).toMatch(/^stemline boundaries: broken\.png: .+\n$/);
    expect(result.err.trim().split('\n')).toHaveLength(1);
    expect(existsSync(join(folder, 'broken.svg'))).toBe(false);
  });

  it('exits 1 saying there is no ink on a blank page', async () => {
    const blank = createCanvas(120, 80);
    const g = blank.getContext('2d');
    g.fillStyle = '#fff';
    g.fillRect(0, 0, 120, 80);
    const path = join(folder, 'blank.png');
    writeFileSync(path, blank.toBuffer('image/png'));
    const result = await run(['boundaries', path, '--json']);
    expect(result.code).toBe(1);
    expect(result.err).toMatch(/No ink found on the page/);
  });

  it('exits 2 for usage mistakes, saying what to do', async () => {
    expect((await run(['boundaries'])).code).toBe(2);
    expect((await run(['boundaries', sheet])).err).toMatch(/-o OUT\.svg, or ask for --json/);
    expect((await run(['boundaries', sheet, '--json', '--colour', 'red'])).code).toBe(2);
    expect((await run(['boundaries', sheet, '--json', '--threshold', '300'])).err).toMatch(/--threshold takes otsu, local or a grey level from 0 to 255/);
    expect((await run(['boundaries', sheet, '--json', '--dpi', 'lots'])).code).toBe(2);
  });
});
