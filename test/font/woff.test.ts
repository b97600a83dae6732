// Reading WOFF 1.0: a web font downloaded as .woff opens exactly as the same font
// as .otf does — same outlines, widths, characters, names and metrics. The WOFF
// files are built from the OTF's tables here (woff-container.ts, W3C WOFF 1.0);
// fontTools (Debian python3-fonttools) confirms they are valid WOFF.
import { expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readFont, type ReadFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { InputError } from '../../electron/io/input-error.ts';
import { FONTTOOLS_PYTHON, REFERENCE_FONTS } from '../support/require-tool.ts';
import { runPythonJson } from './fonttools.ts';
import { describeWith } from './require.ts';
import { TEST_FONT } from './sample-fonts.ts';
import { toWoff } from './woff-container.ts';

/** Everything a reader of the font sees, without where it came from. */
function content(font: ReadFont): unknown {
  const { fileName: _file, container: _container, ...rest } = font;
  return rest;
}

const CHECK_WOFF = `
import io, json, sys
from fontTools.ttLib import TTFont
font = TTFont(io.BytesIO(open(sys.argv[1], "rb").read()))
print(json.dumps({"flavor": font.flavor, "glyphs": len(font.getGlyphOrder())}))
`;

describeWith('reading WOFF 1.0 fonts', [FONTTOOLS_PYTHON, REFERENCE_FONTS.cantarellRegular], () => {
  const sources: Array<{ label: string; otf: () => Uint8Array }> = [
    { label: 'a font Stemline wrote', otf: () => writeOtf(TEST_FONT) },
    { label: 'Cantarell Regular', otf: () => new Uint8Array(readFileSync(REFERENCE_FONTS.cantarellRegular.path)) },
  ];
  for (const source of sources) {
    it(`reads ${source.label} from .woff exactly as from .otf`, () => {
      const otf = source.otf();
      const woff = toWoff(otf);
      expect(woff.length).toBeLessThan(otf.length);
      const directory = mkdtempSync(join(tmpdir(), 'stemline-woff-'));
      try {
        writeFileSync(join(directory, 'font.woff'), woff);
        // Reference: fontTools opens the container as WOFF (flavor "woff").
        const checked = runPythonJson<{ flavor: string; glyphs: number }>(CHECK_WOFF, [join(directory, 'font.woff')]);
        expect(checked.flavor).toBe('woff');
        const fromWoff = readFont(woff, 'font.woff');
        const fromOtf = readFont(otf, 'font.otf');
        expect(checked.glyphs).toBe(fromOtf.glyphs.length);
        expect(fromWoff.container).toBe('woff');
        expect(fromOtf.container).toBe('sfnt');
        expect(JSON.stringify(content(fromWoff))).toBe(JSON.stringify(content(fromOtf)));
      } finally {
        rmSync(directory, { recursive: true, force: true });
      }
    });
  }

  it('says a WOFF file is incomplete when it was cut short', () => {
    const woff = toWoff(writeOtf(TEST_FONT));
    let caught: unknown;
    try {
      readFont(woff.subarray(0, woff.length - 10), 'cut.woff');
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(InputError);
    expect((caught as InputError).kind).toBe('font-unreadable');
    expect((caught as InputError).message).toMatch(/cut\.woff: the font file is incomplete/);
  });
});
