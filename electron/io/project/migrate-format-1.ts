// Opens project files of format 1 (Stemline before glyphs had several characters)
// by turning them into format 2 before validation: a glyph's single `character`
// becomes the list `unicodes` (empty for ''), and an embedded scan's bare base64
// string becomes { sha256, base64 } with the digest of its bytes. Everything else
// is the same in both formats and is validated by the format 2 schema, so a wrong
// field elsewhere is still named by its path. The file itself is not changed; saving
// the project writes format 2.
import { invalidFieldError } from './project-error.ts';
import { unicodeHexOf } from './project-unicodes.ts';
import { embedScan } from './embedded-scan.ts';
import { isBase64 } from './project-schema.ts';
import { quotedJson, quotedText } from './schema-issue.ts';

/** The format this migration reads. */
export const FORMAT_1 = 1;
/** The format it produces. */
const FORMAT_2 = 2;

type Json = Record<string, unknown>;
const isObject = (value: unknown): value is Json => typeof value === 'object' && value !== null && !Array.isArray(value);

function migrateGlyph(glyph: unknown, index: number, file: string): unknown {
  if (!isObject(glyph)) return glyph; // the format 2 schema names it
  const where = `glyphs.${index}`;
  if ('unicodes' in glyph) throw invalidFieldError(file, `${where}.unicodes`, 'a format 1 project has no "unicodes" (it came in with format 2); remove it, or set "formatVersion": 2 and remove "character"');
  const { character, ...rest } = glyph;
  if (typeof character !== 'string') throw invalidFieldError(file, `${where}.character`, `it must be a string of one character, or "" for an unencoded glyph, not ${quotedJson(character)}`);
  const codePoints = [...character];
  if (codePoints.length > 1) {
    throw invalidFieldError(file, `${where}.character`, `"${quotedText(character)}" is ${codePoints.length} characters and a glyph is for one; give the glyph one character, or "" and a name for a ligature`);
  }
  return { unicodes: codePoints.map(unicodeHexOf), ...rest };
}

function migrateScan(scan: unknown, index: number, file: string): unknown {
  if (!isObject(scan) || scan.embedded === undefined) return scan;
  const { embedded } = scan;
  if (typeof embedded !== 'string' || !isBase64(embedded)) {
    throw invalidFieldError(file, `scans.${index}.embedded`, 'in a format 1 project it must be the scan\'s bytes in standard base64');
  }
  return { ...scan, embedded: embedScan(new Uint8Array(Buffer.from(embedded, 'base64'))) };
}

/**
 * The format 2 form of the parsed format 1 project `raw` (`file` is used in
 * messages). Throws ProjectError for the fields it changes when they are wrong;
 * leaves any other damage for the schema to name. `raw` is not modified.
 */
export function migrateFormat1(raw: Json, file: string): Json {
  const { glyphs, scans } = raw;
  return {
    ...raw,
    formatVersion: FORMAT_2,
    ...(Array.isArray(glyphs) ? { glyphs: glyphs.map((g, i) => migrateGlyph(g, i, file)) } : {}),
    ...(Array.isArray(scans) ? { scans: scans.map((s, i) => migrateScan(s, i, file)) } : {}),
  };
}
