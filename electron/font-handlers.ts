// The font intents' handlers: build the project's font in memory for the proof, and
// export it as an .otf file to a place the user chose (the save dialog, or a name in
// the browser workspace, the same rules as saving a project). The font is written
// by electron/io/font/ from the glyphs the renderer assembled; a source that cannot
// make a valid font is refused with the writer's message, naming the glyph.
import { basename } from 'node:path';
import { stat } from 'node:fs/promises';
import type { ExportedFont, FontContent, HostIntents, ProofFont } from './api-contract.ts';
import type { HostContext } from './host-context.ts';
import { HandlerError } from './handler-error.ts';
import { fileFailure } from './file-failure.ts';
import { OutlineError } from '../core/outline/index.ts';
import { FontError } from './io/font/font-error.ts';
import type { FontSource } from './io/font/font-model.ts';
import { writeOtf } from './io/font/write-font.ts';
import { FONT_FILE_EXTENSION } from './io/font/write-font-file.ts';
import { writeFileAtomic } from './io/atomic-write.ts';
import { fontSourceFromProject } from './io/project/font-from-project.ts';
import { repeatedCharacterProblem } from './repeated-glyph-characters.ts';

type Args<K extends keyof HostIntents> = HostIntents[K]['args'];

/** The space, which the writer adds to every font that has none (prepare-glyphs.ts). */
const SPACE = ' ';

/** The font source for `content`, or a HandlerError 'font-build' saying what to change. */
function sourceOf(content: FontContent): FontSource {
  // Two letters with one character: said by the letters' numbers on the sheet, not by glyph numbers (repeated-glyph-characters.ts).
  const repeated = repeatedCharacterProblem(content.glyphs);
  if (repeated !== null) throw new HandlerError('font-build', `The font could not be built: ${repeated}`);
  try {
    return fontSourceFromProject(content);
  } catch (error) {
    throw buildFailure(error);
  }
}

function buildFailure(error: unknown): unknown {
  if (error instanceof FontError) {
    const where = error.glyph === undefined ? '' : ` (glyph "${error.glyph}")`;
    return new HandlerError('font-build', `The font could not be built${where}: ${error.message}`);
  }
  if (error instanceof OutlineError) {
    return new HandlerError('font-build', `The font could not be built: an outline is damaged (${error.message}). Undo the last edit, or refit the letter.`);
  }
  return error;
}

/** The font file's bytes for `source`, or a HandlerError 'font-build'. */
function fontBytes(source: FontSource): Uint8Array {
  try {
    return writeOtf(source);
  } catch (error) {
    throw buildFailure(error);
  }
}

/** Every character `source`'s font maps: its glyphs' characters and the space. */
function mappedCharacters(source: FontSource): string[] {
  const characters = new Set<string>([SPACE]);
  for (const glyph of source.glyphs) {
    for (const character of glyph.characters ?? (glyph.character === '' ? [] : [glyph.character])) characters.add(character);
  }
  return [...characters].sort((a, b) => a.codePointAt(0)! - b.codePointAt(0)!);
}

/** The name a save dialog suggests: the font's family name as a file name. */
function suggestedFontName(content: FontContent): string {
  const base = content.font.familyName.replace(/[/\\:*?"<>|\u0000-\u001f]+/g, ' ').trim() || 'Untitled';
  return `${base}${FONT_FILE_EXTENSION}`;
}

async function exists(path: string): Promise<boolean> {
  return stat(path).then(() => true, () => false);
}

export function buildProofFont(args: Args<'buildProofFont'>, _context: HostContext): ProofFont {
  const source = sourceOf(args);
  const bytes = fontBytes(source);
  return { base64: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('base64'), characters: mappedCharacters(source) };
}

export async function exportFont(args: Args<'exportFont'>, context: HostContext): Promise<ExportedFont | null> {
  // The font is built before the user is asked where to put it, so a font that
  // cannot be built is reported at once and no dialog is shown in vain.
  const source = sourceOf(args);
  const bytes = fontBytes(source);
  let path: string | null;
  try {
    path = await context.projects.places.chooseToExportFont(args.name, suggestedFontName(args));
  } catch (error) {
    throw fileFailure(error, 'export the font to', 'the chosen file');
  }
  if (path === null) return null;
  const name = basename(path);
  const replaced = await exists(path);
  try {
    await writeFileAtomic(path, bytes);
  } catch (error) {
    throw fileFailure(error, 'export the font to', name);
  }
  return { name, path, replaced };
}
