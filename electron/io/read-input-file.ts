// Reads a file the user named (a scan, a font, a project), turning the file system's
// failures into an InputError whose message names the file and says what happened.
import { readFile } from 'node:fs/promises';
import { basename } from 'node:path';
import { InputError } from './input-error.ts';

export async function readInputFile(path: string): Promise<Buffer> {
  try {
    return await readFile(path);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'there is no such file' : code === 'EISDIR' ? 'it is a folder, not a file' : code === 'EACCES' ? 'permission was denied' : `it could not be read (${code ?? String(error)})`;
    throw new InputError('file-unreadable', path, `${basename(path)}: ${why}.`);
  }
}
