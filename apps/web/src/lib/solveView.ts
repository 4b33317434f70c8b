/** Runs the solver for a screen. The solver returns typed results; a throw here is a bug, shown as such. */
import { comparativeStatics, normalize, solve, STATICS_MAX_RIVALS } from "@contend/solver";
import type { Contest, Parsed, Scenario, SolveResult, StaticsResult } from "@contend/solver";

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

/** Comparative statics for the explorer; null for sequential moves (shown for simultaneous only). */
export function staticsForView(scenario: Scenario): Parsed<StaticsResult> | null {
  if (scenario.leader) return null;
  if (scenario.rivals.length > STATICS_MAX_RIVALS)
    return {
      ok: false,
      path: "",
      message: `comparative statics are shown for up to ${STATICS_MAX_RIVALS} rivals`,
    };
  try {
    return comparativeStatics(scenario);
  } catch (e) {
    return { ok: false, path: "", message: `solver failed: ${(e as Error).message}` };
  }
}

/** What the explorer shows for one scenario: its equilibrium and comparative statics. */
export interface ExplorerAnswer {
  solved: SolvedView;
  statics: Parsed<StaticsResult> | null;
}

export function answerForView(scenario: Scenario): ExplorerAnswer {
  return { solved: solveForView(scenario), statics: staticsForView(scenario) };
}
