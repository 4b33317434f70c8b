"use client";

import { useCallback, useEffect, useState } from "react";
import { MAX_STEPS_1D, planAxis } from "@contend/solver";
import type { AxisSpec, Scenario, Sweep1d } from "@contend/solver";
import type { SweepWorkerApi } from "../workers/sweep.worker";
import { useWorkerJob } from "./useWorkerJob";

export type SweepState =
  | { status: "idle" }
  | { status: "running"; done: number; total: number }
  | { status: "done"; sweep: Sweep1d; ms: number }
  | { status: "error"; path: string; message: string };

function createSweepWorker(): Worker {
  return new Worker(new URL("../workers/sweep.worker.ts", import.meta.url), { type: "module" });
}

/**
 * Runs a one-parameter sweep in a Web Worker (workers/sweep.worker.ts), so typing, scrolling
 * and the progress bar stay responsive even when each point is a mixed-equilibrium solve of a
 * second. The axis is checked here first, so a bad field is named at once. Starting a new
 * sweep, cancelling or leaving the page terminates the worker in flight.
 */
export function useSweepWorker(scenario: Scenario | null, spec: AxisSpec, auto: boolean) {
  const [state, setState] = useState<SweepState>({ status: "idle" });
  const { launch, stop } = useWorkerJob<SweepWorkerApi>(createSweepWorker);

  const run = useCallback(() => {
    stop();
    if (scenario === null) {
      setState({ status: "idle" });
      return;
    }
    const axis = planAxis(scenario, spec, "sweep", MAX_STEPS_1D);
    if (!axis.ok) {
      setState({ status: "error", path: axis.path, message: axis.message });
      return;
    }
    setState({ status: "running", done: 0, total: axis.value.values.length });
    launch(async (api, onProgress) => api.run(scenario, spec, onProgress), {
      progress: (done, total) => setState({ status: "running", done, total }),
      done: (out, ms) =>
        setState(
          out.ok
            ? { status: "done", sweep: out.sweep, ms }
            : { status: "error", path: out.path, message: out.message },
        ),
      fail: (message) => setState({ status: "error", path: "sweep", message }),
    });
  }, [scenario, spec, launch, stop]);

  const cancel = useCallback(() => {
    stop();
    setState({ status: "idle" });
  }, [stop]);

  useEffect(() => {
    if (!auto) return;
    const t = setTimeout(run, 250);
    return () => clearTimeout(t);
  }, [auto, run]);

  return { state, run, cancel };
}
