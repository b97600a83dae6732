// `stemline import` and `stemline check`: an existing font becomes a project that
// opens again, and the checks run over fonts and projects alike. References: Debian's
// Cantarell Regular (CFF) — every contour of a professionally drawn font must read
// with the CFF direction convention.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCaptured as run } from './run-captured.ts';
import { loadProject } from '../../electron/io/project/project-file.ts';
import { CANTARELL, describeWithFont } from '../raster/require-font.ts';

const folder = mkdtempSync(join(tmpdir(), 'stemline-import-'));


describeWithFont('stemline import and check', CANTARELL, () => {
  const project = join(folder, 'cantarell.stemline');

  it('imports a CFF font as a project that opens with its names, metrics and glyphs', async () => {
    const result = await run(['import', CANTARELL.path, '-o', project]);
    expect(result.code).toBe(0);
    expect(result.err).toMatch(/wrote .*cantarell\.stemline: Cantarell Regular, \d+ glyphs, 1000 units per em \(CFF outlines\)/);
    const loaded = await loadProject(project);
    expect(loaded.font).toMatchObject({ familyName: 'Cantarell', styleName: 'Regular', unitsPerEm: 1000, capHeight: 694, xHeight: 482 }); // Cantarell's OS/2 sCapHeight and sxHeight
    expect(loaded.glyphs.find((g) => g.unicodes[0] === '0048')?.outline.contours).toHaveLength(1); // H
  });

  it('checks the imported project and finds no wrong-direction contours in A–Z', async () => {
    const result = await run(['check', project, '--json']);
    expect(result.code).toBe(0);
    const report = JSON.parse(result.out) as { kind: string; glyphs: Array<{ character: string; warnings: Array<{ kind: string }> }> };
    expect(report.kind).toBe('project');
    const capitals = report.glyphs.filter((g) => /^[A-Z]$/.test(g.character));
    expect(capitals).toHaveLength(26);
    expect(capitals.flatMap((g) => g.warnings).filter((w) => w.kind === 'wrong-direction')).toEqual([]);
    expect(result.err).toMatch(/^\d+ glyphs checked, \d+ warnings/);
  });
});

describe('stemline import and check with bad input', () => {
  it('exit 1 naming a file that is not a font', async () => {
    const notFont = join(folder, 'notes.otf');
    writeFileSync(notFont, 'these are not the glyphs you are looking for');
    const result = await run(['check', notFont]);
    expect(result.code).toBe(1);
    expect(result.err).toMatch(/^stemline check: notes\.otf/);
  });

  it('exit 1 naming a missing file, and 2 without an output', async () => {
    expect((await run(['import', join(folder, 'missing.otf'), '-o', join(folder, 'x.stemline')])).err).toMatch(/missing\.otf: there is no such file/);
    expect((await run(['import', join(folder, 'missing.otf')])).code).toBe(2);
  });

  it('exit 1 with the wrong field for a broken project', async () => {
    const broken = join(folder, 'broken.stemline');
    writeFileSync(broken, '{"format": "stemline-project", "formatVersion": 1, "font": {}}');
    const result = await run(['check', broken]);
    expect(result.code).toBe(1);
    expect(result.err).toMatch(/broken\.stemline: font\.familyName is wrong/);
  });
});
