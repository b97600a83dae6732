// The font heights in the project file: the values a designer typed come back as
// typed when the project is opened, the others follow the drawing as measured again,
// and a project saved before the file recorded who set what still opens with exactly
// the metrics it was saved with.
import { describe, expect, it } from 'vitest';
import { createDocument, createEditorState, dispatch, resolveMetrics, setFontMetric, type FontMetrics } from '../../core/document/index.ts';
import { parseProject, serializeProject } from '../../electron/io/project/project-file.ts';
import { ProjectError } from '../../electron/io/project/project-error.ts';
import { newProject } from '../../electron/io/project/new-project.ts';
import { savedMetricFields, savedMetricOverrides } from '../../renderer/src/project/saved-metrics.ts';

const MEASURED: FontMetrics = { unitsPerEm: 1000, ascender: 760, descender: -236, capHeight: 712, xHeight: 498, lineGap: 204 };

/** A format 2 project as Stemline wrote it before `metricsSetByUser` existed: no such field, and here no line gap either. */
function projectBeforeTypedMetrics(): string {
  return JSON.stringify({
    format: 'stemline-project',
    formatVersion: 2,
    savedBy: 'Stemline 0.1.0',
    font: { familyName: 'Harbour Signs', styleName: 'Regular', unitsPerEm: 1000, capHeight: 712, xHeight: 498, ascender: 760, descender: -236 },
    fit: { tolerance: 1, cornerAngleDegrees: 40, axisSnapDegrees: 3 },
    scans: [],
    glyphs: [],
  });
}

describe('font heights in the project file', () => {
  it('a project saved before typed metrics existed opens, with exactly the metrics it was saved with', () => {
    const project = parseProject(projectBeforeTypedMetrics(), 'old.stemline');
    expect(project.font.metricsSetByUser).toBeUndefined();
    // The drawing, traced again, measures the same heights; the line gap the file lacks was 0 in its font.
    const overrides = savedMetricOverrides(project.font, MEASURED);
    expect(overrides).toEqual({ lineGap: 0 });
    expect(resolveMetrics(MEASURED, overrides)).toEqual({ ...MEASURED, lineGap: 0 });
  });

  it('in such a project, a saved value the drawing no longer measures is kept as the designer’s', () => {
    const project = parseProject(projectBeforeTypedMetrics(), 'old.stemline');
    const remeasured = { ...MEASURED, xHeight: 505 };
    expect(resolveMetrics(remeasured, savedMetricOverrides(project.font, remeasured))).toEqual({ ...MEASURED, lineGap: 0 });
  });

  it('typed values come back as typed, the others follow the drawing as measured again', () => {
    let state = createEditorState(createDocument([], MEASURED));
    state = dispatch(state, setFontMetric(state.document, 'xHeight', 520));
    state = dispatch(state, setFontMetric(state.document, 'lineGap', 0));
    const saved = { ...newProject('Harbour Signs'), font: { ...newProject('Harbour Signs').font, ...savedMetricFields(state.document) } };
    const reopened = parseProject(serializeProject(saved), 'new.stemline');
    expect(reopened.font).toMatchObject({ xHeight: 520, lineGap: 0, ascender: 760, metricsSetByUser: ['xHeight', 'lineGap'] });
    const remeasured = { ...MEASURED, ascender: 770 };
    const overrides = savedMetricOverrides(reopened.font, remeasured);
    expect(overrides).toEqual({ xHeight: 520, lineGap: 0 });
    expect(resolveMetrics(remeasured, overrides)).toEqual({ ...MEASURED, ascender: 770, xHeight: 520, lineGap: 0 });
  });

  it('a file naming a metric that does not exist is refused, naming the field', () => {
    const text = projectBeforeTypedMetrics().replace('"descender":-236', '"descender":-236,"metricsSetByUser":["baseline"]');
    let error: unknown;
    try {
      parseProject(text, 'odd.stemline');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ProjectError);
    expect((error as ProjectError).message).toContain('font.metricsSetByUser.0');
  });
});
