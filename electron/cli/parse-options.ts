// Command-line option parsing shared by the commands: node's strict parseArgs, with
// its errors turned into CliUsageError and helpers for numeric values.
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { CliUsageError } from './cli-usage-error.ts';

type Options = NonNullable<ParseArgsConfig['options']>;

/** Parses `args` strictly against `options`; unknown options are usage errors. */
export function parseCommandLine<T extends Options>(command: string, args: readonly string[], options: T) {
  try {
    return parseArgs({ args: [...args], options, allowPositionals: true, strict: true });
  } catch (error) {
    const message = error instanceof Error ? error.message.replace(/\. To specify a positional argument.*$/, '') : String(error);
    throw new CliUsageError(`stemline ${command}: ${message}. See "stemline --help".`);
  }
}

/** Reads a numeric option value within [min, max]; undefined stays undefined. */
export function numberOption(command: string, name: string, value: string | undefined, min: number, max: number): number | undefined {
  if (value === undefined) return undefined;
  const parsed = Number(value);
  if (value.trim() === '' || !Number.isFinite(parsed) || parsed < min || parsed > max) {
    throw new CliUsageError(`stemline ${command}: --${name} takes a number from ${min} to ${max}, not "${value}".`);
  }
  return parsed;
}
