// The corrections of a scan's letters and guides in the project file: a project
// saved before they existed (no "sheetEdits") still opens unchanged; corrections
// saved open again exactly; and a hand-edited correction that makes no sense is
// refused with the field that is wrong, before anything is replayed on the scan.
import { describe, expect, it } from 'vitest';
import { parseProject, serializeProject } from '../../electron/io/project/project-file.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';
import { savedSheetEdit } from '../../electron/io/project/sheet-edits-schema.ts';
import type { ProjectData } from '../../electron/io/project/project-schema.ts';
import type { SheetEdit } from '../../core/raster/index.ts';

const EDITS: SheetEdit[] = [
  { kind: 'merge', letters: [2, 3] },
  { kind: 'cut', letter: 3, x: 290 },
  { kind: 'split', letter: 0, x: 61.5 },
  { kind: 'assign', characters: 'Hxilt' },
  { kind: 'retype', letter: 4, character: 'k' },
  { kind: 'baseline', row: 0, y: 160.5 },
  { kind: 'height', guide: 'x-height', pixels: 70 },
  { kind: 'height', guide: 'cap-height', pixels: null },
];

function project(edits?: readonly SheetEdit[]): ProjectData {
  return {
    ...newProject('Harbour Signs'),
    scans: [{ id: 'scan-1', path: 'row.png', characters: 'Hxilk', ...(edits ? { sheetEdits: edits.map(savedSheetEdit) } : {}) }],
  };
}

function refusal(text: string): string {
  try {
    parseProject(text, 'edited.stemline');
  } catch (error) {
    expect(error).toBeInstanceOf(ProjectError);
    return (error as Error).message;
  }
  throw new Error('the project was accepted');
}

describe('corrections saved with a scan', () => {
  it('are optional: a project saved before them opens as it was', () => {
    // The file an earlier Stemline wrote: format 2, a scan with characters and no "sheetEdits".
    const old = serializeProject(project());
    expect(old).not.toContain('sheetEdits');
    const opened = parseProject(old, 'old.stemline');
    expect(opened.scans[0]).toEqual({ id: 'scan-1', path: 'row.png', characters: 'Hxilk' });
  });

  it('open again exactly as saved, in order', () => {
    expect(parseProject(serializeProject(project(EDITS)), 'corrected.stemline').scans[0]?.sheetEdits).toEqual(EDITS);
  });

  it('are refused by field when hand-edited into nonsense', () => {
    const text = (edits: unknown) => serializeProject(project()).replace('"characters": "Hxilk"', `"characters": "Hxilk", "sheetEdits": ${JSON.stringify(edits)}`);
    expect(refusal(text([{ kind: 'merge', letters: [2] }]))).toMatch(/^edited\.stemline: scans\.0\.sheetEdits\.0\.letters is wrong.*at least two letters to merge/);
    expect(refusal(text([{ kind: 'retype', letter: 1.5, character: 'a' }]))).toMatch(/scans\.0\.sheetEdits\.0\.letter is wrong.*a letter number counted from 0/);
    expect(refusal(text([{ kind: 'height', guide: 'x-height', pixels: -4 }]))).toMatch(/scans\.0\.sheetEdits\.0\.pixels is wrong.*a height above the baseline/);
    expect(refusal(text([{ kind: 'erase', letter: 0 }]))).toMatch(/scans\.0\.sheetEdits\.0\.kind is wrong.*one of assign, retype, merge, split, cut, baseline, height/);
    expect(refusal(text([{ kind: 'cut', letter: 0, x: 12, extra: true }]))).toMatch(/scans\.0\.sheetEdits\.0\.extra is wrong/);
  });
});
