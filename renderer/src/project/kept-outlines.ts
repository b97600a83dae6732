// Fitting again after correcting the sheet keeps the user's work: a letter whose ink
// and place on the scan did not change (same contours, same frame — baseline and
// scale) keeps the outline and advance width the user edited, taking only its new
// character; letters that were merged, split, cut or moved by a guide are fitted
// afresh, since their old outline no longer matches their ink.
import { createDocument, type DocumentGlyph, type GlyphDocument, type GlyphId } from '../../../core/document/index.ts';
import type { EditableLetter } from '../editor/letter-document.ts';

export interface EditedLetters {
  readonly document: GlyphDocument;
  readonly letters: readonly EditableLetter[];
}

/** The key of a letter's ink and frame: equal keys, the same outline fits. */
function inkKey(letter: EditableLetter): string {
  const { frame, contours } = letter.letter;
  return `${contours.join(',')}|${frame.originX},${frame.baselineY},${frame.unitsPerPixel}`;
}

/**
 * `fresh` (the letters just fitted) with the edited outline and advance width of
 * every letter of `previous` whose ink and frame are the same, and the previous
 * vertical metrics when the fresh ones are the same as those previous was fitted
 * with (`previousFitted`), so metrics the user changed are kept too. Also returns how
 * many letters kept their outline. Pure: nothing passed in is changed.
 */
export function keptOutlines(previous: EditedLetters, previousFitted: GlyphDocument['metrics'], fresh: EditedLetters): { document: GlyphDocument; letters: EditableLetter[]; kept: number } {
  const byKey = new Map(previous.letters.map((letter) => [inkKey(letter), letter]));
  let kept = 0;
  const glyphs: (DocumentGlyph & { id: GlyphId })[] = [];
  const letters = fresh.letters.map((letter) => {
    const glyph = fresh.document.glyphs[letter.id]!;
    const before = byKey.get(inkKey(letter));
    const edited = before ? previous.document.glyphs[before.id] : undefined;
    if (before && edited) {
      kept++;
      glyphs.push({ id: letter.id, ...glyph, outline: edited.outline, advanceWidth: edited.advanceWidth });
      return { ...letter, shiftX: before.shiftX };
    }
    glyphs.push({ id: letter.id, ...glyph });
    return letter;
  });
  const sameMetrics = JSON.stringify(fresh.document.metrics) === JSON.stringify(previousFitted);
  return { document: createDocument(glyphs, sameMetrics ? previous.document.metrics : fresh.document.metrics), letters, kept };
}
