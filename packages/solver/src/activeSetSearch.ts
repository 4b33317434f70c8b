/**
 * Pure equilibria of ratio-form contests where some r_i > 1 (payoffs not concave, so an
 * equilibrium may fail to exist or be one of several). For each candidate set of active
 * rivals the share-function equations (Cornes & Hartley 2005) are solved with the others at
 * zero, taking the larger root of each first-order condition (the local maximum); every
 * candidate is then verified by a global best-response check of every rival, including the
 * option of spending nothing. Candidate sets: all subsets of size >= 2 for n <= 8, otherwise
 * the prefixes of the rivals sorted by strength w_i^(1/r_i) v_i / m_i plus the end point of a
 * damped best-response iteration. Known facts used only
 * in notes: the symmetric profile is an equilibrium iff r <= n/(n-1) (Baye, Kovenock & de
 * Vries 1994, Public Choice 81); above that bound equilibria with fewer active rivals can
 * exist (k identical active rivals need r <= k/(k-1), and the idle ones must not want to
 * enter: with n = 3 and r = 1.6 two active rivals, with r = 1.3 and n = 10 three or four);
 * with r > 2 there is no pure equilibrium, while for r >= 2 a mixed one with full dissipation
 * exists (Alcalde & Dahm 2010, Journal of Public Economics 94). Volume numbers from memory.
 */
import type { BestResponseOptions, Opposition } from "./bestResponse";
import { bestResponseAgainst, oppositions, payoffAgainst } from "./bestResponse";
import { bestResponseIteration } from "./bestResponseIteration";
import { shareFunctionEquilibrium } from "./shareFunction";
import type { Contest } from "./types";

export interface SearchOptions {
  /** accept a candidate when its Nash gap is at most this (default 1e-6 * prize) */
  tolerance?: number;
  gridPoints?: number;
  /** exhaustive subset search up to this many rivals (default 8) */
  exhaustiveUpTo?: number;
}

/**
 * Verifies a profile by global best responses, stopping at the first rival whose regret
 * exceeds the tolerance; memoises rivals facing an identical situation. Returns the gap, or
 * Infinity if rejected.
 */
export function verifyProfile(
  contest: Contest,
  efforts: readonly number[],
  tolerance: number,
  opts: BestResponseOptions,
  memo?: Map<string, number>,
  order?: readonly number[],
): number {
  const os: Opposition[] = oppositions(contest, efforts);
  let gap = 0;
  const n = contest.rivals.length;
  for (let t = 0; t < n; t++) {
    const i = order ? order[t]! : t;
    const rv = contest.rivals[i]!;
    const o = os[i]!;
    const e = efforts[i] ?? 0;
    // 12 significant digits: identical rivals in mirrored profiles differ only by rounding
    const key = `${rv.value}|${rv.cost}|${rv.weight}|${rv.r}|${rv.maxEffort}|${e.toPrecision(12)}|${o.z.toPrecision(12)}|${o.lnZ.toPrecision(12)}`;
    let reg = memo?.get(key);
    if (reg === undefined) {
      const now = payoffAgainst(contest, i, e, o);
      const br = bestResponseAgainst(contest, i, o, opts, e);
      reg = Math.max(0, br.payoff - now);
      memo?.set(key, reg);
    }
    if (reg > tolerance) return Infinity;
    gap = Math.max(gap, reg);
  }
  return gap;
}

function* subsetsBySize(n: number): Generator<boolean[]> {
  // largest sets first; within a size, lexicographic by index
  for (let size = n; size >= 2; size--) {
    const idx = Array.from({ length: size }, (_, k) => k);
    for (;;) {
      const mask = new Array<boolean>(n).fill(false);
      for (const k of idx) mask[k] = true;
      yield mask;
      let p = size - 1;
      while (p >= 0 && idx[p] === n - size + p) p--;
      if (p < 0) break;
      idx[p]!++;
      for (let q = p + 1; q < size; q++) idx[q] = idx[q - 1]! + 1;
    }
  }
}

function* strengthPrefixes(contest: Contest): Generator<boolean[]> {
  const n = contest.rivals.length;
  const strength = contest.rivals.map((x) => (Math.pow(x.weight, 1 / x.r) * x.value) / x.cost);
  const order = strength.map((_, i) => i).sort((a, b) => strength[b]! - strength[a]! || a - b);
  for (let size = n; size >= 2; size--) {
    const mask = new Array<boolean>(n).fill(false);
    for (let k = 0; k < size; k++) mask[order[k]!] = true;
    yield mask;
  }
}

/** True when two profiles agree up to a small fraction of the largest reachable effort. */
export function sameProfile(contest: Contest, a: readonly number[], b: readonly number[]): boolean {
  let scale = 0;
  for (const x of contest.rivals) scale = Math.max(scale, Math.min(x.maxEffort, x.value / x.cost));
  const tol = 1e-7 * scale;
  return a.every((x, i) => Math.abs(x - (b[i] ?? 0)) <= tol);
}

export interface FoundEquilibrium {
  efforts: number[];
  gap: number;
}

/** Every distinct verified pure equilibrium found, most active rivals first. */
export function ratioActiveSetSearch(
  contest: Contest,
  opts: SearchOptions = {},
): FoundEquilibrium[] {
  const n = contest.rivals.length;
  const tol = opts.tolerance ?? 1e-6 * contest.prize;
  const brOpts: BestResponseOptions =
    opts.gridPoints === undefined ? {} : { gridPoints: opts.gridPoints };
  const memo = new Map<string, number>();
  const found: FoundEquilibrium[] = [];
  const exhaustive = n <= (opts.exhaustiveUpTo ?? 8);
  const sets = exhaustive ? subsetsBySize(n) : strengthPrefixes(contest);
  for (const members of sets) {
    const sol = shareFunctionEquilibrium(contest, { members });
    if (!sol.ok) continue;
    const e = sol.efforts;
    if (found.some((f) => sameProfile(contest, f.efforts, e))) continue;
    // rivals left out are the likeliest to want in: check them first
    const order = e
      .map((x, i) => ({ x, i }))
      .sort((p, q) => p.x - q.x)
      .map((p) => p.i);
    const gap = verifyProfile(contest, e, tol, brOpts, memo, order);
    if (gap <= tol) found.push({ efforts: e, gap });
  }
  if (!exhaustive) {
    // beyond the exhaustive range, best-response iteration may reach other active sets
    const start = contest.rivals.map((x) => Math.min(x.maxEffort, (x.r * x.value) / (x.cost * n)));
    const end = bestResponseIteration(contest, start, { sweeps: 100, damping: 0.5 });
    // damping only halves the efforts of rivals on their way out: re-solve on the active set
    const members = end?.map(
      (e, i) => e > 1e-9 * (contest.rivals[i]!.value / contest.rivals[i]!.cost),
    );
    const sol = members ? shareFunctionEquilibrium(contest, { members }) : null;
    if (sol?.ok && !found.some((f) => sameProfile(contest, f.efforts, sol.efforts))) {
      const gap = verifyProfile(contest, sol.efforts, tol, brOpts, memo);
      if (gap <= tol) found.push({ efforts: sol.efforts, gap });
    }
  }
  return found;
}
