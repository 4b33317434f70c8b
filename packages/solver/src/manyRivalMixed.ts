/**
 * Approximate mixed equilibria of ratio-form (r > 1) and logit contests with three or more
 * rivals and no pure equilibrium.
 *
 * Method: simultaneous fictitious play on an effort grid per rival (Brown 1951, "Iterative
 * solution of games by fictitious play", in Activity Analysis of Production and Allocation,
 * Koopmans (ed.), Wiley; from memory). Each round every rival best-responds, on its grid, to
 * the others' empirical mixes (the averages of their past grid best responses, started from
 * the uniform mix); the averages are the candidate mixes. Fictitious play need not converge
 * in games with three or more players, so nothing is assumed: the mix with the smallest gap
 * on the grids is kept, and its Nash gap is certified over the continuum at the end. The
 * iteration stops at a stated number of rounds (default 200), never on a wall clock unless a
 * time budget is given, so the same contest gives the same answer on every machine.
 *
 * Expectations over the others' independent mixes: rival i's chance of winning at effort x
 * depends on them only through Z = sum_{j != i} w_j e_j^r_j (ratio) or sum_j e^(k e_j)
 * (logit), so Z's distribution is built once per rival. Exactly, over the product of the
 * others' supports, when that product has at most EXACT_ATOMS points; otherwise from a stated
 * number of seeded samples of Z, and the certified gap then adds 2 v_i eps with
 * eps = sqrt(ln(2 n / delta) / (2 N)): for every x the winning chance is a decreasing
 * function of Z with values in [0, 1], so its sample mean is within eps of the true mean for
 * all x at once whenever the sample CDF of Z is within eps of the true CDF, which holds with
 * probability at least 1 - delta / n per rival (Dvoretzky-Kiefer-Wolfowitz inequality with
 * Massart's constant: Massart 1990, Annals of Probability 18(3), 1269-1283; from memory). The
 * result then says so: the gap holds with probability 1 - delta.
 */
import { logWeight } from "./csf";
import { effortCeiling, justAbove, mixedStrategyOf, type DiscreteMix } from "./discreteMixed";
import { gridMaximize } from "./gridMaximize";
import { noPureEquilibrium } from "./pureEquilibrium";
import { mulberry32 } from "./rng";
import { startGrid } from "./twoRivalMixed";
import type { Contest, Equilibrium } from "./types";

/** Largest product of the others' supports whose expectation is computed exactly. */
export const EXACT_ATOMS = 20_000;

export interface ManyRivalMixedOptions {
  /** fictitious-play rounds (default 200) */
  rounds?: number;
  /** optional wall-clock budget in ms (default none: results depend only on the contest) */
  timeBudgetMs?: number;
  /** clock in ms, injectable for tests */
  now?: () => number;
  /** largest product of supports computed exactly (default EXACT_ATOMS) */
  exactAtoms?: number;
  /**
   * search even when the product of the grids exceeds exactAtoms, with sampled expectations
   * (default false: the sampling error, 2 v eps, is then several % of the prize and the search
   * takes seconds, so the answer is none-pure with that reason)
   */
  sampleLarge?: boolean;
  /** samples of Z when the product of supports exceeds exactAtoms (default 4000) */
  samples?: number;
  /** seed of those samples (default 1) */
  seed?: number;
  /** the sampled gap holds with probability 1 - delta (default 0.01) */
  delta?: number;
  /** points of the dense grid that certifies the gap (default 2001) */
  certifyGridPoints?: number;
}

/** Distribution of Z (see the file header), plus its error. */
interface Facing {
  /** Z / e^shift of the atoms with Z > 0 (shift = the largest ln Z), and their probabilities */
  z: Float64Array;
  q: Float64Array;
  shift: number;
  /** probability that every other rival spends nothing (Z = 0, ratio form) */
  q0: number;
  /** uniform bound on the error of any winning chance computed from it (0 when exact) */
  eps: number;
}

function logAdd(a: number, b: number): number {
  if (a === -Infinity) return b;
  if (b === -Infinity) return a;
  const m = Math.max(a, b);
  return m + Math.log(Math.exp(a - m) + Math.exp(b - m));
}

function played(contest: Contest, j: number, mix: DiscreteMix): { lw: number[]; q: number[] } {
  const lw: number[] = [];
  const q: number[] = [];
  mix.efforts.forEach((e, k) => {
    if (mix.probabilities[k]! > 0) {
      lw.push(logWeight(contest, j, e));
      q.push(mix.probabilities[k]!);
    }
  });
  return { lw, q };
}

/** Adds up the probabilities of equal values (identical rivals give many). */
function mergeEqual(lz: number[], q: number[]): { lz: Float64Array; q: Float64Array } {
  const order = lz.map((_, k) => k).sort((a, b) => lz[a]! - lz[b]!);
  const outZ: number[] = [];
  const outQ: number[] = [];
  for (const k of order) {
    if (outZ.length > 0 && outZ[outZ.length - 1] === lz[k]) outQ[outQ.length - 1]! += q[k]!;
    else {
      outZ.push(lz[k]!);
      outQ.push(q[k]!);
    }
  }
  return { lz: Float64Array.from(outZ), q: Float64Array.from(outQ) };
}

