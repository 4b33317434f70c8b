/**
 * Runs the Monte Carlo of the equilibrium off the page's thread. Messaging through comlink;
 * progress goes back through a proxied callback at most every PROGRESS_MS (each message costs
 * the page a render and a layout), and once at the end. Cancelling is terminating the worker
 * (the page starts a new one for the next run).
 */
import { expose } from "comlink";
import { runUncertain } from "@contend/solver";
import type { UncertainResult, UncertainScenario } from "@contend/solver";

const PROGRESS_EVERY = 250;
const PROGRESS_MS = 100;

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
    let last = 0;
    const throttled = (done: number, total: number) => {
      const now = performance.now();
      if (done < total && now - last < PROGRESS_MS) return;
      last = now;
      onProgress(done, total);
    };
    return runUncertain(scenario, { ...req, onProgress: throttled, progressEvery: PROGRESS_EVERY });
  },
};

export type UncertainWorkerApi = typeof api;

expose(api);
