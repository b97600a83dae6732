// The command-line interface as a plain function: argument list in, exit code out,
// text written through the given streams. `main.ts` wires it to the process; the
// tests call it directly. A usage mistake exits 2; bad input (a file that will not
// decode, a page with no ink) exits 1 with a one-line message naming the problem.
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_USAGE, helpText, versionLine, type CommandSummary } from './usage.ts';
import { CliUsageError } from './cli-usage-error.ts';
import type { ProgressDisplay } from './progress-bar.ts';
import { InputError } from '../io/input-error.ts';
import { RasterError } from '../../core/raster/index.ts';
import { boundariesCommand } from './commands/boundaries.ts';
import { traceCommand } from './commands/trace.ts';
import { buildCommand } from './commands/build.ts';
import { importCommand } from './commands/import.ts';
import { checkCommand } from './commands/check.ts';
import { ProjectError } from '../io/project/project-error.ts';
import { OutlineError } from '../../core/outline/index.ts';

/** Where the CLI writes: stdout for results, stderr for messages, and a progress display when stderr is a terminal. */
export interface CliStreams {
  out: (text: string) => void;
  err: (text: string) => void;
  /** Given only when stderr is a terminal (main.ts); commands without it show no progress. */
  progress?: ProgressDisplay;
}

/** A command: its summary for `--help` and how to run it. */
export interface CliCommand extends CommandSummary {
  run: (args: readonly string[], streams: CliStreams) => Promise<number>;
}

/** Every command the CLI offers, in the order `--help` lists them. */
export const COMMANDS: readonly CliCommand[] = [buildCommand, traceCommand, boundariesCommand, importCommand, checkCommand];

/** Runs the CLI on `argv` (the arguments after the program name) and returns the exit code. */
export async function runCli(argv: readonly string[], streams: CliStreams): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined) {
    streams.err(`${helpText(COMMANDS)}\n`);
    return EXIT_USAGE;
  }
  if (first === '--help' || first === '-h' || first === 'help') {
    streams.out(`${helpText(COMMANDS)}\n`);
    return EXIT_OK;
  }
  if (first === '--version' || first === '-V') {
    streams.out(`${versionLine()}\n`);
    return EXIT_OK;
  }
  const command = COMMANDS.find((candidate) => candidate.name === first);
  if (!command) {
    const known = COMMANDS.length > 0 ? ` Commands: ${COMMANDS.map((c) => c.name).join(', ')}.` : '';
    streams.err(`stemline: unknown command or option "${first}".${known} See "stemline --help".\n`);
    return EXIT_USAGE;
  }
  try {
    return await command.run(rest, streams);
  } catch (error) {
    if (error instanceof CliUsageError) {
      streams.err(`${error.message}\n`);
      return EXIT_USAGE;
    }
    if (error instanceof InputError || error instanceof RasterError || error instanceof ProjectError || error instanceof OutlineError) {
      streams.err(`stemline ${command.name}: ${oneLine(error.message)}\n`);
      return EXIT_BAD_INPUT;
    }
    throw error;
  }
}

function oneLine(text: string): string {
  return text.replace(/\s*\n\s*/g, ' ');
}
