/**
 * Best allocation of one rival's budget over several fronts against the others' efforts, its
 * regret, and the Nash gap of a whole profile.
 *
 * Rival i maximises sum_k [V_k p_k(x_k) - c_k x_k] (or sum_k V_k p_k for a sunk budget) subject
 * to sum_k c_k x_k <= B. With a Lagrange multiplier lambda on the budget the problem separates:
 * each front is a single contest in which i pays the shadow cost mu c_k per unit, mu = 1 +
 * lambda (mu = lambda for a sunk budget), and its best response there is the solver's exact
 * global one-dimensional best response (bestResponseAgainst: closed form for r = 1, the larger
 * root of a concave function for r != 1, the logit candidates). Each front's best response is
 * non-increasing in mu (Topkis 1978, monotone comparative statics; from memory), so total
 * spend falls in mu and mu is found by bisection on a log scale: "water-filling".
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
 *   down to fit, the current allocation) and of the "one front in its convex region" family of
 *   residualFront.ts: exact whenever spend is continuous at the multiplier, otherwise the best
 *   of a search (a lower bound on the best payoff).
 */
import type { Opposition } from "../bestResponse";
import { bestResponseAgainst, oppositions } from "../bestResponse";
import { residualFrontCandidate } from "./residualFront";
import type { Contest, Rival } from "../types";
import type { BestAllocation, FrontsContest, FrontsResponses } from "./types";

/** Most steps of the root search on ln mu. */
const ROOT_STEPS = 60;
/** The bracket search steps ln mu by FIRST_WIDENING x 2^d from the hint, d < MAX_WIDENINGS. */
const FIRST_WIDENING = 0.05;
const MAX_WIDENINGS = 60;

/** p_k of rival i on front k at effort x against opposition o (same conventions as csf.ts). */
export function frontShare(contest: Contest, i: number, x: number, o: Opposition): number {
  const rv = contest.rivals[i]!;
  const csf = contest.csf;
  if (csf.kind === "ratio") {
    const y = x > 0 ? rv.weight * Math.pow(x, rv.r) : 0;
    return y + o.z === 0 ? 1 / contest.rivals.length : y / (y + o.z);
  }
  if (csf.kind === "logit") {
    return o.lnZ === -Infinity
      ? 1
      : 1 / (1 + Math.exp(o.lnZ - Math.log(rv.weight) - csf.scale * x));
  }
  throw new Error("all-pay fronts are rejected by validation");
}

/** Rival i's payoff from a whole allocation row, given each front's opposition. */
export function allocationPayoff(
  fc: FrontsContest,
  i: number,
  row: readonly number[],
  opp: readonly Opposition[],
): number {
  const rv = fc.rivals[i]!;
  let u = 0;
  for (let k = 0; k < fc.fronts.length; k++) {
    const x = row[k] ?? 0;
    u += rv.value[k]! * frontShare(fc.contests[k]!, i, x, opp[k]!);
    if (!rv.sunkBudget) u -= rv.cost[k]! * x;
  }
  return u;
}

/** Money a row spends. */
export function spendOf(fc: FrontsContest, i: number, row: readonly number[]): number {
  const c = fc.rivals[i]!.cost;
  let s = 0;
  for (let k = 0; k < row.length; k++) s += c[k]! * (row[k] ?? 0);
  return s;
}

/** Concave when every front is ratio form with r <= 1 (see the file header). */
export function frontsAreConcave(fc: FrontsContest): boolean {
  return fc.fronts.every((f) => f.csf.kind === "ratio" && f.csf.decisiveness <= 1);
}

/**
 * Best allocation of rival i given each front's opposition `opp[k]` (see the file header);
 * `current`, when given and within budget, is a candidate too, so regrets are never negative;
 * `hint` is a guess of the multiplier mu (where the search starts).
 */
