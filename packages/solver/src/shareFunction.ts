/**
 * Share-function (aggregative) method for ratio-form contests: Cornes & Hartley 2005,
 * "Asymmetric contests with general technologies", Economic Theory 26 (volume from memory).
 *
 * In effective units y_i = w_i e_i^r_i, Y = sum y_j, s_i = y_i / Y, rival i's first-order
 * condition d/dy_i [v_i y_i / Y - m_i (y_i / w_i)^(1/r_i)] = 0 with Y_{-i} fixed reads
 *     v_i (Y - y_i) / Y^2 = (m_i / r_i) (y_i / w_i)^(1/r_i) / y_i,
 * and multiplying by y_i gives   v_i r_i s_i (1 - s_i) = m_i e_i,   e_i = (s_i Y / w_i)^(1/r_i).
 * Given Y it fixes the share s_i(Y):
 *   r_i = 1:  s_i = max(0, 1 - m_i Y / (w_i v_i))          (drop-out when a_i Y >= 1)
 *   r_i < 1:  the unique root in (0, 1) of  c s^q = 1 - s,  c = m_i (Y/w_i)^(1/r_i) / (v_i r_i),
 *             q = 1/r_i - 1 > 0  (no drop-out: the marginal product is infinite at zero)
 *   r_i > 1:  q < 0, the equation has 0 or 2 roots; the larger one is the local maximum of the
 *             payoff (the smaller is a local minimum), s_i = 0 when there is none. Only a
 *             candidate: the caller must verify it with a global best-response check.
 * A budget B_i caps the share: s_i <= w_i B_i^r_i / Y. The equilibrium aggregate solves
 * sum_i s_i(Y) (+ F / Y for a fixed contribution F, e.g. a committed leader) = 1, whose left
 * side falls in Y; the root is bracketed in log Y and found by Brent's method. For r_i <= 1
 * the equilibrium is unique (Szidarovszky & Okuguchi 1997, Games and Economic Behavior 18;
 * volume from memory). Each evaluation is O(n) with a few Newton steps per rival.
 */
import { brentRoot } from "./brentRoot";
import type { Contest } from "./types";

function softplus(t: number): number {
  return t > 0 ? t + Math.log1p(Math.exp(-t)) : Math.log1p(Math.exp(t));
}
function sigmoid(t: number): number {
  return t >= 0 ? 1 / (1 + Math.exp(-t)) : Math.exp(t) / (1 + Math.exp(t));
}

/**
 * Root in t = logit(s) of  phi(t) = ln c + q ln s - ln(1 - s)
 *                                  = ln c - q softplus(-t) + softplus(t).
 * phi' = q sigma(-t) + sigma(t) and phi'' = (1 - q) sigma(t) sigma(-t): phi is convex or
 * concave throughout, so Newton converges monotonically once a step lands on the right side;
 * a bracket guards it anyway. For q < 0 (r > 1) the larger root lies right of t* = ln(-q).
 */
function unconstrainedShare(lnC: number, q: number): number {
  const phi = (t: number) => lnC - q * softplus(-t) + softplus(t);
  const dphi = (t: number) => q * sigmoid(-t) + sigmoid(t);
  let lo: number;
  let hi: number;
  if (q > 0) {
    lo = -Math.max(1, Math.abs(lnC) / Math.min(q, 1)) - 2;
    hi = -lo;
    while (phi(lo) > 0) lo *= 2;
    while (phi(hi) < 0) hi *= 2;
  } else {
    lo = Math.log(-q);
    if (phi(lo) > 0) return 0; // no interior critical point: the rival stays out
    hi = Math.max(lo + 1, -lnC + 2);
    while (phi(hi) < 0) hi = hi + 2 * (hi - lo);
  }
  let t = q > 0 ? Math.min(Math.max(-lnC / Math.max(q, 1), lo), hi) : hi;
  for (let it = 0; it < 100; it++) {
    const f = phi(t);
    if (f > 0) hi = t;
    else lo = t;
    const d = dphi(t);
    let next = t - f / d;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - t) <= 1e-14 * Math.max(1, Math.abs(t))) {
      t = next;
      break;
    }
    t = next;
  }
  return sigmoid(t);
}

