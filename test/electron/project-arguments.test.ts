// The project intents refuse malformed and huge arguments before any file is touched:
// wrong types, keys they do not take, handles the host never spells, file names
// longer than a file system takes, invalid projects (naming the wrong field), scan
// copies that do not match their digest, and projects beyond the largest a project
// file may be.
import { describe, expect, it } from 'vitest';
import { readdirSync } from 'node:fs';
import { HandlerError } from '../../electron/handler-error.ts';
import { MAX_PROJECT_BYTES } from '../../electron/io/project/project-file.ts';
import { browserHostFixture, sampleProject } from './project-host-fixture.ts';

async function badArguments(promise: Promise<unknown>): Promise<string> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(HandlerError);
  expect((error as HandlerError).kind).toBe('bad-arguments');
  return (error as HandlerError).message;
}

describe('project intent arguments', () => {
  it('refuse values of the wrong shape, naming the field', async () => {
    const host = browserHostFixture();
    const cases: [string, unknown, RegExp][] = [
      ['openProject', { name: 42 }, /"openProject" was refused: name is wrong/],
      ['openProject', [1, 2], /openProject/],
      ['openProject', 'harbour.stemline', /openProject/],
      ['openProject', { name: 'a.stemline', path: '/etc/passwd' }, /path is wrong \(this request does not take it\)/],
      ['saveProject', { project: sampleProject() }, /handle is wrong/],
      ['saveProject', { handle: '../../etc', project: sampleProject() }, /handle is wrong \(a project handle the host gave\)/],
      ['saveProject', { handle: 'a'.repeat(32) }, /project is wrong/],
      ['saveProjectAs', { project: sampleProject(), name: '' }, /name is wrong/],
      ['autosaveProject', { project: null }, /the project is wrong/],
      ['findRecoveredWork', { handle: 7 }, /handle is wrong/],
      ['discardRecoveredWork', {}, /handle is wrong/],
      ['listProjects', { name: 'x' }, /takes no arguments/],
    ];
    for (const [intent, args, message] of cases) {
      expect(await badArguments(host.call(intent as 'openProject', args)), intent).toMatch(message);
    }
    expect(readdirSync(host.workspace)).toEqual([]);
  });

  it('refuse an invalid project, saying which field is wrong', async () => {
    const host = browserHostFixture();
    const project = sampleProject();
    const broken = { ...project, glyphs: [{ ...project.glyphs[0]!, advanceWidth: 'wide' }] };
    expect(await badArguments(host.call('saveProjectAs', { project: broken, name: 'broken' }))).toMatch(/project\.glyphs\.0\.advanceWidth is wrong/);
    const offGrid = { ...project, glyphs: [{ ...project.glyphs[0]!, outline: { contours: [[[40000, 0, 'on']]] } }] };
    expect(await badArguments(host.call('autosaveProject', { project: offGrid }))).toMatch(/project\.glyphs\.0\.outline\.contours\.0\.0\.0 is wrong/);
    expect(readdirSync(host.workspace)).toEqual([]);
  });

  it('refuse a scan copy that does not match its SHA-256', async () => {
    const host = browserHostFixture();
    const project = sampleProject();
    const scan = project.scans[0]!;
    const damaged = { ...project, scans: [{ ...scan, embedded: { ...scan.embedded!, base64: 'AAAA' } }] };
    expect(await badArguments(host.call('saveProjectAs', { project: damaged, name: 'damaged' }))).toMatch(/project\.scans\.0\.embedded is wrong \(the copy of the scan does not match its SHA-256\)/);
  });

  it('refuse huge arguments: a file name beyond any file system’s, and a project beyond the largest project file', async () => {
    const host = browserHostFixture();
    expect(await badArguments(host.call('openProject', { name: `${'a'.repeat(1_000_000)}.stemline` }))).toMatch(/name is wrong/);
    // Nine scans sharing one 64 MiB string: 576 MiB of JSON, refused by size before the schema reads a byte of it.
    const chunk = 'A'.repeat(64 * 1024 * 1024);
    const project = sampleProject();
    const huge = { ...project, scans: Array.from({ length: 9 }, (_, i) => ({ ...project.scans[0]!, id: `scan-${i}`, embedded: { sha256: '0'.repeat(64), base64: chunk } })) };
    expect(9 * chunk.length).toBeGreaterThan(MAX_PROJECT_BYTES);
    expect(await badArguments(host.call('autosaveProject', { project: huge }))).toMatch(/larger than the 512 MiB a Stemline project may hold/);
    expect(readdirSync(host.workspace)).toEqual([]);
  });
});
