/**
 * All-pay auction, n identical rivals (value v, cost m): the symmetric mixed equilibrium
 * (Hillman & Riley 1989; Baye, Kovenock & de Vries 1996). Derived here: each rival must be
 * indifferent over its support, v F(x)^(n-1) - m x = 0 (payoff 0, as with full dissipation),
 * so F(x) = (m x / v)^(1/(n-1)) on [0, v/m], no atom. Expected effort per rival
 * E[x] = int_0^{v/m} (1 - F) dx = (v/m)(1 - (n-1)/n) = v/(m n); expected total effort v/m:
 * the whole prize is dissipated. Each wins with probability 1/n.
 */
import { allPayMixedGap } from "./mixedGap";
import { identicalRivals } from "./symmetricRatio";
import type { Contest, Equilibrium, MixedStrategy } from "./types";

/** The symmetric mixed equilibrium, or null unless all-pay, identical unit-weight rivals, n >= 2, budgets >= v/m. */
export function allPaySymmetric(contest: Contest, gridPoints = 2001): Equilibrium | null {
  const rivals = contest.rivals;
  const n = rivals.length;
  const a = rivals[0];
  if (contest.csf.kind !== "allpay" || n < 2 || !a || !identicalRivals(contest)) return null;
  if (a.weight !== 1) return null;
  const top = a.value / a.cost;
  if (a.maxEffort < top) return null;
  const s: MixedStrategy = {
    atomAtZero: 0,
    low: 0,
    high: top,
    mean: top / n,
    cdfExponent: 1 / (n - 1),
  };
  const strategies = rivals.map(() => ({ ...s }));
  const expectedEfforts = strategies.map((x) => x.mean);
  return {
    kind: "mixed",
    efforts: null,
    expectedEfforts,
    shares: new Array<number>(n).fill(1 / n),
    payoffs: new Array<number>(n).fill(0),
    totalEffort: top,
    dissipation: (a.cost * top) / contest.prize,
    active: new Array<boolean>(n).fill(true),
    nashGap: allPayMixedGap(contest, strategies, gridPoints),
    method: "closed-form:all-pay-symmetric",
    strategies,
  };
}
