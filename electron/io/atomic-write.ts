// Writes a file so that a reader never sees half of it: the bytes go to a temporary
// file beside the target, are flushed to disk, and replace the target in one rename.
// If anything fails, the previous file (if any) is left as it was. A write cut short
// by a crash or a killed process leaves its temporary file behind; each later write
// of the same file clears those that are old enough to belong to no write still
// running.
import { open, readdir, rename, stat, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { randomBytes } from 'node:crypto';

/**
 * Age after which a leftover temporary file is cleared: 10 minutes, far longer than
 * writing even an embedded-scan project takes (seconds), so a write still running in
 * another window is never touched. Our own choice.
 */
export const STALE_TEMPORARY_MS = 10 * 60 * 1000;

/** Hex digits of the random part of a temporary file's name. */
const RANDOM_BYTES = 6;

/** The temporary file names of writes to `name`: `.NAME.<12 hex digits>.tmp`. */
function isTemporaryOf(entry: string, name: string): boolean {
  const prefix = `.${name}.`;
  if (!entry.startsWith(prefix) || !entry.endsWith('.tmp')) return false;
  return /^[0-9a-f]+$/.test(entry.slice(prefix.length, -'.tmp'.length)) && entry.length === prefix.length + RANDOM_BYTES * 2 + '.tmp'.length;
}

/** Atomically replaces `path` with `contents`. */
export async function writeFileAtomic(path: string, contents: string | Uint8Array): Promise<void> {
  const temporary = join(dirname(path), `.${basename(path)}.${randomBytes(RANDOM_BYTES).toString('hex')}.tmp`);
  const handle = await open(temporary, 'w');
  try {
    await handle.writeFile(contents);
    await handle.sync();
  } finally {
    await handle.close();
  }
  try {
    await rename(temporary, path);
  } catch (error) {
    await unlink(temporary).catch(() => undefined);
    throw error;
  }
  await clearStaleTemporaries(path);
}

/** Removes the leftover temporary files of earlier writes to `path` older than STALE_TEMPORARY_MS; never fails the write. */
export async function clearStaleTemporaries(path: string, now = Date.now()): Promise<void> {
  const folder = dirname(path);
  const name = basename(path);
  let entries: string[];
  try {
    entries = await readdir(folder);
  } catch {
    return;
  }
  for (const entry of entries) {
    if (!isTemporaryOf(entry, name)) continue;
    const leftover = join(folder, entry);
    try {
      if (now - (await stat(leftover)).mtimeMs > STALE_TEMPORARY_MS) await unlink(leftover);
    } catch {
      // Gone already, or not ours to remove: the write itself has succeeded.
    }
  }
}
