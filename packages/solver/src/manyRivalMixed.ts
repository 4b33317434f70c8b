/**
 * Approximate mixed equilibria of ratio-form (r > 1) and logit contests with three or more
 * rivals and no pure equilibrium.
 *
 * Method: fictitious play on effort grids (fictitiousPlay.ts), whose kept mixes get their
 * Nash gap certified over the continuum (mixedCertificate.ts). The play stops at a stated
 * number of rounds (default 1000) or at a stated wall-clock budget (solve() gives it 10 s),
 * whichever comes first; within the round limit the same contest gives the same answer on
 * every machine, and an answer cut by the clock says so in its note.
 *
 * Expectations over the others' independent mixes come from the Laplace transform of their
 * total weight (othersTotal.ts): linear in the number of rivals, within a stated error.
 */
import { mixedStrategyOf } from "./discreteMixed";
import { fictitiousPlay, type FictitiousPlayOptions } from "./fictitiousPlay";
import { certifyMixes } from "./mixedCertificate";
import type { Contest, Equilibrium } from "./types";

export interface ManyRivalMixedOptions extends FictitiousPlayOptions {
  /** points of the dense grid that certifies the gap (default 2001) */
  certifyGridPoints?: number;
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
