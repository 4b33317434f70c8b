/**
 * Approximate mixed equilibria of ratio-form (r > 1) and logit contests with three or more
 * rivals and no pure equilibrium.
 *
 * Method: simultaneous fictitious play on an effort grid per rival (Brown 1951, "Iterative
 * solution of games by fictitious play", in Activity Analysis of Production and Allocation,
 * Koopmans (ed.), Wiley; from memory). Each round every rival best-responds, on its grid, to
 * the others' empirical mixes (the averages of their past grid best responses; the first round
 * answers the uniform mix); the averages are the candidate mixes. Fictitious play need not converge
 * in games with three or more players, so nothing is assumed: the mix with the smallest gap
 * on the grids is kept, and its Nash gap is certified over the continuum at the end
 * (mixedCertificate.ts). The iteration stops at a stated number of rounds (default 1000) or at
 * a stated wall-clock budget (solve() gives it 10 s), whichever comes first; within the round
 * limit the same contest gives the same answer on every machine, and an answer cut by the
 * clock says so in its note.
 *
 * Expectations over the others' independent mixes come from the Laplace transform of their
 * total weight (othersTotal.ts): linear in the number of rivals, within a stated error.
 */
import { effortCeiling, mixedStrategyOf, type DiscreteMix } from "./discreteMixed";
import { certifyMixes } from "./mixedCertificate";
import { othersTotal, rivalClasses } from "./othersTotal";
import { startGrid } from "./twoRivalMixed";
import type { Contest, Equilibrium } from "./types";

/** Lattice step while playing (winning chances within about 2e-7); certificates use a finer one. */
const PLAY_STEP = 0.5;

export interface ManyRivalMixedOptions {
  /** fictitious-play rounds (default 1000) */
  rounds?: number;
  /** optional wall-clock budget in ms (default none: results depend only on the contest) */
  timeBudgetMs?: number;
  /** clock in ms, injectable for tests */
  now?: () => number;
  /** points of the dense grid that certifies the gap (default 2001) */
  certifyGridPoints?: number;
}

export interface FictitiousPlayResult {
  mixes: DiscreteMix[];
  /** gap on the grids of the kept mixes (money); the certificate is computed separately */
  gridGap: number;
  rounds: number;
  /** true when the time budget ended the play before the round limit */
  outOfTime: boolean;
}

/** Simultaneous fictitious play on the grids (file header); keeps the mix with the least grid gap. */
export function fictitiousPlay(
  contest: Contest,
  opts: ManyRivalMixedOptions = {},
): FictitiousPlayResult {
  const maxRounds = opts.rounds ?? 1000;
  const now = opts.now ?? (() => performance.now());
  const budget = opts.timeBudgetMs ?? Infinity;
  const t0 = now();
  // identical rivals start alike and best-respond alike, so one mix per class is played
  const classes = rivalClasses(contest);
  const { classOf, members } = classes;
  const grids = members.map((m) => startGrid(effortCeiling(contest, m[0]!)));
  // the first round answers the uniform mix; later ones the average of the best responses
  // so far (the uniform start is not averaged in: with many rivals its weight on large
  // efforts would add up to more than the prize)
  const counts = grids.map((g) => g.map(() => 0));
  let total = 0;
  const mixOf = (): DiscreteMix[] => {
    const byClass = grids.map((g, c) => ({
      efforts: g,
      probabilities: counts[c]!.map((x) => (total > 0 ? x / total : 1 / g.length)),
    }));
    return classOf.map((c) => byClass[c]!);
  };
  let best: Omit<FictitiousPlayResult, "outOfTime"> | null = null;
  let t = 0;
  let outOfTime = false;
  for (; t < maxRounds; t++) {
    const mixes = mixOf();
    const facing = othersTotal(contest, mixes, PLAY_STEP, classes);
    let gridGap = 0;
    const brs = members.map((m, c) => {
      const i = m[0]!;
      const us = grids[c]!.map((x) => facing.payoff(i, x));
      let arg = 0;
      let own = 0;
      us.forEach((u, k) => {
        if (u > us[arg]!) arg = k;
        own += mixes[i]!.probabilities[k]! * u;
      });
      gridGap = Math.max(gridGap, us[arg]! - own);
      return arg;
    });
    if (!best || gridGap < best.gridGap) best = { mixes, gridGap, rounds: t + 1 };
    brs.forEach((k, c) => (counts[c]![k]! += 1));
    total += 1;
    if (now() - t0 > budget) {
      outOfTime = t + 1 < maxRounds;
      t++;
      break;
    }
  }
  return { ...best!, rounds: t, outOfTime };
}

/**
 * The approximate mixed equilibrium of a ratio or logit contest with three or more rivals as
 * an Equilibrium record (always `approximate`: a learning method gives an epsilon-equilibrium),
 * or null when the contest is not of that kind.
 */
export function manyRivalMixedEquilibrium(
  contest: Contest,
  opts: ManyRivalMixedOptions = {},
): Equilibrium | null {
  const n = contest.rivals.length;
  if (n < 3 || contest.csf.kind === "allpay") return null;
  const fp = fictitiousPlay(contest, opts);
  const cert = certifyMixes(contest, fp.mixes, opts);
  const spent = contest.rivals.reduce((s, rv, i) => s + rv.cost * cert.expectedEfforts[i]!, 0);
  const stop = fp.outOfTime ? `stopped by its ${opts.timeBudgetMs} ms time budget after ` : "";
  return {
    kind: "mixed",
    efforts: null,
    expectedEfforts: cert.expectedEfforts,
    shares: cert.shares,
    payoffs: cert.payoffs,
    totalEffort: cert.expectedEfforts.reduce((s, e) => s + e, 0),
    dissipation: spent / contest.prize,
    active: cert.expectedEfforts.map((e) => e > 0),
    nashGap: cert.gap,
    method: "numeric:fictitious-play",
    strategies: fp.mixes.map((m) => mixedStrategyOf(m, 1e-12)),
    approximate: true,
    note: `Approximate mixed-strategy equilibrium from fictitious play on an effort grid (${stop}${fp.rounds} rounds; expectations over the others' mixes from the Laplace transform of their total, within a stated error); its Nash gap is certified against every pure deviation.`,
  };
}
