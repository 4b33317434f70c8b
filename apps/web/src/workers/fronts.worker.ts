/**
 * Solves and sweeps fronts scenarios off the page's thread. Messaging through comlink; sweep
 * progress goes back through a proxied callback at most every PROGRESS_MS, and once at the
 * end. Cancelling is terminating the worker (the page starts a new one for the next job).
 */
import { expose } from "comlink";
import { normalizeFronts, solveFronts, sweepFronts } from "@contend/solver";
import type {
  FrontsEquilibrium,
  FrontsScenario,
  FrontsSweepPoint,
  FrontsSweepSpec,
  Parsed,
} from "@contend/solver";

const PROGRESS_MS = 100;

const api = {
  solve(scenario: FrontsScenario): FrontsEquilibrium {
    return solveFronts(normalizeFronts(scenario)).equilibrium;
  },
  sweep(
    scenario: FrontsScenario,
    spec: FrontsSweepSpec,
    onProgress: (done: number, total: number) => void,
  ): Parsed<FrontsSweepPoint[]> {
    let last = 0;
    return sweepFronts(scenario, spec, {
      onProgress: (done, total) => {
        const now = performance.now();
        if (done < total && now - last < PROGRESS_MS) return;
        last = now;
        onProgress(done, total);
      },
    });
  },
};

export type FrontsWorkerApi = typeof api;

expose(api);
