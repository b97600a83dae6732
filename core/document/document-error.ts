/**
 * The error the glyph document throws when an edit does not fit the state it is
 * applied to: a point reference to a glyph, contour or point that does not exist, or a
 * change whose recorded "before" value is not what the document holds (a transaction
 * built from an older state). The message says what was wrong; `code` tells the kinds
 * apart.
 */
export type DocumentErrorCode = 'unknown-glyph' | 'unknown-point' | 'stale-change' | 'bad-argument';

export class DocumentError extends Error {
  readonly code: DocumentErrorCode;
  constructor(code: DocumentErrorCode, message: string) {
    super(message);
    this.name = 'DocumentError';
    this.code = code;
  }
}
