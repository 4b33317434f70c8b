/**
 * Two rivals, each playing a finite mixed strategy (efforts with probabilities), in the ratio
 * (Tullock 1980) or logit (Hirshleifer 1989) form: expected shares and payoffs, the payoff of
 * a pure deviation, and the certified Nash gap: each rival's best pure deviation over the
 * continuum [0, min(budget, value / cost)] against the other's mixed strategy (dense grid,
 * fine near zero, with Brent refinement of the best local maxima: gridMaximize) minus its
 * expected payoff, never assumed. Efforts above value / cost lose money for sure, so the
 * interval holds every candidate. Common practice, no source.
 */
import { logWeight } from "./csf";
import { brentMaximize } from "./brentMaximize";
import { gridMaximize } from "./gridMaximize";
import type { Contest, MixedStrategy } from "./types";

export interface DiscreteMix {
  efforts: number[];
  probabilities: number[];
}

/** Rival i's chance of winning at effort x against rival j at effort y (ratio or logit). */
export function pairShare(li: number, lj: number): number {
  if (li === -Infinity && lj === -Infinity) return 0.5; // nobody spends: equal split
  return 1 / (1 + Math.exp(lj - li));
}

/** Largest sensible effort of rival i: min(budget, value / cost). */
export function effortCeiling(contest: Contest, i: number): number {
  const rv = contest.rivals[i]!;
  return Math.min(rv.maxEffort, rv.value / rv.cost);
}

/** The other's mix as rival i faces it: log weights and probabilities of its played points. */
interface Facing {
  lw: Float64Array;
  q: Float64Array;
}

function facing(contest: Contest, j: number, mix: DiscreteMix): Facing {
  const idx = mix.probabilities.map((q, k) => (q > 0 ? k : -1)).filter((k) => k >= 0);
  return {
    lw: Float64Array.from(idx, (k) => logWeight(contest, j, mix.efforts[k]!)),
    q: Float64Array.from(idx, (k) => mix.probabilities[k]!),
  };
}

function payoffFacing(contest: Contest, i: number, x: number, f: Facing): number {
  const rv = contest.rivals[i]!;
  const li = logWeight(contest, i, x);
  let win = 0;
  for (let k = 0; k < f.q.length; k++) win += f.q[k]! * pairShare(li, f.lw[k]!);
  return rv.value * win - rv.cost * x;
}

/** Expected payoff (money) of rival i at pure effort x against the other's mix. */
export function deviationPayoff(
  contest: Contest,
  i: number,
  x: number,
  other: DiscreteMix,
): number {
  return payoffFacing(contest, i, x, facing(contest, 1 - i, other));
}

export interface MixedOutcome {
  expectedEfforts: [number, number];
  shares: [number, number];
  payoffs: [number, number];
}

/** Expected efforts, winning probabilities and payoffs of two independent mixes. */
export function mixedOutcome(
  contest: Contest,
  mixes: readonly [DiscreteMix, DiscreteMix],
): MixedOutcome {
  const [a, b] = mixes;
  const lb = b.efforts.map((y) => logWeight(contest, 1, y));
  let p0 = 0;
  for (let s = 0; s < a.efforts.length; s++) {
    const pa = a.probabilities[s]!;
    if (!(pa > 0)) continue;
    const la = logWeight(contest, 0, a.efforts[s]!);
    let w = 0;
    for (let t = 0; t < b.efforts.length; t++) {
      const qb = b.probabilities[t]!;
      if (qb > 0) w += qb * pairShare(la, lb[t]!);
    }
    p0 += pa * w;
  }
  const mean = (m: DiscreteMix) => m.efforts.reduce((s, e, k) => s + e * m.probabilities[k]!, 0);
  const e0 = mean(a);
  const e1 = mean(b);
  const [r0, r1] = [contest.rivals[0]!, contest.rivals[1]!];
  return {
    expectedEfforts: [e0, e1],
    shares: [p0, 1 - p0],
    payoffs: [r0.value * p0 - r0.cost * e0, r1.value * (1 - p0) - r1.cost * e1],
  };
}

/** Best pure deviation of rival i against the other's mix (grid plus Brent refinement). */
export function bestDeviation(
  contest: Contest,
  i: number,
  other: DiscreteMix,
  gridPoints: number,
  extra: readonly number[] = [],
): { x: number; payoff: number } {
  const hi = effortCeiling(contest, i);
  const f = facing(contest, 1 - i, other);
  const g = gridMaximize((x) => payoffFacing(contest, i, x, f), hi, gridPoints, extra);
  return { x: g.x, payoff: g.fx };
}

