/**
 * Summary statistics of Monte Carlo draws. Percentiles interpolate linearly between order
 * statistics: with sorted x_1..x_N and h = (N - 1) p, Q(p) = x_floor(h)+1 + (h - floor h)
 * (x_floor(h)+2 - x_floor(h)+1) (Hyndman & Fan 1996, The American Statistician 50, definition 7).
 */
import type { Band } from "./types";

/** Type-7 percentile of an ascending array; NaN when it is empty. */
export function percentile7(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  const a = sorted[lo]!;
  return a + (h - lo) * (sorted[hi]! - a);
}

export function sortedCopy(xs: ArrayLike<number>): Float64Array {
  return Float64Array.from(xs).sort();
}

export function meanOf(xs: ArrayLike<number>): number {
  let s = 0;
  for (let k = 0; k < xs.length; k++) s += xs[k]!;
  return xs.length === 0 ? Number.NaN : s / xs.length;
}

/**
 * Per-rival band from a draw-major matrix: values[d * n + i] is rival i in draw d, over `rows`
 * draws. Null entries when there are no draws.
 */
export function band(values: Float64Array, rows: number, n: number): Band {
  const out: Band = { mean: [], p10: [], p50: [], p90: [] };
  const col = new Float64Array(rows);
  for (let i = 0; i < n; i++) {
    for (let d = 0; d < rows; d++) col[d] = values[d * n + i]!;
    if (rows === 0) {
      out.mean.push(null);
      out.p10.push(null);
      out.p50.push(null);
      out.p90.push(null);
      continue;
    }
    out.mean.push(meanOf(col));
    col.sort();
    out.p10.push(percentile7(col, 0.1));
    out.p50.push(percentile7(col, 0.5));
    out.p90.push(percentile7(col, 0.9));
  }
  return out;
}
