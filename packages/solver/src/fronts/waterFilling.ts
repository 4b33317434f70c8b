/**
 * One rival's best allocation of a budget over the fronts whose shares change continuously
 * with effort (ratio and logit), against the others' efforts: "water-filling".
 *
 * Rival i maximises sum_k [V_k p_k(x_k) - c_k x_k] (or sum_k V_k p_k for a sunk budget) subject
 * to sum_k c_k x_k <= B. With a Lagrange multiplier lambda on the budget the problem separates:
 * each front is a single contest in which i pays the shadow cost mu c_k per unit, mu = 1 +
 * lambda (mu = lambda for a sunk budget), and its best response there is the solver's exact
 * global one-dimensional best response (bestResponseAgainst: closed form for r = 1, the larger
 * root of a concave function for r != 1, the logit candidates). Each front's best response is
 * non-increasing in mu (Topkis 1978, monotone comparative statics; from memory), so total
 * spend falls in mu and mu is found by a bracketing root search on a log scale.
 * - Ratio form with r <= 1 on every front: the program is concave and spend is continuous in
 *   mu, so the multiplier that exhausts the budget gives the exact constrained optimum
 *   (Kuhn-Tucker conditions are sufficient for a concave program).
 * - r > 1 or logit on some front: whenever the allocation at the multiplier spends the budget,
 *   it maximises the Lagrangian globally with the budget exhausted, so it is the global optimum
 *   of the constrained problem, concave or not (Everett 1963, "Generalized Lagrange multiplier
 *   method for solving problems of optimum allocation of resources", Operations Research 11;
 *   from memory). But a front's best response can jump as mu crosses a value, and then no
 *   multiplier exhausts the budget (a duality gap). The result is then the best of
 *   the candidates around the jump (the allocation just inside the budget, that allocation with
 *   the leftover money put on each front in turn, the allocation just above the budget scaled
 *   down to fit) and of the "one front in its convex region" family of residualFront.ts: exact
 *   whenever spend is continuous at the multiplier, otherwise the best of a search (a lower
 *   bound on the best payoff).
 * Fronts marked in `skip` (the all-pay fronts, see allPayAllocation.ts) get no money here.
 */
import type { Opposition } from "../bestResponse";
import { bestResponseAgainst } from "../bestResponse";
import type { Contest, Rival } from "../types";
import { allocationPayoff, frontShare, spendOf } from "./frontPayoff";
import { residualFrontCandidate } from "./residualFront";
import type { FrontsContest } from "./types";

/** Most steps of the root search on ln mu. */
const ROOT_STEPS = 60;
/** The bracket search steps ln mu by FIRST_WIDENING x 2^d from the hint, d < MAX_WIDENINGS. */
const FIRST_WIDENING = 0.05;
const MAX_WIDENINGS = 60;

export interface WaterFilled {
  row: number[];
  /** Lagrange multiplier of the budget (0 when slack; null without a budget) */
  shadowPrice: number | null;
}

/**
 * Rival i's best allocation of `budget` money (Infinity: no cap) over the fronts not in
 * `skip`, against each front's opposition `opp[k]`; `hint` is a guess of the multiplier mu;
 * the root search on ln mu stops within `rootTol` (relative; the default is what a best
 * response needs, a looser one serves a search that only needs the multiplier roughly).
 */
