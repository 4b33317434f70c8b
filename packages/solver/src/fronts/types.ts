/**
 * Several fronts, one budget: the scenario and result types of simultaneous contests fought
 * with one purse (Friedman 1958, "Game-theory models in the allocation of advertising
 * expenditures", Operations Research 6; from memory).
 *
 * Conventions: rows are rivals in file order, columns fronts in file order. x_ik >= 0 is
 * rival i's effort on front k, bought at c_ik per unit, so it spends c_ik x_ik of money there;
 * a budget B_i caps money: sum_k c_ik x_ik <= B_i. Payoff sum_k V_ik p_ik - sum_k c_ik x_ik,
 * or sum_k V_ik p_ik for a rival whose budget is sunk (spent here or not at all).
 */
import type { Contest, CsfSpec, EquilibriumKind } from "../types";

/** One front as written in a scenario file. */
export interface FrontSpec {
  name: string;
  prize: number;
  csf: CsfSpec;
}

/** A number for every front, or one entry per front. */
export type PerFront = number | number[];

export interface FrontsRivalSpec {
  name: string;
  /** cost per unit of effort on each front, > 0 */
  cost: PerFront;
  /** value of each front to this rival; defaults to the front's prize */
  value?: PerFront | null;
  /** head start on each front; defaults to 1 */
  weight?: PerFront | null;
  /** total money this rival can spend over all fronts; null = no cap */
  budget?: number | null;
  /** the budget is committed: money not spent here is lost (needs a budget) */
  sunkBudget?: boolean | null;
}

/** A scenario file with `fronts` in place of `prize` and `csf`. */
export interface FrontsScenario {
  title: string;
  fronts: FrontSpec[];
  rivals: FrontsRivalSpec[];
  currency?: string | null;
}

/** A rival with defaults filled in; arrays have one entry per front. */
export interface FrontsRival {
  name: string;
  cost: number[];
  value: number[];
  weight: number[];
  /** Infinity when uncapped */
  budget: number;
  sunkBudget: boolean;
}

/** A fronts scenario with defaults resolved, plus one single contest per front. */
export interface FrontsContest {
  title: string;
  fronts: FrontSpec[];
  rivals: FrontsRival[];
  /**
   * front k as a single contest: rival i has cost c_ik, value V_ik, weight w_ik and no budget
   * of its own (0 when its total budget is 0); the budget lives across fronts.
   */
  contests: Contest[];
}

export interface FrontsEquilibrium {
  /** "pure", or "none-pure" when no profile passed the global check */
  kind: Extract<EquilibriumKind, "pure" | "none-pure">;
  /** efforts x_ik (rows rivals, columns fronts); null when none-pure */
  allocations: number[][] | null;
  /** money c_ik x_ik */
  spends: number[][] | null;
  /** p_ik */
  shares: number[][] | null;
  payoffs: number[] | null;
  /** money each rival spends over all fronts */
  budgetUsed: number[] | null;
  /** money spent on each front by all rivals */
  frontTotals: number[] | null;
  /**
   * what one more unit of budget is worth to each rival (the budget's Lagrange multiplier):
   * 0 when the budget does not bind, null for a rival without a budget
   */
  shadowPrices: (number | null)[] | null;
  /** largest regret at the reported profile, each regret against a whole-allocation best
   * response (NaN when none-pure) */
  nashGap: number;
  method: string;
  note?: string;
}

export interface FrontsSolveResult {
  equilibrium: FrontsEquilibrium;
  alternatives: FrontsEquilibrium[];
}

export interface FrontsSolveOptions {
  /** accept a profile when its Nash gap is at most this (default 1e-6 x the sum of prizes) */
  tolerance?: number;
}

/** One rival's best allocation against the others' efforts. */
export interface BestAllocation {
  allocation: number[];
  payoff: number;
  /** Lagrange multiplier of the budget (0 when slack; null without a budget) */
  shadowPrice: number | null;
}

/** `contend respond` output for a fronts scenario. */
export interface FrontsResponses {
  bestAllocations: number[][];
  regrets: number[];
  payoffs: number[];
  nashGap: number;
  /** per rival: shadow price of the budget at its best allocation */
  shadowPrices: (number | null)[];
}
