// The font heights a designer types reach the font: the project the window saves
// carries them, and the proof font and the exported .otf built from it record them in
// the tables the OpenType spec defines for them — 'head' unitsPerEm; 'hhea' ascender,
// descender, lineGap; 'OS/2' sTypoAscender, sTypoDescender, sTypoLineGap, sCapHeight,
// sxHeight, and usWinAscent / usWinDescent covering the typed lines and all the ink.
// Read back with two independent parsers: opentype.js 2.0.0 and Debian's fontTools.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import opentype from 'opentype.js/dist/opentype.js';
import { createDocument, createEditorState, dispatch, setFontMetric, type FontMetrics, type MetricName } from '../../core/document/index.ts';
import { onCurve, type GlyphOutline } from '../../core/outline/index.ts';
import { embedScan } from '../../electron/io/project/embedded-scan.ts';
import { projectContent } from '../../renderer/src/project/project-content.ts';
import type { EditableLetter } from '../../renderer/src/editor/letter-document.ts';
import type { FittedLetter } from '../../renderer/src/scan/trace-protocol.ts';
import type { FontContent } from '../../electron/api-contract.ts';
import { FONTTOOLS_PYTHON } from '../support/require-tool.ts';
import { browserHostFixture } from '../electron/project-host-fixture.ts';
import { inspectFont } from './inspect.ts';
import { describeWith } from './require.ts';

/** As measured from a drawing (made up). */
const MEASURED: FontMetrics = { unitsPerEm: 1000, ascender: 760, descender: -236, capHeight: 712, xHeight: 498, lineGap: 204 };
/** What the designer types over them: a 2048 em and heights that are none of the measured ones. */
const TYPED: FontMetrics = { unitsPerEm: 2048, ascender: 1650, descender: -480, capHeight: 1400, xHeight: 1010, lineGap: 90 };
/** The "p" below reaches 600 units under the baseline, past the typed descender (−480). */
const P_BOTTOM = -600;
/** The "H" reaches the cap height, under the typed ascender. */
const H_TOP = 1400;

const box = (x0: number, y0: number, x1: number, y1: number): GlyphOutline => ({ contours: [{ points: [onCurve(x0, y0), onCurve(x1, y0), onCurve(x1, y1), onCurve(x0, y1)] }] });

function fittedLetter(index: number, character: string, outline: GlyphOutline): FittedLetter {
  return { index, character, box: { x: 10, y: 10, width: 20, height: 70 }, frame: { originX: 10, baselineY: 80, unitsPerPixel: 10 }, outline, contours: [], ink: '', warnings: [], maxDeviation: 0.5, problem: null };
}

/** The window's font after the designer typed every metric of TYPED, as the proof and export get it. */
function typedFont(): FontContent {
  const h = box(100, 0, 900, H_TOP);
  const p = box(100, P_BOTTOM, 900, 1000);
  const letters: EditableLetter[] = [
    { id: 'letter-1', character: 'H', letter: fittedLetter(0, 'H', h), shiftX: 0 },
    { id: 'letter-2', character: 'p', letter: fittedLetter(1, 'p', p), shiftX: 0 },
  ];
  let state = createEditorState(createDocument([
    { id: 'letter-1', name: 'letter-1', unicodes: [0x48], outline: h, advanceWidth: 1000 },
    { id: 'letter-2', name: 'letter-2', unicodes: [0x70], outline: p, advanceWidth: 1000 },
  ], MEASURED));
  // Heights first, then the x-height under the new ascender, so each step is a valid font.
  for (const name of ['unitsPerEm', 'ascender', 'capHeight', 'xHeight', 'descender', 'lineGap'] satisfies MetricName[]) {
    state = dispatch(state, setFontMetric(state.document, name, TYPED[name]));
  }
  const project = projectContent({ scan: { fileName: 'sheet.png', copy: embedScan(new Uint8Array([1, 2, 3])), characters: 'Hp' }, scanFromBase: false, editing: { document: state.document, letters }, carried: [], base: null });
  return { font: project.font, glyphs: project.glyphs };
}

async function exportedAndProof(): Promise<{ exported: Uint8Array; proof: Uint8Array }> {
  const host = browserHostFixture();
  const content = typedFont();
  const written = await host.call('exportFont', { ...content, name: 'heights' });
  const proof = await host.call('buildProofFont', content);
  return { exported: new Uint8Array(readFileSync(written!.path)), proof: new Uint8Array(Buffer.from(proof.base64, 'base64')) };
}

describe('typed font heights in the project', () => {
  it('are saved as the metrics in force, with the list of those the designer typed', () => {
    const { font } = typedFont();
    expect(font).toMatchObject({ ...TYPED, metricsSetByUser: ['unitsPerEm', 'ascender', 'capHeight', 'xHeight', 'descender', 'lineGap'] });
  });
});

describe('typed font heights in the exported font, read by opentype.js', () => {
  it('are in head, hhea and OS/2 as the OpenType spec defines them, and the proof font is the same file', async () => {
    const { exported, proof } = await exportedAndProof();
    expect(Buffer.from(proof).equals(Buffer.from(exported))).toBe(true);
    const font = opentype.parse(exported.buffer.slice(exported.byteOffset, exported.byteOffset + exported.byteLength) as ArrayBuffer);
    // OpenType spec, 'head': unitsPerEm.
    expect(font.unitsPerEm).toBe(TYPED.unitsPerEm);
    // OpenType spec, 'hhea': ascender, descender, lineGap — written equal to the OS/2 typo values.
    expect(font.tables.hhea).toMatchObject({ ascender: TYPED.ascender, descender: TYPED.descender, lineGap: TYPED.lineGap });
    // OpenType spec, 'OS/2': sTypoAscender, sTypoDescender, sTypoLineGap, sCapHeight, sxHeight.
    expect(font.tables.os2).toMatchObject({ sTypoAscender: TYPED.ascender, sTypoDescender: TYPED.descender, sTypoLineGap: TYPED.lineGap, sCapHeight: TYPED.capHeight, sxHeight: TYPED.xHeight });
    // OpenType spec, 'OS/2' usWinAscent/usWinDescent: ink outside them is clipped on Windows, so they cover the lines and all ink.
    expect(font.tables.os2?.usWinAscent).toBe(Math.max(TYPED.ascender, H_TOP));
    expect(font.tables.os2?.usWinDescent).toBe(-P_BOTTOM);
  });
});

describeWith('typed font heights in the exported font, read by fontTools', [FONTTOOLS_PYTHON], () => {
  it('are what fontTools reads from head, hhea and OS/2 (OpenType spec field definitions), with no warnings', async () => {
    const { exported } = await exportedAndProof();
    const view = inspectFont(exported);
    expect(view.head.unitsPerEm).toBe(TYPED.unitsPerEm);
    expect(view.hhea).toMatchObject({ ascent: TYPED.ascender, descent: TYPED.descender, lineGap: TYPED.lineGap });
    expect(view.os2).toMatchObject({
      sTypoAscender: TYPED.ascender,
      sTypoDescender: TYPED.descender,
      sTypoLineGap: TYPED.lineGap,
      sCapHeight: TYPED.capHeight,
      sxHeight: TYPED.xHeight,
      usWinAscent: Math.max(TYPED.ascender, H_TOP),
      usWinDescent: -P_BOTTOM,
    });
    expect(view.warnings).toEqual([]);
  });
});
