// Rewrites the Top DICT of a CFF table (Adobe Technical Note #5176, "The Compact
// Font Format Specification"). opentype.js 2.0.0 writes a wrong FontBBox — it passes
// [0, yMin, ascender, advanceWidthMax], not [xMin, yMin, xMax, yMax] — and offers no
// way to set it, nor the underline values. Changing DICT operands can change the
// DICT's length, which moves everything after it, so the absolute offsets the Top
// DICT holds (charset, CharStrings, Private) are moved by the same amount. Only the
// layout opentype.js writes is supported: one font, no CID font dicts. The reader
// also checks here that a CFF table's INDEXes are sound before opentype.js walks them.

/** CFF DICT operators used here (TN #5176, Table 9 "Top DICT Operator Entries"); two-byte operators as 1200 + second byte. */
const OPERATOR = {
  fontBBox: 5,
  charset: 15,
  encoding: 16,
  charStrings: 17,
  private: 18,
  underlinePosition: 1203,
  underlineThickness: 1204,
  fdArray: 1236,
  fdSelect: 1237,
} as const;

/** Prefix byte of two-byte operators (TN #5176, Table 3: escape 12). */
const ESCAPE = 12;
/** Two-byte operators are numbered 1200 + their second byte here. */
const ESCAPED_OPERATOR_BASE = 1200;
/** Top DICT defaults (TN #5176, Table 9): UnderlinePosition −100, UnderlineThickness 50. */
export const CFF_DEFAULT_UNDERLINE_POSITION = -100;
export const CFF_DEFAULT_UNDERLINE_THICKNESS = 50;
/** Predefined charsets (ISOAdobe, Expert, ExpertSubset) are 0–2 and Encodings 0–1, not offsets (TN #5176, sections 12–13). */
const LAST_PREDEFINED_CHARSET = 2;
const LAST_PREDEFINED_ENCODING = 1;

/** DICT operand encodings (TN #5176, Table 3). */
const OPERAND_INT16 = 28;
const OPERAND_INT32 = 29;
const OPERAND_REAL = 30;
const FIRST_OPERATOR_BYTE_LIMIT = 22; // bytes 0–21 are operators
const ONE_BYTE_FIRST = 32;
const ONE_BYTE_LAST = 246;
const ONE_BYTE_BIAS = 139;
const TWO_BYTE_POSITIVE_FIRST = 247;
const TWO_BYTE_NEGATIVE_FIRST = 251;
const TWO_BYTE_LAST = 254;
const TWO_BYTE_BIAS = 108;
const ONE_BYTE_RANGE = 107; // |v| ≤ 107 fits one byte
const TWO_BYTE_RANGE = 1131; // 108 ≤ |v| ≤ 1131 fits two bytes
const INT16_MIN = -32768;
const INT16_MAX = 32767;
/** A real number ends at a nibble of 0xf (TN #5176, Table 5). */
const REAL_END_NIBBLE = 0xf;

interface DictEntry {
  readonly operator: number;
  /** Each operand's encoded bytes. */
  readonly operands: readonly Uint8Array[];
  /** Each operand's value (NaN for reals, which are kept as bytes). */
  readonly values: readonly number[];
}

/** The new Top DICT values. */
export interface TopDictChanges {
  readonly fontBBox: readonly [number, number, number, number];
  readonly underlinePosition: number;
  readonly underlineThickness: number;
}

/** An INDEX starts with its count (Card16) and offSize (Card8) (TN #5176, section 5). */
const INDEX_HEADER_BYTES = 3;
/** An empty INDEX is just its count, 0 (TN #5176, section 5). */
const EMPTY_INDEX = new Uint8Array([0, 0]);

/** One INDEX: where it starts and ends in the table, and its items (views). */
interface CffIndex {
  readonly start: number;
  readonly end: number;
  readonly items: Uint8Array[];
}

function readOffset(bytes: Uint8Array, at: number, size: number): number {
  let value = 0;
  for (let i = 0; i < size; i++) value = value * 256 + bytes[at + i]!;
  return value;
}

/** Reads the INDEX at `start` (TN #5176, section 5 "INDEX Data"). */
function readIndex(bytes: Uint8Array, start: number): CffIndex {
  const count = readOffset(bytes, start, 2);
  if (count === 0) return { start, end: start + 2, items: [] };
  const offSize = bytes[start + 2]!;
  const offsetsAt = start + INDEX_HEADER_BYTES;
  const dataBase = offsetsAt + (count + 1) * offSize - 1; // offsets are 1-based
  const items: Uint8Array[] = [];
  for (let i = 0; i < count; i++) {
    const from = dataBase + readOffset(bytes, offsetsAt + i * offSize, offSize);
    const to = dataBase + readOffset(bytes, offsetsAt + (i + 1) * offSize, offSize);
    items.push(bytes.subarray(from, to));
  }
  const end = dataBase + readOffset(bytes, offsetsAt + count * offSize, offSize);
  if (end > bytes.length) throw new RangeError('a CFF INDEX runs past the end of the table');
  return { start, end, items };
}

