// The test font in a real browser: headless Chromium (Debian's /usr/bin/chromium)
// loads a font Stemline wrote through the CSS Font Loading API without an OTS
// complaint, and the text it renders on a canvas has the ink of our own outlines,
// rasterized independently in Node by Skia (@napi-rs/canvas) at the same size and
// positions. Bytes cross into the page as base64; no server file is involved.
import { test, expect, type Page } from '@playwright/test';
import { createCanvas } from '@napi-rs/canvas';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { contourSegments, type GlyphOutline } from '../../core/outline/index.ts';
import type { FontGlyph, FontSource } from '../../electron/io/font/font-model.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { TEST_FONT, TEST_GLYPHS } from '../font/sample-fonts.ts';

const chromium = checkRequirement(CHROMIUM);

/** Text size in CSS pixels: 0.4 px per font unit, large enough that hinting moves edges by a small fraction of the ink. */
const FONT_SIZE_PX = 400;
/** Blank space around the text, px. */
const MARGIN_PX = 20;
/** Ink at or above half coverage counts as inked for the overlap measure. */
const INK_THRESHOLD = 128;
/**
 * Required overlap (intersection over union of inked pixels) between Chromium's
 * rendering and ours. Chosen here: hinting and anti-aliasing may place an edge a
 * fraction of a pixel differently, which at 400 px costs well under 1% of the ink
 * (measured when written: 0.9991, mean coverage difference 0.1% per inked pixel);
 * a missing counter, a filled hole, a glyph off by one advance or outlines drifting
 * by a unit or two would bring it below this.
 */
const MIN_INK_OVERLAP = 0.99;
const FAMILY = 'StemlineRenderTest';

/** The test letters with advance widths that land on whole pixels at this size (multiples of 5 units are 2 px at 0.4 px per unit). */
const RENDER_GLYPHS: FontGlyph[] = TEST_GLYPHS.filter((g) => g.character !== '').map((g) => ({ ...g, advanceWidth: Math.round(g.advanceWidth / 5) * 5 }));
const RENDER_FONT: FontSource = { ...TEST_FONT, familyName: 'Stemline Render Test', glyphs: RENDER_GLYPHS };
const TEXT = 'AoS.éI';

interface Layout {
  width: number;
  height: number;
  baseline: number;
  scale: number;
}

function layout(font: FontSource, text: string): Layout {
  const scale = FONT_SIZE_PX / (font.unitsPerEm ?? 1000);
  const advance = [...text].reduce((sum, c) => sum + (font.glyphs.find((g) => g.character === c)?.advanceWidth ?? 0), 0);
  return {
    width: Math.ceil(advance * scale) + 2 * MARGIN_PX,
    height: Math.ceil((font.ascender - font.descender) * scale) + 2 * MARGIN_PX,
    baseline: MARGIN_PX + font.ascender * scale,
    scale,
  };
}

/** Our own rendering: the outlines (on whole units, as the font holds them) filled with the nonzero rule by Skia. */
function renderOutlines(font: FontSource, text: string, at: Layout): Uint8Array {
  const canvas = createCanvas(at.width, at.height);
  const g = canvas.getContext('2d');
  g.fillStyle = '#ffffff';
  g.fillRect(0, 0, at.width, at.height);
  g.fillStyle = '#000000';
  let penX = 0;
  for (const character of text) {
    const glyph = font.glyphs.find((candidate) => candidate.character === character)!;
    const outline: GlyphOutline = glyph.outline;
    const px = (x: number) => MARGIN_PX + (penX + Math.round(x)) * at.scale;
    const py = (y: number) => at.baseline - Math.round(y) * at.scale;
    g.beginPath();
    for (const contour of outline.contours) {
      const segments = contourSegments(contour);
      if (segments.length === 0) continue;
      g.moveTo(px(segments[0]!.p0.x), py(segments[0]!.p0.y));
      for (const s of segments) {
        if (s.kind === 'line') g.lineTo(px(s.p1.x), py(s.p1.y));
        else g.bezierCurveTo(px(s.p1.x), py(s.p1.y), px(s.p2.x), py(s.p2.y), px(s.p3.x), py(s.p3.y));
      }
      g.closePath();
    }
    g.fill('nonzero');
    penX += Math.round(glyph.advanceWidth);
  }
  const rgba = g.getImageData(0, 0, at.width, at.height).data;
  return Uint8Array.from({ length: at.width * at.height }, (_, i) => 255 - rgba[i * 4]!);
}

