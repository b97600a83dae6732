// The error every file reader on the Node side throws for input it cannot use: a
// scan that will not decode, an image over the pixel budget, a page with no ink, a
// font file that is damaged or in a format Stemline does not read.
// The message names the file, says what was wrong and what to do; `kind` lets the
// CLI, the UI and the tests tell failures apart without parsing prose.

export type InputErrorKind =
  | 'file-unreadable'
  | 'image-unsupported'
  | 'image-corrupt'
  | 'image-too-large'
  | 'image-empty'
  | 'font-unreadable'
  | 'font-unsupported'
  | 'font-too-large';

export class InputError extends Error {
  readonly kind: InputErrorKind;
  readonly file: string;

  constructor(kind: InputErrorKind, file: string, message: string) {
    super(message);
    this.name = 'InputError';
    this.kind = kind;
    this.file = file;
  }
}
