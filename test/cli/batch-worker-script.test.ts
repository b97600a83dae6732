// The batch worker is found beside the module that starts it: compiled JavaScript in
// the build; from the sources a bundle of them (or, failing that, the sources through
// tsx's API). A worker holds the sheets it traced and fits them to the same letters
// as the calling thread does, and fits single letters sent to it to the same outlines.
import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { batchWorkerScript, unbundledWorkerScript } from '../../electron/batch/worker-script.ts';
import { LocalSheetThread } from '../../electron/batch/sheet-threads.ts';
import { WorkerSheetThread } from '../../electron/batch/worker-sheet-thread.ts';
import { fitLetterJob, planSheetFit } from '../../core/pipeline/index.ts';
import { segmentSheet, traceScan } from '../../core/raster/index.ts';

const sourceModule = new URL('../../electron/batch/worker-script.ts', import.meta.url).href;
const folder = mkdtempSync(join(tmpdir(), 'stemline-worker-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** A ring and a bar, 600 dpi: two letters with a hole, a straight stem and round sides. */
function ringAndBar(): { width: number; height: number; data: Uint8Array } {
  const width = 260;
  const height = 160;
  const data = new Uint8Array(width * height).fill(240);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const r = Math.hypot(x - 70, y - 80);
      if ((r < 55 && r > 30) || (x > 170 && x < 200 && y > 20 && y < 140)) data[y * width + x] = 20;
    }
  }
  return { width, height, data };
}

describe('batch worker script', () => {
  it('is batch-worker.js beside a compiled module, started as it is', async () => {
    const script = await batchWorkerScript('file:///app/build/electron/electron/batch/worker-script.js');
    expect(script.url.href).toBe('file:///app/build/electron/electron/batch/batch-worker.js');
    expect(script.eval).toBeUndefined();
  });

  it('is a bundle of the sources, kept in node_modules/.cache, beside a source module', async () => {
    const script = await batchWorkerScript(sourceModule);
    expect(script.eval).toBeUndefined();
    expect(script.url.pathname).toMatch(/\/node_modules\/\.cache\/stemline-batch-worker\/batch-worker-[0-9a-f]+-[0-9a-f]+\.mjs$/);
    expect(readFileSync(script.url, 'utf8')).toContain('runs as a worker thread of a batch build');
  });

  it('falls back to the sources through tsx when no bundle can be made', async () => {
    const script = await batchWorkerScript(sourceModule, () => Promise.reject(new Error('no esbuild here')));
    expect(script).toEqual(unbundledWorkerScript(sourceModule));
    expect(script.url.pathname.endsWith('/electron/batch/batch-worker.ts')).toBe(true);
    expect(script.eval).toMatch(/tsImport\(".*\/electron\/batch\/batch-worker\.ts"/);
  });

  it('is built by the Electron build, so the compiled command line finds it', () => {
    const config = JSON.parse(readFileSync(new URL('../../electron/tsconfig.json', import.meta.url), 'utf8').replace(/^\s*\/\/.*$/gm, '')) as { files: string[] };
    expect(config.files).toEqual(expect.arrayContaining(['cli/main.ts', 'batch/batch-worker.ts']));
  });

  it.each([
    ['bundled', () => batchWorkerScript(sourceModule)],
    ['through tsx', () => Promise.resolve(unbundledWorkerScript(sourceModule))],
  ])('holds, deals and fits a sheet on a worker thread (%s) to the same letters as in this thread', async (_how, script) => {
    const { width, height, data } = ringAndBar();
    const path = join(folder, 'ring-and-bar.png');
    writeFileSync(path, await sharp(Buffer.from(data), { raw: { width, height, channels: 1 } }).withMetadata({ density: 600 }).png().toBuffer());
    const task = { kind: 'trace', path, dpi: undefined, scan: {} } as const;
    const settings = { fit: {}, capHeightUnits: 700 };
    const here = new LocalSheetThread();
    const worker = new WorkerSheetThread(script());
    try {
      const [local, remote] = await Promise.all([here.trace(0, task), worker.trace(0, task)]);
      expect(remote).toEqual(local);
      expect(local.letterCount).toBe(2);
      expect(await worker.deal(0, 'ol')).toEqual(await here.deal(0, 'ol'));
      let lettersReported = 0;
      const fitted = await worker.fit(0, null, settings, () => lettersReported++);
      expect(fitted).toEqual(await here.fit(0, null, settings, () => {}));
      expect(fitted.letters.map((letter) => letter.character)).toEqual(['o', 'l']);
      expect(lettersReported).toBe(2);
      // The sheet was let go once fitted.
      await expect(worker.deal(0, 'ol')).rejects.toThrow('Sheet 1 is not held by this thread of the build.');
    } finally {
      await worker.close();
    }
  });

  it('fits a single letter sent to a worker to the same outline as in this thread', async () => {
    const traced = traceScan({ raster: { ...ringAndBar(), dpi: 600 } });
    const plan = planSheetFit({ ...traced, sheet: segmentSheet(traced.contours, { characters: 'ol' }) });
    const worker = new WorkerSheetThread(batchWorkerScript(sourceModule));
    try {
      for (const job of plan.jobs) expect(await worker.fitLetter(job)).toEqual(fitLetterJob(job));
    } finally {
      await worker.close();
    }
    expect(plan.jobs).toHaveLength(2);
  });

  it('rejects what was asked of a worker that stopped, in words', async () => {
    const worker = new WorkerSheetThread({ url: new URL('data:text/javascript,process.exit(3)') });
    await expect(worker.trace(0, { kind: 'trace', path: 'never.png', dpi: undefined, scan: {} })).rejects.toThrow(/A batch worker (exited unexpectedly \(exit code 3\)|stopped)/);
    expect(worker.canHelp).toBe(false);
    await worker.close();
  });
});
