// Decoding a TIFF for the page, through the decodeScan intent in both hosts: greyscale,
// RGB, 1-bit CCITT Group 4 and multi-strip files come back as a PNG holding exactly the
// greys the command line reads from the same file (electron/io/decode-scan.ts), with the
// resolution the file records; bad requests and bad files are refused with a message
// saying what to do. Reference encoder: sharp/libvips, which writes the test files.
import { describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { HandlerError } from '../../electron/handler-error.ts';
import { decodeScanBytes } from '../../electron/io/decode-scan.ts';
import { MAX_DECODE_SCAN_FILE_BYTES } from '../../electron/scan-decode-handler.ts';
import type { DecodedScanImage } from '../../electron/api-contract.ts';
import { browserHostFixture, desktopHostFixture } from './project-host-fixture.ts';

const WIDTH = 120;
/** Tall enough that libvips writes more than one strip (it writes strips of at most 256 rows here). */
const HEIGHT = 700;
/** TIFF resolution tags take pixels per unit; sharp's xres/yres are per millimetre. */
const MM_PER_INCH = 25.4;

/** A grey test card: a black square, a mid-grey band and white paper. */
function testCard(): Buffer {
  const data = Buffer.alloc(WIDTH * HEIGHT, 255);
  for (let y = 100; y < 400; y++) for (let x = 10; x < 70; x++) data[y * WIDTH + x] = 0;
  for (let y = 500; y < 560; y++) for (let x = 0; x < WIDTH; x++) data[y * WIDTH + x] = 128;
  return data;
}

const grey = () => sharp(testCard(), { raw: { width: WIDTH, height: HEIGHT, channels: 1 } });
const atDpi = (dpi: number) => ({ xres: dpi / MM_PER_INCH, yres: dpi / MM_PER_INCH, resolutionUnit: 'inch' as const });

/** How many strips the first image of a TIFF is stored in (TIFF 6.0 §3: StripOffsets, tag 273). */
function stripCount(tiff: Buffer): number {
  const little = tiff.toString('latin1', 0, 2) === 'II';
  const u16 = (at: number) => (little ? tiff.readUInt16LE(at) : tiff.readUInt16BE(at));
  const u32 = (at: number) => (little ? tiff.readUInt32LE(at) : tiff.readUInt32BE(at));
  const ifd = u32(4);
  for (let i = 0; i < u16(ifd); i++) {
    const entry = ifd + 2 + i * 12;
    if (u16(entry) === 273) return u32(entry + 4);
  }
  return 0;
}

/** The greys of the PNG the host sent, as the page will decode them (sharp decodes the PNG here). */
async function pngGreys(decoded: DecodedScanImage): Promise<Buffer> {
  const { data, info } = await sharp(Buffer.from(decoded.pngBase64, 'base64')).toColourspace('b-w').raw().toBuffer({ resolveWithObject: true });
  expect(info.channels).toBe(1);
  return data;
}

async function refusal(promise: Promise<unknown>): Promise<HandlerError> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(HandlerError);
  return error as HandlerError;
}

