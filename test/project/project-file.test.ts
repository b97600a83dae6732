// Project files: a saved project opens again exactly; a damaged, foreign or newer
// file is refused with a message naming the file and the wrong field; autosave offers
// the latest work after a crash; and saving never leaves a half-written file.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, utimesSync, existsSync, truncateSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { autosaveProject, findRecovery, loadProject, parseProject, recoveryPathFor, saveProject, serializeProject } from '../../electron/io/project/project-file.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';
import type { ProjectData } from '../../electron/io/project/project-schema.ts';

const folder = () => mkdtempSync(join(tmpdir(), 'stemline-project-'));

function sampleProject(): ProjectData {
  const project = newProject('Harbour Signs');
  return {
    ...project,
    scans: [{ id: 'sheet-1', path: 'scans/capitals.png', dpi: 600, characters: 'ABC', threshold: 'otsu' }],
    glyphs: [
      {
        unicodes: ['0049'], // I
        advanceWidth: 300,
        leftSidebearing: 50,
        outline: { contours: [[[50, 0, 'on'], [250, 0, 'on'], [250, 700, 'on'], [50, 700, 'on']]] },
        source: { scan: 'sheet-1', letter: 0 },
        fitOverrides: { forcedCorners: [12], forcedSmooth: [] },
      },
      {
        unicodes: ['004F'], // O
        advanceWidth: 720,
        outline: { contours: [[[360, -10, 'on-smooth'], [560, -10, 'off'], [690, 140, 'off'], [690, 345, 'on-smooth'], [690, 550, 'off'], [560, 710, 'off'], [360, 710, 'on-smooth'], [160, 710, 'off'], [30, 550, 'off'], [30, 345, 'on-smooth'], [30, 140, 'off'], [160, -10, 'off']]] },
      },
    ],
  };
}

async function expectProjectError(promise: Promise<unknown> | (() => unknown), kind: string, pattern: RegExp) {
  const error = await (typeof promise === 'function' ? Promise.resolve().then(promise) : promise).then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(ProjectError);
  expect((error as ProjectError).kind).toBe(kind);
  expect((error as ProjectError).message).toMatch(pattern);
}

