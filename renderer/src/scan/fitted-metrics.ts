// The heights a fitted sheet shows, in font units, as the tracing worker sends them to
// the page: the cap height (or, where no flat-topped capital is assigned, the typical
// letter height, which sets the scale all the same) and the x-height, ascender and
// descender where the sheet measures them. The letter document turns these into the
// font's metrics with the rule the command line uses (core/metrics/font-heights.ts).
import type { TracedLetters } from '../../../core/pipeline/index.ts';
import type { FittedMetrics } from './trace-protocol.ts';

export function fittedMetrics(fitted: Pick<TracedLetters, 'metrics' | 'unitsPerPixel'>): FittedMetrics {
  const units = (height: { pixels: number } | null) => (height ? height.pixels * fitted.unitsPerPixel : null);
  return {
    capHeight: (fitted.metrics.capHeight?.pixels ?? fitted.metrics.letterHeightPixels) * fitted.unitsPerPixel,
    xHeight: units(fitted.metrics.xHeight),
    ascender: units(fitted.metrics.ascender),
    descender: units(fitted.metrics.descender),
  };
}
