// A newcomer's whole first session, in the real page against the real host: from the
// demo, start a new project; open the demo's own scan through the page's "Open a scan…";
// see its 70 letters boxed and labelled where the demo draws them; fit them and look
// at them all; open "a", drag an on-curve point and watch the outline and its
// curvature combs follow; undo, and the letter is exactly as it was; proof a line in
// the font the letters make; export that font and read it back. Each step leaves a
// screenshot in the test's output folder. With STEMLINE_README_SHOTS=1 three of them
// are also written to docs/images/ for the README's tour, at a fixed window size.
import { test, expect, type Page, type TestInfo } from '@playwright/test';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import opentype from 'opentype.js/dist/opentype.js';
import { checkRequirement, CHROMIUM } from '../support/require-tool.ts';
import { expectAcceptedCffFont } from './exported-font.ts';
import { startBrowserHost, type BrowserHost } from '../../electron/browser-host.ts';
import { RENDERER_BUILD_DIR } from '../../electron/project-paths.ts';
import { DEMO_SHEETS_FOLDER, readDemoManifest } from '../../electron/demo/demo-files.ts';
import { DEMO_SHEETS } from '../../electron/demo/demo-scenario.ts';
import { splitCharacters } from '../../core/raster/index.ts';

const chromium = checkRequirement(CHROMIUM);

/** The window size of every step, so the README's images are the same size each time they are made. */
const VIEWPORT = { width: 1280, height: 800 } as const;
/** Set to 1 to write the README's images (docs/images/) from this run. */
const README_SHOTS = process.env.STEMLINE_README_SHOTS === '1';
/** Where the README's images go, and which step's screenshot each one is. */
const README_IMAGES = fileURLToPath(new URL('../../docs/images/', import.meta.url));
const README_SHOT_OF_STEP: Readonly<Record<string, string>> = {
  '03-sheet-assigned': 'sheet.png',
  '05-letter-a': 'letter.png',
  '08-proof': 'proof.png',
};
/** The most a README image may weigh: our own limit, so the repository stays light to clone. */
const README_IMAGE_MAX_BYTES = 400 * 1024;
/** Where a PNG's width and height sit: the IHDR chunk, first after the 8-byte signature (PNG specification, 11.2.2). */
const PNG_WIDTH_OFFSET = 16;
const PNG_HEIGHT_OFFSET = 20;

/** Opening the 600-dpi sheet and fitting its 70 letters in the page's worker, on a slow shared machine (about 3 s here). */
const SHEET_WORK_TIMEOUT_MS = 60_000;
/** The proof's first build: the host's build plus the browser's load, on a loaded machine. */
const FIRST_BUILD_WAIT_MS = 15_000;
/** How far the point is dragged, CSS pixels: far enough to change the letter visibly at the whole-letter zoom. */
const DRAG_PX = { x: 36, y: -28 } as const;
/** Pointer moves in the drag, so the comb is redrawn along the way as under a hand. */
const DRAG_STEPS = 8;
/** The proof line: the shop of the demo's story, every character of which is drawn on its sheet, short enough to fit the window at 96 px. */
const PROOF_TEXT = 'Pellworth & Daughters';

