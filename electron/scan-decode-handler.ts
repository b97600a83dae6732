// The decode-scan intent: the page hands the host a scan file it cannot decode itself
// — a TIFF, which no browser decodes, including the 1-bit CCITT Group 4 files office
// scanners write — and the host decodes it with the reader the command line uses
// (io/decode-scan.ts, sharp), with the same pixel budget and messages. The greys come
// back as a lossless 8-bit greyscale PNG, which the page decodes to exactly these
// values (and can show as the sheet's image), with the file's resolution beside it.
// The same handler answers the desktop preload and the browser-mode host.
import sharp from 'sharp';
import * as v from 'valibot';
import type { DecodedScanImage, HostIntents } from './api-contract.ts';
import type { HostContext } from './host-context.ts';
import { HandlerError } from './handler-error.ts';
import { MAX_FILE_NAME_LENGTH } from './places/workspace-files.ts';
import { decodeScanBytes } from './io/decode-scan.ts';
import { InputError } from './io/input-error.ts';

/**
 * Largest scan file decoded for the page: 192 MiB, which holds an uncompressed 8-bit
 * greyscale TIFF of the whole 200-megapixel budget (decode-scan.ts PIXEL_BUDGET), and
 * whose base64 (4 characters per 3 bytes) is 256 MiB, the largest body the browser
 * host takes (browser-host.ts MAX_PROJECT_REQUEST_BYTES).
 */
export const MAX_DECODE_SCAN_FILE_BYTES = 192 * 2 ** 20;

/** Characters of base64 the largest file takes. */
const MAX_SCAN_BASE64_CHARACTERS = 4 * Math.ceil(MAX_DECODE_SCAN_FILE_BYTES / 3);

/** Room in a request for the file name and the JSON around the base64, beyond the base64 itself. */
const REQUEST_OVERHEAD_CHARACTERS = 4096;

/** The largest decode-scan request body, for the browser host. */
export const MAX_DECODE_SCAN_REQUEST_CHARACTERS = MAX_SCAN_BASE64_CHARACTERS + REQUEST_OVERHEAD_CHARACTERS;

/**
 * Standard base64 (RFC 4648 §4): the alphabet, padding only at the end; with the length a
 * multiple of 4, checked apart. One character class, no repeated group, so the test stays
 * linear on a string of hundreds of MiB (a repeated group overflows V8's regex stack).
 */
const BASE64_PATTERN = /^[A-Za-z0-9+/]*={0,2}$/;

const MEBIBYTE = 2 ** 20;

const schema = v.strictObject({
  name: v.pipe(v.string(), v.minLength(1, 'a file name'), v.maxLength(MAX_FILE_NAME_LENGTH, `a file name of at most ${MAX_FILE_NAME_LENGTH} characters`)),
  base64: v.string('the file’s bytes in base64'),
});

/** The validated arguments of decodeScan; throws HandlerError 'bad-arguments', or 'scan-unreadable' for a file too large. */
export function decodeScanArguments(raw: unknown): HostIntents['decodeScan']['args'] {
  const result = v.safeParse(schema, raw ?? {});
  if (!result.success) {
    const issue = result.issues[0];
    const where = issue ? (v.getDotPath(issue) ?? 'the arguments') : 'the arguments';
    const problem = issue?.expected === 'never' ? 'this request does not take it' : (issue?.message ?? 'invalid value');
    throw new HandlerError('bad-arguments', `The request "decodeScan" was refused: ${where} is wrong (${problem}). This is a bug in the app: please report it.`);
  }
  const { name, base64 } = result.output;
  if (base64.length > MAX_SCAN_BASE64_CHARACTERS) {
    const megabytes = Math.round((base64.length * 3) / 4 / MEBIBYTE);
    throw new HandlerError('scan-unreadable', `${name} is about ${megabytes} MiB; Stemline reads scan files up to ${MAX_DECODE_SCAN_FILE_BYTES / MEBIBYTE} MiB. Save it compressed (Group 4 for a 1-bit scan, LZW or Deflate for grey), scan at a lower resolution, or crop the sheet.`);
  }
  if (base64.length === 0 || base64.length % 4 !== 0 || !BASE64_PATTERN.test(base64)) {
    throw new HandlerError('bad-arguments', `The request "decodeScan" was refused: base64 is wrong (not standard base64). This is a bug in the app: please report it.`);
  }
  return { name, base64 };
}

export async function decodeScan(args: HostIntents['decodeScan']['args'], _context: HostContext): Promise<DecodedScanImage> {
  let scan;
  try {
    scan = await decodeScanBytes(Buffer.from(args.base64, 'base64'), args.name);
  } catch (error) {
    if (error instanceof InputError) throw new HandlerError('scan-unreadable', error.message);
    throw error;
  }
  const { width, height, data } = scan.raster;
  const png = await sharp(data, { raw: { width, height, channels: 1 }, limitInputPixels: false }).png().toBuffer();
  return {
    width,
    height,
    ...(scan.dpi === undefined ? {} : { dpi: scan.dpi }),
    format: scan.format,
    bilevel: scan.bilevel,
    notes: scan.notes,
    pngBase64: png.toString('base64'),
  };
}
