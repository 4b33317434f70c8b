/**
 * Rows for the explorer's sweep bands: per swept value and rival, the P10, P50 and P90 of a
 * money figure (spend or payoff) over the draws, plus the [P10, P90] pair a range area plots.
 */
import type { BandSweep } from "@contend/solver";
import type { Row } from "./chartData";

export type BandMetric = "spends" | "payoffs";

export const bandLowKey = (i: number) => `p10_${i}`;
export const bandMidKey = (i: number) => `p50_${i}`;
export const bandHighKey = (i: number) => `p90_${i}`;
export const bandPairKey = (i: number) => `band_${i}`;

/** A table row (numbers only) and, for the chart, the same row with each rival's [P10, P90]. */
export interface BandRows {
  table: Row[];
  chart: Record<string, number | null | [number, number]>[];
}

export function bandRows(sweep: BandSweep, metric: BandMetric): BandRows {
  const table: Row[] = [];
  const chart: BandRows["chart"] = [];
  for (const p of sweep.points) {
    const band = p[metric];
    const row: Record<string, number | null> = { x: p.x };
    const pairs: Record<string, [number, number]> = {};
    band.p50.forEach((_, i) => {
      const lo = band.p10[i] ?? null;
      const hi = band.p90[i] ?? null;
      row[bandLowKey(i)] = lo;
      row[bandMidKey(i)] = band.p50[i] ?? null;
      row[bandHighKey(i)] = hi;
      if (lo !== null && hi !== null) pairs[bandPairKey(i)] = [lo, hi];
    });
    table.push(row);
    chart.push({ ...row, ...pairs });
  }
  return { table, chart };
}

/** The largest share of draws without a pure equilibrium over the points (reported, not hidden). */
export function worstNoPure(sweep: BandSweep): number {
  return sweep.points.reduce((m, p) => Math.max(m, p.noPureEquilibrium), 0);
}
