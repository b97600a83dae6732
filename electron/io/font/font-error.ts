// The error the font writer throws for a font source it cannot turn into a valid
// font: a glyph whose points lie outside what a font can store, two glyphs for one
// character, metrics that make no sense. The message says what was wrong, where
// (the glyph, when there is one) and what to do; `kind` lets the CLI, the UI and the
// tests tell the cases apart without parsing prose.
//
// Reading a font file the user chose is input handling like reading a scan: the
// reader throws InputError (electron/io/input-error.ts) with the kinds
// 'font-unreadable' and 'font-unsupported', which the CLI already reports.

export type FontErrorKind =
  | 'bad-metrics'
  | 'bad-name'
  | 'bad-character'
  | 'duplicate-character'
  | 'bad-glyph-name'
  | 'duplicate-glyph-name'
  | 'bad-advance-width'
  | 'coordinate-out-of-range'
  | 'bad-outline';

export class FontError extends Error {
  readonly kind: FontErrorKind;
  /** The glyph the problem is in, when it is in one (its glyph name). */
  readonly glyph: string | undefined;

  constructor(kind: FontErrorKind, message: string, glyph?: string) {
    super(message);
    this.name = 'FontError';
    this.kind = kind;
    this.glyph = glyph;
  }
}
