"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { proxy, wrap, type Remote } from "comlink";
import type { UncertainResult, UncertainScenario } from "@contend/solver";
import type { UncertainRequest, UncertainWorkerApi } from "../workers/uncertain.worker";

export type UncertainRunState =
  | { status: "idle"; cancelled?: boolean }
  | { status: "running"; done: number; total: number }
  | {
      status: "done";
      result: UncertainResult;
      scenario: UncertainScenario;
      ms: number;
    }
  | { status: "error"; message: string };

interface Live {
  worker: Worker;
  api: Remote<UncertainWorkerApi>;
}

/**
 * Monte Carlo runs in a Web Worker: the page only receives progress messages and the summary,
 * so it stays responsive. Starting a run while one is going, cancelling, or leaving the page
 * terminates the worker in flight.
 */
export function useUncertainRun() {
  const [state, setState] = useState<UncertainRunState>({ status: "idle" });
  const live = useRef<Live | null>(null);

  const stop = useCallback(() => {
    live.current?.worker.terminate();
    live.current = null;
  }, []);

  useEffect(() => stop, [stop]);

  const run = useCallback(
    (scenario: UncertainScenario, req: UncertainRequest) => {
      stop();
      const worker = new Worker(new URL("../workers/uncertain.worker.ts", import.meta.url), {
        type: "module",
      });
      const mine: Live = { worker, api: wrap<UncertainWorkerApi>(worker) };
      live.current = mine;
      const started = performance.now();
      setState({ status: "running", done: 0, total: req.draws });
      const onProgress = proxy((done: number, total: number) => {
        if (live.current === mine) setState({ status: "running", done, total });
      });
      mine.api
        .run(scenario, req, onProgress)
        .then((result) => {
          if (live.current !== mine) return;
          stop();
          setState({ status: "done", result, scenario, ms: performance.now() - started });
        })
        .catch((e: unknown) => {
          if (live.current !== mine) return;
          stop();
          setState({ status: "error", message: `solver failed: ${(e as Error).message}` });
        });
    },
    [stop],
  );

  const cancel = useCallback(() => {
    stop();
    setState({ status: "idle", cancelled: true });
  }, [stop]);

  return { state, run, cancel };
}
