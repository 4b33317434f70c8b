/**
 * Best responses, regrets and the Nash gap.
 * - Ratio form, r_i = 1, with Z = sum_{j != i} w_j e_j^r_j > 0: the closed form
 *   w_i e_i = max(0, sqrt(w_i v_i Z / m_i) - Z), capped by the budget (Tullock 1980; the
 *   payoff is concave, so the cap is the constrained optimum).
 * - Ratio form, r_i < 1: the payoff is concave in e_i (a concave increasing share of a concave
 *   power), so the unique root of the first-order condition is found by bisection in log effort.
 * - Ratio form, r_i > 1, and anything else: global 1-D maximisation (dense grid + Brent).
 * - Logit form (Hirshleifer 1989): u_i'' has the sign of 1 - 2 p_i, so the payoff has at most
 *   one interior local maximum, where v k p (1 - p) = m with p > 1/2; candidates are 0, the cap
 *   and that point (exact global maximum). The grid check is used as a cross-check in tests.
 * - All-pay auction against pure efforts: bid just above the highest other effort (or tie, or 0).
 * When every other rival spends nothing in the ratio form, the supremum (the whole prize at
 * vanishing cost) is not attained: the result carries supremumOnly and the limit payoff.
 */
import { gridMaximize } from "./gridMaximize";
import type { BestResponse, Contest, Responses } from "./types";

export interface BestResponseOptions {
  /** smallest effort step (supremum cases); default 1e-6 * v_i / m_i */
  step?: number;
  /** grid points for the global search (default 2001) */
  gridPoints?: number;
}

/**
 * What rival i faces from the others: ratio form Z = sum_{j != i} w_j e_j^r_j; logit
 * lnZ = ln sum_{j != i} w_j exp(k e_j); all-pay the highest other effort and how many tie there.
 */
export interface Opposition {
  z: number;
  lnZ: number;
  top: number;
  ties: number;
}

/** Opposition of every rival at once, in O(n) via prefix and suffix sums (no cancellation). */
export function oppositions(contest: Contest, efforts: readonly number[]): Opposition[] {
  const n = contest.rivals.length;
  const csf = contest.csf;
  const out: Opposition[] = new Array<Opposition>(n);
  if (csf.kind === "allpay") {
    // highest effort, how many hold it, and the runner-up level with its count
    let top1 = -Infinity;
    let top2 = -Infinity;
    for (let i = 0; i < n; i++) {
      const e = efforts[i] ?? 0;
      if (e > top1) {
        top2 = top1;
        top1 = e;
      } else if (e < top1 && e > top2) top2 = e;
    }
    let c1 = 0;
    let c2 = 0;
    for (let i = 0; i < n; i++) {
      const e = efforts[i] ?? 0;
      if (e === top1) c1++;
      else if (e === top2) c2++;
    }
    for (let i = 0; i < n; i++) {
      const e = efforts[i] ?? 0;
      if (e === top1 && c1 === 1) out[i] = { z: 0, lnZ: -Infinity, top: top2, ties: c2 };
      else out[i] = { z: 0, lnZ: -Infinity, top: top1, ties: c1 - (e === top1 ? 1 : 0) };
    }
    return out;
  }
  const logs = new Float64Array(n);
  let shift = -Infinity;
  for (let i = 0; i < n; i++) {
    const rv = contest.rivals[i]!;
    const e = efforts[i] ?? 0;
    const l =
      csf.kind === "logit"
        ? Math.log(rv.weight) + csf.scale * e
        : e > 0
          ? Math.log(rv.weight) + rv.r * Math.log(e)
          : -Infinity;
    logs[i] = l;
    if (l > shift) shift = l;
  }
  if (csf.kind === "ratio") shift = 0; // keep Z in natural units for the ratio form
  const pre = new Float64Array(n + 1);
  const suf = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) pre[i + 1] = pre[i]! + Math.exp(logs[i]! - shift);
  for (let i = n - 1; i >= 0; i--) suf[i] = suf[i + 1]! + Math.exp(logs[i]! - shift);
  for (let i = 0; i < n; i++) {
    const s = pre[i]! + suf[i + 1]!;
    out[i] = { z: s, lnZ: Math.log(s) + shift, top: 0, ties: 0 };
  }
  return out;
}

/** u_i(e) given the opposition; ratio all-zero profile splits equally among all n. */
export function payoffAgainst(contest: Contest, i: number, e: number, o: Opposition): number {
  const rv = contest.rivals[i]!;
  const n = contest.rivals.length;
  const csf = contest.csf;
  let p: number;
  if (csf.kind === "ratio") {
    const y = e > 0 ? rv.weight * Math.pow(e, rv.r) : 0;
    p = y + o.z === 0 ? 1 / n : y / (y + o.z);
  } else if (csf.kind === "logit") {
    const a = Math.log(rv.weight) + csf.scale * e;
    p = o.lnZ === -Infinity ? 1 : 1 / (1 + Math.exp(o.lnZ - a));
  } else {
    if (o.ties === 0 || e > o.top) p = 1;
    else if (e === o.top) p = 1 / (o.ties + 1);
    else p = 0;
  }
  return rv.value * p - rv.cost * e;
}

function better(a: BestResponse, e: number, f: number): BestResponse {
  return f > a.payoff ? { effort: e, payoff: f } : a;
}

