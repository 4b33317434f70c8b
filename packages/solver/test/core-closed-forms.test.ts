// Closed-form equilibria checked against the share-function method and against an independent
// Nelder-Mead (fmin) best-response iteration. Journal volume numbers are quoted from memory.
import { describe, expect, test } from "vitest";
import {
  hillmanRileyEquilibrium,
  normalize,
  ntiEffort,
  ntiTwoRival,
  shareFunctionEquilibrium,
  solve,
  symmetricRatioEquilibrium,
} from "../src/index";
import type { CsfSpec, RivalSpec } from "../src/types";
import { maxRelDiff, refEquilibrium, refGap } from "./reference";

const contest = (
  rivals: RivalSpec[],
  csf: CsfSpec = { kind: "ratio", decisiveness: 1 },
  prize = 100,
) => normalize({ title: "test", prize, csf, rivals });

/** The share-function solution, failing the test with the method's own message otherwise. */
const solvedByShares = (c: ReturnType<typeof normalize>) => {
  const sol = shareFunctionEquilibrium(c);
  if (!sol.ok) throw new Error(`share-function: ${sol.message}`);
  return sol;
};

describe("symmetric ratio contest (Tullock 1980)", () => {
  test("symmetricRatioEquilibrium(n=4, v=100, m=2, r=0.8) gives e* = r v (n-1)/(m n^2) = 7.5", () => {
    const c = contest(
      [1, 2, 3, 4].map((k) => ({ name: `r${k}`, cost: 2 })),
      { kind: "ratio", decisiveness: 0.8 },
    );
    const e = symmetricRatioEquilibrium(c)!;
    expect(e).toHaveLength(4);
    for (const x of e) expect(x).toBeCloseTo((0.8 * 100 * 3) / (2 * 16), 12);
    expect(maxRelDiff(e, solvedByShares(c).efforts)).toBeLessThan(1e-10);
    expect(maxRelDiff(e, refEquilibrium(c))).toBeLessThan(1e-5);
    expect(solve(c).equilibrium.method).toBe("closed-form:symmetric");
    // dissipation r (n-1)/n
    expect(solve(c).equilibrium.dissipation).toBeCloseTo(0.8 * 0.75, 12);
  });
});

describe("Hillman & Riley 1989 / Stein 2002 active set, r = 1", () => {
  test("hillmanRileyEquilibrium(two rivals, common v) gives e_1 = v m_2/(m_1+m_2)^2", () => {
    const c = contest([
      { name: "a", cost: 1 },
      { name: "b", cost: 3 },
    ]);
    const e = hillmanRileyEquilibrium(c)!;
    expect(e[0]).toBeCloseTo((100 * 3) / 16, 12);
    expect(e[1]).toBeCloseTo((100 * 1) / 16, 12);
  });

  test("hillmanRileyEquilibrium(five rivals, costs/values/weights) matches share function and fmin iteration", () => {
    const c = contest([
      { name: "a", cost: 1, value: 120 },
      { name: "b", cost: 1.4, weight: 1.5 },
      { name: "c", cost: 1.2, value: 90 },
      { name: "d", cost: 1.1, weight: 0.8 },
      { name: "e", cost: 9 },
    ]);
    const e = hillmanRileyEquilibrium(c)!;
    expect(e[4]).toBe(0); // a_e = 0.09 is above the cut-off (about 0.0149): it stays out
    expect(e.slice(0, 4).every((x) => x > 0)).toBe(true);
    expect(maxRelDiff(e, solvedByShares(c).efforts)).toBeLessThan(1e-10);
    const ref = refEquilibrium(c);
    expect(maxRelDiff(e, ref, 1e-3)).toBeLessThan(1e-5);
    expect(refGap(c, e)).toBeLessThan(1e-8);
  });
});

describe("Nti 1999 two rivals, r <= 1, different values", () => {
  test("ntiEffort(v1=100, v2=50, r=0.5) matches the unit-cost formula and fmin iteration", () => {
    const c = contest(
      [
        { name: "a", cost: 1, value: 100 },
        { name: "b", cost: 1, value: 50 },
      ],
      { kind: "ratio", decisiveness: 0.5 },
    );
    const r = 0.5;
    const d = Math.sqrt(100) + Math.sqrt(50);
    const e1 = (r * Math.pow(100, 1.5) * Math.sqrt(50)) / (d * d);
    expect(ntiEffort(100, 50, r)).toBeCloseTo(e1, 12);
    const e = ntiTwoRival(c)!;
    expect(e[0]).toBeCloseTo(e1, 12);
    expect(maxRelDiff(e, refEquilibrium(c))).toBeLessThan(1e-5);
  });

  test("ntiTwoRival with costs and weights (rescaled V_i = v_i w_i^(1/r)/m_i) matches share function and fmin", () => {
    const c = contest(
      [
        { name: "a", cost: 1.5, value: 80, weight: 2 },
        { name: "b", cost: 0.7, value: 60, weight: 0.6 },
      ],
      { kind: "ratio", decisiveness: 0.7 },
    );
    const e = ntiTwoRival(c)!;
    expect(maxRelDiff(e, solvedByShares(c).efforts)).toBeLessThan(1e-10);
    expect(maxRelDiff(e, refEquilibrium(c))).toBeLessThan(1e-5);
    expect(refGap(c, e)).toBeLessThan(1e-8);
  });

  test("ntiTwoRival with r = 1 and common v reduces to v m_2/(m_1+m_2)^2 (Hillman & Riley 1989)", () => {
    const c = contest([
      { name: "a", cost: 2 },
      { name: "b", cost: 5 },
    ]);
    const e = ntiTwoRival(c)!;
    expect(e[0]).toBeCloseTo((100 * 5) / 49, 12);
    expect(e[1]).toBeCloseTo((100 * 2) / 49, 12);
  });
});

describe("share-function method (Cornes & Hartley 2005), r_i <= 1, budgets", () => {
  test("shareFunctionEquilibrium(mixed r_i, values, weights, one budget) has zero reference gap", () => {
    const c = contest([
      { name: "a", cost: 1, decisiveness: 0.4, budget: 1 },
      { name: "b", cost: 2, weight: 2, value: 140 },
      { name: "c", cost: 1.5, decisiveness: 0.8 },
      { name: "d", cost: 0.9, decisiveness: 0.6, value: 60 },
    ]);
    const sol = solvedByShares(c);
    expect(sol.capped).toEqual([true, false, false, false]);
    expect(sol.efforts[0]).toBe(1);
    expect(refGap(c, sol.efforts)).toBeLessThan(1e-8);
    const ref = refEquilibrium(c);
    expect(maxRelDiff(sol.efforts, ref)).toBeLessThan(1e-5);
  });
});
