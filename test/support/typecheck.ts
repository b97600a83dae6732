// `npm run typecheck`: every TypeScript project in the repository, strict.
//  - core/ alone, with no DOM and no Node types, so any such use fails;
//  - the Node side, tests and benchmarks (tsconfig.json);
//  - the Svelte renderer (svelte-check);
//  - the Electron entry points, which need the `electron` package's types: skipped
//    with a message where that package is absent (a failure under STEMLINE_REQUIRE_ALL=1).
// Writes test-results/typecheck-junit.xml so CI counts these checks with the tests.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { junitXml, type CaseResult } from './junit.ts';
import { requireAllIsSet, REQUIRE_ALL_VARIABLE } from './require-tool.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
const bin = (name: string) => join(root, 'node_modules', '.bin', name);

interface Check {
  name: string;
  command: string;
  args: string[];
  /** When set, the check is skipped (or failed under strict mode) with this message. */
  missing?: string;
}

const electronTypes = join(root, 'node_modules', 'electron', 'electron.d.ts');
const checks: Check[] = [
  { name: 'core/ type-checks with no DOM and no Node', command: bin('tsc'), args: ['-p', 'core/tsconfig.json'] },
  { name: 'Node side, tests and benchmarks type-check', command: bin('tsc'), args: ['-p', 'tsconfig.json'] },
  { name: 'renderer type-checks (svelte-check)', command: bin('svelte-check'), args: ['--tsconfig', 'renderer/tsconfig.json', '--fail-on-warnings'] },
  {
    name: 'Electron main and preload type-check',
    command: bin('tsc'),
    args: ['-p', 'electron/tsconfig.json', '--noEmit'],
    missing: existsSync(electronTypes) ? undefined : 'the electron package is not installed (ELECTRON_SKIP_BINARY_DOWNLOAD=1 npm install electron)',
  },
];

const results: CaseResult[] = [];
for (const check of checks) {
  if (check.missing !== undefined) {
    const message = `skipped: ${check.missing}`;
    if (requireAllIsSet()) {
      results.push({ name: check.name, failure: `${message} (${REQUIRE_ALL_VARIABLE}=1 makes this a failure)` });
      console.error(`✗ ${check.name}: ${message}`);
    } else {
      results.push({ name: check.name, skipped: message });
      console.log(`- ${check.name}: ${message}`);
    }
    continue;
  }
  const run = spawnSync(check.command, check.args, { cwd: root, encoding: 'utf8' });
  const output = `${run.stdout ?? ''}${run.stderr ?? ''}`.trim();
  if (run.status === 0) {
    results.push({ name: check.name });
    console.log(`✓ ${check.name}`);
  } else {
    results.push({ name: check.name, failure: output || `exit ${run.status}` });
    console.error(`✗ ${check.name}\n${output}`);
  }
}

mkdirSync(join(root, 'test-results'), { recursive: true });
writeFileSync(join(root, 'test-results', 'typecheck-junit.xml'), junitXml('typecheck', results));
process.exitCode = results.some((r) => r.failure !== undefined) ? 1 : 0;
