/**
 * Equilibrium of several simultaneous contests fought with one budget per rival.
 *
 * Method 1, multipliers outside, one contest per front inside (derived here from the
 * Kuhn-Tucker conditions of each rival's program, see bestAllocation.ts): at an equilibrium
 * every rival i has a multiplier mu_i (1 + its budget's shadow price, or the shadow price for
 * a sunk budget) such that on every front its effort is a best response at the shadow cost
 * mu_i c_ik. Given the multipliers the fronts decouple: each is a single contest with costs
 * mu_i c_ik, solved by the share-function method (Cornes & Hartley 2005, Economic Theory 26)
 * for ratio fronts with r <= 1, where the equilibrium is unique (Szidarovszky & Okuguchi 1997,
 * Games and Economic Behavior 18), and by the single-contest solver's verified search
 * otherwise. The multipliers are then moved until each budget is spent exactly or mu_i = 1 with
 * money to spare: a secant step on ln mu_i per rival (the elasticity of its spend to its own
 * multiplier, measured from the last step). Volume numbers from memory.
 * Method 2, when method 1 fails (a front without a pure equilibrium at some multipliers, or
 * no convergence): damped Gauss-Seidel iteration of whole-allocation best responses (a convex
 * combination of two allocations within budget stays within budget). Common practice, no source.
 * Whatever either method returns passes the global check: every rival's best allocation
 * (bestAllocation.ts) against the profile; the largest regret is the reported Nash gap, and a
 * profile whose gap exceeds the tolerance is not reported as an equilibrium.
 */
import { shares } from "../csf";
import { anderson } from "./anderson";
import { shareFunctionEquilibrium } from "../shareFunction";
import { solve } from "../solve";
import type { Contest } from "../types";
import {
  allocationPayoff,
  bestAllocationAgainst,
  frontOppositions,
  frontsAreConcave,
  respondFronts,
  spendOf,
} from "./bestAllocation";
import type {
  FrontsContest,
  FrontsEquilibrium,
  FrontsSolveOptions,
  FrontsSolveResult,
} from "./types";

const OUTER_ITERATIONS = 400;
/** fewer rounds when fronts need the verified single-contest search (slower per round) */
const OUTER_ITERATIONS_SEARCH = 60;
/** most an accelerated step may move ln mu beyond the plain step */
const MAX_EXTRAPOLATION = 0.5;
/** relative tolerance on a binding budget in the multiplier loop */
const BUDGET_TOL = 1e-9;
const BR_SWEEPS = 200;
const BR_DAMPING = 0.5;
/** sweeps between Nash-gap checks in the best-response iteration */
const GAP_CHECK_EVERY = 5;
const STALL_CHECKS = 4;

export function solveFronts(fc: FrontsContest, opts: FrontsSolveOptions = {}): FrontsSolveResult {
  const totalPrize = fc.fronts.reduce((s, f) => s + f.prize, 0);
  const tol = opts.tolerance ?? 1e-6 * totalPrize;
  const lone = loneFront(fc);
  if (lone !== null) return { equilibrium: nonePure(fc, "numeric", lone), alternatives: [] };
  const viaMultipliers = multiplierEquilibrium(fc);
  if (viaMultipliers) {
    const eq = packageProfile(fc, viaMultipliers, "fronts:multipliers+share-function");
    if (eq.nashGap <= tol) return { equilibrium: eq, alternatives: [] };
  }
  const start = viaMultipliers ?? evenSplit(fc);
  const it = bestResponseIteration(fc, start, tol);
  const eq = packageProfile(fc, it.profile, "fronts:best-response-iteration");
  if (eq.nashGap <= tol) return { equilibrium: eq, alternatives: [] };
  const why = frontsAreConcave(fc)
    ? "the multiplier search and best-response iteration did not reach a profile within the tolerance (numerical trouble; please report the scenario)"
    : "no profile passed the global best-response check: with r > 1 or a logit front a rival's best allocation can jump between fronts, and then a pure equilibrium may not exist";
  return {
    equilibrium: nonePure(
      fc,
      "fronts:best-response-iteration",
      `No pure-strategy equilibrium found: ${why}. Smallest Nash gap reached ${eq.nashGap.toPrecision(3)} (tolerance ${tol.toPrecision(3)}).`,
    ),
    alternatives: [],
  };
}

/** A reason when some front has at most one rival able to spend (no optimum exists there). */
function loneFront(fc: FrontsContest): string | null {
  const able = fc.rivals.filter((r) => r.budget > 0).length;
  if (able >= 2) return null;
  return able === 0
    ? "No rival has any budget to spend."
    : "At most one rival can spend anything: it wins every front with any positive step, so no allocation is optimal.";
}

