// Packs an OpenType font into a WOFF 1.0 file (W3C, "WOFF File Format 1.0",
// sections 3–5): the same tables, each zlib-compressed unless that makes it larger,
// behind a 44-byte header and a 20-byte-per-table directory sorted by tag.
// opentype.js cannot write WOFF, so the WOFF reading test builds its input here.
import { deflateSync } from 'node:zlib';
import { readTableRecords } from '../../electron/io/font/sfnt-tables.ts';

/** 'wOFF' (WOFF 1.0, "WOFF Header"). */
const WOFF_SIGNATURE = 0x774f4646;
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
/** The sfnt header and per-table record sizes, for totalSfntSize (WOFF 1.0, "WOFF Header"). */
const SFNT_HEADER_BYTES = 12;
const SFNT_RECORD_BYTES = 16;
const pad4 = (n: number) => (n + 3) & ~3;

/** The WOFF 1.0 form of the sfnt font `font`. */
export function toWoff(font: Uint8Array): Uint8Array {
  const view = new DataView(font.buffer, font.byteOffset, font.byteLength);
  const { sfntVersion, records } = readTableRecords(font);
  const sorted = [...records].sort((a, b) => (a.tag < b.tag ? -1 : a.tag > b.tag ? 1 : 0));
  const tables = sorted.map((record) => {
    const data = font.subarray(record.offset, record.offset + record.length);
    const compressed = deflateSync(data);
    return { record, stored: compressed.length < data.length ? new Uint8Array(compressed) : data };
  });
  let offset = WOFF_HEADER_BYTES + WOFF_ENTRY_BYTES * tables.length;
  const placed = tables.map((t) => {
    const at = offset;
    offset = pad4(offset + t.stored.length);
    return { ...t, at };
  });
  const length = placed.length > 0 ? placed[placed.length - 1]!.at + placed[placed.length - 1]!.stored.length : offset;
  const out = new Uint8Array(length);
  const w = new DataView(out.buffer);
  w.setUint32(0, WOFF_SIGNATURE);
  w.setUint32(4, sfntVersion);
  w.setUint32(8, length);
  w.setUint16(12, tables.length);
  w.setUint32(16, SFNT_HEADER_BYTES + SFNT_RECORD_BYTES * tables.length + tables.reduce((n, t) => n + pad4(t.record.length), 0));
  w.setUint16(20, 1); // majorVersion of the font data (WOFF 1.0: the font's own version; 1.0 here)
  w.setUint16(22, 0);
  placed.forEach((t, i) => {
    const entry = WOFF_HEADER_BYTES + i * WOFF_ENTRY_BYTES;
    for (let k = 0; k < 4; k++) w.setUint8(entry + k, t.record.tag.charCodeAt(k));
    w.setUint32(entry + 4, t.at);
    w.setUint32(entry + 8, t.stored.length);
    w.setUint32(entry + 12, t.record.length);
    w.setUint32(entry + 16, view.getUint32(SFNT_HEADER_BYTES + records.indexOf(t.record) * SFNT_RECORD_BYTES + 4));
    out.set(t.stored, t.at);
  });
  return out;
}
