// `tsx test/bench/build-child.ts BUILD-ARGS…`: runs `stemline build` in a fresh
// process for the batch benchmarks (batch.bench.ts), as a user's run starts cold,
// and prints one JSON line: exit code, wall time, CPU time of all its threads, the glyph lines written, peak
// resident memory of the whole process (its worker threads included) and the
// resident memory each time another sheet has been traced — flat if the build streams.
import { runCli } from '../../electron/cli/run-cli.ts';

/** Sampling interval of resident memory, ms: fine enough to catch a peak lasting a sheet's trace (common practice). */
const SAMPLE_INTERVAL_MS = 50;
const MIB = 1024 * 1024;

const started = performance.now();
const cpuAtStart = process.cpuUsage();
let peakSampled = 0;
const sampler = setInterval(() => {
  peakSampled = Math.max(peakSampled, process.memoryUsage.rss());
}, SAMPLE_INTERVAL_MS);
const rssAfterSheet: number[] = [];
let glyphLines = 0;
let err = '';
const code = await runCli(process.argv.slice(2), {
  out: (text) => {
    glyphLines += text.split('\n').length - 1;
  },
  err: (text) => {
    err += text;
  },
  progress: {
    show(progress) {
      if (progress.sheetsTraced > rssAfterSheet.length) rssAfterSheet.push(process.memoryUsage.rss() / MIB);
    },
    clear() {},
  },
});
clearInterval(sampler);
const ms = performance.now() - started;
const cpu = process.cpuUsage(cpuAtStart);
/** CPU time of the whole process (every thread), ms: what a build costs, whatever the cores. */
const cpuMs = (cpu.user + cpu.system) / 1000;
const maxRssMiB = Math.max(process.resourceUsage().maxRSS / 1024, peakSampled / MIB);
process.stdout.write(`${JSON.stringify({ code, ms, cpuMs, glyphLines, maxRssMiB, rssAfterSheetMiB: rssAfterSheet, err: err.slice(-2000) })}\n`);
