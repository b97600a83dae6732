// Recent projects through the handlers, with real files in a temporary folder: every
// project opened or saved goes first on the list kept in the host's per-user folder;
// the renderer gets names, folder names and handles, never a path; a recent project
// reopens through its handle; the list is bounded, and a damaged or edited list file
// can never name anything but project files. Also the window intents: the page's
// project state and the close after saving.
import { describe, expect, it } from 'vitest';
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { HandlerError } from '../../electron/handler-error.ts';
import { MAX_RECENT_PATH_LENGTH, MAX_RECENT_PROJECTS, RecentProjects, recentProjectsPath } from '../../electron/places/recent-projects.ts';
import { MAX_TITLE_LENGTH } from '../../electron/window-handlers.ts';
import type { ProjectState } from '../../electron/api-contract.ts';
import { saveProject as writeProjectFile } from '../../electron/io/project/project-file.ts';
import { browserHostFixture, desktopHostFixture, sampleProject, type ProjectHostFixture } from './project-host-fixture.ts';

async function refusal(promise: Promise<unknown>): Promise<HandlerError> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(HandlerError);
  return error as HandlerError;
}

function listFile(host: ProjectHostFixture): string {
  return recentProjectsPath(host.appFolder);
}

describe('recent projects', () => {
  it('puts each project opened or saved first, and lists names, folder names and handles — never a path', async () => {
    const host = browserHostFixture();
    await host.call('saveProjectAs', { project: sampleProject(), name: 'harbour' });
    await host.call('saveProjectAs', { project: sampleProject(), name: 'sign' });
    await host.call('openProject', { name: 'harbour.stemline' });
    const { projects } = await host.call('listRecentProjects', {});
    expect(projects.map((p) => [p.name, p.folderName])).toEqual([['harbour.stemline', 'workspace'], ['sign.stemline', 'workspace']]);
    for (const project of projects) {
      expect(project.handle).toMatch(/^[0-9a-f]{32}$/);
      expect(JSON.stringify(project)).not.toContain(host.root);
    }
  });

  it('reopens a recent project through its handle, the same handle the window already has', async () => {
    const host = browserHostFixture();
    const saved = (await host.call('saveProjectAs', { project: sampleProject(345), name: 'harbour' }))!;
    const { projects } = await host.call('listRecentProjects', {});
    expect(projects[0]!.handle).toBe(saved.handle);
    const opened = await host.call('openRecentProject', { handle: projects[0]!.handle });
    expect(opened.name).toBe('harbour.stemline');
    expect(opened.project.glyphs[0]?.advanceWidth).toBe(345);
  });

  it('keeps the list in the app’s folder, written whole (no temporary file left), readable by the next run', async () => {
    const host = desktopHostFixture({ open: [], save: [] });
    const path = join(host.outside, 'far.stemline');
    await writeProjectFile(path, sampleProject());
    const answers = desktopHostFixture({ open: [path], save: [] });
    // A second host sharing nothing but the same app folder, as the next run of the app would.
    const first = { ...answers, context: { ...answers.context, recent: new RecentProjects(listFile(host)) } };
    const { invokeHandler } = await import('../../electron/handlers.ts');
    await invokeHandler('openProject', {}, first.context);
    expect(readdirSync(host.appFolder)).toEqual(['recent-projects.json']);
    expect(JSON.parse(readFileSync(listFile(host), 'utf8'))).toEqual({ format: 'stemline-recent-projects', version: 1, projects: [path] });
    const { projects } = await host.call('listRecentProjects', {});
    expect(projects.map((p) => p.name)).toEqual(['far.stemline']);
  });

  it('keeps at most the ten most recent, each once', async () => {
    const host = browserHostFixture();
    for (let i = 0; i < MAX_RECENT_PROJECTS + 2; i += 1) await host.call('saveProjectAs', { project: sampleProject(), name: `p${i}` });
    await host.call('openProject', { name: 'p5.stemline' });
    const { projects } = await host.call('listRecentProjects', {});
    expect(projects).toHaveLength(MAX_RECENT_PROJECTS);
    expect(projects[0]!.name).toBe('p5.stemline');
    expect(projects.filter((p) => p.name === 'p5.stemline')).toHaveLength(1);
    expect(projects.map((p) => p.name)).not.toContain('p0.stemline');
  });

  it('reads a damaged list file as empty, and leaves out every entry that is not an absolute project-file path', async () => {
    const host = browserHostFixture();
    mkdirSync(host.appFolder, { recursive: true });
    writeFileSync(listFile(host), '{"format":"stemline-recent-projects","version":1,"projects":[');
    expect((await host.call('listRecentProjects', {})).projects).toEqual([]);
    const real = join(host.workspace, 'real.stemline');
    await writeProjectFile(real, sampleProject());
    const entries = [real, '/etc/passwd', 'relative.stemline', 42, { path: real }, `/${'x'.repeat(MAX_RECENT_PATH_LENGTH)}.stemline`, `${host.workspace}/nul\u0000.stemline`, join(host.workspace, 'gone.stemline')];
    writeFileSync(listFile(host), JSON.stringify({ format: 'stemline-recent-projects', version: 1, projects: entries }));
    expect((await host.call('listRecentProjects', {})).projects.map((p) => p.name)).toEqual(['real.stemline']);
    writeFileSync(listFile(host), JSON.stringify({ format: 'other', version: 1, projects: [real] }));
    expect((await host.call('listRecentProjects', {})).projects).toEqual([]);
  });

  it('in browser mode offers only projects directly inside the workspace, even when the desktop app opened others', async () => {
    const host = browserHostFixture();
    await writeProjectFile(join(host.outside, 'elsewhere.stemline'), sampleProject());
    await host.context.recent.add(join(host.outside, 'elsewhere.stemline'));
    await host.context.recent.add(host.secret);
    await host.call('saveProjectAs', { project: sampleProject(), name: 'inside' });
    expect((await host.call('listRecentProjects', {})).projects.map((p) => p.name)).toEqual(['inside.stemline']);
  });

  it('says a recent project that was moved or deleted is gone, and takes it off the list', async () => {
    const host = browserHostFixture();
    await host.call('saveProjectAs', { project: sampleProject(), name: 'harbour' });
    const { projects } = await host.call('listRecentProjects', {});
    rmSync(join(host.workspace, 'harbour.stemline'));
    const error = await refusal(host.call('openRecentProject', { handle: projects[0]!.handle }));
    expect(error.kind).toBe('project-file');
    expect(error.message).toMatch(/^harbour\.stemline is no longer in the folder “workspace” .* Use Open… to find it\.$/);
    expect(await host.context.recent.list()).toEqual([]);
  });

  it('refuses a handle it never gave, a malformed or huge one, and arguments it does not take', async () => {
    const host = browserHostFixture();
    expect((await refusal(host.call('openRecentProject', { handle: 'a'.repeat(32) }))).kind).toBe('project-unknown');
    for (const args of [{}, { handle: '../secret' }, { handle: 'x'.repeat(1 << 20) }, { handle: 'a'.repeat(32), path: host.secret }, { path: host.secret }, 'harbour', null, [host.secret]]) {
      expect((await refusal(host.call('openRecentProject', args))).kind).toBe('bad-arguments');
    }
    for (const args of [{ path: host.secret }, [1], 'all']) expect((await refusal(host.call('listRecentProjects', args))).kind).toBe('bad-arguments');
    expect(readFileSync(host.secret, 'utf8')).toContain('"secret":true');
  });

  it('refuses to reopen a never-saved project’s place as if it were a file', async () => {
    const host = browserHostFixture();
    const { handle } = await host.call('autosaveProject', { project: sampleProject() });
    expect((await refusal(host.call('openRecentProject', { handle }))).kind).toBe('bad-arguments');
  });
});

