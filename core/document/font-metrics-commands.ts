/**
 * The font-wide vertical metrics as the designer edits them: units per em, ascender,
 * descender, cap height, x-height and line gap. The values measured from the drawing
 * are the defaults (GlyphDocument.measuredMetrics); a value the designer types
 * overrides its measured one until they ask for the measured one back. Each edit is
 * one transaction (one undo step) of one 'metrics.set' change.
 *
 * The checks say what the font tables allow and what a designer would call a
 * mistake, each with what to do instead: units per em 16–16384 (OpenType spec, 'head'
 * unitsPerEm); every other value a whole number in a signed 16-bit field (OpenType
 * spec, 'hhea' FWORD and 'OS/2' sTypoAscender… int16); the ascender above the
 * baseline and above the x-height, the descender at or below the baseline, heights
 * above the baseline, the line gap not negative.
 */
import { DocumentError } from './document-error.ts';
import type { FontMetrics, GlyphDocument, MetricName, MetricOverrides } from './glyph-document.ts';
import { resolveMetrics } from './glyph-document.ts';
import type { Transaction } from './transaction.ts';
import { transaction } from './transaction.ts';

/** The metrics in the order a designer reads them, top of the line to bottom. */
export const METRIC_NAMES: readonly MetricName[] = ['unitsPerEm', 'ascender', 'capHeight', 'xHeight', 'descender', 'lineGap'];

/** How the messages name each metric. */
export const METRIC_LABELS: Readonly<Record<MetricName, string>> = {
  unitsPerEm: 'units per em',
  ascender: 'ascender',
  capHeight: 'cap height',
  xHeight: 'x-height',
  descender: 'descender',
  lineGap: 'line gap',
};

/** head.unitsPerEm range (OpenType spec, 'head': "Valid range is from 16 to 16384"). */
export const MIN_UNITS_PER_EM = 16;
export const MAX_UNITS_PER_EM = 16384;
/** Range of a signed 16-bit field, what 'hhea' and 'OS/2' store these metrics in (OpenType spec, "Data types": FWORD, int16). */
const INT16_MIN = -32768;
const INT16_MAX = 32767;

/** One thing wrong with a set of metrics: which rule, the metrics it concerns, and what to do. */
export interface MetricProblem {
  /** Tells problems apart (two problems with the same rule are the same problem). */
  readonly rule: string;
  readonly metrics: readonly MetricName[];
  readonly message: string;
}

function wholeNumberProblems(metrics: FontMetrics): MetricProblem[] {
  const problems: MetricProblem[] = [];
  for (const name of METRIC_NAMES) {
    const value = metrics[name];
    const label = METRIC_LABELS[name];
    if (!Number.isInteger(value)) {
      problems.push({ rule: `${name}-whole`, metrics: [name], message: `The ${label} is ${value}; a font stores whole units. Type a whole number.` });
    } else if (name === 'unitsPerEm' && (value < MIN_UNITS_PER_EM || value > MAX_UNITS_PER_EM)) {
      problems.push({ rule: 'unitsPerEm-range', metrics: [name], message: `The units per em is ${value}; OpenType allows ${MIN_UNITS_PER_EM} to ${MAX_UNITS_PER_EM}. Type a number in that range (1000 and 2048 are usual).` });
    } else if (value < INT16_MIN || value > INT16_MAX) {
      problems.push({ rule: `${name}-range`, metrics: [name], message: `The ${label} is ${value}; a font can store ${INT16_MIN} to ${INT16_MAX} units. Type a number in that range.` });
    }
  }
  return problems;
}

/**
 * Every problem with `metrics`, in METRIC_NAMES order; [] when a font can be written
 * with them and nothing reads as a mistake.
 */
