// `npx tsx electron/demo/generate-demo-sheets.ts [FOLDER]`: draws every demo sheet
// (demo-scenario.ts) from its seed and writes, into electron/demo/sheets/ or FOLDER,
// a greyscale PNG and a 1-bit CCITT Group 4 TIFF of each, with the manifest
// (demo-files.ts). The output is committed, so `npm start` needs no generation step;
// run this again after changing a skeleton, the pen or the paper, and commit the
// new sheets with the change (the tests fail until then).
import sharp from 'sharp';
import { mkdir, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { DEMO_DESCRIPTION, DEMO_FAMILY_NAME, DEMO_SHEETS, DEMO_TITLE, sheetCharacters, type DemoSheetSpec } from './demo-scenario.ts';
import { renderDemoSheet, type DemoSheetRaster } from './demo-sheet.ts';
import { DEMO_MANIFEST_NAME, DEMO_SHEETS_FOLDER, pixelHash, type DemoManifest, type DemoManifestSheet } from './demo-files.ts';

/**
 * Grey level below which a pixel is ink in the 1-bit copy: halfway between black and
 * white. The demo's paper never falls below about 215 and its solid ink sits near
 * 30, so any level between them gives the same letters; halfway keeps the ink's
 * anti-aliased edge where the eye puts it.
 */
export const BILEVEL_THRESHOLD = 128;

/** Millimetres per inch: TIFF resolution is given to sharp in pixels per millimetre. */
const MM_PER_INCH = 25.4;

/** The PNG of a sheet: 8-bit grey at maximum zlib compression, with its resolution recorded (pHYs). */
export function sheetPng(raster: DemoSheetRaster): Promise<Buffer> {
  return sharp(Buffer.from(raster.data), { raw: { width: raster.width, height: raster.height, channels: 1 } })
    .png({ compressionLevel: 9 })
    .withMetadata({ density: raster.dpi })
    .toBuffer();
}

/** The sheet's pixels as a 1-bit scan gives them: 0 below BILEVEL_THRESHOLD, 255 from it up. */
export function bilevelPixels(raster: DemoSheetRaster): Uint8Array {
  return raster.data.map((grey) => (grey < BILEVEL_THRESHOLD ? 0 : 255));
}

/** The 1-bit CCITT Group 4 TIFF of a sheet (libvips writes Group 4 only from a one-band b-w image at 1 bit). */
export function sheetTiff(raster: DemoSheetRaster): Promise<Buffer> {
  return sharp(Buffer.from(bilevelPixels(raster)), { raw: { width: raster.width, height: raster.height, channels: 1 } })
    .toColourspace('b-w')
    .tiff({ compression: 'ccittfax4', bitdepth: 1, xres: raster.dpi / MM_PER_INCH, yres: raster.dpi / MM_PER_INCH })
    .toBuffer();
}

/** Draws `spec` and writes its PNG and TIFF into `folder`; returns its manifest entry. */
export async function writeSheet(spec: DemoSheetSpec, folder: string): Promise<DemoManifestSheet> {
  const raster = renderDemoSheet(spec);
  const png = `${spec.name}.png`;
  const tiff = `${spec.name}.tif`;
  await writeFile(join(folder, png), await sheetPng(raster));
  await writeFile(join(folder, tiff), await sheetTiff(raster));
  return { png, tiff, characters: sheetCharacters(spec), width: raster.width, height: raster.height, dpi: raster.dpi, greySha256: pixelHash(raster.data) };
}

async function main(): Promise<void> {
  const folder = resolve(process.argv[2] ?? DEMO_SHEETS_FOLDER);
  await mkdir(folder, { recursive: true });
  const sheets: DemoManifestSheet[] = [];
  for (const spec of DEMO_SHEETS) {
    const entry = await writeSheet(spec, folder);
    sheets.push(entry);
    console.log(`wrote ${entry.png} and ${entry.tiff}: ${entry.width} × ${entry.height} px at ${entry.dpi} dpi, ${entry.characters.replace(/\s/g, '').length} letters`);
  }
  const manifest: DemoManifest = { title: DEMO_TITLE, description: DEMO_DESCRIPTION, familyName: DEMO_FAMILY_NAME, sheets };
  await writeFile(join(folder, DEMO_MANIFEST_NAME), `${JSON.stringify(manifest, null, 2)}\n`);
  console.log(`wrote ${DEMO_MANIFEST_NAME} in ${folder}`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : String(error));
    process.exit(1);
  });
}
