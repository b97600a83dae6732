// The header reader gives a scan's format, size and recorded resolution without
// decoding it, the same in the page and on the Node side. Reference files are
// written by sharp/libvips and Skia (@napi-rs/canvas), two independent encoders.
import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { createCanvas } from '@napi-rs/canvas';
import { readImageHeader } from '../../core/raster/image-header.ts';
import { decodeScanBytes } from '../../electron/io/decode-scan.ts';

const white = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: '#ffffff' } });

describe('image header', () => {
  it('reads a PNG size and its pHYs resolution (ISO/IEC 15948 §11.3.5.3)', async () => {
    const png = await white(321, 123).png().withMetadata({ density: 600 }).toBuffer();
    expect(readImageHeader(png)).toEqual({ format: 'png', width: 321, height: 123, dpi: 600 });
  });

  it('gives no resolution for a PNG that records none, where a decoder would claim 72 dpi', async () => {
    const png = createCanvas(40, 30).toBuffer('image/png');
    expect(readImageHeader(png)).toEqual({ format: 'png', width: 40, height: 30 });
    expect((await sharp(png).metadata()).density).toBe(72); // what libvips reports for it
    expect((await decodeScanBytes(png, 'canvas.png')).dpi).toBeUndefined();
  });

  it('reads a JPEG frame size and JFIF density (ITU-T T.81 SOF0, JFIF 1.02 APP0)', async () => {
    const jpeg = await white(200, 150).jpeg().withMetadata({ density: 300 }).toBuffer();
    const header = readImageHeader(jpeg);
    expect(header).toMatchObject({ format: 'jpeg', width: 200, height: 150 });
    expect(header?.dpi).toBeCloseTo(300, 0);
  });

  it('reads lossy and lossless WebP sizes', async () => {
    expect(readImageHeader(await white(97, 61).webp({ lossless: true }).toBuffer())).toEqual({ format: 'webp', width: 97, height: 61 });
    expect(readImageHeader(await white(97, 61).webp({ quality: 80 }).toBuffer())).toMatchObject({ format: 'webp', width: 97, height: 61 });
  });

  it('recognises TIFF and refuses what is not an image or is cut short', async () => {
    expect(readImageHeader(await white(10, 10).tiff().toBuffer())?.format).toBe('tiff');
    expect(readImageHeader(new TextEncoder().encode('plain text, not an image'))).toBeNull();
    const jpeg = await white(64, 64).jpeg().toBuffer();
    expect(readImageHeader(jpeg.subarray(0, 20))).toBeNull();
  });
});
