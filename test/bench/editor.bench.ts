// The editor's speed goals, measured in the real UI: the built renderer served by the
// real browser-mode host (electron/browser-host.ts, own port and a temporary
// workspace) and driven in Debian's headless Chromium, software rendering (no GPU).
//
// - Dragging a point of a 200-segment glyph: the time from each pointermove to the
//   end of the frame that shows the moved outline, points and combs. Goal: median
//   ≤ 8 ms, p95 ≤ 16 ms.
// - Opening a 100-glyph project: the time from the click on the project in the
//   chooser to the end of the first frame that shows all 100 letters at a glance.
//   Goal: ≤ 1 s.
//
// How a drag move is timed: a capture listener on the window sees each pointermove
// before the app does and notes performance.now(); it asks for an animation frame,
// and from that frame's callback posts a message, whose task runs once the frame's
// style, layout and paint are done on the main thread. The gap between the two is one
// move's whole cost on the main thread: the app's handler, the document update,
// Svelte's updates, the new SVG path data, style, layout and paint. Rasterising the
// painted frame happens on other threads and is not in it. The moves are sent one at
// a time, each after the previous one's frame, so no two share a frame. The same gap
// measured from the event's own timeStamp (which adds the wait for the frame the
// browser aligns pointer moves to) is reported beside it.
//
// The 200-segment glyph: the demo sheet's "o" (test/support/demo-sheet.ts) is fitted
// and saved through the page, then the saved glyph's outline is replaced by a
// synthetic one of 200 cubic segments (test/support/dense-outline.ts), and the project
// opened again: a real project on a real scan, with an outline as dense as the goal
// names and every segment a curve (the worst case for combs).
import { chromium, type Browser, type Page } from '@playwright/test';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startBrowserHost, type BrowserHost } from '../../electron/browser-host.ts';
import { RENDERER_BUILD_DIR } from '../../electron/project-paths.ts';
import { outlineToJson } from '../../core/outline/index.ts';
import { CHROMIUM } from '../support/require-tool.ts';
import { DEMO_CHARACTERS, demoSheetPng } from '../support/demo-sheet.ts';
import { denseRingOutline } from '../support/dense-outline.ts';
import { hundredLetterSheetPng, sheetCharacters, SHEET_LETTER_COUNT } from './hundred-letter-sheet.ts';
import { measured, type MeasuredTask } from './timing-summary.ts';

/** Port of the benchmark's host: away from `npm start` (5731) and the browser tests' (5742, 5792). */
const BENCH_HOST_PORT = Number(process.env.STEMLINE_BENCH_PORT ?? 5791);
/** Segments of the dragged glyph: the goal's figure. */
export const DRAG_GLYPH_SEGMENTS = 200;
/** Measured pointer moves of the drag, after the warm-up ones. Enough for a stable p95 (10 moves above it). */
const DRAG_MOVES = 200;
/** Moves first made and not measured, so the JIT has compiled the drag's paths. */
const DRAG_WARMUP_MOVES = 20;
/** Pointer travel per move, screen pixels: a slow, careful drag; sure to move the point by whole units at whole-letter zoom. */
const DRAG_STEP_PIXELS = 3;
/** Moves in one direction before the drag turns back, so it stays on the canvas. */
const DRAG_LEG_MOVES = 10;
/** Times the 100-glyph project is opened; the median is reported. */
const OPEN_RUNS = 5;
/** Browser arguments of the browser tests (test/playwright.config.ts): headless, software rendering, no network. */
const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
/** The window size the measurement uses: a common laptop screen. */
const VIEWPORT = { width: 1440, height: 900 };
/** How long setting up may take (tracing and fitting 100 letters on a busy 2-core machine), ms. */
const SETUP_TIMEOUT_MS = 180_000;
/** Goals of the editor issue's speed section, ms. */
export const DRAG_MEDIAN_GOAL_MS = 8;
export const DRAG_P95_GOAL_MS = 16;
export const OPEN_GOAL_MS = 1000;

