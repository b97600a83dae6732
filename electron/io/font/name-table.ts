// The 'name' table (OpenType spec, 'name' table, format 0): the family, style,
// version and PostScript names that font menus, browsers and PDF files show. Built
// here rather than by opentype.js, which fills name IDs 0 and 7–14 with " "
// placeholders, writes a "manufacturer: full name" unique ID and always adds
// Unicode-platform records that force an 'ltag' table. We write Windows-platform
// Unicode records only (platform 3, encoding 1, US English), which every current
// system reads (common practice for new fonts).

/** Name IDs used here (OpenType spec, 'name' table, "Name IDs"). */
export const NAME_ID = {
  familyName: 1,
  subfamilyName: 2,
  uniqueId: 3,
  fullName: 4,
  version: 5,
  postScriptName: 6,
  designer: 9,
  typographicFamily: 16,
  typographicSubfamily: 17,
} as const;

/** Windows platform (OpenType spec, 'name': platform ID 3). */
const PLATFORM_WINDOWS = 3;
/** Unicode BMP encoding, UTF-16BE strings (OpenType spec, 'name': Windows encoding ID 1). */
const ENCODING_UNICODE_BMP = 1;
/** US English (OpenType spec, 'name': Windows language ID 0x0409). */
const LANGUAGE_US_ENGLISH = 0x0409;
/** Bytes of the table header (format, count, storageOffset) and of each name record. */
const HEADER_BYTES = 6;
const RECORD_BYTES = 12;
/** Offsets and lengths in the table are 16-bit (OpenType spec, 'name'). */
const MAX_STORAGE_BYTES = 0xffff;

export interface NameRecord {
  readonly nameId: number;
  readonly text: string;
}

function utf16BigEndian(text: string): Uint8Array {
  const out = new Uint8Array(text.length * 2);
  for (let i = 0; i < text.length; i++) {
    const unit = text.charCodeAt(i);
    out[2 * i] = unit >> 8;
    out[2 * i + 1] = unit & 0xff;
  }
  return out;
}

/**
 * A format-0 'name' table holding `records` as Windows/Unicode/US-English strings,
 * sorted by name ID as the spec requires. Identical strings are stored once.
 * Throws RangeError for an empty string or when the strings exceed 64 KiB.
 */
export function buildNameTable(records: readonly NameRecord[]): Uint8Array {
  const sorted = [...records].sort((a, b) => a.nameId - b.nameId);
  const storage: Uint8Array[] = [];
  const offsets = new Map<string, number>();
  let storageLength = 0;
  const placed = sorted.map((record) => {
    if (record.text.length === 0) throw new RangeError(`name ID ${record.nameId} would be empty`);
    let offset = offsets.get(record.text);
    const bytes = utf16BigEndian(record.text);
    if (offset === undefined) {
      offset = storageLength;
      offsets.set(record.text, offset);
      storage.push(bytes);
      storageLength += bytes.length;
    }
    return { nameId: record.nameId, offset, length: bytes.length };
  });
  if (storageLength > MAX_STORAGE_BYTES) throw new RangeError('the font names are too long for the name table');
  const storageOffset = HEADER_BYTES + placed.length * RECORD_BYTES;
  const out = new Uint8Array(storageOffset + storageLength);
  const view = new DataView(out.buffer);
  view.setUint16(0, 0); // format 0
  view.setUint16(2, placed.length);
  view.setUint16(4, storageOffset);
  placed.forEach((record, i) => {
    const at = HEADER_BYTES + i * RECORD_BYTES;
    view.setUint16(at, PLATFORM_WINDOWS);
    view.setUint16(at + 2, ENCODING_UNICODE_BMP);
    view.setUint16(at + 4, LANGUAGE_US_ENGLISH);
    view.setUint16(at + 6, record.nameId);
    view.setUint16(at + 8, record.length);
    view.setUint16(at + 10, record.offset);
  });
  let at = storageOffset;
  for (const bytes of storage) {
    out.set(bytes, at);
    at += bytes.length;
  }
  return out;
}
