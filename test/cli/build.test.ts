// `stemline build`: sheets of letters in, an OpenType test font out that the font
// sanitizer browsers use (ots-sanitize, Debian opentype-sanitizer) accepts and that an
// independent parser (fontkit) maps the drawn characters to, with one summary line
// per glyph. The sheet is Cantarell Regular (Debian fonts-cantarell) rasterized by
// Skia through @napi-rs/canvas.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as fontkit from 'fontkit';
import { runCaptured as run } from './run-captured.ts';
import { addGlyphPath, loadFont, renderAntialiased } from '../raster/reference-render.ts';
import { CANTARELL, describeWithFont } from '../raster/require-font.ts';
import { checkRequirement, OTS_SANITIZE } from '../support/require-tool.ts';
import sharp from 'sharp';

const folder = mkdtempSync(join(tmpdir(), 'stemline-build-'));
/** Pixels per font unit of the reference sheet: capitals about 208 px tall, as at 600 dpi. */
const SCALE = 0.3;


describeWithFont('stemline build', CANTARELL, () => {
  const ots = checkRequirement(OTS_SANITIZE);
  const reference = loadFont(CANTARELL.path);
  const rows = ['HOLA', 'xonag'];

  let sheetPath: Promise<string> | undefined;
  const sheet = (): Promise<string> => (sheetPath ??= drawSheet());

  async function drawSheet(): Promise<string> {
    const raster = renderAntialiased(1100, 520, (context) => {
      context.beginPath();
      rows.forEach((text, r) => {
        let x = 30;
        for (const character of text) {
          const glyph = reference.charToGlyph(character);
          addGlyphPath(context, glyph.path.commands, { scale: SCALE, originX: x, originY: 240 + r * 240 });
          x += (glyph.advanceWidth ?? 500) * SCALE + 24;
        }
      });
      context.fill('nonzero');
    });
    const path = join(folder, 'sheet.png');
    writeFileSync(path, await sharp(Buffer.from(raster.data), { raw: { width: raster.width, height: raster.height, channels: 1 } }).png().withMetadata({ density: 600 }).toBuffer());
    return path;
  }

  it('writes a font the sanitizer accepts, with every drawn character mapped', async () => {
    const output = join(folder, 'harbour-test.otf');
    const result = await run(['build', await sheet(), '--chars', 'HOLA xonag', '-o', output]);
    expect(result.code).toBe(0);
    const lines = result.out.trim().split('\n');
    expect(lines).toHaveLength(9);
    expect(lines[0]).toMatch(/^H\tU\+0048\tH\tadvance \d+\tsegments \d+\ton-curve \d+\tcorners \d+\tmax-deviation [\d.]+\twarnings \d+$/);
    expect(result.err).toMatch(/wrote .*harbour-test\.otf: 9 glyphs, 1000 units per em, cap height 700/);
    const font = fontkit.create(readFileSync(output)) as fontkit.Font;
    expect(font.familyName).toBe('Harbour Test');
    for (const character of 'HOLAxonag') expect(font.glyphForCodePoint(character.codePointAt(0) ?? 0).id).toBeGreaterThan(0);
    // The drawn H's flat top lands on the chosen cap height (Cantarell's H is 694 of 1000; scaled to 700).
    expect(font.glyphForCodePoint(0x48).bbox.maxY).toBeGreaterThanOrEqual(698);
    expect(font.glyphForCodePoint(0x48).bbox.maxY).toBeLessThanOrEqual(702);
    if (ots.available) {
      const sanitized = spawnSync(OTS_SANITIZE.path, [output, join(folder, 'sanitized.otf')], { encoding: 'utf8' });
      expect(sanitized.status, sanitized.stderr).toBe(0);
    } else {
      console.warn(ots.message);
    }
  });

  it('refuses, naming both counts, when the characters do not match the letters', async () => {
    const output = join(folder, 'short.otf');
    const result = await run(['build', await sheet(), '--chars', 'HOLA xona', '-o', output]);
    expect(result.code).toBe(1);
    expect(result.err).toMatch(/sheet shows 9 letters but 8 characters were given/);
    expect(existsSync(output)).toBe(false);
  });

  it('refuses a character given twice', async () => {
    const result = await run(['build', await sheet(), '--chars', 'HOLA xonax', '-o', join(folder, 'twice.otf')]);
    expect(result.code).toBe(1);
    expect(result.err).toMatch(/"x" is assigned twice/);
  });

  it('exits 2 for a missing --chars or output', async () => {
    const path = await sheet();
    expect((await run(['build', path, '-o', join(folder, 'x.otf')])).err).toMatch(/--chars/);
    expect((await run(['build', path, '--chars', 'HOLAxonag'])).code).toBe(2);
    expect((await run(['build', '--chars', 'A', '-o', 'x.otf'])).code).toBe(2);
  });
});

describe('stemline build usage', () => {
  it('lists build in --help', async () => {
    expect((await run(['--help'])).out).toMatch(/build SHEET\.\.\. --chars "STRING" -o FONT\.otf/);
  });
});
