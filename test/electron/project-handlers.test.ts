// Saving and opening projects through the browser host's handlers, with real files in
// a temporary workspace: a project saved is listed and opens again exactly, with its
// scan; saving over it keeps one file; and every name that would reach outside the
// workspace — "..", absolute paths, folders, hidden files, symlinks leading out — is
// refused with a message, leaving the file outside untouched.
import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { HandlerError } from '../../electron/handler-error.ts';
import { loadProject } from '../../electron/io/project/project-file.ts';
import { browserHostFixture, sampleProject, SCAN_BYTES, SECRET_TEXT, withoutStamp, type ProjectHostFixture } from './project-host-fixture.ts';
import { embedScan } from '../../electron/io/project/embedded-scan.ts';

async function refusal(promise: Promise<unknown>): Promise<HandlerError> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(HandlerError);
  return error as HandlerError;
}

async function savedAs(host: ProjectHostFixture, name: string, project = sampleProject()) {
  const saved = await host.call('saveProjectAs', { project, name });
  expect(saved).not.toBeNull();
  return saved!;
}

describe('saving and opening projects in the browser workspace', () => {
  it('saves a project under a chosen name, lists it, and opens it again exactly with its scan', async () => {
    const host = browserHostFixture();
    const saved = await savedAs(host, 'harbour');
    expect(saved.name).toBe('harbour.stemline');
    expect(withoutStamp(await loadProject(join(host.workspace, 'harbour.stemline')))).toEqual(sampleProject());

    const listing = await host.call('listProjects', {});
    expect(listing).toMatchObject({ kind: 'workspace', folderName: 'workspace', projects: [{ name: 'harbour.stemline' }] });
    if (listing.kind === 'workspace') expect(Date.parse(listing.projects[0]!.modifiedAt)).not.toBeNaN();

    const opened = await host.call('openProject', { name: 'harbour.stemline' });
    expect(opened?.name).toBe('harbour.stemline');
    expect(opened?.handle).toBe(saved.handle);
    expect(withoutStamp(opened!.project)).toEqual(sampleProject());
  });

  it('saves over the opened file in place, leaving no temporary or recovery file behind', async () => {
    const host = browserHostFixture();
    const { handle } = await savedAs(host, 'harbour.stemline');
    await host.call('autosaveProject', { handle, project: sampleProject(310) });
    expect(existsSync(join(host.workspace, '.harbour.stemline.recovery'))).toBe(true);
    expect(await host.call('saveProject', { handle, project: sampleProject(320) })).toEqual({ handle, name: 'harbour.stemline' });
    expect((await loadProject(join(host.workspace, 'harbour.stemline'))).glyphs[0]?.advanceWidth).toBe(320);
    expect(readdirSync(host.workspace)).toEqual(['harbour.stemline']);
  });

  it('opens a project with the scan file beside it, sending the file’s bytes to the page', async () => {
    const host = browserHostFixture();
    const project = sampleProject();
    const withoutCopy = { ...project, scans: project.scans.map(({ embedded: _embedded, ...scan }) => scan) };
    await savedAs(host, 'beside', withoutCopy);
    writeFileSync(join(host.workspace, 'sheet.png'), SCAN_BYTES);
    const opened = await host.call('openProject', { name: 'beside.stemline' });
    expect(opened?.project.scans[0]?.embedded).toEqual(embedScan(SCAN_BYTES));
  });

  it('says the scan is missing when neither its file nor a copy is there', async () => {
    const host = browserHostFixture();
    const project = sampleProject();
    await savedAs(host, 'bare', { ...project, scans: project.scans.map(({ embedded: _embedded, ...scan }) => scan) });
    const error = await refusal(host.call('openProject', { name: 'bare.stemline' }));
    expect(error.kind).toBe('project-file');
    expect(error.message).toMatch(/bare\.stemline: the scan "sheet\.png" is missing/);
  });

  it('says what is wrong with a damaged project file, naming it', async () => {
    const host = browserHostFixture();
    writeFileSync(join(host.workspace, 'half.stemline'), '{"format": "stemline-proj');
    const error = await refusal(host.call('openProject', { name: 'half.stemline' }));
    expect(error.kind).toBe('project-file');
    expect(error.message).toMatch(/^half\.stemline is not a Stemline project: it is not valid JSON/);
  });

  it('refuses names that lead outside the workspace or are not project files, and reads or writes nothing there', async () => {
    const host = browserHostFixture();
    const names = ['../outside/secret.stemline', join(host.outside, 'secret.stemline'), 'sub/secret.stemline', 'sub\\secret.stemline', '..', '.', '.hidden.stemline', 'C:secret.stemline', 'nul\u0000.stemline', 'notes.txt'];
    for (const name of names) {
      const opening = await refusal(host.call('openProject', { name }));
      expect(opening.kind, name).toBe('path-refused');
      expect(opening.message).toMatch(/was refused: .*Choose a project file directly inside the workspace folder "workspace"/);
      if (name === 'notes.txt') continue; // saving adds the extension: "notes.txt.stemline" is a fine name
      const saving = await refusal(host.call('saveProjectAs', { project: sampleProject(), name }));
      expect(saving.kind, name).toBe('path-refused');
    }
    expect(readFileSync(host.secret, 'utf8')).toBe(SECRET_TEXT);
    expect(readdirSync(host.outside)).toEqual(['secret.stemline']);
    expect(readdirSync(host.workspace)).toEqual([]);
  });

  it('refuses a symlink leading outside the workspace, for opening and saving, and does not list it', async () => {
    const host = browserHostFixture();
    symlinkSync(host.secret, join(host.workspace, 'escape.stemline'));
    symlinkSync(host.outside, join(host.workspace, 'folder.stemline'));
    for (const name of ['escape.stemline', 'folder.stemline']) {
      const opening = await refusal(host.call('openProject', { name }));
      expect(opening.kind).toBe('path-refused');
      expect(opening.message).toMatch(/is a link to a file outside the workspace folder "workspace"/);
    }
    const saving = await refusal(host.call('saveProjectAs', { project: sampleProject(), name: 'escape' }));
    expect(saving.kind).toBe('path-refused');
    expect(readFileSync(host.secret, 'utf8')).toBe(SECRET_TEXT);
    expect(await host.call('listProjects', {})).toMatchObject({ projects: [] });
  });

  it('follows a symlink that stays inside the workspace', async () => {
    const host = browserHostFixture();
    await savedAs(host, 'harbour');
    symlinkSync(join(host.workspace, 'harbour.stemline'), join(host.workspace, 'alias.stemline'));
    const opened = await host.call('openProject', { name: 'alias.stemline' });
    expect(withoutStamp(opened!.project)).toEqual(sampleProject());
    expect((await host.call('listProjects', {})) as { projects: { name: string }[] }).toMatchObject({ projects: [{ name: 'alias.stemline' }, { name: 'harbour.stemline' }] });
  });

  it('says so when a listed project has gone, and needs a chosen name to open at all', async () => {
    const host = browserHostFixture();
    const gone = await refusal(host.call('openProject', { name: 'gone.stemline' }));
    expect(gone.kind).toBe('path-refused');
    expect(gone.message).toMatch(/There is no project "gone\.stemline" in the workspace folder/);
    expect((await refusal(host.call('openProject', {}))).kind).toBe('bad-arguments');
    expect((await refusal(host.call('saveProjectAs', { project: sampleProject() }))).kind).toBe('bad-arguments');
  });

  it('saves only to places it gave a handle for', async () => {
    const host = browserHostFixture();
    const unknown = await refusal(host.call('saveProject', { handle: 'a'.repeat(32), project: sampleProject() }));
    expect(unknown.kind).toBe('project-unknown');
    expect(unknown.message).toMatch(/Use Save as… to choose where to save it/);
    const { handle: untitled } = await host.call('autosaveProject', { project: sampleProject() });
    const notSaved = await refusal(host.call('saveProject', { handle: untitled, project: sampleProject() }));
    expect(notSaved.message).toMatch(/has not been saved to a file yet: use Save as…/);
    expect(readdirSync(host.workspace)).toEqual([]);
  });

  it('reports a folder it cannot write to with the reason and what to do', async () => {
    const host = browserHostFixture();
    const { handle } = await savedAs(host, 'harbour');
    const { chmodSync } = await import('node:fs');
    chmodSync(host.workspace, 0o500);
    try {
      if (process.getuid?.() === 0) return; // root writes anyway: nothing to see
      const error = await refusal(host.call('saveProject', { handle, project: sampleProject(400) }));
      expect(error.kind).toBe('project-file');
      expect(error.message).toMatch(/^Could not save harbour\.stemline: Stemline is not allowed .* Your work is still open in the window/);
    } finally {
      chmodSync(host.workspace, 0o700);
    }
  });
});
