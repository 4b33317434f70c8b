/** Runs the solver for a screen. The solver returns typed results; a throw here is a bug, shown as such. */
import { normalize, solve } from "@contend/solver";
import type { Contest, Scenario, SolveResult } from "@contend/solver";

export type SolvedView =
  { ok: true; contest: Contest; result: SolveResult } | { ok: false; message: string };

export function solveForView(scenario: Scenario): SolvedView {
  try {
    const contest = normalize(scenario);
    return { ok: true, contest, result: solve(contest) };
  } catch (e) {
    return { ok: false, message: `solver failed: ${(e as Error).message}` };
  }
}
