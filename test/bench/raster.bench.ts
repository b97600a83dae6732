// Throughput benchmarks of the raster stage on a full page: a synthetic 600-dpi US
// Letter sheet (5100 × 6600 px, 33.7 Mpx) of hand-lettering-like strokes, pushed
// through binarize → cleanup → boundaries, the part whose cost grows with the page
// rather than with the ink. The design target is well under 1.5 s for the three steps
// on one core. This file only registers tasks; the runner (test/bench/run.ts) owns the
// Bench and the reporting.

import { createCanvas } from '@napi-rs/canvas';
import type { Bench, Task } from 'tinybench';
import { binarize, cleanupMask, traceBoundaries, type GreyRaster } from '../../core/raster/index.ts';
import { seededRandom } from '../support/seeded-random.ts';

/** US Letter at 600 dpi: 8.5 in × 11 in. */
export const PAGE_WIDTH = 5100;
export const PAGE_HEIGHT = 6600;
export const PAGE_DPI = 600;

/** Letter cell and stroke sizes at 600 dpi: 12 mm letters (≈ 283 px) with 1.5 mm (≈ 35 px) strokes. */
const LETTER_SIZE = 283;
const STROKE_WIDTH = 35;
const CELL_WIDTH = 330;
const CELL_HEIGHT = 420;
const MARGIN = 300;
/** Sensor noise (grey levels, uniform ±) and dust specks per page, to give cleanup work. */
const NOISE_AMPLITUDE = 12;
const SPECK_COUNT = 400;


/**
 * A page of procedural letters (bowls, stems, arches, dots) drawn anti-aliased by
 * @napi-rs/canvas, with seeded noise and dust specks. About 1.5 s to build.
 */
export function synthesizeLetterSheet(): GreyRaster {
  const canvas = createCanvas(PAGE_WIDTH, PAGE_HEIGHT);
  const context = canvas.getContext('2d');
  context.fillStyle = '#ffffff';
  context.fillRect(0, 0, PAGE_WIDTH, PAGE_HEIGHT);
  context.strokeStyle = '#141414';
  context.fillStyle = '#141414';
  context.lineWidth = STROKE_WIDTH;
  context.lineCap = 'round';
  const random = seededRandom(600);
  const half = LETTER_SIZE / 2;
  let shape = 0;
  for (let top = MARGIN; top + CELL_HEIGHT <= PAGE_HEIGHT - MARGIN; top += CELL_HEIGHT) {
    for (let left = MARGIN; left + CELL_WIDTH <= PAGE_WIDTH - MARGIN; left += CELL_WIDTH) {
      const cx = left + CELL_WIDTH / 2 + (random() - 0.5) * 10;
      const cy = top + CELL_HEIGHT / 2 + (random() - 0.5) * 10;
      context.beginPath();
      switch (shape++ % 5) {
        case 0: // o
          context.arc(cx, cy, half * 0.8, 0, 2 * Math.PI);
          break;
        case 1: // c
          context.arc(cx, cy, half * 0.8, 0.25 * Math.PI, 1.75 * Math.PI);
          break;
        case 2: // n
          context.moveTo(cx - half * 0.7, cy + half);
          context.lineTo(cx - half * 0.7, cy - half * 0.3);
          context.arc(cx, cy - half * 0.3, half * 0.7, Math.PI, 2 * Math.PI);
          context.lineTo(cx + half * 0.7, cy + half);
          break;
        case 3: // l
          context.moveTo(cx, cy - half);
          context.lineTo(cx, cy + half);
          break;
        default: // e
          context.moveTo(cx - half * 0.8, cy);
          context.lineTo(cx + half * 0.8, cy);
          context.arc(cx, cy, half * 0.8, 0, 1.8 * Math.PI, true);
          break;
      }
      context.stroke();
      if (shape % 3 === 0) {
        context.beginPath();
        context.arc(cx + half * 0.9, cy - half * 1.05, STROKE_WIDTH * 0.6, 0, 2 * Math.PI);
        context.fill();
      }
    }
  }
  for (let i = 0; i < SPECK_COUNT; i++) {
    context.beginPath();
    context.arc(random() * PAGE_WIDTH, random() * PAGE_HEIGHT, 0.8 + random() * 1.5, 0, 2 * Math.PI);
    context.fill();
  }
  const rgba = context.getImageData(0, 0, PAGE_WIDTH, PAGE_HEIGHT).data;
  const data = new Uint8Array(PAGE_WIDTH * PAGE_HEIGHT);
  for (let i = 0; i < data.length; i++) {
    const noisy = rgba[i * 4]! + Math.round((random() - 0.5) * 2 * NOISE_AMPLITUDE);
    data[i] = noisy < 0 ? 0 : noisy > 255 ? 255 : noisy;
  }
  return { width: PAGE_WIDTH, height: PAGE_HEIGHT, data, dpi: PAGE_DPI };
}

