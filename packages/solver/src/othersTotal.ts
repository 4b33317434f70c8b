/**
 * Each rival's chance of winning at a pure effort against the others' independent finite mixes,
 * in time linear in the number of rivals (the product of the others' supports is never formed).
 *
 * In the ratio and logit forms rival i wins with probability y / (y + Z), where y is its weight
 * at effort x (ratio: w x^r; logit: w e^(k x)) and Z is the sum of the others' weights. For
 * y > 0, y / (y + Z) = integral over t > 0 of y e^(-t (y + Z)) dt, so, the others being
 * independent,
 *   E[y / (y + Z)] = integral_0^inf y e^(-t y) prod_{j != i} phi_j(t) dt,
 * with phi_j(t) = E[e^(-t w_j)] = sum_k q_jk e^(-t w_jk) (the Laplace transform of rival j's
 * weight; common practice, no source). With t = e^s the integrand is analytic in the strip
 * |Im s| < pi/2 and decays doubly exponentially on one side, so the trapezoidal rule on the
 * fixed lattice s_m = m h converges exponentially: the error is at most 2 M_a / (e^(2 pi a / h)
 * - 1) for any strip half-width a < pi/2, where M_a = 1 / cos a bounds the integral of |f| along
 * the strip's lines, since |prod phi_j| <= 1 there (Trefethen & Weideman 2014, "The
 * exponentially convergent trapezoidal rule", SIAM Review 56(3), 385-458, Theorem 5.1; from
 * memory). Truncation to y t in [e^-LOW, e^HIGH] adds two geometric tails. The total, `error`,
 * bounds the error of every winning chance at once; certificates add 2 v_i error to the gap.
 *
 * The lattice does not depend on y, so ln prod_{j != i} phi_j(t_m) is computed once per node
 * for every rival (prefix and suffix sums over classes: no cancellation) and shared by all
 * efforts. Rivals with the same parameters playing the same mix object form one class, so
 * 10,000 identical rivals cost what one does.
 */
import { logWeight } from "./csf";
import type { DiscreteMix } from "./discreteMixed";
import type { Contest } from "./types";

/** ln(y t) below which nodes are left out (their total is bounded in `error`). */
export const LOW = 36;
/** ln(y t) above which nodes are left out. */
export const HIGH = 5;

/** Default lattice step in s = ln t: error about 1e-12 of a winning chance. */
export const FINE_STEP = 0.25;

/** Uniform bound on the quadrature and truncation error of a winning chance for step h. */
export function quadratureError(h: number): number {
  let best = Infinity;
  for (let a = 0.05; a < Math.PI / 2; a += 0.05) {
    best = Math.min(best, 2 / (Math.cos(a) * Math.expm1((2 * Math.PI * a) / h)));
  }
  const lowTail = (h * Math.exp(-LOW)) / -Math.expm1(-h);
  const high = Math.exp(HIGH);
  const highTail = (h * Math.exp(-high / 2)) / -Math.expm1((-high * h) / 2);
  return best + lowTail + highTail + 1e-14;
}

interface Atoms {
  lw: Float64Array;
  lq: Float64Array;
  /** probability of weight zero (ratio form, zero effort) */
  zero: number;
}

function atomsOf(contest: Contest, j: number, mix: DiscreteMix): Atoms {
  const lw: number[] = [];
  const lq: number[] = [];
  let zero = 0;
  mix.efforts.forEach((e, k) => {
    const p = mix.probabilities[k]!;
    if (!(p > 0)) return;
    const l = logWeight(contest, j, e);
    if (l === -Infinity) zero += p;
    else {
      lw.push(l);
      lq.push(Math.log(p));
    }
  });
  return { lw: Float64Array.from(lw), lq: Float64Array.from(lq), zero };
}

/** ln phi_j(e^s): log-sum-exp of ln q - e^(s + ln w) over the atoms (scratch: one slot each). */
function lnPhi(a: Atoms, s: number, scratch: Float64Array): number {
  let top = a.zero > 0 ? Math.log(a.zero) : -Infinity;
  for (let k = 0; k < a.lw.length; k++) {
    const term = a.lq[k]! - Math.exp(s + a.lw[k]!);
    scratch[k] = term;
    if (term > top) top = term;
  }
  if (top === -Infinity) return -Infinity;
  let sum = a.zero > 0 ? Math.exp(Math.log(a.zero) - top) : 0;
  for (let k = 0; k < a.lw.length; k++) sum += Math.exp(scratch[k]! - top);
  return top + Math.log(sum);
}

