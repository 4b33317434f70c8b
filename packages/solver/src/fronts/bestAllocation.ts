/**
 * Best allocation of one rival's budget over several fronts against the others' efforts, its
 * regret, and the Nash gap of a whole profile.
 * - Fronts whose shares move continuously with effort (ratio, logit): water-filling with one
 *   multiplier for the budget (waterFilling.ts, with the argument for exactness there).
 * - All-pay fronts: every combination of concede / tie / outbid on them, the rest of the
 *   budget water-filled over the other fronts (allPayAllocation.ts).
 * The rival's current allocation, when given and within budget, is a candidate too, so
 * regrets are never negative.
 */
import type { Opposition } from "../bestResponse";
import { allPayAllocation } from "./allPayAllocation";
import { allPayFronts, allocationPayoff, frontOppositions, spendOf } from "./frontPayoff";
import type { BestAllocation, FrontsContest, FrontsResponses } from "./types";
import { waterFill } from "./waterFilling";

/**
 * Best allocation of rival i given each front's opposition `opp[k]` (see the file header);
 * `hint` is a guess of the budget's multiplier mu (where the search starts).
 */
export function bestAllocationAgainst(
  fc: FrontsContest,
  i: number,
  opp: readonly Opposition[],
  current?: readonly number[],
  hint?: number,
): BestAllocation {
  const rv = fc.rivals[i]!;
  const allPay = allPayFronts(fc);
  let best: BestAllocation;
  if (allPay.length > 0) best = allPayAllocation(fc, i, opp, allPay, hint);
  else {
    const w = waterFill(fc, i, opp, rv.budget, undefined, hint);
    best = {
      allocation: w.row,
      payoff: allocationPayoff(fc, i, w.row, opp),
      shadowPrice: w.shadowPrice,
    };
  }
  if (current && spendOf(fc, i, current) <= rv.budget) {
    const u = allocationPayoff(fc, i, current, opp);
    // ties keep the current row: a rival already at a best allocation does not move
    if (u >= best.payoff) best = { ...best, allocation: current.slice(), payoff: u };
  }
  return best;
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
