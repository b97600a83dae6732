// The OpenType file container ("sfnt"): a table directory followed by the tables
// (OpenType spec, "Organization of an OpenType font": table directory and table
// records). The writer takes opentype.js's font apart into tables, replaces or
// patches some, and puts it back together here with fresh checksums; the reader and
// the tests use the directory to see what a file holds and whether it is complete.
import { checkSumAdjustment, HEAD_CHECKSUM_ADJUSTMENT_OFFSET, tableChecksum } from './font-checksum.ts';

/** sfntVersion of fonts with CFF outlines: the tag 'OTTO' (OpenType spec, table directory). */
export const SFNT_VERSION_CFF = 0x4f54544f;
/** sfntVersion of fonts with TrueType outlines (OpenType spec, table directory: 0x00010000). */
export const SFNT_VERSION_TRUETYPE = 0x00010000;

/** Bytes of the table directory header: sfntVersion, numTables, searchRange, entrySelector, rangeShift. */
export const SFNT_HEADER_BYTES = 12;
/** Bytes per table record: tag, checksum, offset, length (OpenType spec, table directory). */
export const TABLE_RECORD_BYTES = 16;
/** Table tags are four ASCII bytes (OpenType spec, "Data types": Tag). */
const TAG_BYTES = 4;
/** Tables start on 4-byte boundaries and are zero-padded to them (OpenType spec, table directory). */
const TABLE_ALIGNMENT = 4;
/** checkSumAdjustment is a uint32. */
const CHECKSUM_ADJUSTMENT_BYTES = 4;
/** searchRange is (largest power of 2 ≤ numTables) × 16 (OpenType spec, table directory). */
const SEARCH_RANGE_UNIT = 16;

export interface TableRecord {
  readonly tag: string;
  readonly checksum: number;
  readonly offset: number;
  readonly length: number;
}

export interface SfntTable {
  readonly tag: string;
  readonly data: Uint8Array;
}

function tagAt(view: DataView, offset: number): string {
  let tag = '';
  for (let i = 0; i < TAG_BYTES; i++) tag += String.fromCharCode(view.getUint8(offset + i));
  return tag;
}

/**
 * The sfntVersion and the table records of an sfnt file. Throws RangeError when the
 * directory itself runs past the end of `bytes`; does not check the tables' extents
 * (see `tablesOutsideFile`).
 */
export function readTableRecords(bytes: Uint8Array): { sfntVersion: number; records: TableRecord[] } {
  if (bytes.length < SFNT_HEADER_BYTES) throw new RangeError('the file is shorter than a font header');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const sfntVersion = view.getUint32(0);
  const numTables = view.getUint16(4);
  if (SFNT_HEADER_BYTES + numTables * TABLE_RECORD_BYTES > bytes.length) throw new RangeError('the table directory runs past the end of the file');
  const records: TableRecord[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = SFNT_HEADER_BYTES + i * TABLE_RECORD_BYTES;
    records.push({ tag: tagAt(view, at), checksum: view.getUint32(at + 4), offset: view.getUint32(at + 8), length: view.getUint32(at + 12) });
  }
  return { sfntVersion, records };
}

/** Tags of the tables whose data would lie (partly) beyond `fileLength` bytes. */
export function tablesOutsideFile(records: readonly TableRecord[], fileLength: number): string[] {
  return records.filter((r) => r.offset + r.length > fileLength).map((r) => r.tag);
}

/** The tables of an sfnt file, in the order their data appears in it (copies, not views). */
export function readSfntTables(bytes: Uint8Array): { sfntVersion: number; tables: SfntTable[] } {
  const { sfntVersion, records } = readTableRecords(bytes);
  const outside = tablesOutsideFile(records, bytes.length);
  if (outside.length > 0) throw new RangeError(`table(s) ${outside.join(', ')} run past the end of the file`);
  const tables = [...records]
    .sort((a, b) => a.offset - b.offset)
    .map((r) => ({ tag: r.tag, data: bytes.slice(r.offset, r.offset + r.length) }));
  return { sfntVersion, tables };
}

const padded = (length: number) => Math.ceil(length / TABLE_ALIGNMENT) * TABLE_ALIGNMENT;

/**
 * An sfnt file from `tables`, laid out in the given order, with the directory sorted
 * by tag, every table checksum computed and head.checkSumAdjustment set so the whole
 * file sums to the OpenType magic value. The input tables are not modified.
 */
export function assembleSfnt(sfntVersion: number, tables: readonly SfntTable[]): Uint8Array {
  const numTables = tables.length;
  const directoryBytes = SFNT_HEADER_BYTES + numTables * TABLE_RECORD_BYTES;
  const total = tables.reduce((sum, t) => sum + padded(t.data.length), padded(directoryBytes));
  const out = new Uint8Array(total);
  const view = new DataView(out.buffer);
  const largestPowerOfTwo = numTables > 0 ? 2 ** Math.floor(Math.log2(numTables)) : 0;
  view.setUint32(0, sfntVersion);
  view.setUint16(4, numTables);
  view.setUint16(6, largestPowerOfTwo * SEARCH_RANGE_UNIT);
  view.setUint16(8, largestPowerOfTwo > 0 ? Math.log2(largestPowerOfTwo) : 0);
  view.setUint16(10, numTables * TABLE_RECORD_BYTES - largestPowerOfTwo * SEARCH_RANGE_UNIT);

  const placed: Array<TableRecord> = [];
  let offset = padded(directoryBytes);
  let headOffset = -1;
  for (const table of tables) {
    const data = table.data;
    out.set(data, offset);
    if (table.tag === 'head') {
      headOffset = offset;
      // The head checksum is taken with checkSumAdjustment zeroed (OpenType spec, 'head').
      out.fill(0, offset + HEAD_CHECKSUM_ADJUSTMENT_OFFSET, offset + HEAD_CHECKSUM_ADJUSTMENT_OFFSET + CHECKSUM_ADJUSTMENT_BYTES);
    }
    placed.push({ tag: table.tag, checksum: tableChecksum(out.subarray(offset, offset + data.length)), offset, length: data.length });
    offset += padded(data.length);
  }
  // Table records are sorted by tag in ascending order (OpenType spec, table directory).
  placed.sort((a, b) => (a.tag < b.tag ? -1 : a.tag > b.tag ? 1 : 0));
  placed.forEach((record, i) => {
    const at = SFNT_HEADER_BYTES + i * TABLE_RECORD_BYTES;
    for (let k = 0; k < TAG_BYTES; k++) view.setUint8(at + k, record.tag.charCodeAt(k));
    view.setUint32(at + 4, record.checksum);
    view.setUint32(at + 8, record.offset);
    view.setUint32(at + 12, record.length);
  });
  if (headOffset >= 0) view.setUint32(headOffset + HEAD_CHECKSUM_ADJUSTMENT_OFFSET, checkSumAdjustment(tableChecksum(out)));
  return out;
}
