// A font source checked and settled into exactly what the tables will say: whole-unit
// metrics, names, the style linking, the PostScript name, the timestamp, the glyph
// list and the bounds of all ink. Every table builder works from this, so each
// value is decided once. Bad values are a FontError saying what to change.
import { FontError } from './font-error.ts';
import {
  DEFAULT_FONT_VERSION,
  DEFAULT_UNITS_PER_EM,
  DEFAULT_WEIGHT_CLASS,
  REPRODUCIBLE_TIMESTAMP,
  STEMLINE_VENDOR_ID,
  type FontSource,
} from './font-model.ts';
import { unionOfIntegerBoxes, type IntegerBox } from './integer-outline.ts';
import { postScriptName } from './postscript-name.ts';
import { INT16_MAX, INT16_MIN, prepareGlyphs, type PreparedGlyph } from './prepare-glyphs.ts';
import { styleLinking, type StyleLinking } from './style-linking.ts';

/** head.unitsPerEm range (OpenType spec, 'head': 16 to 16384). */
const MIN_UNITS_PER_EM = 16;
const MAX_UNITS_PER_EM = 16384;
/** OS/2 usWeightClass range (OpenType spec, 'OS/2': 1 to 1000). */
const MIN_WEIGHT_CLASS = 1;
const MAX_WEIGHT_CLASS = 1000;
/** achVendID is four bytes, padded with spaces (OpenType spec, 'OS/2' achVendID). */
const VENDOR_ID_LENGTH = 4;
/** head.fontRevision is a 16.16 fixed-point number (OpenType spec, 'head'). */
const MAX_FONT_REVISION = 32767;
/** Decimals of the version in name ID 5 ("Version 1.000"; OpenType spec, name ID 5: "Version <number>.<number>"). */
const VERSION_DECIMALS = 3;
/** Underline below the baseline and its thickness for a 1000-unit em (common practice; also the CFF Top DICT defaults, Adobe TN #5176). */
const UNDERLINE_POSITION_PER_1000 = -100;
const UNDERLINE_THICKNESS_PER_1000 = 50;
/** Earliest time a font can record: head dates count seconds from 1904-01-01 (OpenType spec, LONGDATETIME). */
const EARLIEST_TIMESTAMP_MS = Date.UTC(1904, 0, 1);
const MS_PER_SECOND = 1000;
/** Printable ASCII, what achVendID may hold. */
const PRINTABLE_ASCII = /^[\x20-\x7e]+$/;
/** Control characters, which no font name may contain. */
const CONTROL_CHARACTER = /\p{Cc}/u;

export interface PreparedFont {
  readonly familyName: string;
  readonly styleName: string;
  readonly fullName: string;
  readonly postScriptName: string;
  readonly linking: StyleLinking;
  readonly unitsPerEm: number;
  readonly ascender: number;
  readonly descender: number;
  readonly lineGap: number;
  readonly xHeight: number;
  readonly capHeight: number;
  readonly weightClass: number;
  /** Exactly four characters. */
  readonly vendorId: string;
  readonly fontRevision: number;
  /** "1.000" */
  readonly versionNumber: string;
  readonly designer: string | undefined;
  /** Seconds since 1970-01-01 UTC. */
  readonly timestampSeconds: number;
  readonly underlinePosition: number;
  readonly underlineThickness: number;
  readonly glyphs: readonly PreparedGlyph[];
  /** Union of every glyph's ink box; all zero when no glyph has ink. */
  readonly inkBounds: IntegerBox;
}

function wholeUnits(value: number | undefined, what: string, fallback?: number): number {
  const v = value ?? fallback;
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new FontError('bad-metrics', `The font's ${what} is ${String(v)}; it must be a number of font units.`);
  const rounded = Math.round(v) + 0;
  if (rounded < INT16_MIN || rounded > INT16_MAX) throw new FontError('bad-metrics', `The font's ${what} is ${rounded}, beyond the ${INT16_MIN}…${INT16_MAX} units a font can store.`);
  return rounded;
}

function checkedName(text: unknown, what: string, example: string): string {
  if (typeof text !== 'string' || text.trim().length === 0) throw new FontError('bad-name', `The font's ${what} is empty; give it one (e.g. "${example}").`);
  if (CONTROL_CHARACTER.test(text)) throw new FontError('bad-name', `The font's ${what} contains a control character (tab, line break…); remove it.`);
  return text.replace(/\s+/g, ' ').trim();
}

function checkedVendorId(vendorId: string | undefined): string {
  const id = vendorId ?? STEMLINE_VENDOR_ID;
  if (typeof id !== 'string' || id.length === 0 || id.length > VENDOR_ID_LENGTH || !PRINTABLE_ASCII.test(id)) {
    throw new FontError('bad-name', `The vendor ID "${String(id)}" must be 1–${VENDOR_ID_LENGTH} printable ASCII characters (e.g. "${STEMLINE_VENDOR_ID}").`);
  }
  return id.padEnd(VENDOR_ID_LENGTH, ' ');
}

