"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { proxy, wrap, type Remote } from "comlink";
import type {
  FrontsEquilibrium,
  FrontsScenario,
  FrontsSweepPoint,
  FrontsSweepSpec,
} from "@contend/solver";
import type { FrontsWorkerApi } from "../workers/fronts.worker";

interface Live {
  worker: Worker;
  api: Remote<FrontsWorkerApi>;
}

/**
 * One fronts worker at a time for a caller: `start` terminates the job in flight (if any) and
 * returns a fresh worker; `isCurrent` tells a late reply from a job that was replaced.
 */
function useOneWorker() {
  const live = useRef<Live | null>(null);
  const stop = useCallback(() => {
    live.current?.worker.terminate();
    live.current = null;
  }, []);
  useEffect(() => stop, [stop]);
  const start = useCallback((): Live => {
    stop();
    const worker = new Worker(new URL("../workers/fronts.worker.ts", import.meta.url), {
      type: "module",
    });
    const mine: Live = { worker, api: wrap<FrontsWorkerApi>(worker) };
    live.current = mine;
    return mine;
  }, [stop]);
  const isCurrent = useCallback((mine: Live) => live.current === mine, []);
  return { start, stop, isCurrent };
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
  const { start, stop, isCurrent } = useOneWorker();
  useEffect(() => {
    if (!scenario) {
      stop();
      return;
    }
    const mine = start();
    const started = performance.now();
    setState((s) => ({
      status: "solving",
      previous:
        s.status === "done"
          ? { scenario: s.scenario, eq: s.eq }
          : s.status === "solving"
            ? s.previous
            : null,
    }));
    mine.api
      .solve(scenario)
      .then((eq) => {
        if (!isCurrent(mine)) return;
        stop();
        setState({ status: "done", scenario, eq, ms: performance.now() - started });
      })
      .catch((e: unknown) => {
        if (!isCurrent(mine)) return;
        stop();
        setState({ status: "error", message: `solver failed: ${(e as Error).message}` });
      });
  }, [scenario, start, stop, isCurrent]);
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
  const { start, stop, isCurrent } = useOneWorker();
  const run = useCallback(
    (scenario: FrontsScenario, spec: FrontsSweepSpec) => {
      const mine = start();
      setState({ status: "running", done: 0, total: spec.steps });
      const onProgress = proxy((done: number, total: number) => {
        if (isCurrent(mine)) setState({ status: "running", done, total });
      });
      mine.api
        .sweep(scenario, spec, onProgress)
        .then((res) => {
          if (!isCurrent(mine)) return;
          stop();
          setState(
            res.ok
              ? { status: "done", points: res.value, scenario, spec }
              : { status: "error", message: `${res.path}: ${res.message}` },
          );
        })
        .catch((e: unknown) => {
          if (!isCurrent(mine)) return;
          stop();
          setState({ status: "error", message: `solver failed: ${(e as Error).message}` });
        });
    },
    [start, stop, isCurrent],
  );
  const cancel = useCallback(() => {
    stop();
    setState({ status: "idle", cancelled: true });
  }, [stop]);
  return { state, run, cancel };
}
