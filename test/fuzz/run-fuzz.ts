// `npm run fuzz`: the fuzzing suites (test/fuzz/*.fuzz.test.ts) with FUZZ_RUNS_LONG
// cases each and a fresh seed, unless STEMLINE_FUZZ_RUNS / STEMLINE_FUZZ_SEED say
// otherwise. Extra arguments go to Vitest (e.g. a file to run only one suite). Each
// suite prints its seed; a failure's report gives the seed and path to replay it.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { FUZZ_RUNS_VARIABLE, FUZZ_SEED_VARIABLE } from './fuzz-settings.ts';

/** Cases per suite in a long run: five times the normal suite's. */
const FUZZ_RUNS_LONG = 10_000;

const root = fileURLToPath(new URL('../..', import.meta.url));
const env = { ...process.env, [FUZZ_RUNS_VARIABLE]: process.env[FUZZ_RUNS_VARIABLE] ?? String(FUZZ_RUNS_LONG), [FUZZ_SEED_VARIABLE]: process.env[FUZZ_SEED_VARIABLE] ?? 'random' };
const files = process.argv.slice(2);
const result = spawnSync('npx', ['vitest', 'run', '--config', 'test/vitest.config.ts', ...(files.length > 0 ? files : ['test/fuzz/'])], { cwd: root, env, stdio: 'inherit' });
process.exitCode = result.status ?? 1;
