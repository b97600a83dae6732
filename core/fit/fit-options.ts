/**
 * The settings of the fitting engine, with their defaults and the reasons for them.
 *
 * Everything the fitter decides from the caller's side lives here: how far the outline
 * may stray from the traced boundary, what counts as a corner, when a nearly straight
 * line is made exactly horizontal or vertical, which points the user has forced, and
 * how fine the coordinate grid is. All lengths are font units in a y-up frame; the caller
 * maps traced pixel chains into that frame before fitting.
 */

export interface FitOptions {
  /**
   * Largest allowed distance, in font units, from any traced boundary point to the
   * outline (outside the rounded tips of corners, which are recovered by sharpening
   * rather than followed). Default {@link DEFAULT_TOLERANCE}.
   */
  readonly tolerance?: number;
  /**
   * A point where the boundary's tangent turns by more than this many degrees is a
   * corner; between two straight sides, from 0.8 of it (corners.ts). Default
   * {@link DEFAULT_CORNER_ANGLE_DEGREES}.
   */
  readonly cornerAngleDegrees?: number;
  /**
   * A straight line within this many degrees of horizontal or vertical is made exactly
   * horizontal or vertical. Default {@link DEFAULT_AXIS_SNAP_DEGREES}.
   */
  readonly axisSnapDegrees?: number;
  /** Chain indices that must become corners, whatever the detector says. */
  readonly forcedCorners?: readonly number[];
  /** Chain indices that must never become corners (the join there is kept smooth). */
  readonly forcedSmooth?: readonly number[];
  /** Coordinate grid in font units; outputs are multiples of it. Default 1 (integers). */
  readonly grid?: number;
  /**
   * Size of one scan pixel in font units. The scale of scan noise and of the corner
   * rounding caused by anti-aliasing and blur is a pixel, so the fitter's local windows
   * are measured in pixels. Default: estimated as the median step between consecutive
   * chain points (boundary tracers step about one pixel at a time).
   */
  readonly pixelSize?: number;
  /**
   * The scan's edge blur σ in scan pixels, as the tracer measures it
   * (core/raster/edge-blur.ts). It sets how far a corner the scan rounded may lie from
   * the traced tip, and so tells that rounding from one the designer drew. Default:
   * unknown, and corners are given the reach of a moderately blurred scan
   * (corners.ts, CORNER_ROUNDING_RADIUS_PX).
   */
  readonly scanBlurPx?: number;
  /**
   * The scan's noise σ across the boundary, in scan pixels. With `scanBlurPx` it sets
   * the margin by which a corner may lie beyond the tip the blur predicts
   * (corners.ts, cornerReachMarginPx). Give it when the scan's noise is known better
   * than a boundary's own scatter shows it (the tracer's `edgeNoisePx` for a smoothed
   * 1-bit scan). Default: measured on each chain (local-line.ts estimateNoise).
   */
  readonly scanNoisePx?: number;
  /**
   * 'economy' fits the fewest on-curve points (corners, lines, extrema, least-squares
   * cubics); 'smooth' fits one C² B-spline and reduces it (smooth-fit.ts), for brush
   * and pen lettering where curvature continuity matters more than point economy.
   * Default {@link DEFAULT_FIT_MODE}.
   */
  readonly mode?: FitMode;
  /**
   * Make smooth joins curvature-continuous (G2) where the tolerance allows, by
   * adjusting handle lengths along their tangents (fairing.ts). Default
   * {@link DEFAULT_FAIRING} in economy mode; on in smooth mode, whose point is curvature
   * continuity (its reduction to fewer points merges C² pieces into G1 joins, which
   * fairing makes G2 again).
   */
  readonly fairing?: boolean;
}

/** How the fitter trades point economy against curvature continuity (see `FitOptions.mode`). */
export type FitMode = 'economy' | 'smooth';

/** Every option resolved to a value. */
export interface ResolvedFitOptions {
  readonly tolerance: number;
  readonly cornerAngleDegrees: number;
  readonly axisSnapDegrees: number;
  readonly forcedCorners: readonly number[];
  readonly forcedSmooth: readonly number[];
  readonly grid: number;
  /** Undefined here means: estimate from the chain. */
  readonly pixelSize: number | undefined;
  /** Undefined here means: unknown. */
  readonly scanBlurPx: number | undefined;
  readonly scanNoisePx: number | undefined;
  readonly mode: FitMode;
  readonly fairing: boolean;
}

/**
 * Default tolerance: 1.5 font units. At the intended scan scale of about one pixel per
 * unit, traced boundaries deviate from the drawn edge by 0.5–2 units (measured: median
 * Hausdorff 0.6 units clean, 1.9 units on a degraded scan, in round trips on the
 * reference fonts), so a
 * tighter tolerance only makes the outline follow scan noise with extra points, and a
 * looser one starts to lose drawn detail. 1.5 units on a 1000-unit em is 0.15 % of the
 * em, below what is visible at text sizes.
 */