/** Z relative to its largest value (no overflow), the atom at Z = 0 kept apart. */
function scaled(d: { lz: Float64Array; q: Float64Array }): Omit<Facing, "eps"> {
  let shift = -Infinity;
  let q0 = 0;
  const z: number[] = [];
  const q: number[] = [];
  d.lz.forEach((l) => (shift = Math.max(shift, l)));
  d.lz.forEach((l, k) => {
    if (l === -Infinity) q0 += d.q[k]!;
    else {
      z.push(Math.exp(l - shift));
      q.push(d.q[k]!);
    }
  });
  return { z: Float64Array.from(z), q: Float64Array.from(q), shift, q0 };
}

/** The distribution of ln Z that rival i faces, exact or sampled (file header). */
export function facingOthers(
  contest: Contest,
  i: number,
  mixes: readonly DiscreteMix[],
  opts: { exactAtoms?: number; samples?: number; seed?: number; delta?: number } = {},
): Facing {
  const n = contest.rivals.length;
  const others = mixes.map((m, j) => (j === i ? null : played(contest, j, m)));
  const size = others.reduce((s, o) => s * (o ? o.q.length : 1), 1);
  if (size <= (opts.exactAtoms ?? EXACT_ATOMS)) {
    let lz = [-Infinity];
    let q = [1];
    for (const o of others) {
      if (!o) continue;
      const nlz: number[] = [];
      const nq: number[] = [];
      for (let a = 0; a < lz.length; a++) {
        for (let b = 0; b < o.q.length; b++) {
          nlz.push(logAdd(lz[a]!, o.lw[b]!));
          nq.push(q[a]! * o.q[b]!);
        }
      }
      lz = nlz;
      q = nq;
    }
    return { ...scaled(mergeEqual(lz, q)), eps: 0 };
  }
  const N = opts.samples ?? 4000;
  const delta = opts.delta ?? 0.01;
  const rng = mulberry32((opts.seed ?? 1) * 7919 + i);
  const cum = others.map((o) => {
    if (!o) return null;
    let s = 0;
    return o.q.map((p) => (s += p));
  });
  const lz = new Float64Array(N);
  for (let s = 0; s < N; s++) {
    let acc = -Infinity;
    others.forEach((o, j) => {
      if (!o) return;
      const c = cum[j]!;
      const u = rng() * c[c.length - 1]!;
      let k = 0;
      while (k < c.length - 1 && c[k]! <= u) k++;
      acc = logAdd(acc, o.lw[k]!);
    });
    lz[s] = acc;
  }
  const eps = Math.sqrt(Math.log((2 * n) / delta) / (2 * N));
  return { ...scaled({ lz, q: new Float64Array(N).fill(1 / N) }), eps };
}

/** Rival i's expected payoff (money) at pure effort x against the facing distribution. */
export function payoffFacingOthers(contest: Contest, i: number, x: number, f: Facing): number {
  const rv = contest.rivals[i]!;
  const ly = logWeight(contest, i, x);
  // nobody spends: equal split among all n; else any positive effort wins outright
  let win = f.q0 * (ly === -Infinity ? 1 / contest.rivals.length : 1);
  if (ly !== -Infinity && f.q.length > 0) {
    const y = Math.exp(ly - f.shift);
    if (y === Infinity)
      win += 1 - f.q0; // every Z is below 1e-308 of y: a sure win
    else for (let k = 0; k < f.q.length; k++) win += (f.q[k]! * y) / (y + f.z[k]!);
  }
  return rv.value * win - rv.cost * x;
}

export interface ManyRivalCertificate {
  /** certified gap (money), sampling error included */
  gap: number;
  expectedEfforts: number[];
  shares: number[];
  payoffs: number[];
  /** true when some expectation was sampled (the gap then holds with probability 1 - delta) */
  sampled: boolean;
}

/**
 * Certified Nash gap of independent mixes: for each rival, its best pure deviation over
 * [0, min(budget, value / cost)] (dense grid, fine near zero, Brent refinement: gridMaximize)
 * minus its expected payoff, plus twice the sampling error in money when Z was sampled.
 */
export function certifyMixes(
  contest: Contest,
  mixes: readonly DiscreteMix[],
  opts: ManyRivalMixedOptions = {},
): ManyRivalCertificate {
  const n = contest.rivals.length;
  let gap = 0;
  let sampled = false;
  const expectedEfforts: number[] = [];
  const shares: number[] = [];
  const payoffs: number[] = [];
  for (let i = 0; i < n; i++) {
    const rv = contest.rivals[i]!;
    const f = facingOthers(contest, i, mixes, opts);
    sampled ||= f.eps > 0;
    const own = mixes[i]!;
    let u = 0;
    let e = 0;
    own.efforts.forEach((x, k) => {
      const p = own.probabilities[k]!;
      if (p > 0) {
        u += p * payoffFacingOthers(contest, i, x, f);
        e += p * x;
      }
    });
    const extra = [...own.efforts];
    mixes.forEach((m, j) => {
      if (j !== i) extra.push(...justAbove(contest, m, 1e-3));
    });
    const dev = gridMaximize(
      (x) => payoffFacingOthers(contest, i, x, f),
      effortCeiling(contest, i),
      opts.certifyGridPoints ?? 2001,
      extra,
    );
    gap = Math.max(gap, dev.fx - u + 2 * rv.value * f.eps);
    expectedEfforts.push(e);
    payoffs.push(u);
    shares.push((u + rv.cost * e) / rv.value);
  }
  return { gap: Math.max(0, gap), expectedEfforts, shares, payoffs, sampled };
}

