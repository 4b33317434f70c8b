/**
 * Runs the explorer's equilibrium solve and its one-parameter sweep off the page's thread: with three or more rivals in the mixed
 * region each point is a fictitious-play solve of a fraction of a second or more, which would
 * freeze typing and scrolling on the page. Messaging through comlink; progress goes back
 * through a proxied callback at most every PROGRESS_MS and once at the end. Cancelling is
 * terminating the worker (the page starts a new one for the next sweep).
 */
import { expose } from "comlink";
import { assemble1d, MAX_STEPS_1D, plan1d, planAxis } from "@contend/solver";
import type { AxisSpec, Scenario, Sweep1d, SweepPoint } from "@contend/solver";
import { answerForView } from "../lib/solveView";
import type { ExplorerAnswer } from "../lib/solveView";

const PROGRESS_MS = 100;

export type SweepOutcome =
  { ok: true; sweep: Sweep1d } | { ok: false; path: string; message: string };

const api = {
  /** The explorer's equilibrium and comparative statics; plain data for postMessage. */
  answer(scenario: Scenario): ExplorerAnswer {
    return answerForView(scenario);
  },
  run(
    scenario: Scenario,
    spec: AxisSpec,
    onProgress: (done: number, total: number) => void,
  ): SweepOutcome {
    const axis = planAxis(scenario, spec, "sweep", MAX_STEPS_1D);
    if (!axis.ok) return { ok: false, path: axis.path, message: axis.message };
    const plan = plan1d(scenario, axis.value);
    const points: SweepPoint[] = [];
    let last = performance.now();
    for (let k = 0; k < plan.count; k++) {
      points.push(plan.evaluate(k));
      const now = performance.now();
      if (now - last >= PROGRESS_MS) {
        last = now;
        onProgress(k + 1, plan.count);
      }
    }
    const names = scenario.rivals.map((r) => r.name);
    return { ok: true, sweep: assemble1d(axis.value.param, names, points) };
  },
};

export type SweepWorkerApi = typeof api;

expose(api);
