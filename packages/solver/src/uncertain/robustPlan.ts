/**
 * The robust plan of one rival: the spend (money) that maximises its average payoff over the
 * draws, when in each draw the others spend that draw's equilibrium amounts (the planning
 * rival's own cost, value, weight and budget are that draw's too). A spend above a draw's budget
 * is cut to the budget in that draw. Regret in a draw is the gap to that draw's best reply to the
 * same opposition (>= 0). The sample average of payoffs need not be concave (budgets, r > 1), so
 * the search is global: `gridMaximize`, a dense grid polished by Brent's method.
 */
import { bestResponseAgainst, oppositions, payoffAgainst, type Opposition } from "../bestResponse";
import { gridMaximize } from "../gridMaximize";
import type { Contest } from "../types";
import { meanOf, percentile7, sortedCopy } from "./stats";
import type { RobustPlanSummary } from "./types";

/** One draw as the planning rival sees it. */
export interface PlanDraw {
  contest: Contest;
  opposition: Opposition;
  /** payoff of that draw's best reply to the opposition */
  bestReplyPayoff: number;
}

export function planDraw(contest: Contest, i: number, efforts: readonly number[]): PlanDraw {
  const opposition = oppositions(contest, efforts)[i]!;
  return {
    contest,
    opposition,
    bestReplyPayoff: bestResponseAgainst(contest, i, opposition).payoff,
  };
}

/** The planning rival's payoff (money) in one draw when it spends `spend`. */
export function payoffOfSpend(draw: PlanDraw, i: number, spend: number): number {
  const rv = draw.contest.rivals[i]!;
  const s = Math.min(spend, rv.maxSpend);
  return payoffAgainst(draw.contest, i, s / rv.cost, draw.opposition);
}

export function averagePayoff(draws: readonly PlanDraw[], i: number, spend: number): number {
  let sum = 0;
  for (const d of draws) sum += payoffOfSpend(d, i, spend);
  return sum / draws.length;
}

/**
 * The ratio form's average payoff over typed columns: the search evaluates the average a few
 * hundred times, so this loop is the plan's cost. Same payoff as `payoffAgainst` (Tullock 1980
 * share w e^r / (w e^r + Z), equal split when nobody spends); a test checks the two agree.
 */
export function ratioAverage(draws: readonly PlanDraw[], i: number): (spend: number) => number {
  const m = draws.length;
  const v = new Float64Array(m);
  const c = new Float64Array(m);
  const w = new Float64Array(m);
  const r = new Float64Array(m);
  const cap = new Float64Array(m);
  const z = new Float64Array(m);
  draws.forEach((d, k) => {
    const rv = d.contest.rivals[i]!;
    v[k] = rv.value;
    c[k] = rv.cost;
    w[k] = rv.weight;
    r[k] = rv.r;
    cap[k] = rv.maxSpend;
    z[k] = d.opposition.z;
  });
  const n = draws[0]?.contest.rivals.length ?? 1;
  return (spend: number) => {
    let sum = 0;
    for (let k = 0; k < m; k++) {
      const s = spend < cap[k]! ? spend : cap[k]!;
      const e = s / c[k]!;
      const rk = r[k]!;
      const y = e > 0 ? w[k]! * (rk === 1 ? e : Math.pow(e, rk)) : 0;
      const zk = z[k]!;
      sum += v[k]! * (y + zk === 0 ? 1 / n : y / (y + zk)) - s;
    }
    return sum / m;
  };
}

/** Highest spend worth searching: above its value (or budget) in every draw, spending loses. */
export function spendCeiling(draws: readonly PlanDraw[], i: number): number {
  let hi = 0;
  for (const d of draws) {
    const rv = d.contest.rivals[i]!;
    hi = Math.max(hi, Math.min(rv.value, rv.maxSpend));
  }
  return hi;
}

export interface SpendOutcome extends RobustPlanSummary {
  payoffByDraw: number[];
  regretByDraw: number[];
}

export function evaluateSpend(draws: readonly PlanDraw[], i: number, spend: number): SpendOutcome {
  const payoffByDraw = draws.map((d) => payoffOfSpend(d, i, spend));
  const regretByDraw = draws.map((d, k) => d.bestReplyPayoff - payoffByDraw[k]!);
  const pay = sortedCopy(payoffByDraw);
  const reg = sortedCopy(regretByDraw);
  return {
    expectedPayoff: meanOf(payoffByDraw),
    p10Payoff: percentile7(pay, 0.1),
    p50Payoff: percentile7(pay, 0.5),
    p90Payoff: percentile7(pay, 0.9),
    meanRegret: meanOf(regretByDraw),
    p90Regret: percentile7(reg, 0.9),
    payoffByDraw,
    regretByDraw,
  };
}

/** Grid size of the global search (the average costs one pass over the draws per point). */
export const PLAN_GRID_POINTS = 257;

/** The spend maximising the average payoff; `extra` spends are always candidates. */
export function robustSpend(
  draws: readonly PlanDraw[],
  i: number,
  extra: readonly number[] = [],
): number {
  if (draws.length === 0) return 0;
  const hi = spendCeiling(draws, i);
  const f =
    draws[0]!.contest.csf.kind === "ratio"
      ? ratioAverage(draws, i)
      : (s: number) => averagePayoff(draws, i, s);
  return gridMaximize(f, hi, PLAN_GRID_POINTS, extra).x;
}
