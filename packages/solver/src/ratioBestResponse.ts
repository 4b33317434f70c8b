/**
 * Ratio-form best responses (Tullock 1980), shared by the per-rival route (bestResponseAgainst)
 * and the O(n) route (respond) of bestResponse.ts.
 * - r_i = 1, with Z = sum_{j != i} w_j e_j^r_j > 0: the closed form
 *   w_i e_i = max(0, sqrt(w_i v_i Z / m_i) - Z), capped by the budget (the payoff is concave,
 *   so the cap is the constrained optimum).
 * - r_i != 1 (derived here): with s = w e^r / (w e^r + Z) and t = logit(s),
 *   sign u'(e) = sign psi(t),  psi(t) = ln(v r s (1 - s)) - ln(m e),  e = (e^t Z / w)^(1/r),
 *   and psi''(t) = -2 sigma(t) sigma(-t) < 0: psi is concave in t. For r < 1 it is also
 *   decreasing (one crossing, the maximum). For r > 1 it rises until sigma(t) = (1 - 1/r)/2
 *   and falls after, so u falls, may rise, then falls: the only interior local maximum is the
 *   larger root of psi. Candidates 0, that root and the cap give the global maximum exactly.
 *   Should the Newton iteration for that root ever stop short of its tolerance, the candidate
 *   comes from a dense-grid search instead of from an unconverged iterate.
 */
import { gridMaximize } from "./gridMaximize";
import { logisticParts } from "./logistic";
import { newtonRoot, type Iterated } from "./newton";
import type { Rival } from "./types";

/** Newton on psi stops when a step is below this fraction of |t| (or of 1). */
const PSI_REL_TOL = 1e-14;
/** Newton on psi converges monotonically in a few steps; this many means something is wrong. */
const PSI_MAX_ITER = 200;
/** How far right of psi's peak the search for a point with psi <= 0 goes (in t). */
const PSI_BRACKET_LIMIT = 1e6;
/** Grid points of the fallback search when the Newton iteration does not converge. */
const FALLBACK_GRID_POINTS = 2001;

/** A rival's own term w e^r of the ratio form (0 at zero effort). */
export function ratioTerm(rv: Rival, e: number): number {
  return e > 0 ? (rv.r === 1 ? rv.weight * e : rv.weight * Math.pow(e, rv.r)) : 0;
}

/**
 * Ratio-form payoff v y / (y + z) - m e of a rival whose own term is y = w e^r against the
 * others' z; an all-zero profile splits the prize equally among all n.
 */
export function ratioPayoff(rv: Rival, n: number, e: number, y: number, z: number): number {
  const p = y + z === 0 ? 1 / n : y / (y + z);
  return rv.value * p - rv.cost * e;
}

/**
 * The effort that can beat spending nothing against z = sum_{j != i} w_j e_j^r_j > 0: the
 * interior maximum capped by the budget (see the file header), or 0 when there is none. The
 * caller compares its payoff with that of spending nothing (and of the current effort).
 */
export function ratioCandidate(rv: Rival, n: number, z: number): number {
  const { value: v, cost: m, weight: w, maxEffort: B, r } = rv;
  if (r === 1) {
    const y = Math.sqrt((w * v * z) / m) - z;
    return y > 0 ? Math.min(y / w, B) : 0;
  }
  if (!(Math.min(B, v / m) > 0)) return 0;
  const interior = ratioInteriorMaximum(v, m, w, r, z);
  if (interior.ok) return interior.x > 0 ? Math.min(interior.x, B) : 0;
  const u = (e: number) => ratioPayoff(rv, n, e, ratioTerm(rv, e), z);
  return gridMaximize(u, Math.min(B, v / m), FALLBACK_GRID_POINTS).x;
}

/**
 * psi(t) of the file header, K = ln(m / (v r)) + ln(Z / w) / r:
 * psi(t) = ln s + ln(1 - s) - t / r - K with s = sigma(t), and its slope 1 - 2 sigma(t) - 1/r.
 */
function ratioPsi(t: number, r: number, K: number): readonly [number, number] {
  const { softplus, softplusNeg, sigma } = logisticParts(t);
  return [-softplusNeg - softplus - t / r - K, 1 - 2 * sigma - 1 / r];
}

/**
 * Interior local maximum of u(e) = v w e^r / (w e^r + Z) - m e for r != 1, Z > 0 (x = 0 if
 * none): Newton on the concave psi(t) described in the file header, from the right of the root.
 * `ok: false` when the iteration stops short of its tolerance.
 */
export function ratioInteriorMaximum(
  v: number,
  m: number,
  w: number,
  r: number,
  z: number,
): Iterated {
  const lnZw = Math.log(z) - Math.log(w);
  const K = Math.log(m / (v * r)) + lnZw / r;
  const psi = (t: number) => ratioPsi(t, r, K)[0];
  let t: number;
  if (r < 1) t = 0;
  else {
    // psi peaks where sigma(t) = (1 - 1/r) / 2
    const q = 0.5 * (1 - 1 / r);
    const tPeak = Math.log(q / (1 - q));
    if (psi(tPeak) <= 0) return { ok: true, x: 0, iterations: 0 };
    let d = 1;
    t = tPeak + d;
    while (psi(t) > 0 && d < PSI_BRACKET_LIMIT) {
      d *= 2;
      t = tPeak + d;
    }
    if (psi(t) > 0) return { ok: false, x: t, iterations: 0, reason: "not-converged" };
  }
  const root = newtonRoot((x) => ratioPsi(x, r, K), t, {
    relTol: PSI_REL_TOL,
    maxIter: PSI_MAX_ITER,
  });
  return { ...root, x: Math.exp((root.x + lnZw) / r) };
}
