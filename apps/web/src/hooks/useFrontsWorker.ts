"use client";

import { useCallback, useEffect, useState } from "react";
import type {
  FrontsEquilibrium,
  FrontsScenario,
  FrontsSweepPoint,
  FrontsSweepSpec,
} from "@contend/solver";
import type { FrontsWorkerApi } from "../workers/fronts.worker";
import { useWorkerJob } from "./useWorkerJob";

function createFrontsWorker(): Worker {
  return new Worker(new URL("../workers/fronts.worker.ts", import.meta.url), { type: "module" });
}

export type FrontsSolveState =
  | { status: "idle" }
  | { status: "solving"; previous: { scenario: FrontsScenario; eq: FrontsEquilibrium } | null }
  | { status: "done"; scenario: FrontsScenario; eq: FrontsEquilibrium; ms: number }
  | { status: "error"; message: string };

/**
 * The equilibrium of `scenario`, solved in a Web Worker so typing never waits for it. A new
 * scenario while one is being solved terminates that solve; the last answer stays on screen
 * (marked as solving) until the new one arrives.
 */
export function useFrontsSolve(scenario: FrontsScenario | null): FrontsSolveState {
  const [state, setState] = useState<FrontsSolveState>({ status: "idle" });
  const { launch, stop } = useWorkerJob<FrontsWorkerApi>(createFrontsWorker);
  useEffect(() => {
    if (!scenario) {
      stop();
      return;
    }
    setState((s) => ({
      status: "solving",
      previous:
        s.status === "done"
          ? { scenario: s.scenario, eq: s.eq }
          : s.status === "solving"
            ? s.previous
            : null,
    }));
    launch((api) => api.solve(scenario), {
      done: (eq, ms) => setState({ status: "done", scenario, eq, ms }),
      fail: (message) => setState({ status: "error", message }),
    });
  }, [scenario, launch, stop]);
  return state;
}

export type FrontsSweepState =
  | { status: "idle"; cancelled?: boolean }
  | { status: "running"; done: number; total: number }
  | { status: "done"; points: FrontsSweepPoint[]; scenario: FrontsScenario; spec: FrontsSweepSpec }
  | { status: "error"; message: string };

/** A sweep in a Web Worker with progress; cancelling (or a new run) terminates it. */
export function useFrontsSweepRun() {
  const [state, setState] = useState<FrontsSweepState>({ status: "idle" });
  const { launch, stop } = useWorkerJob<FrontsWorkerApi>(createFrontsWorker);
  const run = useCallback(
    (scenario: FrontsScenario, spec: FrontsSweepSpec) => {
      setState({ status: "running", done: 0, total: spec.steps });
      launch(async (api, onProgress) => api.sweep(scenario, spec, onProgress), {
        progress: (done, total) => setState({ status: "running", done, total }),
        done: (res) =>
          setState(
            res.ok
              ? { status: "done", points: res.value, scenario, spec }
              : { status: "error", message: `${res.path}: ${res.message}` },
          ),
        fail: (message) => setState({ status: "error", message }),
      });
    },
    [launch],
  );
  const cancel = useCallback(() => {
    stop();
    setState({ status: "idle", cancelled: true });
  }, [stop]);
  return { state, run, cancel };
}
