// Fixes what opentype.js 2.0.0 writes wrongly and cannot be told otherwise: the
// name table is replaced by ours (no " " placeholders, a real unique ID, name IDs
// 16/17 only when needed), 'ltag' is dropped (nothing refers to it once the
// Unicode-platform names are gone), the CFF Top DICT gets the true FontBBox and the
// underline values, 'head' gets the reproducible timestamp, revision, bounding box
// and macStyle, 'hhea' the line gap and sidebearing extremes. The font is then
// reassembled with fresh table checksums and head.checkSumAdjustment.
import { rewriteTopDict } from './cff-top-dict.ts';
import { patchHead } from './head-table.ts';
import { hheaValues, patchHhea } from './hhea-table.ts';
import { buildNameTable, NAME_ID, type NameRecord } from './name-table.ts';
import type { PreparedFont } from './prepare-font.ts';
import { assembleSfnt, readSfntTables, type SfntTable } from './sfnt-tables.ts';

/** Tables dropped from the draft: 'ltag' only serves Unicode-platform name records, which we do not write. */
const DROPPED_TABLES = new Set(['ltag']);

/** The name records for `font` (OpenType spec, 'name' IDs). */
export function nameRecords(font: PreparedFont): NameRecord[] {
  const { linking } = font;
  const records: NameRecord[] = [
    { nameId: NAME_ID.familyName, text: linking.legacyFamily },
    { nameId: NAME_ID.subfamilyName, text: linking.legacySubfamily },
    // A string no other font shares (OpenType spec, name ID 3): version, vendor and PostScript name.
    { nameId: NAME_ID.uniqueId, text: `${font.versionNumber};${font.vendorId.trim()};${font.postScriptName}` },
    { nameId: NAME_ID.fullName, text: font.fullName },
    { nameId: NAME_ID.version, text: `Version ${font.versionNumber}` },
    { nameId: NAME_ID.postScriptName, text: font.postScriptName },
  ];
  if (font.designer !== undefined) records.push({ nameId: NAME_ID.designer, text: font.designer });
  if (linking.typographic !== undefined) {
    records.push({ nameId: NAME_ID.typographicFamily, text: linking.typographic.family });
    records.push({ nameId: NAME_ID.typographicSubfamily, text: linking.typographic.subfamily });
  }
  return records;
}

function finishedTable(table: SfntTable, font: PreparedFont): SfntTable {
  switch (table.tag) {
    case 'name':
      return { tag: 'name', data: buildNameTable(nameRecords(font)) };
    case 'CFF ': {
      const { xMin, yMin, xMax, yMax } = font.inkBounds;
      return {
        tag: 'CFF ',
        data: rewriteTopDict(table.data, {
          fontBBox: [xMin, yMin, xMax, yMax],
          underlinePosition: font.underlinePosition,
          underlineThickness: font.underlineThickness,
        }),
      };
    }
    case 'head':
      return {
        tag: 'head',
        data: patchHead(table.data, {
          fontRevision: font.fontRevision,
          timestampSeconds: font.timestampSeconds,
          bounds: font.inkBounds,
          macStyle: font.linking.macStyle,
        }),
      };
    case 'hhea':
      return { tag: 'hhea', data: patchHhea(table.data, hheaValues(font)) };
    default:
      return table;
  }
}

/** The finished font file from opentype.js's draft of `font`. */
export function finishTables(draft: Uint8Array, font: PreparedFont): Uint8Array {
  const { sfntVersion, tables } = readSfntTables(draft);
  const finished = tables.filter((t) => !DROPPED_TABLES.has(t.tag)).map((t) => finishedTable(t, font));
  return assembleSfnt(sfntVersion, finished);
}
