// Reading scans: every format a lettering artist's scanner or phone produces
// arrives as the same 8-bit greyscale raster, with its resolution, and bad files
// are refused with a message naming the file. Reference encoder: sharp/libvips
// (a general-purpose image library), which writes the test files here.
import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { deflateSync } from 'node:zlib';
import { checkPixelBudget, decodeScanBytes, decodeScanFile, PIXEL_BUDGET } from '../../electron/io/decode-scan.ts';
import { InputError } from '../../electron/io/input-error.ts';

const WIDTH = 64;
const HEIGHT = 48;

/** A grey test card: a black square, a mid-grey band and white paper. */
function testCard(): Uint8Array {
  const data = new Uint8Array(WIDTH * HEIGHT).fill(255);
  for (let y = 8; y < 30; y++) for (let x = 10; x < 30; x++) data[y * WIDTH + x] = 0;
  for (let y = 36; y < 44; y++) for (let x = 0; x < WIDTH; x++) data[y * WIDTH + x] = 128;
  return data;
}

const rawGrey = (data: Uint8Array) => sharp(Buffer.from(data), { raw: { width: WIDTH, height: HEIGHT, channels: 1 } });

async function expectInputError(promise: Promise<unknown>, kind: string, pattern: RegExp) {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(InputError);
  expect((error as InputError).kind).toBe(kind);
  expect((error as InputError).message).toMatch(pattern);
}

