/**
 * What counts as a valid allocation in a session with fronts (R46): the one rule the engine,
 * computer moves, missing moves and the web's seat form all use. An allocation is money, one
 * amount per front in file order; each amount is finite and >= 0 and the total is within the
 * rival's budget (money, same tolerance as a single move: withinBudget). Amounts need not sit
 * on the spend step. The effort on front k is spend / the rival's cost there.
 */
import { LIMITS } from "@contend/protocol";
import { withinBudget } from "./effort";

export type AllocationCheck =
  | { ok: true; spends: number[]; efforts: number[]; total: number }
  | { ok: false; reason: "wrong-length"; expected: number; got: number }
  | { ok: false; reason: "not-a-number" | "negative" | "too-large"; front: number }
  | { ok: false; reason: "over-budget"; total: number; budget: number; over: number };

/** A rival's terms over the fronts: cost per front (money per unit of effort) and its budget. */
export interface AllocationTerms {
  cost: readonly number[];
  /** money; null, undefined or Infinity: no cap */
  budget?: number | null;
}

export function checkAllocation(
  spends: readonly number[],
  rival: AllocationTerms,
): AllocationCheck {
  const k = rival.cost.length;
  if (spends.length !== k) {
    return { ok: false, reason: "wrong-length", expected: k, got: spends.length };
  }
  let total = 0;
  for (let j = 0; j < k; j++) {
    const x = spends[j]!;
    if (typeof x !== "number" || !Number.isFinite(x))
      return { ok: false, reason: "not-a-number", front: j };
    if (x < 0) return { ok: false, reason: "negative", front: j };
    if (x > LIMITS.effortMax) return { ok: false, reason: "too-large", front: j };
    total += x;
  }
  const budget = rival.budget;
  if (budget !== null && budget !== undefined && Number.isFinite(budget)) {
    if (!withinBudget(total, budget)) {
      return { ok: false, reason: "over-budget", total, budget, over: total - budget };
    }
  }
  return {
    ok: true,
    spends: spends.slice(),
    efforts: spends.map((x, j) => x / rival.cost[j]!),
    total,
  };
}

/** The refusal in plain words, numbers as given (screens format their own); fronts by name. */
export function allocationProblemText(
  check: Exclude<AllocationCheck, { ok: true }>,
  frontNames: readonly string[] = [],
): string {
  const front = (j: number) => frontNames[j] ?? `front ${j + 1}`;
  switch (check.reason) {
    case "wrong-length":
      return `needs one amount per front (${check.expected}), got ${check.got}`;
    case "not-a-number":
      return `${front(check.front)}: must be a number`;
    case "negative":
      return `${front(check.front)}: must be zero or more`;
    case "too-large":
      return `${front(check.front)}: must be at most ${LIMITS.effortMax}`;
    case "over-budget":
      // 12 significant digits: the sum of amounts given to the cent carries no float dust
      return `the total ${Number(check.total.toPrecision(12))} is more than the budget ${check.budget}`;
  }
}
