// The Stemline project file, format 2: what a project holds — the font's settings,
// the fitting settings, the scans (by relative path, optionally with an embedded
// copy), and every glyph's characters, outline, metrics and per-point fitting
// overrides — as a valibot schema, so a file that was hand-edited or half-synced is
// refused with the field that is wrong. Format 1 files are read through
// migrate-format-1.ts. Format 2 changed: a glyph's single `character` became the
// ordered list `unicodes`, and an embedded scan carries its SHA-256. Later, within
// format 2, the font gained the optional `metricsSetByUser`: which vertical metrics
// the designer typed (the others are measured from the drawing). A file without it
// opens as before (renderer/src/project/saved-metrics.ts says how it is read). And a
// scan gained the optional `sheetEdits` (sheet-edits-schema.ts). Then the settings the
// app sets (core/pipeline/pipeline-settings.ts): the fit gained the optional `fitMode`
// and `fairJoins`, a scan the optional `speckAreaMm2` and `pinholeAreaMm2` beside its
// `threshold` and `invert`; a file without them opens with the defaults
// (renderer/src/project/saved-settings.ts).
import * as v from 'valibot';
import type { MetricName } from '../../../core/document/index.ts';
import { CLEANUP_AREA_RANGE, FIT_MODES, GREY_LEVEL_RANGE } from '../../../core/pipeline/pipeline-settings.ts';
import { sheetEditsSchema } from './sheet-edits-schema.ts';

/** The `format` field's value: tells a Stemline project from any other JSON. */
export const PROJECT_FORMAT_NAME = 'stemline-project';

/** The format this version writes, and the newest it reads. */
export const CURRENT_FORMAT_VERSION = 2;

/** Project file extension. */
export const PROJECT_EXTENSION = '.stemline';

/** Largest coordinate or metric accepted: CFF coordinates must fit a signed 16-bit integer (OpenType 'CFF ' via Type 2 charstrings). */
const INT16_MAX = 32767;

const fontUnits = v.pipe(v.number(), v.finite(), v.minValue(-INT16_MAX), v.maxValue(INT16_MAX));
const positiveUnits = v.pipe(v.number(), v.integer(), v.minValue(16), v.maxValue(16384)); // unitsPerEm range: OpenType 'head' table

/** The vertical metrics a designer can type over the measured ones (core/document font-metrics-commands.ts). */
export const SAVED_METRIC_NAMES = ['unitsPerEm', 'ascender', 'capHeight', 'xHeight', 'descender', 'lineGap'] as const satisfies readonly MetricName[];

const pointSchema = v.tuple([fontUnits, fontUnits, v.picklist(['on', 'on-smooth', 'off'])]);

/** The last Unicode code point (Unicode, "Code Points"). */
const LAST_CODE_POINT = 0x10ffff;
/** A code point as the UFO format writes one: 4 to 6 uppercase hex digits (UFO 3, glif "unicode" element). */
const UNICODE_HEX = /^[0-9A-F]{4,6}$/;

const unicodeSchema = v.pipe(
  v.string(),
  v.regex(UNICODE_HEX, 'a code point as 4–6 uppercase hex digits, e.g. "0041" for A'),
  v.check((hex) => Number.parseInt(hex, 16) <= LAST_CODE_POINT, 'a code point at most 10FFFF'),
);

/** Lowercase hex SHA-256 digest: 32 bytes (FIPS 180-4). */
const SHA256_HEX = /^[0-9a-f]{64}$/;
/**
 * Standard base64 with padding (RFC 4648, section 4): the alphabet, then at most two
 * "=". A plain character-class loop: a grouped pattern such as (?:x{4})* overflows
 * the regular expression stack on the tens of megabytes of an embedded scan.
 */
const BASE64 = /^[A-Za-z0-9+/]*={0,2}$/;
/** Base64 comes in groups of four characters (RFC 4648, section 4). */
const BASE64_GROUP = 4;

/** Whether `text` is standard, padded base64 (RFC 4648, section 4). */
export function isBase64(text: string): boolean {
  return text.length % BASE64_GROUP === 0 && BASE64.test(text);
}

const embeddedScanSchema = v.strictObject({
  /** SHA-256 of the scan's original bytes, lowercase hex. */
  sha256: v.pipe(v.string(), v.regex(SHA256_HEX, 'a SHA-256 digest: 64 lowercase hex digits')),
  /** The scan's original bytes in base64. */
  base64: v.pipe(
    v.string(),
    v.check(isBase64, 'the scan\'s bytes in standard base64 (A–Z, a–z, 0–9, "+", "/", "=" padding)'),
  ),
});

const glyphSchema = v.strictObject({
  /**
   * The code points the glyph is for, in order, the first its own (primary) one,
   * the one its default name comes from; empty for an unencoded glyph. The UFO's
   * convention (UFO 3, glif: "the first occurrence … defines the primary Unicode
   * value").
   */
  unicodes: v.array(unicodeSchema),
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
  /** A copy of the scan, when the user chose to embed it: used when the file at `path` is missing. */
  embedded: v.optional(embeddedScanSchema),
  dpi: v.optional(v.pipe(v.number(), v.minValue(1), v.maxValue(100000))),
  characters: v.optional(v.string()),
  /** The user's corrections of the scan's letters and guides, in order; when present they include the assignments of characters. */
  sheetEdits: v.optional(sheetEditsSchema),
  threshold: v.optional(v.union([v.literal('otsu'), v.literal('local'), v.pipe(v.number(), v.integer(), v.minValue(GREY_LEVEL_RANGE.min), v.maxValue(GREY_LEVEL_RANGE.max))])),
  invert: v.optional(v.boolean()),
  /** Ink specks smaller than this (mm²) were erased when tracing; absent: the default. */
  speckAreaMm2: v.optional(v.pipe(v.number(), v.minValue(CLEANUP_AREA_RANGE.min), v.maxValue(CLEANUP_AREA_RANGE.max))),
  /** Pinholes smaller than this (mm²) were filled; absent: the default. */
  pinholeAreaMm2: v.optional(v.pipe(v.number(), v.minValue(CLEANUP_AREA_RANGE.min), v.maxValue(CLEANUP_AREA_RANGE.max))),
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
    /** The metrics above that the designer typed; the rest follow the drawing. Absent in files saved before it existed. */
    metricsSetByUser: v.optional(v.array(v.picklist(SAVED_METRIC_NAMES))),
  }),
  fit: v.strictObject({
    tolerance: v.pipe(v.number(), v.minValue(0.05), v.maxValue(100)),
    cornerAngleDegrees: v.pipe(v.number(), v.minValue(1), v.maxValue(179)),
    axisSnapDegrees: v.pipe(v.number(), v.minValue(0), v.maxValue(45)),
    /** Absent: economy, the default. */
    fitMode: v.optional(v.picklist(FIT_MODES)),
    /** Absent: off, the default (smooth mode fairs whatever this says). */
    fairJoins: v.optional(v.boolean()),
  }),
  scans: v.array(scanSchema),
  glyphs: v.array(glyphSchema),
});

/** A validated project, as read from or written to a project file. */
export type ProjectData = v.InferOutput<typeof projectSchema>;
/** One glyph of a project. */
export type ProjectGlyph = ProjectData['glyphs'][number];
/** One scan of a project. */
export type ProjectScan = ProjectData['scans'][number];
/** The embedded copy of a scan. */
export type EmbeddedScan = NonNullable<ProjectScan['embedded']>;
