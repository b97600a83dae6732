// A font imported as a project and written out again maps the same characters to
// the same glyphs — including glyphs the font reaches from several characters
// (Cantarell draws the space and the no-break space with one glyph, and the hyphen,
// soft hyphen, hyphen U+2010 and non-breaking hyphen with another) — and the written
// font passes the browsers' sanitizer. References: fontTools 4.38 (Debian
// python3-fonttools) reading the cmap of the original and of the written font;
// ots-sanitize; Debian's Cantarell Regular (CFF) and DejaVu Sans (TrueType, ~6,000
// glyphs, where every glyph has at most one character).
import { expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readFont } from '../../electron/io/font/read-font.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { fontSourceFromProject } from '../../electron/io/project/font-from-project.ts';
import { projectFromFont } from '../../electron/io/project/project-from-font.ts';
import { loadProject, saveProject } from '../../electron/io/project/project-file.ts';
import { FONTTOOLS_PYTHON, OTS_SANITIZE, REFERENCE_FONTS, type Requirement } from '../support/require-tool.ts';
import { runPythonJson } from '../font/fonttools.ts';
import { otsSanitize } from '../font/ots.ts';
import { describeWith } from '../font/require.ts';

/** Every glyph's code points over all of the font's Unicode cmap subtables, by glyph name (fontTools cmap.buildReversed). */
const REVERSED_CMAP = `
import json, sys
from fontTools.ttLib import TTFont
reversed = TTFont(sys.argv[1])["cmap"].buildReversed()
print(json.dumps({name: sorted(codes) for name, codes in reversed.items()}))
`;

/**
 * opentype.js 2.0.0 maps U+0000 to any glyph named ".null" whatever it is given
 * (its Glyph constructor); DejaVu Sans has such a glyph but maps nothing to it.
 */
const NULL_GLYPH_NAME = '.null';

function reversedCmap(path: string): Record<string, number[]> {
  const cmap = runPythonJson<Record<string, number[]>>(REVERSED_CMAP, [path]);
  delete cmap[NULL_GLYPH_NAME];
  return cmap;
}

interface TripCase {
  label: string;
  font: Requirement;
  /** Glyphs the font reaches from several characters, by name, as fontTools reads them from the original. */
  multiple: Record<string, number[]>;
}

const cases: TripCase[] = [
  {
    label: 'Cantarell Regular (CFF)',
    font: REFERENCE_FONTS.cantarellRegular,
    multiple: { space: [0x20, 0xa0], hyphen: [0x2d, 0xad, 0x2010, 0x2011], uni2002: [0x2000, 0x2002], uni2003: [0x2001, 0x2003], emdash: [0x2014, 0x2015] },
  },
  { label: 'DejaVu Sans (TrueType)', font: REFERENCE_FONTS.dejavuSans, multiple: {} },
];

for (const tripCase of cases) {
  describeWith(`${tripCase.label} through a project and back to a font`, [tripCase.font, FONTTOOLS_PYTHON, OTS_SANITIZE], () => {
    let memo: { written: string; bytes: Uint8Array; projectGlyphs: number } | undefined;
    const trip = async () => {
      if (memo === undefined) {
        const folder = mkdtempSync(join(tmpdir(), 'stemline-font-project-'));
        const projectPath = join(folder, 'imported.stemline');
        await saveProject(projectPath, projectFromFont(readFont(readFileSync(tripCase.font.path), tripCase.font.path)));
        const project = await loadProject(projectPath);
        const bytes = writeOtf(fontSourceFromProject(project));
        const written = join(folder, 'written.otf');
        writeFileSync(written, bytes);
        memo = { written, bytes, projectGlyphs: project.glyphs.length };
      }
      return memo;
    };

    it('maps every character to the same glyph as the original font, glyphs with several characters included', async () => {
      const { written } = await trip();
      // Reference: fontTools' reading of both cmaps.
      const original = reversedCmap(tripCase.font.path);
      const back = reversedCmap(written);
      for (const [name, codePoints] of Object.entries(tripCase.multiple)) expect(original[name]).toEqual(codePoints);
      for (const name of Object.keys(tripCase.multiple)) expect(back[name]).toEqual(original[name]);
      expect(back).toEqual(original);
    });

    it('writes a font the browsers’ sanitizer accepts', async () => {
      const { bytes } = await trip();
      // Reference: ots-sanitize.
      const result = otsSanitize(bytes);
      expect(result.output).toMatch(/sanitized successfully/);
      expect(result.passed).toBe(true);
    });
  });
}
