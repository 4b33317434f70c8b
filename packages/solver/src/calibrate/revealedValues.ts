/**
 * Revealed value of the prize to each rival, assuming each period's spends were best replies:
 * the ratio form's first-order condition in money, V_i r p_i (1 - p_i) / s_i = 1 (Tullock 1980;
 * stated for market shares by Cooper & Nakanishi 1988), gives V_it = s_it / (r p_it (1 - p_it))
 * at the fitted share p_it. The estimate is the median over periods; its 90% interval is the
 * 5th and 95th percentile (Hyndman & Fan 1996, type 7) of the medians of a bootstrap over periods
 * (Efron & Tibshirani, An Introduction to the Bootstrap, 1993): periods are drawn with
 * replacement, the same draw for every rival, so a rival's median uses the drawn periods in which
 * it has a usable row. r and the head starts stay at their estimates (their own intervals are
 * reported beside); the interval shows how much the revealed value moves from period to period.
 *
 * A resample in which a rival has no row gives it no median; the percentiles use the others.
 * The weighted-median walk over each rival's values, pre-sorted once, makes a resample cost O(n).
 */
import { mulberry32 } from "../rng";

/** Type-7 quantile of ascending-sorted values (linear between order statistics). */
export function sortedQuantile(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

export interface RevealedValueSummary {
  /** median over periods */
  estimate: number;
  /** bootstrap 90% interval */
  low: number;
  high: number;
}

/**
 * values[i] are rival i's revealed values, periodOfValue[i] the regression period (0..T-1) of
 * each; returns one summary per rival.
 */
export function summariseRevealedValues(
  values: readonly Float64Array[],
  periodOfValue: readonly Int32Array[],
  periodCount: number,
  opts: { seed: number; resamples: number },
): RevealedValueSummary[] {
  const N = values.length;
  // Each rival's values sorted, with the period of each sorted value.
  const sortedVals: Float64Array[] = [];
  const sortedPeriods: Int32Array[] = [];
  for (let i = 0; i < N; i++) {
    const v = values[i]!;
    const order = Array.from(v.keys()).sort((a, b) => v[a]! - v[b]!);
    sortedVals.push(Float64Array.from(order, (k) => v[k]!));
    sortedPeriods.push(Int32Array.from(order, (k) => periodOfValue[i]![k]!));
  }
  const counts = new Int32Array(periodCount);
  const weightedMedian = (i: number): number => {
    const vs = sortedVals[i]!;
    const ps = sortedPeriods[i]!;
    let total = 0;
    for (let k = 0; k < ps.length; k++) total += counts[ps[k]!]!;
    if (total === 0) return NaN;
    const lowRank = Math.floor((total - 1) / 2);
    const highRank = Math.floor(total / 2);
    let acc = 0;
    let low = NaN;
    for (let k = 0; k < ps.length; k++) {
      acc += counts[ps[k]!]!;
      if (Number.isNaN(low) && acc > lowRank) low = vs[k]!;
      if (acc > highRank) return (low + vs[k]!) / 2;
    }
    return low;
  };

  counts.fill(1);
  const estimates = Array.from({ length: N }, (_, i) => weightedMedian(i));

  const rng = mulberry32(opts.seed);
  const medians = Array.from({ length: N }, () => new Float64Array(opts.resamples));
  const filled = new Int32Array(N);
  for (let b = 0; b < opts.resamples; b++) {
    counts.fill(0);
    for (let k = 0; k < periodCount; k++) counts[Math.floor(rng() * periodCount)]! += 1;
    for (let i = 0; i < N; i++) {
      const m = weightedMedian(i);
      if (!Number.isNaN(m)) medians[i]![filled[i]!++] = m;
    }
  }
  return estimates.map((estimate, i) => {
    const ms = medians[i]!.subarray(0, filled[i]!).sort();
    return {
      estimate,
      low: ms.length > 0 ? sortedQuantile(ms, 0.05) : estimate,
      high: ms.length > 0 ? sortedQuantile(ms, 0.95) : estimate,
    };
  });
}