describe('the window intents', () => {
  const state: ProjectState = { title: 'harbour', hasProject: true, hasUnsavedChanges: true, canUndo: true, canRedo: false };

  it('pass the page’s project state to the host’s window, validated', async () => {
    const host = desktopHostFixture({ open: [], save: [] });
    const seen: ProjectState[] = [];
    host.context.window = { projectStateChanged: (s) => seen.push(s), close: () => true };
    expect(await host.call('reportProjectState', state)).toEqual({});
    expect(seen).toEqual([state]);
    const bad: unknown[] = [{ ...state, hasUnsavedChanges: 'yes' }, { ...state, title: 'x'.repeat(MAX_TITLE_LENGTH + 1) }, { ...state, path: '/etc/passwd' }, { title: 'harbour' }, null, 'dirty'];
    for (const args of bad) {
      const error = await refusal(host.call('reportProjectState', args));
      expect(error.kind).toBe('bad-arguments');
      expect(error.message).toMatch(/"reportProjectState" was refused/);
    }
    expect(seen).toHaveLength(1);
  });

  it('close the desktop window on request, and say there is none in browser mode', async () => {
    const desktop = desktopHostFixture({ open: [], save: [] });
    let closed = 0;
    desktop.context.window = { projectStateChanged: () => undefined, close: () => ++closed > 0 };
    expect(await desktop.call('closeWindow', {})).toEqual({ closed: true });
    expect(closed).toBe(1);
    expect(await browserHostFixture().call('closeWindow', {})).toEqual({ closed: false });
    expect((await refusal(desktop.call('closeWindow', { force: true }))).kind).toBe('bad-arguments');
  });
});
