/**
 * Pure equilibria of a ratio-form contest between n >= 3 identical rivals (Tullock 1980) with
 * r > 1, one representative per number k of active rivals. With k identical rivals active and
 * the rest idle, the active ones play the symmetric k-rival equilibrium
 * e_k = r v (k - 1) / (m k^2), which is an equilibrium among them iff r <= k / (k - 1) (Baye,
 * Kovenock & de Vries 1994, Public Choice 81; volume from memory); the profile is an
 * equilibrium of the whole contest iff, in addition, no idle rival gains by entering against
 * the k active ones. Both checks use the exact best response (ratioCandidate), so each k
 * costs O(1) and 10,000 rivals are settled in microseconds instead of a search over subsets.
 * Every choice of which k rivals are active is an equilibrium too: there are C(n, k).
 */
import { ratioCandidate, ratioPayoff, ratioTerm } from "./ratioBestResponse";
import { identicalRivals } from "./symmetricRatio";
import type { Contest, Equilibrium } from "./types";

export interface SymmetricActiveSet {
  /** number of active rivals */
  k: number;
  /** effort of each active rival */
  effort: number;
  /** largest regret (active or idle rival) */
  gap: number;
  /** ln C(n, k): how many equivalent equilibria (choices of the active rivals) */
  lnCount: number;
}

/**
 * Every k (most active first) whose k-active symmetric profile passes the global check, or
 * null when the shortcut does not apply (not ratio form, not identical, n < 3, r <= 1, or a
 * budget binding at some candidate: the general search handles those).
 */
export function symmetricActiveSets(
  contest: Contest,
  tolerance: number,
): SymmetricActiveSet[] | null {
  const n = contest.rivals.length;
  const rv = contest.rivals[0];
  if (contest.csf.kind !== "ratio" || n < 3 || !rv || !identicalRivals(contest)) return null;
  const { r, value: v, cost: m } = rv;
  if (!(r > 1)) return null;
  // r <= k / (k - 1)  <=>  k <= r / (r - 1)
  const kMax = Math.min(n, Math.floor(r / (r - 1) + 1e-9));
  for (let k = 2; k <= kMax; k++) {
    if ((r * v * (k - 1)) / (m * k * k) > rv.maxEffort) return null;
  }
  // ln C(n, kMax), then C(n, k) = C(n, k + 1) (k + 1) / (n - k) going down
  let lnC = 0;
  for (let j = 1; j <= kMax; j++) lnC += Math.log(n - kMax + j) - Math.log(j);
  const out: SymmetricActiveSet[] = [];
  for (let k = kMax; k >= 2; k--) {
    if (k < kMax) lnC += Math.log(k + 1) - Math.log(n - k);
    const e = (r * v * (k - 1)) / (m * k * k);
    const y = ratioTerm(rv, e);
    // an active rival against k - 1 others, and an idle one against all k
    const zActive = (k - 1) * y;
    const now = ratioPayoff(rv, n, e, y, zActive);
    const candA = ratioCandidate(rv, n, zActive);
    const bestA = Math.max(0, ratioPayoff(rv, n, candA, ratioTerm(rv, candA), zActive), now);
    const zIdle = k * y;
    const candI = ratioCandidate(rv, n, zIdle);
    const bestI = Math.max(0, ratioPayoff(rv, n, candI, ratioTerm(rv, candI), zIdle));
    const gap = Math.max(bestA - now, bestI);
    if (gap <= tolerance) out.push({ k, effort: e, gap, lnCount: lnC });
  }
  return out;
}

/** The profile of a representative: the first k rivals active. */
export function activeSetProfile(n: number, set: SymmetricActiveSet): number[] {
  const e = new Array<number>(n).fill(0);
  for (let i = 0; i < set.k; i++) e[i] = set.effort;
  return e;
}

/**
 * The Equilibrium record of a representative, built in O(n) from the symmetry: active shares
 * 1/k, idle 0; its Nash gap is the one measured above (an active and an idle rival stand for
 * all, since identical rivals facing the same efforts have the same regret).
 */
export function activeSetEquilibrium(contest: Contest, set: SymmetricActiveSet): Equilibrium {
  const n = contest.rivals.length;
  const rv = contest.rivals[0]!;
  const efforts = activeSetProfile(n, set);
  const share = 1 / set.k;
  const pay = rv.value * share - rv.cost * set.effort;
  return {
    kind: "pure",
    efforts,
    shares: efforts.map((e) => (e > 0 ? share : 0)),
    payoffs: efforts.map((e) => (e > 0 ? pay : 0)),
    totalEffort: set.k * set.effort,
    dissipation: (set.k * rv.cost * set.effort) / contest.prize,
    active: efforts.map((e) => e > 0),
    nashGap: set.gap,
    method: set.k === n ? "closed-form:symmetric" : "closed-form:symmetric-active-set",
  };
}

/** "3", "4,950" or "about 2.6e+35" equivalent equilibria. */
export function countText(lnCount: number): string {
  const c = Math.exp(lnCount);
  if (c < 1e15) return Math.round(c).toLocaleString("en-US");
  const log10 = lnCount / Math.LN10;
  const exp = Math.floor(log10);
  return `about ${Math.pow(10, log10 - exp).toFixed(1)}e+${exp}`;
}