/** A PNG that claims the given size in its header but holds almost no data (a decompression bomb's shape). */
function pngClaiming(width: number, height: number): Uint8Array {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (bytes: Buffer) => {
    let c = 0xffffffff;
    for (const b of bytes) c = (crcTable[(c ^ b) & 0xff] ?? 0) ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, body: Buffer) => {
    const length = Buffer.alloc(4);
    length.writeUInt32BE(body.length);
    const typed = Buffer.concat([Buffer.from(type, 'ascii'), body]);
    const sum = Buffer.alloc(4);
    sum.writeUInt32BE(crc(typed));
    return Buffer.concat([length, typed, sum]);
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth (PNG specification, ISO/IEC 15948 §11.2.2)
  header[9] = 0; // colour type 0: greyscale
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(Buffer.alloc(1024))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

describe('scan decoding', () => {
  it('reads an 8-bit greyscale PNG pixel for pixel, with its resolution', async () => {
    const png = await rawGrey(testCard()).png().withMetadata({ density: 600 }).toBuffer();
    const scan = await decodeScanBytes(png, 'card.png');
    expect(scan.raster.width).toBe(WIDTH);
    expect(scan.raster.height).toBe(HEIGHT);
    expect([...scan.raster.data]).toEqual([...testCard()]);
    expect(scan.dpi).toBe(600);
    expect(scan.bilevel).toBe(false);
    expect(scan.format).toBe('png');
  });

  it('maps 16-bit greys to 8 bits by value, not by truncation', async () => {
    const sixteen = await rawGrey(testCard()).toColourspace('grey16').png().toBuffer();
    expect((await sharp(sixteen).metadata()).depth).toBe('ushort');
    const scan = await decodeScanBytes(sixteen, 'card16.png');
    expect(Math.abs((scan.raster.data[40 * WIDTH + 5] ?? 0) - 128)).toBeLessThanOrEqual(1);
    expect(scan.raster.data[20 * WIDTH + 20]).toBe(0);
    expect(scan.raster.data[0]).toBe(255);
  });

  it('reads a palette PNG', async () => {
    const palette = await rawGrey(testCard()).png({ palette: true, colours: 4 }).toBuffer();
    expect((await sharp(palette).metadata()).isPalette).toBe(true);
    const scan = await decodeScanBytes(palette, 'palette.png');
    expect(scan.raster.data[20 * WIDTH + 20]).toBe(0);
    expect(scan.raster.data[0]).toBe(255);
  });

  it('puts transparent areas on white paper, not black', async () => {
    const rgba = new Uint8Array(WIDTH * HEIGHT * 4); // all transparent black
    for (let i = 0; i < WIDTH * 10; i++) rgba.set([0, 0, 0, 255], i * 4); // opaque black top rows
    const png = await sharp(Buffer.from(rgba), { raw: { width: WIDTH, height: HEIGHT, channels: 4 } }).png().toBuffer();
    const scan = await decodeScanBytes(png, 'alpha.png');
    expect(scan.raster.data[0]).toBe(0);
    expect(scan.raster.data[30 * WIDTH + 30]).toBe(255);
  });

  it('turns a phone JPEG upright by its EXIF orientation', async () => {
    // EXIF orientation 6: the stored image must be turned 90° clockwise for display (EXIF 2.32, CIPA DC-008, tag 0x0112).
    const jpeg = await rawGrey(testCard()).jpeg({ quality: 95 }).withMetadata({ orientation: 6 }).toBuffer();
    const scan = await decodeScanBytes(jpeg, 'phone.jpg');
    expect(scan.raster.width).toBe(HEIGHT);
    expect(scan.raster.height).toBe(WIDTH);
    // Stored pixel (x=20, y=20) lands at displayed (HEIGHT-1-20, 20) after a clockwise turn.
    expect(scan.raster.data[20 * HEIGHT + (HEIGHT - 1 - 20)]).toBeLessThan(40);
    // Displayed (col 40, row 5) comes from stored (x=5, y=HEIGHT-1-40=7): white paper.
    expect(scan.raster.data[5 * HEIGHT + 40]).toBeGreaterThan(215);
  });

  it('reads a 1-bit CCITT Group 4 TIFF to the same pixels as its PNG source', async () => {
    const card = testCard().map((v) => (v < 128 ? 0 : 255));
    const png = await rawGrey(card).png().toBuffer();
    const g4 = await rawGrey(card).toColourspace('b-w').tiff({ compression: 'ccittfax4', bitdepth: 1, xres: 300 / 25.4, yres: 300 / 25.4, resolutionUnit: 'inch' }).toBuffer();
    const fromPng = await decodeScanBytes(png, 'card.png');
    const fromTiff = await decodeScanBytes(g4, 'card.tif');
    expect([...fromTiff.raster.data]).toEqual([...fromPng.raster.data]);
    expect(fromTiff.bilevel).toBe(true);
    expect(fromTiff.dpi).toBe(300);
  });

  it('reads a TIFF resolution given per centimetre as dots per inch', async () => {
    const tiff = await rawGrey(testCard()).tiff({ xres: 600 / 25.4, yres: 600 / 25.4, resolutionUnit: 'cm' }).toBuffer();
    expect((await decodeScanBytes(tiff, 'cm.tif')).dpi).toBeCloseTo(600, 6);
  });

  it('reads the first page of a multi-page TIFF and says so', async () => {
    const black = await sharp({ create: { width: WIDTH, height: HEIGHT, channels: 3, background: '#000' } }).png().toBuffer();
    const white = await sharp({ create: { width: WIDTH, height: HEIGHT, channels: 3, background: '#fff' } }).png().toBuffer();
    const twoPages = await sharp([black, white], { join: { animated: true } }).toColourspace('b-w').tiff({ compression: 'ccittfax4', bitdepth: 1 }).toBuffer();
    const scan = await decodeScanBytes(twoPages, 'batch.tif');
    expect(scan.raster.height).toBe(HEIGHT);
    expect(scan.raster.data.every((v) => v === 0)).toBe(true);
    expect(scan.notes.join(' ')).toMatch(/batch\.tif has 2 pages; only the first page was read/);
  });

  it('reads WebP', async () => {
    const webp = await rawGrey(testCard()).webp({ lossless: true }).toBuffer();
    const scan = await decodeScanBytes(webp, 'card.webp');
    expect(scan.format).toBe('webp');
    expect(scan.raster.data[20 * WIDTH + 20]).toBe(0);
  });

  it('names the file and the problem for a truncated PNG', async () => {
    const png = await rawGrey(testCard()).png().toBuffer();
    await expectInputError(decodeScanBytes(png.subarray(0, png.length - 40), 'cut.png'), 'image-corrupt', /^cut\.png: .*damaged or incomplete/);
  });

  it('calls a TIFF whose first directory is damaged a damaged TIFF, not "not an image"', async () => {
    const tiff = await rawGrey(testCard()).tiff().toBuffer();
    const damaged = Buffer.from(tiff);
    damaged.writeUInt32LE(0xffff_fff0, 4); // the offset of the first image directory (TIFF 6.0, section 2), pointed past the end
    await expectInputError(decodeScanBytes(damaged, 'sheet.tif'), 'image-corrupt', /^sheet\.tif: this TIFF file is damaged or incomplete \(.+\)\. Export or scan it again\.$/);
  });

  it('says a text file is not an image it can read', async () => {
    await expectInputError(decodeScanBytes(new TextEncoder().encode('hello, not an image'), 'notes.txt'), 'image-unsupported', /notes\.txt: not an image .* PNG, JPEG, TIFF or WebP/);
  });

  it('says when the file does not exist or is a folder', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'stemline-decode-'));
    await expectInputError(decodeScanFile(join(folder, 'missing.png')), 'file-unreadable', /missing\.png: there is no such file/);
    await expectInputError(decodeScanFile(folder), 'file-unreadable', /is a folder/);
  });

  it('refuses a tiny file claiming 100,000 × 100,000 pixels from its header alone, suggesting what to do', async () => {
    await expectInputError(decodeScanBytes(pngClaiming(100_000, 100_000), 'bomb.png'), 'image-too-large', /bomb\.png is 100,000 × 100,000 pixels \(10\.0 gigapixels\); Stemline reads up to 200 megapixels/);
  });

  it('suggests a scan resolution that fits the budget when the file gives its dpi', () => {
    // A US-letter page (8.5 × 11 in = 216 × 279 mm) at 2,400 dpi is 20,400 × 26,400 pixels (538.56 megapixels);
    // √(200 / 538.56) × 2,400 dpi = 1,462 dpi, offered rounded down to a multiple of 50.
    expect(() => checkPixelBudget(20_400, 26_400, 2400, 'letter.tif')).toThrow(
      'letter.tif is 20,400 × 26,400 pixels (539 megapixels); Stemline reads up to 200 megapixels: this 216 × 279 mm page fits at 1450 dpi or lower.',
    );
    expect(() => checkPixelBudget(14_142, 14_142, undefined, 'square.png')).not.toThrow();
    expect(PIXEL_BUDGET).toBe(200_000_000);
  });
});

