// Saves a font source as an .otf file, atomically: a reader (a font manager, a
// browser watching the file) sees either the previous file or the complete new one,
// never half of it.
import { writeFileAtomic } from '../atomic-write.ts';
import type { FontSource } from './font-model.ts';
import { writeOtf } from './write-font.ts';

/** The extension of the font files written: OpenType with CFF outlines (OpenType spec, "Filenames": .otf). */
export const FONT_FILE_EXTENSION = '.otf';

/**
 * Writes `source` as an OpenType CFF font to `path`, replacing any file there.
 * Throws FontError for a source that cannot make a valid font (nothing is written
 * then), or the file system's error when the file cannot be written.
 */
export async function saveFont(path: string, source: FontSource): Promise<void> {
  await writeFileAtomic(path, writeOtf(source));
}
