"use client";

import { useCallback } from "react";
import type { UncertainResult, UncertainScenario } from "@contend/solver";
import type { UncertainRequest } from "../workers/uncertain.worker";
import { useUncertainWorker } from "./useUncertainWorker";

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

/** The explorer's Monte Carlo of the equilibrium, run in the uncertainty worker. */
export function useUncertainRun() {
  const task = useUncertainWorker<{ result: UncertainResult; scenario: UncertainScenario }>();
  const { start } = task;
  const run = useCallback(
    (scenario: UncertainScenario, req: UncertainRequest) =>
      start(req.draws, async (api, onProgress) => ({
        result: await api.run(scenario, req, onProgress),
        scenario,
      })),
    [start],
  );
  const state: UncertainRunState =
    task.state.status === "done"
      ? { status: "done", ...task.state.value, ms: task.state.ms }
      : task.state;
  return { state, run, cancel: task.cancel };
}
