/**
 * Method 1 of frontsEquilibrium.ts: multipliers outside, one contest per front inside (derived
 * here from the Kuhn-Tucker conditions of each rival's program, see waterFilling.ts): at an
 * equilibrium every rival i has a multiplier mu_i (1 + its budget's shadow price, or the shadow
 * price for a sunk budget) such that on every front its effort is a best response at the shadow
 * cost mu_i c_ik. Given the multipliers the fronts decouple: each is a single contest with costs
 * mu_i c_ik, solved by the share-function method (Cornes & Hartley 2005, Economic Theory 26)
 * for ratio fronts with r <= 1, where the equilibrium is unique (Szidarovszky & Okuguchi 1997,
 * Games and Economic Behavior 18), and by the single-contest solver's verified search
 * otherwise. The multipliers are then moved until each budget is spent exactly or mu_i = 1 with
 * money to spare: each rival's next multiplier is the one at which its best allocation against
 * the others fits its budget, accelerated by Anderson mixing on ln mu. Volume numbers from memory.
 */
import { anderson } from "./anderson";
import { shareFunctionEquilibrium } from "../shareFunction";
import { solve } from "../solve";
import type { Contest } from "../types";
import { waterFill } from "./waterFilling";
import { frontOppositions, frontsAreConcave, spendOf } from "./frontPayoff";
import type { FrontsContest } from "./types";

const OUTER_ITERATIONS = 400;
/** fewer rounds when fronts need the verified single-contest search (slower per round) */
const OUTER_ITERATIONS_SEARCH = 60;
/** most an accelerated step may move ln mu beyond the plain step */
const MAX_EXTRAPOLATION = 0.5;
/** relative tolerance on a binding budget in the multiplier loop */
const BUDGET_TOL = 1e-9;

/** The single contest of front k with rival i's cost scaled by mu_i. */
function scaledFront(c: Contest, mu: readonly number[]): Contest {
  return { ...c, rivals: c.rivals.map((rv, i) => ({ ...rv, cost: rv.cost * mu[i]! })) };
}

/** Each front's equilibrium at the given multipliers: allocations[i][k], or null. */
function frontsAt(fc: FrontsContest, mu: readonly number[], concave: boolean): number[][] | null {
  const n = fc.rivals.length;
  const out = fc.rivals.map(() => new Array<number>(fc.fronts.length).fill(0));
  for (let k = 0; k < fc.fronts.length; k++) {
    const c = scaledFront(fc.contests[k]!, mu);
    let efforts: number[] | null;
    if (concave) {
      const sf = shareFunctionEquilibrium(c);
      efforts = sf?.ok ? sf.efforts : null;
    } else {
      // only a pure profile is used: skip the mixed-equilibrium search
      const eq = solve(c, { mixed: false }).equilibrium;
      efforts = eq.kind === "pure" ? eq.efforts : null;
    }
    if (!efforts) return null;
    for (let i = 0; i < n; i++) out[i]![k] = efforts[i]!;
  }
  return out;
}

/** Method 1 (see the file header); null when it does not converge. */
export function multiplierEquilibrium(fc: FrontsContest): number[][] | null {
  const concave = frontsAreConcave(fc);
  const n = fc.rivals.length;
  const floor = fc.rivals.map((r) => (r.sunkBudget ? 0 : 1));
  // a sunk rival's first multiplier: the symmetric Tullock spend sum_k V_k (n - 1) / (n^2 mu)
  // (Tullock 1980) set equal to its budget
  const mu = fc.rivals.map((r, i) =>
    floor[i]! > 0
      ? floor[i]!
      : (r.value.reduce((a, b) => a + b, 0) * Math.max(1, n - 1)) / (n * n * (r.budget || 1)),
  );
  const accel = anderson();
  const rounds = concave ? OUTER_ITERATIONS : OUTER_ITERATIONS_SEARCH;
  for (let it = 0; it < rounds; it++) {
    const x = frontsAt(fc, mu, concave);
    if (!x) return null;
    let done = true;
    const opp = frontOppositions(fc, x);
    const next = mu.slice();
    for (let i = 0; i < n; i++) {
      const rv = fc.rivals[i]!;
      if (!(rv.budget < Infinity) || rv.budget === 0) continue;
      const ratio = spendOf(fc, i, x[i]!) / rv.budget;
      if (!rv.sunkBudget && mu[i]! <= floor[i]! && ratio <= 1 + BUDGET_TOL) continue;
      if (Math.abs(ratio - 1) <= BUDGET_TOL) continue;
      done = false;
      // the multiplier at which i's best allocation against the others' efforts fits its budget
      // only the multiplier is needed here, and only as closely as the budget is missed
      const rootTol = Math.min(1e-4, Math.max(1e-13, 1e-3 * Math.abs(ratio - 1)));
      const br = waterFill(
        fc,
        i,
        opp.map((o) => o[i]!),
        rv.budget,
        undefined,
        mu[i],
        rootTol,
      );
      const target = Math.max(floor[i]!, (br.shadowPrice ?? 0) + floor[i]!);
      next[i] = target;
    }
    if (done) {
      const binding = fc.rivals.map(
        (r, i) => r.budget > 0 && r.budget < Infinity && mu[i]! > floor[i]!,
      );
      return fitBudgets(fc, x, binding);
    }
    const u = mu.map(Math.log);
    const step = accel.next(
      u,
      next.map((m) => Math.log(m)),
    );
    for (let i = 0; i < n; i++) {
      // trust the extrapolation only within MAX_EXTRAPOLATION of the plain step in ln mu
      const plain = Math.log(next[i]!);
      const t = Math.min(plain + MAX_EXTRAPOLATION, Math.max(plain - MAX_EXTRAPOLATION, step[i]!));
      const v = Math.exp(Number.isFinite(t) ? t : plain);
      mu[i] = Math.max(floor[i]!, v);
    }
  }
  return null;
}

/**
 * Rows spend at most their budget, and exactly their budget where it binds (`binding[i]`): the
 * multiplier loop stops within BUDGET_TOL, and a sunk budget left unspent would be money lost.
 */
export function fitBudgets(
  fc: FrontsContest,
  x: number[][],
  binding?: readonly boolean[],
): number[][] {
  return x.map((row, i) => {
    const s = spendOf(fc, i, row);
    const B = fc.rivals[i]!.budget;
    if (!(s > B) && !(binding?.[i] && s > 0 && s < B)) return row;
    let scaled = row.map((v) => v * (B / s));
    // rounding can leave the sum a few ulps above B: shave until it is not
    for (let t = 1; spendOf(fc, i, scaled) > B; t *= 2) {
      scaled = row.map((v) => v * (B / s) * (1 - t * Number.EPSILON));
    }
    return scaled;
  });
}
