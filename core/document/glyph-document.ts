/**
 * The editable glyph document: immutable state the editor renders and transactions
 * change (in the manner of CodeMirror 6's EditorState). It holds every glyph's outline
 * and horizontal metrics, the font-wide vertical metrics (the values measured from
 * the drawing, the ones the designer typed over them, and the two resolved), and the
 * point selection.
 *
 * Plain readonly data with structural sharing: an edit to one contour makes a new
 * contour, a new contour list for its glyph, a new glyph record and a new glyph table,
 * and shares everything else with the previous state. Nothing here mutates its input.
 *
 * Sidebearings are computed, not stored. The advance width is stored; the left
 * sidebearing is the ink's left edge (xMin of the outline's tight bounds, which is what
 * OpenType's hmtx records) and the right sidebearing is advance − xMax. Storing only
 * the advance means no edit can leave the three out of step: move a point and the
 * sidebearings follow, as a designer expects; change a sidebearing and the command
 * moves the outline or the advance (metrics-commands.ts).
 */
import { boundsOfSegments } from '../geometry/bounds.ts';
import { contourSegments, type GlyphOutline, type OutlinePoint } from '../outline/index.ts';
import { DocumentError } from './document-error.ts';

/** A glyph's key in the document: its production name or any other stable id. */
export type GlyphId = string;

/** One point of one contour of one glyph: `point` indexes `contour.points`. */
export interface PointRef {
  readonly glyph: GlyphId;
  readonly contour: number;
  readonly point: number;
}

/** One glyph as the editor holds it. */
export interface DocumentGlyph {
  /** The glyph name written to the font (post / CFF charset). */
  readonly name: string;
  /** Unicode code points mapped to this glyph (cmap), possibly none. */
  readonly unicodes: readonly number[];
  readonly outline: GlyphOutline;
  /** Advance width in font units (hmtx). */
  readonly advanceWidth: number;
}

/**
 * Font-wide vertical metrics, font units, y up: what the font's 'head' (unitsPerEm),
 * 'hhea' and 'OS/2' (typo ascender, descender and line gap, sCapHeight, sxHeight)
 * tables record (electron/io/font writes them).
 */
export interface FontMetrics {
  readonly unitsPerEm: number;
  readonly ascender: number;
  /** Negative: below the baseline. */
  readonly descender: number;
  readonly capHeight: number;
  readonly xHeight: number;
  /** Extra space between lines, 0 or more. */
  readonly lineGap: number;
}

/** The name of one vertical metric. */
export type MetricName = keyof FontMetrics;

/** The values the designer typed over the measured ones; a metric absent here is the measured value. */
export type MetricOverrides = Readonly<Partial<Record<MetricName, number>>>;

/**
 * The selected points, kept in canonical order (glyph, contour, point) without
 * duplicates so that two equal selections are structurally equal.
 */
export type Selection = readonly PointRef[];

export interface GlyphDocument {
  readonly glyphs: Readonly<Record<GlyphId, DocumentGlyph>>;
  /** Glyph order of the font; every id in it is a key of `glyphs`. */
  readonly glyphOrder: readonly GlyphId[];
  /** The metrics in force: each the designer's value where one was typed, else the measured one. */
  readonly metrics: FontMetrics;
  /** The metrics measured from the drawing: the defaults the designer's values override. */
  readonly measuredMetrics: FontMetrics;
  /** The designer's values; changed only by metrics transactions (font-metrics-commands.ts). */
  readonly metricOverrides: MetricOverrides;
  readonly selection: Selection;
}

/**
 * Metrics of a 1000-unit em with a 700-unit cap height (common practice for text
 * faces), and a line gap that tops the 1000-unit ascender-to-descender span up to
 * 1.2 em of line spacing (core/metrics/line-gap.ts).
 */
export const DEFAULT_FONT_METRICS: FontMetrics = { unitsPerEm: 1000, ascender: 800, descender: -200, capHeight: 700, xHeight: 500, lineGap: 200 };

/** The metrics in force: `overrides` over `measured`. */
export function resolveMetrics(measured: FontMetrics, overrides: MetricOverrides): FontMetrics {
  const resolved: Record<MetricName, number> = { ...measured };
  for (const [name, value] of Object.entries(overrides) as [MetricName, number | undefined][]) {
    if (value !== undefined) resolved[name] = value;
  }
  return resolved;
}

