// A sheet of 100 drawn letters for the editor benchmark's "open a 100-glyph project":
// ten rows of ten shapes (rings, bars and chevrons of varied sizes, like the demo
// sheet's o, l and v) drawn by Skia (@napi-rs/canvas) at 300 dpi, as PNG bytes, and
// the 100 distinct characters assigned to them in reading order. Sizes vary from a
// seeded generator so every run draws the same sheet.
import { createCanvas, type SKRSContext2D } from '@napi-rs/canvas';
import sharp from 'sharp';
import { seededRandom } from '../support/seeded-random.ts';

/** Letters on the sheet: the 100-glyph project of the editor's speed goal. Every third letter, from the second on, is a bar (kinds: ring, bar, chevron). */
export const SHEET_LETTER_COUNT = 100;
/** Letters per row, and so rows per sheet. */
const PER_ROW = 10;
/** Space each letter gets, pixels (about 8 × 11 mm at 300 dpi, a comfortable hand-lettering cell). */
const CELL_WIDTH = 100;
const CELL_HEIGHT = 140;
/** Blank paper round the grid, pixels. */
const SHEET_MARGIN = 60;
/** Scan resolution written into the PNG (the demo sheet's). */
const SHEET_DPI = 300;
/** Seed of the size variation (any fixed number). */
const SHEET_SEED = 100;
/** Paper and ink greys of the demo sheet (test/support/demo-sheet.ts). */
const PAPER = '#f2f0ea';
const INK = '#1a1a1a';

/**
 * 100 distinct characters in reading order: A–Z, a–z, 0–9 and 38 accented Latin
 * letters from Latin-1 Supplement (U+00C0 onwards, skipping × and ÷).
 */
export function sheetCharacters(): string {
  const ranges: string[] = [];
  for (let c = 0x41; c <= 0x5a; c++) ranges.push(String.fromCodePoint(c));
  for (let c = 0x61; c <= 0x7a; c++) ranges.push(String.fromCodePoint(c));
  for (let c = 0x30; c <= 0x39; c++) ranges.push(String.fromCodePoint(c));
  for (let c = 0xc0; ranges.length < SHEET_LETTER_COUNT; c++) if (c !== 0xd7 && c !== 0xf7) ranges.push(String.fromCodePoint(c));
  return ranges.join('');
}

function drawLetter(g: SKRSContext2D, kind: number, x: number, y: number, size: number): void {
  g.beginPath();
  if (kind === 0) {
    g.ellipse(x, y, 30 * size, 36 * size, 0, 0, 2 * Math.PI);
    g.ellipse(x, y, 16 * size, 22 * size, 0, 0, 2 * Math.PI, true);
  } else if (kind === 1) {
    g.rect(x - 9 * size, y - 48 * size, 18 * size, 96 * size);
  } else {
    g.moveTo(x - 34 * size, y + 40 * size);
    g.lineTo(x, y - 40 * size);
    g.lineTo(x + 34 * size, y + 40 * size);
    g.lineTo(x + 20 * size, y + 40 * size);
    g.lineTo(x, y - 10 * size);
    g.lineTo(x - 20 * size, y + 40 * size);
    g.closePath();
  }
  g.fill();
}

/** The sheet as a greyscale PNG; another seed gives another sheet of the same layout with other sizes. */
export async function hundredLetterSheetPng(seed: number = SHEET_SEED): Promise<Buffer> {
  const random = seededRandom(seed);
  const rows = Math.ceil(SHEET_LETTER_COUNT / PER_ROW);
  const width = 2 * SHEET_MARGIN + PER_ROW * CELL_WIDTH;
  const height = 2 * SHEET_MARGIN + rows * CELL_HEIGHT;
  const canvas = createCanvas(width, height);
  const g = canvas.getContext('2d');
  g.fillStyle = PAPER;
  g.fillRect(0, 0, width, height);
  g.fillStyle = INK;
  for (let i = 0; i < SHEET_LETTER_COUNT; i++) {
    const row = Math.floor(i / PER_ROW);
    const column = i % PER_ROW;
    // 85–100 % of full size: letters of one hand differ a little.
    drawLetter(g, i % 3, SHEET_MARGIN + (column + 0.5) * CELL_WIDTH, SHEET_MARGIN + (row + 0.5) * CELL_HEIGHT, 0.85 + 0.15 * random());
  }
  const rgba = g.getImageData(0, 0, width, height).data;
  const grey = Buffer.alloc(width * height);
  for (let i = 0; i < grey.length; i++) grey[i] = rgba[i * 4] ?? 255;
  return sharp(grey, { raw: { width, height, channels: 1 } }).png().withMetadata({ density: SHEET_DPI }).toBuffer();
}
