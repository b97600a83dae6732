// `tsx test/bench/build-child.ts BUILD-ARGS…`: runs `stemline build` in a fresh
// process for the batch benchmarks (batch.bench.ts), as a user's run starts cold,
// and prints one JSON line: exit code, wall time, CPU time of all its threads and of
// its main thread alone (the rest is the workers, V8's background compiling and
// collecting, and the image decoder's threads), the glyph lines written, peak
// resident memory of the whole process (its worker threads included) and the
// resident memory each time another sheet has been traced — flat if the build streams.
import { readFileSync } from 'node:fs';
import { runCli } from '../../electron/cli/run-cli.ts';

/** Sampling interval of resident memory, ms: fine enough to catch a peak lasting a sheet's trace (common practice). */
const SAMPLE_INTERVAL_MS = 50;
const MIB = 1024 * 1024;

/** Clock ticks per second of /proc's CPU times (USER_HZ, 100 on Linux for every common architecture). */
const USER_HZ = 100;
/** CPU time of this process's main thread, ms, from /proc (Linux); null elsewhere. */
function mainThreadCpuMs(): number | null {
  try {
    const stat = readFileSync(`/proc/self/task/${process.pid}/stat`, 'utf8');
    // Fields after the command name (which may hold spaces): state is field 3, utime 14 and stime 15 (proc(5)).
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return ((Number(fields[11]) + Number(fields[12])) * 1000) / USER_HZ;
  } catch {
    return null;
  }
}
const started = performance.now();
const mainCpuAtStart = mainThreadCpuMs();
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
const mainCpuAtEnd = mainThreadCpuMs();
/** CPU time of the main thread during the build, ms (null where /proc is not there). */
const mainCpuMs = mainCpuAtEnd === null || mainCpuAtStart === null ? null : mainCpuAtEnd - mainCpuAtStart;
const maxRssMiB = Math.max(process.resourceUsage().maxRSS / 1024, peakSampled / MIB);
process.stdout.write(`${JSON.stringify({ code, ms, cpuMs, mainCpuMs, glyphLines, maxRssMiB, rssAfterSheetMiB: rssAfterSheet, err: err.slice(-2000) })}\n`);
