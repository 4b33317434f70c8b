/**
 * Mixed equilibria of two-rival ratio-form (r > 1) and logit contests without a pure one.
 *
 * A two-rival contest is strategically equivalent to a zero-sum game (Ewerhart 2015,
 * Economic Theory 60(1), 59-71, uses this): divide rival i's payoff by its value and add to
 * each payoff a term that depends on the other rival's effort only, which changes no best
 * response: A(x, y) = p_1(x, y) - c_1 x + c_2 y with c_i = cost_i / value_i; rival 1 maximises
 * A, rival 2 minimises it. The equilibria of the game are therefore the optimal strategies of
 * a zero-sum game and can be computed as a linear programme (matrixGame.ts).
 *
 * Method: the double oracle (McMahan, Gordon & Blum 2003, ICML; from memory). Start from an
 * effort grid that is log-spaced near zero (Ewerhart 2015 shows symmetric equilibria for
 * 2 < r < infinity have mass points accumulating at zero) and linear above; solve the matrix
 * game; add each rival's exact best pure deviation over the continuum against the other's mix
 * (grid plus Brent refinement); repeat until the certified gap stops improving, falls below
 * the target, or the round limit (or an optional time budget) is reached. The final gap is certified on a dense grid
 * (discreteMixed.ts) and reported, never assumed.
 */
import {
  deviationPeaks,
  discreteMixedGap,
  effortCeiling,
  justAbove,
  mixedOutcome,
  mixedStrategyOf,
  pairShare,
  type DiscreteMix,
} from "./discreteMixed";
import { logWeight } from "./csf";
import { solveMatrixGame } from "./matrixGame";
import type { Contest, Equilibrium } from "./types";

export interface TwoRivalMixedOptions {
  /** stop once the gap is below this (money; default 1e-5 * prize) */
  target?: number;
  /** the result is flagged approximate when its certified gap exceeds this (default 1e-6 * prize) */
  tolerance?: number;
  /**
   * wall-clock budget for the iteration in ms; default none, so the answer depends only on the
   * contest (the round limit bounds the work; computer seats must replay identically)
   */
  timeBudgetMs?: number;
  /** clock (ms), injectable for tests */
  now?: () => number;
  /** points of the dense grid that certifies the final gap (default 4001) */
  certifyGridPoints?: number;
  /** most oracle rounds (default 40) */
  maxRounds?: number;
}

/** Log-spaced near zero, linear above: 0, hi 10^(-k/2) for k = 16..1, hi j / 16. */
export function startGrid(hi: number): number[] {
  if (!(hi > 0)) return [0];
  const out = new Set<number>([0]);
  for (let k = 16; k >= 1; k--) out.add(hi * Math.pow(10, -k / 2));
  for (let j = 1; j <= 16; j++) out.add((hi * j) / 16);
  return [...out].sort((a, b) => a - b);
}

/** A(x, y) for every pair of the two sets (the zero-sum form in the file header). */
function zeroSumMatrix(contest: Contest, xs: readonly number[], ys: readonly number[]): number[][] {
  const [r0, r1] = [contest.rivals[0]!, contest.rivals[1]!];
  const c0 = r0.cost / r0.value;
  const c1 = r1.cost / r1.value;
  const ly = ys.map((y) => logWeight(contest, 1, y));
  return xs.map((x) => {
    const lx = logWeight(contest, 0, x);
    return ys.map((y, b) => pairShare(lx, ly[b]!) - c0 * x + c1 * y);
  });
}

/** Sets larger than this drop the points the last solution did not play. */
const PRUNE_ABOVE = 120;

function prune(mix: DiscreteMix, set: readonly number[]): number[] {
  const played = new Set(mix.efforts.filter((_, k) => mix.probabilities[k]! > 0));
  const hi = Math.max(...set);
  return set.filter((x) => x === 0 || x === hi || played.has(x) || !mix.efforts.includes(x));
}