/** Share s_i(Y) of one rival (before or after its budget cap), see the file header. */
export function rivalShare(
  v: number,
  m: number,
  w: number,
  r: number,
  budget: number,
  aggregate: number,
): { share: number; capped: boolean } {
  const Y = aggregate;
  let s: number;
  if (r === 1) s = Math.max(0, 1 - (m * Y) / (w * v));
  else {
    const lnC = Math.log(m) + Math.log(Y / w) / r - Math.log(v * r);
    s = unconstrainedShare(lnC, 1 / r - 1);
  }
  if (budget < Infinity) {
    const cap = (w * Math.pow(budget, r)) / Y;
    if (s >= cap) return { share: cap, capped: true };
  }
  return { share: s, capped: false };
}

export interface ShareFunctionOptions {
  /** which rivals take part (default: all); the others spend nothing */
  members?: readonly boolean[];
  /** a fixed effective contribution F to the aggregate (a committed leader's w e^r) */
  fixed?: number;
}

export interface ShareFunctionSolution {
  efforts: number[];
  /** equilibrium aggregate Y = sum w_i e_i^r_i (including the fixed contribution) */
  aggregate: number;
  /** true where the budget binds */
  capped: boolean[];
}

/**
 * Equilibrium of the ratio-form contest by the share-function method, or null when the
 * share equation has no root (a lone participant facing nobody: the supremum is not
 * attained; or, with r_i > 1, no consistent interior candidate for this set of members).
 */
export function shareFunctionEquilibrium(
  contest: Contest,
  opts: ShareFunctionOptions = {},
): ShareFunctionSolution | null {
  const rivals = contest.rivals;
  const n = rivals.length;
  const fixed = opts.fixed ?? 0;
  const idx: number[] = [];
  for (let i = 0; i < n; i++) {
    const rv = rivals[i]!;
    if ((opts.members?.[i] ?? true) && rv.budget > 0) idx.push(i);
  }
  const k = idx.length;
  const v = new Float64Array(k);
  const m = new Float64Array(k);
  const w = new Float64Array(k);
  const r = new Float64Array(k);
  const b = new Float64Array(k);
  let guess = fixed;
  for (let j = 0; j < k; j++) {
    const rv = rivals[idx[j]!]!;
    v[j] = rv.value;
    m[j] = rv.cost;
    w[j] = rv.weight;
    r[j] = rv.r;
    b[j] = rv.budget;
    const e0 = Math.min(rv.budget, (rv.r * rv.value) / (rv.cost * Math.max(2, k)));
    guess += rv.weight * Math.pow(e0, rv.r);
  }
  if (k === 0) return null;
  const excess = (lnY: number) => {
    const Y = Math.exp(lnY);
    let s = fixed / Y;
    for (let j = 0; j < k; j++) s += rivalShare(v[j]!, m[j]!, w[j]!, r[j]!, b[j]!, Y).share;
    return s - 1;
  };
  let lo = Math.log(guess > 0 && Number.isFinite(guess) ? guess : 1);
  let hi = lo;
  let flo = excess(lo);
  let fhi = flo;
  let tries = 0;
  while (flo <= 0 && tries < 200) {
    hi = lo;
    fhi = flo;
    lo -= 2;
    flo = excess(lo);
    tries++;
  }
  tries = 0;
  while (fhi > 0 && tries < 200) {
    lo = hi;
    flo = fhi;
    hi += 2;
    fhi = excess(hi);
    tries++;
  }
  if (!(flo > 0) || !(fhi <= 0)) return null;
  const lnY = brentRoot(excess, lo, hi, flo, fhi, 1e-14);
  const Y = Math.exp(lnY);
  // the aggregate must actually balance (with r_i > 1 the share sum can jump past 1)
  if (Math.abs(excess(lnY)) > 1e-9) return null;
  const efforts = new Array<number>(n).fill(0);
  const capped = new Array<boolean>(n).fill(false);
  for (let j = 0; j < k; j++) {
    const i = idx[j]!;
    const sh = rivalShare(v[j]!, m[j]!, w[j]!, r[j]!, b[j]!, Y);
    capped[i] = sh.capped;
    efforts[i] = sh.capped ? b[j]! : Math.pow((sh.share * Y) / w[j]!, 1 / r[j]!);
  }
  return { efforts, aggregate: Y, capped };
}
