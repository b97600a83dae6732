// Reads an image file's header — format, size and resolution — before any pixels are
// decoded, so an oversized scan is refused at once and the resolution the file
// really records reaches the cleanup step. Both the page (browser mode) and the Node
// side use it, so a scan gets the same resolution wherever it is opened; a file that
// records none gets none (decoders that report a default 72 dpi are not trusted).
// Formats: PNG (ISO/IEC 15948: IHDR, pHYs), JPEG (ITU-T T.81 SOFn markers; JFIF APP0
// density or EXIF XResolution), WebP (RIFF VP8/VP8L/VP8X) and TIFF (recognised only:
// browsers cannot decode it, and the Node side reads its tags through sharp).

export type HeaderFormat = 'png' | 'jpeg' | 'webp' | 'tiff';

export interface ImageHeader {
  format: HeaderFormat;
  width: number;
  height: number;
  /** Dots per inch, when the header records it. */
  dpi?: number;
}

/** Metres per inch, for PNG's pixels-per-metre resolution. */
const METRES_PER_INCH = 0.0254;
/** Centimetres per inch, for JFIF density given per centimetre. */
const CM_PER_INCH = 2.54;

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function startsWith(bytes: Uint8Array, prefix: readonly number[], offset = 0): boolean {
  return prefix.every((b, i) => bytes[offset + i] === b);
}

function ascii(bytes: Uint8Array, offset: number, length: number): string {
  return String.fromCharCode(...bytes.subarray(offset, offset + length));
}

/** Names of the formats, as a message calls them. */
export const HEADER_FORMAT_NAMES: Readonly<Record<HeaderFormat, string>> = { png: 'PNG', jpeg: 'JPEG', webp: 'WebP', tiff: 'TIFF' };

/**
 * The format `bytes` start like, by its signature alone (the first 12 bytes), or
 * null: so a file whose header is damaged can be called a damaged PNG, not "not an
 * image".
 */
