// Fitting again — after correcting the sheet, after tracing it with other scan
// settings, or with other fit settings — keeps the user's work: a letter the user
// edited whose ink and place on the scan did not change (the same traced boundary,
// the same frame — baseline and scale) keeps the outline and advance width the user
// gave it, taking only its new character. Every other letter takes its fresh fit:
// letters the user never edited follow the new settings, and letters that were
// merged, split, cut, traced differently or moved by a guide are fitted afresh, since
// their old outline no longer matches their ink.
import { createDocument, type DocumentGlyph, type GlyphDocument, type GlyphId } from '../../../core/document/index.ts';
import type { EditableLetter } from '../editor/letter-document.ts';

export interface EditedLetters {
  readonly document: GlyphDocument;
  readonly letters: readonly EditableLetter[];
}

/** The key of a letter's ink and frame: equal keys, the same outline fits. */
function inkKey(letter: EditableLetter): string {
  const { frame, ink } = letter.letter;
  return `${ink}|${frame.originX},${frame.baselineY},${frame.unitsPerPixel}`;
}

/** Whether the user changed a glyph from the way it was fitted (its outline or advance width). */
function edited(glyph: DocumentGlyph, asFitted: DocumentGlyph | undefined): boolean {
  return asFitted === undefined || glyph.advanceWidth !== asFitted.advanceWidth || JSON.stringify(glyph.outline) !== JSON.stringify(asFitted.outline);
}

/**
 * `fresh` (the letters just fitted) with the edited outline and advance width of
 * every letter of `previous` that the user edited (it differs from `previousFitted`,
 * the document as it was fitted) and whose ink and frame are the same, and the
 * previous vertical metrics when the fresh ones are the same as those `previous` was
 * fitted with, so metrics the user changed are kept too. Also returns how many
 * letters kept their edited outline. Pure: nothing passed in is changed.
 */
export function keptOutlines(previous: EditedLetters, previousFitted: GlyphDocument, fresh: EditedLetters): { document: GlyphDocument; letters: EditableLetter[]; kept: number } {
  const byKey = new Map(previous.letters.map((letter) => [inkKey(letter), letter]));
  let kept = 0;
  const glyphs: (DocumentGlyph & { id: GlyphId })[] = [];
  const letters = fresh.letters.map((letter) => {
    const glyph = fresh.document.glyphs[letter.id]!;
    const before = byKey.get(inkKey(letter));
    const mine = before ? previous.document.glyphs[before.id] : undefined;
    if (before && mine && edited(mine, previousFitted.glyphs[before.id])) {
      kept++;
      glyphs.push({ id: letter.id, ...glyph, outline: mine.outline, advanceWidth: mine.advanceWidth });
      return { ...letter, shiftX: before.shiftX };
    }
    glyphs.push({ id: letter.id, ...glyph });
    return letter;
  });
  const sameMetrics = JSON.stringify(fresh.document.metrics) === JSON.stringify(previousFitted.metrics);
  return { document: createDocument(glyphs, sameMetrics ? previous.document.metrics : fresh.document.metrics), letters, kept };
}
