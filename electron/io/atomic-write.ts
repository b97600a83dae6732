// Writes a file so that a reader never sees half of it: the bytes go to a temporary
// file beside the target, are flushed to disk, and replace the target in one rename.
// If anything fails, the previous file (if any) is left as it was.
import { open, rename, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { randomBytes } from 'node:crypto';

/** Atomically replaces `path` with `contents`. */
export async function writeFileAtomic(path: string, contents: string | Uint8Array): Promise<void> {
  const temporary = join(dirname(path), `.${basename(path)}.${randomBytes(6).toString('hex')}.tmp`);
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
}
