// A build streams its sheets over its threads with sheet affinity: each sheet is
// traced, dealt and fitted by the one thread it was given to; no thread holds more
// than SHEETS_IN_HAND sheets however many are named; and the fitted sheets are those
// of the pipeline in memory (core/pipeline fitTracedSheets) in the sheets' order,
// whichever thread finished first.
import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { fitSheetFiles, SHEETS_IN_HAND } from '../../electron/batch/fit-sheet-files.ts';
import { LocalSheetThread, type SheetThread } from '../../electron/batch/sheet-threads.ts';
import { fitTracedSheets, traceSheetScan } from '../../core/pipeline/index.ts';

/** A 600-dpi sheet of a ring and a bar (an o and an l), drawn in code; `flat` gives the bar a flat top. */
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
  return { width, height, data, dpi: 600 };
}

const folder = mkdtempSync(join(tmpdir(), 'stemline-sheets-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));
const sheetCount = 12;
const rasters = Array.from({ length: sheetCount }, (_, i) => ringAndBar(80 + i));
const files = await Promise.all(
  rasters.map(async (raster, i) => {
    const path = join(folder, `sheet-${i}.png`);
    writeFileSync(path, await sharp(Buffer.from(raster.data), { raw: { width: raster.width, height: raster.height, channels: 1 } }).withMetadata({ density: 600 }).png().toBuffer());
    return path;
  }),
);
// Two letters a sheet; "I" on `scaleSheet` so that sheet sets the scale for all.
const charactersWithScaleOn = (scaleSheet: number) => files.map((_, i) => (i === scaleSheet ? 'oI' : String.fromCodePoint(0xe000 + 2 * i, 0xe001 + 2 * i))).join(' ');

/**
 * Threads that each really hold their sheets (this thread's code, one object per
 * thread) and answer after a pause of their own, so they finish in a changing order;
 * a record of which thread did what to which sheet, and the most sheets each held.
 */
function recordingThreads(count: number) {
  const log: Array<{ thread: number; step: 'trace' | 'deal' | 'fit' | 'release'; sheet: number }> = [];
  const holding = Array.from({ length: count }, () => new Set<number>());
  const mostHeld = Array.from({ length: count }, () => 0);
  const pause = (thread: number, sheet: number) => new Promise((resolve) => setTimeout(resolve, ((thread * 7 + sheet * 3) % 5) + 1));
  const threads: SheetThread[] = Array.from({ length: count }, (_, thread) => {
    const real = new LocalSheetThread();
    return {
      async trace(sheet, task) {
        log.push({ thread, step: 'trace', sheet });
        holding[thread]?.add(sheet);
        mostHeld[thread] = Math.max(mostHeld[thread] ?? 0, holding[thread]?.size ?? 0);
        await pause(thread, sheet);
        return real.trace(sheet, task);
      },
      async deal(sheet, characters) {
        log.push({ thread, step: 'deal', sheet });
        await pause(thread, sheet);
        return real.deal(sheet, characters);
      },
      async fit(sheet, reference, settings, onLetter) {
        log.push({ thread, step: 'fit', sheet });
        await pause(thread, sheet);
        const fitted = await real.fit(sheet, reference, settings, onLetter);
        holding[thread]?.delete(sheet);
        return fitted;
      },
      release(sheet) {
        log.push({ thread, step: 'release', sheet });
        holding[thread]?.delete(sheet);
        real.release(sheet);
      },
    };
  });
  return { threads, log, mostHeld };
}

function inMemory(characters: string) {
  return fitTracedSheets(rasters.map((raster) => traceSheetScan({ raster })), characters);
}

describe('streaming the sheets of a build over its threads', () => {
  it.each([1, 2, 3])('on %i threads, keeps each sheet on one thread and holds at most SHEETS_IN_HAND on each', async (count) => {
    const { threads, log, mostHeld } = recordingThreads(count);
    let fittedLetters = 0;
    const fitted = await fitSheetFiles(files, charactersWithScaleOn(0), { scan: {}, dpi: undefined, fit: {} }, threads, { onProgress: (p) => (fittedLetters = p.lettersFitted) });
    expect(fitted).toHaveLength(sheetCount);
    expect(fittedLetters).toBe(2 * sheetCount);
    for (let sheet = 0; sheet < sheetCount; sheet++) {
      const steps = log.filter((entry) => entry.sheet === sheet);
      expect(steps.map((entry) => entry.step)).toEqual(['trace', 'deal', 'fit']);
      expect(new Set(steps.map((entry) => entry.thread)).size).toBe(1);
    }
    for (const most of mostHeld) expect(most).toBeLessThanOrEqual(SHEETS_IN_HAND);
    if (count > 1) expect(new Set(log.map((entry) => entry.thread)).size).toBe(count);
  });

  it.each([0, 5])('fits the sheets as the pipeline in memory does, in their order, with the scale set by sheet %i', async (scaleSheet) => {
    const characters = charactersWithScaleOn(scaleSheet);
    const fitted = await fitSheetFiles(files, characters, { scan: {}, dpi: undefined, fit: {} }, recordingThreads(3).threads);
    const reference = inMemory(characters);
    expect(fitted.map((s) => s.letters.map((l) => [l.character, l.outline]))).toEqual(reference.map((s) => s.letters.map((l) => [l.character, l.outline])));
    expect(fitted.map((s) => s.unitsPerPixel)).toEqual(reference.map((s) => s.unitsPerPixel));
    expect(fitted.map((s) => s.notes)).toEqual(reference.map((s) => s.notes));
  });

  it('scales each sheet by its own letter height when no sheet shows flat-topped capitals, as the pipeline in memory does', async () => {
    const characters = files.map((_, i) => String.fromCodePoint(0xe000 + 2 * i, 0xe001 + 2 * i)).join('');
    const fitted = await fitSheetFiles(files, characters, { scan: {}, dpi: undefined, fit: {} }, recordingThreads(2).threads);
    expect(fitted.map((s) => s.unitsPerPixel)).toEqual(inMemory(characters).map((s) => s.unitsPerPixel));
    // …which is not the scale the flat-topped bar gives when it is called I.
    expect(fitted[0]?.unitsPerPixel).not.toBe(inMemory(charactersWithScaleOn(0))[0]?.unitsPerPixel);
  });

  it('names both counts when the characters run out, as the pipeline in memory does, and lets the uncounted sheets go', async () => {
    const short = charactersWithScaleOn(0).slice(0, -2);
    const inMemoryError = (() => {
      try {
        inMemory(short);
        return null;
      } catch (error) {
        return error as Error;
      }
    })();
    expect(inMemoryError?.message).toMatch(/sheets show 24 letters .* but 22 characters were given/);
    const { threads, log } = recordingThreads(2);
    await expect(fitSheetFiles(files, short, { scan: {}, dpi: undefined, fit: {} }, threads)).rejects.toThrow(inMemoryError?.message ?? 'never');
    expect(log.filter((entry) => entry.step === 'release').map((entry) => entry.sheet)).toEqual([sheetCount - 1]);
  });

  it('reports a file that will not decode, after the sheets before it', async () => {
    const broken = join(folder, 'broken.png');
    writeFileSync(broken, 'not an image');
    const notes: number[] = [];
    await expect(fitSheetFiles([files[0] as string, broken, files[1] as string], 'oI xy zw', { scan: {}, dpi: undefined, fit: {} }, recordingThreads(2).threads, { onDecodeNotes: (sheet) => notes.push(sheet) })).rejects.toThrow(/broken\.png/);
    expect(notes).toEqual([0]);
  });
});