interface Box {
  readonly character: string;
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

/** Every letter box on the sheet with its label, in the sheet's pixels. */
async function letterBoxes(page: Page): Promise<Box[]> {
  return page.getByTestId('letter-box').evaluateAll((groups) =>
    groups.map((g) => {
      const rect = g.querySelector('rect')!;
      const n = (name: string) => Number(rect.getAttribute(name));
      return { character: g.getAttribute('data-character') ?? '', x: n('x'), y: n('y'), width: n('width'), height: n('height') };
    }),
  );
}

/** What the one-letter canvas draws of the outline: every point mark in font units, the outline path and the combs. */
async function drawnLetter(page: Page) {
  const marks = await page.locator('[data-testid="on-curve-point"], [data-testid="handle"]').evaluateAll((elements) =>
    elements.map((e) => ({
      kind: e.getAttribute('data-testid'),
      role: e.getAttribute('data-role'),
      contour: Number(e.getAttribute('data-contour')),
      point: Number(e.getAttribute('data-point')),
      x: Number(e.getAttribute('data-x')),
      y: Number(e.getAttribute('data-y')),
    })),
  );
  const d = (testId: string) => page.getByTestId(testId).getAttribute('d');
  // The combs are drawn in two layers, the segments standing still and those a drag moves; which layer a segment is in
  // does not change what is drawn, so the combs are compared as the set of their sub-paths.
  const layers = [await d('comb-teeth'), await d('comb-envelope'), await d('comb-teeth-moving'), await d('comb-envelope-moving')];
  const combs = layers.flatMap((path) => (path ?? '').split(/(?=M)/).map((s) => s.trim()).filter((s) => s !== '')).sort();
  return { marks, outline: await d('outline'), combs };
}

test.describe('a newcomer’s first session, from a new project to an exported font', () => {
  test.skip(!chromium.available, chromium.message);
  test.use({ viewport: VIEWPORT });
  test.setTimeout(SHEET_WORK_TIMEOUT_MS * 3);

  let host: BrowserHost;
  let workspace: string;
  test.beforeAll(async () => {
    // A host of its own that offers the demo, as `npm start` does (the suite's shared host has none).
    workspace = mkdtempSync(join(tmpdir(), 'stemline-journey-'));
    const token = process.env.STEMLINE_BROWSER_TOKEN;
    host = await startBrowserHost(RENDERER_BUILD_DIR, 0, { workspace, untitledFolder: join(workspace, 'recovery'), ...(token ? { token } : {}) });
  });
  test.afterAll(async () => {
    await host.close();
  });

  test('imports the demo scan into a new project, edits "a", proofs and exports a font that passes the sanitizer', async ({ page }, testInfo: TestInfo) => {
    const problems: string[] = [];
    page.on('pageerror', (error) => problems.push(error.message));
    const shot = async (step: string) => {
      const path = testInfo.outputPath(`${step}.png`);
      await page.screenshot({ path });
      const readme = README_SHOT_OF_STEP[step];
      if (README_SHOTS && readme) {
        const png = readFileSync(path);
        expect(png.length, `${readme} is light enough for the README`).toBeLessThan(README_IMAGE_MAX_BYTES);
        expect([png.readUInt32BE(PNG_WIDTH_OFFSET), png.readUInt32BE(PNG_HEIGHT_OFFSET)], `${readme} is the window's size`).toEqual([VIEWPORT.width, VIEWPORT.height]);
        mkdirSync(README_IMAGES, { recursive: true });
        copyFileSync(path, join(README_IMAGES, readme));
      }
    };
    const manifest = await readDemoManifest();
    const sheet = manifest.sheets[0]!;
    const characters = splitCharacters(sheet.characters);

    await test.step('starts a new project from the demo', async () => {
      await page.goto(`${new URL(host.url).origin}/`);
      await expect(page.getByTestId('demo-banner')).toBeVisible();
      await page.getByRole('button', { name: 'Start a new project from your own scans' }).click();
      await expect(page.getByRole('heading', { level: 1 })).toHaveText('Untitled project');
      await expect(page.getByTestId('empty-note')).toBeVisible();
      await expect(page.getByRole('button', { name: 'Open the demo project' })).toBeVisible();
      await shot('01-new-project');
    });

    await test.step('opens the demo’s scan through “Open a scan…”, and finds its letters in their rows', async () => {
      const chooser = page.waitForEvent('filechooser');
      await page.getByRole('button', { name: 'Open a scan…' }).click();
      await (await chooser).setFiles(join(DEMO_SHEETS_FOLDER, sheet.png));
      await expect(page.getByTestId('letter-count')).toHaveText(`${characters.length} letters in ${DEMO_SHEETS[0]!.rows.length} rows`, { timeout: SHEET_WORK_TIMEOUT_MS });
      await expect(page.getByTestId('letter-box')).toHaveCount(characters.length);
      await shot('02-sheet-found');
    });

    await test.step('assigns the characters, and each lands on the letter the demo drew there', async () => {
      await page.getByLabel('Characters on the sheet, in reading order').fill(sheet.characters);
      await page.getByRole('button', { name: 'Assign' }).click();
      await expect(page.getByTestId('assigned-count')).toHaveText(`${characters.length} of ${characters.length} letters assigned`);
      const boxes = await letterBoxes(page);
      const box = (c: string) => {
        const found = boxes.filter((b) => b.character === c);
        expect(found, `one box labelled ${c}`).toHaveLength(1);
        return found[0]!;
      };
      const centreY = (b: Box) => b.y + b.height / 2;
      const bottom = (b: Box) => b.y + b.height;
      // The rows as electron/demo/demo-scenario.ts lays them out: each row's first and last letter, left to right on one line, rows going down.
      const rows = DEMO_SHEETS[0]!.rows.map((row) => splitCharacters(row));
      for (const [r, row] of rows.entries()) {
        const first = box(row[0]!);
        const last = box(row.at(-1)!);
        expect(first.x, `${row[0]} starts row ${r + 1}`).toBe(Math.min(...row.map((c) => box(c).x)));
        expect(last.x, `${row.at(-1)} ends row ${r + 1}`).toBe(Math.max(...row.map((c) => box(c).x)));
        if (r > 0) expect(centreY(box(row[0]!)), `row ${r + 1} is below row ${r}`).toBeGreaterThan(bottom(box(rows[r - 1]![0]!)));
      }
      // Shapes that tell a shifted assignment at once: descenders reach below x-height letters' feet, ascenders above their tops,
      // I and l are narrow beside M and m, the full stop is the smallest mark, Q's tail drops below O.
      expect(bottom(box('g'))).toBeGreaterThan(bottom(box('a')) + box('a').height / 4);
      expect(bottom(box('p'))).toBeGreaterThan(bottom(box('o')) + box('o').height / 4);
      expect(box('l').y).toBeLessThan(box('a').y - box('a').height / 4);
      expect(box('I').width).toBeLessThan(box('M').width / 3);
      expect(box('l').width).toBeLessThan(box('m').width / 3);
      expect(box('Q').height).toBeGreaterThan(box('O').height);
      const area = (b: Box) => b.width * b.height;
      expect(Math.min(...boxes.map(area))).toBe(Math.min(area(box('.')), area(box("'")), area(box(','))));
      await shot('03-sheet-assigned');
    });

    await test.step('fits the letters and shows them all at a glance', async () => {
      await page.getByRole('button', { name: 'Fit the assigned letters' }).click();
      await expect(page.getByRole('heading', { name: 'Letters at a glance' })).toBeVisible({ timeout: SHEET_WORK_TIMEOUT_MS });
      await expect(page.getByTestId('glance-count')).toHaveText(`${characters.length} letters fitted`);
      const shown = await page.getByTestId('letter-thumbnail').evaluateAll((buttons) => buttons.map((b) => b.getAttribute('data-character')));
      expect([...shown].sort()).toEqual([...characters].sort());
      await shot('04-letters-at-a-glance');
    });

    let before!: Awaited<ReturnType<typeof drawnLetter>>;
    await test.step('opens “a” over its scan, with its points, handles and combs', async () => {
      await page.getByTestId('letter-thumbnail').and(page.locator('[data-character="a"]')).click();
      await expect(page.getByRole('heading', { level: 1 })).toHaveText('a');
      await expect(page.getByTestId('on-curve-point').first()).toBeVisible();
      expect(Number(await page.getByTestId('letter-canvas').getAttribute('data-comb-teeth'))).toBeGreaterThan(0);
      await expect(page.getByTestId('comb-envelope')).toHaveAttribute('d', /^M.+L/);
      before = await drawnLetter(page);
      expect(before.marks.filter((m) => m.kind === 'on-curve-point').length).toBeGreaterThan(4);
      await shot('05-letter-a');
    });

    await test.step('drags an on-curve point: the outline and the combs follow', async () => {
      // A smooth point, so its handles and the curves either side of it all move and the combs change.
      const point = page.locator('[data-testid="on-curve-point"][data-role="smooth"]').first();
      const contour = await point.getAttribute('data-contour');
      const index = await point.getAttribute('data-point');
      const the = page.locator(`[data-testid="on-curve-point"][data-contour="${contour}"][data-point="${index}"]`);
      const box = (await the.boundingBox())!;
      const start = { x: box.x + box.width / 2, y: box.y + box.height / 2 };
      await page.mouse.move(start.x, start.y);
      await page.mouse.down();
      await page.mouse.move(start.x + DRAG_PX.x, start.y + DRAG_PX.y, { steps: DRAG_STEPS });
      await page.mouse.up();
      await expect(page.getByTestId('undo-steps')).toHaveText('1 edit to undo');
      const after = await drawnLetter(page);
      const moved = after.marks.find((m) => m.kind === 'on-curve-point' && m.contour === Number(contour) && m.point === Number(index))!;
      const was = before.marks.find((m) => m.kind === 'on-curve-point' && m.contour === Number(contour) && m.point === Number(index))!;
      expect(moved.x).toBeGreaterThan(was.x);
      expect(moved.y).toBeGreaterThan(was.y); // font units grow upward; the mouse went up
      expect(after.outline).not.toBe(before.outline);
      expect(after.combs).not.toEqual(before.combs);
      await shot('06-letter-dragged');
    });

    await test.step('undo puts the letter back exactly', async () => {
      await page.getByTestId('undo').click();
      await expect(page.getByTestId('undo-steps')).toHaveText('0 edits to undo');
      expect(await drawnLetter(page)).toEqual(before);
      await shot('07-letter-undone');
    });

    await test.step('sets a line in the font the letters make', async () => {
      await page.getByTestId('proof-toggle').click();
      await expect(page.getByTestId('proof-state')).toHaveAttribute('data-phase', 'ready', { timeout: FIRST_BUILD_WAIT_MS });
      await page.getByTestId('proof-text').fill(PROOF_TEXT);
      const line = page.locator('[data-testid="proof-line"][data-size="96"]');
      await expect(line).toHaveText(PROOF_TEXT);
      await expect(page.getByTestId('missing-characters')).toHaveCount(0);
      const family = (await line.getAttribute('data-family'))!;
      const set = await page.evaluate(
        ({ family, text }) => {
          const g = document.createElement('canvas').getContext('2d')!;
          const width = (font: string, s: string) => {
            g.font = font;
            return g.measureText(s).width;
          };
          const face = [...document.fonts].find((f) => f.family === family || f.family === `"${family}"`);
          const letters = [...new Set(text.replace(/ /g, ''))];
          return {
            status: face?.status ?? 'absent',
            widths: Object.fromEntries(letters.map((c) => [c, width(`96px "${family}"`, c)])),
            proof: width(`96px "${family}"`, text),
            fallback: width('96px sans-serif', text),
          };
        },
        { family, text: PROOF_TEXT },
      );
      expect(set.status).toBe('loaded');
      for (const [c, w] of Object.entries(set.widths)) expect(w, `width of ${c} in the proof font`).toBeGreaterThan(0);
      expect(set.proof).not.toBeCloseTo(set.fallback, 0);
      await shot('08-proof');
    });

    await test.step('exports the font, which passes the sanitizer and holds every letter as drawn', async () => {
      await page.getByTestId('export-font').click();
      const chooser = page.getByTestId('font-export-chooser');
      await expect(chooser).toBeVisible();
      await chooser.getByLabel('File name').fill('first-font');
      await shot('09-export-chooser');
      await chooser.getByRole('button', { name: 'Export', exact: true }).click();
      const path = join(workspace, 'first-font.otf');
      await expect(page.getByTestId('export-status')).toHaveText(`Exported first-font.otf to ${path}`);
      await shot('10-exported');
      const bytes = expectAcceptedCffFont(path, testInfo);
      // Read back by opentype.js, a reader independent of the page: every character drawn has its own glyph with ink and an advance.
      const font = opentype.parse(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
      for (const c of characters) {
        const glyph = font.charToGlyph(c);
        expect(glyph.index, `${c} is mapped`).toBeGreaterThan(0);
        expect(glyph.advanceWidth ?? 0, `${c} has an advance`).toBeGreaterThan(0);
        expect(glyph.path.commands.length, `${c} has an outline`).toBeGreaterThan(2);
      }
      // The "a" written is the "a" on screen after the undo: the same on-curve points, in font units.
      const onCurve = (points: { x: number; y: number }[]) => points.map((p) => `${p.x},${p.y}`).sort();
      const written = font.charToGlyph('a').path.commands.flatMap((command) => ('x' in command ? [{ x: command.x, y: command.y }] : []));
      const drawn = before.marks.filter((m) => m.kind === 'on-curve-point');
      expect([...new Set(onCurve(written))]).toEqual([...new Set(onCurve(drawn))]);
    });
    expect(problems).toEqual([]);
  });
});
