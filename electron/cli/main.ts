// Process entry of the `stemline` command line (`npm run --silent stemline -- …`).
import { runCli } from './run-cli.ts';

const code = await runCli(process.argv.slice(2), {
  out: (text) => process.stdout.write(text),
  err: (text) => process.stderr.write(text),
});
process.exitCode = code;