function evenSplit(fc: FrontsContest): number[][] {
  const K = fc.fronts.length;
  return fc.rivals.map((rv) => {
    if (rv.budget === Infinity) return rv.value.map((v, k) => v / (4 * rv.cost[k]!));
    return rv.cost.map((c) => rv.budget / (K * c));
  });
}

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

/** Method 1 of the file header; null when it does not converge. */
function multiplierEquilibrium(fc: FrontsContest): number[][] | null {
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
      const br = bestAllocationAgainst(
        fc,
        i,
        opp.map((o) => o[i]!),
        undefined,
        mu[i],
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
function fitBudgets(fc: FrontsContest, x: number[][], binding?: readonly boolean[]): number[][] {
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

/** Method 2 of the file header: the profile with the smallest gap seen. */
function bestResponseIteration(
  fc: FrontsContest,
  start: number[][],
  tol: number,
): { profile: number[][] } {
  const x = fitBudgets(fc, start).map((r) => r.slice());
  const n = fc.rivals.length;
  // each rival's last multiplier starts its next search nearby
  const hints = fc.rivals.map((): number | undefined => undefined);
  let bestGap = Infinity;
  let stalled = 0;
  for (let s = 0; s < BR_SWEEPS; s++) {
    // stop as soon as the profile passes the check with room to spare
    if (s % GAP_CHECK_EVERY === GAP_CHECK_EVERY - 1) {
      const gap = respondFronts(fc, fitBudgets(fc, x)).nashGap;
      if (gap <= 1e-9 * tol) break;
      // a cycle (common with r > 1 or logit fronts): give up after STALL_CHECKS checks without
      // a tenth off the best gap seen
      if (gap < 0.9 * bestGap) {
        bestGap = gap;
        stalled = 0;
      } else if (++stalled >= STALL_CHECKS) break;
    }
    let moved = 0;
    for (let i = 0; i < n; i++) {
      const opp = frontOppositions(fc, x).map((o) => o[i]!);
      const rv = fc.rivals[i]!;
      const best = bestAllocationAgainst(fc, i, opp, x[i], hints[i]);
      if (best.shadowPrice !== null && Number.isFinite(best.shadowPrice)) {
        hints[i] = best.shadowPrice + (rv.sunkBudget ? 0 : 1);
      }
      const br = best.allocation;
      for (let k = 0; k < br.length; k++) {
        const next = x[i]![k]! + BR_DAMPING * (br[k]! - x[i]![k]!);
        const scale = rv.value[k]! / rv.cost[k]!;
        moved = Math.max(moved, Math.abs(next - x[i]![k]!) / scale);
        x[i]![k] = next;
      }
    }
    if (moved <= 1e-11) break;
  }
  // a convex combination of two rows within budget can round a few ulps above it
  return { profile: fitBudgets(fc, x) };
}

/** Packages a profile with its shares, payoffs, money and the measured Nash gap. */
export function packageProfile(
  fc: FrontsContest,
  allocations: number[][],
  method: string,
): FrontsEquilibrium {
  const K = fc.fronts.length;
  const res = respondFronts(fc, allocations);
  const opp = frontOppositions(fc, allocations);
  const perFront = fc.contests.map((c, k) =>
    shares(
      c,
      allocations.map((row) => row[k]!),
    ),
  );
  const spends = allocations.map((row, i) => row.map((x, k) => x * fc.rivals[i]!.cost[k]!));
  const frontTotals = new Array<number>(K).fill(0);
  for (const row of spends) row.forEach((s, k) => (frontTotals[k] = frontTotals[k]! + s));
  return {
    kind: "pure",
    allocations,
    spends,
    shares: allocations.map((_, i) => perFront.map((p) => p[i]!)),
    payoffs: allocations.map((row, i) =>
      allocationPayoff(
        fc,
        i,
        row,
        opp.map((o) => o[i]!),
      ),
    ),
    budgetUsed: spends.map((row) => row.reduce((a, b) => a + b, 0)),
    frontTotals,
    shadowPrices: res.shadowPrices,
    nashGap: res.nashGap,
    method,
  };
}

function nonePure(fc: FrontsContest, method: string, note: string): FrontsEquilibrium {
  return {
    kind: "none-pure",
    allocations: null,
    spends: null,
    shares: null,
    payoffs: null,
    budgetUsed: null,
    frontTotals: null,
    shadowPrices: null,
    nashGap: Number.NaN,
    method,
    note,
  };
}
