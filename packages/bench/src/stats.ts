/** Latency summaries. Percentiles use the nearest-rank method (common practice, no source). */

export interface Summary {
  count: number;
  p50: number;
  p99: number;
  max: number;
  mean: number;
}

/**
 * Nearest-rank percentile of an ascending array: the smallest value with at least q of the
 * data at or below it. q in [0, 1]; NaN for an empty array.
 */
export function percentile(sorted: readonly number[], q: number): number {
  if (sorted.length === 0) return Number.NaN;
  if (!(q >= 0 && q <= 1)) throw new RangeError(`percentile: q must be in [0, 1], got ${q}`);
  const rank = Math.max(1, Math.ceil(q * sorted.length));
  return sorted[rank - 1]!;
}

export function summarize(values: readonly number[]): Summary {
  const sorted = [...values].sort((a, b) => a - b);
  const sum = sorted.reduce((s, v) => s + v, 0);
  return {
    count: sorted.length,
    p50: percentile(sorted, 0.5),
    p99: percentile(sorted, 0.99),
    max: sorted.length ? sorted[sorted.length - 1]! : Number.NaN,
    mean: sorted.length ? sum / sorted.length : Number.NaN,
  };
}

/** a / b, NaN when b is not a positive number (so a missing baseline never reads as "fast") */
export function ratio(a: number, b: number): number {
  return b > 0 && Number.isFinite(a) ? a / b : Number.NaN;
}