/** Encodes an INDEX with the smallest offset size that fits. */
function encodeIndex(items: readonly Uint8Array[]): Uint8Array {
  if (items.length === 0) return EMPTY_INDEX.slice();
  const dataLength = items.reduce((n, item) => n + item.length, 0);
  const offSize = dataLength + 1 < 0x100 ? 1 : dataLength + 1 < 0x10000 ? 2 : dataLength + 1 < 0x1000000 ? 3 : 4;
  const out = new Uint8Array(INDEX_HEADER_BYTES + (items.length + 1) * offSize + dataLength);
  out[0] = items.length >> 8;
  out[1] = items.length & 0xff;
  out[2] = offSize;
  let offset = 1;
  let dataAt = INDEX_HEADER_BYTES + (items.length + 1) * offSize;
  const writeOffset = (index: number, value: number) => {
    for (let k = 0; k < offSize; k++) out[INDEX_HEADER_BYTES + index * offSize + k] = Math.floor(value / 256 ** (offSize - 1 - k)) & 0xff;
  };
  items.forEach((item, i) => {
    writeOffset(i, offset);
    out.set(item, dataAt);
    dataAt += item.length;
    offset += item.length;
  });
  writeOffset(items.length, offset);
  return out;
}

/** Parses a DICT into operator entries (TN #5176, section 4 "DICT Data"). */
function parseDict(bytes: Uint8Array): DictEntry[] {
  const entries: DictEntry[] = [];
  let operands: Uint8Array[] = [];
  let values: number[] = [];
  let i = 0;
  while (i < bytes.length) {
    const b0 = bytes[i]!;
    if (b0 < FIRST_OPERATOR_BYTE_LIMIT) {
      const operator = b0 === ESCAPE ? ESCAPED_OPERATOR_BASE + bytes[i + 1]! : b0;
      i += b0 === ESCAPE ? 2 : 1;
      entries.push({ operator, operands, values });
      operands = [];
      values = [];
      continue;
    }
    const start = i;
    let value: number;
    if (b0 === OPERAND_INT16) {
      value = ((bytes[i + 1]! << 24) >> 16) | bytes[i + 2]!;
      i += 3;
    } else if (b0 === OPERAND_INT32) {
      value = (bytes[i + 1]! << 24) | (bytes[i + 2]! << 16) | (bytes[i + 3]! << 8) | bytes[i + 4]!;
      i += 5;
    } else if (b0 === OPERAND_REAL) {
      i += 1;
      for (;;) {
        const byte = bytes[i++];
        if (byte === undefined) throw new RangeError('a CFF real number runs past the end of its DICT');
        if (byte >> 4 === REAL_END_NIBBLE || (byte & 0xf) === REAL_END_NIBBLE) break;
      }
      value = Number.NaN;
    } else if (b0 >= ONE_BYTE_FIRST && b0 <= ONE_BYTE_LAST) {
      value = b0 - ONE_BYTE_BIAS;
      i += 1;
    } else if (b0 >= TWO_BYTE_POSITIVE_FIRST && b0 < TWO_BYTE_NEGATIVE_FIRST) {
      value = (b0 - TWO_BYTE_POSITIVE_FIRST) * 256 + bytes[i + 1]! + TWO_BYTE_BIAS;
      i += 2;
    } else if (b0 >= TWO_BYTE_NEGATIVE_FIRST && b0 <= TWO_BYTE_LAST) {
      value = -(b0 - TWO_BYTE_NEGATIVE_FIRST) * 256 - bytes[i + 1]! - TWO_BYTE_BIAS;
      i += 2;
    } else {
      throw new RangeError(`byte ${b0} is not a valid CFF DICT operand`);
    }
    operands.push(bytes.subarray(start, i));
    values.push(value);
  }
  return entries;
}