/** Best response of rival i to a given opposition (see the file header for the methods). */
export function bestResponseAgainst(
  contest: Contest,
  i: number,
  o: Opposition,
  opts: BestResponseOptions = {},
  current?: number,
): BestResponse {
  const rv = contest.rivals[i]!;
  const { value: v, cost: m, weight: w, budget: B, r } = rv;
  const hi = Math.min(B, v / m);
  const u = (e: number) => payoffAgainst(contest, i, e, o);
  const step = Math.min(opts.step ?? (1e-6 * v) / m, B);
  let best: BestResponse;
  const csf = contest.csf;
  if (csf.kind === "ratio") {
    if (o.z === 0) {
      if (!(B > 0)) return { effort: 0, payoff: u(0) };
      return { effort: step, payoff: v, supremumOnly: true };
    }
    if (r === 1) {
      const y = Math.max(0, Math.sqrt((w * v * o.z) / m) - o.z);
      const e = Math.min(y / w, B);
      best = { effort: e, payoff: u(e) };
    } else if (r < 1) {
      best = concaveRatioResponse(contest, i, o.z, hi, u);
    } else {
      const g = gridMaximize(u, hi, opts.gridPoints ?? 2001);
      best = { effort: g.x, payoff: g.fx };
    }
  } else if (csf.kind === "logit") {
    const k = csf.scale;
    best = { effort: 0, payoff: u(0) };
    if (hi > 0) best = better(best, hi, u(hi));
    const disc = 1 - (4 * m) / (v * k);
    if (disc > 0 && o.lnZ !== -Infinity) {
      const p = 0.5 * (1 + Math.sqrt(disc));
      const e = (Math.log(p / (1 - p)) + o.lnZ - Math.log(w)) / k;
      if (e > 0 && e < hi) best = better(best, e, u(e));
    }
  } else {
    best = { effort: 0, payoff: u(0) };
    if (o.ties > 0 && o.top <= B) best = better(best, o.top, u(o.top));
    if (o.ties === 0) {
      // nobody else: spending nothing already wins (ties split among one)
    } else if (o.top + step <= B && v - m * o.top > best.payoff) {
      best = { effort: o.top + step, payoff: v - m * o.top, supremumOnly: true };
    }
  }
  if (current !== undefined && current >= 0 && current <= B) {
    const fc = u(current);
    if (fc > best.payoff) best = { effort: current, payoff: fc };
  }
  return best;
}

/**
 * Ratio form, r < 1, Z > 0: the payoff is concave, so the first-order condition has one root.
 * In t = logit of the post-deviation share s = y / (y + Z) it reads
 *   psi(t) = -softplus(-t) - softplus(t) - t / r - K = 0,  K = ln(m / (v r)) + (ln Z - ln w) / r,
 * (from v r s (1 - s) = m e with e = (s Z / ((1 - s) w))^(1/r)); psi is decreasing and
 * concave, so Newton converges monotonically after at most one step. e = exp((t + ln Z - ln w) / r).
 */
function concaveRatioResponse(
  contest: Contest,
  i: number,
  z: number,
  hi: number,
  u: (e: number) => number,
): BestResponse {
  const { value: v, cost: m, weight: w, r, budget: B } = contest.rivals[i]!;
  if (!(hi > 0)) return { effort: 0, payoff: u(0) };
  const lnZw = Math.log(z) - Math.log(w);
  const K = Math.log(m / (v * r)) + lnZw / r;
  let t = 0;
  for (let it = 0; it < 100; it++) {
    const E = Math.exp(-Math.abs(t));
    const l1p = Math.log1p(E);
    const sig = t >= 0 ? 1 / (1 + E) : E / (1 + E);
    const f = -((t < 0 ? -t : 0) + l1p) - ((t > 0 ? t : 0) + l1p) - t / r - K;
    const d = 1 - 2 * sig - 1 / r;
    const step = f / d;
    t -= step;
    if (Math.abs(step) <= 1e-14 * Math.max(1, Math.abs(t))) break;
  }
  const e = Math.min(B, Math.exp((t + lnZw) / r));
  return { effort: e, payoff: u(e) };
}

/** Best response of rival i to the others' efforts in `efforts` (its own entry is ignored). */
export function bestResponse(
  contest: Contest,
  i: number,
  efforts: readonly number[],
  opts: BestResponseOptions = {},
): BestResponse {
  const o = oppositions(contest, efforts)[i]!;
  return bestResponseAgainst(contest, i, o, opts);
}

/** Best responses, regrets (>= 0: the current effort is always a candidate) and the Nash gap. */
export function respond(
  contest: Contest,
  efforts: readonly number[],
  opts: BestResponseOptions = {},
): Responses {
  const os = oppositions(contest, efforts);
  const n = contest.rivals.length;
  const bestResponses = new Array<number>(n);
  const regrets = new Array<number>(n);
  const pays = new Array<number>(n);
  let gap = 0;
  for (let i = 0; i < n; i++) {
    const o = os[i]!;
    const cur = efforts[i] ?? 0;
    const now = payoffAgainst(contest, i, cur, o);
    const br = bestResponseAgainst(contest, i, o, opts, cur);
    bestResponses[i] = br.effort;
    pays[i] = now;
    const reg = Math.max(0, br.payoff - now);
    regrets[i] = reg;
    if (reg > gap) gap = reg;
  }
  return { bestResponses, regrets, payoffs: pays, nashGap: gap };
}

/** Largest regret of the profile (0 at an exact pure equilibrium). */
export function nashGap(
  contest: Contest,
  efforts: readonly number[],
  opts: BestResponseOptions = {},
): number {
  return respond(contest, efforts, opts).nashGap;
}
