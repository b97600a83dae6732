// `stemline build --jobs N`: letters traced and fitted on worker threads give the
// same font, byte for byte, and the same summary as in one thread, and the same font
// as the pipeline traced and fitted in memory (core/pipeline traceSheets). The scans
// are the demo's 600-dpi broad-nib alphabet (70 letters) and a 300-dpi sheet of three
// shapes, so the characters are dealt across two sheets of different resolutions.
// With 2 jobs the second sheet is held, traced and fitted by the worker (its scale set
// by the first sheet, traced here); with 3 the second worker has no sheet of its own
// and fits letters of the first, sent to it as packed jobs.
import { describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCaptured as run } from './run-captured.ts';
import { defaultJobs } from '../../electron/cli/commands/build.ts';
import { DEMO_SHEETS_FOLDER, readDemoManifest } from '../../electron/demo/demo-files.ts';
import { demoSheetPng } from '../support/demo-sheet.ts';
import { decodeScanFile } from '../../electron/io/decode-scan.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { draftFont, traceSheets } from '../../core/pipeline/index.ts';

const folder = mkdtempSync(join(tmpdir(), 'stemline-jobs-'));
/** Characters of the second sheet (a ring, a bar and a chevron), distinct from the demo's. */
const SECOND_SHEET_CHARACTERS = 'øłŵ';
const FAMILY = 'Jobs Test';

async function sheets(): Promise<{ paths: string[]; characters: string }> {
  const manifest = await readDemoManifest();
  const demo = manifest.sheets[0];
  if (!demo) throw new Error('The demo manifest lists no sheet.');
  const second = join(folder, 'second.png');
  writeFileSync(second, await demoSheetPng());
  return { paths: [join(DEMO_SHEETS_FOLDER, demo.png), second], characters: `${demo.characters} ${SECOND_SHEET_CHARACTERS}` };
}

async function build(paths: readonly string[], characters: string, jobs: string, name: string) {
  mkdirSync(join(folder, name), { recursive: true });
  const output = join(folder, name, 'font.otf');
  const result = await run(['build', ...paths, '--chars', characters, '-o', output, '--family', FAMILY, '--jobs', jobs]);
  return { ...result, output };
}

describe('stemline build --jobs', () => {
  it('writes the same font bytes and the same per-glyph lines with 2 and 3 threads as in one thread, and as the pipeline in memory', async () => {
    const { paths, characters } = await sheets();
    const one = await build(paths, characters, '1', 'one');
    const oneBytes = readFileSync(one.output);
    expect(one.code, one.err).toBe(0);
    expect(oneBytes.length).toBeGreaterThan(1000);
    expect(one.out.trim().split('\n')).toHaveLength(73);
    for (const jobs of ['2', '3']) {
      const more = await build(paths, characters, jobs, `jobs-${jobs}`);
      expect(more.code, more.err).toBe(0);
      expect(Buffer.compare(readFileSync(more.output), oneBytes), `--jobs ${jobs}`).toBe(0);
      expect(more.out).toBe(one.out);
      expect(more.err.replace(join(folder, `jobs-${jobs}`), '')).toBe(one.err.replace(join(folder, 'one'), ''));
    }

    const images = [];
    for (const path of paths) {
      const scan = await decodeScanFile(path);
      images.push({ raster: scan.dpi === undefined ? scan.raster : { ...scan.raster, dpi: scan.dpi } });
    }
    const font = draftFont(traceSheets(images, characters, { fit: {}, capHeightUnits: 700 }), { familyName: FAMILY, styleName: 'Regular', unitsPerEm: 1000, capHeight: 700 });
    const inMemory = writeOtf({ ...font, glyphs: font.glyphs.map(({ character, outline, advanceWidth, leftSidebearing }) => ({ character, outline, advanceWidth, leftSidebearing })) });
    expect(Buffer.compare(Buffer.from(inMemory), oneBytes)).toBe(0);
  }, 180_000);

  it('reports a sheet with no ink as in one thread', async () => {
    const blank = join(folder, 'blank.png');
    const sharp = (await import('sharp')).default;
    writeFileSync(blank, await sharp({ create: { width: 200, height: 200, channels: 3, background: '#ffffff' } }).png().toBuffer());
    const { paths } = await sheets();
    const one = await build([blank, paths[1] as string], 'olv', '1', 'blank-one');
    const two = await build([blank, paths[1] as string], 'olv', '2', 'blank-two');
    expect(one.code).toBe(1);
    expect(one.err).toMatch(/^stemline build: No ink found on the page/m);
    expect(two).toMatchObject({ code: one.code, err: one.err, out: one.out });
  });

  it.each(['0', '-1', '1.5', 'many', '', '257'])('refuses --jobs "%s" with one line and exit 2', async (value) => {
    const result = await run(['build', 'sheet.png', '--chars', 'A', '-o', join(folder, 'never.otf'), `--jobs=${value}`]);
    expect(result.code).toBe(2);
    expect(result.out).toBe('');
    expect(result.err).toBe(`stemline build: --jobs takes a whole number of threads from 1 to 256, not "${value}".\n`);
  });

  it('refuses a value taken for an option in one line, with exit 2', async () => {
    const result = await run(['build', 'sheet.png', '--chars', 'A', '-o', join(folder, 'never.otf'), '--jobs', '-1']);
    expect(result.code).toBe(2);
    expect(result.err).toMatch(/^stemline build: Option '--jobs' argument is ambiguous\. .*--jobs=-XYZ'\. See "stemline --help"\.\n$/);
  });

  it.each([
    [1, 16, 1],
    [4, 2, 1],
    [4, 3, 2],
    [8, 4, 2],
    [8, 8, 5],
    [3, 1, 1],
  ])('by default builds %i sheets on %i cores with %i threads (one per sheet, one per 1.5 cores)', (sheets, cores, threads) => {
    expect(defaultJobs(sheets, cores)).toBe(threads);
  });

  it('lists --jobs in --help', async () => {
    expect((await run(['--help'])).out).toMatch(/--jobs N .*the number of cores/);
  });
});
