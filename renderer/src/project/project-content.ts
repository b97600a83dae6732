// The project file's contents built from what the user has in the window: the scan
// (embedded, with the characters assigned on it), every fitted letter's glyph as
// edited (characters, outline, advance width, which letter of the scan it is), the
// corrections made to the scan's letters and guides, the scan and fit settings (saved-settings.ts), the font's vertical metrics and which of them the designer typed (saved-metrics.ts), and — from the project that was opened — every setting
// and glyph the window does not edit, kept as it was.
import type { DocumentGlyph, GlyphDocument } from '../../../core/document/index.ts';
import { outlineToJson } from '../../../core/outline/index.ts';
import { newProject } from '../../../electron/io/project/new-project.ts';
import { unicodeHexOf } from '../../../electron/io/project/project-unicodes.ts';
import type { EmbeddedScan, ProjectData, ProjectGlyph, ProjectScan } from '../../../electron/io/project/project-schema.ts';
import { savedSheetEdit } from '../../../electron/io/project/sheet-edits-schema.ts';
import type { SheetEdit } from '../../../core/raster/index.ts';
import type { EditableLetter } from '../editor/letter-document.ts';
import { savedMetricFields } from './saved-metrics.ts';
import { savedFitFields, savedScanFields } from './saved-settings.ts';
import type { FitSettings, ScanSettings } from '../../../core/pipeline/index.ts';

/** Id of the scan in a project started in the window. */
export const FIRST_SCAN_ID = 'scan-1';

export interface WindowContent {
  /**
   * The opened scan: its file name, embedded copy, the characters last assigned on it
   * and the corrections made to it (assignments included); null before a scan is opened.
   */
  readonly scan: { readonly fileName: string; readonly copy: EmbeddedScan; readonly characters: string | null; readonly edits?: readonly SheetEdit[]; readonly settings?: ScanSettings } | null;
  /** The fit settings in the window; absent: the opened project's, as they were. */
  readonly fit?: FitSettings;
  /** Whether `scan` is the scan of `base` (restored from it), so its entry and glyph settings carry over. */
  readonly scanFromBase: boolean;
  /** The fitted letters being edited; null before fitting. */
  readonly editing: { readonly document: GlyphDocument; readonly letters: readonly EditableLetter[] } | null;
  /** Glyphs of `base` not drawn from its scan (imported from a font), kept unchanged. */
  readonly carried: readonly ProjectGlyph[];
  /** The project that was opened, or null for a new one. */
  readonly base: ProjectData | null;
}

function glyphOfLetter(glyph: DocumentGlyph, letter: EditableLetter, scanId: string, saved: ProjectGlyph | undefined): ProjectGlyph {
  return {
    unicodes: glyph.unicodes.map((codePoint) => unicodeHexOf(String.fromCodePoint(codePoint))),
    ...(saved?.name === undefined ? {} : { name: saved.name }),
    advanceWidth: glyph.advanceWidth,
    outline: outlineToJson(glyph.outline),
    source: { scan: scanId, letter: letter.letter.index },
    ...(saved?.fitOverrides === undefined ? {} : { fitOverrides: saved.fitOverrides }),
  };
}

/** The project for `content`. Pure: nothing is read or changed. */
export function projectContent(content: WindowContent): ProjectData {
  const start = content.base ?? newProject();
  const baseScan = content.scanFromBase ? content.base?.scans[0] : undefined;
  const scanId = baseScan?.id ?? FIRST_SCAN_ID;
  const scans: ProjectScan[] = [];
  if (content.scan) {
    const { characters: _characters, sheetEdits: _sheetEdits, ...base } = baseScan ?? { id: scanId, path: content.scan.fileName };
    // The window's scan settings replace the saved ones; without them, the saved ones stay.
    const { threshold: _threshold, invert: _invert, speckAreaMm2: _speck, pinholeAreaMm2: _pinhole, ...unset } = base;
    const kept = content.scan.settings === undefined ? base : { ...unset, ...savedScanFields(content.scan.settings) };
    // Assignments alone are saved as `characters`, as before corrections existed; any other correction saves the whole list.
    const edits = content.scan.edits ?? [];
    const corrected = edits.some((edit) => edit.kind !== 'assign');
    scans.push({
      ...kept,
      embedded: content.scan.copy,
      ...(content.scan.characters === null ? {} : { characters: content.scan.characters }),
      ...(corrected ? { sheetEdits: edits.map(savedSheetEdit) } : {}),
    });
  }
  // A saved glyph's own settings (name, fitting overrides) carry over to the letter it was saved for: the same
  // letter of the scan with the same character. Corrections can renumber letters, so the number alone is not enough.
  const savedGlyph = (letterIndex: number, unicodes: readonly number[]) =>
    baseScan
      ? content.base?.glyphs.find((g) => g.source?.scan === scanId && g.source.letter === letterIndex && g.unicodes[0] === (unicodes[0] === undefined ? undefined : unicodeHexOf(String.fromCodePoint(unicodes[0]))))
      : undefined;
  const letterGlyphs = content.editing
    ? content.editing.letters.flatMap((letter) => {
        const glyph = content.editing!.document.glyphs[letter.id];
        return glyph ? [glyphOfLetter(glyph, letter, scanId, savedGlyph(letter.letter.index, glyph.unicodes))] : [];
      })
    : [];
  const document = content.editing?.document;
  return {
    format: start.format,
    formatVersion: start.formatVersion,
    font: document ? { ...start.font, ...savedMetricFields(document) } : start.font,
    fit: content.fit === undefined ? start.fit : savedFitFields(start.fit, content.fit),
    scans,
    glyphs: [...letterGlyphs, ...content.carried],
  };
}
