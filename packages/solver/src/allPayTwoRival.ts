/**
 * All-pay auction with complete information, the two strongest rivals active: Hillman &
 * Riley 1989 (Economics & Politics 1); Baye, Kovenock & de Vries 1996 (Economic Theory 8);
 * volume numbers from memory. With unit costs and v_1 >= v_2 (>= v_3 ...): rival 1 mixes
 * uniformly on [0, v_2]; rival 2 bids 0 with probability 1 - v_2/v_1 and otherwise mixes
 * uniformly on [0, v_2]; everyone else bids 0. Expected efforts v_2/2 and v_2^2/(2 v_1),
 * payoffs v_1 - v_2 and 0. Unique when v_2 > v_3 (BKV 1996); with ties at v_2 it is one of many.
 * Costs (derived here): dividing u_i by m_i gives the unit-cost game with value V_i = v_i/m_i
 * and the same efforts, so the result holds with V in place of v and payoffs m_i times the
 * unit-cost ones: rival 1 earns v_1 - m_1 V_2. Winning chances: rival 2 wins with
 * probability V_2 / (2 V_1), rival 1 with the rest.
 */
import { allPayMixedGap } from "./mixedGap";
import type { Contest, Equilibrium, MixedStrategy } from "./types";

/** Rival indices ordered by V_i = v_i / m_i, strongest first (stable on ties). */
export function allPayStrengthOrder(contest: Contest): number[] {
  const V = contest.rivals.map((x) => x.value / x.cost);
  return V.map((_, i) => i).sort((a, b) => V[b]! - V[a]! || a - b);
}

/**
 * Mixed equilibrium with the two strongest active, or null unless all-pay with unit weights,
 * at least two rivals, and budgets of the two active rivals not below the support top V_2.
 */
export function allPayTwoRival(contest: Contest, gridPoints = 2001): Equilibrium | null {
  const rivals = contest.rivals;
  const n = rivals.length;
  if (contest.csf.kind !== "allpay" || n < 2 || rivals.some((x) => x.weight !== 1)) return null;
  const order = allPayStrengthOrder(contest);
  const i1 = order[0]!;
  const i2 = order[1]!;
  const a = rivals[i1]!;
  const b = rivals[i2]!;
  const V1 = a.value / a.cost;
  const V2 = b.value / b.cost;
  if (a.maxEffort < V2 || b.maxEffort < V2) return null;
  const strategies: MixedStrategy[] = rivals.map(() => ({
    atomAtZero: 1,
    low: 0,
    high: 0,
    mean: 0,
  }));
  strategies[i1] = { atomAtZero: 0, low: 0, high: V2, mean: V2 / 2 };
  strategies[i2] = { atomAtZero: 1 - V2 / V1, low: 0, high: V2, mean: (V2 * V2) / (2 * V1) };
  const expectedEfforts = strategies.map((s) => s.mean);
  const shares = new Array<number>(n).fill(0);
  shares[i1] = 1 - V2 / (2 * V1);
  shares[i2] = V2 / (2 * V1);
  const payoffs = new Array<number>(n).fill(0);
  payoffs[i1] = a.value - a.cost * V2;
  const spend = expectedEfforts.reduce((s, e, i) => s + rivals[i]!.cost * e, 0);
  const V3 = n > 2 ? rivals[order[2]!]!.value / rivals[order[2]!]!.cost : -Infinity;
  const eq: Equilibrium = {
    kind: "mixed",
    efforts: null,
    expectedEfforts,
    shares,
    payoffs,
    totalEffort: expectedEfforts.reduce((s, e) => s + e, 0),
    dissipation: spend / contest.prize,
    active: expectedEfforts.map((e) => e > 0),
    nashGap: allPayMixedGap(contest, strategies, gridPoints),
    method: "closed-form:all-pay-two-rival",
    strategies,
  };
  if (n > 2) {
    eq.note =
      V3 < V2
        ? "Only the two rivals with the highest value-to-cost ratio bid; the others stay out (unique: Baye, Kovenock & de Vries 1996)."
        : "Several rivals share the second-highest value-to-cost ratio: this is one of many equilibria (Baye, Kovenock & de Vries 1996).";
  }
  return eq;
}
