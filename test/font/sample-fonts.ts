// Font sources for the font tests and benchmarks: a handful of letters drawn the
// way the fitter produces them (cubic bowls with counters, straight stems, smooth
// and corner points, coordinates with fractions), and a generator for large
// deterministic fonts. Outer contours run counter-clockwise, counters clockwise.
import { offCurve, onCurve, reverseContour, type GlyphOutline, type OutlineContour } from '../../core/outline/index.ts';
import type { FontGlyph, FontSource } from '../../electron/io/font/font-model.ts';

/** Handle length of a quarter circle drawn as one cubic: 4/3·(√2 − 1) of the radius (the standard circle approximation). */
const CIRCLE_HANDLE = (4 / 3) * (Math.SQRT2 - 1);

/** An ellipse as four cubics, counter-clockwise from its bottom point, all four joins smooth. */
export function ellipse(cx: number, cy: number, rx: number, ry: number): OutlineContour {
  const hx = rx * CIRCLE_HANDLE;
  const hy = ry * CIRCLE_HANDLE;
  return {
    points: [
      onCurve(cx, cy - ry, true), offCurve(cx + hx, cy - ry), offCurve(cx + rx, cy - hy),
      onCurve(cx + rx, cy, true), offCurve(cx + rx, cy + hy), offCurve(cx + hx, cy + ry),
      onCurve(cx, cy + ry, true), offCurve(cx - hx, cy + ry), offCurve(cx - rx, cy + hy),
      onCurve(cx - rx, cy, true), offCurve(cx - rx, cy - hy), offCurve(cx - hx, cy - ry),
    ],
  };
}

/** A rectangle, counter-clockwise (corner points). */
export function rectangle(x0: number, y0: number, x1: number, y1: number): OutlineContour {
  return { points: [onCurve(x0, y0), onCurve(x1, y0), onCurve(x1, y1), onCurve(x0, y1)] };
}

/** A ring: outer ellipse counter-clockwise, counter clockwise-reversed. */
export function ring(cx: number, cy: number, rx: number, ry: number, stroke: number): GlyphOutline {
  return { contours: [ellipse(cx, cy, rx, ry), reverseContour(ellipse(cx, cy, rx - stroke, ry - stroke))] };
}

/** An "o" with fractional coordinates, as fitting leaves them. */
export const LETTER_O: GlyphOutline = ring(290.3, 245.6, 240.45, 255.2, 71.7);

/** An "I": one stem. */
export const LETTER_I: GlyphOutline = { contours: [rectangle(90, 0, 190.4, 700)] };

/** An "A": a triangle with a triangular counter and a corner-only outline. */
export const LETTER_A: GlyphOutline = {
  contours: [
    { points: [onCurve(20, 0), onCurve(110, 0), onCurve(160.6, 180), onCurve(419.4, 180), onCurve(470, 0), onCurve(560, 0), onCurve(335, 700), onCurve(245, 700)] },
    { points: [onCurve(185, 260), onCurve(290, 610), onCurve(395, 260)] },
  ],
};

/** An "S"-like stroke: curves joined smoothly and at corners, handles at odd angles. */
export const LETTER_S: GlyphOutline = {
  contours: [
    {
      points: [
        onCurve(60, 90), offCurve(120.25, 20.75), offCurve(200, -12), onCurve(290, -12, true),
        offCurve(410.5, -12), offCurve(500, 60), onCurve(500, 180, true), offCurve(500, 300), offCurve(400, 340), onCurve(290, 380, true),
        offCurve(200, 410), offCurve(160, 440), onCurve(160, 510, true), offCurve(160, 570), offCurve(210, 620), onCurve(290, 620, true),
        offCurve(350, 620), offCurve(400, 600), onCurve(450, 560), onCurve(490, 625),
        offCurve(430, 675), offCurve(370, 700), onCurve(290, 700, true), offCurve(160, 700), offCurve(80, 620), onCurve(80, 505, true),
        offCurve(80, 390), offCurve(180, 340), onCurve(280, 305, true), offCurve(380, 270), offCurve(420, 240), onCurve(420, 175, true),
        offCurve(420, 110), offCurve(370, 68), onCurve(290, 68, true), offCurve(210, 68), offCurve(150, 100), onCurve(105, 155),
      ],
    },
  ],
};

/** An "é": the o and an acute accent above it. */
export const LETTER_E_ACUTE: GlyphOutline = {
  contours: [...LETTER_O.contours, { points: [onCurve(260, 560), onCurve(330, 560), onCurve(420, 720), onCurve(330, 720)] }],
};

/** A period: a dot. */
export const PERIOD: GlyphOutline = { contours: [ellipse(80, 45, 45, 45)] };

/** The test letters as glyphs. */
export const TEST_GLYPHS: readonly FontGlyph[] = [
  { character: 'o', outline: LETTER_O, advanceWidth: 580.6 },
  { character: 'I', outline: LETTER_I, advanceWidth: 280 },
  { character: 'A', outline: LETTER_A, advanceWidth: 580 },
  { character: 'S', outline: LETTER_S, advanceWidth: 560 },
  { character: 'é', outline: LETTER_E_ACUTE, advanceWidth: 580 },
  { character: '.', outline: PERIOD, advanceWidth: 160 },
  { character: '', name: 'o.alt', outline: ring(290, 245, 230, 245, 90), advanceWidth: 580 },
];

/** A small, ordinary Latin test font. */
export const TEST_FONT: FontSource = {
  familyName: 'Stemline Test',
  styleName: 'Regular',
  unitsPerEm: 1000,
  ascender: 800,
  descender: -200,
  lineGap: 90,
  xHeight: 500,
  capHeight: 700,
  weightClass: 400,
  designer: 'Test Letterer',
  glyphs: TEST_GLYPHS,
};

/** First code point of the CJK Unified Ideographs block, a long run of assignable characters (Unicode, block U+4E00–U+9FFF). */
const CJK_FIRST = 0x4e00;

/**
 * A deterministic font of `count` glyphs, each a ring with a stem whose sizes vary
 * with the index (about 13 cubics and lines per glyph, like a traced letter).
 */
export function syntheticFont(count: number): FontSource {
  const glyphs: FontGlyph[] = [];
  for (let i = 0; i < count; i++) {
    const wobble = (k: number) => Math.round(40 * Math.sin(i * 0.7 + k)) + (i % 7) * 0.25;
    const bowl = ring(300 + wobble(1), 250 + wobble(2), 220 + wobble(3), 250 + wobble(4), 70 + (i % 5) * 6);
    const stem = rectangle(560 + wobble(5), -200 + (i % 3) * 100, 640 + wobble(5), 720);
    glyphs.push({ character: String.fromCodePoint(CJK_FIRST + i), outline: { contours: [...bowl.contours, stem] }, advanceWidth: 720 + (i % 11) });
  }
  return { ...TEST_FONT, familyName: 'Stemline Synthetic', glyphs };
}

/** Freezes `value` and everything it holds, so a test can prove the writer does not modify its input. */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const key of Object.keys(value)) deepFreeze((value as Record<string, unknown>)[key]);
  }
  return value;
}
