// Independent reference for the fronts-session tests: shares and payoffs written out from the
// ratio-form success function (Tullock 1980, "Efficient rent seeking"; weights as head starts),
// and a rival's best payoff over its budget set found by Nelder-Mead (fmin), a general-purpose
// optimiser that shares no code with the solver. The budget set {s >= 0, sum s <= B} is
// parametrised by s_k = B sigma(t) softmax(z)_k (money), so the search is unconstrained.
import fmin from "./fminLoader";

export interface RefFront {
  prize: number;
  r: number;
}
export interface RefRival {
  cost: number[];
  value: number[];
  weight: number[];
  budget: number;
  sunk: boolean;
}

/** p_i on one front: w_i s_i^r / sum_j w_j s_j^r with efforts s = spend / cost. */
export function refShare(
  front: RefFront,
  w: readonly number[],
  efforts: readonly number[],
  i: number,
) {
  const y = efforts.map((x, j) => (x > 0 ? w[j]! * Math.pow(x, front.r) : 0));
  const tot = y.reduce((a, b) => a + b, 0);
  return tot === 0 ? 1 / efforts.length : y[i]! / tot;
}

/** Rival i's payoff when the money allocations are `spends` (rows rivals, columns fronts). */
export function refPayoff(
  fronts: readonly RefFront[],
  rivals: readonly RefRival[],
  spends: readonly (readonly number[])[],
  i: number,
): number {
  let u = 0;
  fronts.forEach((f, k) => {
    const efforts = spends.map((row, j) => row[k]! / rivals[j]!.cost[k]!);
    const w = rivals.map((rv) => rv.weight[k]!);
    u += rivals[i]!.value[k]! * refShare(f, w, efforts, i);
    if (!rivals[i]!.sunk) u -= spends[i]![k]!;
  });
  return u;
}

/** Best payoff rival i reaches against the others' `spends`, by Nelder-Mead from several starts. */
export function refBestPayoff(
  fronts: readonly RefFront[],
  rivals: readonly RefRival[],
  spends: readonly (readonly number[])[],
  i: number,
): number {
  const K = fronts.length;
  const B = rivals[i]!.budget;
  const rowOf = (z: number[]) => {
    const top = Math.max(...z.slice(0, K));
    const ex = z.slice(0, K).map((v) => Math.exp(v - top));
    const sum = ex.reduce((a, b) => a + b, 0);
    const total = B / (1 + Math.exp(-z[K]!));
    return ex.map((e) => (total * e) / sum);
  };
  const at = (row: number[]) => spends.map((r, j) => (j === i ? row : r));
  const f = (z: number[]) => -refPayoff(fronts, rivals, at(rowOf(z)), i);
  let best = refPayoff(fronts, rivals, spends, i);
  const starts: number[][] = [new Array<number>(K + 1).fill(0)];
  for (let k = 0; k < K; k++)
    starts.push([...new Array<number>(K).fill(0).map((_, j) => (j === k ? 3 : 0)), 4]);
  const mine = spends[i]!;
  const used = mine.reduce((a, b) => a + b, 0);
  if (used > 0) {
    const frac = Math.min(1 - 1e-9, Math.max(1e-9, used / B));
    starts.push([
      ...mine.map((s) => Math.log(Math.max(s, 1e-12 * used))),
      Math.log(frac / (1 - frac)),
    ]);
  }
  for (const x0 of starts) {
    const r = fmin.nelderMead(f, x0, { maxIterations: 600 * (K + 1), minErrorDelta: 1e-14 });
    best = Math.max(best, -r.fx);
  }
  return best;
}
