/**
 * The tornado of payoff swings: for each uncertain parameter, every rival's equilibrium payoff
 * with that parameter at its 90th percentile minus at its 10th, all other parameters at their
 * medians. Rows are sorted by the largest absolute swing of any rival (ties keep parameter order;
 * a row whose ends lack a pure equilibrium counts as swing 0 for sorting). One-at-a-time
 * sensitivity as in decision analysis (common practice, no source).
 */
import { normalize } from "../normalize";
import { solve } from "../solve";
import { quantile } from "./dist";
import { pointScenarios } from "./draws";
import type { TornadoRow, UncertainParam, UncertainScenario } from "./types";

export function tornado(s: UncertainScenario, params: readonly UncertainParam[]): TornadoRow[] {
  const point = pointScenarios(s, params);
  const payoffsAt = (values: Float64Array): number[] | null => {
    const eq = solve(normalize(point(values)), { mixed: false }).equilibrium;
    return eq.kind === "pure" ? eq.payoffs : null;
  };
  const medians = Float64Array.from(params, (p) => quantile(p.dist, 0.5));
  const rows = params.map((p, k): TornadoRow => {
    const low = quantile(p.dist, 0.1);
    const high = quantile(p.dist, 0.9);
    const v = medians.slice();
    v[k] = low;
    const atLow = payoffsAt(v);
    v[k] = high;
    const atHigh = payoffsAt(v);
    const payoffSwing = s.rivals.map((_, i) => (atLow && atHigh ? atHigh[i]! - atLow[i]! : null));
    return { parameter: p.path, low, high, payoffSwing };
  });
  const size = (r: TornadoRow) => Math.max(0, ...r.payoffSwing.map((x) => Math.abs(x ?? 0)));
  return rows
    .map((r, k) => ({ r, k, size: size(r) }))
    .sort((a, b) => b.size - a.size || a.k - b.k)
    .map((x) => x.r);
}
