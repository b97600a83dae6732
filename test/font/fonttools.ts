// Runs Debian's fontTools (python3-fonttools, an independent font compiler and
// parser) from the tests: the interpreter is /usr/bin/python3, not the `python3`
// first on PATH, which lacks fontTools. Scripts print JSON on stdout.
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/** Debian's Python, the one that carries fontTools (see test/support/require-tool.ts FONTTOOLS_PYTHON). */
export const DEBIAN_PYTHON = '/usr/bin/python3';

/** Largest JSON answer expected from a script (a full reference-font dump). */
const MAX_OUTPUT_BYTES = 512 * 1024 * 1024;

/** Runs `code` with `args` (sys.argv[1:]) and parses its stdout as JSON. */
export function runPythonJson<T>(code: string, args: readonly string[] = []): T {
  const stdout = execFileSync(DEBIAN_PYTHON, ['-c', code, ...args], { encoding: 'utf8', maxBuffer: MAX_OUTPUT_BYTES });
  return JSON.parse(stdout) as T;
}

/** Runs the script file `name` from test/font/ with `args` and parses its stdout as JSON. */
export function runPythonScriptJson<T>(name: string, args: readonly string[] = []): T {
  const script = fileURLToPath(new URL(name, import.meta.url));
  const stdout = execFileSync(DEBIAN_PYTHON, [script, ...args], { encoding: 'utf8', maxBuffer: MAX_OUTPUT_BYTES });
  return JSON.parse(stdout) as T;
}
