// The window's size and position, remembered between runs: written atomically to the
// app's per-user folder when a window moves, resizes or closes; read back validated
// (a damaged or foreign file is ignored, never trusted); and placed on a display that
// is there now, so a window last seen on an unplugged monitor does not open off-screen.
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import * as v from 'valibot';
import { writeFileAtomic } from '../io/atomic-write.ts';
import { MIN_WINDOW_SIZE } from './window-options.ts';

/** Where a window is: its outer rectangle in screen DIPs, and whether it was maximised. No position: centre it. */
export interface WindowBounds {
  x?: number;
  y?: number;
  width: number;
  height: number;
  maximized?: boolean;
}

/** A display's work area (the screen less task bars and docks), as Electron's screen module reports it. */
export interface DisplayArea {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The file in the app's folder holding the last window state. */
export const WINDOW_STATE_FILE_NAME = 'window-state.json';

/** The format tag and version the file is written with. */
const WINDOW_STATE_FORMAT = 'stemline-window-state';
const WINDOW_STATE_VERSION = 1;

/** Opening size in CSS pixels when nothing is remembered: room for a glyph canvas beside its panels. */
export const DEFAULT_WINDOW_SIZE = { width: 1280, height: 820 } as const;

/**
 * Largest coordinate or size taken from the file: 32767, the largest 16-bit signed
 * value, beyond any desktop of today (X11 and Windows limit screen coordinates to it).
 */
const MAX_COORDINATE = 32767;

/**
 * How much of the title bar must lie on a display for the remembered place to be used:
 * 64 DIPs across and the top 32 DIPs down — enough to grab and drag it (rule of thumb,
 * common practice in window-state libraries).
 */
const MIN_VISIBLE = { width: 64, height: 32 } as const;

/** The largest file read back: a window state is a few dozen bytes. */
const MAX_STATE_FILE_BYTES = 4096;

const coordinate = v.pipe(v.number(), v.integer(), v.minValue(-MAX_COORDINATE), v.maxValue(MAX_COORDINATE));
const size = v.pipe(v.number(), v.integer(), v.minValue(1), v.maxValue(MAX_COORDINATE));

const stateFileSchema = v.object({
  format: v.literal(WINDOW_STATE_FORMAT),
  version: v.literal(WINDOW_STATE_VERSION),
  bounds: v.strictObject({ x: v.optional(coordinate), y: v.optional(coordinate), width: size, height: size, maximized: v.optional(v.boolean()) }),
});

/** The window-state file in the app's per-user folder. */
export function windowStatePath(appFolder: string): string {
  return join(appFolder, WINDOW_STATE_FILE_NAME);
}

/** The remembered bounds, or null when there is no file or it is not a valid window state (it is then ignored). */
export async function readWindowState(path: string): Promise<WindowBounds | null> {
  let text: string;
  try {
    const bytes = await readFile(path);
    if (bytes.length > MAX_STATE_FILE_BYTES) return null;
    text = bytes.toString('utf8');
  } catch {
    return null;
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return null;
  }
  const parsed = v.safeParse(stateFileSchema, raw);
  return parsed.success ? parsed.output.bounds : null;
}

/** Writes `bounds` to `path` atomically (a reader never sees half a file), creating nothing else. */
export async function writeWindowState(path: string, bounds: WindowBounds): Promise<void> {
  const clean: WindowBounds = { width: Math.round(bounds.width), height: Math.round(bounds.height) };
  if (bounds.x !== undefined && bounds.y !== undefined) {
    clean.x = Math.round(bounds.x);
    clean.y = Math.round(bounds.y);
  }
  if (bounds.maximized === true) clean.maximized = true;
  await writeFileAtomic(path, `${JSON.stringify({ format: WINDOW_STATE_FORMAT, version: WINDOW_STATE_VERSION, bounds: clean })}\n`);
}

function overlap(aStart: number, aLength: number, bStart: number, bLength: number): number {
  return Math.max(0, Math.min(aStart + aLength, bStart + bLength) - Math.max(aStart, bStart));
}

function clampSize(wanted: number, minimum: number, available: number): number {
  return Math.max(Math.min(minimum, available), Math.min(wanted, available));
}

/**
 * Where to open a window given the remembered `saved` bounds (or null) and the
 * displays there now (`primary` first among them): the remembered size and place when
 * its title bar is on a display, its size shrunk to fit that display; otherwise the
 * remembered (or default) size, shrunk to fit, centred on the primary display. Of
 * several displays the one holding most of the title bar is the window's.
 */
export function placeWindow(saved: WindowBounds | null, displays: readonly DisplayArea[], primary: DisplayArea): WindowBounds {
  const wanted = saved ?? { ...DEFAULT_WINDOW_SIZE };
  const maximized = wanted.maximized === true ? { maximized: true } : {};
  if (wanted.x !== undefined && wanted.y !== undefined) {
    const titleBar = { x: wanted.x, y: wanted.y, width: wanted.width, height: MIN_VISIBLE.height };
    // The display holding most of the title bar, if it holds enough of it to grab.
    let home: DisplayArea | undefined;
    let best = 0;
    for (const d of displays) {
      const across = overlap(titleBar.x, titleBar.width, d.x, d.width);
      const down = overlap(titleBar.y, titleBar.height, d.y, d.height);
      if (across >= MIN_VISIBLE.width && down >= MIN_VISIBLE.height && across * down > best) {
        home = d;
        best = across * down;
      }
    }
    if (home !== undefined) {
      const width = clampSize(wanted.width, MIN_WINDOW_SIZE.width, home.width);
      const height = clampSize(wanted.height, MIN_WINDOW_SIZE.height, home.height);
      const x = Math.min(Math.max(wanted.x, home.x), home.x + home.width - width);
      const y = Math.min(Math.max(wanted.y, home.y), home.y + home.height - height);
      return { x, y, width, height, ...maximized };
    }
  }
  const width = clampSize(wanted.width, MIN_WINDOW_SIZE.width, primary.width);
  const height = clampSize(wanted.height, MIN_WINDOW_SIZE.height, primary.height);
  return {
    x: primary.x + Math.round((primary.width - width) / 2),
    y: primary.y + Math.round((primary.height - height) / 2),
    width,
    height,
    ...maximized,
  };
}
