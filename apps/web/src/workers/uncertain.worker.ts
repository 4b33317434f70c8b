/**
 * Runs the Monte Carlo of the equilibrium off the page's thread. Messaging through comlink;
 * progress goes back through a proxied callback every PROGRESS_EVERY draws. Cancelling is
 * terminating the worker (the page starts a new one for the next run).
 */
import { expose } from "comlink";
import { runUncertain } from "@contend/solver";
import type { UncertainResult, UncertainScenario } from "@contend/solver";

const PROGRESS_EVERY = 250;

export interface UncertainRequest {
  draws: number;
  seed: number;
  planRival: number | null;
}

const api = {
  run(
    scenario: UncertainScenario,
    req: UncertainRequest,
    onProgress: (done: number, total: number) => void,
  ): UncertainResult {
    return runUncertain(scenario, { ...req, onProgress, progressEvery: PROGRESS_EVERY });
  },
};

export type UncertainWorkerApi = typeof api;

expose(api);
