/**
 * Best responses, regrets and the Nash gap. Every best response is a GLOBAL maximum over
 * [0, budget]; spending nothing is always a candidate.
 * - Ratio form (Tullock 1980): the closed form for r_i = 1, the larger root of a concave
 *   function for r_i != 1 (ratioBestResponse.ts).
 * - Logit form (Hirshleifer 1989): u_i'' has the sign of 1 - 2 p_i, so the payoff has at most
 *   one interior local maximum, where v k p (1 - p) = m with p > 1/2; candidates are 0, the cap
 *   and that point.
 * - All-pay auction against pure efforts: bid just above the highest other effort (or tie, or 0).
 * - opts.gridPoints, when given, adds a dense-grid search with Brent refinement on top of the
 *   shape-based candidates (a cross-check; the better of the two is returned).
 * When every other rival spends nothing in the ratio form, the supremum (the whole prize at
 * vanishing cost) is not attained: the result carries supremumOnly and the limit payoff.
 */
import { logWeight } from "./csf";
import { gridMaximize } from "./gridMaximize";
import { logitInteriorLogOdds } from "./logitInterior";
import { ratioCandidate, ratioPayoff, ratioTerm } from "./ratioBestResponse";
import type { BestResponse, Contest, Responses } from "./types";

export { ratioInteriorMaximum } from "./ratioBestResponse";

export interface BestResponseOptions {
  /** smallest effort step (supremum cases); default 1e-6 * v_i / m_i */
  step?: number;
  /** when set, also search a dense grid of this many points (cross-check of the candidates) */
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
    const l = logWeight(contest, i, efforts[i] ?? 0);
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
    return ratioPayoff(rv, n, e, ratioTerm(rv, e), o.z);
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

/** Best response of rival i to a given opposition (see the file header for the methods). */
export function bestResponseAgainst(
  contest: Contest,
  i: number,
  o: Opposition,
  opts: BestResponseOptions = {},
  current?: number,
): BestResponse {
  const rv = contest.rivals[i]!;
  const { value: v, cost: m, weight: w, maxEffort: B } = rv;
  const hi = Math.min(B, v / m);
  const step = Math.min(opts.step ?? (1e-6 * v) / m, B);
  let bestE = 0;
  let bestU = payoffAgainst(contest, i, 0, o);
  let supremum = false;
  const consider = (e: number) => {
    if (!(e >= 0 && e <= B)) return;
    const f = payoffAgainst(contest, i, e, o);
    if (f > bestU) {
      bestU = f;
      bestE = e;
    }
  };
  const csf = contest.csf;
  if (csf.kind === "ratio") {
    if (o.z === 0) {
      if (!(B > 0)) return { effort: 0, payoff: bestU };
      return { effort: step, payoff: v, supremumOnly: true };
    }
    consider(ratioCandidate(rv, contest.rivals.length, o.z));
  } else if (csf.kind === "logit") {
    const k = csf.scale;
    if (hi > 0) consider(hi);
    const logOdds = logitInteriorLogOdds(v, m, k);
    if (logOdds !== null && o.lnZ !== -Infinity) {
      const e = (logOdds + o.lnZ - Math.log(w)) / k;
      if (e > 0 && e < hi) consider(e);
    }
  } else {
    if (o.ties > 0 && o.top <= B) consider(o.top);
    if (o.ties > 0 && o.top + step <= B && v - m * o.top > bestU) {
      bestU = v - m * o.top;
      bestE = o.top + step;
      supremum = true;
    }
  }
  if (opts.gridPoints !== undefined && csf.kind !== "allpay" && hi > 0) {
    const g = gridMaximize((e) => payoffAgainst(contest, i, e, o), hi, opts.gridPoints);
    if (g.fx > bestU) {
      bestU = g.fx;
      bestE = g.x;
      supremum = false;
    }
  }
  if (current !== undefined && current >= 0 && current <= B) {
    const fc = payoffAgainst(contest, i, current, o);
    if (fc > bestU) {
      bestU = fc;
      bestE = current;
      supremum = false;
    }
  }
  return supremum
    ? { effort: bestE, payoff: bestU, supremumOnly: true }
    : { effort: bestE, payoff: bestU };
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
  if (contest.csf.kind === "ratio" && opts.gridPoints === undefined) {
    return respondRatio(contest, efforts, opts);
  }
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

/**
 * The ratio-form case of respond without per-rival allocations (the same payoff and best
 * response as payoffAgainst and bestResponseAgainst): large contests check in O(n).
 */
function respondRatio(
  contest: Contest,
  efforts: readonly number[],
  opts: BestResponseOptions,
): Responses {
  const rivals = contest.rivals;
  const n = rivals.length;
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) y[i] = ratioTerm(rivals[i]!, efforts[i] ?? 0);
  const pre = new Float64Array(n + 1);
  const suf = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) pre[i + 1] = pre[i]! + y[i]!;
  for (let i = n - 1; i >= 0; i--) suf[i] = suf[i + 1]! + y[i]!;
  const bestResponses = new Array<number>(n);
  const regrets = new Array<number>(n);
  const pays = new Array<number>(n);
  let gap = 0;
  for (let i = 0; i < n; i++) {
    const rv = rivals[i]!;
    const z = pre[i]! + suf[i + 1]!;
    const cur = efforts[i] ?? 0;
    const now = ratioPayoff(rv, n, cur, y[i]!, z);
    const { value: v, cost: m, maxEffort: B } = rv;
    let bestE = 0;
    let bestU: number;
    if (z === 0) {
      if (B > 0) {
        bestE = Math.min(opts.step ?? (1e-6 * v) / m, B);
        bestU = v; // supremum, not attained
      } else bestU = ratioPayoff(rv, n, 0, 0, z);
    } else {
      bestU = ratioPayoff(rv, n, 0, 0, z);
      const e = ratioCandidate(rv, n, z);
      if (e > 0) {
        const u = ratioPayoff(rv, n, e, ratioTerm(rv, e), z);
        if (u > bestU) {
          bestU = u;
          bestE = e;
        }
      }
    }
    if (now > bestU && cur <= B) {
      bestU = now;
      bestE = cur;
    }
    bestResponses[i] = bestE;
    pays[i] = now;
    const reg = bestU - now > 0 ? bestU - now : 0;
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
