// Conversion between physical sizes on the paper (millimetres, square millimetres) and
// pixels. Cleanup thresholds are set in millimetres because a lettering artist thinks
// about the size of a speck of dust on the sheet, not about how many pixels it covers
// at whatever resolution the scanner happened to use.

/** Millimetres per inch (exact, by the 1959 international yard and pound agreement). */
export const MM_PER_INCH = 25.4;

/**
 * Resolution assumed when a scan declares none: 300 dpi is the usual default of
 * document scanners and the resolution most scanning guides recommend for line art
 * at minimum. Results computed with it are flagged in the notes.
 */
export const ASSUMED_DPI = 300;

/** A scan resolution in dots per inch on each axis. */
export interface Resolution {
  readonly dpiX: number;
  readonly dpiY: number;
  /** True when neither axis was declared and {@link ASSUMED_DPI} stands in. */
  readonly assumed: boolean;
}

function usable(dpi: number | undefined): dpi is number {
  return dpi !== undefined && Number.isFinite(dpi) && dpi > 0;
}

/**
 * The resolution to compute with. Each axis takes the first usable (finite, positive)
 * value of: its own declared value, the other axis's value, `dpi`. When none is usable
 * both axes are {@link ASSUMED_DPI} and `assumed` is true.
 */
export function resolveResolution(declared: { readonly dpiX?: number; readonly dpiY?: number; readonly dpi?: number }): Resolution {
  const fallback = usable(declared.dpi) ? declared.dpi : undefined;
  const x = usable(declared.dpiX) ? declared.dpiX : usable(declared.dpiY) ? declared.dpiY : fallback;
  const y = usable(declared.dpiY) ? declared.dpiY : usable(declared.dpiX) ? declared.dpiX : fallback;
  if (x === undefined || y === undefined) return { dpiX: ASSUMED_DPI, dpiY: ASSUMED_DPI, assumed: true };
  return { dpiX: x, dpiY: y, assumed: false };
}

/** Pixels covered by an area of `squareMillimetres` on the paper: mm² · (dpiX / 25.4) · (dpiY / 25.4). */
export function squareMillimetresToPixels(squareMillimetres: number, resolution: Resolution): number {
  return squareMillimetres * (resolution.dpiX / MM_PER_INCH) * (resolution.dpiY / MM_PER_INCH);
}

/** Pixels spanned by `millimetres` on the paper, using the mean of the two axes' resolutions. */
export function millimetresToPixels(millimetres: number, resolution: Resolution): number {
  return (millimetres * Math.sqrt(resolution.dpiX * resolution.dpiY)) / MM_PER_INCH;
}

/** The note to show when the resolution was assumed. */
export function assumedResolutionNote(): string {
  return `The scan does not state its resolution; ${ASSUMED_DPI} dpi was assumed for sizes given in millimetres. Set the resolution if the scan was made at another one.`;
}
