// The editor's letters restored from a project: the project's scan was traced and
// its letters fitted again (for where each letter sits on the scan and the fit's
// warnings), and each saved glyph replaces its letter's fresh outline with the one
// the user edited, with its advance width and characters, so editing continues where
// it was left. Vertical metrics are measured from the scan again, with the designer's
// values from the project over them (saved-metrics.ts).
import { createDocument, type DocumentGlyph, type GlyphDocument, type GlyphId } from '../../../core/document/index.ts';
import { outlineFromJson } from '../../../core/outline/index.ts';
import { DEFAULT_SIDEBEARING_PER_CAP_HEIGHT } from '../../../core/metrics/index.ts';
import type { ProjectData, ProjectGlyph } from '../../../electron/io/project/project-schema.ts';
import type { FittedSheet } from '../scan/trace-protocol.ts';
import { fontMetricsOf, letterDocument, letterGlyphId, type EditableLetter } from '../editor/letter-document.ts';
import { savedMetricOverrides } from './saved-metrics.ts';

/** A project whose letters no longer match its scan; the message is for the user. */
export class RestoreError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RestoreError';
  }
}

const HEX = 16;

export interface RestoredLetters {
  /** The fitted sheet with only the saved letters, each with an outline. */
  readonly sheet: FittedSheet;
  readonly document: GlyphDocument;
  readonly letters: EditableLetter[];
}

/**
 * The letters of `sheet` (fitted afresh from the project's scan) carrying the saved
 * `glyphs` (each with a `source` letter on that scan), in the project's order.
 * Throws RestoreError when a glyph names a letter the scan does not have.
 */
export function restoredLetters(sheet: FittedSheet, glyphs: readonly ProjectGlyph[], font: ProjectData['font'], projectName: string): RestoredLetters {
  const fresh = new Map(letterDocument(sheet).letters.map((letter) => [letter.letter.index, letter]));
  const byIndex = new Map(sheet.letters.map((letter) => [letter.index, letter]));
  /** Where a letter whose fresh fit failed starts: its ink's left edge (frame x = 0) at the default sidebearing. */
  const defaultShift = Math.round(DEFAULT_SIDEBEARING_PER_CAP_HEIGHT * fontMetricsOf(sheet).capHeight);
  const documentGlyphs: (DocumentGlyph & { id: GlyphId })[] = [];
  const letters: EditableLetter[] = [];
  for (const glyph of glyphs) {
    const index = glyph.source?.letter ?? -1;
    const fitted = byIndex.get(index);
    if (fitted === undefined) {
      throw new RestoreError(`${projectName}: a glyph belongs to letter #${index + 1} of the scan, but the scan now shows ${sheet.letters.length} assigned letters. The file has not been changed; open it in the version of Stemline that saved it.`);
    }
    const outline = outlineFromJson(glyph.outline);
    const codePoints = glyph.unicodes.map((hex) => Number.parseInt(hex, HEX));
    const character = codePoints.length > 0 ? String.fromCodePoint(codePoints[0]!) : fitted.character;
    const id = letterGlyphId(fitted);
    const shiftX = fresh.get(index)?.shiftX ?? defaultShift;
    documentGlyphs.push({ id, name: id, unicodes: codePoints, outline, advanceWidth: glyph.advanceWidth });
    letters.push({ id, character, letter: { ...fitted, character, outline: fitted.outline ?? outline, problem: null }, shiftX });
  }
  if (new Set(letters.map((l) => l.id)).size !== letters.length) {
    throw new RestoreError(`${projectName}: two glyphs belong to the same letter of the scan. The file has not been changed; fix it by hand or open its recovery copy.`);
  }
  const measured = fontMetricsOf(sheet);
  return { sheet: { ...sheet, letters: letters.map((l) => l.letter) }, document: createDocument(documentGlyphs, measured, savedMetricOverrides(font, measured)), letters };
}
