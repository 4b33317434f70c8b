/**
 * Best-allocation candidates for a binding budget when some fronts are not concave (ratio form
 * with r > 1, or logit). On such a front the value of money f_k(s) is S-shaped: convex, then
 * concave. Derived here: at a constrained optimum at most one front with positive money sits
 * in its convex region, because for two such fronts j, l the sum f_j(s_j + t) + f_l(s_l - t) is
 * strictly convex in t, so moving money to one end would gain. Every front with positive money
 * meets the same marginal condition f_k'(s_k) = mu; the fronts on concave parts are found by
 * the multiplier search, but a front in its convex region sits on the rising side of its
 * marginal, which the per-front maximisation at a shadow cost never picks.
 * The candidates here: for each non-concave front j, every other front at its best response at
 * shadow cost mu and front j gets the rest of the budget; the best mu is found by a grid in
 * ln mu around the multiplier, polished by Brent's method (Brent 1973, chapter 5). The grid is
 * a search, not a proof: the equilibrium's global check and the tests' independent optimiser
 * are what vouch for the result.
 */
import { brentMaximize } from "../brentMaximize";

export interface ResidualSearch {
  /** allocation of every front at shadow cost mu (each front's own best response) */
  at(mu: number): number[];
  spend(row: readonly number[]): number;
  pay(row: readonly number[]): number;
  cost: readonly number[];
  budget: number;
  /** the multiplier the search found, and its floor (1, or 0 for a sunk budget) */
  mu: number;
  floor: number;
  /** fronts whose value of money may be convex somewhere */
  nonConcave: readonly number[];
}

const GRID = 40;
/** ln mu is scanned over [ln mu - BELOW, ln mu + ABOVE] */
const BELOW = 4;
const ABOVE = 6;

/** Best candidate row (and its payoff) of the family described in the file header, or null. */
export function residualFrontCandidate(
  s: ResidualSearch,
): { row: number[]; payoff: number } | null {
  let best: { row: number[]; payoff: number } | null = null;
  const low = Math.log(Math.max(s.mu * Math.exp(-BELOW), s.floor > 0 ? s.floor : 1e-300));
  const high = Math.log(s.mu) + ABOVE;
  if (!(high > low)) return null;
  for (const j of s.nonConcave) {
    const rowAt = (t: number): number[] | null => {
      const row = s.at(Math.exp(t));
      row[j] = 0;
      const rest = s.budget - s.spend(row);
      if (!(rest >= 0)) return null;
      row[j] = (rest / s.cost[j]!) * (1 - 1e-15);
      return row;
    };
    const value = (t: number) => {
      const row = rowAt(t);
      return row ? s.pay(row) : -Infinity;
    };
    const ts: number[] = [];
    const vs: number[] = [];
    for (let g = 0; g <= GRID; g++) {
      const t = low + ((high - low) * g) / GRID;
      ts.push(t);
      vs.push(value(t));
    }
    let g0 = 0;
    for (let g = 1; g <= GRID; g++) if (vs[g]! > vs[g0]!) g0 = g;
    if (vs[g0] === -Infinity) continue;
    const a = ts[Math.max(0, g0 - 1)]!;
    const b = ts[Math.min(GRID, g0 + 1)]!;
    const polished = brentMaximize(value, a, b, 1e-10, 100);
    const t = polished.fx > vs[g0]! ? polished.x : ts[g0]!;
    const row = rowAt(t);
    if (!row || !(s.spend(row) <= s.budget)) continue;
    const u = s.pay(row);
    if (!best || u > best.payoff) best = { row, payoff: u };
  }
  return best;
}
