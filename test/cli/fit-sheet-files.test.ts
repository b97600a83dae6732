// A build streams its sheets: with N threads, no more than N + 1 sheets are being
// decoded and traced at once however many sheets are named, letters are handed out
// only when the runner has room, and the fitted sheets are those of the pipeline in
// memory (core/pipeline fitTracedSheets) in the sheets' order.
import { describe, expect, it } from 'vitest';
import { fitSheetFiles } from '../../electron/batch/fit-sheet-files.ts';
import type { BatchRunner } from '../../electron/batch/batch-runner.ts';
import type { BatchTask, BatchTaskResult, TracedSheetFile } from '../../electron/batch/batch-tasks.ts';
import { fitLetterJob, fitTracedSheets, traceSheetScan } from '../../core/pipeline/index.ts';

/** A 600-dpi sheet of a ring and a bar (an o and an l), drawn in code. */
function ringAndBar(barHeight: number) {
  const width = 260;
  const height = 170;
  const data = new Uint8Array(width * height).fill(240);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const r = Math.hypot(x - 70, y - 90);
      if ((r < 55 && r > 30) || (x > 170 && x < 200 && y > 145 - barHeight && y < 145)) data[y * width + x] = 20;
    }
  }
  return traceSheetScan({ raster: { width, height, data, dpi: 600 } });
}

/**
 * A runner that traces by looking the sheet up (no files) and lets the test decide
 * when traces finish: it records how many were running at once and how many fits
 * were handed out while it said it had no room.
 */
function recordingRunner(parallelism: number, sheets: ReadonlyMap<string, ReturnType<typeof ringAndBar>>) {
  const stats = { tracesRunning: 0, mostTracesRunning: 0, fitsGiven: 0, fitsGivenWithoutRoom: 0 };
  let roomFree = true;
  const runner: BatchRunner = {
    parallelism,
    async run<T extends BatchTask>(task: T): Promise<BatchTaskResult<T>> {
      if (task.kind === 'fit') {
        stats.fitsGiven++;
        if (!roomFree) stats.fitsGivenWithoutRoom++;
        return fitLetterJob(task.job) as BatchTaskResult<T>;
      }
      stats.tracesRunning++;
      stats.mostTracesRunning = Math.max(stats.mostTracesRunning, stats.tracesRunning);
      await new Promise((resolve) => setTimeout(resolve, 5));
      stats.tracesRunning--;
      const traced = sheets.get(task.path);
      if (!traced) throw new Error(`no sheet ${task.path}`);
      const result: TracedSheetFile = { decodeNotes: [], scan: traced, traceError: null };
      return result as BatchTaskResult<T>;
    },
    runHere(task) {
      return this.run(task);
    },
    async room() {
      // Room only every other time, after a pause: the build must wait for it.
      roomFree = false;
      await new Promise((resolve) => setTimeout(resolve, 1));
      roomFree = true;
    },
    close: () => Promise.resolve(),
  };
  return { runner, stats };
}

describe('streaming the sheets of a build', () => {
  const sheetCount = 12;
  const sheets = new Map(Array.from({ length: sheetCount }, (_, i) => [`sheet-${i}.png`, ringAndBar(80 + i)] as const));
  const files = [...sheets.keys()];
  // Two letters a sheet; "I" on the first so it sets the scale for all.
  const characters = files.map((_, i) => (i === 0 ? 'oI' : String.fromCodePoint(0xe000 + 2 * i, 0xe001 + 2 * i))).join(' ');

  it.each([1, 2, 4])('traces at most %i + 1 sheets at once and waits for room before each letter', async (parallelism) => {
    const { runner, stats } = recordingRunner(parallelism, sheets);
    const fitted = await fitSheetFiles(files, characters, { scan: {}, dpi: undefined, fit: {} }, runner);
    expect(stats.mostTracesRunning).toBeGreaterThanOrEqual(1);
    expect(stats.mostTracesRunning).toBeLessThanOrEqual(parallelism + 1);
    expect(stats.fitsGiven).toBe(2 * sheetCount);
    expect(stats.fitsGivenWithoutRoom).toBe(0);
    expect(fitted).toHaveLength(sheetCount);
  });

  it('fits the sheets as the pipeline in memory does, in their order', async () => {
    const fitted = await fitSheetFiles(files, characters, { scan: {}, dpi: undefined, fit: {} }, recordingRunner(3, sheets).runner);
    const reference = fitTracedSheets([...sheets.values()], characters);
    expect(fitted.map((s) => s.letters.map((l) => [l.character, l.outline]))).toEqual(reference.map((s) => s.letters.map((l) => [l.character, l.outline])));
    expect(fitted.map((s) => s.unitsPerPixel)).toEqual(reference.map((s) => s.unitsPerPixel));
    expect(fitted.map((s) => s.notes)).toEqual(reference.map((s) => s.notes));
  });

  it('names both counts when the characters run out, as the pipeline in memory does', async () => {
    const short = characters.slice(0, -2);
    const inMemory = (() => {
      try {
        fitTracedSheets([...sheets.values()], short);
        return null;
      } catch (error) {
        return error as Error;
      }
    })();
    expect(inMemory?.message).toMatch(/sheets show 24 letters .* but 22 characters were given/);
    await expect(fitSheetFiles(files, short, { scan: {}, dpi: undefined, fit: {} }, recordingRunner(1, sheets).runner)).rejects.toThrow(inMemory?.message ?? 'never');
  });
});
