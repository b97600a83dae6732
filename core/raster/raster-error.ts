// The one error type the raster stage throws. A code lets callers (the UI, the CLI)
// react to the kind of failure; the message tells a person what was wrong and what to
// do about it, because it is shown to lettering artists, not to programmers.

/**
 * - `bad-raster`: the raster or mask handed in is malformed (size, data type or length).
 * - `bad-option`: an option is out of its documented range.
 * - `empty-page`: no ink remains after binarization and cleanup.
 */
export type RasterErrorCode = 'bad-raster' | 'bad-option' | 'empty-page';

/** An error from the raster stage; `code` says which kind, `message` what to do. */
export class RasterError extends Error {
  readonly code: RasterErrorCode;

  constructor(code: RasterErrorCode, message: string) {
    super(message);
    this.name = 'RasterError';
    this.code = code;
  }
}
