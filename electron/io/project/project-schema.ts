// The Stemline project file, format 1: what a project holds — the font's settings,
// the fitting settings, the scans (by relative path, or embedded), and every glyph's
// outline, metrics and per-point fitting overrides — as a valibot schema, so a file
// that was hand-edited or half-synced is refused with the field that is wrong.
import * as v from 'valibot';

/** The `format` field's value: tells a Stemline project from any other JSON. */
export const PROJECT_FORMAT_NAME = 'stemline-project';

/** The format this version writes, and the newest it reads. */
export const CURRENT_FORMAT_VERSION = 1;

/** Project file extension. */
export const PROJECT_EXTENSION = '.stemline';

/** Largest coordinate or metric accepted: CFF coordinates must fit a signed 16-bit integer (OpenType 'CFF ' via Type 2 charstrings). */
const INT16_MAX = 32767;

const fontUnits = v.pipe(v.number(), v.finite(), v.minValue(-INT16_MAX), v.maxValue(INT16_MAX));
const positiveUnits = v.pipe(v.number(), v.integer(), v.minValue(16), v.maxValue(16384)); // unitsPerEm range: OpenType 'head' table

const pointSchema = v.tuple([fontUnits, fontUnits, v.picklist(['on', 'on-smooth', 'off'])]);

const glyphSchema = v.strictObject({
  character: v.pipe(v.string(), v.maxLength(16)),
  name: v.optional(v.pipe(v.string(), v.regex(/^[A-Za-z_.][A-Za-z0-9_.]{0,62}$/, 'a glyph name of letters, digits, "_" and "." (at most 63)'))),
  advanceWidth: fontUnits,
  leftSidebearing: v.optional(fontUnits),
  outline: v.strictObject({ contours: v.array(v.array(pointSchema)) }),
  source: v.optional(v.strictObject({ scan: v.string(), letter: v.pipe(v.number(), v.integer(), v.minValue(0)) })),
  fitOverrides: v.optional(v.strictObject({
    forcedCorners: v.array(v.pipe(v.number(), v.integer(), v.minValue(0))),
    forcedSmooth: v.array(v.pipe(v.number(), v.integer(), v.minValue(0))),
  })),
});

const scanSchema = v.strictObject({
  id: v.pipe(v.string(), v.minLength(1)),
  /** Path relative to the project file's folder, with "/" separators. */
  path: v.string(),
  /** The scan's bytes in base64, when the user chose to embed it. */
  embedded: v.optional(v.string()),
  dpi: v.optional(v.pipe(v.number(), v.minValue(1), v.maxValue(100000))),
  characters: v.optional(v.string()),
  threshold: v.optional(v.union([v.literal('otsu'), v.literal('local'), v.pipe(v.number(), v.integer(), v.minValue(0), v.maxValue(255))])),
  invert: v.optional(v.boolean()),
});

export const projectSchema = v.strictObject({
  format: v.literal(PROJECT_FORMAT_NAME),
  formatVersion: v.literal(CURRENT_FORMAT_VERSION),
  savedBy: v.optional(v.string()),
  font: v.strictObject({
    familyName: v.pipe(v.string(), v.minLength(1), v.maxLength(200)),
    styleName: v.pipe(v.string(), v.minLength(1), v.maxLength(200)),
    unitsPerEm: positiveUnits,
    capHeight: fontUnits,
    xHeight: fontUnits,
    ascender: fontUnits,
    descender: fontUnits,
    lineGap: v.optional(fontUnits),
  }),
  fit: v.strictObject({
    tolerance: v.pipe(v.number(), v.minValue(0.05), v.maxValue(100)),
    cornerAngleDegrees: v.pipe(v.number(), v.minValue(1), v.maxValue(179)),
    axisSnapDegrees: v.pipe(v.number(), v.minValue(0), v.maxValue(45)),
  }),
  scans: v.array(scanSchema),
  glyphs: v.array(glyphSchema),
});

/** A validated project, as read from or written to a project file. */
export type ProjectData = v.InferOutput<typeof projectSchema>;
