// Mutations of a real sample file for the fuzzing suites: bytes set, header-sized
// fields overwritten with the values parsers trip on (0, 1, all ones, sizes of
// 100,000 and more), runs of bytes deleted, duplicated or replaced, and the file cut
// short. Half of the edits land in the first HEADER_BYTES, where sizes, counts and
// offsets live; the rest anywhere. The same seed gives the same mutations.
import fc from 'fast-check';
import { crc32 } from 'node:zlib';

/** Bytes at the start of a file where its headers and directories lie (PNG IHDR, TIFF IFD0, an sfnt table directory). */
const HEADER_BYTES = 512;

/** Values written over 16- and 32-bit fields: the edges of their ranges and sizes no real file has. */
const INTERESTING_VALUES = [0, 1, 2, 0x7f, 0x80, 0xff, 0x100, 0x7fff, 0x8000, 0xffff, 0x1_0000, 100_000, 0x7fff_ffff, 0x8000_0000, 0xffff_ffff];

type Edit =
  | { kind: 'set'; at: number; value: number }
  | { kind: 'field'; at: number; bytes: 2 | 4; value: number; littleEndian: boolean }
  | { kind: 'delete'; at: number; length: number }
  | { kind: 'duplicate'; at: number; length: number }
  | { kind: 'splice'; at: number; bytes: Uint8Array }
  | { kind: 'truncate'; at: number };

/** Where an edit lands, uniformly (fast-check leans towards small numbers, which would hit the signature nearly every time). */
const place = fc.oneof(fc.noBias(fc.integer({ min: 0, max: HEADER_BYTES - 1 })), fc.noBias(fc.nat()));

const edit: fc.Arbitrary<Edit> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('set' as const), at: place, value: fc.integer({ min: 0, max: 255 }) }) },
  { weight: 4, arbitrary: fc.record({ kind: fc.constant('field' as const), at: place, bytes: fc.constantFrom(2 as const, 4 as const), value: fc.constantFrom(...INTERESTING_VALUES), littleEndian: fc.boolean() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('delete' as const), at: place, length: fc.integer({ min: 1, max: 64 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('duplicate' as const), at: place, length: fc.integer({ min: 1, max: 64 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('splice' as const), at: place, bytes: fc.uint8Array({ minLength: 1, maxLength: 32 }) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('truncate' as const), at: fc.noBias(fc.nat()) }) },
);

function apply(bytes: Uint8Array, e: Edit): Uint8Array {
  if (bytes.length === 0) return bytes;
  const at = e.at % bytes.length;
  switch (e.kind) {
    case 'set': {
      const out = Uint8Array.from(bytes); // a copy: Buffer's slice() would share the sample's memory
      out[at] = e.value;
      return out;
    }
    case 'field': {
      const out = Uint8Array.from(bytes);
      const view = new DataView(out.buffer, out.byteOffset, out.byteLength);
      if (at + e.bytes > out.length) return out;
      if (e.bytes === 2) view.setUint16(at, e.value & 0xffff, e.littleEndian);
      else view.setUint32(at, e.value >>> 0, e.littleEndian);
      return out;
    }
    case 'delete':
      return concat(bytes.subarray(0, at), bytes.subarray(at + e.length));
    case 'duplicate':
      return concat(bytes.subarray(0, at + e.length), bytes.subarray(at));
    case 'splice':
      return concat(bytes.subarray(0, at), e.bytes, bytes.subarray(at + e.bytes.length));
    case 'truncate':
      return Uint8Array.from(bytes.subarray(0, at));
  }
}

function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let offset = 0;
  for (const part of parts) {
    out.set(part, offset);
    offset += part.length;
  }
  return out;
}

const PNG_SIGNATURE_BYTES = 8;
/** A PNG chunk's length, type and CRC fields around its data (ISO/IEC 15948, 5.3). */
const PNG_CHUNK_OVERHEAD = 12;

/**
 * `bytes` with every PNG chunk's CRC recomputed (ISO/IEC 15948, 5.3: CRC-32 of the
 * type and data), so an edited header field reaches the decoder instead of being
 * refused for its checksum. Stops at the first chunk that runs past the end.
 */
export function withPngCrcsFixed(bytes: Uint8Array): Uint8Array {
  const out = Uint8Array.from(bytes);
  const view = new DataView(out.buffer, out.byteOffset, out.byteLength);
  let offset = PNG_SIGNATURE_BYTES;
  while (offset + PNG_CHUNK_OVERHEAD <= out.length) {
    const length = view.getUint32(offset);
    const end = offset + 8 + length;
    if (end + 4 > out.length) break;
    view.setUint32(end, crc32(out.subarray(offset + 4, end)));
    offset = end + 4;
  }
  return out;
}

/**
 * A sample picked from `samples` with 1–4 edits applied; `name` says which sample it
 * was. A PNG has its chunk checksums made right again after the edits in half the
 * cases, so the edits reach past the checksum test.
 */
export function mutatedSample(samples: readonly { name: string; bytes: Uint8Array }[]): fc.Arbitrary<{ name: string; bytes: Uint8Array }> {
  return fc.record({ sample: fc.constantFrom(...samples), edits: fc.array(edit, { minLength: 1, maxLength: 4 }), fixChecksums: fc.boolean() }).map(({ sample, edits, fixChecksums }) => {
    const bytes = edits.reduce(apply, sample.bytes);
    return { name: sample.name, bytes: fixChecksums && sample.name.endsWith('.png') ? withPngCrcsFixed(bytes) : bytes };
  });
}
