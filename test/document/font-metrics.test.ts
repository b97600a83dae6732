// The font's vertical metrics as the designer edits them: a typed value overrides the
// one measured from the drawing, each edit is one undo step that puts the measured
// value back, "use the measured value" drops the designer's value, and values a font
// cannot store or that read as a mistake are refused with a message saying what to
// type instead.
import { describe, expect, it } from 'vitest';
import {
  createDocument,
  createEditorState,
  DEFAULT_FONT_METRICS,
  dispatch,
  DocumentError,
  isMetricOverridden,
  metricProblems,
  metricValueProblem,
  redo,
  setFontMetric,
  undo,
  useMeasuredMetric,
  type FontMetrics,
} from '../../core/document/index.ts';
import { squareContour } from './support.ts';

/** Measured metrics of a drawing: cap height 712, x-height 498, ascender 760, descender −236 (made up, not round). */
const MEASURED: FontMetrics = { unitsPerEm: 1000, ascender: 760, descender: -236, capHeight: 712, xHeight: 498, lineGap: 204 };

function document() {
  return createDocument([{ name: 'H', unicodes: [0x48], outline: { contours: [squareContour(50, 0, 650, 712)] }, advanceWidth: 700 }], MEASURED);
}

function messageOf(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    if (error instanceof DocumentError) return error.message;
    throw error;
  }
  throw new Error('expected a DocumentError');
}

describe('font-wide vertical metrics', () => {
  it('start as measured from the drawing, with no value of the designer’s', () => {
    const doc = document();
    expect(doc.metrics).toEqual(MEASURED);
    expect(doc.measuredMetrics).toEqual(MEASURED);
    expect(isMetricOverridden(doc, 'xHeight')).toBe(false);
  });

  it('a typed x-height is in force, the measured one is kept beside it, and undo brings the measured one back in one step', () => {
    let state = createEditorState(document());
    const tr = setFontMetric(state.document, 'xHeight', 520)!;
    expect(tr.userEvent).toBe('metrics.font');
    state = dispatch(state, tr);
    expect(state.document.metrics).toEqual({ ...MEASURED, xHeight: 520 });
    expect(state.document.measuredMetrics.xHeight).toBe(498);
    expect(isMetricOverridden(state.document, 'xHeight')).toBe(true);
    expect(state.history.done).toHaveLength(1);
    state = undo(state);
    expect(state.document.metrics).toEqual(MEASURED);
    expect(isMetricOverridden(state.document, 'xHeight')).toBe(false);
    state = redo(state);
    expect(state.document.metrics.xHeight).toBe(520);
  });

  it('“use the measured value” drops the designer’s value, as its own undo step', () => {
    let state = createEditorState(document());
    state = dispatch(state, setFontMetric(state.document, 'ascender', 800));
    state = dispatch(state, setFontMetric(state.document, 'lineGap', 0));
    state = dispatch(state, useMeasuredMetric(state.document, 'ascender'));
    expect(state.document.metrics).toEqual({ ...MEASURED, lineGap: 0 });
    expect(state.history.done).toHaveLength(3);
    expect(useMeasuredMetric(state.document, 'ascender')).toBeNull();
    state = undo(state);
    expect(state.document.metrics.ascender).toBe(800);
  });

  it('typing the value already in force changes nothing and makes no undo step', () => {
    let state = createEditorState(document());
    state = dispatch(state, setFontMetric(state.document, 'capHeight', 700));
    expect(setFontMetric(state.document, 'capHeight', 700)).toBeNull();
  });

  it('editing the metrics leaves every glyph as it was (shared, not copied)', () => {
    const doc = document();
    const next = dispatch(createEditorState(doc), setFontMetric(doc, 'descender', -250)).document;
    expect(next.glyphs).toBe(doc.glyphs);
  });

  it('refuses units per em outside 16–16384, naming the range (OpenType spec, ‘head’ unitsPerEm: “Valid range is from 16 to 16384”)', () => {
    const doc = document();
    expect(setFontMetric(doc, 'unitsPerEm', 16)).not.toBeNull();
    expect(setFontMetric(doc, 'unitsPerEm', 16384)).not.toBeNull();
    expect(messageOf(() => setFontMetric(doc, 'unitsPerEm', 15))).toBe('The units per em is 15; OpenType allows 16 to 16384. Type a number in that range (1000 and 2048 are usual).');
    expect(messageOf(() => setFontMetric(doc, 'unitsPerEm', 16385))).toContain('OpenType allows 16 to 16384');
    expect(messageOf(() => setFontMetric(doc, 'unitsPerEm', 1000.5))).toBe('The units per em is 1000.5; a font stores whole units. Type a whole number.');
  });

  it('refuses a descender above the baseline, an ascender at or below the x-height, and a negative line gap', () => {
    const doc = document();
    expect(setFontMetric(doc, 'descender', 0)).not.toBeNull();
    expect(messageOf(() => setFontMetric(doc, 'descender', 12))).toBe('The descender is 12; it must be at or below the baseline. Type 0 or a negative number.');
    expect(messageOf(() => setFontMetric(doc, 'ascender', 498))).toBe('The ascender (498) must be above the x-height (498). Raise the ascender or lower the x-height.');
    expect(messageOf(() => setFontMetric(doc, 'xHeight', 761))).toBe('The ascender (760) must be above the x-height (761). Raise the ascender or lower the x-height.');
    expect(messageOf(() => setFontMetric(doc, 'lineGap', -1))).toBe('The line gap is -1; it cannot be negative. Type 0 or more.');
    expect(messageOf(() => setFontMetric(doc, 'capHeight', 0))).toContain('must be above the baseline');
  });

  it('refuses values beyond the 16-bit fields the font keeps them in (OpenType spec, ‘hhea’ FWORD, ‘OS/2’ int16)', () => {
    const doc = document();
    expect(messageOf(() => setFontMetric(doc, 'ascender', 32768))).toBe('The ascender is 32768; a font can store -32768 to 32767 units. Type a number in that range.');
    expect(setFontMetric(doc, 'ascender', 32767)).not.toBeNull();
  });

  it('says what is wrong before the edit is made, and nothing for a good value', () => {
    const doc = document();
    expect(metricValueProblem(doc, 'descender', 5)).toContain('at or below the baseline');
    expect(metricValueProblem(doc, 'descender', -300)).toBeNull();
  });

  it('a measured value that is already odd does not block editing another metric', () => {
    // A sheet with only capitals measures no x-height: suppose the fallback landed above the ascender.
    const odd = createDocument([], { ...MEASURED, xHeight: 900 });
    expect(metricProblems(odd.metrics).map((p) => p.rule)).toEqual(['ascender-above-xHeight']);
    expect(setFontMetric(odd, 'lineGap', 0)).not.toBeNull();
    // …and fixing it is allowed too.
    expect(setFontMetric(odd, 'xHeight', 500)).not.toBeNull();
  });

  it('refuses to put back a measured value that does not fit the designer’s others, saying which', () => {
    let state = createEditorState(document());
    state = dispatch(state, setFontMetric(state.document, 'xHeight', 400));
    state = dispatch(state, setFontMetric(state.document, 'ascender', 450));
    expect(messageOf(() => useMeasuredMetric(state.document, 'xHeight'))).toBe('The ascender (450) must be above the x-height (498). Raise the ascender or lower the x-height.');
  });

  it('the default metrics themselves have no problems', () => {
    expect(metricProblems(DEFAULT_FONT_METRICS)).toEqual([]);
  });
});