/** The shortest DICT encoding of an integer (TN #5176, Table 3). */
function encodeInteger(value: number): Uint8Array {
  if (!Number.isInteger(value)) throw new RangeError(`CFF DICT integer expected, got ${value}`);
  if (Math.abs(value) <= ONE_BYTE_RANGE) return new Uint8Array([value + ONE_BYTE_BIAS]);
  if (value >= TWO_BYTE_BIAS && value <= TWO_BYTE_RANGE) {
    const v = value - TWO_BYTE_BIAS;
    return new Uint8Array([(v >> 8) + TWO_BYTE_POSITIVE_FIRST, v & 0xff]);
  }
  if (value <= -TWO_BYTE_BIAS && value >= -TWO_BYTE_RANGE) {
    const v = -value - TWO_BYTE_BIAS;
    return new Uint8Array([(v >> 8) + TWO_BYTE_NEGATIVE_FIRST, v & 0xff]);
  }
  if (value >= INT16_MIN && value <= INT16_MAX) return new Uint8Array([OPERAND_INT16, (value >> 8) & 0xff, value & 0xff]);
  return encodeOffset(value);
}

/** The fixed five-byte encoding, used for offsets so the DICT's length does not depend on them. */
function encodeOffset(value: number): Uint8Array {
  return new Uint8Array([OPERAND_INT32, (value >>> 24) & 0xff, (value >>> 16) & 0xff, (value >>> 8) & 0xff, value & 0xff]);
}

function encodeDict(entries: readonly DictEntry[]): Uint8Array {
  const parts: Uint8Array[] = [];
  for (const entry of entries) {
    parts.push(...entry.operands);
    parts.push(entry.operator >= ESCAPED_OPERATOR_BASE ? new Uint8Array([ESCAPE, entry.operator - ESCAPED_OPERATOR_BASE]) : new Uint8Array([entry.operator]));
  }
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const part of parts) {
    out.set(part, at);
    at += part.length;
  }
  return out;
}

const integerEntry = (operator: number, values: readonly number[]): DictEntry => ({ operator, operands: values.map(encodeInteger), values });

/** Is operand `index` of `operator` an absolute offset into the CFF table? */
function isOffsetOperand(operator: number, index: number, value: number): boolean {
  switch (operator) {
    case OPERATOR.charset:
      return value > LAST_PREDEFINED_CHARSET;
    case OPERATOR.encoding:
      return value > LAST_PREDEFINED_ENCODING;
    case OPERATOR.charStrings:
      return true;
    case OPERATOR.private:
      return index === 1;
    default:
      return false;
  }
}

/**
 * The CFF table with its Top DICT's FontBBox and underline values replaced and every
 * absolute offset moved to match. `cff` is not modified.
 */
export function rewriteTopDict(cff: Uint8Array, changes: TopDictChanges): Uint8Array {
  const headerSize = cff[2];
  if (cff[0] !== 1 || headerSize === undefined) throw new RangeError('not a CFF version 1 table');
  const nameIndex = readIndex(cff, headerSize);
  const topDictIndex = readIndex(cff, nameIndex.end);
  const [topDict, ...otherDicts] = topDictIndex.items;
  if (topDict === undefined || otherDicts.length > 0) throw new RangeError('expected exactly one font in the CFF table');
  const entries = parseDict(topDict);
  if (entries.some((e) => e.operator === OPERATOR.fdArray || e.operator === OPERATOR.fdSelect)) throw new RangeError('CID-keyed CFF fonts are not supported here');

  const changed: DictEntry[] = [];
  for (const entry of entries) {
    if (entry.operator === OPERATOR.underlinePosition || entry.operator === OPERATOR.underlineThickness) continue;
    if (entry.operator === OPERATOR.fontBBox) {
      changed.push(integerEntry(OPERATOR.fontBBox, changes.fontBBox));
      if (changes.underlinePosition !== CFF_DEFAULT_UNDERLINE_POSITION) changed.push(integerEntry(OPERATOR.underlinePosition, [changes.underlinePosition]));
      if (changes.underlineThickness !== CFF_DEFAULT_UNDERLINE_THICKNESS) changed.push(integerEntry(OPERATOR.underlineThickness, [changes.underlineThickness]));
      continue;
    }
    changed.push(entry);
  }
  if (!entries.some((e) => e.operator === OPERATOR.fontBBox)) changed.unshift(integerEntry(OPERATOR.fontBBox, changes.fontBBox));

  // Offsets become fixed five-byte numbers first, so the DICT's length is final
  // before the shift it causes is known.
  const withFixedOffsets = (shift: number) =>
    changed.map((entry) =>
      entry.operands.some((_, i) => isOffsetOperand(entry.operator, i, entry.values[i] ?? 0))
        ? {
            ...entry,
            operands: entry.operands.map((bytes, i) => (isOffsetOperand(entry.operator, i, entry.values[i] ?? 0) ? encodeOffset((entry.values[i] ?? 0) + shift) : bytes)),
          }
        : entry,
    );
  const newIndexLength = encodeIndex([encodeDict(withFixedOffsets(0))]).length;
  const shift = newIndexLength - (topDictIndex.end - topDictIndex.start);
  const newTopDictIndex = encodeIndex([encodeDict(withFixedOffsets(shift))]);

  const out = new Uint8Array(cff.length + shift);
  out.set(cff.subarray(0, topDictIndex.start), 0);
  out.set(newTopDictIndex, topDictIndex.start);
  out.set(cff.subarray(topDictIndex.end), topDictIndex.start + newTopDictIndex.length);
  return out;
}

