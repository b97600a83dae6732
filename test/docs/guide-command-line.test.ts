// The command-line chapter of the user guide (docs/guide/08-command-line.md) against
// the command line itself: its usage lines and every command's synopsis are the ones
// `--help` prints, and every example command runs on the demo sheet and succeeds, in
// the order the guide gives them (later ones read what earlier ones wrote), with the
// results the chapter states. Outputs go to a temporary folder.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { COMMANDS } from '../../electron/cli/run-cli.ts';
import { helpText } from '../../electron/cli/usage.ts';
import { runCaptured } from '../cli/run-captured.ts';
import { fencedLines, guideChapter, PROJECT_ROOT, shellWords } from './guide-text.ts';

const chapter = guideChapter('08-command-line.md');
const PREFIX = ['npm', 'run', '--silent', 'stemline', '--'];
/** Options that take no value: every other option takes the next word. */
const FLAGS = new Set(['--json', '--invert', '--fair-joins', '--help', '--version']);
const OUTPUT_OPTIONS = new Set(['-o', '--output']);

const examples = fencedLines(chapter, 'sh')
  .filter((line) => line.trim() !== '')
  .map((line) => {
    const words = shellWords(line);
    if (words.slice(0, PREFIX.length).join(' ') !== PREFIX.join(' ')) throw new Error(`an example does not start with "${PREFIX.join(' ')}": ${line}`);
    return { line, argv: words.slice(PREFIX.length) };
  });

const outputs = mkdtempSync(join(tmpdir(), 'stemline-guide-'));
afterAll(() => rmSync(outputs, { recursive: true, force: true }));

/**
 * The example's arguments as run here: a file named in the project (the demo sheet) by
 * its full path; an output, and a file an earlier example wrote, in the temporary folder.
 */
function runnable(argv: readonly string[]): string[] {
  const result: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const word = argv[i]!;
    if (word.startsWith('-')) {
      result.push(word);
      if (!FLAGS.has(word) && i + 1 < argv.length) {
        const value = argv[++i]!;
        result.push(OUTPUT_OPTIONS.has(word) ? join(outputs, value) : value);
      }
    } else if (i === 0) {
      result.push(word);
    } else {
      result.push(existsSync(join(PROJECT_ROOT, word)) ? join(PROJECT_ROOT, word) : join(outputs, word));
    }
  }
  return result;
}

/** What each example printed, by its command, for the checks of the chapter's closing paragraph. */
const printed = new Map<string, { out: string; err: string }[]>();

describe('the guide\'s command line', () => {
  it('gives the usage lines and each command\'s synopsis exactly as --help prints them', () => {
    const help = helpText(COMMANDS).split('\n');
    for (const usage of help.filter((line) => line.includes('npm run --silent stemline --'))) expect(chapter).toContain(usage);
    const synopses = fencedLines(chapter, '');
    for (const command of COMMANDS) expect(synopses, `the synopsis of ${command.name}`).toContain(command.synopsis);
  });

  it('has examples for build, trace and boundaries', () => {
    const commands = new Set(examples.map((e) => e.argv[0]));
    for (const name of ['build', 'trace', 'boundaries']) expect(commands).toContain(name);
  });

  for (const example of examples) {
    it(`runs: ${example.line.slice(PREFIX.join(' ').length + 1, 120)}`, async () => {
      const result = await runCaptured(runnable(example.argv));
      expect(result.code, result.err).toBe(0);
      const name = example.argv[0]!;
      printed.set(name, [...(printed.get(name) ?? []), { out: result.out, err: result.err }]);
    }, 300_000);
  }

  it('states what the examples print', () => {
    const build = printed.get('build')?.[0];
    expect(build?.err).toMatch(/^wrote .*pellworth\.otf: 70 glyphs, 1000 units per em, cap height 700/m);
    // The sample lines the chapter quotes are lines the build printed.
    const sample = chapter.split('\n').filter((line) => line.startsWith('A\tU+0041') || line.startsWith('note: '));
    expect(sample.length).toBe(2);
    expect(build?.out.split('\n')).toContain(sample[0]);
    expect(build?.err.split('\n')).toContain(sample[1]);

    const trace = JSON.parse(printed.get('trace')?.[0]?.out ?? '{}') as { tolerance: number; unitsPerPixel: number };
    expect(chapter).toContain(`a tolerance of ${trace.tolerance.toFixed(2)} units`);
    expect(chapter).toContain(`a pixel is ${trace.unitsPerPixel.toFixed(2)} units`);
    expect(chapter).toContain(`cap height is ${Math.round(700 / trace.unitsPerPixel)} px`);

    const boundaries = JSON.parse(printed.get('boundaries')?.[0]?.out ?? '{}') as { threshold: { method: string; level: number }; boundary: string };
    expect(boundaries.threshold.method).toBe('otsu');
    expect(chapter).toContain(`Otsu's level ${boundaries.threshold.level} and \`${boundaries.boundary}\``);

    expect(printed.get('check')?.[0]?.err).toMatch(/^71 glyphs checked/);
  });
});
