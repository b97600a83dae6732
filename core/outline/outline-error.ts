/**
 * The error the outline model throws for point lists that are not a valid outline
 * (a malformed contour, a project file with bad outline data). The message says what
 * was wrong; `code` lets callers tell the kinds apart.
 */
export type OutlineErrorCode = 'bad-contour' | 'bad-outline-data';

export class OutlineError extends Error {
  readonly code: OutlineErrorCode;
  constructor(code: OutlineErrorCode, message: string) {
    super(message);
    this.name = 'OutlineError';
    this.code = code;
  }
}
