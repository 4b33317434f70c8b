// Independent reference computations for the fronts tests: payoffs written out from the
// success-function definitions (Tullock 1980; Hirshleifer 1989; the all-pay auction) and a rival's best allocation
// over its budget set found by Nelder-Mead (fmin), a general-purpose optimiser that shares no
// code with the solver. The budget set {s >= 0, sum s <= B} is parametrised by
// s_k = B sigma(t) softmax(z)_k (spends in money), so the search is unconstrained.
import type { FrontsContest } from "../src/fronts/types";
import fmin from "./fminLoader";

/** p of rival i on front k when the efforts on that front are `col`. */
export function refShare(fcx: FrontsContest, k: number, i: number, col: readonly number[]): number {
  const f = fcx.fronts[k]!;
  const w = fcx.rivals.map((r) => r.weight[k]!);
  if (f.csf.kind === "ratio") {
    const r = f.csf.decisiveness;
    const y = col.map((x, j) => (x > 0 ? w[j]! * Math.pow(x, r) : 0));
    const tot = y.reduce((a, b) => a + b, 0);
    return tot === 0 ? 1 / col.length : y[i]! / tot;
  }
  if (f.csf.kind === "logit") {
    const kk = f.csf.scale;
    let tot = 0;
    col.forEach((x, j) => (tot += (w[j]! / w[i]!) * Math.exp(kk * (x - col[i]!))));
    return 1 / tot;
  }
  // all-pay auction: the highest effort wins, rivals tied at the top split the prize
  const top = Math.max(...col);
  return col[i] === top ? 1 / col.filter((x) => x === top).length : 0;
}

/** Rival i's payoff when it plays `row` and the others play `alloc`. */
export function refPayoff(
  fcx: FrontsContest,
  i: number,
  row: readonly number[],
  alloc: readonly (readonly number[])[],
): number {
  const rv = fcx.rivals[i]!;
  let u = 0;
  for (let k = 0; k < fcx.fronts.length; k++) {
    const col = alloc.map((r, j) => (j === i ? row[k]! : r[k]!));
    u += rv.value[k]! * refShare(fcx, k, i, col);
    if (!rv.sunkBudget) u -= rv.cost[k]! * row[k]!;
  }
  return u;
}

/** Best payoff rival i can reach against `alloc`, by Nelder-Mead from several starts. */
export function refBestPayoff(
  fcx: FrontsContest,
  i: number,
  alloc: readonly (readonly number[])[],
): number {
  const rv = fcx.rivals[i]!;
  const K = fcx.fronts.length;
  const B = rv.budget;
  const cap = Number.isFinite(B) ? B : rv.value.reduce((a, b) => a + b, 0);
  const sig = (t: number) => 1 / (1 + Math.exp(-t));
  const rowOf = (z: number[]): number[] => {
    const top = Math.max(...z.slice(0, K));
    const ex = z.slice(0, K).map((v) => Math.exp(v - top));
    const sum = ex.reduce((a, b) => a + b, 0);
    // without a budget the total is free too (up to the sum of values, beyond which nothing pays)
    const total = cap * sig(z[K]!);
    return ex.map((e, k) => (total * e) / sum / rv.cost[k]!);
  };
  const f = (z: number[]) => -refPayoff(fcx, i, rowOf(z), alloc);
  let best = refPayoff(fcx, i, alloc[i]!, alloc);
  const starts: number[][] = [];
  const spends = alloc[i]!.map((x, k) => x * rv.cost[k]!);
  const used = spends.reduce((a, b) => a + b, 0);
  if (used > 0) {
    const frac = Math.min(1 - 1e-9, Math.max(1e-9, used / cap));
    starts.push([
      ...spends.map((s) => Math.log(Math.max(s, 1e-12 * used))),
      Math.log(frac / (1 - frac)),
    ]);
  }
  starts.push(new Array<number>(K + 1).fill(0));
  for (let k = 0; k < K; k++)
    starts.push([...new Array<number>(K).fill(0).map((_, j) => (j === k ? 3 : 0)), 2]);
  for (const x0 of starts) {
    const r = fmin.nelderMead(f, x0, { maxIterations: 400 * (K + 1), minErrorDelta: 1e-14 });
    best = Math.max(best, -r.fx);
  }
  return best;
}

/** Largest regret of a profile measured with the reference best payoffs. */
export function refFrontsGap(fcx: FrontsContest, alloc: readonly (readonly number[])[]): number {
  let g = 0;
  for (let i = 0; i < alloc.length; i++) {
    g = Math.max(g, refBestPayoff(fcx, i, alloc) - refPayoff(fcx, i, alloc[i]!, alloc));
  }
  return g;
}
