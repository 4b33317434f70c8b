/**
 * Simultaneous fictitious play on an effort grid per class of identical rivals (Brown 1951,
 * "Iterative solution of games by fictitious play", in Activity Analysis of Production and
 * Allocation, Koopmans (ed.), Wiley; from memory). Each round every class best-responds, on its
 * grid, to the others' empirical mixes (the averages of their past grid best responses; the
 * first round answers the uniform mix); the averages are the candidate mixes, and the one with
 * the least gap on the grids is kept. Nothing is assumed about convergence: the caller
 * certifies the kept mixes over the continuum (mixedCertificate.ts).
 *
 * Winning chances use the Laplace-transform quadrature of othersTotal.ts on its fixed lattice
 * s_m = m h, kept incrementally: a class's unnormalised transform sum_k count_k e^(-t_m w_k)
 * changes by one term per round, and the kernel y t_m e^(-y t_m) h of every grid point is
 * computed once, so a round costs O(classes x (lattice + grid x lattice)) multiplications and
 * one exponential per class and node.
 */
import { logWeight } from "./csf";
import { effortCeiling, type DiscreteMix } from "./discreteMixed";
import { HIGH, LOW, rivalClasses } from "./othersTotal";
import { startGrid } from "./twoRivalMixed";
import type { Contest } from "./types";

/** Lattice step while playing (winning chances within about 2e-7); certificates use a finer one. */
const PLAY_STEP = 0.5;

export interface FictitiousPlayOptions {
  /** rounds (default 1000) */
  rounds?: number;
  /** optional wall-clock budget in ms (default none: results depend only on the contest) */
  timeBudgetMs?: number;
  /** clock in ms, injectable for tests */
  now?: () => number;
}

export interface FictitiousPlayResult {
  /** one mix per rival (members of a class share one object) */
  mixes: DiscreteMix[];
  /** gap on the grids of the kept mixes (money); the certificate is computed separately */
  gridGap: number;
  rounds: number;
  /** true when the time budget ended the play before the round limit */
  outOfTime: boolean;
}

function logAdd(a: number, b: number): number {
  if (a === -Infinity) return b;
  if (b === -Infinity) return a;
  const m = Math.max(a, b);
  return m + Math.log1p(Math.exp(-Math.abs(a - b)));
}

