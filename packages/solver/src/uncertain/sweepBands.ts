/**
 * A sweep of a scenario with ranges: at each value of the swept parameter, the Monte Carlo of
 * the equilibrium (`runUncertain`) with that parameter set to the value, summarised as bands
 * (mean, P10, P50, P90 per rival) of effort, spend and payoff. Every point uses the same seed,
 * so the points share their draws (common random numbers) and the bands move smoothly. If the
 * swept parameter itself holds a range, the sweep's value replaces it. Pure and deterministic.
 */
import { parseParamPath, withParam } from "../sweep/params";
import type { Parsed, Scenario } from "../types";
import { runUncertain } from "./monteCarlo";
import type { Band, UncertainScenario } from "./types";

export interface BandPoint {
  x: number;
  /** draws with a pure-strategy equilibrium, the ones the bands summarise */
  pureDraws: number;
  noPureEquilibrium: number;
  efforts: Band;
  spends: Band;
  payoffs: Band;
}

export interface BandSweep {
  param: string;
  draws: number;
  seed: number;
  points: BandPoint[];
}

export interface BandSweepOptions {
  draws: number;
  seed: number;
  /** called after each point with (points done, points in all) */
  onProgress?: (done: number, total: number) => void;
}

export function sweepBands(
  s: UncertainScenario,
  param: string,
  values: readonly number[],
  opts: BandSweepOptions,
): Parsed<BandSweep> {
  // Paths address the same fields in a scenario with ranges; only `csf` and rival count are read.
  const path = parseParamPath(s as unknown as Scenario, param);
  if (!path.ok) return path;
  const points: BandPoint[] = [];
  for (const x of values) {
    const at = withParam(s as unknown as Scenario, path.value, x) as unknown as UncertainScenario;
    const r = runUncertain(at, { draws: opts.draws, seed: opts.seed, sensitivity: false });
    points.push({
      x,
      pureDraws: r.pureDraws,
      noPureEquilibrium: r.noPureEquilibrium,
      efforts: r.efforts,
      spends: r.spends,
      payoffs: r.payoffs,
    });
    opts.onProgress?.(points.length, values.length);
  }
  return { ok: true, value: { param, draws: opts.draws, seed: opts.seed, points } };
}
