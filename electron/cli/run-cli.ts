// The command-line interface as a plain function: argument list in, exit code out,
// text written through the given streams. `main.ts` wires it to the process; the
// tests call it directly. A usage mistake exits 2; bad input (a file that will not
// decode, a page with no ink, any error of electron/error-catalogue.ts) exits 1
// with a one-line message naming the problem.
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_USAGE, helpText, versionLine, type CommandSummary } from './usage.ts';
import { CliUsageError } from './cli-usage-error.ts';
import type { ProgressDisplay } from './progress-bar.ts';
import { dirname } from 'node:path';
import { isUserFacingError } from '../error-catalogue.ts';
import { boundariesCommand } from './commands/boundaries.ts';
import { traceCommand } from './commands/trace.ts';
import { buildCommand } from './commands/build.ts';
import { importCommand } from './commands/import.ts';
import { checkCommand } from './commands/check.ts';

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
    if (isUserFacingError(error)) {
      streams.err(`stemline ${command.name}: ${oneLine(error.message)}\n`);
      return EXIT_BAD_INPUT;
    }
    const fileSystem = fileSystemMessage(error);
    if (fileSystem) {
      streams.err(`stemline ${command.name}: ${fileSystem}\n`);
      return EXIT_BAD_INPUT;
    }
    throw error;
  }
}

/** What went wrong and what to do, per file-system error code met when writing a result. */
const FILE_SYSTEM_PROBLEMS: Readonly<Record<string, string>> = {
  ENOENT: 'that folder does not exist. Create it, or write somewhere else',
  ENOTDIR: 'part of that path is a file, not a folder. Check the path',
  EACCES: 'you may not write there. Choose a folder of your own',
  EPERM: 'you may not write there. Choose a folder of your own',
  EROFS: 'that disk is read-only. Write somewhere else',
  ENOSPC: 'the disk is full. Free some space, or write somewhere else',
  EISDIR: 'that is a folder. Give a file name',
};

/** A one-line message for a file-system error (results are written beside their target first, so the folder is named). */
function fileSystemMessage(error: unknown): string | undefined {
  if (!(error instanceof Error)) return undefined;
  const { code, path } = error as NodeJS.ErrnoException;
  const problem = code === undefined ? undefined : FILE_SYSTEM_PROBLEMS[code];
  if (!problem || path === undefined) return undefined;
  const place = code === 'EISDIR' ? path : dirname(path);
  return `cannot write in ${place}: ${problem}.`;
}

function oneLine(text: string): string {
  return text.replace(/\s*\n\s*/g, ' ');
}