export function formatBySignature(bytes: Uint8Array): HeaderFormat | null {
  if (startsWith(bytes, PNG_SIGNATURE)) return 'png';
  if (bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'jpeg';
  if (bytes.length >= 12 && ascii(bytes, 0, 4) === 'RIFF' && ascii(bytes, 8, 4) === 'WEBP') return 'webp';
  if (bytes.length >= 4 && (ascii(bytes, 0, 4) === 'II*\0' || ascii(bytes, 0, 4) === 'MM\0*')) return 'tiff';
  return null;
}

/** The header of `bytes`, or null when the format is not one of the four above or the header is cut short. */
export function readImageHeader(bytes: Uint8Array): ImageHeader | null {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  try {
    if (startsWith(bytes, PNG_SIGNATURE)) return readPng(bytes, view);
    if (bytes[0] === 0xff && bytes[1] === 0xd8) return readJpeg(bytes, view);
    if (ascii(bytes, 0, 4) === 'RIFF' && ascii(bytes, 8, 4) === 'WEBP') return readWebp(bytes, view);
    if (ascii(bytes, 0, 4) === 'II*\0' || ascii(bytes, 0, 4) === 'MM\0*') return { format: 'tiff', width: 0, height: 0 };
  } catch {
    return null; // a read past the end: the header is incomplete
  }
  return null;
}

function readPng(bytes: Uint8Array, view: DataView): ImageHeader {
  const header: ImageHeader = { format: 'png', width: view.getUint32(16), height: view.getUint32(20) };
  let offset = 8;
  while (offset + 8 <= bytes.length) {
    const length = view.getUint32(offset);
    const type = ascii(bytes, offset + 4, 4);
    if (type === 'pHYs' && length >= 9) {
      const perMetreX = view.getUint32(offset + 8);
      const unitIsMetre = bytes[offset + 16] === 1;
      if (unitIsMetre && perMetreX > 0) header.dpi = Math.round(perMetreX * METRES_PER_INCH * 100) / 100;
    }
    if (type === 'IDAT' || type === 'IEND') break;
    offset += 12 + length;
  }
  return header;
}

/** EXIF (CIPA DC-008) tags of IFD0 that give the resolution. */
const EXIF_X_RESOLUTION = 0x011a;
const EXIF_RESOLUTION_UNIT = 0x0128;
/** EXIF ResolutionUnit values: 2 = inch, 3 = centimetre. */
const EXIF_UNIT_INCH = 2;
const EXIF_UNIT_CM = 3;

/** XResolution in dpi from an EXIF block (a TIFF structure) starting at `start`, if recorded. */
function exifDpi(view: DataView, start: number): number | undefined {
  const little = view.getUint16(start) === 0x4949; // "II": little-endian byte order
  const ifd = start + view.getUint32(start + 4, little);
  const entries = view.getUint16(ifd, little);
  let resolution: number | undefined;
  let unit = EXIF_UNIT_INCH; // the EXIF default
  for (let i = 0; i < entries; i++) {
    const entry = ifd + 2 + i * 12;
    const tag = view.getUint16(entry, little);
    if (tag === EXIF_X_RESOLUTION) {
      const at = start + view.getUint32(entry + 8, little);
      const denominator = view.getUint32(at + 4, little);
      if (denominator > 0) resolution = view.getUint32(at, little) / denominator;
    } else if (tag === EXIF_RESOLUTION_UNIT) {
      unit = view.getUint16(entry + 8, little);
    }
  }
  if (resolution === undefined || resolution <= 0) return undefined;
  if (unit === EXIF_UNIT_CM) return resolution * CM_PER_INCH;
  return unit === EXIF_UNIT_INCH ? resolution : undefined;
}

/** A damaged EXIF block costs only the resolution, never the image. */
function exifDpiOrNone(view: DataView, start: number): number | undefined {
  try {
    return exifDpi(view, start);
  } catch {
    return undefined;
  }
}

function readJpeg(bytes: Uint8Array, view: DataView): ImageHeader {
  let offset = 2;
  let dpi: number | undefined;
  let exifResolution: number | undefined;
  while (offset + 4 <= bytes.length) {
    if (bytes[offset] !== 0xff) throw new RangeError('not a marker');
    const marker = bytes[offset + 1] ?? 0;
    const length = view.getUint16(offset + 2);
    if (marker === 0xe0 && ascii(bytes, offset + 4, 5) === 'JFIF\0') {
      const units = bytes[offset + 11];
      const density = view.getUint16(offset + 12);
      if (units === 1 && density > 0) dpi = density;
      if (units === 2 && density > 0) dpi = density * CM_PER_INCH;
    }
    if (marker === 0xe1 && ascii(bytes, offset + 4, 6) === 'Exif\0\0') exifResolution = exifDpiOrNone(view, offset + 10);
    // SOF0–SOF15 carry the frame size, except DHT (C4), JPG (C8) and DAC (CC).
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      const header: ImageHeader = { format: 'jpeg', height: view.getUint16(offset + 5), width: view.getUint16(offset + 7) };
      // JFIF density when it states a unit, else the EXIF resolution.
      const recorded = dpi ?? exifResolution;
      if (recorded !== undefined) header.dpi = recorded;
      return header;
    }
    offset += 2 + length;
  }
  throw new RangeError('no frame header');
}

function readWebp(bytes: Uint8Array, view: DataView): ImageHeader {
  const chunk = ascii(bytes, 12, 4);
  if (chunk === 'VP8X') {
    const width = 1 + (view.getUint32(24, true) & 0xffffff);
    const height = 1 + (view.getUint32(27, true) & 0xffffff);
    return { format: 'webp', width, height };
  }
  if (chunk === 'VP8L') {
    const bits = view.getUint32(21, true);
    return { format: 'webp', width: 1 + (bits & 0x3fff), height: 1 + ((bits >>> 14) & 0x3fff) };
  }
  if (chunk === 'VP8 ') {
    return { format: 'webp', width: view.getUint16(26, true) & 0x3fff, height: view.getUint16(28, true) & 0x3fff };
  }
  throw new RangeError('unknown WebP chunk');
}
