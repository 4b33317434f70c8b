"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { proxy, wrap, type Remote } from "comlink";
import { MAX_STEPS_1D, planAxis } from "@contend/solver";
import type { AxisSpec, Scenario, Sweep1d } from "@contend/solver";
import type { SweepWorkerApi } from "../workers/sweep.worker";

export type SweepState =
  | { status: "idle" }
  | { status: "running"; done: number; total: number }
  | { status: "done"; sweep: Sweep1d; ms: number }
  | { status: "error"; path: string; message: string };

interface Live {
  worker: Worker;
  api: Remote<SweepWorkerApi>;
}

/**
 * Runs a one-parameter sweep in a Web Worker (workers/sweep.worker.ts), so typing, scrolling
 * and the progress bar stay responsive even when each point is a mixed-equilibrium solve of a
 * second. The axis is checked here first, so a bad field is named at once. Starting a new
 * sweep, cancelling or leaving the page terminates the worker in flight.
 */
export function useSweepWorker(scenario: Scenario | null, spec: AxisSpec, auto: boolean) {
  const [state, setState] = useState<SweepState>({ status: "idle" });
  const live = useRef<Live | null>(null);

  const stop = useCallback(() => {
    live.current?.worker.terminate();
    live.current = null;
  }, []);

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
    const worker = new Worker(new URL("../workers/sweep.worker.ts", import.meta.url), {
      type: "module",
    });
    const mine: Live = { worker, api: wrap<SweepWorkerApi>(worker) };
    live.current = mine;
    const started = performance.now();
    setState({ status: "running", done: 0, total: axis.value.values.length });
    const onProgress = proxy((done: number, total: number) => {
      if (live.current === mine) setState({ status: "running", done, total });
    });
    mine.api
      .run(scenario, spec, onProgress)
      .then((out) => {
        if (live.current !== mine) return;
        stop();
        setState(
          out.ok
            ? { status: "done", sweep: out.sweep, ms: performance.now() - started }
            : { status: "error", path: out.path, message: out.message },
        );
      })
      .catch((e: unknown) => {
        if (live.current !== mine) return;
        stop();
        setState({
          status: "error",
          path: "sweep",
          message: `solver failed: ${(e as Error).message}`,
        });
      });
  }, [scenario, spec, stop]);

  const cancel = useCallback(() => {
    stop();
    setState({ status: "idle" });
  }, [stop]);

  useEffect(() => {
    if (!auto) return;
    const t = setTimeout(run, 250);
    return () => clearTimeout(t);
  }, [auto, run]);

  useEffect(() => stop, [stop]);

  return { state, run, cancel };
}
