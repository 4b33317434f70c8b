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
 * A budget B_i (money) caps effort at B_i / m_i and so the share: s_i <= w_i (B_i / m_i)^r_i / Y. The equilibrium aggregate solves
 * sum_i s_i(Y) (+ F / Y for a fixed contribution F, e.g. a committed leader) = 1, whose left
 * side falls in Y; the root is bracketed in log Y and found by safeguarded Newton steps
 * (the slope comes from implicit differentiation of each share). For r_i <= 1
 * the equilibrium is unique (Szidarovszky & Okuguchi 1997, Games and Economic Behavior 18;
 * volume from memory). Each evaluation is O(n) with a few Newton steps per rival.
 */
import { logisticParts, sigmoid } from "./logistic";
import { newtonRoot, type Iterated } from "./newton";
import type { Contest } from "./types";

/** Newton on phi (one rival's share) stops when a step is below this fraction of |t|. */
const SHARE_REL_TOL = 1e-13;
/** Newton on phi converges in a few steps from a warm start; this many means something is wrong. */
const SHARE_MAX_ITER = 100;
/** r_i = 1 shares below this are rounding residue of a rival exactly at the drop-out point. */
const DROP_OUT_RESIDUE = 1e-12;
/** Steps the bracket search for the aggregate may take in ln Y. */
const BRACKET_MAX_TRIES = 400;
/** The safeguarded Newton on ln Y stops on a step below this fraction of |ln Y|... */
const AGGREGATE_STEP_TOL = 1e-15;
/** ...or on a bracket narrower than this fraction of |ln Y|. */
const AGGREGATE_BRACKET_TOL = 1e-13;
/** Iterations of the safeguarded Newton on ln Y (each at least halves the bracket). */
const AGGREGATE_MAX_ITER = 200;
/** A bracket this narrow (relative) with ... */
const JUMP_BRACKET = 1e-12;
/** ... a fall of the share sum larger than this across it is a jump, not a root (r_i > 1). */
const JUMP_SIZE = 1e-3;
/** The shares must sum to 1 within this for the aggregate to be an equilibrium. */
const BALANCE_TOL = 1e-9;

/**
 * phi(t) = lnC - q softplus(-t) + softplus(t) of one rival's share in t = logit(s), q = 1/r - 1,
 * and its slope phi'(t) = q sigma(-t) + sigma(t).
 */
function phi(lnC: number, q: number, t: number): readonly [number, number] {
  const { softplus, softplusNeg, sigma } = logisticParts(t);
  return [lnC - q * softplusNeg + softplus, q * (1 - sigma) + sigma];
}

/**
 * Newton solver for the share of a rival with r != 1 in t = logit(s), phi(t) = 0 with
 * phi''(t) = (1 - q) sigma(t) sigma(-t).
 * For q > 0 (r < 1) phi is increasing with slope between min(q, 1) and max(q, 1) and has a
 * constant sign of curvature, so Newton converges monotonically after at most one overshoot
 * (and is exact on the two linear tails): warm starts from the previous aggregate make it a
 * few steps. For q < 0 (r > 1) phi is convex with its minimum at t* = ln(-q); the larger root
 * is reached by Newton from the right of t*, and there is no root when phi(t*) > 0.
 * Returns null when there is no root; `ok: false` when Newton stops short of its tolerance.
 */
function solveShareLogit(lnC: number, q: number, t0: number): Iterated | null {
  let t = t0;
  let safeguard: ((next: number, x: number) => number) | undefined;
  if (q < 0) {
    const tStar = Math.log(-q);
    if (phi(lnC, q, tStar)[0] > 0) return null;
    if (!(t > tStar)) t = Math.max(tStar + 1, -lnC + 1);
    // stay on the increasing branch
    safeguard = (next, x) => (next <= tStar ? 0.5 * (x + tStar) : next);
  }
  return newtonRoot((x) => phi(lnC, q, x), t, {
    relTol: SHARE_REL_TOL,
    maxIter: SHARE_MAX_ITER,
    safeguard,
  });
}

