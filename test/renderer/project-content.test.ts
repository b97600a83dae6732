// The project the window saves: a valid project file holding the scan, each fitted
// letter's edited glyph and the metrics — and, for a project that was opened, every
// setting and glyph the window does not edit, kept as it was (a user would otherwise
// lose their font name, fitting settings or imported glyphs by saving).
import { describe, expect, it } from 'vitest';
import * as v from 'valibot';
import { createDocument, DEFAULT_FONT_METRICS } from '../../core/document/index.ts';
import { onCurve } from '../../core/outline/index.ts';
import { projectSchema, type ProjectData } from '../../electron/io/project/project-schema.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { embedScan } from '../../electron/io/project/embedded-scan.ts';
import { projectContent, FIRST_SCAN_ID } from '../../renderer/src/project/project-content.ts';
import type { EditableLetter } from '../../renderer/src/editor/letter-document.ts';
import type { FittedLetter } from '../../renderer/src/scan/trace-protocol.ts';

const copy = embedScan(new Uint8Array([1, 2, 3, 4]));
const square = { contours: [{ points: [onCurve(50, 0), onCurve(250, 0), onCurve(250, 700), onCurve(50, 700)] }] };

function fittedLetter(index: number, character: string): FittedLetter {
  return { index, character, contours: [index], ink: `ink-${index}`, box: { x: 10, y: 10, width: 20, height: 70 }, frame: { originX: 10, baselineY: 80, unitsPerPixel: 10 }, outline: square, warnings: [], maxDeviation: 0.5, problem: null };
}

function editing(advanceWidth: number) {
  const letters: EditableLetter[] = [{ id: 'letter-3', character: 'I', letter: fittedLetter(2, 'I'), shiftX: 50 }];
  const document = createDocument([{ id: 'letter-3', name: 'letter-3', unicodes: [0x49], outline: square, advanceWidth }], { ...DEFAULT_FONT_METRICS, capHeight: 690 });
  return { document, letters };
}

describe('the project the window saves', () => {
  it('is a valid project file with the scan, the characters assigned, and each letter’s glyph as edited', () => {
    const project = projectContent({ scan: { fileName: 'sheet.png', copy, characters: 'ABI' }, scanFromBase: false, editing: editing(300), carried: [], base: null });
    expect(v.safeParse(projectSchema, project).success).toBe(true);
    expect(project.scans).toEqual([{ id: FIRST_SCAN_ID, path: 'sheet.png', embedded: copy, characters: 'ABI' }]);
    expect(project.glyphs).toEqual([
      { unicodes: ['0049'], advanceWidth: 300, outline: { contours: [[[50, 0, 'on'], [250, 0, 'on'], [250, 700, 'on'], [50, 700, 'on']]] }, source: { scan: FIRST_SCAN_ID, letter: 2 } },
    ]);
    expect(project.font.capHeight).toBe(690);
  });

  it('keeps what the window does not edit from the project that was opened', () => {
    const base: ProjectData = {
      ...newProject('Harbour Signs'),
      fit: { tolerance: 0.9, cornerAngleDegrees: 30, axisSnapDegrees: 3 },
      scans: [{ id: 'capitals', path: 'scans/capitals.png', dpi: 600, threshold: 'local', characters: 'ABI' }],
      glyphs: [
        { unicodes: ['0049'], name: 'I.alt', advanceWidth: 280, outline: { contours: [] }, source: { scan: 'capitals', letter: 2 }, fitOverrides: { forcedCorners: [1], forcedSmooth: [] } },
        { unicodes: ['0020'], advanceWidth: 250, outline: { contours: [] } },
      ],
    };
    const carried = base.glyphs.filter((g) => g.source === undefined);
    const project = projectContent({ scan: { fileName: 'capitals.png', copy, characters: 'ABI' }, scanFromBase: true, editing: editing(310), carried, base });
    expect(v.safeParse(projectSchema, project).success).toBe(true);
    expect(project.font.familyName).toBe('Harbour Signs');
    expect(project.fit).toEqual(base.fit);
    expect(project.scans).toEqual([{ id: 'capitals', path: 'scans/capitals.png', dpi: 600, threshold: 'local', characters: 'ABI', embedded: copy }]);
    expect(project.glyphs[0]).toMatchObject({ name: 'I.alt', advanceWidth: 310, source: { scan: 'capitals', letter: 2 }, fitOverrides: { forcedCorners: [1], forcedSmooth: [] } });
    expect(project.glyphs[1]).toEqual(carried[0]);
  });

  it('saves the corrections of the sheet once there is more than an assignment, and gives a renumbered letter no other letter\'s settings', () => {
    const base: ProjectData = {
      ...newProject('Harbour Signs'),
      scans: [{ id: 'capitals', path: 'capitals.png', characters: 'ABO' }],
      // Saved for letter #3 when it was an "O"; after a merge, letter #3 is the "I".
      glyphs: [{ unicodes: ['004F'], name: 'O.round', advanceWidth: 700, outline: { contours: [] }, source: { scan: 'capitals', letter: 2 }, fitOverrides: { forcedCorners: [4], forcedSmooth: [] } }],
    };
    const assignedOnly = projectContent({ scan: { fileName: 'capitals.png', copy, characters: 'ABI', edits: [{ kind: 'assign', characters: 'ABI' }] }, scanFromBase: true, editing: editing(300), carried: [], base });
    expect(assignedOnly.scans[0]).not.toHaveProperty('sheetEdits');
    const edits = [{ kind: 'merge', letters: [0, 1] }, { kind: 'assign', characters: 'ABI' }] as const;
    const corrected = projectContent({ scan: { fileName: 'capitals.png', copy, characters: 'ABI', edits }, scanFromBase: true, editing: editing(300), carried: [], base });
    expect(v.safeParse(projectSchema, corrected).success).toBe(true);
    expect(corrected.scans[0]?.sheetEdits).toEqual(edits);
    expect(corrected.glyphs[0]).toEqual({ unicodes: ['0049'], advanceWidth: 300, outline: { contours: [[[50, 0, 'on'], [250, 0, 'on'], [250, 700, 'on'], [50, 700, 'on']]] }, source: { scan: 'capitals', letter: 2 } });
  });

  it('holds no glyphs and no scan before anything is opened, and is still a valid file', () => {
    const project = projectContent({ scan: null, scanFromBase: false, editing: null, carried: [], base: null });
    expect(v.safeParse(projectSchema, project).success).toBe(true);
    expect(project.scans).toEqual([]);
    expect(project.glyphs).toEqual([]);
  });
});
