/**
 * The scenario model and every result type the solver returns. This file is the contract
 * between the solver, the protocol, the server and the web app: change it deliberately.
 *
 * Conventions (all arrays are in rival order):
 * - effort e_i >= 0 is the model's internal quantity; what a rival spends (money) is
 *   spend_i = cost_i * effort_i. Budgets cap money: cost_i * effort_i <= budget_i.
 * - shares p_i are winning probabilities (or market shares) and sum to 1.
 * - payoff u_i = v_i * p_i - m_i * e_i (risk neutral).
 * - dissipation = (sum_i m_i e_i) / prize, using expected efforts for mixed equilibria.
 */

import type { Provenance } from "./calibrate/provenanceTypes";

/** Contest success function as written in a scenario file. */
export type CsfSpec =
  | { kind: "ratio"; decisiveness: number } // Tullock 1980; decisiveness r > 0
  | { kind: "logit"; scale: number } // Hirshleifer 1989; scale k > 0
  | { kind: "allpay" }; // highest effort wins, ties split

/** A rival as written in a scenario file (optional fields fall back to defaults). */
export interface RivalSpec {
  name: string;
  /** marginal cost of effort m_i > 0 */
  cost: number;
  /** value of the prize to this rival v_i > 0; defaults to the scenario prize */
  value?: number | null;
  /** weight (head start) w_i > 0; defaults to 1 */
  weight?: number | null;
  /**
   * most this rival may spend, in money: cost * effort <= budget (Che & Gale 1997 read budgets
   * as money). null = no cap. Files written when this field was an effort cap read the same
   * wherever cost is 1.
   */
  budget?: number | null;
  /** own decisiveness r_i (ratio form only); defaults to csf.decisiveness */
  decisiveness?: number | null;
}

/** A scenario file (the JSON the `contend` CLI reads). */
export interface Scenario {
  title: string;
  /** prize value used when a rival has no own value; also the rent for dissipation */
  prize: number;
  csf: CsfSpec;
  rivals: RivalSpec[];
  /** name of the rival who commits first (leader-follower game), or null */
  leader?: string | null;
  /** display only: currency symbol or code, e.g. "$" or "EUR" */
  currency?: string | null;
  /** where the numbers came from (a calibration from data); carried along, never computed on */
  provenance?: Provenance | null;
}

/**
 * A rival with every default filled in. The scenario's budget (money) becomes two caps:
 * maxSpend = budget and maxEffort = budget / cost, both Infinity when uncapped. Algorithms
 * compare efforts with maxEffort; screens speak maxSpend.
 */
export interface Rival {
  name: string;
  cost: number;
  value: number;
  weight: number;
  /** the budget in money (cost * effort <= maxSpend); Infinity when uncapped */
  maxSpend: number;
  /** the same cap in effort units: maxSpend / cost; Infinity when uncapped */
  maxEffort: number;
  /** decisiveness for the ratio form (ignored by logit and all-pay) */
  r: number;
}

/** A scenario with defaults resolved: what every algorithm takes. */
export interface Contest {
  title: string;
  prize: number;
  csf: CsfSpec;
  rivals: Rival[];
  /** index of the leader, or null */
  leader: number | null;
}

/** A mixed strategy: an optional atom at zero plus a continuous part on [low, high]. */
export interface MixedStrategy {
  /** probability of spending exactly zero */
  atomAtZero: number;
  /** the rest of the mass is spread over [low, high] (uniform unless cdfExponent is set) */
  low: number;
  high: number;
  /**
   * shape of the non-atom part: its conditional CDF is ((x - low) / (high - low))^cdfExponent
   * on [low, high]; omitted or 1 = uniform. The symmetric all-pay equilibrium with n
   * identical rivals has cdfExponent 1 / (n - 1).
   */
  cdfExponent?: number;
  /** expected effort */
  mean: number;
  /**
   * a finite mixed strategy (ratio and logit forms): every effort played with its probability
   * (probabilities sum to 1); atomAtZero, low and high then summarise it, and the range
   * between the points is not played
   */
  points?: { effort: number; probability: number }[];
}

export type EquilibriumKind = "pure" | "mixed" | "none-pure";

export interface Equilibrium {
  kind: EquilibriumKind;
  /** pure efforts, or null for mixed / none-pure */
  efforts: number[] | null;
  /** expected efforts (mixed equilibria) */
  expectedEfforts?: number[];
  /** winning probabilities; null when none-pure */
  shares: number[] | null;
  /** expected payoffs; null when none-pure */
  payoffs: number[] | null;
  /** sum of (expected) efforts */
  totalEffort: number;
  /** sum_i m_i e_i / prize */
  dissipation: number;
  /** true where the rival spends a positive amount */
  active: boolean[];
  /** largest regret measured at the reported profile (0 for an exact equilibrium; NaN when
   * kind is "none-pure" and there is no profile to measure) */
  nashGap: number;
  /** which method produced it, e.g. "closed-form:symmetric", "share-function", "numeric" */
  method: string;
  /** mixed strategies per rival (all-pay; finite mixes with points for ratio and logit) */
  strategies?: MixedStrategy[];
  /** set when the contest's numbers are beyond what the solver computes reliably: the reason
   * (kind is then "none-pure" and no number is reported) */
  outOfRange?: string;
  /**
   * how many equilibria this record stands for: the same efforts given to any other choice of
   * identical rivals (symmetric contests above the existence bound); omitted means 1
   */
  equivalents?: number;
  /** true when the reported profile is only an approximate equilibrium: its certified Nash
   * gap exceeds the solver's tolerance (mixed equilibria computed on a grid) */
  approximate?: boolean;
  /** plain-language remark, e.g. why no pure equilibrium exists */
  note?: string;
}

export interface SolveResult {
  /** the main equilibrium; with a leader set, the subgame-perfect leader-follower outcome */
  equilibrium: Equilibrium;
  /** further equilibria found (same shape), possibly empty */
  alternatives: Equilibrium[];
}

export interface SolveOptions {
  /** tolerance on the Nash gap for accepting a numerical candidate (default 1e-6 * prize) */
  tolerance?: number;
  /**
   * Best responses are exact global maxima from the payoff's shape (see bestResponse.ts);
   * when set, a dense grid of this many points is searched as well (a cross-check).
   * Mixed-equilibrium gaps and the leader's search use it as their grid size.
   */
  gridPoints?: number;
  /** clock in ms for the time budgets of the mixed-equilibrium searches (tests inject one) */
  now?: () => number;
  /** false: stop at "none-pure" instead of searching for a mixed equilibrium (default true) */
  mixed?: boolean;
  /** wall-clock budget (ms) of the mixed search with three or more rivals (default 10,000) */
  mixedTimeBudgetMs?: number;
}

/** Best response of one rival to the others' efforts. */
export interface BestResponse {
  effort: number;
  payoff: number;
  /**
   * true when the supremum is not attained (others all spend zero in the ratio form):
   * effort is then the smallest positive step and payoff the limit value.
   */
  supremumOnly?: boolean;
}

/** `contend respond` output. */
export interface Responses {
  bestResponses: number[];
  regrets: number[];
  payoffs: number[];
  nashGap: number;
}

/** Typed expected failure (never thrown for bad user input). */
export interface InputError {
  ok: false;
  /** dotted path of the offending field, e.g. "rivals.2.cost" */
  path: string;
  message: string;
}

export type Parsed<T> = { ok: true; value: T } | InputError;