export const DEFAULT_TOLERANCE = 1.5;

/**
 * Default corner angle: 25°. Tangent turns of drawn corners in text typefaces are
 * mostly 45–150°; bracketed serifs and stem joins go down to about 25–30°. Below
 * about 20° a turn on a noisy chain cannot be told from a tight curve (the measured
 * noise in the detector's tangents is a few degrees, see corners.ts), so 25° keeps
 * nearly every drawn corner without inventing corners on curves. Common practice
 * puts this threshold between 20° and 30°.
 */
export const DEFAULT_CORNER_ANGLE_DEGREES = 25;

/**
 * Default axis snap: 2°. Common practice: a line drawn by hand to be vertical is
 * rarely more than a degree or two off, while an intended slant (an italic or a
 * diagonal stroke) is at least several degrees.
 */
export const DEFAULT_AXIS_SNAP_DEGREES = 2;

/** Default grid: 1 font unit (integer coordinates, as font formats store them). */
export const DEFAULT_GRID = 1;

/**
 * Default mode: 'economy'. Most lettering is drawn for text typefaces, where few,
 * well-placed on-curve points are what a designer edits and what hints well; smooth
 * mode is the option for brush and pen work.
 */
export const DEFAULT_FIT_MODE: FitMode = 'economy';

/**
 * Fairing is off by default: it changes handle lengths the least-squares fit chose,
 * spends part of the tolerance, costs several extra solves per contour, and grid
 * rounding afterwards reopens small curvature steps (fairing.ts); it is for users who
 * judge outlines by a curvature comb and ask for it.
 */
export const DEFAULT_FAIRING = false;

/**
 * Smooth mode fairs unless told not to. Measured on traced Cantarell D O S C G o c e
 * (1 px per unit): median relative curvature step at smooth cubic joins after rounding
 * 7.2 % without fairing, 3.3 % with it; before rounding 7.9 % and 0.
 */
export const SMOOTH_MODE_FAIRING = true;

/**
 * The options with defaults filled in. Throws a RangeError naming the option for
 * values that cannot work (non-positive tolerance or grid, angles outside (0°, 180°),
 * an unknown mode).
 */
export function resolveFitOptions(options: FitOptions = {}): ResolvedFitOptions {
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  const cornerAngleDegrees = options.cornerAngleDegrees ?? DEFAULT_CORNER_ANGLE_DEGREES;
  const axisSnapDegrees = options.axisSnapDegrees ?? DEFAULT_AXIS_SNAP_DEGREES;
  const grid = options.grid ?? DEFAULT_GRID;
  if (!(tolerance > 0) || !Number.isFinite(tolerance)) throw new RangeError(`tolerance must be a positive number of font units, got ${String(tolerance)}`);
  if (!(cornerAngleDegrees > 0 && cornerAngleDegrees < 180)) throw new RangeError(`cornerAngleDegrees must be between 0 and 180, got ${String(cornerAngleDegrees)}`);
  if (!(axisSnapDegrees >= 0 && axisSnapDegrees < 45)) throw new RangeError(`axisSnapDegrees must be between 0 and 45, got ${String(axisSnapDegrees)}`);
  if (!(grid > 0) || !Number.isFinite(grid)) throw new RangeError(`grid must be a positive number of font units, got ${String(grid)}`);
  if (options.pixelSize !== undefined && !(options.pixelSize > 0)) throw new RangeError(`pixelSize must be positive, got ${String(options.pixelSize)}`);
  if (options.scanBlurPx !== undefined && !(options.scanBlurPx > 0 && Number.isFinite(options.scanBlurPx))) throw new RangeError(`scanBlurPx must be a positive number of scan pixels, got ${String(options.scanBlurPx)}`);
  if (options.scanNoisePx !== undefined && !(options.scanNoisePx >= 0 && Number.isFinite(options.scanNoisePx))) throw new RangeError(`scanNoisePx must be zero or a positive number of scan pixels, got ${String(options.scanNoisePx)}`);
  const mode = options.mode ?? DEFAULT_FIT_MODE;
  if (mode !== 'economy' && mode !== 'smooth') throw new RangeError(`mode must be 'economy' or 'smooth', got ${String(mode)}`);
  return {
    tolerance,
    cornerAngleDegrees,
    axisSnapDegrees,
    forcedCorners: options.forcedCorners ?? [],
    forcedSmooth: options.forcedSmooth ?? [],
    grid,
    pixelSize: options.pixelSize,
    scanBlurPx: options.scanBlurPx,
    scanNoisePx: options.scanNoisePx,
    mode,
    fairing: options.fairing ?? (mode === 'smooth' ? SMOOTH_MODE_FAIRING : DEFAULT_FAIRING),
  };
}