/** Names of the registered tasks, for the runner and for megapixelsPerSecond. */
export const RASTER_TASKS = {
  binarize: 'raster: binarize (Otsu), 600-dpi Letter page',
  cleanup: 'raster: cleanup (specks + pinholes), 600-dpi Letter page',
  boundaries: 'raster: boundaries (marching squares), 600-dpi Letter page',
  pipeline: 'raster: binarize → cleanup → boundaries, 600-dpi Letter page',
} as const;

/** Pixels processed by one iteration of every registered task. */
export const PAGE_MEGAPIXELS = (PAGE_WIDTH * PAGE_HEIGHT) / 1e6;

/**
 * Registers the raster tasks on `bench`. The page is synthesized lazily, once, by the
 * first task that runs (in its beforeAll hook, outside the timed iterations), and the
 * intermediate results each step needs are prepared there too.
 */
export function rasterBenchmarks(bench: Bench): Bench {
  let page: GreyRaster | undefined;
  let binarized: ReturnType<typeof binarize> | undefined;
  let cleaned: ReturnType<typeof cleanupMask> | undefined;
  const preparePage = (): GreyRaster => (page ??= synthesizeLetterSheet());
  const prepareBinarized = (): ReturnType<typeof binarize> => (binarized ??= binarize(preparePage()));
  const prepareCleaned = (): ReturnType<typeof cleanupMask> => (cleaned ??= cleanupMask(prepareBinarized().mask, { dpi: PAGE_DPI }));

  bench.add(RASTER_TASKS.binarize, () => binarize(preparePage()), { beforeAll: () => void preparePage() });
  bench.add(RASTER_TASKS.cleanup, () => cleanupMask(prepareBinarized().mask, { dpi: PAGE_DPI }), { beforeAll: () => void prepareBinarized() });
  bench.add(
    RASTER_TASKS.boundaries,
    () => {
      const b = prepareBinarized();
      return traceBoundaries(b.grey, prepareCleaned().mask, { method: 'marching-squares', isoField: b.isoField });
    },
    { beforeAll: () => void prepareCleaned() },
  );
  bench.add(
    RASTER_TASKS.pipeline,
    () => {
      const b = binarize(preparePage());
      const c = cleanupMask(b.mask, { dpi: PAGE_DPI });
      return traceBoundaries(b.grey, c.mask, { method: 'marching-squares', isoField: b.isoField });
    },
    { beforeAll: () => void preparePage() },
  );
  return bench;
}

/**
 * Megapixels per second of a completed raster task (page megapixels ÷ mean seconds per
 * iteration), or null when the task has not completed.
 */
export function megapixelsPerSecond(task: Task): number | null {
  const result = task.result;
  if (result.state !== 'completed') return null;
  return PAGE_MEGAPIXELS / (result.period / 1000);
}

/** One line per raster task of `bench`: name, mean time and throughput. */
export function rasterThroughputReport(bench: Bench): string[] {
  const names: readonly string[] = Object.values(RASTER_TASKS);
  return bench.tasks
    .filter((task) => names.includes(task.name))
    .map((task) => {
      const rate = megapixelsPerSecond(task);
      const result = task.result;
      const mean = result.state === 'completed' ? `${result.period.toFixed(0)} ms` : result.state;
      return `${task.name}: ${mean}${rate === null ? '' : `, ${rate.toFixed(1)} Mpx/s`}`;
    });
}
