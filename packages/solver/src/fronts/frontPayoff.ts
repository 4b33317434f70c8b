/**
 * What a rival gets from a whole allocation row: its share of each front, its payoff and the
 * money it spends, each front's opposition, and which fronts make the program concave. Shares
 * follow csf.ts exactly (ratio form, Tullock 1980; logit, Hirshleifer 1989; all-pay auction:
 * the highest effort wins, rivals tied at the top split the prize).
 */
import type { Opposition } from "../bestResponse";
import { oppositions } from "../bestResponse";
import type { Contest } from "../types";
import type { FrontsContest } from "./types";

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
  // all-pay: o.top is the highest other effort and o.ties how many others hold it
  if (o.ties === 0 || x > o.top) return 1;
  return x === o.top ? 1 / (o.ties + 1) : 0;
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

/** Concave when every front is ratio form with r <= 1 (see bestAllocation.ts). */
export function frontsAreConcave(fc: FrontsContest): boolean {
  return fc.fronts.every((f) => f.csf.kind === "ratio" && f.csf.decisiveness <= 1);
}

/** Indices of the all-pay fronts. */
export function allPayFronts(fc: FrontsContest): number[] {
  return fc.fronts.flatMap((f, k) => (f.csf.kind === "allpay" ? [k] : []));
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
