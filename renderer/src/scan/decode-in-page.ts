// Decodes a scan in the page, for browser mode: the browser's own image decoder
// turns the file into pixels (EXIF orientation applied, no colour conversion), and
// this module flattens them onto white paper as 8-bit greys, so the same core
// tracing path runs as in the desktop app and the CLI. Browsers cannot decode TIFF:
// read-scan.ts hands those files to the host, which decodes them with the command
// line's reader and gives back a PNG that this module then decodes.
import { readImageHeader } from '../../../core/raster/image-header.ts';

/**
 * Largest scan decoded in the page. The same 200-megapixel budget as the desktop
 * app (electron/io/decode-scan.ts): a US-letter page at about 1,650 dpi.
 */
export const PAGE_PIXEL_BUDGET = 200_000_000;

export interface PageScan {
  raster: { width: number; height: number; data: Uint8Array; dpi?: number };
  format: string;
}

/** A scan that cannot be read in the page; the message is for the user. */
export class PageDecodeError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PageDecodeError';
  }
}

/**
 * Rec. 709 luma weights (ITU-R BT.709-6, item 3.3), applied to the sRGB values as
 * stored. For grey scans, where R = G = B, the result is the stored grey exactly.
 */
const LUMA_RED = 0.2126;
const LUMA_GREEN = 0.7152;
const LUMA_BLUE = 0.0722;

export async function decodeScanInPage(file: Blob, name: string): Promise<PageScan> {
  const bytes = new Uint8Array(await file.arrayBuffer());
  const header = readImageHeader(bytes);
  if (header === null) throw new PageDecodeError(`${name}: not an image Stemline can read. Use PNG, JPEG, TIFF or WebP.`);
  if (header.format === 'tiff') {
    // read-scan.ts sends TIFF to the host; reaching here is a slip in the app, not the file.
    throw new PageDecodeError(`${name}: a TIFF reached the page's own decoder, which cannot read it. This is a bug in the app: please report it.`);
  }
  const pixels = header.width * header.height;
  if (pixels > PAGE_PIXEL_BUDGET) {
    throw new PageDecodeError(`${name} is ${header.width.toLocaleString('en-US')} × ${header.height.toLocaleString('en-US')} pixels (${Math.round(pixels / 1e6)} megapixels); Stemline reads up to ${PAGE_PIXEL_BUDGET / 1e6} megapixels: scan at a lower resolution or crop the sheet.`);
  }
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(new Blob([bytes]), { colorSpaceConversion: 'none', premultiplyAlpha: 'none', imageOrientation: 'from-image' });
  } catch {
    throw new PageDecodeError(`${name}: the image data is damaged or incomplete. Export or scan it again.`);
  }
  const { width, height } = bitmap;
  const canvas = new OffscreenCanvas(width, height);
  const context = canvas.getContext('2d', { willReadFrequently: true });
  if (!context) throw new PageDecodeError('This browser gives no 2D canvas to read the scan with.');
  context.drawImage(bitmap, 0, 0);
  bitmap.close();
  const rgba = context.getImageData(0, 0, width, height, { colorSpace: 'srgb' }).data;
  const data = new Uint8Array(width * height);
  for (let i = 0, j = 0; i < data.length; i++, j += 4) {
    const alpha = (rgba[j + 3] ?? 255) / 255;
    const luma = LUMA_RED * (rgba[j] ?? 0) + LUMA_GREEN * (rgba[j + 1] ?? 0) + LUMA_BLUE * (rgba[j + 2] ?? 0);
    data[i] = Math.round(alpha * luma + (1 - alpha) * 255);
  }
  const raster: PageScan['raster'] = { width, height, data };
  if (header.dpi !== undefined) raster.dpi = header.dpi;
  return { raster, format: header.format };
}
