// Draws Stemline's application icon: a hand-drawn "S" stroke in ink on warm paper,
// with two of its on-curve points (vermilion squares) and their handles (thin lines
// ending in round knobs) — the app's subject, a letter turned into points and
// handles. The drawing is our own, made here as SVG and rasterised by sharp into the
// PNGs electron-builder packs: icon.png (1024 px, from which it makes the macOS .icns
// and the Windows .ico) and icons/NxN.png for Linux desktops.
// Run: `npx tsx electron/resources/draw-icon.ts` (the PNGs are committed; run again after changing the drawing).
import sharp from 'sharp';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The drawing's own units: a 1024-unit square, the size macOS asks of an app icon (Apple HIG, "App icons": 1024×1024 px). */
const CANVAS = 1024;

/** The paper square's margin and corner radius: macOS icons sit on a rounded square inset about 10% from the edge (Apple's icon grid, from memory). */
const MARGIN = 100;
const CORNER = 180;

/** Ink, paper and accent: the renderer's theme colours (renderer/src/theme.css --ink, --paper, --accent). */
const INK = '#24211d';
const PAPER = '#f4efe5';
const ACCENT = '#b8432b';

/** The S's stroke width and the size of the point marks, in drawing units. */
const STROKE = 96;
const POINT = 88;
const HANDLE_LINE = 14;
const KNOB_RADIUS = 30;

/** Linux icon theme sizes electron-builder installs (freedesktop Icon Theme Specification's usual sizes). */
const LINUX_SIZES = [16, 32, 48, 64, 128, 256, 512, 1024];

interface Point {
  x: number;
  y: number;
}

/** The S as two cubic Bézier segments through three on-curve points. */
const S_START: Point = { x: 700, y: 290 };
const S_MIDDLE: Point = { x: 512, y: 512 };
const S_END: Point = { x: 320, y: 740 };
const HANDLES = {
  startOut: { x: 520, y: 180 },
  middleIn: { x: 250, y: 360 },
  middleOut: { x: 780, y: 660 },
  endIn: { x: 500, y: 850 },
};

function pt(p: Point): string {
  return `${p.x} ${p.y}`;
}

/** The icon as SVG text. */
export function iconSvg(): string {
  const inner = CANVAS - 2 * MARGIN;
  const stroke = `M ${pt(S_START)} C ${pt(HANDLES.startOut)} ${pt(HANDLES.middleIn)} ${pt(S_MIDDLE)} C ${pt(HANDLES.middleOut)} ${pt(HANDLES.endIn)} ${pt(S_END)}`;
  const square = (p: Point) => `<rect x="${p.x - POINT / 2}" y="${p.y - POINT / 2}" width="${POINT}" height="${POINT}" fill="${ACCENT}"/>`;
  const handle = (from: Point, to: Point) =>
    `<line x1="${from.x}" y1="${from.y}" x2="${to.x}" y2="${to.y}" stroke="${ACCENT}" stroke-width="${HANDLE_LINE}"/><circle cx="${to.x}" cy="${to.y}" r="${KNOB_RADIUS}" fill="${PAPER}" stroke="${ACCENT}" stroke-width="${HANDLE_LINE}"/>`;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${CANVAS} ${CANVAS}" width="${CANVAS}" height="${CANVAS}">`,
    `<rect x="${MARGIN}" y="${MARGIN}" width="${inner}" height="${inner}" rx="${CORNER}" fill="${PAPER}"/>`,
    `<path d="${stroke}" fill="none" stroke="${INK}" stroke-width="${STROKE}" stroke-linecap="round"/>`,
    handle(S_MIDDLE, HANDLES.middleIn),
    handle(S_MIDDLE, HANDLES.middleOut),
    square(S_MIDDLE),
    square(S_START),
    square(S_END),
    '</svg>',
  ].join('\n');
}

async function main(): Promise<void> {
  const here = fileURLToPath(new URL('.', import.meta.url));
  const svg = Buffer.from(iconSvg());
  await sharp(svg).png().toFile(join(here, 'icon.png'));
  mkdirSync(join(here, 'icons'), { recursive: true });
  for (const size of LINUX_SIZES) await sharp(svg).resize(size, size).png().toFile(join(here, 'icons', `${size}x${size}.png`));
  console.log(`Drew icon.png and ${LINUX_SIZES.length} Linux sizes in ${here}`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : String(error));
    process.exit(1);
  });
}
