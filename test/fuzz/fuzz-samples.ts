// The real files the fuzzing suites mutate: small copies of the demo sheets
// (electron/demo/sheets/) in every scan format Stemline reads, fonts cut down from
// Debian's Cantarell and DejaVu Sans to a few glyphs (by fontTools' subsetter) and
// one written by Stemline itself, and projects written by Stemline's own save.
// They are small on purpose, so thousands of cases run in seconds.
import sharp from 'sharp';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { checkRequirement, FONTTOOLS_PYTHON, REFERENCE_FONTS } from '../support/require-tool.ts';
import { DEBIAN_PYTHON } from '../font/fonttools.ts';
import { writeOtf } from '../../electron/io/font/write-font.ts';
import { LETTER_I, LETTER_O } from '../font/sample-fonts.ts';
import { saveProject } from '../../electron/io/project/project-file.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { embedScan } from '../../electron/io/project/embedded-scan.ts';
import type { ProjectData } from '../../electron/io/project/project-schema.ts';

export interface Sample {
  name: string;
  bytes: Uint8Array;
}

const SHEETS = fileURLToPath(new URL('../../electron/demo/sheets/', import.meta.url));

/** Width the demo sheets are scaled to: its 70 letters stay separate blobs a few pixels high, and a case decodes in about a millisecond. */
const SMALL_SHEET_WIDTH = 160;
/** The top left of the 1-bit sheet, holding its first letters, scaled to SMALL_SHEET_WIDTH. */
const CROP = { left: 0, top: 0, width: 1200, height: 800 };

/** Small scans made from the demo sheets: grey PNG, 1-bit PNG, 1-bit Group 4 TIFF, JPEG, WebP, LZW TIFF. */
export async function scanSamples(): Promise<Sample[]> {
  const png = readFileSync(join(SHEETS, 'pellworth-alphabet.png'));
  const tif = readFileSync(join(SHEETS, 'pellworth-alphabet.tif'));
  const small = () => sharp(png).resize({ width: SMALL_SHEET_WIDTH }).greyscale();
  const crop = () => sharp(tif).extract(CROP).resize({ width: SMALL_SHEET_WIDTH }).threshold(128);
  return [
    { name: 'sheet.png', bytes: await small().png().withMetadata({ density: 600 }).toBuffer() },
    { name: 'sheet-1bit.png', bytes: await crop().toColourspace('b-w').png({ palette: true, colours: 2 }).toBuffer() },
    { name: 'sheet-g4.tif', bytes: await crop().toColourspace('b-w').tiff({ compression: 'ccittfax4', bitdepth: 1, xres: 600 / 25.4, yres: 600 / 25.4, resolutionUnit: 'inch' }).toBuffer() },
    { name: 'sheet.jpg', bytes: await small().jpeg({ quality: 80 }).toBuffer() },
    { name: 'sheet.webp', bytes: await small().webp({ quality: 80 }).toBuffer() },
    { name: 'sheet-lzw.tif', bytes: await small().tiff({ compression: 'lzw' }).toBuffer() },
  ];
}

/** Characters the font samples keep: a counter, a stem, a descender, a diagonal. */
const SUBSET_TEXT = 'Aog';

/** Fonts: Stemline's own writing of two letters, and, when fontTools and the fonts are installed, Cantarell (CFF) and DejaVu Sans (TrueType) cut down to SUBSET_TEXT, each also as WOFF. */
export function fontSamples(): { samples: Sample[]; skipped: string[] } {
  const own = writeOtf({
    familyName: 'Fuzz Sample', styleName: 'Regular', unitsPerEm: 1000, ascender: 800, descender: -200, xHeight: 500, capHeight: 700,
    glyphs: [{ character: 'o', outline: LETTER_O, advanceWidth: 600 }, { character: 'I', outline: LETTER_I, advanceWidth: 280 }],
  });
  const samples: Sample[] = [{ name: 'own.otf', bytes: own }];
  const skipped: string[] = [];
  const tools = checkRequirement(FONTTOOLS_PYTHON);
  const folder = mkdtempSync(join(tmpdir(), 'stemline-fuzz-fonts-'));
  for (const [requirement, name] of [[REFERENCE_FONTS.cantarellRegular, 'cantarell'], [REFERENCE_FONTS.dejavuSans, 'dejavu']] as const) {
    const font = checkRequirement(requirement);
    if (!tools.available || !font.available) {
      skipped.push(tools.available ? font.message : tools.message);
      continue;
    }
    const extension = requirement.path.endsWith('.otf') ? 'otf' : 'ttf';
    for (const flavor of [undefined, 'woff'] as const) {
      const out = join(folder, `${name}.${flavor ?? extension}`);
      execFileSync(DEBIAN_PYTHON, ['-m', 'fontTools.subset', requirement.path, `--text=${SUBSET_TEXT}`, `--output-file=${out}`, ...(flavor ? [`--flavor=${flavor}`] : [])], { stdio: 'pipe' });
      samples.push({ name: `${name}.${flavor ?? extension}`, bytes: readFileSync(out) });
    }
  }
  return { samples, skipped };
}

/** Projects as Stemline's save writes them: empty, with glyphs and metrics, and with an embedded scan. */
export async function projectSamples(scan: Sample): Promise<Sample[]> {
  const folder = mkdtempSync(join(tmpdir(), 'stemline-fuzz-projects-'));
  const empty = newProject('Fuzz Empty');
  const withGlyphs: ProjectData = {
    ...newProject('Fuzz Letters'),
    glyphs: [
      { unicodes: ['0049'], advanceWidth: 280, outline: { contours: [[[90, 0, 'on'], [190, 0, 'on'], [190, 700, 'on'], [90, 700, 'on']]] } },
      { unicodes: ['006F'], advanceWidth: 600, outline: { contours: [[[290, -10, 'on-smooth'], [420, -10, 'off'], [530, 100, 'off'], [530, 250, 'on-smooth'], [530, 400, 'off'], [420, 510, 'off'], [290, 510, 'on-smooth'], [160, 510, 'off'], [50, 400, 'off'], [50, 250, 'on-smooth'], [50, 100, 'off'], [160, -10, 'off']]] } },
    ],
  };
  const withScan: ProjectData = { ...newProject('Fuzz Scan'), scans: [{ id: 'scan-1', path: 'sheet.png', characters: 'Aa', embedded: embedScan(scan.bytes) }] };
  const out: Sample[] = [];
  for (const [name, project] of [['empty', empty], ['letters', withGlyphs], ['scan', withScan]] as const) {
    const path = join(folder, `${name}.stemline`);
    await saveProject(path, project);
    out.push({ name: `${name}.stemline`, bytes: readFileSync(path) });
  }
  return out;
}
