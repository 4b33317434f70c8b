/** One solved scenario reduced to the numbers a sweep plots. */
import { normalize, spendsOf } from "../normalize";
import { solve } from "../solve";
import type { Equilibrium, EquilibriumKind, Scenario } from "../types";

export interface SweepPoint {
  value: number;
  kind: EquilibriumKind;
  /** pure efforts, expected efforts for a mixed equilibrium, null where no equilibrium is known */
  efforts: (number | null)[];
  /** money: cost x effort at this point (expected when mixed), null where effort is unknown */
  spends: (number | null)[];
  payoffs: (number | null)[];
  totalEffort: number | null;
  /** sum of spends (money) */
  totalSpend: number | null;
  dissipation: number | null;
}

/** Pure efforts, or expected efforts for a mixed equilibrium; null when neither is known. */
export function effortsOf(eq: Equilibrium): number[] | null {
  return eq.efforts ?? eq.expectedEfforts ?? null;
}

export function solvePoint(scenario: Scenario, value: number): SweepPoint {
  const contest = normalize(scenario);
  const eq = solve(contest).equilibrium;
  const n = scenario.rivals.length;
  const efforts = effortsOf(eq);
  const known = efforts !== null;
  const spends = efforts ? spendsOf(contest, efforts) : null;
  return {
    value,
    kind: eq.kind,
    efforts: efforts ?? new Array<null>(n).fill(null),
    spends: spends ?? new Array<null>(n).fill(null),
    payoffs: eq.payoffs ?? new Array<null>(n).fill(null),
    totalEffort: known && Number.isFinite(eq.totalEffort) ? eq.totalEffort : null,
    totalSpend: spends ? spends.reduce((a, b) => a + b, 0) : null,
    dissipation: known && Number.isFinite(eq.dissipation) ? eq.dissipation : null,
  };
}
