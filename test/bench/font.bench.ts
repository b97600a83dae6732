// Benchmarks for font export and import: writing a 500-glyph test font (about a
// full Latin set with accents and symbols) and reading it back, the two steps a
// lettering artist waits for when exporting or opening a font, and reading a large
// reference face, Debian's DejaVu Sans (6,253 TrueType glyphs, ~306,000 points once
// converted to cubics), as when one is opened to compare with or start from. Goal:
// under 300 ms each for the 500-glyph font and under 1 s for DejaVu Sans on one
// core. Registered on a Bench supplied by the benchmark runner, which owns timing
// options and reporting.
import { existsSync, readFileSync } from 'node:fs';
import type { Bench } from 'tinybench';
import { readFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { syntheticFont } from '../font/sample-fonts.ts';
import { REFERENCE_FONTS } from '../support/require-tool.ts';

/** Glyphs in the benchmark font: a large Latin character set. */
export const BENCHMARK_GLYPH_COUNT = 500;
export const WRITE_TASK = `font: write a ${BENCHMARK_GLYPH_COUNT}-glyph OTF`;
export const READ_TASK = `font: read a ${BENCHMARK_GLYPH_COUNT}-glyph OTF into outlines`;
export const READ_DEJAVU_TASK = 'font: read DejaVu Sans (TrueType, 6,253 glyphs) into outlines';

/** Registers the font tasks on `bench`; the DejaVu Sans task only where the font is installed (fonts-dejavu-core). */
export function fontBenchmarks(bench: Bench): void {
  const source = syntheticFont(BENCHMARK_GLYPH_COUNT);
  const bytes = writeOtf(source);
  bench
    .add(WRITE_TASK, () => writeOtf(source).length)
    .add(READ_TASK, () => readFont(bytes, 'benchmark.otf').glyphs.length);
  const dejavu = REFERENCE_FONTS.dejavuSans;
  if (existsSync(dejavu.path)) {
    const dejavuBytes = readFileSync(dejavu.path);
    bench.add(READ_DEJAVU_TASK, () => readFont(dejavuBytes, dejavu.path).glyphs.length);
  } else {
    console.warn(`font: "${READ_DEJAVU_TASK}" left out: ${dejavu.what} not found at ${dejavu.path}; install it with "${dejavu.install}".`);
  }
}
