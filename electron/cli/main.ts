// Process entry of the `stemline` command line (`npm run --silent stemline -- …`).
import { runCli } from './run-cli.ts';
import { terminalProgress } from './progress-bar.ts';

const code = await runCli(process.argv.slice(2), {
  out: (text) => process.stdout.write(text),
  err: (text) => process.stderr.write(text),
  // A progress bar only on a terminal: piped and captured stderr stays as the contract says.
  ...(process.stderr.isTTY ? { progress: terminalProgress((text) => process.stderr.write(text)) } : {}),
});
process.exitCode = code;
