// Runs the command line in-process with its output captured, for the CLI tests:
// the exit code, what went to stdout and what went to stderr.
import { runCli } from '../../electron/cli/run-cli.ts';

export async function runCaptured(argv: readonly string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await runCli(argv, { out: (t) => (out += t), err: (t) => (err += t) });
  return { code, out, err };
}
