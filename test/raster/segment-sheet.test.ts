// Segmenting a sheet of letters: separate pieces of ink that make one letter (dots,
// accents, a stroke broken on the scan) are grouped, neighbouring letters stay apart,
// rows and baselines are found, and the artist's characters are assigned in reading
// order. The sheet is rendered from a reference font so the truth is known exactly.

import { describe, expect, it } from 'vitest';
import type { PathCommand } from 'opentype.js/dist/opentype.js';
import { segmentSheet, traceScan, type Box } from '../../core/raster/index.ts';
import { addGlyphPath, loadFont, renderAntialiased, toPixel, type FontPlacement } from './reference-render.ts';
import { CANTARELL, describeWithFont } from './require-font.ts';

const SCALE = 0.25; // px per font unit: Cantarell's 1000-unit em is 250 px
const LEFT = 60.4;
const TRACKING_PX = 40;
const BASELINES = [260.3, 640.6];
const ROWS = ['Hij', 'ÀÉä'];
const WIDTH = 900;
const HEIGHT = 760;
/** A baseline found from the traced letters is within this distance of where it was drawn. */
const BASELINE_TOLERANCE_PX = 1.5;
/** A letter's box is the glyph's drawn box to within this (anti-aliasing, erased gaps). */
const BOX_TOLERANCE_PX = 1.5;

function commandBox(commands: readonly PathCommand[], placement: FontPlacement): Box {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const command of commands) {
    if (command.type === 'Z') continue;
    const p = toPixel(placement, command.x, command.y);
    xs.push(p.x);
    ys.push(p.y);
  }
  const x = Math.min(...xs);
  const y = Math.min(...ys);
  return { x, y, width: Math.max(...xs) - x, height: Math.max(...ys) - y };
}

describeWithFont('sheet segmentation', CANTARELL, () => {
  const font = loadFont(CANTARELL.path);
  const drawn: { character: string; box: Box; commands: readonly PathCommand[]; placement: FontPlacement }[] = [];
  ROWS.forEach((text, row) => {
    let x = LEFT;
    for (const character of text) {
      const glyph = font.charToGlyph(character);
      const placement = { scale: SCALE, originX: x, originY: BASELINES[row]! };
      drawn.push({ character, box: commandBox(glyph.path.commands, placement), commands: glyph.path.commands, placement });
      x += (glyph.advanceWidth ?? 600) * SCALE + TRACKING_PX;
    }
  });
  const [letterH, , letterJ] = drawn;
  const page = renderAntialiased(
    WIDTH,
    HEIGHT,
    (context) => {
      context.beginPath();
      for (const glyph of drawn) addGlyphPath(context, glyph.commands, glyph.placement);
      context.fill('nonzero');
      context.fillStyle = '#ffffff';
      // Broken strokes: a 5 px crack across the top of the H's left stem, and one across the j's stem.
      context.fillRect(letterH!.box.x - 3, letterH!.box.y + 0.2 * letterH!.box.height, 0.3 * letterH!.box.width, 5);
      context.fillRect(letterJ!.box.x - 3, BASELINES[0]! - 35, letterJ!.box.width + 6, 5);
    },
    4,
  );
  const traced = traceScan({ raster: page, dpiX: 600 }, { characters: 'Hij ÀÉä' });
  const { sheet } = traced;

  it('finds one letter per drawn glyph: dots, accents and broken strokes join their letter', () => {
    expect(sheet.letters).toHaveLength(drawn.length);
    // Each piece really is separate ink: H (2 pieces), i (2), j (3), À (2 + counter), É (2), ä (3 + counter).
    expect(traced.contours.filter((contour) => contour.depth === 0)).toHaveLength(2 + 2 + 3 + 2 + 2 + 3);
    expect(sheet.letters.map((letter) => letter.contours.length)).toEqual([2, 2, 3, 3, 2, 4]);
  });

  it('orders letters in reading order, row by row, and boxes each around its whole glyph', () => {
    sheet.letters.forEach((letter, index) => {
      const expected = drawn[index]!.box;
      expect(letter.index).toBe(index);
      expect(letter.row).toBe(index < 3 ? 0 : 1);
      // Reference: the glyph's own outline box, placed where it was drawn.
      expect(Math.abs(letter.box.x - expected.x)).toBeLessThan(BOX_TOLERANCE_PX);
      expect(Math.abs(letter.box.y - expected.y)).toBeLessThan(BOX_TOLERANCE_PX);
      expect(Math.abs(letter.box.x + letter.box.width - (expected.x + expected.width))).toBeLessThan(BOX_TOLERANCE_PX);
      expect(Math.abs(letter.box.y + letter.box.height - (expected.y + expected.height))).toBeLessThan(BOX_TOLERANCE_PX);
    });
  });

  it('finds each row\'s baseline where the text was set, despite the descender of j', () => {
    expect(sheet.rows).toHaveLength(2);
    sheet.rows.forEach((row, index) => expect(Math.abs(row.baseline - BASELINES[index]!)).toBeLessThan(BASELINE_TOLERANCE_PX));
  });

  it('assigns the typed characters in reading order, skipping spaces', () => {
    expect(sheet.letters.map((letter) => letter.character)).toEqual(['H', 'i', 'j', 'À', 'É', 'ä']);
    expect(sheet.notes).toEqual([]);
  });

  it('leaves letters without a character when fewer are typed, and reports extra characters', () => {
    const fewer = segmentSheet(traced.contours, { characters: 'Hi' });
    expect(fewer.letters.map((letter) => letter.character)).toEqual(['H', 'i', null, null, null, null]);
    expect(fewer.notes.join(' ')).toMatch(/4 letter\(s\) have no character/);
    const more = segmentSheet(traced.contours, { characters: 'Hij ÀÉä xy' });
    expect(more.notes.join(' ')).toMatch(/"xy" was not assigned/);
  });

  it('counts a decomposed accented character (E + combining acute) as one character', () => {
    const decomposed = segmentSheet(traced.contours, { characters: 'Hij A\u0300E\u0301a\u0308' });
    expect(decomposed.letters.map((letter) => letter.character)).toEqual(['H', 'i', 'j', 'À', 'É', 'ä']);
  });
});

describe('sheet segmentation of simple shapes', () => {
  it('keeps two round letters apart even when they nearly touch, and a full stop is a letter of its own', () => {
    const page = renderAntialiased(300, 120, (context) => {
      context.lineWidth = 8;
      for (const cx of [50, 117]) { // outer radius 32: a 3 px gap between the two
        context.beginPath();
        context.arc(cx, 60, 28, 0, 2 * Math.PI);
        context.stroke();
      }
      context.beginPath();
      context.arc(165, 84, 5, 0, 2 * Math.PI);
      context.fill();
    }, 4);
    const { sheet } = traceScan({ raster: page, dpiX: 300 }, { characters: 'oo.' });
    expect(sheet.letters.map((letter) => letter.character)).toEqual(['o', 'o', '.']);
    expect(sheet.rows).toHaveLength(1);
  });
});