function addPoint(set: number[], x: number): boolean {
  const tol = 1e-12 * Math.max(1, Math.abs(x));
  if (set.some((s) => Math.abs(s - x) <= tol)) return false;
  set.push(x);
  return true;
}

export interface TwoRivalMixedResult {
  mixes: [DiscreteMix, DiscreteMix];
  gap: number;
  rounds: number;
}

/** The double-oracle iteration; the returned gap is certified on the dense grid. */
export function twoRivalMixedMixes(
  contest: Contest,
  opts: TwoRivalMixedOptions = {},
): TwoRivalMixedResult {
  const now = opts.now ?? (() => performance.now());
  const target = opts.target ?? 1e-5 * contest.prize;
  const budget = opts.timeBudgetMs ?? Infinity;
  const maxRounds = opts.maxRounds ?? 40;
  const t0 = now();
  const sets: [number[], number[]] = [
    startGrid(effortCeiling(contest, 0)),
    startGrid(effortCeiling(contest, 1)),
  ];
  let best: { mixes: [DiscreteMix, DiscreteMix]; gap: number } | null = null;
  let rounds = 0;
  for (; rounds < maxRounds; rounds++) {
    const sol = solveMatrixGame(zeroSumMatrix(contest, sets[0], sets[1]));
    const mixes: [DiscreteMix, DiscreteMix] = [
      { efforts: sets[0].slice(), probabilities: sol.row },
      { efforts: sets[1].slice(), probabilities: sol.col },
    ];
    const out = mixedOutcome(contest, mixes);
    let gap = 0;
    let added = false;
    for (const i of [0, 1] as const) {
      // heavy atoms only while iterating; the final certificate checks them all
      const extra = [...sets[i], ...justAbove(contest, mixes[1 - i]!, 1e-3)];
      const peaks = deviationPeaks(contest, i, mixes[1 - i]!, 1024, extra, 8);
      gap = Math.max(gap, peaks[0]!.payoff - out.payoffs[i]);
      for (const p of peaks) {
        if (p.payoff - out.payoffs[i] > 0.1 * target) added = addPoint(sets[i], p.x) || added;
      }
      if (sets[i].length > PRUNE_ABOVE) sets[i] = prune(mixes[i], sets[i]);
    }
    if (!best || gap < best.gap) best = { mixes, gap };
    if (gap <= target || !added || now() - t0 > budget) break;
  }
  const mixes = best!.mixes;
  const gap = discreteMixedGap(contest, mixes, opts.certifyGridPoints ?? 4001);
  return { mixes, gap: Math.max(0, gap), rounds: rounds + 1 };
}

/**
 * The mixed equilibrium of a two-rival ratio or logit contest as an Equilibrium record, or
 * null when the contest is not of that kind.
 */
export function twoRivalMixedEquilibrium(
  contest: Contest,
  opts: TwoRivalMixedOptions = {},
): Equilibrium | null {
  if (contest.rivals.length !== 2 || contest.csf.kind === "allpay") return null;
  const res = twoRivalMixedMixes(contest, opts);
  const out = mixedOutcome(contest, res.mixes);
  const tol = opts.tolerance ?? 1e-6 * contest.prize;
  const strategies = res.mixes.map((m) => mixedStrategyOf(m, 1e-12));
  const spent = contest.rivals.reduce((s, rv, i) => s + rv.cost * out.expectedEfforts[i]!, 0);
  return {
    kind: "mixed",
    efforts: null,
    expectedEfforts: [...out.expectedEfforts],
    shares: [...out.shares],
    payoffs: [...out.payoffs],
    totalEffort: out.expectedEfforts[0] + out.expectedEfforts[1],
    dissipation: spent / contest.prize,
    active: out.expectedEfforts.map((e) => e > 0),
    nashGap: res.gap,
    method: "numeric:double-oracle",
    strategies,
    approximate: !(res.gap <= tol),
    note: `Mixed-strategy equilibrium computed on a refined effort grid (${res.rounds} rounds); its Nash gap is certified against every pure deviation.`,
  };
}
