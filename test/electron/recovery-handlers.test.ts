// Autosave and recovered work through the handlers, with real files: the recovery
// copy is written beside a saved project (or, for a project never saved, in the
// host's own folder), offered only when it is newer than the project file, and gone
// once discarded or superseded by a save.
import { describe, expect, it } from 'vitest';
import { readdirSync, utimesSync, writeFileSync } from 'node:fs';
import { loadProject } from '../../electron/io/project/project-file.ts';
import { join } from 'node:path';
import { browserHostFixture, sampleProject, withoutStamp } from './project-host-fixture.ts';

/** Seconds between the older and the newer file in these tests: far beyond any file system's timestamp resolution (FAT's is 2 s). */
const AGE_GAP_SECONDS = 60;

function setAge(path: string, secondsAgo: number): void {
  const when = new Date(Date.now() - secondsAgo * 1000);
  utimesSync(path, when, when);
}

describe('autosave and recovered work', () => {
  it('offers autosaved work newer than the project file, as autosaved', async () => {
    const host = browserHostFixture();
    const saved = await host.call('saveProjectAs', { project: sampleProject(300), name: 'harbour' });
    const handle = saved!.handle;
    await host.call('autosaveProject', { handle, project: sampleProject(333) });
    const project = join(host.workspace, 'harbour.stemline');
    const recovery = join(host.workspace, '.harbour.stemline.recovery');
    setAge(project, AGE_GAP_SECONDS * 2);
    setAge(recovery, AGE_GAP_SECONDS);
    const found = await host.call('findRecoveredWork', { handle });
    expect(found?.handle).toBe(handle);
    expect(found?.name).toBe('harbour.stemline');
    expect(withoutStamp(found!.project)).toEqual(sampleProject(333));
    expect(Math.abs(Date.parse(found!.savedAt) - (Date.now() - AGE_GAP_SECONDS * 1000))).toBeLessThan(5000);
  });

  it('offers nothing when the project was saved after the autosave', async () => {
    const host = browserHostFixture();
    const { handle } = (await host.call('saveProjectAs', { project: sampleProject(300), name: 'harbour' }))!;
    await host.call('autosaveProject', { handle, project: sampleProject(333) });
    setAge(join(host.workspace, '.harbour.stemline.recovery'), AGE_GAP_SECONDS * 2);
    setAge(join(host.workspace, 'harbour.stemline'), AGE_GAP_SECONDS);
    expect(await host.call('findRecoveredWork', { handle })).toBeNull();
  });

  it('discards recovered work when asked, and says when there was none', async () => {
    const host = browserHostFixture();
    const { handle } = (await host.call('saveProjectAs', { project: sampleProject(), name: 'harbour' }))!;
    await host.call('autosaveProject', { handle, project: sampleProject(333) });
    expect(await host.call('discardRecoveredWork', { handle })).toEqual({ discarded: true });
    expect(readdirSync(host.workspace)).toEqual(['harbour.stemline']);
    expect(await host.call('discardRecoveredWork', { handle })).toEqual({ discarded: false });
    expect(await host.call('findRecoveredWork', { handle })).toBeNull();
  });

  it('keeps the work of a project never saved in the host’s folder and offers the latest of it', async () => {
    const host = browserHostFixture();
    const first = await host.call('autosaveProject', { project: sampleProject(301) });
    const second = await host.call('autosaveProject', { project: sampleProject(302) });
    expect(first.handle).not.toBe(second.handle);
    const copies = readdirSync(host.untitledFolder).sort();
    expect(copies).toHaveLength(2);
    for (const copy of copies) expect(copy).toMatch(/^\.untitled-[0-9a-f]{32}\.stemline\.recovery$/);
    setAge(join(host.untitledFolder, copies[0]!), AGE_GAP_SECONDS * 2);
    setAge(join(host.untitledFolder, copies[1]!), AGE_GAP_SECONDS);
    const latest = await host.call('findRecoveredWork', {});
    expect(latest?.name).toBeNull();
    const newer = await loadProject(join(host.untitledFolder, copies[1]!));
    expect(withoutStamp(latest!.project)).toEqual(withoutStamp(newer));
    // Autosaving again through the offered handle rewrites that copy, not a third one.
    await host.call('autosaveProject', { handle: latest!.handle, project: sampleProject(303) });
    expect(readdirSync(host.untitledFolder).sort()).toEqual(copies);
    expect((await loadProject(join(host.untitledFolder, copies[1]!))).glyphs[0]?.advanceWidth).toBe(303);
  });

  it('removes the never-saved copy once that work is saved as a file', async () => {
    const host = browserHostFixture();
    const { handle } = await host.call('autosaveProject', { project: sampleProject() });
    expect(readdirSync(host.untitledFolder)).toHaveLength(1);
    const saved = await host.call('saveProjectAs', { project: sampleProject(), name: 'kept', replacing: handle });
    expect(saved?.name).toBe('kept.stemline');
    expect(readdirSync(host.untitledFolder)).toEqual([]);
    expect(await host.call('findRecoveredWork', {})).toBeNull();
  });

  it('ignores a damaged recovery copy rather than blocking the project', async () => {
    const host = browserHostFixture();
    const { handle } = (await host.call('saveProjectAs', { project: sampleProject(), name: 'harbour' }))!;
    const recovery = join(host.workspace, '.harbour.stemline.recovery');
    writeFileSync(recovery, '{"format":"stemline-project","formatVersion":2,"glyphs":[');
    setAge(join(host.workspace, 'harbour.stemline'), AGE_GAP_SECONDS);
    expect(await host.call('findRecoveredWork', { handle })).toBeNull();
    expect(withoutStamp((await host.call('openProject', { name: 'harbour.stemline' }))!.project)).toEqual(sampleProject());
  });
});
