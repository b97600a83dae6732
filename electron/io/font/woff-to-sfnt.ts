// Unpacks a WOFF 1.0 file into the plain OpenType file it wraps, with Node's zlib,
// before opentype.js sees it. opentype.js inflates WOFF tables with its own small
// inflater, which loops forever on some damaged compressed data and allocates
// whatever size a table entry claims; here every table is inflated with its output
// capped at the size the entry declares, and the declared sizes together are held
// to MAX_UNPACKED_FONT_BYTES, so a damaged or hostile WOFF is refused at once.
import { inflateSync } from 'node:zlib';
import { InputError } from '../input-error.ts';
import { SFNT_HEADER_BYTES, TABLE_RECORD_BYTES } from './sfnt-tables.ts';

/** WOFF 1.0 header and table directory layout (W3C WOFF 1.0, "WOFF Header", "Table Directory"). */
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
const WOFF_FLAVOR_OFFSET = 4;
const WOFF_NUM_TABLES_OFFSET = 12;
/** Tables start on 4-byte boundaries (OpenType spec, table directory). */
const TABLE_ALIGNMENT = 4;
/** searchRange is (largest power of 2 ≤ numTables) × 16 (OpenType spec, table directory). */
const SEARCH_RANGE_UNIT = 16;

/**
 * Most bytes the unpacked font may take: 128 MiB. The largest fonts in use (pan-CJK
 * families with 65,535 glyphs) are 20–40 MiB unpacked (a figure from memory); a
 * lettering font is well under 1 MiB. A WOFF declaring more is damaged or a
 * decompression bomb.
 */
export const MAX_UNPACKED_FONT_BYTES = 128 * 2 ** 20;

interface WoffEntry {
  tag: string;
  offset: number;
  compressedLength: number;
  length: number;
  checksum: number;
}

const padded = (length: number) => Math.ceil(length / TABLE_ALIGNMENT) * TABLE_ALIGNMENT;

function damaged(fileName: string, detail: string): InputError {
  return new InputError('font-unreadable', fileName, `${fileName}: the WOFF font is damaged (${detail}). Download or export it again.`);
}

/**
 * The OpenType file inside the WOFF 1.0 file `bytes`, whose directory and table
 * extents font-container.ts has already checked. Throws InputError
 * 'font-unreadable' for a table that does not inflate to its declared size, and
 * 'font-too-large' when the declared sizes pass MAX_UNPACKED_FONT_BYTES.
 */
export function woffToSfnt(bytes: Uint8Array, fileName: string): Uint8Array {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const numTables = view.getUint16(WOFF_NUM_TABLES_OFFSET);
  const entries: WoffEntry[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = WOFF_HEADER_BYTES + i * WOFF_ENTRY_BYTES;
    const tag = String.fromCharCode(...bytes.subarray(at, at + 4));
    entries.push({ tag, offset: view.getUint32(at + 4), compressedLength: view.getUint32(at + 8), length: view.getUint32(at + 12), checksum: view.getUint32(at + 16) });
  }
  const directoryBytes = padded(SFNT_HEADER_BYTES + numTables * TABLE_RECORD_BYTES);
  const total = entries.reduce((sum, e) => sum + padded(e.length), directoryBytes);
  if (total > MAX_UNPACKED_FONT_BYTES) {
    throw new InputError('font-too-large', fileName, `${fileName}: its tables would unpack to ${(total / 2 ** 20).toFixed(0)} MiB; Stemline reads fonts of up to ${MAX_UNPACKED_FONT_BYTES / 2 ** 20} MiB. The file is damaged, or not a font to open here: choose another copy.`);
  }
  const out = new Uint8Array(total);
  const outView = new DataView(out.buffer);
  const largestPowerOfTwo = numTables > 0 ? 2 ** Math.floor(Math.log2(numTables)) : 0;
  outView.setUint32(0, view.getUint32(WOFF_FLAVOR_OFFSET));
  outView.setUint16(4, numTables);
  outView.setUint16(6, largestPowerOfTwo * SEARCH_RANGE_UNIT);
  outView.setUint16(8, largestPowerOfTwo > 0 ? Math.log2(largestPowerOfTwo) : 0);
  outView.setUint16(10, numTables * TABLE_RECORD_BYTES - largestPowerOfTwo * SEARCH_RANGE_UNIT);
  let offset = directoryBytes;
  entries.forEach((entry, i) => {
    const stored = bytes.subarray(entry.offset, entry.offset + entry.compressedLength);
    let data: Uint8Array;
    if (entry.compressedLength === entry.length) data = stored;
    else if (entry.compressedLength > entry.length) throw damaged(fileName, `table ${JSON.stringify(entry.tag)} is stored larger than it unpacks to`);
    else {
      try {
        // A compressed table is a zlib stream (W3C WOFF 1.0, "Table Data"); the cap stops a stream that inflates past its declared size.
        data = inflateSync(stored, { maxOutputLength: Math.max(1, entry.length) });
      } catch (error) {
        throw damaged(fileName, `table ${JSON.stringify(entry.tag)} does not unpack: ${error instanceof Error ? error.message : String(error)}`);
      }
      if (data.length !== entry.length) throw damaged(fileName, `table ${JSON.stringify(entry.tag)} unpacks to ${data.length} bytes, not the ${entry.length} it declares`);
    }
    out.set(data, offset);
    const record = SFNT_HEADER_BYTES + i * TABLE_RECORD_BYTES;
    for (let k = 0; k < 4; k++) outView.setUint8(record + k, entry.tag.charCodeAt(k));
    outView.setUint32(record + 4, entry.checksum);
    outView.setUint32(record + 8, offset);
    outView.setUint32(record + 12, entry.length);
    offset += padded(entry.length);
  });
  return out;
}
