// The projects the user opened or saved lately, most recent first: the list behind
// File ▸ Open recent and the renderer's recent-files intent. Kept in the app's
// per-user folder (app-data-folder.ts) as a small JSON file written atomically; read
// back validated (absolute paths of project files only, bounded in number and length),
// so a damaged or edited file can never name anything else. Only paths a dialog
// answered, the OS handed over, or the browser workspace held are ever added.
import { readFile } from 'node:fs/promises';
import { mkdir } from 'node:fs/promises';
import { dirname, isAbsolute, join } from 'node:path';
import * as v from 'valibot';
import { writeFileAtomic } from '../io/atomic-write.ts';
import { hasProjectExtension } from './workspace-files.ts';

/** How many recent projects are kept: ten, the length of most applications' Open Recent (common practice). */
export const MAX_RECENT_PROJECTS = 10;

/** Longest path kept: PATH_MAX on Linux (4096 bytes); longer ones are not a place a dialog answered. */
export const MAX_RECENT_PATH_LENGTH = 4096;

/**
 * The largest list file read back: the kept number of paths of the longest length,
 * each with 64 bytes for its quotes, comma, indent and escapes, and 256 for the
 * format and version fields around them.
 */
const MAX_RECENT_FILE_BYTES = MAX_RECENT_PROJECTS * (MAX_RECENT_PATH_LENGTH + 64) + 256;

/** The file in the app's folder. */
export const RECENT_PROJECTS_FILE_NAME = 'recent-projects.json';

const RECENT_FORMAT = 'stemline-recent-projects';
const RECENT_VERSION = 1;

const pathSchema = v.pipe(
  v.string(),
  v.maxLength(MAX_RECENT_PATH_LENGTH),
  v.check((path) => isAbsolute(path) && hasProjectExtension(path) && !path.includes('\u0000'), 'an absolute path of a project file'),
);

const fileSchema = v.object({
  format: v.literal(RECENT_FORMAT),
  version: v.literal(RECENT_VERSION),
  projects: v.array(v.unknown()),
});

/** The recent-projects file in the app's per-user folder. */
export function recentProjectsPath(appFolder: string): string {
  return join(appFolder, RECENT_PROJECTS_FILE_NAME);
}

/** Whether `path` may be kept in the list (absolute, a project file's name, not too long). */
export function isRecentPath(path: string): boolean {
  return v.is(pathSchema, path);
}

/**
 * The list, backed by the file at `file`. Reads are taken fresh each time (another
 * window or the other host may have changed it); writes are queued so two changes
 * never interleave. A failure to write is reported to `onWriteFailure` and otherwise
 * ignored: a recent list is a convenience, never a reason for a save to fail.
 */
export class RecentProjects {
  private writes: Promise<void> = Promise.resolve();
  private readonly listeners = new Set<(paths: readonly string[]) => void>();

  constructor(
    private readonly file: string,
    private readonly onWriteFailure: (error: unknown) => void = () => undefined,
  ) {}

  /** The kept paths, most recent first; a missing or damaged file is an empty list, and entries not valid are left out. */
  async list(): Promise<string[]> {
    await this.writes;
    return this.read();
  }

  /** Puts `path` first (once); a path not valid for the list is ignored. */
  add(path: string): Promise<void> {
    if (!isRecentPath(path)) return this.writes;
    return this.change((paths) => [path, ...paths.filter((p) => p !== path)]);
  }

  /** Takes `path` off the list (its file is gone). */
  remove(path: string): Promise<void> {
    return this.change((paths) => paths.filter((p) => p !== path));
  }

  /** Empties the list. */
  clear(): Promise<void> {
    return this.change(() => []);
  }

  /** Calls `listener` with the new list after each change (the shell rebuilds its menu). */
  onChange(listener: (paths: readonly string[]) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private change(update: (paths: string[]) => string[]): Promise<void> {
    const run = this.writes.then(async () => {
      const before = await this.read();
      const after = update(before).slice(0, MAX_RECENT_PROJECTS);
      if (after.length === before.length && after.every((p, i) => p === before[i])) return;
      try {
        await mkdir(dirname(this.file), { recursive: true });
        await writeFileAtomic(this.file, `${JSON.stringify({ format: RECENT_FORMAT, version: RECENT_VERSION, projects: after }, null, 1)}\n`);
      } catch (error) {
        this.onWriteFailure(error);
        return;
      }
      for (const listener of this.listeners) listener(after);
    });
    this.writes = run.catch(() => undefined);
    return this.writes;
  }

  private async read(): Promise<string[]> {
    let raw: unknown;
    try {
      const bytes = await readFile(this.file);
      if (bytes.length > MAX_RECENT_FILE_BYTES) return [];
      raw = JSON.parse(bytes.toString('utf8'));
    } catch {
      return [];
    }
    const parsed = v.safeParse(fileSchema, raw);
    if (!parsed.success) return [];
    const paths: string[] = [];
    for (const entry of parsed.output.projects) {
      if (typeof entry === 'string' && isRecentPath(entry) && !paths.includes(entry)) paths.push(entry);
      if (paths.length === MAX_RECENT_PROJECTS) break;
    }
    return paths;
  }
}
