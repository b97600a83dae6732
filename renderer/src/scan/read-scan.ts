// Reads a scan file into the greys the tracing worker takes, whichever its format:
// PNG, JPEG and WebP are decoded in the page (decode-in-page.ts); TIFF, which no
// browser decodes, is decoded by the host with the command line's own reader
// (electron/scan-decode-handler.ts), in the desktop app and in browser mode alike,
// and comes back as a lossless greyscale PNG that the page both decodes (to the same
// greys) and shows as the sheet's image.
import { readImageHeader } from '../../../core/raster/image-header.ts';
import { host } from '../host-api.ts';
import { toBase64 } from '../project/scan-copy.ts';
import { decodeScanInPage, type PageScan } from './decode-in-page.ts';

export interface ReadScan {
  scan: PageScan;
  /** An image of the scan the page can show: the file itself, or the host's PNG of a TIFF. */
  image: Blob;
  /** Things the user should know about how the file was read. */
  notes: string[];
}

/** Formats the page hands to its host to decode. */
const DECODED_BY_HOST = new Set(['tiff']);

function bytesOf(base64: string): Uint8Array<ArrayBuffer> {
  const binary = atob(base64);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}

/** Decodes `file`; failures throw with a message for the user (PageDecodeError, or the host's HostError). */
export async function readScan(file: Blob, name: string): Promise<ReadScan> {
  const bytes = new Uint8Array(await file.arrayBuffer());
  const format = readImageHeader(bytes)?.format;
  if (format === undefined || !DECODED_BY_HOST.has(format)) return { scan: await decodeScanInPage(file, name), image: file, notes: [] };
  const decoded = await host.decodeScan({ name, base64: toBase64(bytes) });
  const image = new Blob([bytesOf(decoded.pngBase64)], { type: 'image/png' });
  const { raster } = await decodeScanInPage(image, name);
  // The PNG records no resolution: the file's own comes beside it.
  if (decoded.dpi !== undefined) raster.dpi = decoded.dpi;
  else delete raster.dpi;
  return { scan: { raster, format: decoded.format }, image, notes: decoded.notes };
}
