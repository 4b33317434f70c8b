"use client";

import { useEffect, useState } from "react";
import type { Scenario } from "@contend/solver";
import type { ExplorerAnswer } from "../lib/solveView";
import { startSolving } from "../lib/solveState";
import type { SolveState } from "../lib/solveState";
import type { SweepWorkerApi } from "../workers/sweep.worker";
import { useWorkerJob } from "./useWorkerJob";

function createSweepWorker(): Worker {
  return new Worker(new URL("../workers/sweep.worker.ts", import.meta.url), { type: "module" });
}

/**
 * The explorer's equilibrium and comparative statics, computed in a Web Worker
 * (workers/sweep.worker.ts) with the same calls the page used to make: with three or more rivals in the mixed region a solve takes a
 * fraction of a second or more, which would freeze typing. A newer scenario terminates the
 * solve in flight; the last answer stays on screen, marked as solving, until the new one comes.
 */
export function useExplorerSolve(scenario: Scenario | null): SolveState<ExplorerAnswer> {
  const [state, setState] = useState<SolveState<ExplorerAnswer>>({ status: "idle" });
  const { launch, stop } = useWorkerJob<SweepWorkerApi>(createSweepWorker);
  useEffect(() => {
    if (scenario === null) {
      stop();
      setState({ status: "idle" });
      return;
    }
    setState(startSolving);
    launch(async (api) => api.answer(scenario), {
      done: (value, ms) => setState({ status: "done", value, ms }),
      fail: (message) => setState({ status: "error", message }),
    });
  }, [scenario, launch, stop]);
  return state;
}
