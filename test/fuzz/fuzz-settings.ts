// How many cases each fuzzing suite runs, from which seed, and the limits every case
// is held to. `npm test` runs FUZZ_RUNS_DEFAULT cases per area from a fixed seed, so
// a run is repeatable; `npm run fuzz` (test/fuzz/run-fuzz.ts) sets STEMLINE_FUZZ_RUNS
// and a fresh seed. Every suite prints its seed, and fast-check's failure report
// gives the seed and the path of the shrunk case: set STEMLINE_FUZZ_SEED and
// STEMLINE_FUZZ_PATH to those to replay exactly that case.
import fc from 'fast-check';
import { appendFileSync, mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const FUZZ_RUNS_VARIABLE = 'STEMLINE_FUZZ_RUNS';
export const FUZZ_SEED_VARIABLE = 'STEMLINE_FUZZ_SEED';
export const FUZZ_PATH_VARIABLE = 'STEMLINE_FUZZ_PATH';

/** Cases per area in `npm test`: enough to reach the odd header field, few enough to keep the suite short. */
export const FUZZ_RUNS_DEFAULT = 2000;

/** The seed `npm test` uses when none is given (any fixed number: it only has to stay the same). */
export const FUZZ_SEED_DEFAULT = 20261203;

/**
 * Longest one case may take. Inputs are a few kilobytes, so a case takes
 * milliseconds; a case near this is a hang or a loop over a bogus count. fast-check's
 * timeout interrupts only asynchronous cases, so the synchronous readers are also
 * timed per case (caseTimer) and fail when they pass it.
 */
export const CASE_TIME_LIMIT_MS = 5000;

/**
 * Resident memory a fuzzing worker may reach (1.5 GiB). The inputs are tiny, so a
 * case that reaches it has allocated for a size it read from the file without checking.
 */
export const FUZZ_MEMORY_LIMIT_BYTES = 1.5 * 2 ** 30;

/** Where each run's seeds are appended, so a failure seen in CI's log can be found again. */
const SEED_LOG = fileURLToPath(new URL('../../test-results/fuzz-seeds.log', import.meta.url));

export interface FuzzSettings {
  readonly runs: number;
  readonly seed: number;
  /** fast-check's replay path of one case, when replaying. */
  readonly path: string | undefined;
}

/** The settings for the suite `area`, from the environment; printed and logged. */
export function fuzzSettings(area: string): FuzzSettings {
  const runsText = process.env[FUZZ_RUNS_VARIABLE];
  const runs = runsText === undefined ? FUZZ_RUNS_DEFAULT : Number(runsText);
  if (!Number.isInteger(runs) || runs < 1) throw new Error(`${FUZZ_RUNS_VARIABLE} must be a whole number of cases from 1, not "${runsText}".`);
  const seedText = process.env[FUZZ_SEED_VARIABLE];
  const seed = seedText === undefined ? FUZZ_SEED_DEFAULT : seedText === 'random' ? (Date.now() ^ (Math.random() * 2 ** 31)) | 0 : Number(seedText);
  if (!Number.isInteger(seed)) throw new Error(`${FUZZ_SEED_VARIABLE} must be a whole number or "random", not "${seedText}".`);
  const path = process.env[FUZZ_PATH_VARIABLE];
  const line = `fuzz ${area}: ${runs} cases, seed ${seed}${path === undefined ? '' : `, path ${path}`} (replay: ${FUZZ_SEED_VARIABLE}=${seed})`;
  console.info(line);
  try {
    mkdirSync(fileURLToPath(new URL('../../test-results/', import.meta.url)), { recursive: true });
    appendFileSync(SEED_LOG, `${new Date().toISOString()} ${line}\n`);
  } catch {
    // the log is a convenience; the printed line and fast-check's report carry the seed too
  }
  return { runs, seed, path };
}

/** fast-check parameters for `settings`: its count, seed and path, the per-case time limit. */
export function fuzzParameters<T>(settings: FuzzSettings): fc.Parameters<T> {
  return {
    numRuns: settings.runs,
    seed: settings.seed,
    ...(settings.path === undefined ? {} : { path: settings.path }),
    plugins: [fc.timeout(CASE_TIME_LIMIT_MS)],
    endOnFailure: false,
  };
}

/** Vitest's time limit for a suite of `runs` cases (the per-case limit bounds each case; this bounds the run). */
export function suiteTimeLimitMs(runs: number, perCaseBudgetMs: number): number {
  return Math.max(60_000, runs * perCaseBudgetMs);
}

/**
 * Runs `work` (one synchronous case), failing when it takes longer than
 * CASE_TIME_LIMIT_MS or leaves the worker over FUZZ_MEMORY_LIMIT_BYTES.
 */
export function withinLimits<T>(what: string, work: () => T): T {
  const started = performance.now();
  try {
    return work();
  } finally {
    checkLimits(what, started);
  }
}

/** The asynchronous form of withinLimits (the time limit is also enforced by fast-check's timeout). */
export async function withinLimitsAsync<T>(what: string, work: () => Promise<T>): Promise<T> {
  const started = performance.now();
  try {
    return await work();
  } finally {
    checkLimits(what, started);
  }
}

function checkLimits(what: string, started: number): void {
  const elapsed = performance.now() - started;
  if (elapsed > CASE_TIME_LIMIT_MS) throw new Error(`${what} took ${Math.round(elapsed)} ms, over the ${CASE_TIME_LIMIT_MS} ms one case may take`);
  const rss = process.memoryUsage.rss();
  if (rss > FUZZ_MEMORY_LIMIT_BYTES) throw new Error(`${what} left the worker at ${Math.round(rss / 2 ** 20)} MiB, over the ${FUZZ_MEMORY_LIMIT_BYTES / 2 ** 20} MiB limit`);
}

/**
 * Asserts that `error` is one of the `allowed` error classes and carries a message a
 * person can read: not empty, one that does not end in a stack trace or "[object Object]".
 */
export function expectTypedError(what: string, error: unknown, allowed: readonly (abstract new (...args: never[]) => Error)[]): void {
  if (!allowed.some((type) => error instanceof type)) {
    const detail = error instanceof Error ? `${error.name}: ${error.message}\n${error.stack ?? ''}` : String(error);
    throw new Error(`${what} threw something other than ${allowed.map((t) => t.name).join(' or ')}: ${detail}`);
  }
  const message = (error as Error).message;
  if (message.trim().length === 0 || /\[object Object\]|\bundefined\b|\n\s+at /.test(message)) {
    throw new Error(`${what} threw ${(error as Error).name} with a message a person cannot act on: ${JSON.stringify(message)}`);
  }
}
