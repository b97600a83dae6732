// Scans embedded in the project file: saving with embedScans puts each scan's own
// bytes into the project with their SHA-256; a project moved without its scans
// still opens them from those copies, byte for byte; a copy damaged in the file is
// refused by its digest, not traced as a different picture; and a missing scan
// without a copy says where it was looked for. Real files in a temporary folder.
// References: sha256sum (GNU coreutils) for the digest; sharp/libvips for the scan.
import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { decodeScanBytes } from '../../electron/io/decode-scan.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { loadProject, saveProject } from '../../electron/io/project/project-file.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';
import { readProjectScan, scanReference } from '../../electron/io/project/project-scans.ts';
import type { ProjectData } from '../../electron/io/project/project-schema.ts';

/** Size of the stand-in scan: small, but a real greyscale PNG with a dark bar on white. */
const SCAN_WIDTH = 120;
const SCAN_HEIGHT = 80;
const SCAN_DPI = 600;

async function scanPng(): Promise<Buffer> {
  const pixels = Buffer.alloc(SCAN_WIDTH * SCAN_HEIGHT, 255);
  for (let y = 20; y < 60; y++) pixels.fill(0, y * SCAN_WIDTH + 40, y * SCAN_WIDTH + 60);
  return sharp(pixels, { raw: { width: SCAN_WIDTH, height: SCAN_HEIGHT, channels: 1 } }).withMetadata({ density: SCAN_DPI }).png().toBuffer();
}

/** A folder with `scans/capitals.png` and a project beside it that refers to it. */
async function projectWithScan(): Promise<{ folder: string; projectPath: string; scanPath: string; scanBytes: Buffer; project: ProjectData }> {
  const folder = mkdtempSync(join(tmpdir(), 'stemline-embed-'));
  mkdirSync(join(folder, 'scans'));
  const scanPath = join(folder, 'scans', 'capitals.png');
  const scanBytes = await scanPng();
  writeFileSync(scanPath, scanBytes);
  const projectPath = join(folder, 'harbour.stemline');
  const project: ProjectData = { ...newProject('Harbour Signs'), scans: [{ id: 'sheet-1', path: scanReference(projectPath, scanPath), dpi: SCAN_DPI, characters: 'I' }] };
  return { folder, projectPath, scanPath, scanBytes, project };
}

async function rejection(promise: Promise<unknown>): Promise<ProjectError> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(ProjectError);
  return error as ProjectError;
}

describe('scans embedded in a project', () => {
  it('are recorded by a path relative to the project, with "/" separators', async () => {
    const { project } = await projectWithScan();
    expect(project.scans[0]?.path).toBe('scans/capitals.png');
  });

  it('are written on request with the scan’s own bytes and their SHA-256, and not otherwise', async () => {
    const { projectPath, scanPath, scanBytes, project } = await projectWithScan();
    await saveProject(projectPath, project);
    expect((await loadProject(projectPath)).scans[0]?.embedded).toBeUndefined();
    await saveProject(projectPath, project, { embedScans: true });
    const embedded = (await loadProject(projectPath)).scans[0]?.embedded;
    expect(Buffer.from(embedded!.base64, 'base64').equals(scanBytes)).toBe(true);
    // Reference: sha256sum from GNU coreutils on the scan file itself.
    expect(embedded!.sha256).toBe(execFileSync('sha256sum', [scanPath], { encoding: 'utf8' }).split(' ')[0]);
    expect(project.scans[0]?.embedded).toBeUndefined(); // the project given is not modified
  });

  it('open from the embedded copy, byte for byte, when the project was moved without its scans', async () => {
    const { folder, projectPath, scanBytes, project } = await projectWithScan();
    await saveProject(projectPath, project, { embedScans: true });
    const moved = join(mkdtempSync(join(tmpdir(), 'stemline-moved-')), 'harbour.stemline');
    renameSync(projectPath, moved);
    const reopened = await loadProject(moved);
    const scan = await readProjectScan(moved, reopened, 0);
    expect(scan.from).toBe('embedded');
    expect(Buffer.from(scan.bytes).equals(scanBytes)).toBe(true);
    const decoded = await decodeScanBytes(scan.bytes, 'capitals.png');
    expect([decoded.raster.width, decoded.raster.height, decoded.dpi]).toEqual([SCAN_WIDTH, SCAN_HEIGHT, SCAN_DPI]);
    // Beside its scan again, the file is read, not the copy.
    expect((await readProjectScan(join(folder, 'harbour.stemline'), reopened, 0)).from).toBe('file');
  });

  it('keep their copy when saved again with embedding after the scan file went missing', async () => {
    const { projectPath, scanPath, scanBytes, project } = await projectWithScan();
    await saveProject(projectPath, project, { embedScans: true });
    renameSync(scanPath, `${scanPath}.away`);
    await saveProject(projectPath, await loadProject(projectPath), { embedScans: true });
    const scan = await readProjectScan(projectPath, await loadProject(projectPath), 0);
    expect(scan.from).toBe('embedded');
    expect(Buffer.from(scan.bytes).equals(scanBytes)).toBe(true);
  });

  it('refuse a damaged copy by its SHA-256, naming the field and what to do', async () => {
    const { projectPath, scanPath, project } = await projectWithScan();
    await saveProject(projectPath, project, { embedScans: true });
    renameSync(scanPath, `${scanPath}.away`);
    const text = readFileSync(projectPath, 'utf8');
    const base64 = /"base64": "([^"]+)"/.exec(text)![1]!;
    // One character of the copy changed, still valid base64: a bad sync or a hand edit.
    const middle = Math.floor(base64.length / 2);
    const damaged = `${base64.slice(0, middle)}${base64[middle] === 'A' ? 'B' : 'A'}${base64.slice(middle + 1)}`;
    writeFileSync(projectPath, text.replace(base64, damaged));
    const error = await rejection(readProjectScan(projectPath, await loadProject(projectPath), 0));
    expect(error.kind).toBe('scan-damaged');
    expect(error.message).toMatch(/^harbour\.stemline: scans\.0\.embedded is damaged: the embedded copy of "scans\/capitals\.png" does not match its SHA-256.*Put the scan back there/);
  });

  it('say where a missing scan without a copy was looked for', async () => {
    const { projectPath, scanPath, project } = await projectWithScan();
    await saveProject(projectPath, project);
    renameSync(scanPath, `${scanPath}.away`);
    const error = await rejection(readProjectScan(projectPath, await loadProject(projectPath), 0));
    expect(error.kind).toBe('scan-missing');
    expect(error.message).toContain(`the scan "scans/capitals.png" is missing (looked for ${scanPath}) and the project holds no copy`);
    const embedding = await rejection(saveProject(projectPath, await loadProject(projectPath), { embedScans: true }));
    expect(embedding.kind).toBe('scan-missing');
  });

  it('are refused when the copy in the file is not base64, naming the field', async () => {
    const { projectPath, project } = await projectWithScan();
    await saveProject(projectPath, project, { embedScans: true });
    const text = readFileSync(projectPath, 'utf8').replace(/"base64": "[^"]+"/, '"base64": "not base64!"');
    writeFileSync(projectPath, text);
    const error = await rejection(loadProject(projectPath));
    expect(error.kind).toBe('project-invalid');
    expect(error.message).toMatch(/^harbour\.stemline: scans\.0\.embedded\.base64 is wrong: the scan's bytes in standard base64/);
  });
});
