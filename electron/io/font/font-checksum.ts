// Checksums of an OpenType font: each table's checksum in the table directory, and
// head.checkSumAdjustment, which makes the whole file sum to a fixed value (OpenType
// spec, "Calculating checksums" and 'head' table). Needed because the writer edits
// tables after opentype.js has assembled the font, and a stale checksum is a font
// some tools reject as damaged.

/** The whole font's checksum plus checkSumAdjustment must equal this (OpenType spec, 'head': 0xB1B0AFBA). */
export const CHECKSUM_MAGIC = 0xb1b0afba;

/** Byte offset of checkSumAdjustment in the 'head' table (OpenType spec, 'head': after version and fontRevision). */
export const HEAD_CHECKSUM_ADJUSTMENT_OFFSET = 8;

/** Bytes per checksum word: tables are summed as big-endian uint32, zero-padded to a multiple of 4. */
const WORD_BYTES = 4;
/** Checksums are sums modulo 2³². */
const UINT32_RANGE = 2 ** 32;

/** The OpenType checksum of `bytes`: the sum of its big-endian uint32 words, zero-padded, modulo 2³². */
export function tableChecksum(bytes: Uint8Array): number {
  let sum = 0;
  const wholeWords = Math.floor(bytes.length / WORD_BYTES) * WORD_BYTES;
  for (let i = 0; i < wholeWords; i += WORD_BYTES) {
    sum += ((bytes[i]! << 24) >>> 0) + (bytes[i + 1]! << 16) + (bytes[i + 2]! << 8) + bytes[i + 3]!;
    if (sum >= UINT32_RANGE) sum -= UINT32_RANGE;
  }
  if (wholeWords < bytes.length) {
    let last = 0;
    for (let k = 0; k < WORD_BYTES; k++) last = last * 256 + (bytes[wholeWords + k] ?? 0);
    sum = (sum + last) % UINT32_RANGE;
  }
  return sum;
}

/** The checkSumAdjustment for a font whose bytes (with the adjustment field zeroed) sum to `fontChecksum`. */
export function checkSumAdjustment(fontChecksum: number): number {
  return (CHECKSUM_MAGIC - fontChecksum + UINT32_RANGE) % UINT32_RANGE;
}