export interface FictitiousPlayResult {
  mixes: DiscreteMix[];
  /** gap on the grids of the kept mixes (money); the certificate is computed separately */
  gridGap: number;
  rounds: number;
}

/** Simultaneous fictitious play on the grids (file header); keeps the mix with the least grid gap. */
export function fictitiousPlay(
  contest: Contest,
  opts: ManyRivalMixedOptions = {},
): FictitiousPlayResult {
  const n = contest.rivals.length;
  const maxRounds = opts.rounds ?? 200;
  const now = opts.now ?? (() => performance.now());
  const budget = opts.timeBudgetMs ?? Infinity;
  const t0 = now();
  const grids = contest.rivals.map((_, i) => startGrid(effortCeiling(contest, i)));
  const counts = grids.map((g) => g.map(() => 1 / g.length));
  let total = 1;
  const mixOf = (): DiscreteMix[] =>
    grids.map((g, i) => ({ efforts: g, probabilities: counts[i]!.map((c) => c / total) }));
  let best: FictitiousPlayResult | null = null;
  let t = 0;
  for (; t < maxRounds; t++) {
    const mixes = mixOf();
    let gridGap = 0;
    const brs: number[] = [];
    for (let i = 0; i < n; i++) {
      const f = facingOthers(contest, i, mixes, opts);
      const us = grids[i]!.map((x) => payoffFacingOthers(contest, i, x, f));
      let arg = 0;
      let own = 0;
      us.forEach((u, k) => {
        if (u > us[arg]!) arg = k;
        own += mixes[i]!.probabilities[k]! * u;
      });
      gridGap = Math.max(gridGap, us[arg]! - own);
      brs.push(arg);
    }
    if (!best || gridGap < best.gridGap) best = { mixes, gridGap, rounds: t + 1 };
    brs.forEach((k, i) => (counts[i]![k]! += 1));
    total += 1;
    if (now() - t0 > budget) break;
  }
  return { ...best!, rounds: t };
}

/**
 * The approximate mixed equilibrium of a ratio or logit contest with three or more rivals as
 * an Equilibrium record (always `approximate`: a learning method gives an epsilon-equilibrium),
 * `none-pure` with the reason when the others' grids are too many for exact expectations
 * (unless sampleLarge), or null when the contest is not of that kind.
 */
export function manyRivalMixedEquilibrium(
  contest: Contest,
  opts: ManyRivalMixedOptions = {},
): Equilibrium | null {
  const n = contest.rivals.length;
  if (n < 3 || contest.csf.kind === "allpay") return null;
  const sizes = contest.rivals.map((_, i) => startGrid(effortCeiling(contest, i)).length);
  const product = Math.max(
    ...sizes.map((_, i) => sizes.reduce((p, g, j) => (j === i ? p : p * g), 1)),
  );
  const limit = opts.exactAtoms ?? EXACT_ATOMS;
  if (product > limit && !opts.sampleLarge) {
    return noPureEquilibrium(
      contest,
      "numeric:fictitious-play",
      `No mixed-strategy equilibrium is computed for ${n} rivals: the expectation over the others' strategies has ${product} points on the effort grid (the exact limit is ${limit}), and a sampled one is too coarse to certify a useful Nash gap.`,
    );
  }
  const fp = fictitiousPlay(contest, opts);
  const cert = certifyMixes(contest, fp.mixes, opts);
  const spent = contest.rivals.reduce((s, rv, i) => s + rv.cost * cert.expectedEfforts[i]!, 0);
  const how = cert.sampled
    ? `expectations over the others' mixes from ${opts.samples ?? 4000} seeded samples; the gap includes the sampling error and holds with probability ${1 - (opts.delta ?? 0.01)}`
    : "expectations over the others' mixes computed exactly";
  return {
    kind: "mixed",
    efforts: null,
    expectedEfforts: cert.expectedEfforts,
    shares: cert.shares,
    payoffs: cert.payoffs,
    totalEffort: cert.expectedEfforts.reduce((s, e) => s + e, 0),
    dissipation: spent / contest.prize,
    active: cert.expectedEfforts.map((e) => e > 0),
    nashGap: cert.gap,
    method: "numeric:fictitious-play",
    strategies: fp.mixes.map((m) => mixedStrategyOf(m, 1e-12)),
    approximate: true,
    note: `Approximate mixed-strategy equilibrium from fictitious play on an effort grid (${fp.rounds} rounds; ${how}); its Nash gap is certified against every pure deviation.`,
  };
}
