// The scan and fit settings in the project file: set in the window, saved, and read
// back exactly; a project saved before the app could set them opens with the
// defaults; a setting at its default is left out, so such a project's file reads as
// before; and a hand-edited setting no one can use is refused naming the field.
import { describe, expect, it } from 'vitest';
import { embedScan } from '../../electron/io/project/embedded-scan.ts';
import { parseProject, serializeProject } from '../../electron/io/project/project-file.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';
import { projectContent } from '../../renderer/src/project/project-content.ts';
import { projectSettings } from '../../renderer/src/project/saved-settings.ts';
import { DEFAULT_PIPELINE_SETTINGS, type PipelineSettings } from '../../core/pipeline/index.ts';

const copy = embedScan(new Uint8Array([1, 2, 3, 4]));

function saved(settings: PipelineSettings | undefined) {
  return projectContent({
    scan: { fileName: 'sheet.png', copy, characters: 'AB', ...(settings ? { settings: settings.scan } : {}) },
    ...(settings ? { fit: settings.fit } : {}),
    scanFromBase: false,
    editing: null,
    carried: [],
    base: null,
  });
}

describe('settings in the project file', () => {
  it('open exactly as they were saved', () => {
    const settings: PipelineSettings = {
      scan: { threshold: 172, invert: true, speckAreaMm2: 0.5, pinholeAreaMm2: 0 },
      fit: { tolerance: 4, cornerAngleDegrees: 40, fitMode: 'smooth', fairJoins: true },
    };
    const reopened = parseProject(serializeProject(saved(settings)), 'signs.stemline');
    expect(reopened.scans[0]).toMatchObject({ threshold: 172, invert: true, speckAreaMm2: 0.5, pinholeAreaMm2: 0 });
    expect(reopened.fit).toMatchObject({ tolerance: 4, cornerAngleDegrees: 40, fitMode: 'smooth', fairJoins: true, axisSnapDegrees: 2 });
    expect(projectSettings(reopened, reopened.scans[0])).toEqual(settings);
    const local = { ...settings, scan: { ...settings.scan, threshold: 'local' as const } };
    const reopenedLocal = parseProject(serializeProject(saved(local)), 'signs.stemline');
    expect(projectSettings(reopenedLocal, reopenedLocal.scans[0])).toEqual(local);
  });

  it('at their defaults are left out of the file, which then reads as one saved before the app set them', () => {
    const project = saved(DEFAULT_PIPELINE_SETTINGS);
    expect(project.scans[0]).toEqual({ id: 'scan-1', path: 'sheet.png', embedded: copy, characters: 'AB' });
    expect(project.fit).toEqual(newProject().fit);
  });

  it('open with the defaults from a project saved before the app could set them', () => {
    const old = { ...newProject('Harbour Signs'), scans: [{ id: 'scan-1', path: 'sheet.png', characters: 'AB' }] };
    const reopened = parseProject(serializeProject(old), 'old.stemline');
    expect(projectSettings(reopened, reopened.scans[0])).toEqual(DEFAULT_PIPELINE_SETTINGS);
    // A tolerance older files could hold beyond the range the app offers opens at the nearer end of it.
    expect(projectSettings({ ...reopened, fit: { ...reopened.fit, tolerance: 80 } }, reopened.scans[0]).fit.tolerance).toBe(50);
  });

  it('are refused, naming the field, when hand-edited to something no setting accepts', () => {
    const text = (edit: (p: Record<string, unknown>) => void) => {
      const project = JSON.parse(serializeProject(saved(DEFAULT_PIPELINE_SETTINGS))) as Record<string, unknown>;
      edit(project);
      return JSON.stringify(project);
    };
    const badMode = text((p) => ((p.fit as Record<string, unknown>).fitMode = 'fast'));
    expect(() => parseProject(badMode, 'bad.stemline')).toThrow(ProjectError);
    expect(() => parseProject(badMode, 'bad.stemline')).toThrow(/fit\.fitMode/);
    const badSpeck = text((p) => (((p.scans as Record<string, unknown>[])[0]!).speckAreaMm2 = -2));
    expect(() => parseProject(badSpeck, 'bad.stemline')).toThrow(/scans\.0\.speckAreaMm2|speckAreaMm2/);
  });
});
