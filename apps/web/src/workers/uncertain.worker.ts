/**
 * Runs the Monte Carlo of the equilibrium off the page's thread. Messaging through comlink;
 * progress goes back through a proxied callback at most every PROGRESS_MS (each message costs
 * the page a render and a layout), and once at the end. Cancelling is terminating the worker
 * (the page starts a new one for the next run).
 */
import { expose } from "comlink";
import { runUncertain, sweepBands } from "@contend/solver";
import type { BandSweep, Parsed, UncertainResult, UncertainScenario } from "@contend/solver";

const PROGRESS_EVERY = 250;
const PROGRESS_MS = 100;

export interface UncertainRequest {
  draws: number;
  seed: number;
  planRival: number | null;
}

/** A sweep with bands: the swept parameter's path and values, draws per value. */
export interface BandSweepRequest {
  param: string;
  values: number[];
  draws: number;
  seed: number;
}

type OnProgress = (done: number, total: number) => void;

/** Passes on the final call and at most one call per PROGRESS_MS before it. */
function throttle(onProgress: OnProgress): OnProgress {
  let last = 0;
  return (done, total) => {
    const now = performance.now();
    if (done < total && now - last < PROGRESS_MS) return;
    last = now;
    onProgress(done, total);
  };
}

const api = {
  run(scenario: UncertainScenario, req: UncertainRequest, onProgress: OnProgress): UncertainResult {
    return runUncertain(scenario, {
      ...req,
      onProgress: throttle(onProgress),
      progressEvery: PROGRESS_EVERY,
    });
  },
  sweep(
    scenario: UncertainScenario,
    req: BandSweepRequest,
    onProgress: OnProgress,
  ): Parsed<BandSweep> {
    const { param, values, ...opts } = req;
    return sweepBands(scenario, param, values, { ...opts, onProgress: throttle(onProgress) });
  },
};

export type UncertainWorkerApi = typeof api;

expose(api);
