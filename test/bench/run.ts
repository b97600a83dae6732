// `npm run bench`: every benchmark suite, each task warmed up and repeated, printed
// as median time per operation with its spread (median absolute deviation), and written
// to bench-results/bench.json for comparison between runs. Speed is proven here,
// never in a timed unit test.
import { Bench } from 'tinybench';
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { cpus } from 'node:os';
import { APP_VERSION } from '../../electron/app-identity.ts';
import { geometryBenchmarks } from './geometry.bench.ts';
import { rasterBenchmarks, rasterThroughputReport } from './raster.bench.ts';
import { pageBenchmarks, pageReport } from './page.bench.ts';
import { fitBenchmarks } from './fit.bench.ts';
import { peerBenchmarks, peerReport } from './peers.bench.ts';
import { fontBenchmarks } from './font.bench.ts';
import { measureEditor } from './editor.bench.ts';
import { measurePipeline } from './pipeline.bench.ts';
import { measureJobsSpeedUp, measureTenThousandGlyphs } from './batch.bench.ts';
import { measureRoundTrip, summaryTable } from '../fit/round-trip-measure.ts';

/** Minimum measuring time per task: enough samples for a stable median on a busy 2-core machine. */
const MEASURE_MS = 400;
/** Warm-up time per task so the JIT has compiled the hot paths before measuring. */
const WARMUP_MS = 150;

interface TaskReport {
  suite: string;
  task: string;
  medianMs: number;
  /** Median absolute deviation of the per-operation times. */
  madMs: number;
  p99Ms: number;
  /** 95th percentile, for the tasks measured in the browser (their goals are stated as p95). */
  p95Ms?: number;
  samples: number;
}

function formatMs(ms: number): string {
  if (ms < 0.001) return `${(ms * 1e6).toFixed(0)} ns`;
  if (ms < 1) return `${(ms * 1e3).toFixed(2)} µs`;
  return `${ms.toFixed(2)} ms`;
}

/** Repetitions for whole-page tasks (each takes about a second): enough for a stable median. */
const PAGE_ITERATIONS = 12;
/** Repetitions of the peer comparison (each fits 24 glyphs three ways). */
const PEER_ITERATIONS = 8;

interface Suite {
  name: string;
  register: (bench: Bench) => void;
  /** Overrides for heavy suites, e.g. fewer iterations. */
  options?: { iterations?: number; time?: number; warmupIterations?: number };
  /** Extra lines printed after the suite (throughputs, splits). */
  report?: (bench: Bench) => string[] | Promise<string[]>;
  /** Tasks timed outside tinybench (in the browser), with their lines to print. */
  measure?: () => Promise<{ lines: string[]; tasks: TaskReport[] }>;
}

const suites: Suite[] = [
  { name: 'geometry', register: geometryBenchmarks },
  { name: 'page', register: pageBenchmarks, options: { iterations: PAGE_ITERATIONS, time: 0, warmupIterations: 2 }, report: pageReport },
  { name: 'raster steps', register: rasterBenchmarks, options: { iterations: PAGE_ITERATIONS, time: 0, warmupIterations: 2 }, report: rasterThroughputReport },
  { name: 'fitting', register: fitBenchmarks },
  { name: 'font', register: fontBenchmarks, options: { iterations: PEER_ITERATIONS, time: 0, warmupIterations: 1 } },
  { name: 'peers', register: peerBenchmarks, options: { iterations: PEER_ITERATIONS, time: 0, warmupIterations: 1 }, report: peerReport },
  { name: 'pipeline', register: () => undefined, measure: async () => {
    const { lines, tasks } = await measurePipeline();
    return { lines, tasks: tasks.map((t) => ({ suite: 'pipeline', ...t })) };
  } },
  { name: 'jobs', register: () => undefined, measure: async () => {
    const { lines, tasks } = await measureJobsSpeedUp();
    return { lines, tasks: tasks.map((t) => ({ suite: 'jobs', ...t })) };
  } },
  { name: 'batch', register: () => undefined, measure: async () => {
    const { lines, tasks } = await measureTenThousandGlyphs();
    return { lines, tasks: tasks.map((t) => ({ suite: 'batch', ...t })) };
  } },
  { name: 'round trip', register: () => undefined, report: roundTripReport },
  { name: 'editor', register: () => undefined, measure: async () => {
    const { lines, tasks } = await measureEditor();
    return { lines, tasks: tasks.map((t) => ({ suite: 'editor', ...t })) };
  } },
];

/** The round trip on the reference fonts (A–Z a–z 0–9, three variants): the fit-quality figures of the README. */
function roundTripReport(): string[] {
  const { summaries } = measureRoundTrip();
  const rows = summaryTable(summaries);
  console.table(rows);
  return rows.map((row) => Object.entries(row).map(([k, v]) => `${k} ${v}`).join('; '));
}

/** Peak resident memory of this process so far, in MiB (getrusage's maxrss is in KiB on Linux). */
function peakResidentMiB(): number {
  return process.resourceUsage().maxRSS / 1024;
}

/** `npm run bench -- peers fitting` runs only the named suites; no names runs them all. */
const wanted = process.argv.slice(2);
const unknown = wanted.filter((name) => !suites.some((suite) => suite.name === name));
if (unknown.length > 0) {
  console.error(`No benchmark suite named ${unknown.map((n) => `"${n}"`).join(', ')}. Suites: ${suites.map((s) => `"${s.name}"`).join(', ')}.`);
  process.exit(2);
}
const selected = wanted.length === 0 ? suites : suites.filter((suite) => wanted.includes(suite.name));

const reports: TaskReport[] = [];
const notes: Array<{ suite: string; lines: string[]; peakResidentMiB: number }> = [];
for (const suite of selected) {
  const bench = new Bench({ time: MEASURE_MS, warmupTime: WARMUP_MS, ...suite.options });
  suite.register(bench);
  await bench.run();
  console.log(`\n${suite.name}`);
  for (const task of bench.tasks) {
    const result = task.result;
    if (result.state !== 'completed') {
      throw new Error(`Benchmark "${task.name}" did not complete (${result.state}${'error' in result ? `: ${String(result.error)}` : ''}).`);
    }
    const report: TaskReport = {
      suite: suite.name,
      task: task.name,
      medianMs: result.latency.p50,
      madMs: result.latency.mad,
      p99Ms: result.latency.p99,
      samples: result.latency.samplesCount,
    };
    reports.push(report);
    console.log(`  ${task.name.padEnd(60)} median ${formatMs(report.medianMs).padStart(10)}  ± ${formatMs(report.madMs).padStart(9)} (MAD)  p99 ${formatMs(report.p99Ms)}  ${report.samples} runs`);
  }
  const timed = suite.measure ? await suite.measure() : { lines: [], tasks: [] };
  reports.push(...timed.tasks);
  const extra = [...timed.lines, ...(suite.report ? await suite.report(bench) : [])];
  for (const line of extra) console.log(`  ${line}`);
  const peak = peakResidentMiB();
  console.log(`  peak resident memory so far: ${peak.toFixed(0)} MiB`);
  notes.push({ suite: suite.name, lines: extra, peakResidentMiB: peak });
}

const outDir = fileURLToPath(new URL('../../bench-results', import.meta.url));
mkdirSync(outDir, { recursive: true });
const machine = { cores: cpus().length, cpu: cpus()[0]?.model ?? 'unknown', node: process.version };
writeFileSync(join(outDir, 'bench.json'), `${JSON.stringify({ version: APP_VERSION, machine, date: new Date().toISOString(), reports, notes }, null, 2)}\n`);
console.log(`\nReport written to ${join(outDir, 'bench.json')}`);