describe('project files', () => {
  it('open again exactly as saved', async () => {
    const path = join(folder(), 'harbour.stemline');
    const project = sampleProject();
    await saveProject(path, project);
    const loaded = await loadProject(path);
    expect({ ...loaded, savedBy: undefined }).toEqual({ ...project, savedBy: undefined });
    expect(loaded.savedBy).toMatch(/^Stemline \d+\.\d+\.\d+$/);
  });

  it('say which field is wrong in a hand-edited file', async () => {
    const text = serializeProject(sampleProject()).replace('"advanceWidth": 720', '"advanceWidth": "wide"');
    await expectProjectError(() => parseProject(text, 'edited.stemline'), 'project-invalid', /^edited\.stemline: glyphs\.1\.advanceWidth is wrong/);
    const badKind = serializeProject(sampleProject()).replace('"on-smooth"', '"curvy"');
    await expectProjectError(() => parseProject(badKind, 'edited.stemline'), 'project-invalid', /glyphs\.1\.outline\.contours\.0\.0\.2 is wrong/);
  });

  it('refuse coordinates a font cannot hold (beyond 16-bit)', async () => {
    const text = serializeProject(sampleProject()).replace('[\n              250,\n              700', '[\n              250000,\n              700');
    await expectProjectError(() => parseProject(text, 'huge.stemline'), 'project-invalid', /glyphs\.0\.outline/);
  });

  it('refuse a half-synced file as not JSON, pointing to the recovery copy', async () => {
    const text = serializeProject(sampleProject());
    await expectProjectError(() => parseProject(text.slice(0, text.length / 2), 'synced.stemline'), 'project-not-json', /not valid JSON.*recovery copy/);
  });

  it('refuse JSON that is not a Stemline project', async () => {
    await expectProjectError(() => parseProject('{"name":"package"}', 'package.json'), 'project-not-stemline', /not a Stemline project/);
  });

  it('refuse, politely and without touching it, a project from a newer version', async () => {
    const path = join(folder(), 'future.stemline');
    const text = serializeProject(sampleProject()).replace('"formatVersion": 2', '"formatVersion": 7');
    writeFileSync(path, text);
    await expectProjectError(loadProject(path), 'project-too-new', /saved by a newer Stemline \(project format 7\); this version .* reads up to format 2\. Update Stemline/);
    expect(readFileSync(path, 'utf8')).toBe(text);
  });

  it('say when the file does not exist', async () => {
    await expectProjectError(loadProject(join(folder(), 'gone.stemline')), 'project-unreadable', /gone\.stemline: there is no such file/);
  });

  it('offer the autosaved work when it is newer than the project, and drop it after a save', async () => {
    const path = join(folder(), 'harbour.stemline');
    const saved = sampleProject();
    await saveProject(path, saved);
    const old = new Date(Date.now() - 60_000);
    utimesSync(path, old, old);
    expect(await findRecovery(path)).toBeNull();
    const edited = { ...saved, font: { ...saved.font, familyName: 'Harbour Signs Bold' } };
    await autosaveProject(path, edited);
    const recovered = await findRecovery(path);
    expect(recovered?.project.font.familyName).toBe('Harbour Signs Bold');
    expect((await loadProject(path)).font.familyName).toBe('Harbour Signs'); // the project file itself is untouched
    await saveProject(path, edited);
    expect(existsSync(recoveryPathFor(path))).toBe(false);
    expect(await findRecovery(path)).toBeNull();
  });

  it('ignore a damaged recovery file rather than block opening', async () => {
    const path = join(folder(), 'harbour.stemline');
    await saveProject(path, sampleProject());
    writeFileSync(recoveryPathFor(path), '{"format": "stemline-proj');
    const later = new Date(Date.now() + 60_000);
    utimesSync(recoveryPathFor(path), later, later);
    expect(await findRecovery(path)).toBeNull();
    expect((await loadProject(path)).glyphs).toHaveLength(2);
  });
});

describe('projects too large or too deep to be real', () => {
  const refusal = async (work: () => Promise<unknown> | unknown): Promise<ProjectError> => {
    try {
      await work();
    } catch (error) {
      expect(error).toBeInstanceOf(ProjectError);
      return error as ProjectError;
    }
    throw new Error('it was opened');
  };

  it('refuses a file over 512 MiB from its size alone, before reading it', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'stemline-huge-')), 'huge.stemline');
    writeFileSync(path, '');
    truncateSync(path, 600 * 2 ** 20); // a sparse file: nothing is written to disk
    const error = await refusal(() => loadProject(path));
    expect(error.kind).toBe('project-too-large');
    expect(error.message).toBe('huge.stemline is 600 MiB; a Stemline project is at most 512 MiB. This is not a project file.');
  });

  it('refuses glyphs nested 100,000 arrays deep, naming the field and quoting none of it', async () => {
    const depth = 100_000;
    const text = serializeProject(newProject('Deep')).replace('"glyphs": []', `"glyphs": ${'['.repeat(depth)}${']'.repeat(depth)}`);
    const error = await refusal(() => parseProject(text, 'deep.stemline'));
    expect(error.kind).toBe('project-invalid');
    expect(error.message).toMatch(/^deep\.stemline: glyphs\.0\.unicodes is wrong: it is missing\. Fix that field or open the recovery copy\.$/);
  });

  it('refuses a format version nested deep with a short message (it is not written out)', async () => {
    const text = `{"format":"stemline-project","formatVersion":${'['.repeat(50_000)}${']'.repeat(50_000)}}`;
    const error = await refusal(() => parseProject(text, 'deep.stemline'));
    expect(error.message).toBe('deep.stemline: "formatVersion" must be a whole number from 1; it is a value nested too deeply to show.');
  });
});
