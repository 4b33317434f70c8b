import type { Contest, Rival, Scenario } from "./types";

/**
 * Fill every default of a validated scenario: value = prize, weight = 1, no budget = no cap
 * (a budget is money, so the effort cap is budget / cost),
 * r_i = the ratio-form decisiveness (or 1 for logit and all-pay, where it is unused), and
 * resolve the leader's name to an index. Assumes the input already passed validation.
 */
export function normalize(s: Scenario): Contest {
  const defaultR = s.csf.kind === "ratio" ? s.csf.decisiveness : 1;
  const rivals: Rival[] = s.rivals.map((x) => {
    const maxSpend = x.budget ?? Infinity;
    return {
      name: x.name,
      cost: x.cost,
      value: x.value ?? s.prize,
      weight: x.weight ?? 1,
      maxSpend,
      maxEffort: maxEffortFor(maxSpend, x.cost),
      r: s.csf.kind === "ratio" ? (x.decisiveness ?? defaultR) : 1,
    };
  });
  let leader: number | null = null;
  if (s.leader !== undefined && s.leader !== null) {
    const idx = rivals.findIndex((x) => x.name === s.leader);
    leader = idx >= 0 ? idx : null;
  }
  return { title: s.title, prize: s.prize, csf: s.csf, rivals, leader };
}

/**
 * The effort a budget (money) buys: budget / cost, Infinity for no cap. A budget of 0 buys 0.
 * The one place money caps become effort caps.
 */
export function maxEffortFor(budget: number | null | undefined, cost: number): number {
  if (budget === null || budget === undefined || !Number.isFinite(budget)) return Infinity;
  return budget / cost;
}

/** Money each rival spends for the given efforts: cost x effort (spend_i = m_i e_i). */
export function spendsOf(contest: Contest, efforts: readonly number[]): number[] {
  return contest.rivals.map((r, i) => r.cost * (efforts[i] ?? 0));
}

/** Effort each spend buys: spend / cost, the model's internal quantity. */
export function effortsFromSpends(contest: Contest, spends: readonly number[]): number[] {
  return contest.rivals.map((r, i) => (spends[i] ?? 0) / r.cost);
}