export function fictitiousPlay(
  contest: Contest,
  opts: FictitiousPlayOptions = {},
): FictitiousPlayResult {
  const n = contest.rivals.length;
  const maxRounds = opts.rounds ?? 1000;
  const now = opts.now ?? (() => performance.now());
  const budget = opts.timeBudgetMs ?? Infinity;
  const t0 = now();
  const h = PLAY_STEP;
  const { classOf, members } = rivalClasses(contest);
  const C = members.length;
  const size = members.map((m) => m.length);
  const rep = members.map((m) => m[0]!);
  const grids = rep.map((i) => startGrid(effortCeiling(contest, i)));
  const lws = grids.map((g, c) => g.map((x) => logWeight(contest, rep[c]!, x)));
  // the lattice every grid point needs: y t in [e^-LOW, e^HIGH]
  let mLo = Infinity;
  let mHi = -Infinity;
  for (const lw of lws) {
    for (const l of lw) {
      if (l === -Infinity) continue;
      mLo = Math.min(mLo, Math.ceil((-LOW - l) / h));
      mHi = Math.max(mHi, Math.floor((HIGH - l) / h));
    }
  }
  const M = Number.isFinite(mLo) ? mHi - mLo + 1 : 0;
  const s = Float64Array.from({ length: M }, (_, j) => (mLo + j) * h);
  // per grid point: its lattice window and kernel y t e^(-y t) h there
  const kernels = lws.map((lw) =>
    lw.map((l) => {
      if (l === -Infinity) return { from: 0, values: new Float64Array(0) };
      const from = Math.ceil((-LOW - l) / h) - mLo;
      const to = Math.floor((HIGH - l) / h) - mLo;
      const values = new Float64Array(to - from + 1);
      for (let j = from; j <= to; j++) {
        const lyt = s[j]! + l;
        values[j - from] = h * Math.exp(lyt - Math.exp(lyt));
      }
      return { from, values };
    }),
  );
  // ln of sum_k weight_k e^(-t w_k): uniform weights for the first round, counts after
  const termOf = (c: number, k: number, j: number) => -Math.exp(s[j]! + lws[c]![k]!);
  const lnUniform = grids.map((g, c) => {
    const out = new Float64Array(M).fill(-Infinity);
    for (let j = 0; j < M; j++)
      for (let k = 0; k < g.length; k++) out[j] = logAdd(out[j]!, termOf(c, k, j));
    for (let j = 0; j < M; j++) out[j]! -= Math.log(g.length);
    return out;
  });
  const lnSum = grids.map(() => new Float64Array(M).fill(-Infinity));
  const counts = grids.map((g) => new Float64Array(g.length));
  const lnPhi = grids.map(() => new Float64Array(M));
  const g = new Float64Array(M);
  const pre = grids.map(() => new Float64Array(M));
  const suf = grids.map(() => new Float64Array(M));
  let best: Omit<FictitiousPlayResult, "outOfTime"> | null = null;
  let t = 0;
  let outOfTime = false;
  for (; t < maxRounds; t++) {
    const probs = counts.map((cnt) =>
      t === 0 ? new Array<number>(cnt.length).fill(1 / cnt.length) : Array.from(cnt, (x) => x / t),
    );
    for (let c = 0; c < C; c++) {
      const lp = lnPhi[c]!;
      if (t === 0) lp.set(lnUniform[c]!);
      else for (let j = 0; j < M; j++) lp[j] = lnSum[c]![j]! - Math.log(t);
    }
    // pre[c] = sum over classes before c of size x ln phi; suf[c] the same after c
    for (let j = 0; j < M; j++) {
      let acc = 0;
      for (let c = 0; c < C; c++) {
        pre[c]![j] = acc;
        acc += size[c]! * lnPhi[c]![j]!;
      }
      acc = 0;
      for (let c = C - 1; c >= 0; c--) {
        suf[c]![j] = acc;
        acc += size[c]! * lnPhi[c]![j]!;
      }
    }
    const zero = probs.map((p, c) => (lws[c]![0] === -Infinity ? p[0]! : 0));
    let gridGap = 0;
    const brs: number[] = [];
    for (let c = 0; c < C; c++) {
      // ln prod over the others of phi (prefix and suffix sums: no cancellation), exponentiated
      for (let j = 0; j < M; j++) {
        const own = size[c]! > 1 ? (size[c]! - 1) * lnPhi[c]![j]! : 0;
        g[j] = Math.exp(pre[c]![j]! + suf[c]![j]! + own);
      }
      let zeroOthers = 1;
      for (let d = 0; d < C; d++) zeroOthers *= Math.pow(zero[d]!, size[d]! - (d === c ? 1 : 0));
      const rv = contest.rivals[rep[c]!]!;
      let arg = 0;
      let bestU = -Infinity;
      let own = 0;
      grids[c]!.forEach((x, k) => {
        const kern = kernels[c]![k]!;
        let win: number;
        if (lws[c]![k] === -Infinity) win = zeroOthers / n;
        else {
          win = 0;
          for (let q = 0; q < kern.values.length; q++) win += kern.values[q]! * g[kern.from + q]!;
        }
        const u = rv.value * Math.min(1, win) - rv.cost * x;
        if (u > bestU) {
          bestU = u;
          arg = k;
        }
        own += probs[c]![k]! * u;
      });
      gridGap = Math.max(gridGap, bestU - own);
      brs.push(arg);
    }
    if (!best || gridGap < best.gridGap) {
      const byClass = grids.map((gr, c) => ({ efforts: gr, probabilities: probs[c]! }));
      best = { mixes: classOf.map((c) => byClass[c]!), gridGap, rounds: t + 1 };
    }
    brs.forEach((k, c) => {
      counts[c]![k]! += 1;
      const ls = lnSum[c]!;
      for (let j = 0; j < M; j++) ls[j] = logAdd(ls[j]!, termOf(c, k, j));
    });
    if (now() - t0 > budget) {
      outOfTime = t + 1 < maxRounds;
      t++;
      break;
    }
  }
  return { ...best!, rounds: t, outOfTime };
}
