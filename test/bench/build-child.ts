// `tsx test/bench/build-child.ts BUILD-ARGS…`: runs `stemline build` in a fresh
// process for the batch benchmarks (batch.bench.ts), as a user's run starts cold,
// and prints one JSON line: exit code, wall time, CPU time of all its threads and of
// its main thread alone, of the image decoder's threads and of the other threads
// (the workers, V8's background compiling and collecting, libuv's pool), the glyph
// lines written, peak resident memory of the whole process (its worker threads
// included) and the resident memory each time another sheet has been traced — flat
// if the build streams.
import { readdirSync, readFileSync } from 'node:fs';
import { runCli } from '../../electron/cli/run-cli.ts';

/** Sampling interval of resident memory, ms: fine enough to catch a peak lasting a sheet's trace (common practice). */
const SAMPLE_INTERVAL_MS = 50;
const MIB = 1024 * 1024;

/** Clock ticks per second of /proc's CPU times (USER_HZ, 100 on Linux for every common architecture). */
const USER_HZ = 100;
/** Name libvips gives its threads (prctl PR_SET_NAME, cut to 15 bytes by Linux): the image decoder's. */
const DECODER_THREAD_NAME = 'libvips worker';

/** CPU time of one thread of this process, ms, and its name, from /proc (Linux); null elsewhere or once it has ended. */
function threadCpu(tid: string): { name: string; ms: number } | null {
  try {
    const stat = readFileSync(`/proc/self/task/${tid}/stat`, 'utf8');
    // The command name is in parentheses and may hold spaces; after it, state is field 3, utime 14 and stime 15 (proc(5)).
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return { name: stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')')), ms: ((Number(fields[11]) + Number(fields[12])) * 1000) / USER_HZ };
  } catch {
    return null;
  }
}

/** CPU time of this process's main thread, ms; null where /proc is not there. */
function mainThreadCpuMs(): number | null {
  return threadCpu(String(process.pid))?.ms ?? null;
}

/**
 * The last CPU time seen of every thread but the main one, by thread id: sampled as
 * the build runs, because a worker's thread is gone from /proc once it has ended
 * (what it used after its last sample, at most one interval, is missed).
 */
const threadsSeen = new Map<string, { name: string; ms: number; atStart: number }>();
function sampleThreads(atStart: boolean): void {
  let tids: string[];
  try {
    tids = readdirSync('/proc/self/task');
  } catch {
    return;
  }
  for (const tid of tids) {
    if (tid === String(process.pid)) continue;
    const cpu = threadCpu(tid);
    if (!cpu) continue;
    const seen = threadsSeen.get(tid);
    threadsSeen.set(tid, { name: cpu.name, ms: cpu.ms, atStart: seen?.atStart ?? (atStart ? cpu.ms : 0) });
  }
}
sampleThreads(true);
const started = performance.now();
const mainCpuAtStart = mainThreadCpuMs();
const cpuAtStart = process.cpuUsage();
let peakSampled = 0;
const sampler = setInterval(() => {
  peakSampled = Math.max(peakSampled, process.memoryUsage.rss());
  sampleThreads(false);
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
sampleThreads(false);
const ms = performance.now() - started;
const cpu = process.cpuUsage(cpuAtStart);
/** CPU time of the whole process (every thread), ms: what a build costs, whatever the cores. */
const cpuMs = (cpu.user + cpu.system) / 1000;
const mainCpuAtEnd = mainThreadCpuMs();
/** CPU time of the main thread during the build, ms (null where /proc is not there). */
const mainCpuMs = mainCpuAtEnd === null || mainCpuAtStart === null ? null : mainCpuAtEnd - mainCpuAtStart;
/** CPU time during the build of the decoder's threads (`decoder`) or of every other thread but the main one, ms; null where /proc is not there. */
function threadsCpuMs(decoder: boolean): number | null {
  if (threadsSeen.size === 0) return null;
  let sum = 0;
  for (const thread of threadsSeen.values()) if ((thread.name === DECODER_THREAD_NAME) === decoder) sum += thread.ms - thread.atStart;
  return sum;
}
const decoderCpuMs = threadsCpuMs(true);
const otherThreadsCpuMs = threadsCpuMs(false);
const maxRssMiB = Math.max(process.resourceUsage().maxRSS / 1024, peakSampled / MIB);
process.stdout.write(`${JSON.stringify({ code, ms, cpuMs, mainCpuMs, decoderCpuMs, otherThreadsCpuMs, glyphLines, maxRssMiB, rssAfterSheetMiB: rssAfterSheet, err: err.slice(-2000) })}\n`);