export function waterFill(
  fc: FrontsContest,
  i: number,
  opp: readonly Opposition[],
  budget: number,
  skip?: readonly boolean[],
  hint?: number,
  rootTol = 1e-13,
): WaterFilled {
  const rv = fc.rivals[i]!;
  const K = fc.fronts.length;
  const B = budget;
  // one mutable copy of rival i per front, so a probe allocates nothing but its row. No cap per
  // front: the budget is priced by mu, and a cap of B / c on one front would stop mu from rising
  // where that front alone could take the whole budget (a wrong shadow price of 0)
  const mine: Rival[] = fc.contests.map((c) => ({
    ...c.rivals[i]!,
    maxEffort: Infinity,
    maxSpend: Infinity,
  }));
  const scratch: Contest[] = fc.contests.map((c, k) => {
    const rivals = c.rivals.slice();
    rivals[i] = mine[k]!;
    return { ...c, rivals };
  });
  // a front nobody else contests is won by the smallest step: keep it small in money
  const steps = rv.cost.map((c, k) => ({
    step: Math.min((1e-9 * (B < Infinity ? B : rv.value[k]!)) / c, B / c),
  }));
  /** each front's global best response when money costs mu per unit */
  const at = (mu: number): number[] => {
    const row = new Array<number>(K).fill(0);
    for (let k = 0; k < K; k++) {
      if (skip?.[k]) continue;
      // effort bought at the shadow cost
      mine[k]!.cost = mu * rv.cost[k]!;
      row[k] = bestResponseAgainst(scratch[k]!, i, opp[k]!, steps[k]).effort;
    }
    return row;
  };
  if (B === Infinity) return { row: at(1), shadowPrice: null };
  if (B === 0)
    return { row: new Array<number>(K).fill(0), shadowPrice: marginalAtZero(fc, i, opp, skip) };
  const pay = (row: readonly number[]) => allocationPayoff(fc, i, row, opp);
  const spend = (row: readonly number[]) => spendOf(fc, i, row);
  const floor = rv.sunkBudget ? 0 : 1;
  // bracket [lo, hi] with spend(lo) > B >= spend(hi), lo >= floor; every evaluation narrows it
  let lo = floor;
  let hi = Infinity;
  let rowLo: number[] = [];
  let rowHi: number[] = [];
  const probe = (mu: number): number => {
    const row = at(mu);
    const s = spend(row);
    if (s > B) {
      if (mu > lo || rowLo.length === 0) {
        lo = mu;
        rowLo = row;
      }
    } else if (mu < hi) {
      hi = mu;
      rowHi = row;
    }
    return s;
  };
  const start = hint !== undefined && hint > floor && Number.isFinite(hint) ? hint : 1;
  if (!rv.sunkBudget && probe(1) <= B) return { row: rowHi, shadowPrice: 0 };
  const s0 = start === 1 && !rv.sunkBudget ? spend(rowLo) : probe(start);
  const up = s0 > B;
  // widen geometrically in ln mu from the hint until the budget is bracketed; spend has an
  // elasticity near 1 in mu, so the first step is about twice the gap ln(spend / B)
  const first = Math.min(1, Math.max(1e-12, 2 * Math.abs(Math.log(s0 / B)) || FIRST_WIDENING));
  for (let d = 0; d < MAX_WIDENINGS && (up ? !(hi < Infinity) : rowLo.length === 0); d++) {
    const mu = start * Math.exp((up ? 1 : -1) * first * 2 ** d);
    if (!(mu > 0 && mu < Infinity)) break;
    probe(mu);
  }
  if (!(hi < Infinity)) return { row: new Array<number>(K).fill(0), shadowPrice: Infinity };
  // spend stays within the budget however cheap money gets (every front uncontested)
  if (rowLo.length === 0) return { row: rowHi, shadowPrice: 0 };
  // Illinois regula falsi on g(ln mu) = ln spend - ln B (Dowell & Jarratt 1971, BIT 11; from
  // memory): a bracketing secant that halves the stale end's value, superlinear and never
  // leaving [lo, hi]
  if (hi / lo > 1 + 1e-15) {
    const lnB = Math.log(B);
    const g = (row: readonly number[]) => Math.log(Math.max(spend(row), 1e-300)) - lnB;
    let a = Math.log(lo);
    let b = Math.log(hi);
    let ga = g(rowLo);
    let gb = g(rowHi);
    let side = 0;
    for (let s = 0; s < ROOT_STEPS && b - a > rootTol * Math.max(1, Math.abs(a)); s++) {
      let t = ga > 0 && gb <= 0 && ga - gb > 0 ? b - (gb * (b - a)) / (gb - ga) : 0.5 * (a + b);
      if (!(t > a && t < b)) t = 0.5 * (a + b);
      const gt = Math.log(Math.max(probe(Math.exp(t)), 1e-300)) - lnB;
      if (gt > 0) {
        a = t;
        ga = gt;
        if (side === -1) gb *= 0.5;
        side = -1;
      } else {
        b = t;
        gb = gt;
        if (side === 1) ga *= 0.5;
        side = 1;
      }
    }
  }
  // rounding noise in the spend can stall the interpolation next to the root: finish by bisection
  for (let s = 0; s < ROOT_STEPS && hi / lo > 1 + Math.max(1e-11, rootTol); s++)
    probe(Math.sqrt(lo * hi));
  const shadowPrice = Math.max(0, hi - floor);
  // candidates around the multiplier (exact in the concave case, see the header)
  let bestRow = rowHi;
  let bestU = pay(rowHi);
  const tryRow = (row: number[]) => {
    if (!(spend(row) <= B)) return;
    const u = pay(row);
    if (u > bestU) {
      bestU = u;
      bestRow = row;
    }
  };
  const left = B - spend(rowHi);
  if (left > 0) {
    for (let k = 0; k < K; k++) {
      if (skip?.[k]) continue;
      const row = rowHi.slice();
      row[k] = row[k]! + left / rv.cost[k]!;
      tryRow(row);
    }
  }
  const sLo = spend(rowLo);
  if (sLo > 0 && Number.isFinite(sLo)) tryRow(rowLo.map((x) => x * (B / sLo) * (1 - 1e-15)));
  const nonConcave = fc.fronts.flatMap((f, k) =>
    skip?.[k] || (f.csf.kind === "ratio" && f.csf.decisiveness <= 1) ? [] : [k],
  );
  // Everett 1963: a maximiser of the Lagrangian that spends the whole budget is a global optimum
  // of the constrained problem, concave or not; only a jump in spend across B leaves a gap
  const gapless = spend(rowHi) >= B * (1 - 1e-9);
  if (nonConcave.length > 0 && !gapless) {
    const cand = residualFrontCandidate({
      at,
      spend,
      pay,
      cost: rv.cost,
      budget: B,
      mu: hi,
      floor,
      nonConcave,
    });
    if (cand) tryRow(cand.row);
  }
  return { row: bestRow, shadowPrice };
}

/** Value of the first unit of money for a rival with a zero budget (Infinity for r < 1). */
function marginalAtZero(
  fc: FrontsContest,
  i: number,
  opp: readonly Opposition[],
  skip?: readonly boolean[],
): number {
  const rv = fc.rivals[i]!;
  let best = 0;
  for (let k = 0; k < fc.fronts.length; k++) {
    if (skip?.[k]) continue;
    const c = fc.contests[k]!;
    const o = opp[k]!;
    const csf = c.csf;
    let d: number; // d(V p)/d(money) at zero
    if (csf.kind === "ratio") {
      if (o.z === 0 || csf.decisiveness < 1) d = Infinity;
      else if (csf.decisiveness > 1) d = 0;
      else d = (rv.value[k]! * rv.weight[k]!) / (o.z * rv.cost[k]!);
    } else if (csf.kind === "logit") {
      const p = frontShare(c, i, 0, o);
      d = (rv.value[k]! * csf.scale * p * (1 - p)) / rv.cost[k]!;
    } else d = 0;
    best = Math.max(best, d);
  }
  return Math.max(0, best - (rv.sunkBudget ? 0 : 1));
}