/**
 * A TIFF of a header and nothing else, claiming `width` × `height` 1-bit pixels at
 * `dpi` (TIFF 6.0: a little-endian header, one IFD of tags in ascending order, two
 * RATIONAL resolutions after it; the one strip it names is absent).
 */
function tiffClaiming(width: number, height: number, dpi: number): Uint8Array {
  const SHORT = 3;
  const LONG = 4;
  const RATIONAL = 5;
  const tags: [number, number, number][] = [
    [256, LONG, width], [257, LONG, height], [258, SHORT, 1], [259, SHORT, 4], [262, SHORT, 0],
    [273, LONG, 0], [278, LONG, height], [279, LONG, 0], [282, RATIONAL, 0], [283, RATIONAL, 0], [296, SHORT, 2],
  ];
  const ifdAt = 8;
  const rationalsAt = ifdAt + 2 + tags.length * 12 + 4;
  const bytes = new Uint8Array(rationalsAt + 16);
  const view = new DataView(bytes.buffer);
  bytes.set([0x49, 0x49, 0x2a, 0x00]);
  view.setUint32(4, ifdAt, true);
  view.setUint16(ifdAt, tags.length, true);
  tags.forEach(([tag, type, value], i) => {
    const at = ifdAt + 2 + i * 12;
    view.setUint16(at, tag, true);
    view.setUint16(at + 2, type, true);
    view.setUint32(at + 4, 1, true);
    if (type === RATIONAL) view.setUint32(at + 8, rationalsAt + (tag === 282 ? 0 : 8), true);
    else if (type === SHORT) view.setUint16(at + 8, value, true);
    else view.setUint32(at + 8, value, true);
  });
  for (const at of [rationalsAt, rationalsAt + 8]) {
    view.setUint32(at, dpi, true);
    view.setUint32(at + 4, 1, true);
  }
  return bytes;
}

describe('decompression bombs', () => {
  it('refuses a 200-byte TIFF claiming 48,000 × 60,000 pixels at 1,200 dpi, saying its size and the resolution that would fit', async () => {
    const bomb = tiffClaiming(48_000, 60_000, 1200);
    expect(bomb.length).toBeLessThan(200);
    // 48,000 × 60,000 = 2.88 gigapixels; 40 × 50 in = 1,016 × 1,270 mm; √(200 / 2,880) × 1,200 dpi = 316, rounded down to 300.
    await expectInputError(decodeScanBytes(bomb, 'poster.tif'), 'image-too-large', /^poster\.tif is 48,000 × 60,000 pixels \(2\.9 gigapixels\); Stemline reads up to 200 megapixels: this 1016 × 1270 mm page fits at 300 dpi or lower\.$/);
  });
});