export interface ShareFunctionOptions {
  /** which rivals take part (default: all); the others spend nothing */
  members?: readonly boolean[];
  /** a fixed effective contribution F to the aggregate (a committed leader's w e^r) */
  fixed?: number;
}

export interface ShareFunctionSolution {
  ok: true;
  efforts: number[];
  /** equilibrium aggregate Y = sum w_i e_i^r_i (including the fixed contribution) */
  aggregate: number;
  /** true where the budget binds */
  capped: boolean[];
}

/**
 * Why there is no share-function solution: the share equation has no root (a lone participant
 * facing nobody: the supremum is not attained; or, with r_i > 1, no consistent interior
 * candidate for this set of members), or an iteration stopped short of its tolerance.
 */
export interface ShareFunctionFailure {
  ok: false;
  reason: "no-root" | "not-converged";
  message: string;
}

const NO_ROOT: ShareFunctionFailure = {
  ok: false,
  reason: "no-root",
  message: "the share equation has no root for these rivals",
};

function notConverged(what: string): ShareFunctionFailure {
  return {
    ok: false,
    reason: "not-converged",
    message: `the share-function method did not converge (${what})`,
  };
}

/** Equilibrium of the ratio-form contest by the share-function method. */
export function shareFunctionEquilibrium(
  contest: Contest,
  opts: ShareFunctionOptions = {},
): ShareFunctionSolution | ShareFunctionFailure {
  const rivals = contest.rivals;
  const n = rivals.length;
  const fixed = opts.fixed ?? 0;
  const idx: number[] = [];
  for (let i = 0; i < n; i++) {
    const rv = rivals[i]!;
    if ((opts.members?.[i] ?? true) && rv.maxEffort > 0) idx.push(i);
  }
  const k = idx.length;
  if (k === 0) return NO_ROOT;
  // per-rival constants: r = 1 uses a = m/(w v); r != 1 uses lnC = A + lnY/r
  const A = new Float64Array(k);
  const invR = new Float64Array(k);
  const q = new Float64Array(k);
  const lnCap = new Float64Array(k); // ln(w B^r), +Infinity when uncapped
  const unit = new Uint8Array(k);
  const t = new Float64Array(k); // warm starts (logit of the share)
  let guess = fixed;
  for (let j = 0; j < k; j++) {
    const rv = rivals[idx[j]!]!;
    unit[j] = rv.r === 1 ? 1 : 0;
    A[j] =
      rv.r === 1
        ? rv.cost / (rv.weight * rv.value)
        : Math.log(rv.cost) - Math.log(rv.weight) / rv.r - Math.log(rv.value * rv.r);
    invR[j] = 1 / rv.r;
    q[j] = 1 / rv.r - 1;
    lnCap[j] =
      rv.maxEffort < Infinity ? Math.log(rv.weight) + rv.r * Math.log(rv.maxEffort) : Infinity;
    t[j] = Number.NaN;
    const e0 = Math.min(rv.maxEffort, (rv.r * rv.value) / (rv.cost * Math.max(2, k)));
    guess += rv.weight * Math.pow(e0, rv.r);
  }
  const shareArr = new Float64Array(k);
  const cappedArr = new Uint8Array(k);
  let slope = 0; // d(sum of shares)/d lnY at the last evaluation
  let stalled = false; // at the last evaluation, a rival's share stopped short of its tolerance
  /** sum_i s_i(Y) + F/Y - 1 at Y = exp(lnY); fills shareArr, cappedArr and slope */
  const excess = (lnY: number): number => {
    const Y = Math.exp(lnY);
    stalled = false;
    let sum = fixed > 0 ? fixed / Y : 0;
    let d = -(fixed > 0 ? fixed / Y : 0);
    for (let j = 0; j < k; j++) {
      let s: number;
      let ds: number;
      if (unit[j] === 1) {
        const aY = A[j]! * Y;
        s = aY < 1 - DROP_OUT_RESIDUE ? 1 - aY : 0;
        ds = aY < 1 - DROP_OUT_RESIDUE ? -aY : 0;
      } else {
        const lnC = A[j]! + lnY * invR[j]!;
        const start = Number.isNaN(t[j]!) ? -lnC : t[j]!;
        const root = solveShareLogit(lnC, q[j]!, start);
        if (root === null) {
          s = 0;
          ds = 0;
        } else {
          if (!root.ok) stalled = true;
          const tj = root.x;
          t[j] = tj;
          const sg = sigmoid(tj);
          s = sg;
          // implicit differentiation: dt/dlnY = -(1/r) / phi'(t), ds/dt = s (1 - s)
          ds = (-sg * (1 - sg) * invR[j]!) / (q[j]! * (1 - sg) + sg);
        }
      }
      cappedArr[j] = 0;
      if (lnCap[j]! < Infinity) {
        const cap = Math.exp(lnCap[j]! - lnY);
        if (s >= cap) {
          s = cap;
          ds = -cap;
          cappedArr[j] = 1;
        }
      }
      shareArr[j] = s;
      sum += s;
      d += ds;
    }
    slope = d;
    return sum - 1;
  };
  // bracket the root in lnY: the share sum falls as Y rises
  let lo = Math.log(guess > 0 && Number.isFinite(guess) ? guess : 1);
  let flo = excess(lo);
  let hi = lo;
  let fhi = flo;
  let tries = 0;
  if (flo > 0) {
    while (fhi > 0 && tries++ < BRACKET_MAX_TRIES) {
      lo = hi;
      flo = fhi;
      hi += Math.max(0.5, Math.min(4, fhi / Math.max(1e-300, -slope)));
      fhi = excess(hi);
    }
  } else {
    while (flo <= 0 && tries++ < BRACKET_MAX_TRIES) {
      hi = lo;
      fhi = flo;
      lo -= 2;
      flo = excess(lo);
    }
  }
  if (!(flo > 0) || !(fhi <= 0)) return NO_ROOT;
  // safeguarded Newton on the bracket [lo, hi] (Numerical Recipes' rtsafe rule: bisect when
  // the Newton step leaves the bracket or would not halve the previous step; with r_i > 1 the
  // share sum can jump, and there Newton alone would crawl)
  let x = fhi === 0 ? hi : 0.5 * (lo + hi);
  let fx = excess(x);
  let dxOld = hi - lo;
  let finished = fx === 0;
  for (let it = 0; it < AGGREGATE_MAX_ITER && fx !== 0; it++) {
    if (fx > 0) {
      lo = x;
      flo = fx;
    } else {
      hi = x;
      fhi = fx;
    }
    // a jump of the share sum across a vanishing bracket: no root (r_i > 1 only)
    if (hi - lo <= JUMP_BRACKET * Math.max(1, Math.abs(x)) && flo - fhi > JUMP_SIZE) return NO_ROOT;
    let next = slope < 0 ? x - fx / slope : Number.NaN;
    if (!(next > lo && next < hi) || Math.abs(2 * (next - x)) > Math.abs(dxOld)) {
      next = 0.5 * (lo + hi);
    }
    dxOld = next - x;
    const done =
      Math.abs(next - x) <= AGGREGATE_STEP_TOL * Math.max(1, Math.abs(x)) ||
      hi - lo <= AGGREGATE_BRACKET_TOL * Math.max(1, Math.abs(x));
    x = next;
    fx = excess(x);
    finished = done || fx === 0;
    if (done) break;
  }
  if (stalled) return notConverged("a rival's share");
  // the aggregate must actually balance (with r_i > 1 the share sum can jump past 1)
  if (!(Math.abs(fx) <= BALANCE_TOL)) return finished ? NO_ROOT : notConverged("the aggregate");
  const Y = Math.exp(x);
  const efforts = new Array<number>(n).fill(0);
  const capped = new Array<boolean>(n).fill(false);
  for (let j = 0; j < k; j++) {
    const i = idx[j]!;
    const rv = rivals[i]!;
    capped[i] = cappedArr[j] === 1;
    efforts[i] = capped[i] ? rv.maxEffort : Math.pow((shareArr[j]! * Y) / rv.weight, invR[j]!);
  }
  return { ok: true, efforts, aggregate: Y, capped };
}
