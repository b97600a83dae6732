// The font's vertical metrics between the editor and the project file. The file keeps
// the metrics in force (what the font is built with: units per em, cap height,
// x-height, ascender, descender, line gap) and, in `metricsSetByUser`, which of them
// the designer typed; on opening, those stay as typed and the others are measured
// again from the drawing. A file saved before `metricsSetByUser` existed says nothing
// about who set what: there every saved value that differs from what the drawing
// measures counts as the designer's, so the project opens with exactly the metrics it
// was saved with.
import { METRIC_NAMES, type FontMetrics, type GlyphDocument, type MetricName, type MetricOverrides } from '../../../core/document/index.ts';
import type { ProjectData } from '../../../electron/io/project/project-schema.ts';

type SavedFont = ProjectData['font'];

/** The line gap of a file that has none (the font writer's default, font-model.ts). */
const MISSING_LINE_GAP = 0;

/** The project font's metric fields for the document's metrics: the values in force and which the designer typed. */
export function savedMetricFields(document: GlyphDocument): Pick<SavedFont, MetricName | 'metricsSetByUser'> {
  const { unitsPerEm, ascender, descender, capHeight, xHeight, lineGap } = document.metrics;
  const metricsSetByUser = METRIC_NAMES.filter((name) => document.metricOverrides[name] !== undefined);
  return { unitsPerEm, ascender, descender, capHeight, xHeight, lineGap, metricsSetByUser };
}

/** The saved metrics in force, a missing line gap read as 0. */
export function savedMetrics(font: SavedFont): FontMetrics {
  return { unitsPerEm: font.unitsPerEm, ascender: font.ascender, descender: font.descender, capHeight: font.capHeight, xHeight: font.xHeight, lineGap: font.lineGap ?? MISSING_LINE_GAP };
}

/**
 * The designer's values to open `font` with over the `measured` metrics of its
 * drawing: the ones it lists as typed; for a file without that list, every saved value
 * that differs from the measured one.
 */
export function savedMetricOverrides(font: SavedFont, measured: FontMetrics): MetricOverrides {
  const saved = savedMetrics(font);
  const typed = font.metricsSetByUser ?? METRIC_NAMES.filter((name) => saved[name] !== measured[name]);
  return Object.fromEntries(typed.map((name) => [name, saved[name]]));
}
