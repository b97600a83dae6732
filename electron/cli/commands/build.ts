// `stemline build SHEET... --chars "STRING" -o FONT.otf [--family NAME] [--style NAME]
// [--upm N] [--cap-height UNITS]` (and the fit and scan options): the whole job — decode, trace, fit, metrics, font —
// writing an OpenType (CFF) test font and printing one line per glyph. A contract
// other tools rely on: extend it compatibly.
import { basename } from 'node:path';
import { availableParallelism } from 'node:os';
import { saveFont } from '../../io/font/write-font-file.ts';
import { FontError } from '../../io/font/font-error.ts';
import { glyphNameForCodePoint } from '../../io/font/glyph-names.ts';
import { draftFont, DraftFontError, type DraftFont, type DraftGlyph, type FittedSheet } from '../../../core/pipeline/index.ts';
import { fitSheetFiles } from '../../batch/fit-sheet-files.ts';
import { threadsForJobs } from '../../batch/sheet-threads.ts';
import { DEFAULT_CAP_HEIGHT_UNITS, DEFAULT_UNITS_PER_EM } from '../../../core/metrics/index.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { numberOption, parseCommandLine } from '../parse-options.ts';
import type { CliCommand, CliStreams } from '../run-cli.ts';
import { EXIT_BAD_INPUT, EXIT_OK } from '../usage.ts';
import { SCAN_OPTIONS_HELP, scanOptionSpec, scanSettingsFrom } from './scan-options.ts';
import { FIT_OPTIONS_HELP, fitOptionSpec, fitOptionsFrom } from './fit-cli-options.ts';

const COMMAND = 'build';
/** Units per em accepted (OpenType 'head' table: 16 to 16384). */
const UPM_RANGE = { min: 16, max: 16384 } as const;
/**
 * Most worker threads accepted: more than the cores of any workstation gains
 * nothing, and each running thread holds a sheet's image while it traces it.
 */
const MAX_JOBS = 256;

export const buildCommand: CliCommand = {
  name: COMMAND,
  synopsis: 'build SHEET... --chars "STRING" -o FONT.otf [--family NAME] [--style NAME] [--upm N] [--cap-height UNITS] [--jobs N]',
  purpose: 'turn sheets of drawn letters into an OpenType (CFF) test font, one line printed per glyph',
  options: [
    '--chars STRING                 the characters drawn, in reading order across the sheets (spaces ignored)',
    '-o, --output FONT.otf          where to write the font',
    '--family NAME                  family name (default: the font file\'s name)',
    '--style NAME                   style name (default Regular)',
    '--upm N                        units per em (default 1000)',
    `--cap-height UNITS             the drawn cap height becomes this (default ${DEFAULT_CAP_HEIGHT_UNITS} per 1000 units per em)`,
    '--jobs N                       sheets traced and fitted on N threads at once (default: one per sheet, up to two thirds of the number of cores, rounded down); the font is the same for any N',
    ...FIT_OPTIONS_HELP,
    ...SCAN_OPTIONS_HELP.filter((line) => !line.startsWith('--characters')),
  ],
  async run(args, streams) {
    const { values, positionals } = parseCommandLine(COMMAND, args, {
      chars: { type: 'string' },
      output: { type: 'string', short: 'o' },
      family: { type: 'string' },
      style: { type: 'string' },
      upm: { type: 'string' },
      'cap-height': { type: 'string' },
      jobs: { type: 'string' },
      ...fitOptionSpec,
      ...scanOptionSpec,
    });
    if (positionals.length === 0) throw new CliUsageError(`stemline ${COMMAND}: name at least one sheet, e.g. "stemline ${COMMAND} capitals.png --chars ABC -o draft.otf".`);
    if (values.chars === undefined) throw new CliUsageError(`stemline ${COMMAND}: say which characters are drawn with --chars "…", in reading order.`);
    if (values.output === undefined) throw new CliUsageError(`stemline ${COMMAND}: say where to write the font with -o FONT.otf.`);
    if (values.characters !== undefined) throw new CliUsageError(`stemline ${COMMAND}: use --chars for the characters drawn.`);
    const unitsPerEm = numberOption(COMMAND, 'upm', values.upm, UPM_RANGE.min, UPM_RANGE.max) ?? DEFAULT_UNITS_PER_EM;
    if (!Number.isInteger(unitsPerEm)) throw new CliUsageError(`stemline ${COMMAND}: --upm takes a whole number.`);
    const capHeight = numberOption(COMMAND, 'cap-height', values['cap-height'], 1, unitsPerEm) ?? Math.round((DEFAULT_CAP_HEIGHT_UNITS * unitsPerEm) / DEFAULT_UNITS_PER_EM);
    const settings = scanSettingsFrom(COMMAND, values);
    const fit = fitOptionsFrom(COMMAND, values);
    const jobs = jobsOption(values.jobs, positionals.length);

    let font: DraftFont;
    // The workers start now, so their start-up overlaps this thread's first sheet.
    const threads = threadsForJobs(jobs);
    const progress = streams.progress;
    try {
      let sheets: FittedSheet[];
      try {
        sheets = await fitSheetFiles(positionals, values.chars, { scan: settings.trace, dpi: settings.dpi, fit, capHeightUnits: capHeight }, threads.threads, {
          onDecodeNotes: (_sheet, notes) => {
            for (const note of notes) {
              progress?.clear();
              streams.err(`note: ${note}\n`);
            }
          },
          ...(progress ? { onProgress: (state) => progress.show(state) } : {}),
        });
      } finally {
        progress?.clear();
        await threads.close();
      }
      font = draftFont(sheets, {
        familyName: values.family ?? familyFromFileName(values.output),
        styleName: values.style ?? 'Regular',
        unitsPerEm,
        capHeight,
      });
    } catch (error) {
      if (error instanceof DraftFontError) {
        streams.err(`stemline ${COMMAND}: ${error.message}\n`);
        return EXIT_BAD_INPUT;
      }
      throw error;
    }
    try {
      await saveFont(values.output, { ...font, glyphs: font.glyphs.map(({ character, outline, advanceWidth, leftSidebearing }) => ({ character, outline, advanceWidth, leftSidebearing })) });
    } catch (error) {
      if (error instanceof FontError) {
        streams.err(`stemline ${COMMAND}: ${basename(values.output)}: ${error.message}\n`);
        return EXIT_BAD_INPUT;
      }
      throw error;
    }
    printSummary(font, streams);
    streams.err(`wrote ${values.output}: ${font.glyphs.length} glyphs, ${font.unitsPerEm} units per em, cap height ${font.capHeight}, x-height ${font.xHeight}\n`);
    for (const note of font.notes) streams.err(`note: ${note}\n`);
    return EXIT_OK;
  },
};

