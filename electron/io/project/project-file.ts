// Reading and writing project files. Reading validates everything (and says which
// field is wrong), opening older formats through their migration; writing is
// atomic, so a crash or power cut mid-save leaves the previous file intact, and can
// embed the scans; and autosave writes a recovery file beside the project that
// opening offers when it is newer than the project.
import * as v from 'valibot';
import { readFile, stat, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { writeFileAtomic } from '../atomic-write.ts';
import { APP_NAME, APP_VERSION } from '../../app-identity.ts';
import { CURRENT_FORMAT_VERSION, PROJECT_FORMAT_NAME, projectSchema, type ProjectData } from './project-schema.ts';
import { invalidFieldError, ProjectError } from './project-error.ts';
import { FORMAT_1, migrateFormat1 } from './migrate-format-1.ts';
import { withEmbeddedScans } from './project-scans.ts';
import { quotedJson, schemaProblem } from './schema-issue.ts';

/**
 * Largest project file read: 512 MiB. Projects with embedded 600-dpi scans reach tens
 * of megabytes; a file far beyond that is not a project and would exhaust memory.
 */
export const MAX_PROJECT_BYTES = 512 * 1024 * 1024;

/** Parses and validates project JSON text. `name` is used in messages. */
export function parseProject(text: string, name: string): ProjectData {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    throw new ProjectError('project-not-json', name, `${name} is not a Stemline project: it is not valid JSON (${error instanceof Error ? error.message : String(error)}). If a cloud drive was still syncing it, wait and try again, or open its recovery copy.`);
  }
  if (typeof raw !== 'object' || raw === null || (raw as { format?: unknown }).format !== PROJECT_FORMAT_NAME) {
    throw new ProjectError('project-not-stemline', name, `${name} is JSON but not a Stemline project (it has no "format": "${PROJECT_FORMAT_NAME}").`);
  }
  const version = (raw as { formatVersion?: unknown }).formatVersion;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) {
    throw new ProjectError('project-invalid', name, `${name}: "formatVersion" must be a whole number from 1; it is ${quotedJson(version)}.`);
  }
  if (version > CURRENT_FORMAT_VERSION) {
    throw new ProjectError('project-too-new', name, `${name} was saved by a newer ${APP_NAME} (project format ${version}); this version (${APP_VERSION}) reads up to format ${CURRENT_FORMAT_VERSION}. Update ${APP_NAME} to open it; the file has not been changed.`);
  }
  const current = version === FORMAT_1 ? migrateFormat1(raw as Record<string, unknown>, name) : raw;
  const result = v.safeParse(projectSchema, current);
  if (!result.success) {
    const { where, problem } = schemaProblem(result.issues);
    throw invalidFieldError(name, where ?? 'the top level', problem);
  }
  return result.output;
}

/** Reads and validates the project at `path`. Throws ProjectError. */
export async function loadProject(path: string): Promise<ProjectData> {
  const name = basename(path);
  let size: number;
  try {
    size = (await stat(path)).size;
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new ProjectError('project-unreadable', name, `${name}: ${code === 'ENOENT' ? 'there is no such file' : `it could not be read (${code ?? String(error)})`}.`);
  }
  if (size > MAX_PROJECT_BYTES) {
    throw new ProjectError('project-too-large', name, `${name} is ${(size / 2 ** 20).toFixed(0)} MiB; a Stemline project is at most ${MAX_PROJECT_BYTES / 2 ** 20} MiB. This is not a project file.`);
  }
  return parseProject(await readFile(path, 'utf8'), name);
}

/** The project as file text: stable key order, two-space indent, a final newline. */
export function serializeProject(project: ProjectData): string {
  return `${JSON.stringify({ ...project, savedBy: `${APP_NAME} ${APP_VERSION}` }, null, 2)}\n`;
}

export interface SaveOptions {
  /**
   * Embed every scan: its file's bytes go into the project (base64, with their
   * SHA-256), so the project opens with its scans wherever it is moved. A scan
   * whose file is missing keeps the copy it has. Default false: the project keeps
   * whatever copies it already holds.
   */
  readonly embedScans?: boolean;
}

/**
 * Saves atomically to `path` and removes the recovery file it supersedes. Scan
 * paths are relative to the folder of `path`. Throws ProjectError when a scan to
 * embed cannot be read and has no copy.
 */
export async function saveProject(path: string, project: ProjectData, options: SaveOptions = {}): Promise<void> {
  const saved = options.embedScans === true ? await withEmbeddedScans(path, project) : project;
  await writeFileAtomic(path, serializeProject(saved));
  await unlink(recoveryPathFor(path)).catch(() => undefined);
}

/** Where the autosave copy of the project at `path` lives: beside it, hidden. */
export function recoveryPathFor(path: string): string {
  return join(dirname(path), `.${basename(path)}.recovery`);
}

/** Writes the autosave copy (atomically), leaving the project file itself untouched. */
export async function autosaveProject(path: string, project: ProjectData): Promise<void> {
  await writeFileAtomic(recoveryPathFor(path), serializeProject(project));
}

/**
 * The recovered work for the project at `path`, when a recovery file exists, is newer
 * than the project file and is itself a valid project; otherwise null. A damaged
 * recovery file is ignored, never an obstacle to opening the project.
 */
export async function findRecovery(path: string): Promise<{ project: ProjectData; savedAt: Date } | null> {
  const recovery = recoveryPathFor(path);
  let recoveryTime: number;
  try {
    recoveryTime = (await stat(recovery)).mtimeMs;
  } catch {
    return null;
  }
  const projectTime = await stat(path).then((s) => s.mtimeMs, () => -Infinity);
  if (recoveryTime <= projectTime) return null;
  try {
    return { project: await loadProject(recovery), savedAt: new Date(recoveryTime) };
  } catch {
    return null;
  }
}
