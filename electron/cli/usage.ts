// The CLI's usage text and exit codes: the contract other tools rely on.
// Exit 0 on success, 1 when the input is bad (the message names the file and the
// problem), 2 when the command line itself is wrong.
import { APP_NAME, APP_VERSION } from '../app-identity.ts';

export const EXIT_OK = 0;
export const EXIT_BAD_INPUT = 1;
export const EXIT_USAGE = 2;

/** One command of the CLI, as listed in `--help`. */
export interface CommandSummary {
  name: string;
  synopsis: string;
  purpose: string;
  /** Option lines shown under the command in `--help`. */
  options?: readonly string[];
}

export function versionLine(): string {
  return `stemline ${APP_VERSION}`;
}

/** The full `--help` text for the given commands. */
export function helpText(commands: readonly CommandSummary[]): string {
  const lines = [
    `${APP_NAME} ${APP_VERSION}: scans of hand-drawn letters to cubic outlines and a test font.`,
    '',
    'Usage: npm run --silent stemline -- <command> [options]',
    '       npm run --silent stemline -- --help | --version',
    '',
  ];
  if (commands.length > 0) {
    lines.push('Commands:');
    for (const command of commands) {
      lines.push(`  ${command.synopsis}`, `      ${command.purpose}`);
      for (const option of command.options ?? []) lines.push(`        ${option}`);
    }
    lines.push('');
  }
  lines.push('Options:', '  --help      show this text', '  --version   print the version', '');
  lines.push('Exit status: 0 success, 1 bad input (the message names the file and the problem), 2 usage error.');
  return lines.join('\n');
}
