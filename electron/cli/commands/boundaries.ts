// `stemline boundaries IMAGE -o OUT.svg [--json]`: decodes a scan, thresholds and
// cleans it, traces the raw boundary chains and groups them into letters, writing
// the chains as SVG polylines in the image's pixel frame; `--json` prints the
// segmentation (letters, rows, baselines). For inspecting what the fitter receives.
import { decodeScanFile } from '../../io/decode-scan.ts';
import { boundarySvg } from '../../io/boundary-svg.ts';
import { writeFileAtomic } from '../../io/atomic-write.ts';
import { traceScan, type TraceScanResult } from '../../../core/raster/index.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { parseCommandLine } from '../parse-options.ts';
import type { CliCommand } from '../run-cli.ts';
import { EXIT_OK } from '../usage.ts';
import { SCAN_OPTIONS_HELP, scanOptionSpec, scanSettingsFrom } from './scan-options.ts';

const COMMAND = 'boundaries';

export const boundariesCommand: CliCommand = {
  name: COMMAND,
  synopsis: 'boundaries IMAGE -o OUT.svg [--json] [scan options]',
  purpose: 'trace the raw ink boundaries of a scan and group them into letters (SVG polylines, pixel frame)',
  options: ['-o, --output OUT.svg           where to write the boundary chains', '--json                         print the letters, rows and baselines found', ...SCAN_OPTIONS_HELP],
  async run(args, streams) {
    const { values, positionals } = parseCommandLine(COMMAND, args, {
      output: { type: 'string', short: 'o' },
      json: { type: 'boolean' },
      ...scanOptionSpec,
    });
    const [image, ...extra] = positionals;
    if (image === undefined) throw new CliUsageError(`stemline ${COMMAND}: name the scan to trace, e.g. "stemline ${COMMAND} sheet.png -o sheet.svg".`);
    if (extra.length > 0) throw new CliUsageError(`stemline ${COMMAND}: one image at a time; unexpected "${extra.join(' ')}".`);
    if (values.output === undefined && values.json !== true) {
      throw new CliUsageError(`stemline ${COMMAND}: say where to write the SVG with -o OUT.svg, or ask for --json.`);
    }
    const settings = scanSettingsFrom(COMMAND, values);
    const scan = await decodeScanFile(image);
    const dpi = settings.dpi ?? scan.dpi;
    const raster = dpi === undefined ? scan.raster : { ...scan.raster, dpi };
    const result = traceScan({ raster }, settings.trace);
    if (values.output !== undefined) {
      await writeFileAtomic(values.output, boundarySvg(raster.width, raster.height, result.contours, result.sheet));
    }
    if (values.json === true) streams.out(`${JSON.stringify(segmentationReport(image, result, [...scan.notes, ...result.notes]), null, 2)}\n`);
    return EXIT_OK;
  },
};

/** The `--json` report: stable field names, other tools parse them. */
export function segmentationReport(image: string, result: TraceScanResult, notes: string[]) {
  return {
    image,
    width: result.mask.width,
    height: result.mask.height,
    dpi: result.resolution.dpiX,
    dpiAssumed: result.resolution.assumed,
    threshold: { method: result.method, level: result.level, isoLevel: result.isoLevel },
    boundary: result.boundary,
    rows: result.sheet.rows.map((row) => ({ index: row.index, top: row.top, bottom: row.bottom, baseline: row.baseline })),
    letters: result.sheet.letters.map((letter) => ({
      index: letter.index,
      character: letter.character,
      row: letter.row,
      box: letter.box,
      contours: letter.contours.map((i) => {
        const contour = result.contours[i];
        return { depth: contour?.depth ?? 0, points: contour?.points.length ?? 0 };
      }),
    })),
    notes,
  };
}
