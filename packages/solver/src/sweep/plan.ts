/**
 * Sweeps as plans: a plan knows how many points it has and how to evaluate point k, so long
 * sweeps can run in chunks (e.g. inside a Web Worker that posts progress between chunks).
 */
import type { InputError, Parsed, Scenario } from "../types";
import { validateScenario } from "../validate";
import { formatParamPath, parseParamPath, withParam, type ParamPath } from "./params";
import { solvePoint, type SweepPoint } from "./point";

export interface AxisSpec {
  /** parameter path, e.g. "rivals.1.cost" */
  param: string;
  from: number;
  to: number;
  /** number of points, from and to included */
  steps: number;
}

export interface Axis {
  param: string;
  path: ParamPath;
  values: number[];
}

export interface SweepPlan {
  count: number;
  evaluate(k: number): SweepPoint;
}

export const MAX_STEPS_1D = 100_000;
export const MAX_STEPS_2D = 1_000;

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

export function linspace(from: number, to: number, steps: number): number[] {
  if (steps === 1) return [from];
  const out = new Array<number>(steps);
  for (let k = 0; k < steps; k++)
    out[k] = k === steps - 1 ? to : from + ((to - from) * k) / (steps - 1);
  return out;
}

/**
 * Checks an axis against the scenario. Every parameter's valid range is an interval, so a
 * sweep is valid when both endpoints give valid scenarios.
 */
export function planAxis(
  scenario: Scenario,
  spec: AxisSpec,
  name: string,
  maxSteps: number,
): Parsed<Axis> {
  const p = parseParamPath(scenario, spec.param);
  if (!p.ok) return { ...p, path: `${name}.param`, message: `${spec.param}: ${p.message}` };
  for (const key of ["from", "to"] as const) {
    if (typeof spec[key] !== "number" || !Number.isFinite(spec[key])) {
      return fail(`${name}.${key}`, `must be a finite number (got ${String(spec[key])})`);
    }
    const check = validateScenario(withParam(scenario, p.value, spec[key]));
    if (!check.ok) return fail(`${name}.${key}`, `${check.path}: ${check.message}`);
  }
  if (!Number.isInteger(spec.steps) || spec.steps < 1 || spec.steps > maxSteps) {
    return fail(
      `${name}.steps`,
      `must be a whole number from 1 to ${maxSteps} (got ${spec.steps})`,
    );
  }
  return {
    ok: true,
    value: {
      param: formatParamPath(p.value),
      path: p.value,
      values: linspace(spec.from, spec.to, spec.steps),
    },
  };
}

export function plan1d(scenario: Scenario, axis: Axis): SweepPlan {
  return {
    count: axis.values.length,
    evaluate(k) {
      const v = axis.values[k] as number;
      return solvePoint(withParam(scenario, axis.path, v), v);
    },
  };
}

/** Row-major over y: point k is (x = k % nx, y = floor(k / nx)). */
export function plan2d(scenario: Scenario, x: Axis, y: Axis): SweepPlan {
  const nx = x.values.length;
  return {
    count: nx * y.values.length,
    evaluate(k) {
      const xv = x.values[k % nx] as number;
      const yv = y.values[Math.floor(k / nx)] as number;
      return solvePoint(withParam(withParam(scenario, y.path, yv), x.path, xv), xv);
    },
  };
}

/** Evaluates points start..end-1 (clamped to the plan). */
export function sweepChunk(plan: SweepPlan, start: number, end: number): SweepPoint[] {
  const lo = Math.max(0, Math.floor(start));
  const hi = Math.min(plan.count, Math.floor(end));
  const out: SweepPoint[] = [];
  for (let k = lo; k < hi; k++) out.push(plan.evaluate(k));
  return out;
}

export type Progress = (done: number, total: number) => void;

/**
 * A checked sweep ready to run in pieces: `chunk(start, end)` evaluates points start..end-1 and
 * `finish(points)` turns all points, in order, into the result. For Web Workers with progress.
 */
export interface PreparedSweep<T> {
  count: number;
  chunk(start: number, end: number): SweepPoint[];
  finish(points: SweepPoint[]): T;
}

export function prepare<T>(plan: SweepPlan, finish: (points: SweepPoint[]) => T): PreparedSweep<T> {
  return { count: plan.count, chunk: (start, end) => sweepChunk(plan, start, end), finish };
}

/** Runs a prepared sweep synchronously in chunks, reporting progress after each chunk. */
export function runPrepared<T>(sweep: PreparedSweep<T>, onProgress?: Progress, chunk = 256): T {
  const out: SweepPoint[] = [];
  for (let start = 0; start < sweep.count; start += chunk) {
    for (const p of sweep.chunk(start, start + chunk)) out.push(p);
    onProgress?.(out.length, sweep.count);
  }
  return sweep.finish(out);
}