/** Names of the measured tasks in bench.json. */
export const DRAG_TASK = `editor: drag a point of a ${DRAG_GLYPH_SEGMENTS}-segment glyph, pointermove → end of frame`;
export const DRAG_INPUT_TASK = `editor: drag a point of a ${DRAG_GLYPH_SEGMENTS}-segment glyph, event timeStamp → end of frame`;
export const OPEN_TASK = `editor: open a ${SHEET_LETTER_COUNT}-glyph project → first paint of the letters at a glance`;

export interface EditorMeasurement {
  lines: string[];
  tasks: MeasuredTask[];
}

/** Why the suite cannot run here, or null when it can. */
function missingRequirement(): string | null {
  if (!existsSync(CHROMIUM.path)) return `editor: skipped: Chromium not found at ${CHROMIUM.path}; install the Debian package "chromium" (${CHROMIUM.install}).`;
  if (!existsSync(join(RENDERER_BUILD_DIR, 'index.html'))) return `editor: skipped: the renderer is not built (no ${join(RENDERER_BUILD_DIR, 'index.html')}); run "npx vite build --config renderer/vite.config.ts" first.`;
  return null;
}

/** Opens a scan in the page, assigns `characters` and fits, ending at the letters at a glance. */
async function fitSheet(page: Page, png: Buffer, characters: string, letterCount: string): Promise<void> {
  await page.goto('/');
  await page.getByTestId('scan-file').setInputFiles({ name: 'sheet.png', mimeType: 'image/png', buffer: png });
  await page.getByTestId('letter-count').filter({ hasText: letterCount }).waitFor({ timeout: SETUP_TIMEOUT_MS });
  await page.getByLabel('Characters on the sheet, in reading order').fill(characters);
  await page.getByRole('button', { name: 'Assign' }).click();
  await page.getByRole('button', { name: 'Fit the assigned letters' }).click();
  await page.getByRole('heading', { name: 'Letters at a glance' }).waitFor({ timeout: SETUP_TIMEOUT_MS });
}

/** Saves the project through the page's chooser as NAME.stemline in the workspace. */
async function saveAs(page: Page, name: string): Promise<void> {
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  const chooser = page.getByTestId('project-chooser');
  await chooser.getByLabel('File name').fill(name);
  await chooser.getByRole('button', { name: 'Save', exact: true }).click();
  await page.getByTestId('project-status').filter({ hasText: `Saved ${name}.stemline` }).waitFor({ timeout: SETUP_TIMEOUT_MS });
}

/** Opens NAME.stemline from the chooser of a freshly loaded page. */
async function openProject(page: Page, fileName: string): Promise<void> {
  await page.goto('/');
  await page.getByRole('button', { name: 'Open…' }).click();
  await page.getByTestId('project-chooser').getByTestId('project-choice').filter({ hasText: fileName }).click();
}

/**
 * Installs the drag timing in the page (see the file comment): every pointermove
 * adds one sample to `window.__dragFrames`, [from the listener, from timeStamp], ms.
 */
async function installDragTiming(page: Page): Promise<void> {
  await page.evaluate(() => {
    const w = window as unknown as { __dragFrames: Array<[number, number]> };
    w.__dragFrames = [];
    window.addEventListener('pointermove', (event) => {
      const seen = performance.now();
      const stamp = event.timeStamp;
      requestAnimationFrame(() => {
        const channel = new MessageChannel();
        channel.port1.onmessage = () => {
          const end = performance.now();
          w.__dragFrames.push([end - seen, end - stamp]);
        };
        channel.port2.postMessage(null);
      });
    }, { capture: true });
  });
}