describe('decoding a TIFF for the page', () => {
  const hosts = { browser: browserHostFixture(), desktop: desktopHostFixture({ open: [], save: [] }) };

  it('gives the page the same greys and resolution as the command line reads, for grey, RGB, Group 4 and multi-strip files', async () => {
    const files: [string, Buffer, boolean][] = [
      ['grey-lzw.tif', await grey().tiff({ compression: 'lzw', ...atDpi(600) }).toBuffer(), false],
      ['rgb-deflate.tif', await grey().toColourspace('srgb').tint('#406080').tiff({ compression: 'deflate', ...atDpi(400) }).toBuffer(), false],
      ['office-g4.tif', await grey().toColourspace('b-w').tiff({ compression: 'ccittfax4', bitdepth: 1, ...atDpi(300) }).toBuffer(), true],
    ];
    for (const [name, tiff, bilevel] of files) {
      expect(stripCount(tiff), name).toBeGreaterThan(1);
      const reference = await decodeScanBytes(tiff, name);
      for (const [hostName, host] of Object.entries(hosts)) {
        const decoded = await host.call('decodeScan', { name, base64: tiff.toString('base64') });
        expect({ width: decoded.width, height: decoded.height, format: decoded.format, bilevel: decoded.bilevel }, `${hostName} ${name}`).toEqual({ width: WIDTH, height: HEIGHT, format: 'tiff', bilevel });
        expect(decoded.dpi, `${hostName} ${name}`).toBeCloseTo(reference.dpi!, 6);
        expect((await pngGreys(decoded)).equals(Buffer.from(reference.raster.data)), `${hostName} ${name}`).toBe(true);
      }
    }
    // The Group 4 card is black and white only, the grey band thresholded by libvips.
    const g4 = await hosts.browser.call('decodeScan', { name: 'g4.tif', base64: files[2]![1].toString('base64') });
    expect(new Set(await pngGreys(g4))).toEqual(new Set([0, 255]));
  });

  it('reads the first page of a multi-page file and passes on the note saying so', async () => {
    const black = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#000000' } }).png().toBuffer();
    const white = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#ffffff' } }).png().toBuffer();
    const twoPages = await sharp([black, white], { join: { animated: true } }).toColourspace('b-w').tiff({ compression: 'ccittfax4', bitdepth: 1 }).toBuffer();
    const decoded = await hosts.desktop.call('decodeScan', { name: 'two.tif', base64: twoPages.toString('base64') });
    expect(decoded.notes).toEqual(['two.tif has 2 pages; only the first page was read.']);
    expect(new Set(await pngGreys(decoded))).toEqual(new Set([0]));
  });

  it('refuses a damaged file, a file that is no image and one over the size limit, naming the file and what to do', async () => {
    // libvips writes the strips before the directory: overwriting the start of the LZW data leaves a readable header and codes no decoder can take.
    const tiff = await grey().tiff({ compression: 'lzw' }).toBuffer();
    const damaged = Buffer.from(tiff);
    damaged.fill(0xff, 8, Math.min(damaged.readUInt32LE(4), 3000));
    const cases: [string, Buffer, RegExp][] = [
      ['torn.tif', damaged, /^torn\.tif: the image data is damaged or incomplete .*Export or scan it again\.$/],
      ['notes.tif', Buffer.from('these are my notes, not a scan'), /^notes\.tif: not an image Stemline can read\. Use PNG, JPEG, TIFF or WebP\.$/],
    ];
    for (const [name, bytes, message] of cases) {
      const error = await refusal(hosts.browser.call('decodeScan', { name, base64: bytes.toString('base64') }));
      expect(error.kind, name).toBe('scan-unreadable');
      expect(error.message, name).toMatch(message);
    }
    // Only the base64's length is looked at before refusing: 'A' repeated is a valid base64 spelling of zero bytes.
    const over = 'A'.repeat(4 * Math.ceil(MAX_DECODE_SCAN_FILE_BYTES / 3) + 4);
    const tooLarge = await refusal(hosts.desktop.call('decodeScan', { name: 'huge.tif', base64: over }));
    expect(tooLarge.kind).toBe('scan-unreadable');
    expect(tooLarge.message).toMatch(/^huge\.tif is about 192 MiB; Stemline reads scan files up to 192 MiB\. Save it compressed/);
  });

  it('refuses arguments the intent does not take', async () => {
    for (const args of [{ name: 'a.tif' }, { base64: 'AAAA' }, { name: '', base64: 'AAAA' }, { name: 'a.tif', base64: 'not base64!' }, { name: 'a.tif', base64: 'AAAA', path: '/etc/passwd' }, { name: 'a.tif', base64: '' }]) {
      const error = await refusal(hosts.browser.call('decodeScan', args));
      expect(error.kind, JSON.stringify(args)).toBe('bad-arguments');
    }
  });
});
