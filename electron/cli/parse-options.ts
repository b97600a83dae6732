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
    // One line, as every CLI message: node's own messages run over several lines for some mistakes (an option value starting with a dash).
    const text = error instanceof Error ? error.message : String(error);
    const message = text.replace(/\. To specify a positional argument.*$/s, '').split('\n').map((line) => line.trim()).filter((line) => line.length > 0).join(' ').replace(/\.+$/, '');
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