/** Drags a point of the open letter by DRAG_WARMUP_MOVES + DRAG_MOVES paced moves; the measured samples. */
async function dragPoint(page: Page): Promise<{ handler: number[]; input: number[] }> {
  // A smooth point of the outer contour, a quarter of the way round: well inside the canvas.
  const points = page.getByTestId('on-curve-point');
  const count = await points.count();
  const point = points.nth(Math.floor(count / 8));
  const box = await point.boundingBox();
  if (!box) throw new Error('editor: the point to drag is not on screen.');
  const start = { x: box.x + box.width / 2, y: box.y + box.height / 2 };
  await page.mouse.move(start.x, start.y);
  await page.mouse.down();
  // Past the drag threshold, so every measured move moves the point.
  let at = { x: start.x + 2 * DRAG_STEP_PIXELS, y: start.y };
  await page.mouse.move(at.x, at.y);
  await installDragTiming(page);
  const total = DRAG_WARMUP_MOVES + DRAG_MOVES;
  for (let i = 0; i < total; i++) {
    const leg = Math.floor(i / DRAG_LEG_MOVES) % 2 === 0 ? 1 : -1;
    at = { x: at.x + leg * DRAG_STEP_PIXELS, y: at.y + leg * DRAG_STEP_PIXELS };
    await page.mouse.move(at.x, at.y);
    await page.waitForFunction((n) => (window as unknown as { __dragFrames: unknown[] }).__dragFrames.length >= n, i + 1);
  }
  await page.mouse.up();
  const frames = (await page.evaluate(() => (window as unknown as { __dragFrames: Array<[number, number]> }).__dragFrames)).slice(DRAG_WARMUP_MOVES);
  return { handler: frames.map((f) => f[0]), input: frames.map((f) => f[1]) };
}

/** The project for the drag: the demo sheet with its "o" replaced by the dense outline. */
async function prepareDragProject(page: Page, workspace: string): Promise<string> {
  await fitSheet(page, await demoSheetPng(), DEMO_CHARACTERS, '3 letters in 1 row');
  await saveAs(page, 'dense');
  const path = join(workspace, 'dense.stemline');
  const project = JSON.parse(readFileSync(path, 'utf8')) as { glyphs: Array<{ unicodes: string[]; outline: unknown }> };
  const o = project.glyphs.find((g) => g.unicodes[0] === '006F');
  if (!o) throw new Error('editor: the saved demo project has no "o".');
  // Centred on the fitted ring's box in font units, about its size (the demo's "o" is a ring about 600 units tall).
  o.outline = outlineToJson(denseRingOutline(DRAG_GLYPH_SEGMENTS, { x: 330, y: 320 }, 330));
  writeFileSync(path, JSON.stringify(project));
  return 'dense.stemline';
}

/**
 * Environment variable naming a file for a Chromium trace of the drag (open it in
 * Perfetto or chrome://tracing to see where a move's time goes); unset, no trace.
 */
const TRACE_VARIABLE = 'STEMLINE_BENCH_TRACE';
/** The trace's categories: the main thread's tasks, script, style, layout and paint, and JavaScript samples. */
const TRACE_CATEGORIES = ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'blink', 'v8', 'disabled-by-default-v8.cpu_profiler'];

async function measureDrag(browser: Browser, page: Page, fileName: string): Promise<{ handler: number[]; input: number[] }> {
  await openProject(page, fileName);
  await page.getByTestId('letter-thumbnail').filter({ hasText: 'o' }).first().click();
  const segments = Number(await page.getByTestId('letter-status').getAttribute('data-segments'));
  if (segments !== DRAG_GLYPH_SEGMENTS) throw new Error(`editor: the dense letter has ${segments} segments, not ${DRAG_GLYPH_SEGMENTS}.`);
  const tracePath = process.env[TRACE_VARIABLE];
  if (tracePath) await browser.startTracing(page, { path: tracePath, categories: TRACE_CATEGORIES });
  try {
    return await dragPoint(page);
  } finally {
    if (tracePath) {
      await browser.stopTracing();
      console.log(`  trace of the drag written to ${tracePath}`);
    }
  }
}

/**
 * Times opening `fileName` (see the file comment): from the click's timeStamp to the
 * end of the first frame with every thumbnail in the document.
 */
