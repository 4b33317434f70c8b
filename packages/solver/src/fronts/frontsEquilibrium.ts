/**
 * Equilibrium of several simultaneous contests fought with one budget per rival.
 *
 * Method 1 (multiplierEquilibrium.ts): multipliers outside, one single contest per front
 * inside. Method 2, when method 1 fails (a front without a pure equilibrium at some
 * multipliers, an all-pay front, or no convergence): damped Gauss-Seidel iteration of
 * whole-allocation best responses (a convex combination of two allocations within budget stays
 * within budget). Common practice, no source.
 * Whatever either method returns passes the global check: every rival's best allocation
 * (bestAllocation.ts) against the profile; the largest regret is the reported Nash gap, and a
 * profile whose gap exceeds the tolerance is not reported as an equilibrium.
 *
 * All-pay fronts: a single all-pay auction with two or more rivals who value the prize has no
 * pure-strategy equilibrium (Baye, Kovenock & de Vries 1996, Economic Theory 8; from memory):
 * against pure bids someone always gains by outbidding the top bid by a step, or by dropping
 * to nothing. Budgets can change that (rivals tied at their caps, or a sunk budget that is
 * spent anyway), so the same search and check run; when no profile passes, the result is
 * `none-pure` with a note naming the all-pay fronts. Mixed strategies over several fronts with
 * one budget (a Colonel Blotto-type game; Roberson 2006, Economic Theory 29; from memory) are
 * not computed here.
 */
import { shares } from "../csf";
import { bestAllocationAgainst, respondFronts } from "./bestAllocation";
import { allPayFronts, allocationPayoff, frontOppositions, frontsAreConcave } from "./frontPayoff";
import { fitBudgets, multiplierEquilibrium } from "./multiplierEquilibrium";
import type {
  FrontsContest,
  FrontsEquilibrium,
  FrontsSolveOptions,
  FrontsSolveResult,
} from "./types";

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
  const allPay = allPayFronts(fc);
  // the per-front solver has no pure answer on an all-pay front: go straight to method 2
  const viaMultipliers = allPay.length === 0 ? multiplierEquilibrium(fc) : null;
  if (viaMultipliers) {
    const eq = packageProfile(fc, viaMultipliers, "fronts:multipliers+share-function");
    if (eq.nashGap <= tol) return { equilibrium: eq, alternatives: [] };
  }
  const start = viaMultipliers ?? evenSplit(fc);
  const it = bestResponseIteration(fc, start, tol);
  const eq = packageProfile(fc, it.profile, "fronts:best-response-iteration");
  if (eq.nashGap <= tol) return { equilibrium: eq, alternatives: [] };
  const why =
    allPay.length > 0
      ? allPayReason(fc, allPay)
      : frontsAreConcave(fc)
        ? "the multiplier search and best-response iteration did not reach a profile within the tolerance (numerical trouble; please report the scenario)"
        : "no profile passed the global best-response check: with r > 1 or a logit front a rival's best allocation can jump between fronts, and then a pure equilibrium may not exist";
  return {
    equilibrium: nonePure(
      fc,
      "fronts:best-response-iteration",
      `No pure-strategy equilibrium found: ${why}. In the closest profile found some rival could still gain ${eq.nashGap.toPrecision(3)} (money) by re-splitting its budget (tolerance ${tol.toPrecision(3)}).`,
    ),
    alternatives: [],
  };
}

/** Why a scenario with all-pay fronts has no pure equilibrium (see the file header). */
function allPayReason(fc: FrontsContest, allPay: readonly number[]): string {
  const names = allPay.map((k) => `"${fc.fronts[k]!.name}"`);
  const list =
    names.length === 1
      ? `front ${names[0]!} is an all-pay auction`
      : `fronts ${names.join(", ")} are all-pay auctions`;
  const decoupled = fc.rivals.every((r) => r.budget === Infinity);
  return (
    `${list}: against pure bids some rival always gains by outbidding the top bid by a step or by dropping to nothing, so no pure profile passed the global best-response check (without budgets that bind, an all-pay auction has no pure-strategy equilibrium: Baye, Kovenock & de Vries 1996). ` +
    (decoupled
      ? "No rival has a budget, so the fronts are independent contests: solve each all-pay front on its own for its mixed equilibrium (Hillman & Riley 1989)"
      : "Its equilibria are in mixed strategies, and mixed strategies over several fronts with one budget (a Colonel Blotto-type game) are not computed here")
  );
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
  let bestProfile: number[][] | null = null;
  let stalled = 0;
  for (let s = 0; s < BR_SWEEPS; s++) {
    // stop as soon as the profile passes the check with room to spare (the start too)
    if (s % GAP_CHECK_EVERY === 0) {
      const fitted = fitBudgets(fc, x);
      const gap = respondFronts(fc, fitted).nashGap;
      if (gap < bestGap) bestProfile = fitted.map((r) => r.slice());
      if (gap <= 1e-9 * tol) return { profile: fitted };
      // a cycle (common with r > 1, logit or all-pay fronts): give up after STALL_CHECKS checks
      // without a tenth off the best gap seen
      if (gap < 0.9 * bestGap) stalled = 0;
      else if (++stalled >= STALL_CHECKS) break;
      bestGap = Math.min(bestGap, gap);
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
  const last = fitBudgets(fc, x);
  if (!bestProfile || respondFronts(fc, last).nashGap <= bestGap) return { profile: last };
  return { profile: bestProfile };
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
