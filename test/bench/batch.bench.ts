// Batch builds through the command line, each in a fresh process (build-child.ts) as
// a user runs it:
//  - the speed-up of `stemline build --jobs 2` over `--jobs 1`, on one 62-letter
//    600-dpi sheet and on four of them (248 letters), measured alternately and more
//    than once because the machine is shared; goal ≥ 1.8× on 2 cores. Other sheet
//    counts and more runs: STEMLINE_BENCH_JOBS_SHEETS=1,4,8 STEMLINE_BENCH_JOBS_RUNS=5;
//  - a 10,000-glyph font from 100 synthetic 300-dpi sheets of 100 shapes each (rings,
//    bars, chevrons; hundred-letter-sheet.ts with one seed per sheet) mapped to
//    private-use code points: its time, and its peak resident memory with the
//    resident memory as the sheets go by, which stays flat when the build streams.
import { spawnSync } from 'node:child_process';
import { Worker } from 'node:worker_threads';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { renderDemoSheet } from '../../electron/demo/demo-sheet.ts';
import { sheetPng } from '../../electron/demo/generate-demo-sheets.ts';
import { DEMO_SHEETS } from '../../electron/demo/demo-scenario.ts';
import { PIPELINE_ROWS, pipelineSheetPng } from './pipeline.bench.ts';
import { hundredLetterSheetPng, SHEET_LETTER_COUNT } from './hundred-letter-sheet.ts';
import { measured, type MeasuredTask } from './timing-summary.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
const tsx = join(root, 'node_modules', '.bin', 'tsx');
const child = fileURLToPath(new URL('./build-child.ts', import.meta.url));

/** Builds timed per setting by default: alternated 1, 2, 1, 2…, so a burst of load on the shared machine hits both. */
const DEFAULT_SPEED_UP_RUNS = 3;
/** Goal for --jobs 2 over --jobs 1 on 2 cores. */
const SPEED_UP_GOAL = 1.8;
/** Sheet counts of the speed-up cases by default: one sheet, and the 62-letter sheet drawn by four hands (seeds). */
const DEFAULT_SPEED_UP_SHEETS = [1, 4];
/** Most sheets a speed-up case may ask for (one seed each; each adds about a second per build). */
const MAX_SPEED_UP_SHEETS = 32;
/** Glyphs of the synthetic batch. */
const BATCH_GLYPHS = 10_000;
/** First private-use code point of the batch: Supplementary Private Use Area-A (Unicode, U+F0000–U+FFFFD), room for every glyph. */
const BATCH_FIRST_CODE_POINT = 0xf0000;
/**
 * Which letter of the batch's first sheet is called "I": a bar (every third shape
 * from the second is one), flat-topped, so the first sheet sets the drawing scale
 * and every sheet can be fitted as soon as it is traced.
 */
const SCALE_LETTER_INDEX = 1;

interface ChildResult {
  code: number;
  ms: number;
  /** CPU time of every thread of the build, ms. */
  cpuMs: number;
  /** CPU time of the build's main thread, ms (null where it cannot be read). */
  mainCpuMs: number | null;
  /** CPU time of the image decoder's threads, ms (null where it cannot be read). */
  decoderCpuMs: number | null;
  /** CPU time of every other thread (workers, V8's background compiler and collector, libuv's pool), ms (null where it cannot be read). */
  otherThreadsCpuMs: number | null;
  glyphLines: number;
  maxRssMiB: number;
  rssAfterSheetMiB: number[];
  err: string;
}

/**
 * Runs `stemline build ARGS` in a fresh process started with `nodeFlags`, and returns
 * what build-child.ts reports, with the lines the process printed before its report
 * (V8's traces, when a flag asks for them).
 */
