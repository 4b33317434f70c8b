/**
 * Monte Carlo of the equilibrium under ranges: draw N scenarios (seeded), solve each with the
 * ordinary solver, and summarise efforts, spends (money), shares and payoffs (money) per rival
 * over the draws that have a pure-strategy equilibrium. Draws without one (mixed, none found,
 * unsupported) are counted and reported apart, never dropped silently. Optionally the tornado
 * and one rival's robust plan. Pure and deterministic: the same scenario, draws and seed give
 * the same result.
 */
import { normalize } from "../normalize";
import { solve } from "../solve";
import { drawSolver, medianScenario } from "./draws";
import { evaluateSpend, planDraw, robustSpend, type PlanDraw } from "./robustPlan";
import { band } from "./stats";
import { tornado } from "./tornado";
import type { RobustPlan, UncertainResult, UncertainScenario } from "./types";
import { uncertainParams } from "./validateUncertain";

export interface UncertainOptions {
  draws: number;
  seed: number;
  /** rival index to plan for, or null / absent for no plan */
  planRival?: number | null;
  /** called after every `progressEvery` draws (default 500) and once at the end */
  onProgress?: (done: number, total: number) => void;
  progressEvery?: number;
  /** compute the tornado (default true; a sweep of bands leaves it out) */
  sensitivity?: boolean;
}

/** Largest number of draws accepted (memory grows as draws x rivals). */
export const MAX_DRAWS = 1_000_000;

export function runUncertain(s: UncertainScenario, opts: UncertainOptions): UncertainResult {
  const params = uncertainParams(s);
  const n = s.rivals.length;
  const N = opts.draws;
  const every = Math.max(1, opts.progressEvery ?? 500);
  const efforts = new Float64Array(N * n);
  const spends = new Float64Array(N * n);
  const shares = new Float64Array(N * n);
  const payoffs = new Float64Array(N * n);
  const activeCount = new Array<number>(n).fill(0);
  const plan = opts.planRival ?? null;
  const planDraws: PlanDraw[] = [];
  let pure = 0;
  const solveDraw = drawSolver(s, params, opts.seed);
  for (let d = 0; d < N; d++) {
    const { contest, equilibrium: eq } = solveDraw(d);
    if (eq.kind === "pure" && eq.efforts && eq.shares && eq.payoffs) {
      const row = pure * n;
      for (let i = 0; i < n; i++) {
        const e = eq.efforts[i]!;
        efforts[row + i] = e;
        spends[row + i] = contest.rivals[i]!.cost * e;
        shares[row + i] = eq.shares[i]!;
        payoffs[row + i] = eq.payoffs[i]!;
        if (eq.active[i]) activeCount[i]!++;
      }
      if (plan !== null) planDraws.push(planDraw(contest, plan, eq.efforts));
      pure++;
    }
    if (opts.onProgress && ((d + 1) % every === 0 || d + 1 === N)) opts.onProgress(d + 1, N);
  }
  return {
    draws: N,
    seed: opts.seed,
    noPureEquilibrium: N === 0 ? 0 : (N - pure) / N,
    pureDraws: pure,
    parameters: params.map((p) => p.path),
    efforts: band(efforts, pure, n),
    spends: band(spends, pure, n),
    shares: band(shares, pure, n),
    payoffs: band(payoffs, pure, n),
    activeProbability: activeCount.map((c) => (pure === 0 ? null : c / pure)),
    sensitivity: opts.sensitivity === false ? [] : tornado(s, params),
    plan: plan === null ? null : robustPlan(s, plan, planDraws),
  };
}

function robustPlan(s: UncertainScenario, i: number, draws: PlanDraw[]): RobustPlan {
  const median = normalize(medianScenario(s));
  const eq = solve(median, { mixed: false }).equilibrium;
  const medianSpend =
    eq.kind === "pure" && eq.efforts ? median.rivals[i]!.cost * eq.efforts[i]! : null;
  const spend = robustSpend(draws, i, medianSpend === null ? [] : [medianSpend]);
  const base = {
    rival: s.rivals[i]!.name,
    index: i,
    spend,
    equilibriumSpendAtMedians: medianSpend,
    drawsUsed: draws.length,
  };
  if (draws.length === 0) {
    const nan = Number.NaN;
    return {
      ...base,
      expectedPayoff: nan,
      p10Payoff: nan,
      p50Payoff: nan,
      p90Payoff: nan,
      meanRegret: nan,
      p90Regret: nan,
      atMedianEquilibrium: null,
      payoffByDraw: [],
      regretByDraw: [],
    };
  }
  const atMedian = medianSpend === null ? null : evaluateSpend(draws, i, medianSpend);
  return {
    ...base,
    ...evaluateSpend(draws, i, spend),
    atMedianEquilibrium: atMedian && {
      expectedPayoff: atMedian.expectedPayoff,
      p10Payoff: atMedian.p10Payoff,
      p50Payoff: atMedian.p50Payoff,
      p90Payoff: atMedian.p90Payoff,
      meanRegret: atMedian.meanRegret,
      p90Regret: atMedian.p90Regret,
    },
  };
}
