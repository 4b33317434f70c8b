"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { assemble1d, MAX_STEPS_1D, plan1d, planAxis } from "@contend/solver";
import type { AxisSpec, Scenario, Sweep1d, SweepPoint } from "@contend/solver";

export type SweepState =
  | { status: "idle" }
  | { status: "running"; done: number; total: number }
  | { status: "done"; sweep: Sweep1d; ms: number }
  | { status: "error"; path: string; message: string };

/** Milliseconds of solver work per slice before yielding to the browser. */
const SLICE_MS = 12;

/**
 * Runs a one-parameter sweep in time slices on the main thread (setTimeout between slices),
 * so typing, scrolling and the progress bar stay responsive on long sweeps. Starting a new
 * sweep cancels the one in flight.
 */
export function useChunkedSweep(scenario: Scenario | null, spec: AxisSpec, auto: boolean) {
  const [state, setState] = useState<SweepState>({ status: "idle" });
  const runId = useRef(0);

  const run = useCallback(() => {
    runId.current += 1;
    const id = runId.current;
    if (scenario === null) {
      setState({ status: "idle" });
      return;
    }
    const axis = planAxis(scenario, spec, "sweep", MAX_STEPS_1D);
    if (!axis.ok) {
      setState({ status: "error", path: axis.path, message: axis.message });
      return;
    }
    const plan = plan1d(scenario, axis.value);
    const names = scenario.rivals.map((r) => r.name);
    const points: SweepPoint[] = [];
    const started = performance.now();
    setState({ status: "running", done: 0, total: plan.count });
    const slice = () => {
      if (id !== runId.current) return;
      const t0 = performance.now();
      try {
        while (points.length < plan.count && performance.now() - t0 < SLICE_MS) {
          points.push(plan.evaluate(points.length));
        }
      } catch (e) {
        setState({
          status: "error",
          path: "sweep",
          message: `solver failed: ${(e as Error).message}`,
        });
        return;
      }
      if (points.length < plan.count) {
        setState({ status: "running", done: points.length, total: plan.count });
        setTimeout(slice, 0);
      } else {
        setState({
          status: "done",
          sweep: assemble1d(axis.value.param, names, points),
          ms: performance.now() - started,
        });
      }
    };
    setTimeout(slice, 0);
  }, [scenario, spec]);

  const cancel = useCallback(() => {
    runId.current += 1;
    setState({ status: "idle" });
  }, []);

  useEffect(() => {
    if (!auto) return;
    const t = setTimeout(run, 250);
    return () => clearTimeout(t);
  }, [auto, run]);

  useEffect(
    () => () => {
      runId.current += 1;
    },
    [],
  );

  return { state, run, cancel };
}
