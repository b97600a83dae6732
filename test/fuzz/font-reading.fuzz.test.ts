// Fuzzing the font reader: Stemline's own font and Debian's Cantarell (CFF) and
// DejaVu Sans (TrueType) cut down to a few glyphs, each also as WOFF, mutated (table
// directory fields, counts, offsets, bytes, cuts). Every case either reads to
// glyphs whose every coordinate is a finite number, which write back to a font or
// are refused with a FontError, or is refused with an InputError a person can act
// on: never another exception, a hang or a runaway allocation.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { FontError } from '../../electron/io/font/font-error.ts';
import { InputError } from '../../electron/io/input-error.ts';
import { mutatedSample } from './byte-mutation.ts';
import { fontSamples } from './fuzz-samples.ts';
import { expectTypedError, fuzzParameters, fuzzSettings, suiteTimeLimitMs, withinLimits } from './fuzz-settings.ts';

const settings = fuzzSettings('font reading');
const { samples, skipped } = fontSamples();

describe('fuzzing the font reader', () => {
  for (const message of skipped) it.skip(message, () => undefined);

  it(`every mutated font reads to finite outlines or is refused with a readable InputError (${settings.runs} cases)`, async () => {
    for (const sample of samples) expect(readFont(sample.bytes, sample.name).glyphs.length, sample.name).toBeGreaterThan(1);
    let read = 0;
    await fc.assert(
      fc.asyncProperty(mutatedSample(samples), async ({ name, bytes }) => {
        withinLimits(`reading a mutated ${name}`, () => {
          let font;
          try {
            font = readFont(bytes, name);
          } catch (error) {
            expectTypedError(`reading a mutated ${name}`, error, [InputError]);
            expect((error as InputError).message).toContain(name);
            return;
          }
          read++;
          for (const key of ['unitsPerEm', 'ascender', 'descender', 'xHeight', 'capHeight', 'lineGap'] as const) expect(Number.isFinite(font[key]), `${name} ${key}`).toBe(true);
          for (const glyph of font.glyphs) {
            expect(Number.isFinite(glyph.advanceWidth), `${name} ${glyph.name} advance`).toBe(true);
            for (const contour of glyph.outline.contours) {
              for (const point of contour.points) expect(Number.isFinite(point.x) && Number.isFinite(point.y), `${name} ${glyph.name}`).toBe(true);
            }
          }
          try {
            writeOtf(font);
          } catch (error) {
            expectTypedError(`writing back a mutated ${name}`, error, [FontError]);
          }
        });
      }),
      fuzzParameters(settings),
    );
    console.info(`font reading: ${read} of ${settings.runs} cases read`);
    expect(read).toBeGreaterThan(0);
  }, suiteTimeLimitMs(settings.runs, 50));
});
