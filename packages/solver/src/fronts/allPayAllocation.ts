/**
 * Best allocation of one rival when some fronts are all-pay auctions (the highest effort wins,
 * ties split; Baye, Kovenock & de Vries 1996, Economic Theory 8; from memory). Against pure
 * efforts the payoff of an all-pay front is a step function of money: nothing below the top
 * other bid, a tied share at it, the whole prize above it. So on such a front only three
 * efforts can be best (derived here; the single-contest best response in bestResponse.ts uses
 * the same three): 0, the top other effort (tie), and the top other effort plus the smallest
 * step (win; the supremum of winning is not attained, as in the single contest).
 * Exact search: every combination of those choices on the all-pay fronts, pruned to the
 * combinations not dominated in (money spent, net gain) — a combination that costs at least as
 * much and gains no more can never be better, because the rest of the budget is worth at least
 * as much with more money left — and for each survivor the rest of the budget is water-filled
 * over the other fronts (waterFilling.ts). The number of combinations is at most 3^A for A
 * all-pay fronts, which the validator caps (ALL_PAY_FRONTS_MAX).
 */
import type { Opposition } from "../bestResponse";
import { allocationPayoff, frontShare } from "./frontPayoff";
import type { BestAllocation, FrontsContest } from "./types";
import { waterFill } from "./waterFilling";

interface Combo {
  /** money spent on the all-pay fronts */
  money: number;
  /** value won there, minus the money unless the budget is sunk */
  net: number;
  /** effort on each all-pay front, in the order of `fronts` */
  efforts: number[];
}

/** The effort choices on all-pay front k for rival i (see the file header). */
function choices(fc: FrontsContest, i: number, k: number, o: Opposition, step: number): number[] {
  if (o.ties === 0) return [0]; // nobody else: the front is won for nothing
  const out = [0];
  if (o.top > 0) out.push(o.top);
  out.push(o.top + step);
  return out;
}

/** Combinations that no other combination beats in both money and net gain, cheapest first. */
function frontier(list: Combo[]): Combo[] {
  list.sort((a, b) => a.money - b.money || b.net - a.net);
  const out: Combo[] = [];
  let bestNet = -Infinity;
  for (const c of list) {
    if (c.net > bestNet) {
      out.push(c);
      bestNet = c.net;
    }
  }
  return out;
}

/**
 * Best allocation of rival i when `fronts` (indices) are all-pay; the other fronts get the rest
 * of the budget by water-filling. The shadow price is that of the water-filled fronts at the
 * money left to them (0 when there are none): a step in value on an all-pay front has no price
 * per unit of money.
 */
export function allPayAllocation(
  fc: FrontsContest,
  i: number,
  opp: readonly Opposition[],
  fronts: readonly number[],
  hint?: number,
): BestAllocation {
  const rv = fc.rivals[i]!;
  const K = fc.fronts.length;
  const B = rv.budget;
  let combos: Combo[] = [{ money: 0, net: 0, efforts: [] }];
  for (const k of fronts) {
    const c = rv.cost[k]!;
    const step = (1e-9 * (B < Infinity ? B : rv.value[k]!)) / c;
    const next: Combo[] = [];
    for (const x of choices(fc, i, k, opp[k]!, step)) {
      const money = c * x;
      const gain = rv.value[k]! * frontShare(fc.contests[k]!, i, x, opp[k]!);
      const net = gain - (rv.sunkBudget ? 0 : money);
      for (const cb of combos) {
        if (!(cb.money + money <= B)) continue;
        next.push({ money: cb.money + money, net: cb.net + net, efforts: [...cb.efforts, x] });
      }
    }
    combos = frontier(next);
  }
  const skip = fc.fronts.map((f) => f.csf.kind === "allpay");
  const continuous = skip.some((s) => !s);
  let best: BestAllocation | null = null;
  // without a budget (or with money to spare at mu = 1) the other fronts' answer does not
  // depend on the money left: compute it once
  let free: ReturnType<typeof waterFill> | null = null;
  for (const cb of combos) {
    let rest: ReturnType<typeof waterFill> = { row: new Array<number>(K).fill(0), shadowPrice: 0 };
    if (continuous) {
      const left = B === Infinity ? Infinity : Math.max(0, B - cb.money);
      if (
        free &&
        (B === Infinity || (free.shadowPrice === 0 && spendLeft(fc, i, free.row) <= left))
      ) {
        rest = free;
      } else {
        rest = waterFill(fc, i, opp, left, skip, hint);
        if (B === Infinity || rest.shadowPrice === 0) free = rest;
      }
    }
    const row = rest.row.slice();
    fronts.forEach((k, a) => (row[k] = cb.efforts[a]!));
    const payoff = allocationPayoff(fc, i, row, opp);
    if (!best || payoff > best.payoff) {
      best = {
        allocation: row,
        payoff,
        shadowPrice: B === Infinity ? null : continuous ? rest.shadowPrice : 0,
      };
    }
  }
  // the empty combination always survives (0 money), so best is set
  return best!;
}

function spendLeft(fc: FrontsContest, i: number, row: readonly number[]): number {
  const c = fc.rivals[i]!.cost;
  return row.reduce((s, x, k) => s + c[k]! * x, 0);
}
