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
import type { UncertainParam, UncertainScenario } from "./types";

/** The point scenario with parameter k set to values[k] and every other range at quantile q. */
export function scenarioWith(
  s: UncertainScenario,
  params: readonly UncertainParam[],
  values: ArrayLike<number>,
): Scenario {
  const rivals = s.rivals.map((r) => ({
    ...r,
    cost: at(r.cost, 0.5),
    value: r.value === undefined || r.value === null ? r.value : at(r.value, 0.5),
    weight: r.weight === undefined || r.weight === null ? r.weight : at(r.weight, 0.5),
    budget: r.budget === undefined || r.budget === null ? r.budget : at(r.budget, 0.5),
  }));
  const out: Scenario = { ...s, prize: at(s.prize, 0.5), rivals };
  params.forEach((p, k) => {
    const x = values[k]!;
    if (p.rival === null) out.prize = x;
    else if (p.field !== "prize") rivals[p.rival]![p.field] = x;
  });
  return out;
}

/** Every parameter at quantile q (q = 0.5: the median scenario). */
export function scenarioAtQuantile(
  s: UncertainScenario,
  params: readonly UncertainParam[],
  q: number,
): Scenario {
  return scenarioWith(
    s,
    params,
    params.map((p) => quantile(p.dist, q)),
  );
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

export function solveDraw(
  s: UncertainScenario,
  params: readonly UncertainParam[],
  seed: number,
  d: number,
): SolvedDraw {
  const contest = normalize(scenarioWith(s, params, drawValues(params, seed, d)));
  return { contest, equilibrium: solve(contest).equilibrium };
}
