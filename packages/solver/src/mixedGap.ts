/**
 * Measured Nash gap of a mixed-strategy profile in the all-pay auction: for each rival, the
 * best pure deviation on a dense grid against the others' mixed strategies minus the expected
 * payoff of its own mixed strategy (integrated numerically by quantile midpoints), never
 * assumed. Rivals are independent; a positive bid x beats rival j with probability F_j(x)
 * (the only atoms sit at zero), and a zero bid wins only when all others bid zero, splitting
 * n ways. Common practice, no source.
 */
import type { Contest, MixedStrategy } from "./types";

/** P(effort <= x) under a mixed strategy. */
export function mixedCdf(s: MixedStrategy, x: number): number {
  if (x < 0) return 0;
  if (x < s.low) return s.atomAtZero;
  if (x >= s.high) return 1;
  const z = (x - s.low) / (s.high - s.low);
  return s.atomAtZero + (1 - s.atomAtZero) * Math.pow(z, s.cdfExponent ?? 1);
}

/** Effort at probability level u in (0, 1) of the continuous part (inverse CDF). */
function quantile(s: MixedStrategy, u: number): number {
  return s.low + (s.high - s.low) * Math.pow(u, 1 / (s.cdfExponent ?? 1));
}

/** Expected payoff of a pure bid x against the others' mixed strategies. */
export function allPayDeviationPayoff(
  contest: Contest,
  strategies: readonly MixedStrategy[],
  i: number,
  x: number,
): number {
  const rv = contest.rivals[i]!;
  const n = contest.rivals.length;
  let win = 1;
  if (x > 0) {
    for (let j = 0; j < n; j++) if (j !== i) win *= mixedCdf(strategies[j]!, x);
  } else {
    for (let j = 0; j < n; j++) if (j !== i) win *= strategies[j]!.atomAtZero;
    win /= n;
  }
  return rv.value * win - rv.cost * x;
}

/** Expected payoff of rival i's own mixed strategy against the others' (numerical). */
export function allPayMixedPayoff(
  contest: Contest,
  strategies: readonly MixedStrategy[],
  i: number,
  points = 2001,
): number {
  const s = strategies[i]!;
  let total = s.atomAtZero * allPayDeviationPayoff(contest, strategies, i, 0);
  const rest = 1 - s.atomAtZero;
  if (rest > 0 && s.high > s.low) {
    let acc = 0;
    for (let k = 0; k < points; k++) {
      acc += allPayDeviationPayoff(contest, strategies, i, quantile(s, (k + 0.5) / points));
    }
    total += (rest * acc) / points;
  }
  return total;
}

/** Largest gain from a pure deviation, over rivals (>= 0). */
export function allPayMixedGap(
  contest: Contest,
  strategies: readonly MixedStrategy[],
  points = 2001,
): number {
  const n = contest.rivals.length;
  let gap = 0;
  for (let i = 0; i < n; i++) {
    const own = allPayMixedPayoff(contest, strategies, i, points);
    let top = 0;
    for (let j = 0; j < n; j++) if (j !== i) top = Math.max(top, strategies[j]!.high);
    const hi = Math.min(contest.rivals[i]!.maxEffort, top * 1.05 + 1e-12);
    let best = allPayDeviationPayoff(contest, strategies, i, 0);
    for (let k = 1; k < points; k++) {
      best = Math.max(best, allPayDeviationPayoff(contest, strategies, i, (hi * k) / (points - 1)));
    }
    if (top <= hi) best = Math.max(best, allPayDeviationPayoff(contest, strategies, i, top));
    gap = Math.max(gap, best - own);
  }
  return gap;
}
