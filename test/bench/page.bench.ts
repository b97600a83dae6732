// The whole scan stage as a user meets it: a 600-dpi US Letter page (5100 × 6600 px)
// read from a PNG file's bytes and traced — decode → threshold → cleanup → boundaries
// → nesting → letters. Goal: under 1.5 s on one core. Also reports how the time
// splits across the steps and the megapixels per second.
import sharp from 'sharp';
import type { Bench, Task } from 'tinybench';
import { decodeScanBytes } from '../../electron/io/decode-scan.ts';
import { traceScan, type TraceStage } from '../../core/raster/index.ts';
import { PAGE_DPI, PAGE_MEGAPIXELS, synthesizeLetterSheet } from './raster.bench.ts';

export const PAGE_TASK = 'page: decode PNG → traced letters, 600-dpi Letter page';

let pagePng: Uint8Array | undefined;

async function preparePagePng(): Promise<Uint8Array> {
  if (pagePng) return pagePng;
  const page = synthesizeLetterSheet();
  pagePng = await sharp(Buffer.from(page.data.buffer, page.data.byteOffset, page.data.byteLength), {
    raw: { width: page.width, height: page.height, channels: 1 },
  })
    .png({ compressionLevel: 6 })
    .withMetadata({ density: PAGE_DPI })
    .toBuffer();
  return pagePng;
}

async function decodeAndTrace(bytes: Uint8Array, onStage?: (stage: TraceStage | 'decode') => void) {
  onStage?.('decode');
  const scan = await decodeScanBytes(bytes, 'page.png');
  return traceScan({ raster: { ...scan.raster, dpi: scan.dpi ?? PAGE_DPI } }, onStage ? { onProgress: (_f, stage) => onStage(stage) } : {});
}

export function pageBenchmarks(bench: Bench): void {
  // One libvips worker thread: the goal is stated for one core.
  sharp.concurrency(1);
  bench.add(PAGE_TASK, async () => {
    await decodeAndTrace(pagePng ?? (await preparePagePng()));
  }, { beforeAll: async () => void (await preparePagePng()) });
}

/** Report lines: throughput, and one timed run split by step. */
export async function pageReport(bench: Bench): Promise<string[]> {
  const task: Task | undefined = bench.tasks.find((t) => t.name === PAGE_TASK);
  const lines: string[] = [];
  if (task?.result.state === 'completed') {
    lines.push(`page throughput: ${(PAGE_MEGAPIXELS / (task.result.latency.p50 / 1000)).toFixed(1)} Mpx/s (median ${task.result.latency.p50.toFixed(0)} ms for ${PAGE_MEGAPIXELS.toFixed(1)} Mpx; goal < 1500 ms)`);
  }
  const marks: Array<{ stage: string; at: number }> = [];
  const result = await decodeAndTrace(await preparePagePng(), (stage) => marks.push({ stage, at: performance.now() }));
  const split = marks.slice(0, -1).map((mark, i) => `${mark.stage} ${((marks[i + 1]?.at ?? mark.at) - mark.at).toFixed(0)} ms`);
  lines.push(`page split (one run): ${split.join(', ')}; ${result.sheet.letters.length} letters, ${result.contours.length} contours`);
  return lines;
}
