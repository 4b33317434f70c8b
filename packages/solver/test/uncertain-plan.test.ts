import { describe, expect, it } from "vitest";
import {
  averagePayoff,
  drawValues,
  planDraw,
  ratioAverage,
  runUncertain,
  solveDraw,
  uncertainParams,
  type UncertainScenario,
} from "../src/uncertain";
import fmin from "./fminLoader";

const V = 100;
const N = 400;
const SEED = 2024;

/** Two rivals, r = 1, common value; the planner's rival has a cost uniform on [1, 3]. */
const twoRivals = (): UncertainScenario => ({
  title: "Plan against one unknown cost",
  prize: V,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "Planner", cost: 1 },
    { name: "Other", cost: { dist: "uniform", low: 1, high: 3 } },
  ],
});

describe("robust plan", () => {
  const s = twoRivals();
  const res = runUncertain(s, { draws: N, seed: SEED, planRival: 0 });
  const plan = res.plan!;
  const params = uncertainParams(s);
  // The other's cost in each draw (the sampler is not what is under test here).
  const c2s = Array.from({ length: N }, (_, d) => drawValues(params, SEED, d)[0]!);
  // Its equilibrium effort in that draw, Hillman & Riley 1989: e2 = v c1 / (c1 + c2)^2 (c1 = 1).
  const e2s = c2s.map((c2) => V / (1 + c2) ** 2);
  // The planner's payoff with spend x against e2 (cost 1, so effort = spend): v x/(x+e2) - x.
  const pay = (x: number, e2: number) => (x + e2 > 0 ? (V * x) / (x + e2) : V / 2) - x;
  const average = (x: number) => e2s.reduce((t, e2) => t + pay(x, e2), 0) / N;

  it("runUncertain(--plan) spend matches a Nelder-Mead maximisation (fmin) of the sample-average payoff", () => {
    const nm = fmin.nelderMead((z) => -average(Math.abs(z[0]!)), [10], {
      maxIterations: 2000,
      minErrorDelta: 1e-14,
    });
    const nmSpend = Math.abs(nm.x[0]!);
    expect(plan.drawsUsed).toBe(N);
    expect(Math.abs(plan.spend - nmSpend)).toBeLessThan(1e-3);
    expect(plan.expectedPayoff).toBeCloseTo(average(plan.spend), 9);
    expect(plan.expectedPayoff).toBeGreaterThanOrEqual(average(nmSpend) - 1e-9 * V);
  });

  it("runUncertain(--plan) regret is >= 0 in every draw and equals the gap to the closed-form best reply", () => {
    // Tullock 1980 best reply, r = 1: e = max(0, sqrt(v Z / m) - Z) with Z the other's effort.
    const br = e2s.map((z) => Math.max(0, Math.sqrt(V * z) - z));
    plan.regretByDraw.forEach((reg, d) => {
      expect(reg).toBeGreaterThanOrEqual(-1e-9 * V); // floating-point round-off only
      expect(reg).toBeCloseTo(pay(br[d]!, e2s[d]!) - pay(plan.spend, e2s[d]!), 9);
    });
    const mean = plan.regretByDraw.reduce((a, b) => a + b, 0) / N;
    expect(plan.meanRegret).toBeCloseTo(mean, 12);
    expect(plan.meanRegret).toBeGreaterThan(0);
  });

  it("runUncertain(--plan) compares with the median scenario's equilibrium spend", () => {
    // median c2 = 2: e1 = v c2 / (c1 + c2)^2 = 200 / 9 (Hillman & Riley 1989), cost 1
    expect(plan.equilibriumSpendAtMedians).toBeCloseTo(200 / 9, 9);
    const m = plan.atMedianEquilibrium!;
    expect(m.expectedPayoff).toBeCloseTo(average(200 / 9), 9);
    expect(plan.expectedPayoff).toBeGreaterThanOrEqual(m.expectedPayoff);
  });
});

describe("robust plan with budgets, own uncertainty and r < 1", () => {
  // The planner's own cost and budget are ranges too; r = 0.7 goes through the share-function
  // method, and a budget that binds in some draws makes the average payoff non-concave.
  const s: UncertainScenario = {
    title: "Capped planner",
    prize: 100,
    csf: { kind: "ratio", decisiveness: 0.7 },
    rivals: [
      {
        name: "Planner",
        cost: { dist: "triangular", low: 0.8, mode: 1, high: 1.5 },
        budget: { dist: "uniform", low: 5, high: 40 },
      },
      { name: "B", cost: { dist: "uniform", low: 0.5, high: 2 }, weight: 1.2 },
      { name: "C", cost: 1.5, value: { dist: "uniform", low: 60, high: 140 } },
    ],
  };
  const n = 300;
  const res = runUncertain(s, { draws: n, seed: 77, planRival: 0 });
  const params = uncertainParams(s);

  it("runUncertain(--plan) beats every spend of an exhaustive grid search on the sample average", () => {
    // Independent evaluation: in each draw, own effort = min(spend, budget) / cost and share
    // w e^r / (w e^r + Z), Z = sum over the others of w_j e_j^r from the draw's equilibrium.
    const draws = Array.from({ length: n }, (_, d) => solveDraw(s, params, 77, d));
    const avg = (x: number) => {
      let t = 0;
      for (const { contest, equilibrium } of draws) {
        const [me, ...others] = contest.rivals;
        const z = others.reduce(
          (acc, rv, j) => acc + rv.weight * equilibrium.efforts![j + 1]! ** rv.r,
          0,
        );
        const spend = Math.min(x, me!.maxSpend);
        const y = me!.weight * (spend / me!.cost) ** me!.r;
        t += (me!.value * y) / (y + z) - spend;
      }
      return t / n;
    };
    let bestX = 0;
    let bestF = avg(0);
    for (let k = 1; k <= 10_000; k++) {
      const x = (100 * k) / 10_000;
      const f = avg(x);
      if (f > bestF) [bestX, bestF] = [x, f];
    }
    const plan = res.plan!;
    expect(res.noPureEquilibrium).toBe(0);
    expect(plan.expectedPayoff).toBeCloseTo(avg(plan.spend), 9);
    expect(plan.expectedPayoff).toBeGreaterThanOrEqual(bestF - 1e-9 * 100);
    expect(Math.abs(plan.spend - bestX)).toBeLessThan(0.05);
  });

  it("ratioAverage (the fast loop) equals averagePayoff (payoffAgainst per draw)", () => {
    const draws = Array.from({ length: 50 }, (_, d) => {
      const { contest, equilibrium } = solveDraw(s, params, 77, d);
      return planDraw(contest, 0, equilibrium.efforts!);
    });
    const fast = ratioAverage(draws, 0);
    for (const x of [0, 0.5, 3, 12.25, 27, 39.9, 80]) {
      expect(fast(x)).toBeCloseTo(averagePayoff(draws, 0, x), 10);
    }
  });

  it("runUncertain(--plan) regret is >= 0 in every draw", () => {
    const regrets = res.plan!.regretByDraw;
    expect(regrets).toHaveLength(n);
    for (const r of regrets) expect(r).toBeGreaterThanOrEqual(-1e-9 * 100);
    expect(Math.max(...regrets)).toBeGreaterThan(0);
  });
});
