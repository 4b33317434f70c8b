/**
 * Pure equilibria of the logit (difference-form) contest, p_i = w_i exp(k e_i) / sum_j
 * w_j exp(k e_j) (Hirshleifer 1989, Public Choice 63; volume from memory). Derived here:
 * u_i'' = v_i k^2 p_i (1 - p_i)(1 - 2 p_i), so an interior best response needs p_i > 1/2 and
 * solves v_i k p_i (1 - p_i) = m_i; hence at most one rival can be interior at an equilibrium,
 * every other rival spends 0 or its whole budget. The candidates are therefore: each rival at
 * 0 or at its cap, with at most one rival at its interior point, which has a closed form
 *     e_i = (ln(p / (1 - p)) + ln Z_{-i} - ln w_i) / k,   p = (1 + sqrt(1 - 4 m_i / (v_i k))) / 2.
 * Every candidate is verified by a global best-response check. Capped rivals are enumerated
 * exhaustively up to 6 of them; beyond that only "all at cap" and "all at zero", plus the end
 * points of best-response iteration (Gauss-Seidel) started from both.
 */
import type { BestResponseOptions } from "./bestResponse";
import { bestResponseIteration } from "./bestResponseIteration";
import { logitInteriorLogOdds } from "./logitInterior";
import { sameProfile, verifyProfile } from "./activeSetSearch";
import type { FoundEquilibrium, SearchOptions } from "./activeSetSearch";
import type { Contest } from "./types";

function logSumExp(xs: readonly number[]): number {
  let top = -Infinity;
  for (const x of xs) top = Math.max(top, x);
  if (top === -Infinity) return -Infinity;
  let s = 0;
  for (const x of xs) s += Math.exp(x - top);
  return top + Math.log(s);
}

const EXHAUSTIVE_CAPS = 6;

export function logitSearch(contest: Contest, opts: SearchOptions = {}): FoundEquilibrium[] {
  if (contest.csf.kind !== "logit") return [];
  const k = contest.csf.scale;
  const rivals = contest.rivals;
  const n = rivals.length;
  const tol = opts.tolerance ?? 1e-6 * contest.prize;
  const brOpts: BestResponseOptions =
    opts.gridPoints === undefined ? {} : { gridPoints: opts.gridPoints };
  const capIdx = rivals.map((x, i) => i).filter((i) => rivals[i]!.maxEffort < Infinity);
  const capPatterns: boolean[][] = [];
  if (capIdx.length <= EXHAUSTIVE_CAPS) {
    for (let mask = 0; mask < 1 << capIdx.length; mask++) {
      capPatterns.push(capIdx.map((_, b) => (mask & (1 << b)) !== 0));
    }
  } else {
    capPatterns.push(
      capIdx.map(() => false),
      capIdx.map(() => true),
    );
  }
  const memo = new Map<string, number>();
  const found: FoundEquilibrium[] = [];
  const consider = (e: number[]) => {
    if (found.some((f) => sameProfile(contest, f.efforts, e))) return;
    const gap = verifyProfile(contest, e, tol, brOpts, memo);
    if (gap <= tol) found.push({ efforts: e, gap });
  };
  for (const pattern of capPatterns) {
    const base = new Array<number>(n).fill(0);
    capIdx.forEach((i, b) => {
      if (pattern[b]) base[i] = rivals[i]!.maxEffort;
    });
    consider(base.slice());
    for (let i = 0; i < n; i++) {
      const rv = rivals[i]!;
      const logOdds = logitInteriorLogOdds(rv.value, rv.cost, k);
      if (logOdds === null) continue;
      const others = base.map((x, j) =>
        j === i ? -Infinity : Math.log(rivals[j]!.weight) + k * x,
      );
      const lnZ = logSumExp(others);
      if (lnZ === -Infinity) continue;
      const e = (logOdds + lnZ - Math.log(rv.weight)) / k;
      if (!(e > 0) || e > rv.maxEffort) continue;
      const prof = base.slice();
      prof[i] = e;
      consider(prof);
    }
  }
  if (capIdx.length > EXHAUSTIVE_CAPS) {
    for (const pattern of capPatterns) {
      const start = new Array<number>(n).fill(0);
      capIdx.forEach((i, b) => {
        if (pattern[b]) start[i] = rivals[i]!.maxEffort;
      });
      const end = bestResponseIteration(contest, start, { sweeps: 60 });
      if (end) consider(end);
    }
  }
  // most active first, then more total effort
  const act = (x: number[]) => x.filter((e) => e > 0).length;
  const tot = (x: number[]) => x.reduce((s, e) => s + e, 0);
  found.sort((a, b) => act(b.efforts) - act(a.efforts) || tot(b.efforts) - tot(a.efforts));
  return found;
}
