// The scans of a project: found by their paths relative to the project file's
// folder, or, where a file is missing (the project was moved or mailed without its
// scans), taken from the copy embedded in the project. Embedding reads each scan's
// file and puts its bytes into the project.
import { readFile } from 'node:fs/promises';
import { basename, dirname, relative, resolve, sep } from 'node:path';
import { embeddedScanBytes, embedScan } from './embedded-scan.ts';
import { ProjectError } from './project-error.ts';
import type { ProjectData, ProjectScan } from './project-schema.ts';

/** A scan's bytes and where they came from. */
export interface ScanBytes {
  readonly bytes: Uint8Array;
  /** 'file': read from the scan's own file; 'embedded': its file is missing, so from the copy in the project. */
  readonly from: 'file' | 'embedded';
  /** The absolute path the scan's file is expected at. */
  readonly path: string;
}

/** Where the scan `scan` of the project at `projectPath` lives on disk. */
export function scanFilePath(projectPath: string, scan: Pick<ProjectScan, 'path'>): string {
  return resolve(dirname(projectPath), scan.path);
}

/**
 * The path of `scanFile` as a project at `projectPath` records it: relative to the
 * project's folder, with "/" separators on every system (the project schema's rule).
 */
export function scanReference(projectPath: string, scanFile: string): string {
  return relative(dirname(resolve(projectPath)), resolve(scanFile)).split(sep).join('/');
}

/** The file's bytes, or undefined when there is no such file. Other failures throw. */
async function readIfPresent(path: string): Promise<Uint8Array | undefined> {
  try {
    return new Uint8Array(await readFile(path));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return undefined;
    throw error;
  }
}

/**
 * The bytes of `scans[index]` of the project at `projectPath`: its file's, or, when
 * the file is missing, its embedded copy's. Throws ProjectError 'scan-missing' when
 * the file is missing and the project holds no copy, 'scan-damaged' when the copy
 * does not match its SHA-256.
 */
export async function readProjectScan(projectPath: string, project: ProjectData, index: number): Promise<ScanBytes> {
  const scan = project.scans[index];
  const file = basename(projectPath);
  if (scan === undefined) throw new RangeError(`${file} has no scan ${index} (it has ${project.scans.length}).`);
  const path = scanFilePath(projectPath, scan);
  const bytes = await readIfPresent(path);
  if (bytes !== undefined) return { bytes, from: 'file', path };
  if (scan.embedded === undefined) {
    throw new ProjectError('scan-missing', file, `${file}: the scan "${scan.path}" is missing (looked for ${path}) and the project holds no copy of it. Put the scan back there, or save the project with its scans embedded next time.`);
  }
  const copy = embeddedScanBytes(scan.embedded);
  if (copy === undefined) {
    throw new ProjectError('scan-damaged', file, `${file}: scans.${index}.embedded is damaged: the embedded copy of "${scan.path}" does not match its SHA-256, and the file itself is missing (looked for ${path}). Put the scan back there, or open an earlier copy of the project.`);
  }
  return { bytes: copy, from: 'embedded', path };
}

/**
 * `project` with an embedded copy of every scan, read from the scans' files beside
 * the project at `projectPath` (the copy is refreshed when the file has changed).
 * A scan whose file is missing keeps its copy, after checking it; without one it is
 * a ProjectError. `project` is not modified.
 */
export async function withEmbeddedScans(projectPath: string, project: ProjectData): Promise<ProjectData> {
  const scans: ProjectScan[] = [];
  for (let index = 0; index < project.scans.length; index++) {
    const scan = project.scans[index]!;
    const { bytes, from } = await readProjectScan(projectPath, project, index);
    scans.push(from === 'embedded' ? scan : { ...scan, embedded: embedScan(bytes) });
  }
  return { ...project, scans };
}
