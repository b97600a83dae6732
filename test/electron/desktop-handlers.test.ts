// The desktop app's project handlers, with its file dialogs scripted: a project is
// opened from and saved to exactly the path the user answered, a cancelled dialog
// changes nothing, and a file name sent by the page instead of a dialog is refused.
import { describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { HandlerError } from '../../electron/handler-error.ts';
import { loadProject } from '../../electron/io/project/project-file.ts';
import { desktopHostFixture, sampleProject, SECRET_TEXT, withoutStamp } from './project-host-fixture.ts';

describe('projects in the desktop app', () => {
  it('saves where the save dialog answered, adding the extension, and opens what the open dialog answered', async () => {
    const answers: { open: (string | null)[]; save: (string | null)[] } = { open: [], save: [] };
    const host = desktopHostFixture(answers);
    mkdirSync(join(host.root, 'chosen'));
    const target = join(host.root, 'chosen', 'harbour');
    answers.save.push(target);
    const saved = await host.call('saveProjectAs', { project: sampleProject() });
    expect(saved?.name).toBe('harbour.stemline');
    expect(host.suggested).toEqual(['Harbour Signs.stemline']);
    expect(withoutStamp(await loadProject(`${target}.stemline`))).toEqual(sampleProject());

    await host.call('saveProject', { handle: saved!.handle, project: sampleProject(360) });
    expect((await loadProject(`${target}.stemline`)).glyphs[0]?.advanceWidth).toBe(360);

    answers.open.push(`${target}.stemline`);
    const opened = await host.call('openProject', {});
    expect(opened?.handle).toBe(saved!.handle);
    expect(opened?.project.glyphs[0]?.advanceWidth).toBe(360);
  });

  it('does nothing when the user cancels a dialog', async () => {
    const host = desktopHostFixture({ open: [null], save: [null] });
    expect(await host.call('openProject', {})).toBeNull();
    expect(await host.call('saveProjectAs', { project: sampleProject() })).toBeNull();
    expect(readdirSync(host.workspace)).toEqual([]);
  });

  it('refuses a file name sent by the page: only a dialog names files', async () => {
    const host = desktopHostFixture({ open: [], save: [] });
    for (const call of [host.call('openProject', { name: 'secret.stemline' }), host.call('saveProjectAs', { project: sampleProject(), name: '../outside/secret' })]) {
      const error = await call.then(() => null, (e: unknown) => e);
      expect(error).toBeInstanceOf(HandlerError);
      expect((error as HandlerError).kind).toBe('path-refused');
      expect((error as HandlerError).message).toMatch(/chosen in the file dialog/);
    }
    expect(readFileSync(host.secret, 'utf8')).toBe(SECRET_TEXT);
  });

  it('refuses a dialog answer that is not a full path', async () => {
    const host = desktopHostFixture({ open: ['relative/harbour.stemline'], save: ['harbour'] });
    await expect(host.call('openProject', {})).rejects.toMatchObject({ kind: 'path-refused' });
    await expect(host.call('saveProjectAs', { project: sampleProject() })).rejects.toMatchObject({ kind: 'path-refused' });
    expect(existsSync('harbour.stemline')).toBe(false);
  });
});
