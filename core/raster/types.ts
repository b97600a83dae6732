// The data model of the raster stage: greyscale scans, ink masks and the boundary
// contours traced from them, all in one shared pixel frame. Every other file in
// core/raster/ speaks these types, so the conventions live here, once.

/**
 * A point in the pixel frame (see below). Kept local to the raster stage so that this
 * package depends on nothing else in core/.
 */
export interface Point {
  readonly x: number;
  readonly y: number;
}

/**
 * An axis-aligned box in the pixel frame: it covers [x, x + width] × [y, y + height].
 */
export interface Box {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

/**
 * A greyscale raster, row-major: the pixel in column `col` and row `row` is
 * `data[row * width + col]`. 0 is black, 255 is white.
 *
 * Pixel frame, shared by every output of this stage: pixel (col, row) covers the unit
 * square [col, col + 1] × [row, row + 1]; x grows to the right and y grows downward
 * (screen orientation); pixel centres are at (col + 0.5, row + 0.5). This is the same
 * convention as an HTML/Skia canvas, whose pixel (i, j) covers [i, i + 1] × [j, j + 1].
 *
 * `dpi` is optional metadata (dots per inch, equal on both axes). When a scanner reports
 * different horizontal and vertical resolutions, carry them on a {@link ScanImage}.
 */
export interface GreyRaster {
  readonly width: number;
  readonly height: number;
  readonly data: Uint8Array;
  readonly dpi?: number;
}

/**
 * A scan as it arrives from the decoder: the raster plus whatever resolution the file
 * declared. `dpiX`/`dpiY` take precedence over `raster.dpi`.
 */
export interface ScanImage {
  readonly raster: GreyRaster;
  readonly dpiX?: number;
  readonly dpiY?: number;
}

/**
 * A binary ink mask on the same grid as its raster: `data[row * width + col]` is 1 where
 * the pixel is ink and 0 where it is paper. No other values occur.
 *
 * Connectivity is fixed throughout the stage: ink is 8-connected (pixels touching only
 * at a corner belong together) and paper is 4-connected. The two must be dual (Rosenfeld
 * 1970, "Connectivity in digital pictures", J. ACM 17) or a diagonal pair of pixels
 * would either connect both ink and paper through the same corner or neither, and
 * contours would cross or leak.
 */
export interface InkMask {
  readonly width: number;
  readonly height: number;
  readonly data: Uint8Array;
}

/**
 * One closed boundary chain, nested.
 *
 * - `points`: the chain in order, closed implicitly (the first point is not repeated at
 *   the end), with no two consecutive points equal (the last and first included).
 * - `depth`: 0 for an outer boundary of ink, 1 for a hole in it, 2 for an island of ink
 *   inside that hole, and so on.
 * - `parent`: index (in the same contour array) of the smallest contour that encloses
 *   this one, or -1 for depth 0.
 * - `area`: signed shoelace area ½·Σ(xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ) in the pixel frame (px²).
 *
 * Winding follows nesting: even depths (ink outlines) have positive area and odd depths
 * (holes) negative area. In the y-down pixel frame a positive shoelace area means the
 * chain runs clockwise as seen on screen, with ink on the right-hand side of the
 * direction of travel; holes run counter-clockwise on screen, again with ink on the
 * right. Flipped into y-up font units (y′ = −y) ink outlines become clockwise, which is
 * the TrueType contour direction.
 */
export interface Contour {
  readonly points: Point[];
  readonly depth: number;
  readonly parent: number;
  readonly area: number;
}
