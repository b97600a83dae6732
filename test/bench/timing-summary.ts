// Summaries of repeated timings for the benchmarks timed outside tinybench (in the
// browser, or a whole job with its stages): median, spread and high percentiles, in
// the shape the runner writes into bench.json.

/** One measured task, as the runner writes it into bench.json. */
export interface MeasuredTask {
  task: string;
  medianMs: number;
  madMs: number;
  p95Ms: number;
  p99Ms: number;
  samples: number;
}

/** The q-quantile of `values` by linear interpolation between the nearest ranks. */
export function quantile(values: readonly number[], q: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  if (sorted.length === 0) return Number.NaN;
  const at = (sorted.length - 1) * q;
  const low = Math.floor(at);
  const high = Math.ceil(at);
  return sorted[low]! + (sorted[high]! - sorted[low]!) * (at - low);
}

/** Median absolute deviation from the median. */
export function medianAbsoluteDeviation(values: readonly number[]): number {
  const median = quantile(values, 0.5);
  return quantile(values.map((v) => Math.abs(v - median)), 0.5);
}

/** The task's summary from its samples, milliseconds. */
export function measured(task: string, samples: readonly number[]): MeasuredTask {
  return { task, medianMs: quantile(samples, 0.5), madMs: medianAbsoluteDeviation(samples), p95Ms: quantile(samples, 0.95), p99Ms: quantile(samples, 0.99), samples: samples.length };
}