function runBuild(args: readonly string[], nodeFlags: readonly string[] = []): ChildResult & { printed: string[] } {
  const run = spawnSync(tsx, [...nodeFlags, child, 'build', ...args], { cwd: root, encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  const printed = run.stdout.trim().split('\n');
  // V8's traces go straight to the same output and may follow the report, as V8 goes on compiling while the process ends.
  const at = printed.findLastIndex((printedLine) => printedLine.startsWith('{"code":'));
  const line = at < 0 ? '' : (printed.splice(at, 1)[0] ?? '');
  if (run.status !== 0 || !line.startsWith('{')) throw new Error(`The benchmark build did not run (exit ${run.status}): ${run.stderr.slice(-2000)}`);
  const result = JSON.parse(line) as ChildResult;
  if (result.code !== 0) throw new Error(`The benchmark build failed (exit ${result.code}): ${result.err}`);
  return { ...result, printed };
}

/**
 * V8's optimizing compilations in `--trace-opt` output: how many, and of how many
 * distinct functions (a function optimized again after a deoptimization, or after
 * the collector dropped optimized code that only a short-lived closure or an
 * on-stack replacement held, counts each time).
 */
function optimizingCompilations(printed: readonly string[]): { compilations: number; distinct: number } {
  const functions = new Set<string>();
  let compilations = 0;
  for (const line of printed) {
    // "[completed compiling 0x… <JSFunction name (sfi = 0x…)> (target TURBOFAN) [OSR] - took …" (V8 11, Node 20).
    const match = /^\[completed compiling \S+ <JSFunction [^>]*\(sfi = (0x[0-9a-f]+)\)> \(target \w+\)( OSR)?/.exec(line);
    if (!match) continue;
    compilations++;
    functions.add(`${match[1]}${match[2] ?? ''}`);
  }
  return { compilations, distinct: functions.size };
}

/** The characters of sheet `sheet` of the multi-sheet case: the first sheet's own letters, private-use ones on the others. */
function multiSheetCharacters(sheet: number): string {
  const letters = PIPELINE_ROWS.join('');
  if (sheet === 0) return PIPELINE_ROWS.join(' ');
  return Array.from({ length: letters.length }, (_, i) => String.fromCodePoint(BATCH_FIRST_CODE_POINT + (sheet - 1) * letters.length + i)).join('');
}

/** Iterations of the arithmetic loop of the parallelism probe: about a second on one core of this machine. */
const PROBE_ITERATIONS = 4e8;

/** Milliseconds for `threads` worker threads each running the probe loop at once. */
async function probe(threads: number): Promise<number> {
  const code = `let x = 0; for (let i = 0; i < ${PROBE_ITERATIONS}; i++) x += i % 7; require('node:worker_threads').parentPort.postMessage(x);`;
  const start = performance.now();
  await Promise.all(Array.from({ length: threads }, () => new Promise((resolve, reject) => new Worker(code, { eval: true }).once('message', resolve).once('error', reject))));
  return performance.now() - start;
}

/**
 * How much faster two threads of pure arithmetic get through twice the work of one,
 * on this machine as loaded now: the ceiling for any two-thread speed-up measured
 * beside it (2× on two idle cores, less when others are using them).
 */
async function twoThreadCeiling(): Promise<number> {
  const one = await probe(1);
  const two = await probe(2);
  return (2 * one) / two;
}

/** A whole number from the environment variable `name` within 1…max, or `fallback` when unset. */
function countsFromEnvironment(name: string, fallback: readonly number[], max: number): number[] {
  const value = process.env[name];
  if (value === undefined || value.trim() === '') return [...fallback];
  const counts = value.split(',').map((part) => Number(part.trim()));
  if (counts.some((count) => !Number.isInteger(count) || count < 1 || count > max)) throw new Error(`${name} takes whole numbers from 1 to ${max}, separated by commas, not "${value}".`);
  return counts;
}

/** Milliseconds as seconds for the printed lines, two decimals ("NaN" where a figure could not be read). */
function seconds(ms: number | null): string {
  return ((ms ?? Number.NaN) / 1000).toFixed(2);
}

/** --jobs 1 and --jobs 2 alternately on the sheets; the medians, their ratio and the tasks for the report. */
function speedUp(label: string, sheets: readonly string[], characters: string, folder: string, runs: number): { lines: string[]; tasks: MeasuredTask[] } {
  const results = new Map<number, ChildResult[]>([[1, []], [2, []]]);
  for (let run = 0; run < runs; run++) {
    for (const jobs of [1, 2]) {
      results.get(jobs)?.push(runBuild([...sheets, '--chars', characters, '-o', join(folder, `speed-${jobs}.otf`), '--family', 'Speed', '--jobs', String(jobs)]));
    }
  }
  const of = (jobs: number, pick: (result: ChildResult) => number) => (results.get(jobs) ?? []).map(pick);
  const cpu = (jobs: number) => {
    const all = measured('cpu', of(jobs, (r) => r.cpuMs)).medianMs;
    const main = measured('main', of(jobs, (r) => r.mainCpuMs ?? Number.NaN)).medianMs;
    return Number.isNaN(main) ? `${seconds(all)} s` : `${seconds(all)} s (main thread ${seconds(main)} s)`;
  };
  const one = measured(`build --jobs 1: ${label}`, of(1, (r) => r.ms));
  const two = measured(`build --jobs 2: ${label}`, of(2, (r) => r.ms));
  const ratio = one.medianMs / two.medianMs;
  const list = (jobs: number) => of(jobs, (r) => r.ms).map(seconds).join(', ');
  return {
    tasks: [one, two],
    lines: [speedUpLine(), oneThreadLine(label, sheets, characters, folder, results.get(1) ?? [])],
  };
  function speedUpLine(): string {
    return `build speed-up with 2 jobs: ${ratio.toFixed(2)}× on ${label} (median ${seconds(one.medianMs)} s ± ${seconds(one.madMs)} → ${seconds(two.medianMs)} s ± ${seconds(two.madMs)} (MAD); runs ${list(1)} s and ${list(2)} s; CPU time of all threads, median ${cpu(1)} → ${cpu(2)}; goal ≥ ${SPEED_UP_GOAL}× on 2 cores; this machine has ${availableParallelism()})`;
  }
}

/**
 * What one build thread costs besides itself, from the `--jobs 1` runs: the CPU time
 * of its own thread, of the image decoder's threads and of V8's background threads,
 * the cores it keeps busy and so the most 2 cores can give; then two more builds, one
 * started with V8's concurrent recompilation off (its optimizing compiler then runs on
 * the build thread, so what leaves the background threads is the compiler's share) and
 * one with `--trace-opt`, to count its optimizing compilations.
 */
function oneThreadLine(label: string, sheets: readonly string[], characters: string, folder: string, runs: readonly ChildResult[]): string {
  const args = [...sheets, '--chars', characters, '-o', join(folder, 'speed-v8.otf'), '--family', 'Speed', '--jobs', '1'];
  const median = (pick: (result: ChildResult) => number | null) => measured('cpu', runs.map((r) => pick(r) ?? Number.NaN)).medianMs;
  const [wall, main, decoder, other] = [median((r) => r.ms), median((r) => r.mainCpuMs), median((r) => r.decoderCpuMs), median((r) => r.otherThreadsCpuMs)];
  if ([main, decoder, other].some(Number.isNaN)) return `one build thread on ${label}: the CPU time of single threads cannot be read here (Linux's /proc is needed)`;
  const busy = (main + decoder + other) / wall;
  const inline = runBuild(args, ['--no-concurrent-recompilation']);
  const traced = optimizingCompilations(runBuild(args, ['--trace-opt']).printed);
  return (
    `one build thread (--jobs 1) on ${label}, median CPU time: its own thread ${seconds(main)} s, the image decoder's ${seconds(decoder)} s, V8's background threads ${seconds(other)} s; ` +
    `it keeps ${busy.toFixed(2)} cores busy, so 2 cores can give at most ${(2 / busy).toFixed(2)}×. ` +
    `Started with node --no-concurrent-recompilation, the background threads use ${seconds(inline.otherThreadsCpuMs)} s and its own thread ${seconds(inline.mainCpuMs)} s: that share is V8's optimizing compiler. ` +
    `It optimizes ${traced.compilations} times, ${traced.distinct} distinct functions (node --trace-opt)`
  );
}

/** The speed-up of --jobs 2 over --jobs 1, on one sheet and on four (or the counts asked for). */
export async function measureJobsSpeedUp(): Promise<{ lines: string[]; tasks: MeasuredTask[] }> {
  const counts = countsFromEnvironment('STEMLINE_BENCH_JOBS_SHEETS', DEFAULT_SPEED_UP_SHEETS, MAX_SPEED_UP_SHEETS);
  const [runs = DEFAULT_SPEED_UP_RUNS] = countsFromEnvironment('STEMLINE_BENCH_JOBS_RUNS', [DEFAULT_SPEED_UP_RUNS], 100);
  const folder = mkdtempSync(join(tmpdir(), 'stemline-bench-jobs-'));
  try {
    const first = join(folder, 'sheet-1.png');
    writeFileSync(first, await pipelineSheetPng());
    const sheets = [first];
    for (let i = 1; i < Math.max(...counts); i++) {
      const path = join(folder, `sheet-${i + 1}.png`);
      writeFileSync(path, await sheetPng(renderDemoSheet({ name: `sheet-${i + 1}`, rows: PIPELINE_ROWS, seed: (DEMO_SHEETS[0]?.seed ?? 0) + i })));
      sheets.push(path);
    }
    const letters = PIPELINE_ROWS.join('').length;
    const before = await twoThreadCeiling();
    const cases = counts.map((count) => {
      const label = count === 1 ? `one ${letters}-letter 600-dpi sheet` : `${count} such sheets (${count * letters} letters)`;
      const named = sheets.slice(0, count);
      return speedUp(label, named, named.map((_, i) => multiSheetCharacters(i)).join(' '), folder, runs);
    });
    const after = await twoThreadCeiling();
    const ceiling = `two threads of plain arithmetic on this machine meanwhile: ${before.toFixed(2)}× before, ${after.toFixed(2)}× after (the ceiling while others share the cores)`;
    return { lines: [...cases.flatMap((c) => c.lines), ceiling], tasks: cases.flatMap((c) => c.tasks) };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

/** The 10,000-glyph batch: time, peak resident memory and resident memory along the sheets. */
export async function measureTenThousandGlyphs(): Promise<{ lines: string[]; tasks: MeasuredTask[] }> {
  const folder = mkdtempSync(join(tmpdir(), 'stemline-bench-batch-'));
  try {
    const sheetCount = Math.ceil(BATCH_GLYPHS / SHEET_LETTER_COUNT);
    const sheets: string[] = [];
    mkdirSync(join(folder, 'sheets'));
    for (let i = 0; i < sheetCount; i++) {
      const path = join(folder, 'sheets', `sheet-${String(i + 1).padStart(3, '0')}.png`);
      writeFileSync(path, await hundredLetterSheetPng(i + 1));
      sheets.push(path);
    }
    const characters = Array.from({ length: BATCH_GLYPHS }, (_, i) => (i === SCALE_LETTER_INDEX ? 'I' : String.fromCodePoint(BATCH_FIRST_CODE_POINT + i))).join('');
    const jobs = availableParallelism();
    const result = runBuild([...sheets, '--chars', characters, '-o', join(folder, 'ten-thousand.otf'), '--family', 'Ten Thousand', '--jobs', String(jobs)]);
    if (result.glyphLines !== BATCH_GLYPHS) throw new Error(`The batch build printed ${result.glyphLines} glyph lines, not ${BATCH_GLYPHS}.`);
    const along = result.rssAfterSheetMiB;
    const at = (share: number) => along[Math.min(along.length - 1, Math.max(0, Math.round(share * along.length) - 1))] ?? 0;
    const flat = [0.1, 0.25, 0.5, 0.75, 1].map((share) => `${Math.round(share * 100)} % ${at(share).toFixed(0)}`).join(', ');
    return {
      tasks: [{ ...measured(`build ${BATCH_GLYPHS} glyphs from ${sheetCount} synthetic sheets, --jobs ${jobs}`, [result.ms]) }],
      lines: [
        `${BATCH_GLYPHS}-glyph batch (${sheetCount} sheets of ${SHEET_LETTER_COUNT}, 300 dpi, --jobs ${jobs}): ${(result.ms / 1000).toFixed(1)} s, ${(result.ms / BATCH_GLYPHS).toFixed(1)} ms per glyph`,
        `${BATCH_GLYPHS}-glyph batch peak resident memory: ${result.maxRssMiB.toFixed(0)} MiB (whole process, worker threads included); resident after the sheets traced (MiB): ${flat}`,
      ],
    };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}
