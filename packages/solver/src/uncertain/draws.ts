/**
 * Drawing scenarios from their ranges and solving each draw with the ordinary solver. Draw d
 * uses its own generator, mulberry32(deriveSeed(seed, d)), taking one uniform number per
 * uncertain parameter in `uncertainParams` order, so draw d is the same whatever the number of
 * draws and can be computed in chunks.
 */
import { normalize } from "../normalize";
import { deriveSeed, mulberry32 } from "../rng";
import { solve } from "../solve";
import type { Contest, Equilibrium, Scenario } from "../types";
import { at, quantile } from "./dist";
import type { Uncertain, UncertainParam, UncertainScenario } from "./types";

/** The scenario with every range at its median (points stay as they are). */
export function medianScenario(s: UncertainScenario): Scenario {
  const med = (x: Uncertain | null | undefined) => (x === undefined || x === null ? x : at(x, 0.5));
  return {
    ...s,
    prize: at(s.prize, 0.5),
    rivals: s.rivals.map((r) => ({
      ...r,
      cost: at(r.cost, 0.5),
      value: med(r.value),
      weight: med(r.weight),
      budget: med(r.budget),
    })),
  };
}

/**
 * Point scenarios built from one base: parameter k set to values[k], every other range at its
 * median. Only the rivals a parameter touches are copied, so a draw costs O(parameters + rivals).
 */
export function pointScenarios(s: UncertainScenario, params: readonly UncertainParam[]) {
  const base = medianScenario(s);
  return (values: ArrayLike<number>): Scenario => {
    const rivals = base.rivals.slice();
    const out: Scenario = { ...base, rivals };
    for (let k = 0; k < params.length; k++) {
      const p = params[k]!;
      if (p.rival === null) out.prize = values[k]!;
      else if (p.field !== "prize") {
        const i = p.rival;
        if (rivals[i] === base.rivals[i]) rivals[i] = { ...rivals[i]! };
        rivals[i]![p.field] = values[k]!;
      }
    }
    return out;
  };
}

/** The point scenario with parameter k set to values[k] and every other range at its median. */
export function scenarioWith(
  s: UncertainScenario,
  params: readonly UncertainParam[],
  values: ArrayLike<number>,
): Scenario {
  return pointScenarios(s, params)(values);
}

/** The parameter values of draw d. */
export function drawValues(
  params: readonly UncertainParam[],
  seed: number,
  d: number,
  out = new Float64Array(params.length),
): Float64Array {
  const rng = mulberry32(deriveSeed(seed, d));
  for (let k = 0; k < params.length; k++) out[k] = quantile(params[k]!.dist, rng());
  return out;
}

export interface SolvedDraw {
  contest: Contest;
  equilibrium: Equilibrium;
}

/** Solves draws one at a time: `drawSolver(s, params, seed)(d)`. */
export function drawSolver(s: UncertainScenario, params: readonly UncertainParam[], seed: number) {
  const point = pointScenarios(s, params);
  const values = new Float64Array(params.length);
  return (d: number): SolvedDraw => {
    const contest = normalize(point(drawValues(params, seed, d, values)));
    // the bands use pure draws only: skip the mixed-equilibrium search of the others
    return { contest, equilibrium: solve(contest, { mixed: false }).equilibrium };
  };
}

export function solveDraw(
  s: UncertainScenario,
  params: readonly UncertainParam[],
  seed: number,
  d: number,
): SolvedDraw {
  return drawSolver(s, params, seed)(d);
}
