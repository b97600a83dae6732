// The fitting options the tracing commands share (`trace`, `build`): how closely the
// outline follows the ink, what counts as a corner, the fitting mode and curvature
// fairing. One spec and one parser, so both commands spell and check them alike.
import { DEFAULT_CORNER_ANGLE_DEGREES, DEFAULT_TOLERANCE, type FitOptions } from '../../../core/fit/index.ts';
import { CORNER_ANGLE_RANGE, FIT_MODES, TOLERANCE_RANGE } from '../../../core/pipeline/index.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { numberOption } from '../parse-options.ts';

// The accepted ranges are the pipeline settings' (core/pipeline/pipeline-settings.ts), shared with the app's settings panel.

export const fitOptionSpec = {
  tolerance: { type: 'string' },
  'corner-angle': { type: 'string' },
  'fit-mode': { type: 'string' },
  'fair-joins': { type: 'boolean' },
} as const;

export const FIT_OPTIONS_HELP = [
  `--tolerance UNITS              largest distance from the traced ink, in font units (default ${DEFAULT_TOLERANCE}, never under 0.75 px)`,
  `--corner-angle DEGREES         tangent turns sharper than this are corners (default ${DEFAULT_CORNER_ANGLE_DEGREES}; between two straight sides, 0.8 of it)`,
  '--fit-mode economy|smooth      economy: fewest points (default); smooth: curvature-continuous curves for brush and pen work',
  '--fair-joins                   make smooth joins curvature-continuous (G2) where the tolerance allows',
];

interface FitValues {
  tolerance?: string | undefined;
  'corner-angle'?: string | undefined;
  'fit-mode'?: string | undefined;
  'fair-joins'?: boolean | undefined;
}

/** Turns parsed option values into fit options, or throws CliUsageError naming the option. */
export function fitOptionsFrom(command: string, values: FitValues): FitOptions {
  const fit: { -readonly [K in keyof FitOptions]: FitOptions[K] } = {};
  const tolerance = numberOption(command, 'tolerance', values.tolerance, TOLERANCE_RANGE.min, TOLERANCE_RANGE.max);
  if (tolerance !== undefined) fit.tolerance = tolerance;
  const cornerAngle = numberOption(command, 'corner-angle', values['corner-angle'], CORNER_ANGLE_RANGE.min, CORNER_ANGLE_RANGE.max);
  if (cornerAngle !== undefined) fit.cornerAngleDegrees = cornerAngle;
  const mode = values['fit-mode'];
  if (mode !== undefined) {
    const known = FIT_MODES.find((m) => m === mode);
    if (known === undefined) throw new CliUsageError(`stemline ${command}: --fit-mode takes ${FIT_MODES.join(' or ')}, not "${mode}".`);
    fit.mode = known;
  }
  if (values['fair-joins'] === true) fit.fairing = true;
  return fit;
}
