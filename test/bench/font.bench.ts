// Benchmarks for font export and import: writing a 500-glyph test font (about a
// full Latin set with accents and symbols) and reading it back, the two steps a
// lettering artist waits for when exporting or opening a font. Goal: under 300 ms
// each on one core. Registered on a Bench supplied by the benchmark runner, which
// owns timing options and reporting.
import type { Bench } from 'tinybench';
import { readFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { syntheticFont } from '../font/sample-fonts.ts';

/** Glyphs in the benchmark font: a large Latin character set. */
export const BENCHMARK_GLYPH_COUNT = 500;
export const WRITE_TASK = `font: write a ${BENCHMARK_GLYPH_COUNT}-glyph OTF`;
export const READ_TASK = `font: read a ${BENCHMARK_GLYPH_COUNT}-glyph OTF into outlines`;

/** Registers the font tasks on `bench`. */
export function fontBenchmarks(bench: Bench): void {
  const source = syntheticFont(BENCHMARK_GLYPH_COUNT);
  const bytes = writeOtf(source);
  bench
    .add(WRITE_TASK, () => writeOtf(source).length)
    .add(READ_TASK, () => readFont(bytes, 'benchmark.otf').glyphs.length);
}