export function bestAllocationAgainst(
  fc: FrontsContest,
  i: number,
  opp: readonly Opposition[],
  current?: readonly number[],
  hint?: number,
): BestAllocation {
  const rv = fc.rivals[i]!;
  const K = fc.fronts.length;
  const B = rv.budget;
  // one mutable copy of rival i per front, so a probe allocates nothing but its row. No cap per
  // front: the budget is priced by mu, and a cap of B / c on one front would stop mu from rising
  // where that front alone could take the whole budget (a wrong shadow price of 0)
  const caps = rv.cost.map((c) => (B === Infinity ? Infinity : B / c));
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
    step: Math.min((1e-9 * (B < Infinity ? B : rv.value[k]!)) / c, caps[k]!),
  }));
  /** each front's global best response when money costs mu per unit */
  const at = (mu: number): number[] => {
    const row = new Array<number>(K);
    for (let k = 0; k < K; k++) {
      // effort bought at the shadow cost
      mine[k]!.cost = mu * rv.cost[k]!;
      row[k] = bestResponseAgainst(scratch[k]!, i, opp[k]!, steps[k]).effort;
    }
    return row;
  };
  const pay = (row: readonly number[]) => allocationPayoff(fc, i, row, opp);
  const finish = (row: number[], shadowPrice: number | null): BestAllocation => {
    let best = { allocation: row, payoff: pay(row), shadowPrice };
    if (current && spendOf(fc, i, current) <= B) {
      const u = pay(current);
      if (u > best.payoff) best = { allocation: current.slice(), payoff: u, shadowPrice };
    }
    return best;
  };
  if (B === Infinity) return finish(at(1), null);
  if (B === 0) return finish(new Array<number>(K).fill(0), marginalAtZero(fc, i, opp));
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
  if (!rv.sunkBudget && probe(1) <= B) return finish(rowHi, 0);
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
  if (!(hi < Infinity)) return finish(new Array<number>(K).fill(0), Infinity);
  // spend stays within the budget however cheap money gets (every front uncontested)
  if (rowLo.length === 0) return finish(rowHi, 0);
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
    for (let s = 0; s < ROOT_STEPS && b - a > 1e-13 * Math.max(1, Math.abs(a)); s++) {
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
  for (let s = 0; s < ROOT_STEPS && hi / lo > 1 + 1e-11; s++) probe(Math.sqrt(lo * hi));
  const shadow = Math.max(0, hi - floor);
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
      const row = rowHi.slice();
      row[k] = row[k]! + left / rv.cost[k]!;
      tryRow(row);
    }
  }
  const sLo = spend(rowLo);
  if (sLo > 0 && Number.isFinite(sLo)) tryRow(rowLo.map((x) => x * (B / sLo) * (1 - 1e-15)));
  const nonConcave = fc.fronts.flatMap((f, k) =>
    f.csf.kind === "ratio" && f.csf.decisiveness <= 1 ? [] : [k],
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
  return finish(bestRow, shadow);
}

/** Value of the first unit of money for a rival with a zero budget (Infinity for r < 1). */
function marginalAtZero(fc: FrontsContest, i: number, opp: readonly Opposition[]): number {
  const rv = fc.rivals[i]!;
  let best = 0;
  for (let k = 0; k < fc.fronts.length; k++) {
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

/** Each front's oppositions for every rival: out[k][i]. */
export function frontOppositions(
  fc: FrontsContest,
  allocations: readonly (readonly number[])[],
): Opposition[][] {
  return fc.contests.map((c, k) =>
    oppositions(
      c,
      allocations.map((row) => row[k] ?? 0),
    ),
  );
}

/** Best allocations, regrets (>= 0), payoffs and the Nash gap of a profile of allocations. */
export function respondFronts(
  fc: FrontsContest,
  allocations: readonly (readonly number[])[],
): FrontsResponses {
  const opp = frontOppositions(fc, allocations);
  const n = fc.rivals.length;
  const out: FrontsResponses = {
    bestAllocations: [],
    regrets: [],
    payoffs: [],
    nashGap: 0,
    shadowPrices: [],
  };
  for (let i = 0; i < n; i++) {
    const mine = opp.map((o) => o[i]!);
    const now = allocationPayoff(fc, i, allocations[i]!, mine);
    const br = bestAllocationAgainst(fc, i, mine, allocations[i]);
    const reg = Math.max(0, br.payoff - now);
    out.bestAllocations.push(br.allocation);
    out.payoffs.push(now);
    out.regrets.push(reg);
    out.shadowPrices.push(br.shadowPrice);
    if (reg > out.nashGap) out.nashGap = reg;
  }
  return out;
}