/**
 * A document with the given glyphs (in order), no selection. `metrics` are the
 * measured vertical metrics; `overrides` the designer's values over them (none by default).
 */
export function createDocument(
  glyphs: readonly (DocumentGlyph & { readonly id?: GlyphId })[],
  metrics: FontMetrics = DEFAULT_FONT_METRICS,
  overrides: MetricOverrides = {},
): GlyphDocument {
  const table: Record<GlyphId, DocumentGlyph> = {};
  const order: GlyphId[] = [];
  for (const { id, ...glyph } of glyphs) {
    const key = id ?? glyph.name;
    if (key in table) throw new DocumentError('bad-argument', `Glyph id "${key}" appears twice; give each glyph its own id.`);
    table[key] = glyph;
    order.push(key);
  }
  return { glyphs: table, glyphOrder: order, metrics: resolveMetrics(metrics, overrides), measuredMetrics: metrics, metricOverrides: overrides, selection: [] };
}

/** The glyph with this id; throws DocumentError('unknown-glyph') when there is none. */
export function glyphOf(document: GlyphDocument, id: GlyphId): DocumentGlyph {
  const glyph = Object.hasOwn(document.glyphs, id) ? document.glyphs[id] : undefined;
  if (glyph === undefined) throw new DocumentError('unknown-glyph', `The document has no glyph "${id}".`);
  return glyph;
}

/** The point a reference names; throws DocumentError('unknown-point') when it names none. */
export function pointOf(document: GlyphDocument, ref: PointRef): OutlinePoint {
  const point = glyphOf(document, ref.glyph).outline.contours[ref.contour]?.points[ref.point];
  if (point === undefined) {
    throw new DocumentError('unknown-point', `Glyph "${ref.glyph}" has no point ${ref.point} in contour ${ref.contour}.`);
  }
  return point;
}

/** Orders point references by glyph id, contour, then point. */
export function comparePointRefs(a: PointRef, b: PointRef): number {
  if (a.glyph !== b.glyph) return a.glyph < b.glyph ? -1 : 1;
  return a.contour - b.contour || a.point - b.point;
}

/** The same references as plain records, sorted and without duplicates. */
export function normalizeSelection(refs: Iterable<PointRef>): Selection {
  const sorted = [...refs].map((r) => ({ glyph: r.glyph, contour: r.contour, point: r.point })).sort(comparePointRefs);
  return sorted.filter((r, i) => i === 0 || comparePointRefs(sorted[i - 1] as PointRef, r) !== 0);
}

/** True when the selection holds this point. Binary search: the selection is sorted. */
export function isSelected(selection: Selection, ref: PointRef): boolean {
  let lo = 0;
  let hi = selection.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const c = comparePointRefs(selection[mid] as PointRef, ref);
    if (c === 0) return true;
    if (c < 0) lo = mid + 1;
    else hi = mid - 1;
  }
  return false;
}

/**
 * The selected point indices of each contour of one glyph: contour index → set of
 * point indices.
 */
export function selectedPointsByContour(selection: Selection, glyph: GlyphId): Map<number, Set<number>> {
  const byContour = new Map<number, Set<number>>();
  for (const ref of selection) {
    if (ref.glyph !== glyph) continue;
    let set = byContour.get(ref.contour);
    if (!set) byContour.set(ref.contour, (set = new Set()));
    set.add(ref.point);
  }
  return byContour;
}

/** Horizontal extent of the outline's ink (tight curve bounds), or null when it has none. */
export function inkExtent(outline: GlyphOutline): { xMin: number; xMax: number } | null {
  const bounds = boundsOfSegments(outline.contours.flatMap((c) => contourSegments(c)));
  return bounds ? { xMin: bounds.minX, xMax: bounds.maxX } : null;
}

/** The computed sidebearings of a glyph; null for a glyph without ink (a space). */
export interface Sidebearings {
  /** xMin of the ink. */
  readonly left: number;
  /** advanceWidth − xMax of the ink. */
  readonly right: number;
}

/** Left and right sidebearings computed from the outline and the stored advance width. */
export function glyphSidebearings(glyph: DocumentGlyph): Sidebearings | null {
  const extent = inkExtent(glyph.outline);
  return extent ? { left: extent.xMin, right: glyph.advanceWidth - extent.xMax } : null;
}