export function metricProblems(metrics: FontMetrics): MetricProblem[] {
  const problems = wholeNumberProblems(metrics);
  const { ascender, descender, capHeight, xHeight, lineGap } = metrics;
  if (ascender <= 0) problems.push({ rule: 'ascender-above-baseline', metrics: ['ascender'], message: `The ascender is ${ascender}; it must be above the baseline. Type a number more than 0.` });
  if (capHeight <= 0) problems.push({ rule: 'capHeight-above-baseline', metrics: ['capHeight'], message: `The cap height is ${capHeight}; it must be above the baseline. Type a number more than 0.` });
  if (xHeight <= 0) problems.push({ rule: 'xHeight-above-baseline', metrics: ['xHeight'], message: `The x-height is ${xHeight}; it must be above the baseline. Type a number more than 0.` });
  if (ascender <= xHeight) {
    problems.push({ rule: 'ascender-above-xHeight', metrics: ['ascender', 'xHeight'], message: `The ascender (${ascender}) must be above the x-height (${xHeight}). Raise the ascender or lower the x-height.` });
  }
  if (descender > 0) problems.push({ rule: 'descender-below-baseline', metrics: ['descender'], message: `The descender is ${descender}; it must be at or below the baseline. Type 0 or a negative number.` });
  if (lineGap < 0) problems.push({ rule: 'lineGap-not-negative', metrics: ['lineGap'], message: `The line gap is ${lineGap}; it cannot be negative. Type 0 or more.` });
  return problems;
}

/**
 * What is wrong with the document's metrics once `overrides` apply, counting only
 * problems its current metrics do not already have: a measured value that is already
 * odd never blocks an edit of another metric.
 */
function newProblems(document: GlyphDocument, overrides: MetricOverrides): MetricProblem[] {
  const existing = new Set(metricProblems(document.metrics).map((p) => p.rule));
  return metricProblems(resolveMetrics(document.measuredMetrics, overrides)).filter((p) => !existing.has(p.rule));
}

function withOverride(overrides: MetricOverrides, name: MetricName, value: number | undefined): MetricOverrides {
  const { [name]: _dropped, ...rest } = overrides;
  return value === undefined ? rest : { ...rest, [name]: value };
}

/**
 * What setting `name` to `value` would make wrong (the first new problem's message),
 * or null when the value can be set. For a form to say before it dispatches.
 */
export function metricValueProblem(document: GlyphDocument, name: MetricName, value: number): string | null {
  return newProblems(document, withOverride(document.metricOverrides, name, value))[0]?.message ?? null;
}

function metricsTransaction(document: GlyphDocument, after: MetricOverrides): Transaction | null {
  const problem = newProblems(document, after)[0];
  if (problem) throw new DocumentError('bad-argument', problem.message);
  const before = document.metricOverrides;
  if (METRIC_NAMES.every((name) => before[name] === after[name])) return null;
  return transaction('metrics.font', [{ kind: 'metrics.set', before, after }]);
}

/**
 * Sets `name` to the designer's `value`, which then stays whatever the drawing
 * measures. Null when that is already so. Throws DocumentError('bad-argument') with
 * the message of metricValueProblem when the value would make the metrics wrong.
 */
export function setFontMetric(document: GlyphDocument, name: MetricName, value: number): Transaction | null {
  if (!METRIC_NAMES.includes(name)) throw new DocumentError('bad-argument', `There is no font metric "${String(name)}"; use one of ${METRIC_NAMES.join(', ')}.`);
  return metricsTransaction(document, withOverride(document.metricOverrides, name, value));
}

/**
 * Gives `name` back its measured value. Null when it has no value of the designer's.
 * Throws DocumentError('bad-argument') when the measured value would not fit with the
 * designer's other values (the message says which).
 */
export function useMeasuredMetric(document: GlyphDocument, name: MetricName): Transaction | null {
  if (document.metricOverrides[name] === undefined) return null;
  return metricsTransaction(document, withOverride(document.metricOverrides, name, undefined));
}

/** Whether `name` holds a value the designer typed (rather than the measured one). */
export function isMetricOverridden(document: GlyphDocument, name: MetricName): boolean {
  return document.metricOverrides[name] !== undefined;
}