/**
 * Cores one thread of a build keeps busy, measured on this project's 2-core machine
 * (`npm run bench -- jobs`, which reads the main thread's CPU time from /proc): with
 * `--jobs 1`, eight 62-letter sheets took 11.2 s of CPU time, only 6.0 s of it on the
 * build thread — the rest is V8 optimizing the tracer and fitter and collecting
 * garbage on its background threads, and the image decoder's threads. A second build
 * thread therefore finds about half a core free on two cores, and adds 1.4–2.8 s of
 * CPU time of its own (its start-up and V8 compiling the same code again), so it was
 * measured slower, not faster; a thread is started only per 1.5 cores.
 */
export const CORES_PER_BUILD_THREAD = 1.5;

/**
 * `--jobs N`: a whole number of threads from 1 to MAX_JOBS. By default one per sheet,
 * up to one per CORES_PER_BUILD_THREAD cores: one thread on a 2-core machine, where
 * `--jobs 2` measured no faster (README, "Speed of a whole build"), two on 4 cores.
 */
export function defaultJobs(sheetCount: number, cores: number = availableParallelism()): number {
  return Math.max(1, Math.min(Math.floor(cores / CORES_PER_BUILD_THREAD), sheetCount));
}

export function jobsOption(value: string | undefined, sheetCount = Infinity): number {
  if (value === undefined) return defaultJobs(sheetCount);
  const jobs = Number(value);
  if (!/^\s*\d+\s*$/.test(value) || !Number.isInteger(jobs) || jobs < 1 || jobs > MAX_JOBS) {
    throw new CliUsageError(`stemline ${COMMAND}: --jobs takes a whole number of threads from 1 to ${MAX_JOBS}, not "${value}".`);
  }
  return jobs;
}

/** "harbour-signs.otf" → "Harbour Signs". */
function familyFromFileName(path: string): string {
  const stem = basename(path).replace(/\.[^.]+$/, '').replace(/[-_]+/g, ' ').trim();
  return stem.length > 0 ? stem.replace(/\b\w/g, (c) => c.toUpperCase()) : 'Untitled';
}

/** One line per glyph, tab-separated: character, code point, glyph name, advance, segments, on-curve points, corners, max deviation, warnings. */
function printSummary(font: DraftFont, streams: CliStreams): void {
  for (const glyph of font.glyphs) streams.out(`${summaryLine(glyph)}\n`);
}

export function summaryLine(glyph: DraftGlyph): string {
  const report = glyph.source.letter.report;
  const code = `U+${(glyph.character.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`;
  return [
    glyph.character,
    code,
    glyphNameForCodePoint(glyph.character.codePointAt(0) ?? 0),
    `advance ${glyph.advanceWidth}`,
    `segments ${report?.segmentCount ?? 0}`,
    `on-curve ${report?.onCurveCount ?? 0}`,
    `corners ${report?.cornerCount ?? 0}`,
    `max-deviation ${(report?.maxDeviation ?? 0).toFixed(2)}`,
    `warnings ${report?.warnings.length ?? 0}`,
  ].join('\t');
}
