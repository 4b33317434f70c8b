/**
 * What counts as a valid move: the one rule the engine (R12), computer moves, defaulted moves
 * and the web's seat form all use. A move is money (a spend); the model's effort is
 * spend / cost. Spends sit on the session's money grid (spendStepOf(settings)) and within the
 * rival's budget, which is money too.
 */
import { LIMITS } from "@contend/protocol";

/** Relative tolerance for "on the step" and "within the budget". */
export const EFFORT_TOLERANCE = 1e-9;

/** True when x = k * step for an integer k, within 1e-9 (relative to max(1, |x|)). */
export function onStep(x: number, step: number): boolean {
  const k = Math.round(x / step);
  return Math.abs(x - k * step) <= EFFORT_TOLERANCE * Math.max(1, Math.abs(x));
}

/** True when a spend (money) is within the budget (money; null = no cap), within 1e-9. */
export function withinBudget(spend: number, budget: number | null | undefined): boolean {
  if (budget === null || budget === undefined) return true;
  return spend <= budget + EFFORT_TOLERANCE * Math.max(1, budget);
}

/** The nearest multiple of the step, rebuilt from the integer count so 0.1-type steps leave no dust. */
export function snapToStep(x: number, step: number): number {
  if (!(step > 0) || !Number.isFinite(x)) return x;
  const k = Math.round(x / step);
  const decimals = Math.max(0, Math.min(12, -Math.floor(Math.log10(step)) + 2));
  return Number((k * step).toFixed(decimals));
}

/** The largest multiple of the step that is not above the budget. */
export function largestSpendWithin(budget: number, step: number): number {
  const k = Math.floor(budget / step + EFFORT_TOLERANCE);
  const x = snapToStep(k * step, step);
  return x > budget && !withinBudget(x, budget) ? snapToStep((k - 1) * step, step) : x;
}

export type SpendCheck =
  | { ok: true; spend: number; effort: number }
  | { ok: false; reason: "not-a-number" | "negative" | "too-large"; spend: number }
  | { ok: false; reason: "off-step"; spend: number; step: number; nearest: number }
  | { ok: false; reason: "over-budget"; spend: number; budget: number; largest: number };

type RivalTerms = { cost: number; budget?: number | null };

/**
 * R12: is this spend a valid move for a rival with this cost and budget on this money grid?
 * On success it carries the effort it buys (spend / cost).
 */
export function checkSpend(spend: number, rival: RivalTerms, step: number): SpendCheck {
  return checkMove({ spend }, rival, step);
}

/**
 * R12 for either form of a move. A spend must sit on the grid; the older effort form keeps its
 * old grid (the effort is the multiple of the step) so clients written for it work unchanged.
 * Either way the money, cost x effort, must be within the budget.
 */
export function checkMove(
  move: { spend: number } | { effort: number },
  rival: RivalTerms,
  step: number,
): SpendCheck {
  const byEffort = "effort" in move;
  const x = byEffort ? move.effort : move.spend;
  const spend = byEffort ? rival.cost * move.effort : move.spend;
  if (!Number.isFinite(x)) return { ok: false, reason: "not-a-number", spend };
  if (x < 0) return { ok: false, reason: "negative", spend };
  if (x > LIMITS.effortMax || spend > LIMITS.effortMax) {
    return { ok: false, reason: "too-large", spend };
  }
  if (!onStep(x, step)) {
    return { ok: false, reason: "off-step", spend: x, step, nearest: snapToStep(x, step) };
  }
  const budget = rival.budget;
  if (budget !== null && budget !== undefined && !withinBudget(spend, budget)) {
    return {
      ok: false,
      reason: "over-budget",
      spend,
      budget,
      largest: largestSpendWithin(budget, step),
    };
  }
  return { ok: true, spend, effort: byEffort ? move.effort : spend / rival.cost };
}

/** The refusal in plain words, numbers as given (screens format their own). */
export function spendProblemText(check: Exclude<SpendCheck, { ok: true }>): string {
  switch (check.reason) {
    case "not-a-number":
      return "must be a number";
    case "negative":
      return "must be zero or more";
    case "too-large":
      return `must be at most ${LIMITS.effortMax}`;
    case "off-step":
      return `must be a multiple of ${check.step} (nearest: ${check.nearest})`;
    case "over-budget":
      return `is more than the budget ${check.budget}`;
  }
}
