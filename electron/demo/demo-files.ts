// The demo's files as shipped: the sheets in electron/demo/sheets/ (a greyscale PNG
// and a 1-bit Group 4 TIFF of each) and the manifest listing them, their characters
// in reading order and the hash of the pixels the generator drew, so a sheet that no
// longer matches its generator is caught by the tests instead of going stale.
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The manifest's file name inside the sheets folder. */
export const DEMO_MANIFEST_NAME = 'demo-sheets.json';

/**
 * Where the shipped sheets and their manifest live: beside this file when it runs
 * from source (tsx: the CLI, the browser host, the tests); when it runs compiled
 * into build/electron/electron/demo/ (the desktop shell, which tsc builds without
 * copying assets), the same folder of the source tree, three levels up.
 */
export const DEMO_SHEETS_FOLDER = [new URL('./sheets/', import.meta.url), new URL('../../../electron/demo/sheets/', import.meta.url)]
  .map((url) => fileURLToPath(url))
  .find((folder) => existsSync(join(folder, DEMO_MANIFEST_NAME))) ?? fileURLToPath(new URL('./sheets/', import.meta.url));

/** One shipped sheet as the manifest lists it. */
export interface DemoManifestSheet {
  /** The greyscale scan, e.g. "pellworth-alphabet.png". */
  readonly png: string;
  /** The same scan as a 1-bit CCITT Group 4 TIFF, as an office scanner writes it. */
  readonly tiff: string;
  /** The characters drawn, in reading order, rows separated by spaces. */
  readonly characters: string;
  /** Pixel size and resolution. */
  readonly width: number;
  readonly height: number;
  readonly dpi: number;
  /** SHA-256 (hex) of the greyscale pixels, row-major, one byte each: what the generator drew. */
  readonly greySha256: string;
}

export interface DemoManifest {
  readonly title: string;
  readonly description: string;
  readonly familyName: string;
  readonly sheets: readonly DemoManifestSheet[];
}

/** SHA-256 (hex) of raw pixel bytes. */
export function pixelHash(data: Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

/** Reads the manifest of the shipped demo. Throws an Error saying how to regenerate it when it is missing or unreadable. */
export async function readDemoManifest(folder: string = DEMO_SHEETS_FOLDER): Promise<DemoManifest> {
  const path = join(folder, DEMO_MANIFEST_NAME);
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch {
    throw new Error(`The demo's sheets are missing (no ${path}). Run "npx tsx electron/demo/generate-demo-sheets.ts" to draw them again.`);
  }
  const manifest = JSON.parse(text) as DemoManifest;
  if (!Array.isArray(manifest.sheets) || manifest.sheets.length === 0) throw new Error(`${path} lists no sheets. Run "npx tsx electron/demo/generate-demo-sheets.ts" to draw them again.`);
  return manifest;
}
