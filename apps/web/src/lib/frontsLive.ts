/**
 * Helpers for the live screens of a session with fronts (docs/protocol.md R45-R50): a seat's
 * terms on each front, and reading the amounts a seat typed with the engine's own rule
 * (checkAllocation in @contend/session), so the form refuses exactly what the server refuses.
 */
import type { RoleView, RoundResult } from "@contend/protocol";
import { checkAllocation } from "@contend/session";
import { normalizeFronts } from "@contend/solver";
import { formatMoney } from "./format";

export interface SeatFrontsTerms {
  names: string[];
  prizes: number[];
  /** money per unit of effort on each front */
  cost: number[];
  /** what each front is worth to this seat */
  value: number[];
  weight: number[];
  /** money over all fronts; null: no cap */
  budget: number | null;
  sunk: boolean;
}

/** The seat's terms on every front, or null when the session has no fronts. */
export function seatFrontsTerms(view: RoleView, seat: number): SeatFrontsTerms | null {
  if (!view.fronts) return null;
  const fc = normalizeFronts(view.fronts);
  const rv = fc.rivals[seat];
  if (!rv) return null;
  return {
    names: fc.fronts.map((f) => f.name),
    prizes: fc.fronts.map((f) => f.prize),
    cost: rv.cost,
    value: rv.value,
    weight: rv.weight,
    budget: Number.isFinite(rv.budget) ? rv.budget : null,
    sunk: rv.sunkBudget,
  };
}

/** What the seat's boxes hold: blank boxes count as zero (conceding that front). */
export interface AllocationEntry {
  /** some box holds text */
  typed: boolean;
  ok: boolean;
  spends: number[];
  /** money over all fronts (NaN while a box is not a number) */
  total: number;
  /** budget minus total; null without a budget */
  remaining: number | null;
  /** the first problem in plain words with units; null when ok or nothing typed */
  problem: string | null;
  /** per box: its problem, or null */
  frontProblems: (string | null)[];
}

export function readAllocation(
  texts: readonly string[],
  terms: SeatFrontsTerms,
  currency: string | null,
): AllocationEntry {
  const cents = (v: number) => formatMoney(v, currency, 2);
  const spends = terms.names.map((_, k) => {
    const t = (texts[k] ?? "").replace(/[,\s]/g, "");
    return t === "" ? 0 : Number(t);
  });
  const typed = texts.some((t) => t.trim() !== "");
  const total = spends.reduce((a, b) => a + b, 0);
  const remaining = terms.budget === null ? null : terms.budget - total;
  const frontProblems = terms.names.map(() => null as string | null);
  const check = checkAllocation(spends, { cost: terms.cost, budget: terms.budget });
  if (check.ok) return { typed, ok: true, spends, total, remaining, problem: null, frontProblems };
  let problem: string;
  switch (check.reason) {
    case "not-a-number":
    case "negative":
      problem = `${terms.names[check.front]}: enter an amount of zero or more.`;
      frontProblems[check.front] = "Zero or more";
      break;
    case "too-large":
      problem = `${terms.names[check.front]}: that amount is too large.`;
      frontProblems[check.front] = "Too large";
      break;
    case "over-budget":
      // to the cent: rounded figures would read "the total 1,000 is over the budget 1,000"
      problem = `The total ${cents(check.total)} is over your budget of ${cents(check.budget)} by ${cents(check.over)}.`;
      break;
    case "wrong-length":
      problem = "One amount per front.";
      break;
  }
  return { typed, ok: false, spends, total, remaining, problem, frontProblems };
}

/** A round's per-front record, or null for a single-contest round. */
export function frontsOf(round: RoundResult | undefined) {
  return round?.fronts ?? null;
}

/** Sum of a row. */
export function total(row: readonly number[] | null | undefined): number {
  return (row ?? []).reduce((a, b) => a + b, 0);
}
