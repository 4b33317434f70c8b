/** One-parameter sweep: equilibrium efforts, payoffs, total effort and dissipation along a line. */
import type { EquilibriumKind, Parsed, Scenario } from "../types";
import {
  MAX_STEPS_1D,
  plan1d,
  planAxis,
  prepare,
  runPrepared,
  type AxisSpec,
  type PreparedSweep,
  type Progress,
} from "./plan";
import type { SweepPoint } from "./point";

export interface Sweep1d {
  param: string;
  names: string[];
  values: number[];
  /** efforts[i][k]: rival i at point k (expected effort when mixed, null when unknown) */
  efforts: (number | null)[][];
  /** spends[i][k]: money, cost x effort at point k (the cost may be the swept parameter) */
  spends: (number | null)[][];
  payoffs: (number | null)[][];
  totalEffort: (number | null)[];
  totalSpend: (number | null)[];
  dissipation: (number | null)[];
  kinds: EquilibriumKind[];
}

/** Reassembles points (e.g. collected from chunks) into per-rival series. */
export function assemble1d(param: string, names: string[], points: SweepPoint[]): Sweep1d {
  return {
    param,
    names,
    values: points.map((p) => p.value),
    efforts: names.map((_, i) => points.map((p) => p.efforts[i] ?? null)),
    spends: names.map((_, i) => points.map((p) => p.spends[i] ?? null)),
    payoffs: names.map((_, i) => points.map((p) => p.payoffs[i] ?? null)),
    totalEffort: points.map((p) => p.totalEffort),
    totalSpend: points.map((p) => p.totalSpend),
    dissipation: points.map((p) => p.dissipation),
    kinds: points.map((p) => p.kind),
  };
}

export function prepareSweep1d(scenario: Scenario, spec: AxisSpec): Parsed<PreparedSweep<Sweep1d>> {
  const axis = planAxis(scenario, spec, "sweep", MAX_STEPS_1D);
  if (!axis.ok) return axis;
  const names = scenario.rivals.map((r) => r.name);
  const plan = plan1d(scenario, axis.value);
  return {
    ok: true,
    value: prepare(plan, (points) => assemble1d(axis.value.param, names, points)),
  };
}

export function sweep1d(
  scenario: Scenario,
  spec: AxisSpec,
  onProgress?: Progress,
): Parsed<Sweep1d> {
  const prepared = prepareSweep1d(scenario, spec);
  return prepared.ok ? { ok: true, value: runPrepared(prepared.value, onProgress) } : prepared;
}
