// The window opens where the user left it, with real files in a temporary folder: the
// state is written atomically and read back validated (a damaged, foreign or huge
// file is ignored), and a place no longer on any display is moved onto one.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEFAULT_WINDOW_SIZE, placeWindow, readWindowState, windowStatePath, writeWindowState, type DisplayArea } from '../../electron/shell/window-state.ts';
import { MIN_WINDOW_SIZE } from '../../electron/shell/window-options.ts';

function folder(): string {
  return mkdtempSync(join(tmpdir(), 'stemline-window-'));
}

/** A 1920×1080 laptop screen less a 40-pixel task bar, and a 2560×1440 monitor to its right. */
const LAPTOP: DisplayArea = { x: 0, y: 0, width: 1920, height: 1040 };
const MONITOR: DisplayArea = { x: 1920, y: 0, width: 2560, height: 1440 };

describe('remembered window place', () => {
  it('reads back what was written, and leaves no temporary file behind', async () => {
    const dir = folder();
    const path = windowStatePath(dir);
    await writeWindowState(path, { x: 100.4, y: 50, width: 1000, height: 700, maximized: true });
    expect(await readWindowState(path)).toEqual({ x: 100, y: 50, width: 1000, height: 700, maximized: true });
    expect(readdirSync(dir)).toEqual(['window-state.json']);
  });

  it('is nothing when there is no file yet', async () => {
    expect(await readWindowState(windowStatePath(folder()))).toBeNull();
  });

  it('ignores a damaged, foreign, out-of-range or oversized file instead of trusting it', async () => {
    const dir = folder();
    const path = windowStatePath(dir);
    const bad = [
      '{"format":"stemline-window-state","version":1,"bounds":{"width":',
      '{"format":"other","version":1,"bounds":{"width":800,"height":600}}',
      '{"format":"stemline-window-state","version":2,"bounds":{"width":800,"height":600}}',
      '{"format":"stemline-window-state","version":1,"bounds":{"width":-5,"height":600}}',
      '{"format":"stemline-window-state","version":1,"bounds":{"width":800,"height":600.5}}',
      '{"format":"stemline-window-state","version":1,"bounds":{"width":1e9,"height":600}}',
      '{"format":"stemline-window-state","version":1,"bounds":{"width":"800","height":600}}',
      '{"format":"stemline-window-state","version":1,"bounds":{"width":800,"height":600,"preload":"/tmp/evil.js"}}',
      `{"format":"stemline-window-state","version":1,"bounds":{"width":800,"height":600},"pad":"${'x'.repeat(5000)}"}`,
      'null',
    ];
    for (const text of bad) {
      writeFileSync(path, text);
      expect(await readWindowState(path), text.slice(0, 90)).toBeNull();
    }
  });

  it('keeps a place that is on a display', () => {
    expect(placeWindow({ x: 2000, y: 100, width: 1400, height: 900 }, [LAPTOP, MONITOR], LAPTOP)).toEqual({ x: 2000, y: 100, width: 1400, height: 900 });
  });

  it('moves a window last seen on an unplugged monitor to the middle of the primary display', () => {
    const placed = placeWindow({ x: 2000, y: 100, width: 1400, height: 900 }, [LAPTOP], LAPTOP);
    expect(placed).toEqual({ x: 260, y: 70, width: 1400, height: 900 });
  });

  it('moves a window whose title bar is above the top of the screen (it could not be dragged) onto it', () => {
    const placed = placeWindow({ x: 100, y: -500, width: 1000, height: 700 }, [LAPTOP], LAPTOP);
    expect(placed.y).toBeGreaterThanOrEqual(LAPTOP.y);
    expect(placed.y! + placed.height).toBeLessThanOrEqual(LAPTOP.y + LAPTOP.height);
  });

  it('shrinks a window larger than its display to fit the display holding most of its title bar, and pulls it inside', () => {
    const placed = placeWindow({ x: 1800, y: 0, width: 3000, height: 2000 }, [LAPTOP, MONITOR], LAPTOP);
    expect(placed).toEqual({ x: 1920, y: 0, width: 2560, height: 1440 });
    // Title bar across 100–3100: 1820 DIPs of it on the laptop, 1180 on the monitor.
    expect(placeWindow({ x: 100, y: 0, width: 3000, height: 2000 }, [LAPTOP, MONITOR], LAPTOP)).toEqual({ x: 0, y: 0, width: 1920, height: 1040 });
  });

  it('opens the default size centred on the primary display when nothing is remembered, never below the smallest size that works', () => {
    expect(placeWindow(null, [LAPTOP], LAPTOP)).toEqual({ x: 320, y: 110, width: DEFAULT_WINDOW_SIZE.width, height: DEFAULT_WINDOW_SIZE.height });
    const small = placeWindow({ width: 200, height: 100 }, [LAPTOP], LAPTOP);
    expect(small.width).toBe(MIN_WINDOW_SIZE.width);
    expect(small.height).toBe(MIN_WINDOW_SIZE.height);
  });

  it('keeps the maximised flag', () => {
    expect(placeWindow({ x: 0, y: 0, width: 1000, height: 700, maximized: true }, [LAPTOP], LAPTOP).maximized).toBe(true);
  });

  it('writes the file in the documented format', async () => {
    const path = windowStatePath(folder());
    await writeWindowState(path, { width: 900, height: 600 });
    expect(JSON.parse(readFileSync(path, 'utf8'))).toEqual({ format: 'stemline-window-state', version: 1, bounds: { width: 900, height: 600 } });
  });
});