export interface OthersTotal {
  /** rival i's chance of winning at effort x against the others' mixes (within `error`) */
  win(i: number, x: number): number;
  /** rival i's expected payoff (money) at effort x: v_i win - cost_i x */
  payoff(i: number, x: number): number;
  /** uniform bound on the error of every winning chance */
  error: number;
}

/** Rivals grouped by identical parameters and, when given, the same mix object: class of each. */
export function rivalClasses(
  contest: Contest,
  mixes?: readonly DiscreteMix[],
): { classOf: number[]; members: number[][] } {
  const ids = new Map<string, number>();
  const mixIds = new Map<DiscreteMix, number>();
  const members: number[][] = [];
  const classOf = contest.rivals.map((rv, j) => {
    const m = mixes?.[j];
    let mixId = m ? mixIds.get(m) : -1;
    if (mixId === undefined) mixIds.set(m!, (mixId = mixIds.size));
    const key = `${rv.weight}|${rv.r}|${rv.value}|${rv.cost}|${rv.maxEffort}|${mixId}`;
    let c = ids.get(key);
    if (c === undefined) {
      ids.set(key, (c = members.length));
      members.push([]);
    }
    members[c]!.push(j);
    return c;
  });
  return { classOf, members };
}

/**
 * The others' totals as every rival faces them, for independent mixes (one per rival). Callers
 * that already know the classes pass them (members of a class must play the same mix).
 */
export function othersTotal(
  contest: Contest,
  mixes: readonly DiscreteMix[],
  step = FINE_STEP,
  classes: { classOf: number[]; members: number[][] } = rivalClasses(contest, mixes),
): OthersTotal {
  const n = contest.rivals.length;
  const { classOf, members } = classes;
  const size = members.map((m) => m.length);
  const atoms = members.map((m) => atomsOf(contest, m[0]!, mixes[m[0]!]!));
  // probability that everybody but one member of class c spends nothing (ratio form)
  const zeroOthers = atoms.map((_, c) =>
    atoms.reduce((p, a, d) => p * Math.pow(a.zero, size[d]! - (d === c ? 1 : 0)), 1),
  );
  const scratch = new Float64Array(Math.max(1, ...atoms.map((a) => a.lw.length)));
  const nodes = new Map<number, Float64Array>();
  /** ln prod over the others of phi at node m, for a member of each class */
  const node = (m: number): Float64Array => {
    let g = nodes.get(m);
    if (g) return g;
    const s = m * step;
    const l = atoms.map((a) => lnPhi(a, s, scratch));
    const k = l.length;
    g = new Float64Array(k);
    let pre = 0;
    for (let c = 0; c < k; c++) {
      g[c] = pre + (size[c]! > 1 ? (size[c]! - 1) * l[c]! : 0);
      pre += size[c]! * l[c]!;
    }
    let suf = 0;
    for (let c = k - 1; c >= 0; c--) {
      g[c]! += suf;
      suf += size[c]! * l[c]!;
    }
    nodes.set(m, g);
    return g;
  };
  const win = (i: number, x: number): number => {
    const c = classOf[i]!;
    const ly = logWeight(contest, i, x);
    if (ly === -Infinity) return zeroOthers[c]! / n; // nobody spends: equal split
    const lo = Math.ceil((-LOW - ly) / step);
    const hi = Math.floor((HIGH - ly) / step);
    let sum = 0;
    for (let m = lo; m <= hi; m++) {
      const lyt = m * step + ly;
      sum += Math.exp(lyt - Math.exp(lyt) + node(m)[c]!);
    }
    return Math.min(1, Math.max(0, sum * step));
  };
  return {
    win,
    payoff: (i, x) => {
      const rv = contest.rivals[i]!;
      return rv.value * win(i, x) - rv.cost * x;
    },
    error: quadratureError(step),
  };
}
