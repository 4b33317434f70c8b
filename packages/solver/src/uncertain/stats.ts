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

/**
 * Rearranges a[lo..hi] so that a[k] holds the value it would have if sorted, smaller-or-equal
 * values before it and larger-or-equal after (Hoare 1961, "Algorithm 65: Find", CACM 4).
 */
function select(a: Float64Array, k: number, lo: number, hi: number): void {
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    // median of three as the pivot
    const x = a[lo]!;
    const y = a[mid]!;
    const z = a[hi]!;
    const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        const t = a[i]!;
        a[i] = a[j]!;
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return;
  }
}

/**
 * Type-7 percentiles of an unsorted array by selection (O(n) each instead of a sort); the
 * array is reordered in place.
 */
export function percentilesInPlace(a: Float64Array, ps: readonly number[]): number[] {
  const n = a.length;
  return ps.map((p) => {
    if (n === 0) return Number.NaN;
    const h = (n - 1) * p;
    const lo = Math.floor(h);
    select(a, lo, 0, n - 1);
    const x = a[lo]!;
    if (h === lo || lo + 1 >= n) return x;
    let next = Infinity;
    for (let k = lo + 1; k < n; k++) if (a[k]! < next) next = a[k]!;
    return x + (h - lo) * (next - x);
  });
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
    const [p10, p50, p90] = percentilesInPlace(col, [0.1, 0.5, 0.9]);
    out.p10.push(p10!);
    out.p50.push(p50!);
    out.p90.push(p90!);
  }
  return out;
}
