/**
 * Scenarios whose numbers may be ranges, and what a Monte Carlo run of their equilibrium
 * returns. A range is a distribution written in place of the number; draws are independent.
 */
import type { RivalSpec, Scenario } from "../types";

export type Dist =
  | { dist: "uniform"; low: number; high: number }
  | { dist: "triangular"; low: number; mode: number; high: number };

/** A number or a distribution over it. */
export type Uncertain = number | Dist;

/** Fields of a scenario that may hold a range. */
export const UNCERTAIN_RIVAL_FIELDS = ["cost", "value", "weight", "budget"] as const;
export type UncertainRivalField = (typeof UNCERTAIN_RIVAL_FIELDS)[number];

export interface UncertainRivalSpec extends Omit<RivalSpec, UncertainRivalField> {
  cost: Uncertain;
  value?: Uncertain | null;
  weight?: Uncertain | null;
  budget?: Uncertain | null;
}

export interface UncertainScenario extends Omit<Scenario, "prize" | "rivals"> {
  prize: Uncertain;
  rivals: UncertainRivalSpec[];
}

/** One uncertain parameter: its dotted path ("prize", "rivals.1.cost") and its distribution. */
export interface UncertainParam {
  path: string;
  /** rival index, or null for the prize */
  rival: number | null;
  field: "prize" | UncertainRivalField;
  dist: Dist;
}

/** Mean and type-7 percentiles per rival, in rival order (null when no draw had a pure equilibrium). */
export interface Band {
  mean: (number | null)[];
  p10: (number | null)[];
  p50: (number | null)[];
  p90: (number | null)[];
}

export interface TornadoRow {
  parameter: string;
  /** the parameter's 10th and 90th percentiles */
  low: number;
  high: number;
  /** per rival: equilibrium payoff (money) at the 90th percentile minus at the 10th; null when
   * either end has no pure equilibrium */
  payoffSwing: (number | null)[];
}

export interface RobustPlanSummary {
  /** expected payoff (money) over the draws used */
  expectedPayoff: number;
  p10Payoff: number;
  p50Payoff: number;
  p90Payoff: number;
  /** mean gap to each draw's best reply (money), >= 0 */
  meanRegret: number;
  p90Regret: number;
}

export interface RobustPlan extends RobustPlanSummary {
  rival: string;
  /** rival index in file order */
  index: number;
  /** the spend (money) that maximises the sample-average payoff */
  spend: number;
  /** the planning rival's equilibrium spend when every parameter sits at its median */
  equilibriumSpendAtMedians: number | null;
  /** the same statistics for simply spending equilibriumSpendAtMedians in every draw */
  atMedianEquilibrium: RobustPlanSummary | null;
  /** draws the plan averages over (those with a pure equilibrium) */
  drawsUsed: number;
  /** per-draw payoff and regret of the plan, in draw order (for charts; not in the CLI JSON) */
  payoffByDraw: number[];
  regretByDraw: number[];
}

export interface UncertainResult {
  draws: number;
  seed: number;
  /** fraction of draws without a pure-strategy equilibrium (counted, never dropped silently) */
  noPureEquilibrium: number;
  /** how many draws had a pure equilibrium (the percentiles use only those) */
  pureDraws: number;
  parameters: string[];
  efforts: Band;
  /** money: cost x effort in each draw */
  spends: Band;
  shares: Band;
  /** money: value x share - spend */
  payoffs: Band;
  /** per rival: fraction of pure-equilibrium draws in which it spends anything (null if none) */
  activeProbability: (number | null)[];
  sensitivity: TornadoRow[];
  plan: RobustPlan | null;
}