async function measureOpen(page: Page, fileName: string): Promise<number> {
  await page.goto('/');
  await page.getByRole('button', { name: 'Open…' }).click();
  const choice = page.getByTestId('project-chooser').getByTestId('project-choice').filter({ hasText: fileName });
  await choice.waitFor();
  await page.evaluate((expected) => {
    const w = window as unknown as { __openMs: Promise<number> };
    w.__openMs = new Promise((resolve) => {
      window.addEventListener('click', (event) => {
        const clicked = event.timeStamp;
        const poll = () => {
          if (document.querySelectorAll('[data-testid="letter-thumbnail"] path').length < expected) {
            requestAnimationFrame(poll);
            return;
          }
          // The thumbnails are in the document before this frame's rendering: time the end of it.
          requestAnimationFrame(() => {
            const channel = new MessageChannel();
            channel.port1.onmessage = () => resolve(performance.now() - clicked);
            channel.port2.postMessage(null);
          });
        };
        requestAnimationFrame(poll);
      }, { capture: true, once: true });
    });
  }, SHEET_LETTER_COUNT);
  await choice.click();
  return page.evaluate(() => (window as unknown as { __openMs: Promise<number> }).__openMs);
}

/** Runs both measurements; lines to print and the tasks for bench.json. A skip when Chromium or the build is missing. */
export async function measureEditor(): Promise<EditorMeasurement> {
  const missing = missingRequirement();
  if (missing) return { lines: [missing], tasks: [] };
  const workspace = mkdtempSync(join(tmpdir(), 'stemline-bench-'));
  const untitled = mkdtempSync(join(tmpdir(), 'stemline-bench-recovery-'));
  let host: BrowserHost | undefined;
  let browser: Browser | undefined;
  try {
    host = await startBrowserHost(RENDERER_BUILD_DIR, BENCH_HOST_PORT, { workspace, untitledFolder: untitled });
    browser = await chromium.launch({ executablePath: CHROMIUM.path, headless: true, args: CHROMIUM_ARGS });
    const context = await browser.newContext({ baseURL: host.url, viewport: VIEWPORT });
    context.setDefaultTimeout(SETUP_TIMEOUT_MS);
    // tsx compiles this file with esbuild's keepNames, which wraps named functions in
    // __name(fn, "name") — also inside the functions handed to page.evaluate, where
    // the helper does not exist. An identity __name in the page makes them run as written.
    await context.addInitScript('globalThis.__name = (fn) => fn;');
    const page = await context.newPage();
    page.on('crash', () => console.error('editor: the page crashed.'));
    page.on('pageerror', (error) => console.error(`editor: the page threw: ${error.message}`));

    const dense = await prepareDragProject(page, workspace);
    const drag = await measureDrag(browser, page, dense);

    await fitSheet(page, await hundredLetterSheetPng(), sheetCharacters(), `${SHEET_LETTER_COUNT} letters in`);
    await saveAs(page, 'hundred');
    const opens: number[] = [];
    for (let run = 0; run < OPEN_RUNS; run++) opens.push(await measureOpen(page, 'hundred.stemline'));

    const dragTask = measured(DRAG_TASK, drag.handler);
    const inputTask = measured(DRAG_INPUT_TASK, drag.input);
    const openTask = measured(OPEN_TASK, opens);
    return {
      tasks: [dragTask, inputTask, openTask],
      lines: [
        `drag frame median ${dragTask.medianMs.toFixed(1)} ms, p95 ${dragTask.p95Ms.toFixed(1)} ms (${DRAG_GLYPH_SEGMENTS}-segment glyph, ${DRAG_MOVES} moves; goal ≤ ${DRAG_MEDIAN_GOAL_MS} ms, ≤ ${DRAG_P95_GOAL_MS} ms)`,
        `  from the event's timeStamp (adds the wait for the frame the move is aligned to): median ${inputTask.medianMs.toFixed(1)} ms, p95 ${inputTask.p95Ms.toFixed(1)} ms`,
        `open ${SHEET_LETTER_COUNT}-glyph project: ${openTask.medianMs.toFixed(0)} ms to first paint (median of ${OPEN_RUNS}: ${opens.map((ms) => ms.toFixed(0)).join(', ')} ms; goal ≤ ${OPEN_GOAL_MS} ms)`,
      ],
    };
  } finally {
    await browser?.close();
    await host?.close();
    rmSync(workspace, { recursive: true, force: true });
    rmSync(untitled, { recursive: true, force: true });
  }
}
