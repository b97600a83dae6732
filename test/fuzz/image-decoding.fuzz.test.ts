// Fuzzing the scan reader: small copies of the demo sheets in every format Stemline
// reads, mutated (header fields, bytes, cuts), and bytes that only start like an
// image. Every case either decodes to a raster whose size matches its data and is
// traced, or is refused with an InputError (or, for a page with no ink left, a
// RasterError) whose message a person can act on: never another exception, a hang
// or a runaway allocation.
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeScanBytes } from '../../electron/io/decode-scan.ts';
import { InputError } from '../../electron/io/input-error.ts';
import { RasterError, traceScan } from '../../core/raster/index.ts';
import { formatBySignature } from '../../core/raster/image-header.ts';
import { mutatedSample } from './byte-mutation.ts';
import { scanSamples, type Sample } from './fuzz-samples.ts';
import { expectTypedError, fuzzParameters, fuzzSettings, suiteTimeLimitMs, withinLimitsAsync } from './fuzz-settings.ts';

const settings = fuzzSettings('image decoding');

/** Magic numbers of the formats read, for bytes that only start like an image. */
const MAGIC = [
  [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
  [0xff, 0xd8, 0xff],
  [0x49, 0x49, 0x2a, 0x00],
  [0x4d, 0x4d, 0x00, 0x2a],
  [0x52, 0x49, 0x46, 0x46, 0, 0, 0, 0, 0x57, 0x45, 0x42, 0x50],
];

/** Traces what decoded, as the CLI and the page do next: the raster must be one core/ accepts. */
function traceDecoded(raster: { width: number; height: number; data: Uint8Array }, dpi: number | undefined): void {
  expect(raster.data.length).toBe(raster.width * raster.height);
  try {
    traceScan({ raster: dpi === undefined ? raster : { ...raster, dpi } });
  } catch (error) {
    expectTypedError('tracing a decoded scan', error, [RasterError]);
  }
}

describe('fuzzing the scan reader', () => {
  let samples: Sample[] = [];
  beforeAll(async () => {
    samples = await scanSamples();
  });

  it(`every mutated or made-up scan decodes or is refused with a readable InputError (${settings.runs} cases)`, async () => {
    // The samples themselves decode and trace: the mutations start from files that work.
    for (const sample of samples) {
      const scan = await decodeScanBytes(sample.bytes, sample.name);
      expect(scan.raster.width * scan.raster.height, sample.name).toBeGreaterThan(0);
    }
    let decoded = 0;
    const input = fc.oneof(
      { weight: 9, arbitrary: mutatedSample(samples) },
      { weight: 1, arbitrary: fc.record({ name: fc.constant('made-up.img'), bytes: fc.tuple(fc.constantFrom(...MAGIC), fc.uint8Array({ maxLength: 256 })).map(([magic, rest]) => Uint8Array.from([...magic, ...rest])) }) },
    );
    await fc.assert(
      fc.asyncProperty(input, async ({ name, bytes }) => {
        await withinLimitsAsync(`decoding a mutated ${name}`, async () => {
          const scan = await decodeScanBytes(bytes, name).catch((error: unknown) => {
            expectTypedError(`decoding a mutated ${name}`, error, [InputError]);
            expect((error as InputError).message).toContain(name);
            // A file that starts like PNG, JPEG, TIFF or WebP is damaged, never "not an image".
            if (formatBySignature(bytes) !== null) expect((error as InputError).kind).not.toBe('image-unsupported');
            return null;
          });
          if (scan === null) return;
          decoded++;
          traceDecoded(scan.raster, scan.dpi);
        });
      }),
      fuzzParameters(settings),
    );
    console.info(`image decoding: ${decoded} of ${settings.runs} cases decoded and were traced`);
    expect(decoded).toBeGreaterThan(0); // some mutations leave a readable image: the trace step is exercised too
  }, suiteTimeLimitMs(settings.runs, 50));
});
