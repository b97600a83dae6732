// The fitting options the tracing commands share (`trace`, `build`): how closely the
// outline follows the ink, what counts as a corner, the fitting mode and curvature
// fairing. One spec and one parser, so both commands spell and check them alike.
import { DEFAULT_CORNER_ANGLE_DEGREES, DEFAULT_TOLERANCE, type FitOptions } from '../../../core/fit/index.ts';
import { CliUsageError } from '../cli-usage-error.ts';
import { numberOption } from '../parse-options.ts';

/** Accepted tolerance range in font units: below 0.1 is finer than the unit grid; above 50 loses the drawing. */
const TOLERANCE_RANGE = { min: 0.1, max: 50 } as const;
/** Accepted corner angles, degrees: a turn must be more than nothing and less than a reversal. */
const CORNER_ANGLE_RANGE = { min: 1, max: 179 } as const;

export const fitOptionSpec = {
  tolerance: { type: 'string' },
  'corner-angle': { type: 'string' },
  'fit-mode': { type: 'string' },
  'fair-joins': { type: 'boolean' },
} as const;

export const FIT_OPTIONS_HELP = [
  `--tolerance UNITS              largest distance from the traced ink, in font units (default ${DEFAULT_TOLERANCE}, never under 0.75 px)`,
  `--corner-angle DEGREES         tangent turns sharper than this are corners (default ${DEFAULT_CORNER_ANGLE_DEGREES})`,
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
    if (mode !== 'economy' && mode !== 'smooth') throw new CliUsageError(`stemline ${command}: --fit-mode takes economy or smooth, not "${mode}".`);
    fit.mode = mode;
  }
  if (values['fair-joins'] === true) fit.fairing = true;
  return fit;
}