function checkedTimestamp(timestamp: Date | undefined): number {
  const date = timestamp ?? REPRODUCIBLE_TIMESTAMP;
  const ms = date instanceof Date ? date.getTime() : Number.NaN;
  if (!Number.isFinite(ms) || ms < EARLIEST_TIMESTAMP_MS) throw new FontError('bad-metrics', `The font's timestamp must be a valid date after 1904-01-01.`);
  return Math.floor(ms / MS_PER_SECOND);
}

/** Checks `source` and settles every value the tables need. `source` is not modified. */
export function prepareFont(source: FontSource): PreparedFont {
  if (source === null || typeof source !== 'object') throw new FontError('bad-metrics', 'No font source was given.');
  const familyName = checkedName(source.familyName, 'family name', 'Stemline Sans');
  const styleName = checkedName(source.styleName, 'style name', 'Regular');

  const unitsPerEm = wholeUnits(source.unitsPerEm, 'units per em', DEFAULT_UNITS_PER_EM);
  if (unitsPerEm < MIN_UNITS_PER_EM || unitsPerEm > MAX_UNITS_PER_EM) {
    throw new FontError('bad-metrics', `The font's units per em is ${unitsPerEm}; OpenType allows ${MIN_UNITS_PER_EM}–${MAX_UNITS_PER_EM} (1000 is usual).`);
  }
  const ascender = wholeUnits(source.ascender, 'ascender');
  const descender = wholeUnits(source.descender, 'descender');
  const lineGap = wholeUnits(source.lineGap, 'line gap', 0);
  const xHeight = wholeUnits(source.xHeight, 'x-height');
  const capHeight = wholeUnits(source.capHeight, 'cap height');
  if (ascender <= 0) throw new FontError('bad-metrics', `The font's ascender is ${ascender}; it must be above the baseline (more than 0).`);
  if (descender > 0) throw new FontError('bad-metrics', `The font's descender is ${descender}; it must be at or below the baseline (0 or less).`);
  if (lineGap < 0) throw new FontError('bad-metrics', `The font's line gap is ${lineGap}; it must be 0 or more.`);
  if (xHeight < 0 || capHeight < 0) throw new FontError('bad-metrics', `The font's x-height (${xHeight}) and cap height (${capHeight}) must be 0 or more.`);

  const weightClass = source.weightClass ?? DEFAULT_WEIGHT_CLASS;
  if (!Number.isInteger(weightClass) || weightClass < MIN_WEIGHT_CLASS || weightClass > MAX_WEIGHT_CLASS) {
    throw new FontError('bad-metrics', `The font's weight class is ${String(weightClass)}; it must be a whole number ${MIN_WEIGHT_CLASS}–${MAX_WEIGHT_CLASS} (400 Regular, 700 Bold).`);
  }
  const fontRevision = source.version ?? DEFAULT_FONT_VERSION;
  if (typeof fontRevision !== 'number' || !Number.isFinite(fontRevision) || fontRevision < 0 || fontRevision > MAX_FONT_REVISION) {
    throw new FontError('bad-metrics', `The font's version is ${String(fontRevision)}; it must be a number from 0 to ${MAX_FONT_REVISION} (e.g. 1.002).`);
  }
  const designer = source.designer === undefined || source.designer.trim() === '' ? undefined : checkedName(source.designer, 'designer name', 'A. Letterer');

  const glyphs = prepareGlyphs(source.glyphs, { unitsPerEm, capHeight, ascender });
  const inkBounds = glyphs.reduce<IntegerBox | undefined>((box, g) => (g.bounds === undefined ? box : box === undefined ? g.bounds : unionOfIntegerBoxes(box, g.bounds)), undefined) ?? {
    xMin: 0,
    yMin: 0,
    xMax: 0,
    yMax: 0,
  };
  const emScale = unitsPerEm / DEFAULT_UNITS_PER_EM;

  return {
    familyName,
    styleName,
    fullName: `${familyName} ${styleName}`,
    postScriptName: postScriptName(familyName, styleName),
    linking: styleLinking(familyName, styleName),
    unitsPerEm,
    ascender,
    descender,
    lineGap,
    xHeight,
    capHeight,
    weightClass,
    vendorId: checkedVendorId(source.vendorId),
    fontRevision,
    versionNumber: fontRevision.toFixed(VERSION_DECIMALS),
    designer,
    timestampSeconds: checkedTimestamp(source.timestamp),
    underlinePosition: Math.round(UNDERLINE_POSITION_PER_1000 * emScale),
    underlineThickness: Math.max(1, Math.round(UNDERLINE_THICKNESS_PER_1000 * emScale)),
    glyphs,
    inkBounds,
  };
}
