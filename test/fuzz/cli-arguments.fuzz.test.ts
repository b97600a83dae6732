// Fuzzing the command line: every command with any mix of its options, other
// commands' options, values of every kind (numbers out of range, NaN, empty,
// random text) and files of every kind (a small scan, a font, a project, a missing
// file, a folder, a damaged copy). Every run ends with exit status 0, 1 (bad input)
// or 2 (usage) and, when it fails, a message on stderr that names the command;
// never an exception, a hang or a runaway allocation. The suite runs in a scratch
// folder, so an output named by a random value lands there.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { COMMANDS, runCli } from '../../electron/cli/run-cli.ts';
import { EXIT_BAD_INPUT, EXIT_OK, EXIT_USAGE } from '../../electron/cli/usage.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { serializeProject } from '../../electron/io/project/project-file.ts';
import { sampleProject } from '../electron/project-host-fixture.ts';
import { TEST_FONT } from '../font/sample-fonts.ts';
import { fuzzParameters, fuzzSettings, suiteTimeLimitMs, withinLimitsAsync } from './fuzz-settings.ts';

const settings = fuzzSettings('CLI arguments');

/** Every long option any command takes, and some no command takes. */
const OPTIONS = ['--output', '-o', '--json', '--characters', '--chars', '--family', '--style', '--upm', '--cap-height', '--tolerance', '--corner-angle', '--fit-mode', '--fair-joins', '--threshold', '--invert', '--speck-area', '--pinhole-area', '--dpi', '--help', '--version', '--nonsense', '-x', '--', '-'];
/** Values that sit on or past the edges of the options' ranges. */
const EDGE_VALUES = ['0', '-1', '1', '0.5', '255', '256', '16', '16384', '100000', 'NaN', 'Infinity', '-Infinity', '1e309', '', ' ', 'otsu', 'local', 'smooth', 'economy', 'ABC abc', 'A', '\u0000', '🜁'];

/** A scan of a few letter-like blobs: white paper, black ink, 300 dpi. */
async function smallScan(): Promise<Buffer> {
  const width = 48;
  const height = 24;
  const data = Buffer.alloc(width * height, 255);
  for (const [x0, x1] of [[4, 12], [18, 26], [32, 44]] as const) for (let y = 6; y < 18; y++) for (let x = x0; x < x1; x++) data[y * width + x] = 0;
  return sharp(data, { raw: { width, height, channels: 1 } }).png().withMetadata({ density: 300 }).toBuffer();
}

describe('fuzzing the command line', () => {
  const folder = mkdtempSync(join(tmpdir(), 'stemline-fuzz-cli-'));
  const previousFolder = process.cwd();
  const files: string[] = [];
  beforeAll(async () => {
    process.chdir(folder);
    const scan = await smallScan();
    writeFileSync('scan.png', scan);
    writeFileSync('cut.png', scan.subarray(0, scan.length - 30));
    writeFileSync('font.otf', writeOtf(TEST_FONT));
    writeFileSync('project.stemline', serializeProject(sampleProject()));
    writeFileSync('notes.txt', 'not an image');
    mkdirSync('folder');
    files.push('scan.png', 'cut.png', 'font.otf', 'project.stemline', 'notes.txt', 'folder', 'missing.png', join(folder, 'scan.png'));
  });
  afterAll(() => process.chdir(previousFolder));

  it(`every command line ends in exit status 0, 1 or 2 with a message naming the command (${settings.runs} cases)`, async () => {
    const token = fc.oneof(
      { weight: 4, arbitrary: fc.constantFrom(...OPTIONS) },
      { weight: 3, arbitrary: fc.constantFrom(...EDGE_VALUES) },
      { weight: 3, arbitrary: fc.constantFrom(...files) },
      { weight: 1, arbitrary: fc.string({ maxLength: 12 }).map((text) => text.replace(/[/\\]/g, '_')) },
      { weight: 1, arbitrary: fc.double().map(String) },
    );
    const command = fc.oneof({ weight: 9, arbitrary: fc.constantFrom(...COMMANDS.map((c) => c.name)) }, { weight: 1, arbitrary: fc.constantFrom('--help', '--version', 'help', 'tarce', '', '-o') });
    // Half the cases are shaped like real use (a file, then options with values), so they get past the option parser.
    const shaped = fc.tuple(fc.constantFrom(...files), fc.array(fc.tuple(fc.constantFrom(...OPTIONS.filter((o) => o.startsWith('--') && o.length > 2)), fc.constantFrom(...EDGE_VALUES, ...files)), { maxLength: 3 })).map(([file, pairs]) => [file, ...pairs.flatMap(([option, value]) => (/json|invert|fair-joins|help|version/.test(option) ? [option] : [option, value]))]);
    const codes = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(command, fc.oneof(shaped, fc.array(token, { maxLength: 8 })), async (name, rest) => {
        const argv = [name, ...rest];
        const err: string[] = [];
        const code = await withinLimitsAsync(`stemline ${argv.join(' ')}`, () => runCli(argv, { out: () => undefined, err: (text) => err.push(text) }));
        codes.set(code, (codes.get(code) ?? 0) + 1);
        expect([EXIT_OK, EXIT_BAD_INPUT, EXIT_USAGE], argv.join(' ')).toContain(code);
        if (code !== EXIT_OK) {
          const message = err.join('');
          expect(message, argv.join(' ')).toMatch(/stemline/);
          expect(message, argv.join(' ')).not.toMatch(/\n\s+at |\[object Object\]/);
        }
        if (code === EXIT_BAD_INPUT) expect(err.join('').trim().split('\n'), argv.join(' ')).toHaveLength(1); // bad input is one line
      }),
      fuzzParameters(settings),
    );
    console.info(`CLI arguments: exit statuses ${JSON.stringify(Object.fromEntries(codes))} over ${settings.runs} cases`);
    expect(codes.get(EXIT_OK) ?? 0).toBeGreaterThan(0);
    expect(codes.get(EXIT_BAD_INPUT) ?? 0).toBeGreaterThan(0);
  }, suiteTimeLimitMs(settings.runs, 100));
});
