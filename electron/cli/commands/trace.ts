// `stemline trace IMAGE -o OUT.svg [--tolerance UNITS] [--corner-angle DEGREES] [--json]`
// (and `--fit-mode`, `--fair-joins`, the scan options):
// the whole tracing job on one scan — decode, threshold, cleanup, boundaries, letters,
// fitting — writing the fitted outlines as SVG on the image's pixel frame; `--json`
// prints the quality report. A contract other tools rely on: extend it compatibly.
import { decodeScanFile } from '../../io/decode-scan.ts';
import { outlineSvg } from '../../io/outline-svg.ts';
import { writeFileAtomic } from '../../io/atomic-write.ts';
import { traceLetters, type TracedLetters } from '../../../core/pipeline/index.ts';
import { DEFAULT_CAP_HEIGHT_UNITS } from '../../../core/metrics/index.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { numberOption, parseCommandLine } from '../parse-options.ts';
import type { CliCommand } from '../run-cli.ts';
import { EXIT_OK } from '../usage.ts';
import { SCAN_OPTIONS_HELP, scanOptionSpec, scanSettingsFrom } from './scan-options.ts';
import { FIT_OPTIONS_HELP, fitOptionSpec, fitOptionsFrom } from './fit-cli-options.ts';

const COMMAND = 'trace';

export const traceCommand: CliCommand = {
  name: COMMAND,
  synopsis: 'trace IMAGE -o OUT.svg [--tolerance UNITS] [--corner-angle DEGREES] [--json]',
  purpose: 'fit type-quality cubic outlines to the letters of a scan (SVG on the image\'s pixel frame)',
  options: [
    '-o, --output OUT.svg           where to write the outlines',
    ...FIT_OPTIONS_HELP,
    `--cap-height UNITS             font units the drawn cap height (or typical letter height) becomes (default ${DEFAULT_CAP_HEIGHT_UNITS})`,
    '--json                         print the quality report',
    ...SCAN_OPTIONS_HELP,
  ],
  async run(args, streams) {
    const { values, positionals } = parseCommandLine(COMMAND, args, {
      output: { type: 'string', short: 'o' },
      ...fitOptionSpec,
      'cap-height': { type: 'string' },
      json: { type: 'boolean' },
      ...scanOptionSpec,
    });
    const [image, ...extra] = positionals;
    if (image === undefined) throw new CliUsageError(`stemline ${COMMAND}: name the scan to trace, e.g. "stemline ${COMMAND} letter.png -o letter.svg".`);
    if (extra.length > 0) throw new CliUsageError(`stemline ${COMMAND}: one image at a time; unexpected "${extra.join(' ')}".`);
    if (values.output === undefined && values.json !== true) throw new CliUsageError(`stemline ${COMMAND}: say where to write the SVG with -o OUT.svg, or ask for --json.`);
    const fit = fitOptionsFrom(COMMAND, values);
    const capHeight = numberOption(COMMAND, 'cap-height', values['cap-height'], 16, 16384);
    const settings = scanSettingsFrom(COMMAND, values);

    const scan = await decodeScanFile(image);
    const dpi = settings.dpi ?? scan.dpi;
    const raster = dpi === undefined ? scan.raster : { ...scan.raster, dpi };
    const traced = traceLetters({ raster }, { scan: settings.trace, fit, ...(capHeight === undefined ? {} : { capHeightUnits: capHeight }) });
    if (values.output !== undefined) await writeFileAtomic(values.output, outlineSvg(raster.width, raster.height, traced.letters));
    if (values.json === true) streams.out(`${JSON.stringify(qualityReport(image, traced, scan.notes), null, 2)}\n`);
    return EXIT_OK;
  },
};

/** The `--json` quality report: stable field names, other tools parse them. */
export function qualityReport(image: string, traced: TracedLetters, decodeNotes: readonly string[]) {
  return {
    image,
    width: traced.scan.mask.width,
    height: traced.scan.mask.height,
    dpi: traced.scan.resolution.dpiX,
    dpiAssumed: traced.scan.resolution.assumed,
    unitsPerPixel: traced.unitsPerPixel,
    tolerance: traced.tolerance,
    letters: traced.letters.map((letter) => ({
      index: letter.index,
      character: letter.character,
      row: letter.row,
      contours: letter.report?.contourCount ?? 0,
      segments: letter.report?.segmentCount ?? 0,
      lines: letter.report?.lineCount ?? 0,
      onCurvePoints: letter.report?.onCurveCount ?? 0,
      corners: letter.report?.cornerCount ?? 0,
      maxDeviation: letter.report?.maxDeviation ?? null,
      meanDeviation: letter.report?.meanDeviation ?? null,
      warnings: (letter.report?.warnings ?? []).map((w) => ({ kind: w.kind, at: w.at, value: w.value, message: w.message })),
      problem: letter.problem,
    })),
    notes: [...decodeNotes, ...traced.notes],
  };
}
