// The whole job on one core, from scan to font file: a 600-dpi sheet of the 62
// letters A–Z a–z 0–9 drawn with the demo's broad nib (electron/demo, its seed),
// taken from PNG bytes through decode → threshold → cleanup → boundaries → letters
// → fit → font bytes, as `stemline build` does it. Goal: at most 2 s in all. Prints
// the median total and the median of each stage.
import sharp from 'sharp';
import { renderDemoSheet } from '../../electron/demo/demo-sheet.ts';
import { sheetPng } from '../../electron/demo/generate-demo-sheets.ts';
import { DEMO_SHEETS } from '../../electron/demo/demo-scenario.ts';
import { decodeScanBytes } from '../../electron/io/decode-scan.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { draftFont, fitTracedSheets, traceSheetScan } from '../../core/pipeline/index.ts';
import type { TraceStage } from '../../core/raster/index.ts';
import { measured, type MeasuredTask } from './timing-summary.ts';

/** The rows of the sheet: the 62 letters and figures, as the demo sheet lays them out without its punctuation. */
export const PIPELINE_ROWS = ['ABCDEFGHIJKLM', 'NOPQRSTUVWXYZ', 'abcdefghijklm', 'nopqrstuvwxyz', '0123456789'] as const;
/** Goal for the whole job on one core, milliseconds. */
const PIPELINE_GOAL_MS = 2000;
/** Untimed runs first, so the JIT has compiled the hot paths. */
const WARMUP_RUNS = 2;
/** Timed runs: each takes about two seconds, and the median of this many is stable on a shared machine. */
const TIMED_RUNS = 8;

/** The stages in the order the job runs them. */
const STAGES = ['decode', 'threshold', 'cleanup', 'boundaries', 'letters', 'fit', 'font'] as const;
type Stage = (typeof STAGES)[number];

/** Which pipeline stage each step of traceScan belongs to (nesting, edge blur and segmentation find the letters). */
const TRACE_STEP_STAGE: Readonly<Record<Exclude<TraceStage, 'done'>, Stage>> = {
  binarize: 'threshold',
  cleanup: 'cleanup',
  boundaries: 'boundaries',
  nesting: 'letters',
  segmentation: 'letters',
};

let sheetBytes: Promise<Uint8Array> | undefined;

/** The 62-letter sheet as PNG bytes, drawn once per process (about 2 s). */
export function pipelineSheetPng(): Promise<Uint8Array> {
  const seed = DEMO_SHEETS[0]?.seed ?? 0;
  sheetBytes ??= sheetPng(renderDemoSheet({ name: 'sixty-two-letters', rows: PIPELINE_ROWS, seed }));
  return sheetBytes;
}

/** One run of the whole job; returns the font's bytes and the milliseconds spent in each stage. */
export async function runPipeline(png: Uint8Array): Promise<{ font: Uint8Array; stageMs: Record<Stage, number>; glyphs: number }> {
  const stageMs = Object.fromEntries(STAGES.map((s) => [s, 0])) as Record<Stage, number>;
  let current: Stage = 'decode';
  let since = performance.now();
  const enter = (stage: Stage): void => {
    const now = performance.now();
    stageMs[current] += now - since;
    current = stage;
    since = now;
  };
  const scan = await decodeScanBytes(png, 'sheet.png');
  enter('threshold');
  const traced = traceSheetScan({ raster: { ...scan.raster, dpi: scan.dpi ?? 0 } }, {
    onProgress: (_fraction, step) => {
      if (step !== 'done') enter(TRACE_STEP_STAGE[step]);
    },
  });
  enter('fit');
  const sheets = fitTracedSheets([traced], PIPELINE_ROWS.join(' '));
  enter('font');
  const font = draftFont(sheets, { familyName: 'Pipeline Bench', styleName: 'Regular', unitsPerEm: 1000, capHeight: 700 });
  const bytes = writeOtf({ ...font, glyphs: font.glyphs.map(({ character, outline, advanceWidth, leftSidebearing }) => ({ character, outline, advanceWidth, leftSidebearing })) });
  enter('font');
  return { font: bytes, stageMs, glyphs: font.glyphs.length };
}

/** Runs the job warmed up and repeated; the total and each stage as tasks of the report, and the lines to print. */
export async function measurePipeline(): Promise<{ lines: string[]; tasks: MeasuredTask[] }> {
  // One libvips worker thread: the goal is stated for one core.
  sharp.concurrency(1);
  const png = await pipelineSheetPng();
  for (let i = 0; i < WARMUP_RUNS; i++) await runPipeline(png);
  const totals: number[] = [];
  const perStage = new Map<Stage, number[]>(STAGES.map((s) => [s, []]));
  let glyphs = 0;
  for (let i = 0; i < TIMED_RUNS; i++) {
    const start = performance.now();
    const run = await runPipeline(png);
    totals.push(performance.now() - start);
    glyphs = run.glyphs;
    for (const stage of STAGES) perStage.get(stage)?.push(run.stageMs[stage]);
  }
  const total = measured(`pipeline: ${glyphs}-letter 600-dpi sheet, PNG → OTF bytes, one core`, totals);
  const stages = STAGES.map((stage) => measured(`pipeline stage: ${stage}`, perStage.get(stage) ?? []));
  const split = stages.map((s, i) => `${STAGES[i]} ${s.medianMs.toFixed(0)}`).join(', ');
  return {
    tasks: [total, ...stages],
    lines: [
      `pipeline total: median ${total.medianMs.toFixed(0)} ms ± ${total.madMs.toFixed(0)} (MAD) for ${glyphs} glyphs (goal ≤ ${PIPELINE_GOAL_MS} ms)`,
      `pipeline split (medians, ms): ${split}`,
    ],
  };
}
