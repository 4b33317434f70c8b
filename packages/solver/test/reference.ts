// Independent reference computations for the solver tests: payoffs written out directly from
// the success-function definitions (Tullock 1980; Hirshleifer 1989) and best responses found
// by Nelder-Mead (fmin), a general-purpose optimiser that shares no code with the solver.
import type { Contest } from "../src/types";
import fmin from "./fminLoader";

/** u_i with rival i's effort replaced by x; ratio all-zero profile splits equally. */
export function refPayoff(c: Contest, i: number, x: number, efforts: readonly number[]): number {
  const e = efforts.map((v, j) => (j === i ? x : v));
  const rv = c.rivals[i]!;
  let p: number;
  if (c.csf.kind === "ratio") {
    const y = e.map((v, j) => c.rivals[j]!.weight * Math.pow(v, c.rivals[j]!.r));
    const tot = y.reduce((a, b) => a + b, 0);
    p = tot === 0 ? 1 / e.length : y[i]! / tot;
  } else if (c.csf.kind === "logit") {
    const k = c.csf.scale;
    // divide through by exp(k x) to stay finite
    let tot = 0;
    e.forEach((v, j) => (tot += (c.rivals[j]!.weight / rv.weight) * Math.exp(k * (v - x))));
    p = 1 / tot;
  } else {
    const top = Math.max(...e);
    const ties = e.filter((v) => v === top).length;
    p = x === top ? 1 / ties : 0;
  }
  return rv.value * p - rv.cost * x;
}

/** Best response by Nelder-Mead from several starts over e = min(budget, z^2), plus 0 and the cap. */
export function refBestResponse(
  c: Contest,
  i: number,
  efforts: readonly number[],
): { effort: number; payoff: number } {
  const rv = c.rivals[i]!;
  // The budget is money: the most effort it buys is maxSpend / cost (computed here, not read).
  const cap = rv.maxSpend / rv.cost;
  const top = Math.min(cap, rv.value / rv.cost);
  const f = (z: number[]) => -refPayoff(c, i, Math.min(cap, z[0]! * z[0]!), efforts);
  let best = { effort: 0, payoff: refPayoff(c, i, 0, efforts) };
  if (top < Infinity) {
    const atCap = refPayoff(c, i, top, efforts);
    if (atCap > best.payoff) best = { effort: top, payoff: atCap };
  }
  for (const frac of [1e-4, 0.01, 0.1, 0.5]) {
    const r = fmin.nelderMead(f, [Math.sqrt(frac * top)], {
      minErrorDelta: 1e-13,
      maxIterations: 400,
    });
    const e = Math.min(cap, r.x[0]! * r.x[0]!);
    const u = refPayoff(c, i, e, efforts);
    if (u > best.payoff) best = { effort: e, payoff: u };
  }
  return best;
}

/**
 * Equilibrium by Gauss-Seidel iteration of Nelder-Mead best responses (converges for the
 * r <= 1 cases used here); stops when no effort moves by more than 1e-7 of its scale v/m,
 * about the precision a derivative-free optimiser reaches on a flat maximum.
 */
export function refEquilibrium(
  c: Contest,
  start?: number[],
  sweeps = 100,
  frozen: number | null = null,
): number[] {
  const e = start ? start.slice() : c.rivals.map((x) => x.value / (x.cost * c.rivals.length * 2));
  for (let s = 0; s < sweeps; s++) {
    let moved = 0;
    for (let i = 0; i < e.length; i++) {
      if (i === frozen) continue;
      const br = refBestResponse(c, i, e).effort;
      const scale = c.rivals[i]!.value / c.rivals[i]!.cost;
      moved = Math.max(moved, Math.abs(br - e[i]!) / scale);
      e[i] = br;
    }
    if (moved < 1e-7) break;
  }
  return e;
}

/** Largest regret of a profile measured with the reference best responses. */
export function refGap(c: Contest, efforts: readonly number[]): number {
  let g = 0;
  for (let i = 0; i < efforts.length; i++) {
    const now = refPayoff(c, i, efforts[i]!, efforts);
    g = Math.max(g, refBestResponse(c, i, efforts).payoff - now);
  }
  return g;
}

export function maxRelDiff(a: readonly number[], b: readonly number[], floor = 1e-9): number {
  let d = 0;
  a.forEach((x, i) => {
    const y = b[i]!;
    d = Math.max(d, Math.abs(x - y) / Math.max(floor, Math.abs(x), Math.abs(y)));
  });
  return d;
}
