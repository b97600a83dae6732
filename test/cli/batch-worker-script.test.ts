// The batch worker is found beside the module that starts it, as compiled JavaScript
// in the build and as TypeScript (through tsx's API) from the sources, and it answers
// from the sources exactly as the calling thread does.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { batchWorkerScript } from '../../electron/batch/worker-script.ts';
import { poolRunner, inlineRunner } from '../../electron/batch/batch-runner.ts';
import { planSheetFit } from '../../core/pipeline/index.ts';
import { segmentSheet, traceScan } from '../../core/raster/index.ts';

describe('batch worker script', () => {
  it('is batch-worker.js beside a compiled module, started as it is', () => {
    const script = batchWorkerScript('file:///app/build/electron/electron/batch/worker-script.js');
    expect(script.url.href).toBe('file:///app/build/electron/electron/batch/batch-worker.js');
    expect(script.eval).toBeUndefined();
  });

  it('is batch-worker.ts beside a source module, imported through tsx', () => {
    const script = batchWorkerScript(new URL('../../electron/batch/worker-script.ts', import.meta.url).href);
    expect(script.url.pathname.endsWith('/electron/batch/batch-worker.ts')).toBe(true);
    expect(script.eval).toMatch(/tsImport\(".*\/electron\/batch\/batch-worker\.ts"/);
  });

  it('is built by the Electron build, so the compiled command line finds it', () => {
    const config = JSON.parse(readFileSync(new URL('../../electron/tsconfig.json', import.meta.url), 'utf8').replace(/^\s*\/\/.*$/gm, '')) as { files: string[] };
    expect(config.files).toEqual(expect.arrayContaining(['cli/main.ts', 'batch/batch-worker.ts']));
  });

  it('fits a letter on a worker thread to the same outline as in this thread', async () => {
    // A ring and a bar, 600 dpi: two letters with a hole, a straight stem and round sides.
    const width = 260;
    const height = 160;
    const data = new Uint8Array(width * height).fill(240);
    for (let y = 0; y < height; y++) {
      for (let x = 0; x < width; x++) {
        const r = Math.hypot(x - 70, y - 80);
        if ((r < 55 && r > 30) || (x > 170 && x < 200 && y > 20 && y < 140)) data[y * width + x] = 20;
      }
    }
    const traced = traceScan({ raster: { width, height, data, dpi: 600 } });
    const plan = planSheetFit({ ...traced, sheet: segmentSheet(traced.contours, { characters: 'ol' }) });
    const pool = poolRunner(1);
    try {
      for (const job of plan.jobs) {
        expect(await pool.run({ kind: 'fit', job })).toEqual(await inlineRunner().run({ kind: 'fit', job }));
      }
    } finally {
      await pool.close();
    }
    expect(plan.jobs).toHaveLength(2);
  });
});
