// Reading WOFF 1.0: a web font downloaded as .woff opens exactly as the same font
// as .otf does — same outlines, widths, characters, names and metrics. The WOFF
// files are built from the OTF's tables here (woff-container.ts, W3C WOFF 1.0);
// fontTools (Debian python3-fonttools) confirms they are valid WOFF.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readFont, type ReadFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { InputError } from '../../electron/io/input-error.ts';
import { readTableRecords } from '../../electron/io/font/sfnt-tables.ts';
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

describe('damaged and hostile WOFF files', () => {
  /** Byte offset of table `index`'s directory entry, and of its fields (W3C WOFF 1.0, "Table Directory"). */
  const entryAt = (index: number) => 44 + index * 20;
  const ORIG_LENGTH = 12;
  const COMP_LENGTH = 8;
  const OFFSET = 4;
  function caughtReading(bytes: Uint8Array, name: string): InputError {
    try {
      readFont(bytes, name);
    } catch (error) {
      expect(error).toBeInstanceOf(InputError);
      return error as InputError;
    }
    throw new Error(`${name} was read`);
  }
  /** The index of the first table stored compressed, so its stream can be tampered with. */
  function compressedTable(woff: Uint8Array): number {
    const view = new DataView(woff.buffer, woff.byteOffset, woff.byteLength);
    for (let i = 0; i < view.getUint16(12); i++) if (view.getUint32(entryAt(i) + COMP_LENGTH) < view.getUint32(entryAt(i) + ORIG_LENGTH)) return i;
    throw new Error('no compressed table');
  }

  it('refuses a table claiming to unpack to 4 GiB at once, saying the font is too large, before allocating it', () => {
    const woff = toWoff(writeOtf(TEST_FONT));
    const view = new DataView(woff.buffer);
    view.setUint32(entryAt(compressedTable(woff)) + ORIG_LENGTH, 0xffff_fff0);
    const error = caughtReading(woff, 'bomb.woff');
    expect(error.kind).toBe('font-too-large');
    expect(error.message).toMatch(/^bomb\.woff: its tables would unpack to 4096 MiB; Stemline reads fonts of up to 128 MiB\. .*choose another copy\.$/);
  });

  it('says which table is damaged when its compressed data unpacks to more than it declares, or is not compressed data', () => {
    const woff = toWoff(writeOtf(TEST_FONT));
    const view = new DataView(woff.buffer);
    const index = compressedTable(woff);
    const tag = String.fromCharCode(...woff.subarray(entryAt(index), entryAt(index) + 4));
    const shorter = woff.slice();
    new DataView(shorter.buffer).setUint32(entryAt(index) + ORIG_LENGTH, view.getUint32(entryAt(index) + ORIG_LENGTH) - 1);
    expect(caughtReading(shorter, 'long.woff').message).toMatch(new RegExp(`^long\\.woff: the WOFF font is damaged \\(table "${tag}" does not unpack: .+\\)\\. Download or export it again\\.$`));
    const garbage = woff.slice();
    const start = view.getUint32(entryAt(index) + OFFSET);
    garbage.fill(0xa5, start, start + view.getUint32(entryAt(index) + COMP_LENGTH));
    expect(caughtReading(garbage, 'garbage.woff').message).toMatch(new RegExp(`garbage\\.woff: the WOFF font is damaged \\(table "${tag}"`));
  });
});

describe('damaged fonts that opentype.js reads without complaint', () => {
  it('refuses a glyph whose charstring leaves points without a position (opentype.js gives them NaN)', () => {
    const font = writeOtf(TEST_FONT);
    const { records } = readTableRecords(font);
    const cff = records.find((r) => r.tag === 'CFF ')!;
    // The last charstring's operands are replaced by a lone operator: rlineto with an empty stack (Adobe TN 5177, section 4.1).
    const damaged = font.slice();
    const endchar = damaged.lastIndexOf(14, cff.offset + cff.length - 1);
    damaged.fill(5, endchar - 6, endchar); // six rlineto operators in a row, none with operands
    let caught: unknown;
    try {
      const read = readFont(damaged, 'nan.otf');
      // Where opentype.js kept the glyph readable, every coordinate is still a number.
      for (const glyph of read.glyphs) for (const contour of glyph.outline.contours) for (const p of contour.points) expect(Number.isFinite(p.x) && Number.isFinite(p.y)).toBe(true);
    } catch (error) {
      caught = error;
      expect(error).toBeInstanceOf(InputError);
      expect((error as InputError).message).toMatch(/^nan\.otf: the outline of glyph \d+ is damaged \(a point has no position\)\. Export the font again\.$/);
    }
    expect(caught).toBeDefined();
  });
});