/** Chromium's rendering of `text` in the font given as bytes; ink per pixel (0–255). */
async function renderInChromium(page: Page, bytes: Uint8Array, text: string, at: Layout): Promise<{ ink: Uint8Array; status: string }> {
  await page.setContent('<!doctype html><meta charset="utf-8"><title>font render</title><body></body>');
  const result = await page.evaluate(
    async ({ base64, family, text, size, x, baseline, width, height }) => {
      const binary = atob(base64);
      const data = new Uint8Array(binary.length);
      for (let i = 0; i < binary.length; i++) data[i] = binary.charCodeAt(i);
      const face = new FontFace(family, data.buffer);
      try {
        await face.load();
      } catch {
        return { ink: [] as number[], status: face.status };
      }
      document.fonts.add(face);
      const canvas = document.createElement('canvas');
      canvas.width = width;
      canvas.height = height;
      const g = canvas.getContext('2d')!;
      g.fillStyle = '#ffffff';
      g.fillRect(0, 0, width, height);
      g.fillStyle = '#000000';
      g.font = `${size}px "${family}"`;
      g.textBaseline = 'alphabetic';
      g.fillText(text, x, baseline);
      const rgba = g.getImageData(0, 0, width, height).data;
      const ink: number[] = [];
      for (let i = 0; i < rgba.length; i += 4) ink.push(255 - rgba[i]!);
      return { ink, status: face.status };
    },
    { base64: Buffer.from(bytes).toString('base64'), family: FAMILY, text, size: FONT_SIZE_PX, x: MARGIN_PX, baseline: at.baseline, width: at.width, height: at.height },
  );
  return { ink: Uint8Array.from(result.ink), status: result.status };
}

/** Intersection over union of the pixels inked at least half. */
function inkOverlap(a: Uint8Array, b: Uint8Array): number {
  let both = 0;
  let either = 0;
  for (let i = 0; i < a.length; i++) {
    const inA = a[i]! >= INK_THRESHOLD;
    const inB = b[i]! >= INK_THRESHOLD;
    if (inA && inB) both++;
    if (inA || inB) either++;
  }
  return either === 0 ? 1 : both / either;
}

function collectConsoleProblems(page: Page): string[] {
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' || message.type() === 'warning' || /OTS/i.test(message.text())) problems.push(message.text());
  });
  page.on('pageerror', (error) => problems.push(error.message));
  return problems;
}

test.describe('a Stemline font in the browser', () => {
  test.skip(!chromium.available, chromium.message);

  test('loads without an OTS error and renders the same ink as our outlines', async ({ page }) => {
    const problems = collectConsoleProblems(page);
    const bytes = writeOtf(RENDER_FONT);
    const at = layout(RENDER_FONT, TEXT);
    const chromiumInk = await renderInChromium(page, bytes, TEXT, at);
    expect(chromiumInk.status).toBe('loaded');
    expect(problems).toEqual([]);
    const ours = renderOutlines(RENDER_FONT, TEXT, at);
    const overlap = inkOverlap(chromiumInk.ink, ours);
    const inked = ours.filter((v) => v >= INK_THRESHOLD).length;
    expect(inked).toBeGreaterThan(1000);
    test.info().annotations.push({ type: 'ink overlap', description: overlap.toFixed(4) });
    expect(overlap).toBeGreaterThanOrEqual(MIN_INK_OVERLAP);
  });

  test('a non-ASCII family name loads as well', async ({ page }) => {
    const problems = collectConsoleProblems(page);
    const source: FontSource = { ...RENDER_FONT, familyName: 'Café Écrit 手書き' };
    const result = await renderInChromium(page, writeOtf(source), 'oI', layout(source, 'oI'));
    expect(result.status).toBe('loaded');
    expect(problems).toEqual([]);
  });

  test('a damaged font is refused with an OTS error, so the checks above can fail', async ({ page }) => {
    const problems = collectConsoleProblems(page);
    const bytes = writeOtf(RENDER_FONT).slice();
    bytes.fill(0xee, 200); // everything after the table directory is garbage
    const result = await renderInChromium(page, bytes, TEXT, layout(RENDER_FONT, TEXT));
    expect(result.status).toBe('error');
    expect(problems.some((p) => /OTS/.test(p))).toBe(true);
  });
});
