/**
 * Fills the defaults of a validated fronts scenario (value = the front's prize, weight 1,
 * budget Infinity, sunkBudget false) and builds one single contest per front, in which rival i
 * has cost c_ik, value V_ik and weight w_ik and no cap of its own (the budget is shared by the
 * fronts; a rival with a zero budget gets a zero cap on every front).
 */
import type { Contest } from "../types";
import type { FrontsContest, FrontsRival, FrontsScenario, PerFront } from "./types";

function perFront(x: PerFront | null | undefined, k: number, fallback: (j: number) => number) {
  if (x === null || x === undefined) return Array.from({ length: k }, (_, j) => fallback(j));
  return typeof x === "number" ? new Array<number>(k).fill(x) : x.slice();
}

export function normalizeFronts(s: FrontsScenario): FrontsContest {
  const K = s.fronts.length;
  const rivals: FrontsRival[] = s.rivals.map((x) => ({
    name: x.name,
    cost: perFront(x.cost, K, () => 1),
    value: perFront(x.value, K, (j) => s.fronts[j]!.prize),
    weight: perFront(x.weight, K, () => 1),
    budget: x.budget ?? Infinity,
    sunkBudget: x.sunkBudget ?? false,
  }));
  return {
    title: s.title,
    fronts: s.fronts.map((f) => ({ ...f })),
    rivals,
    contests: frontContests(s.title, s.fronts, rivals),
  };
}

/** The single contest of each front (see the file header). */
export function frontContests(
  title: string,
  fronts: FrontsContest["fronts"],
  rivals: readonly FrontsRival[],
): Contest[] {
  return fronts.map((f, k) => ({
    title: `${title}: ${f.name}`,
    prize: f.prize,
    csf: f.csf,
    rivals: rivals.map((rv) => ({
      name: rv.name,
      cost: rv.cost[k]!,
      value: rv.value[k]!,
      weight: rv.weight[k]!,
      maxSpend: rv.budget === 0 ? 0 : Infinity,
      maxEffort: rv.budget === 0 ? 0 : Infinity,
      r: f.csf.kind === "ratio" ? f.csf.decisiveness : 1,
    })),
    leader: null,
  }));
}
