// What the font writer is given: a family's names and vertical metrics, and its
// glyphs as outlines in the shared outline model (core/outline: font units, y up,
// baseline at y = 0, cubic contours, outer contours counter-clockwise). This is
// plain data; the writer validates it and never changes it.
import type { GlyphOutline } from '../../../core/outline/index.ts';

/** One glyph to put into the font. */
export interface FontGlyph {
  /**
   * The glyph's own character (its primary one): exactly one Unicode code point, or
   * '' for a glyph reached by no character (an alternate, a component).
   */
  readonly character: string;
  /**
   * Every character the glyph is for, in order, each one code point: `character`
   * first, then any others the font maps to the same drawing (a no-break space with
   * the space, a soft hyphen with the hyphen). The cmap maps all of them to this
   * glyph. Default: just `character` (none when it is ''). The same order as the UFO
   * format's list of unicode values, whose first is the primary one.
   */
  readonly characters?: readonly string[];
  /**
   * The glyph name. Default: the Adobe Glyph List for New Fonts name of the
   * (primary) character, or uniXXXX / uXXXXX (see glyph-names.ts). Required when
   * `character` is ''.
   */
  readonly name?: string;
  readonly outline: GlyphOutline;
  /** Advance width in font units; rounded to a whole unit in the font. */
  readonly advanceWidth: number;
  /**
   * Where the leftmost ink sits, in font units from the origin. When given, the
   * outline is moved horizontally by whole units so that its left edge lands here;
   * when absent, it is the outline's own left edge.
   */
  readonly leftSidebearing?: number;
}

/** A whole font family member (one style) to write. */
export interface FontSource {
  readonly familyName: string;
  /** e.g. "Regular", "Bold", "Light Italic". */
  readonly styleName: string;
  /** Default DEFAULT_UNITS_PER_EM. */
  readonly unitsPerEm?: number;
  /** Top of the line's ink space above the baseline (positive), font units. */
  readonly ascender: number;
  /** Bottom of the line's ink space (zero or negative), font units. */
  readonly descender: number;
  /** Extra space between lines, font units. Default 0. */
  readonly lineGap?: number;
  /** Height of flat-topped lowercase letters such as x, font units. */
  readonly xHeight: number;
  /** Height of flat-topped capitals such as H, font units. */
  readonly capHeight: number;
  /** 1–1000; 400 is Regular, 700 Bold (OpenType spec, OS/2 usWeightClass). Default 400. */
  readonly weightClass?: number;
  /** Four printable ASCII characters identifying the maker (OS/2 achVendID). Default STEMLINE_VENDOR_ID. */
  readonly vendorId?: string;
  /** Font revision, e.g. 1.002; written as "Version 1.002". Default 1. */
  readonly version?: number;
  readonly designer?: string;
  /** Creation and modification time written into the font. Default REPRODUCIBLE_TIMESTAMP. */
  readonly timestamp?: Date;
  readonly glyphs: readonly FontGlyph[];
}

/** Units per em when none is given (core/metrics: the CFF convention). */
export { DEFAULT_UNITS_PER_EM } from '../../../core/metrics/units-per-em.ts';

/** Regular weight (OpenType spec, OS/2 usWeightClass: 400 = Normal/Regular). */
export const DEFAULT_WEIGHT_CLASS = 400;

/** Our own vendor tag for OS/2 achVendID, used when the source names none. */
export const STEMLINE_VENDOR_ID = 'STML';

/** Font revision when none is given. */
export const DEFAULT_FONT_VERSION = 1;

/**
 * The time written into every font whose source gives none, so that writing the
 * same source twice gives the same bytes (a build that stamps "now" never does).
 */
export const REPRODUCIBLE_TIMESTAMP = new Date(Date.UTC(2000, 0, 1, 0, 0, 0));
