// The catalogue of errors users see (electron/error-catalogue.ts): every kind has a
// remedy that tells the user what to do, and the command line reports every kind as
// bad input (exit 1, one line naming the command) and only usage mistakes as exit 2.
import { describe, expect, it } from 'vitest';
import { ERROR_REMEDIES, isUserFacingError, remedyFor } from '../../electron/error-catalogue.ts';
import { COMMANDS, runCli } from '../../electron/cli/run-cli.ts';
import { CliUsageError } from '../../electron/cli/cli-usage-error.ts';
import { InputError } from '../../electron/io/input-error.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';
import { FontError } from '../../electron/io/font/font-error.ts';
import { HandlerError } from '../../electron/handler-error.ts';
import { RasterError } from '../../core/raster/index.ts';
import { OutlineError } from '../../core/outline/index.ts';
import { DraftFontError } from '../../core/pipeline/index.ts';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { DEMO_SHEETS_FOLDER } from '../../electron/demo/demo-files.ts';

/** Verbs a remedy starts its advice with: each tells the user something to do. */
const ADVICE = /\b(check|save|export|scan|convert|choose|open|put|update|fix|give|rename|set|move|redraw|type|undo|report|draw|change|wait|download|crop|try)\b/i;

const entries = Object.entries(ERROR_REMEDIES).flatMap(([family, kinds]) => Object.entries(kinds as Record<string, string>).map(([kind, remedy]) => ({ family, kind, remedy })));

/** One error of every kind, built as its thrower builds it. */
function sampleErrors(): Error[] {
  const errors: Error[] = [];
  for (const { family, kind, remedy } of entries) {
    const message = `sheet.png: something about ${kind} was wrong. ${remedy}`;
    if (family === 'input') errors.push(new InputError(kind as never, 'sheet.png', message));
    if (family === 'project') errors.push(new ProjectError(kind as never, 'sheet.png', message));
    if (family === 'font') errors.push(new FontError(kind as never, message));
    if (family === 'raster') errors.push(new RasterError(kind as never, message));
    if (family === 'outline') errors.push(new OutlineError(kind as never, message));
    if (family === 'handler') errors.push(new HandlerError(kind as never, message));
  }
  return errors;
}

describe('the catalogue of errors', () => {
  it('gives every kind of error a remedy, one or two sentences that say what to do', () => {
    expect(entries.length).toBeGreaterThanOrEqual(37); // the six error types' kinds when this was written; the compiler makes a new kind add its remedy
    for (const { family, kind, remedy } of entries) {
      expect(remedy, `${family} ${kind}`).toMatch(ADVICE);
      expect(remedy, `${family} ${kind}`).toMatch(/^[A-Z].*[.]$/);
      expect(remedy.length, `${family} ${kind}`).toBeLessThan(160);
    }
  });

  it('finds the remedy of every error by its kind', () => {
    for (const error of sampleErrors()) {
      expect(isUserFacingError(error)).toBe(true);
      expect(remedyFor(error), `${error.name} ${(error as { kind?: string; code?: string }).kind ?? (error as { code?: string }).code}`).toMatch(ADVICE);
    }
    expect(isUserFacingError(new TypeError('x is undefined'))).toBe(false);
    expect(remedyFor(new TypeError('x'))).toBeUndefined();
  });

  it('makes the command line exit 1 with one line for every kind, and 2 for a usage mistake', async () => {
    const command = COMMANDS[0]!;
    const original = command.run;
    try {
      for (const error of [...sampleErrors(), new DraftFontError('The character "A" is given twice in --chars. Give each character once.')]) {
        (command as { run: typeof original }).run = async () => {
          throw error;
        };
        const err: string[] = [];
        expect(await runCli([command.name], { out: () => undefined, err: (t) => err.push(t) }), error.message).toBe(1);
        expect(err.join(''), error.message).toMatch(new RegExp(`^stemline ${command.name}: .+\\n$`));
      }
      (command as { run: typeof original }).run = async () => {
        throw new CliUsageError(`stemline ${command.name}: --upm takes a number from 16 to 16384, not "7".`);
      };
      expect(await runCli([command.name], { out: () => undefined, err: () => undefined })).toBe(2);
    } finally {
      (command as { run: typeof original }).run = original;
    }
  });

  it('says which folder it cannot write in, and what to do, instead of crashing', async () => {
    // Reference: POSIX error codes as Node reports them (ENOENT for a missing folder).
    const out = join(tmpdir(), `stemline-missing-${process.pid}`, 'inner', 'draft.svg');
    const err: string[] = [];
    const code = await runCli(['trace', join(DEMO_SHEETS_FOLDER, 'pellworth-alphabet.png'), '-o', out], { out: () => undefined, err: (t) => err.push(t) });
    expect(code).toBe(1);
    expect(err.join('')).toBe(`stemline trace: cannot write in ${dirname(out)}: that folder does not exist. Create it, or write somewhere else.\n`);
  }, 120_000);
});