/**
 * The best few local maxima of rival i's deviation payoff (money) against the other's mix:
 * evaluated on the union of a uniform grid, a log grid near zero and the given points, each
 * local maximum polished by Brent's method on its two neighbouring cells; best first.
 */
export function deviationPeaks(
  contest: Contest,
  i: number,
  other: DiscreteMix,
  gridPoints: number,
  extra: readonly number[],
  count: number,
): { x: number; payoff: number }[] {
  const hi = effortCeiling(contest, i);
  const facingOther = facing(contest, 1 - i, other);
  const f = (x: number) => payoffFacing(contest, i, x, facingOther);
  if (!(hi > 0)) return [{ x: 0, payoff: f(0) }];
  const xs = new Set<number>([0, hi]);
  for (let k = 1; k < gridPoints; k++) xs.add((hi * k) / gridPoints);
  for (let k = 1; k <= 48; k++) xs.add(hi * Math.pow(10, -k / 4));
  for (const x of extra) if (x >= 0 && x <= hi) xs.add(x);
  const grid = [...xs].sort((a, b) => a - b);
  const fs = grid.map(f);
  const peaks: number[] = [];
  for (let k = 0; k < grid.length; k++) {
    const left = k > 0 ? fs[k - 1]! : -Infinity;
    const right = k + 1 < grid.length ? fs[k + 1]! : -Infinity;
    if (fs[k]! >= left && fs[k]! > right) peaks.push(k);
    else if (fs[k]! > left && fs[k]! >= right) peaks.push(k);
  }
  peaks.sort((p, q) => fs[q]! - fs[p]!);
  return peaks.slice(0, count).map((k) => {
    const a = grid[Math.max(0, k - 1)]!;
    const b = grid[Math.min(grid.length - 1, k + 1)]!;
    const r = b > a ? brentMaximize(f, a, b) : { x: grid[k]!, fx: fs[k]! };
    return r.fx > fs[k]! ? { x: r.x, payoff: r.fx } : { x: grid[k]!, payoff: fs[k]! };
  });
}

/**
 * Efforts just above each of the other's played points: with a steep success function the
 * best deviation may sit closer to an atom than any grid cell (ratio form: relative steps;
 * logit: steps of the order 1 / k, the form's own effort scale).
 */
export function justAbove(contest: Contest, other: DiscreteMix, minProbability = 0): number[] {
  const out: number[] = [];
  const k = contest.csf.kind === "logit" ? contest.csf.scale : 0;
  other.efforts.forEach((y, idx) => {
    if (!(other.probabilities[idx]! > minProbability)) return;
    for (let j = 1; j <= 8; j++) out.push(y * (1 + Math.pow(10, -j)));
    if (k > 0) for (let j = -3; j <= 1; j++) out.push(y + Math.pow(10, j) / k);
  });
  return out;
}

/** Certified Nash gap (money) of two mixes: the larger of the two best deviations' gains. */
export function discreteMixedGap(
  contest: Contest,
  mixes: readonly [DiscreteMix, DiscreteMix],
  gridPoints = 4001,
): number {
  const out = mixedOutcome(contest, mixes);
  let gap = 0;
  for (const i of [0, 1] as const) {
    const own = mixes[i];
    const extra = [...own.efforts, ...justAbove(contest, mixes[1 - i]!)];
    const dev = bestDeviation(contest, i, mixes[1 - i]!, gridPoints, extra);
    gap = Math.max(gap, dev.payoff - out.payoffs[i]);
  }
  return gap;
}

/** The MixedStrategy record of a finite mix: atom at zero, support range, mean and points. */
export function mixedStrategyOf(mix: DiscreteMix, minProbability = 0): MixedStrategy {
  const pts = mix.efforts
    .map((effort, k) => ({ effort, probability: mix.probabilities[k]! }))
    .filter((p) => p.probability > minProbability)
    .sort((p, q) => p.effort - q.effort);
  const total = pts.reduce((s, p) => s + p.probability, 0);
  for (const p of pts) p.probability /= total;
  const atom = pts.filter((p) => p.effort === 0).reduce((s, p) => s + p.probability, 0);
  const positive = pts.filter((p) => p.effort > 0);
  const mean = pts.reduce((s, p) => s + p.effort * p.probability, 0);
  return {
    atomAtZero: atom,
    low: positive[0]?.effort ?? 0,
    high: positive.at(-1)?.effort ?? 0,
    mean,
    points: pts,
  };
}
