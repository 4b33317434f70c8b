/** Two-parameter sweep: one metric of the equilibrium on a grid (a heat map). */
import type { EquilibriumKind, InputError, Parsed, Scenario } from "../types";
import {
  MAX_STEPS_2D,
  plan2d,
  planAxis,
  prepare,
  runPrepared,
  type AxisSpec,
  type PreparedSweep,
  type Progress,
} from "./plan";
import type { SweepPoint } from "./point";

/** "totalEffort", "dissipation", "effort.<i>" or "payoff.<i>" (rival index). */
export type Sweep2dMetric =
  | "totalEffort"
  | "totalSpend"
  | "dissipation"
  | `effort.${number}`
  | `spend.${number}`
  | `payoff.${number}`;

export interface Sweep2d {
  x: { param: string; values: number[] };
  y: { param: string; values: number[] };
  metric: Sweep2dMetric;
  /** z[iy][ix]; null where no equilibrium is known */
  z: (number | null)[][];
  kinds: EquilibriumKind[][];
}

export function metricReader(metric: string, n: number): Parsed<(p: SweepPoint) => number | null> {
  if (metric === "totalEffort") return { ok: true, value: (p) => p.totalEffort };
  if (metric === "totalSpend") return { ok: true, value: (p) => p.totalSpend };
  if (metric === "dissipation") return { ok: true, value: (p) => p.dissipation };
  const m = /^(effort|spend|payoff)\.(\d+)$/.exec(metric);
  const i = m ? Number(m[2]) : -1;
  if (m && i < n) {
    const series = m[1] === "effort" ? "efforts" : m[1] === "spend" ? "spends" : "payoffs";
    return { ok: true, value: (p) => p[series][i] ?? null };
  }
  const err: InputError = {
    ok: false,
    path: "metric",
    message: `must be totalEffort, totalSpend, dissipation, effort.<i>, spend.<i> or payoff.<i> with i < ${n} (got ${metric})`,
  };
  return err;
}

/** Reassembles row-major points (e.g. collected from chunks) into a grid. */
export function assemble2d(
  x: { param: string; values: number[] },
  y: { param: string; values: number[] },
  metric: Sweep2dMetric,
  read: (p: SweepPoint) => number | null,
  points: SweepPoint[],
): Sweep2d {
  const nx = x.values.length;
  const z: (number | null)[][] = [];
  const kinds: EquilibriumKind[][] = [];
  for (let iy = 0; iy < y.values.length; iy++) {
    const row = points.slice(iy * nx, (iy + 1) * nx);
    z.push(row.map(read));
    kinds.push(row.map((p) => p.kind));
  }
  return { x, y, metric, z, kinds };
}

/** Checks both axes and the metric; the result runs in chunks like prepareSweep1d. */
export function prepareSweep2d(
  scenario: Scenario,
  spec: { x: AxisSpec; y: AxisSpec },
  metric: Sweep2dMetric = "totalEffort",
): Parsed<PreparedSweep<Sweep2d>> {
  const x = planAxis(scenario, spec.x, "x", MAX_STEPS_2D);
  if (!x.ok) return x;
  const y = planAxis(scenario, spec.y, "y", MAX_STEPS_2D);
  if (!y.ok) return y;
  if (x.value.param === y.value.param) {
    return { ok: false, path: "y.param", message: `must differ from x.param (${x.value.param})` };
  }
  const read = metricReader(metric, scenario.rivals.length);
  if (!read.ok) return read;
  const plan = plan2d(scenario, x.value, y.value);
  const ax = { param: x.value.param, values: x.value.values };
  const ay = { param: y.value.param, values: y.value.values };
  return {
    ok: true,
    value: prepare(plan, (points) => assemble2d(ax, ay, metric, read.value, points)),
  };
}

export function sweep2d(
  scenario: Scenario,
  spec: { x: AxisSpec; y: AxisSpec },
  metric: Sweep2dMetric = "totalEffort",
  onProgress?: Progress,
): Parsed<Sweep2d> {
  const prepared = prepareSweep2d(scenario, spec, metric);
  return prepared.ok ? { ok: true, value: runPrepared(prepared.value, onProgress) } : prepared;
}