/** Largest offSize of an INDEX (TN #5176, Table 2 "Type": OffSize 1–4). */
const MAX_OFF_SIZE = 4;
/** The Private DICT operator Subrs: the local subroutines' INDEX, offset from the Private DICT (TN #5176, Table 23). */
const PRIVATE_SUBRS_OPERATOR = 19;

/**
 * Checks the INDEX at `start` of `cff` (TN #5176, section 5): offSize 1–4, offsets
 * from 1 that never decrease and end inside the table. Returns where it ends.
 * opentype.js copies every item of every INDEX byte by byte, so an INDEX whose
 * offsets jump back and forth would have it copy the table tens of thousands of
 * times; a checked INDEX holds at most the table's bytes.
 */
function checkIndex(cff: Uint8Array, start: number, what: string): number {
  if (!Number.isInteger(start) || start < 0) throw new RangeError(`the ${what} INDEX has no valid offset`);
  if (start + 2 > cff.length) throw new RangeError(`the ${what} INDEX starts past the end of the table`);
  const count = readOffset(cff, start, 2);
  if (count === 0) return start + 2;
  const offSize = cff[start + 2] ?? 0;
  if (offSize < 1 || offSize > MAX_OFF_SIZE) throw new RangeError(`the ${what} INDEX has offsets of ${offSize} bytes`);
  const offsetsAt = start + INDEX_HEADER_BYTES;
  if (offsetsAt + (count + 1) * offSize > cff.length) throw new RangeError(`the ${what} INDEX runs past the end of the table`);
  const dataBase = offsetsAt + (count + 1) * offSize - 1;
  let previous = readOffset(cff, offsetsAt, offSize);
  if (previous !== 1) throw new RangeError(`the ${what} INDEX does not start at offset 1`);
  for (let i = 1; i <= count; i++) {
    const offset = readOffset(cff, offsetsAt + i * offSize, offSize);
    if (offset < previous) throw new RangeError(`the ${what} INDEX has offsets that go backwards`);
    previous = offset;
  }
  if (dataBase + previous > cff.length) throw new RangeError(`the ${what} INDEX runs past the end of the table`);
  return dataBase + previous;
}

/**
 * Checks the INDEXes of a CFF version 1 table a reader walks: Name, Top DICT,
 * String, Global Subrs, CharStrings and the local Subrs. Throws RangeError saying
 * which is damaged.
 */
export function checkCffIndexes(cff: Uint8Array): void {
  const headerSize = cff[2];
  if (cff[0] !== 1 || headerSize === undefined) throw new RangeError('it is not a CFF version 1 table');
  const nameEnd = checkIndex(cff, headerSize, 'Name');
  const topDictEnd = checkIndex(cff, nameEnd, 'Top DICT');
  const stringEnd = checkIndex(cff, topDictEnd, 'String');
  checkIndex(cff, stringEnd, 'Global Subrs');
  for (const topDict of readIndex(cff, nameEnd).items) {
    let entries: DictEntry[];
    try {
      entries = parseDict(topDict);
    } catch {
      throw new RangeError('its Top DICT is damaged');
    }
    const charStrings = entries.find((e) => e.operator === OPERATOR.charStrings)?.values[0];
    if (charStrings !== undefined) checkIndex(cff, charStrings, 'CharStrings');
    const [privateSize, privateOffset] = entries.find((e) => e.operator === OPERATOR.private)?.values ?? [];
    if (privateSize === undefined || privateOffset === undefined || privateOffset + privateSize > cff.length || privateSize < 0 || privateOffset < 0) continue;
    let privateEntries: DictEntry[];
    try {
      privateEntries = parseDict(cff.subarray(privateOffset, privateOffset + privateSize));
    } catch {
      throw new RangeError('its Private DICT is damaged');
    }
    const subrs = privateEntries.find((e) => e.operator === PRIVATE_SUBRS_OPERATOR)?.values[0];
    if (subrs !== undefined) checkIndex(cff, privateOffset + subrs, 'local Subrs');
  }
}
