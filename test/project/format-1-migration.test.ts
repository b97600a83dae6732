// Project files saved in format 1 (before a glyph could have several characters)
// still open: each glyph's one `character` becomes its list of code points, an
// embedded scan gains the SHA-256 of its bytes, the file on disk is left as it was,
// and saving writes format 2. A format 1 file with a wrong field is refused naming
// the field as the file spells it.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadProject, parseProject, saveProject } from '../../electron/io/project/project-file.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';

/** Bytes standing in for a scan embedded in the format 1 file. */
const SCAN_BYTES = Buffer.from('pretend these are the bytes of capitals.png');

/** A project as format 1 wrote it (the shape of project-schema.ts at format 1). */
function format1Project(glyphs: unknown[] = [
  { character: 'I', advanceWidth: 300, leftSidebearing: 50, outline: { contours: [[[50, 0, 'on'], [250, 0, 'on'], [250, 700, 'on'], [50, 700, 'on']]] }, source: { scan: 'sheet-1', letter: 0 } },
  { character: '', name: 'I.alt', advanceWidth: 320, outline: { contours: [] } },
  { character: '😀', advanceWidth: 1000, outline: { contours: [] } },
]): string {
  return JSON.stringify({
    format: 'stemline-project',
    formatVersion: 1,
    savedBy: 'Stemline 0.1.0',
    font: { familyName: 'Harbour Signs', styleName: 'Regular', unitsPerEm: 1000, capHeight: 700, xHeight: 500, ascender: 750, descender: -250, lineGap: 0 },
    fit: { tolerance: 1, cornerAngleDegrees: 40, axisSnapDegrees: 3 },
    scans: [{ id: 'sheet-1', path: 'scans/capitals.png', embedded: SCAN_BYTES.toString('base64'), dpi: 600, characters: 'I' }],
    glyphs,
  }, null, 2);
}

function projectError(run: () => unknown): ProjectError {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(ProjectError);
    return error as ProjectError;
  }
  throw new Error('expected a ProjectError');
}

describe('a format 1 project file', () => {
  it('opens with each glyph’s character as its list of code points, and the embedded scan with its SHA-256', () => {
    const project = parseProject(format1Project(), 'old.stemline');
    expect(project.formatVersion).toBe(2);
    expect(project.glyphs.map((g) => g.unicodes)).toEqual([['0049'], [], ['1F600']]);
    expect(project.glyphs[1]?.name).toBe('I.alt');
    expect(project.glyphs[0]).toMatchObject({ advanceWidth: 300, leftSidebearing: 50, source: { scan: 'sheet-1', letter: 0 } });
    // Reference for the digest: node's SHA-256 of the original bytes, computed here apart from the migration.
    expect(project.scans[0]?.embedded).toEqual({ sha256: createHash('sha256').update(SCAN_BYTES).digest('hex'), base64: SCAN_BYTES.toString('base64') });
  });

  it('is left untouched on disk when opened, and saved again as format 2 that opens the same', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'stemline-format-1-'));
    const path = join(folder, 'old.stemline');
    const text = format1Project();
    writeFileSync(path, text);
    const project = await loadProject(path);
    expect(readFileSync(path, 'utf8')).toBe(text);
    await saveProject(path, project);
    expect(JSON.parse(readFileSync(path, 'utf8'))).toMatchObject({ formatVersion: 2, glyphs: [{ unicodes: ['0049'] }, { unicodes: [] }, { unicodes: ['1F600'] }] });
    expect({ ...(await loadProject(path)), savedBy: undefined }).toEqual({ ...project, savedBy: undefined });
  });

  it('is refused naming the field when a glyph’s character is not one character', () => {
    const ligature = projectError(() => parseProject(format1Project([{ character: 'fi', advanceWidth: 500, outline: { contours: [] } }]), 'old.stemline'));
    expect(ligature.kind).toBe('project-invalid');
    expect(ligature.message).toMatch(/^old\.stemline: glyphs\.0\.character is wrong: "fi" is 2 characters/);
    const number = projectError(() => parseProject(format1Project([{ character: 65, advanceWidth: 500, outline: { contours: [] } }]), 'old.stemline'));
    expect(number.message).toMatch(/glyphs\.0\.character is wrong: it must be a string/);
  });

  it('is refused naming the field for damage the migration does not touch, as before', () => {
    const error = projectError(() => parseProject(format1Project([{ character: 'I', advanceWidth: 'wide', outline: { contours: [] } }]), 'old.stemline'));
    expect(error.message).toMatch(/^old\.stemline: glyphs\.0\.advanceWidth is wrong/);
    const badCopy = format1Project().replace(SCAN_BYTES.toString('base64'), 'not base64!');
    expect(projectError(() => parseProject(badCopy, 'old.stemline')).message).toMatch(/scans\.0\.embedded is wrong: .*base64/);
  });
});

describe('a format 2 project file', () => {
  it('names a glyph’s code point that is not spelled as hex digits, and an embedded copy without its digest', () => {
    const saved = JSON.stringify(parseProject(format1Project(), 'old.stemline'));
    const shortHex = saved.replace('"unicodes":["0049"]', '"unicodes":["49"]');
    expect(projectError(() => parseProject(shortHex, 'new.stemline')).message).toMatch(/^new\.stemline: glyphs\.0\.unicodes\.0 is wrong: a code point as 4–6 uppercase hex digits/);
    const noDigest = saved.replace(/"sha256":"[0-9a-f]+",/, '');
    expect(projectError(() => parseProject(noDigest, 'new.stemline')).message).toMatch(/^new\.stemline: scans\.0\.embedded\.sha256 is wrong/);
  });
});
