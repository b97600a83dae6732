// The patch to the 'head' table (OpenType spec, 'head'). opentype.js 2.0.0 stamps
// `modified` with the current time (so the same source never gives the same bytes
// twice), fixes fontRevision at 1.0, computes the bounding box from control points
// without .notdef, and sets macStyle from its own bold threshold. Here the dates are
// the source's timestamp, the revision its version, the box the union of every
// glyph's whole-unit ink box (as in CFF FontBBox), and macStyle the style linking's.
import type { IntegerBox } from './integer-outline.ts';

/** Field offsets in 'head' (OpenType spec, 'head' version 1.0 layout). */
const HEAD_OFFSET = {
  fontRevision: 4,
  created: 20,
  modified: 28,
  xMin: 36,
  yMin: 38,
  xMax: 40,
  yMax: 42,
  macStyle: 44,
} as const;
/** Length of a 'head' table (OpenType spec, 'head'). */
const HEAD_LENGTH = 54;
/** Seconds from 1904-01-01 (LONGDATETIME's epoch, OpenType spec "Data types") to 1970-01-01. */
export const SECONDS_1904_TO_1970 = 2_082_844_800;
/** Fixed is 16.16 (OpenType spec, "Data types"). */
const FIXED_ONE = 65536;

export interface HeadValues {
  readonly fontRevision: number;
  /** Seconds since 1970-01-01 UTC, for both created and modified. */
  readonly timestampSeconds: number;
  readonly bounds: IntegerBox;
  readonly macStyle: number;
}

/** A copy of the 'head' table with `values` written in. */
export function patchHead(head: Uint8Array, values: HeadValues): Uint8Array {
  if (head.length !== HEAD_LENGTH) throw new RangeError(`expected a ${HEAD_LENGTH}-byte head table, got ${head.length}`);
  const out = head.slice();
  const view = new DataView(out.buffer);
  view.setInt32(HEAD_OFFSET.fontRevision, Math.round(values.fontRevision * FIXED_ONE));
  const longDateTime = BigInt(values.timestampSeconds + SECONDS_1904_TO_1970);
  view.setBigInt64(HEAD_OFFSET.created, longDateTime);
  view.setBigInt64(HEAD_OFFSET.modified, longDateTime);
  view.setInt16(HEAD_OFFSET.xMin, values.bounds.xMin);
  view.setInt16(HEAD_OFFSET.yMin, values.bounds.yMin);
  view.setInt16(HEAD_OFFSET.xMax, values.bounds.xMax);
  view.setInt16(HEAD_OFFSET.yMax, values.bounds.yMax);
  view.setUint16(HEAD_OFFSET.macStyle, values.macStyle);
  return out;
}
