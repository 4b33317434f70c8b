/** Runs the solver for a screen. The solver returns typed results; a throw here is a bug, shown as such. */
import { comparativeStatics, normalize, solve, STATICS_MAX_RIVALS } from "@contend/solver";
import type {
  Contest,
  Equilibrium,
  Parsed,
  Scenario,
  SolveResult,
  StaticsResult,
} from "@contend/solver";

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

/**
 * Comparative statics for the explorer; null for sequential moves (shown for simultaneous only).
 * `equilibrium`: the scenario's equilibrium when solveForView has just found it (not solved again).
 */
export function staticsForView(
  scenario: Scenario,
  equilibrium?: Equilibrium,
): Parsed<StaticsResult> | null {
  if (scenario.leader) return null;
  if (scenario.rivals.length > STATICS_MAX_RIVALS)
    return {
      ok: false,
      path: "",
      message: `comparative statics are shown for up to ${STATICS_MAX_RIVALS} rivals`,
    };
  try {
    return comparativeStatics(scenario, equilibrium ? { equilibrium } : {});
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
  const solved = solveForView(scenario);
  return {
    solved,
    statics: staticsForView(scenario, solved.ok ? solved.result.equilibrium : undefined),
  };
}
