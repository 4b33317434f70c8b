/**
 * No wrong number at the extremes. Every result the solver hands out is checked here: a
 * number that is not finite, or a pure equilibrium whose measured Nash gap is not below the
 * tolerance (relative to the prize), is never reported as an answer. The record becomes
 * "none-pure" with `outOfRange` set to the reason, and the CLI exits 2 with
 * "numbers out of the range Contend can solve reliably: <reason>". The same check covers
 * `respond`. Common practice, no source.
 */
import { noPureEquilibrium } from "./pureEquilibrium";
import type { Contest, Equilibrium, Responses, SolveResult } from "./types";

export const OUT_OF_RANGE = "numbers out of the range Contend can solve reliably";

function firstBad(name: string, xs: readonly number[] | null | undefined): string | null {
  if (!xs) return null;
  const k = xs.findIndex((x) => !Number.isFinite(x));
  return k < 0 ? null : `${name} ${k + 1} is ${String(xs[k])}`;
}

/** Why an equilibrium record cannot be trusted, or null when it can. */
export function equilibriumRangeProblem(
  contest: Contest,
  eq: Equilibrium,
  tolerance: number,
): string | null {
  if (eq.kind === "none-pure") return null;
  const bad =
    firstBad("effort", eq.efforts) ??
    firstBad("expected effort", eq.expectedEfforts) ??
    firstBad("share", eq.shares) ??
    firstBad("payoff", eq.payoffs) ??
    firstBad("total", [eq.totalEffort, eq.dissipation]);
  if (bad) return `${bad} (prize ${contest.prize})`;
  if (!Number.isFinite(eq.nashGap)) return `the Nash gap is ${String(eq.nashGap)}`;
  if (eq.kind === "pure" && !(eq.nashGap <= tolerance)) {
    return `the measured Nash gap ${eq.nashGap.toPrecision(3)} is not below the tolerance ${tolerance.toPrecision(3)} (prize ${contest.prize})`;
  }
  return null;
}

/** The result with untrustworthy records replaced (main) or dropped (alternatives). */
export function guardSolveResult(
  contest: Contest,
  result: SolveResult,
  tolerance: number,
): SolveResult {
  const why = equilibriumRangeProblem(contest, result.equilibrium, tolerance);
  const alternatives = result.alternatives.filter(
    (eq) => equilibriumRangeProblem(contest, eq, tolerance) === null,
  );
  if (why === null) {
    return alternatives.length === result.alternatives.length
      ? result
      : { equilibrium: result.equilibrium, alternatives };
  }
  const eq = noPureEquilibrium(contest, "out-of-range", `${OUT_OF_RANGE}: ${why}.`);
  eq.outOfRange = why;
  return { equilibrium: eq, alternatives: [] };
}

/** Why `respond`'s numbers cannot be trusted, or null when they can. */
export function responsesRangeProblem(res: Responses): string | null {
  return (
    firstBad("best response", res.bestResponses) ??
    firstBad("payoff", res.payoffs) ??
    firstBad("regret", res.regrets) ??
    (Number.isFinite(res.nashGap) ? null : `the Nash gap is ${String(res.nashGap)}`)
  );
}
