// Decodes a scan file into the plain greyscale raster core/ works on. All image
// formats go through sharp (libvips): PNG (8/16-bit, palette, alpha), JPEG (EXIF
// orientation applied), TIFF (including 1-bit CCITT Group 4; the first page of a
// multi-page file), WebP. The header is read first, so an oversized or bogus image
// is refused before any pixels are decoded.
import sharp, { type Metadata } from 'sharp';
import { basename } from 'node:path';
import { InputError } from './input-error.ts';
import { readInputFile } from './read-input-file.ts';
import { formatBySignature, HEADER_FORMAT_NAMES, readImageHeader } from '../../core/raster/image-header.ts';

/**
 * Largest image accepted, in pixels. 200 megapixels is a US-letter page at about
 * 1,650 dpi, well past the 300–1,200 dpi lettering scans are made at, and keeps the
 * greyscale raster (one byte per pixel) and the stages after it within memory.
 */
export const PIXEL_BUDGET = 200_000_000;

/** Formats this reader accepts, as sharp names them. */
const ACCEPTED_FORMATS = new Set(['png', 'jpeg', 'tiff', 'webp']);

/** Millimetres per inch, for converting a resolution to a physical size. */
const MM_PER_INCH = 25.4;

/** A decoded scan: 8-bit greyscale, 0 = black, 255 = white, row-major. */
export interface DecodedScan {
  raster: { width: number; height: number; data: Uint8Array };
  /** Resolution in dots per inch, when the file records one. */
  dpi?: number;
  /** True when the file stores one bit per pixel (pixel values are 0 or 255 only). */
  bilevel: boolean;
  /** The format sharp detected: 'png', 'jpeg', 'tiff' or 'webp'. */
  format: string;
  /** Things the user should know about how the file was read. */
  notes: string[];
}

/** Reads and decodes the scan at `path`. Throws `InputError` with a user-facing message. */
export async function decodeScanFile(path: string): Promise<DecodedScan> {
  return decodeScanBytes(await readInputFile(path), basename(path));
}

/** Decodes scan bytes; `name` is used in messages. Throws `InputError`. */
export async function decodeScanBytes(bytes: Uint8Array, name: string): Promise<DecodedScan> {
  const metadata = await readHeader(bytes, name);
  const { width, height } = orientedSize(metadata);
  checkPixelBudget(width, height, metadata.density, name);

  const notes: string[] = [];
  if ((metadata.pages ?? 1) > 1) {
    notes.push(`${name} has ${metadata.pages} pages; only the first page was read.`);
  }
  try {
    const { data, info } = await sharp(bytes, { limitInputPixels: PIXEL_BUDGET, failOn: 'error', page: 0 })
      .autoOrient()
      .flatten({ background: '#ffffff' })
      .toColourspace('b-w')
      .raw({ depth: 'uchar' })
      .toBuffer({ resolveWithObject: true });
    if (info.channels !== 1) throw new Error(`expected one channel, got ${info.channels}`);
    const raster = { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.byteLength) };
    const decoded: DecodedScan = { raster, bilevel: metadata.bitsPerSample === 1, format: metadata.format ?? 'unknown', notes };
    const dpi = recordedDpi(bytes, metadata);
    if (dpi !== undefined) decoded.dpi = dpi;
    return decoded;
  } catch (error) {
    throw new InputError('image-corrupt', name, `${name}: the image data is damaged or incomplete (${describeSharpError(error)}). Export or scan it again.`);
  }
}

async function readHeader(bytes: Uint8Array, name: string): Promise<Metadata> {
  let metadata: Metadata;
  try {
    metadata = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch (error) {
    const reason = describeSharpError(error);
    const signature = formatBySignature(bytes);
    if (signature !== null) {
      // libvips calls a file whose header it cannot parse "unsupported"; one that starts like a format it reads is damaged.
      const why = /unsupported image format/i.test(reason) ? 'its header is damaged' : reason;
      throw new InputError('image-corrupt', name, `${name}: this ${HEADER_FORMAT_NAMES[signature]} file is damaged or incomplete (${why}). Export or scan it again.`);
    }
    if (/unsupported image format/i.test(reason)) {
      throw new InputError('image-unsupported', name, `${name}: not an image Stemline can read. Use PNG, JPEG, TIFF or WebP.`);
    }
    throw new InputError('image-corrupt', name, `${name}: the file is damaged or incomplete (${reason}). Export or scan it again.`);
  }
  if (metadata.format === undefined || !ACCEPTED_FORMATS.has(metadata.format)) {
    throw new InputError('image-unsupported', name, `${name}: ${metadata.format ?? 'this'} images are not supported. Use PNG, JPEG, TIFF or WebP.`);
  }
  if (!metadata.width || !metadata.height) {
    throw new InputError('image-corrupt', name, `${name}: the image header gives no size. Export or scan it again.`);
  }
  return metadata;
}

/**
 * The resolution the file itself records: PNG pHYs, JPEG JFIF density and WebP from
 * the shared header reader (libvips reports 72 dpi for files that record nothing),
 * TIFF from its resolution tags through sharp.
 */
function recordedDpi(bytes: Uint8Array, metadata: Metadata): number | undefined {
  if (metadata.format === 'tiff') return metadata.density !== undefined && metadata.density > 0 ? metadata.density : undefined;
  return readImageHeader(bytes)?.dpi;
}

function orientedSize(metadata: Metadata): { width: number; height: number } {
  return metadata.autoOrient ?? { width: metadata.width ?? 0, height: metadata.height ?? 0 };
}

/** Refuses an image over PIXEL_BUDGET, naming its size and a resolution that would fit. */
export function checkPixelBudget(width: number, height: number, dpi: number | undefined, name: string): void {
  const pixels = width * height;
  if (pixels <= PIXEL_BUDGET) return;
  const megapixels = pixels / 1e6;
  const size = `${width.toLocaleString('en-US')} × ${height.toLocaleString('en-US')} pixels (${megapixels >= 1000 ? `${(megapixels / 1000).toFixed(1)} gigapixels` : `${Math.round(megapixels)} megapixels`})`;
  const limit = `Stemline reads up to ${PIXEL_BUDGET / 1e6} megapixels`;
  let advice = 'scan at a lower resolution or crop the sheet';
  if (dpi !== undefined && dpi > 0) {
    const fittingDpi = Math.floor((dpi * Math.sqrt(PIXEL_BUDGET / pixels)) / 50) * 50;
    const widthMm = (width / dpi) * MM_PER_INCH;
    const heightMm = (height / dpi) * MM_PER_INCH;
    advice = `this ${Math.round(widthMm)} × ${Math.round(heightMm)} mm page fits at ${Math.max(fittingDpi, 50)} dpi or lower`;
  }
  throw new InputError('image-too-large', name, `${name} is ${size}; ${limit}: ${advice}.`);
}

function describeSharpError(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  return text.split('\n')[0]?.replace(/^Input (buffer|file) /, '').trim() || 'unknown error';
}
