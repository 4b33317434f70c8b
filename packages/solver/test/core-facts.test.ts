// Facts of the trade the solver must reproduce. Sources: Tullock 1980; Baye, Kovenock &
// de Vries 1994 (Public Choice 81); Hillman & Riley 1989 (Economics & Politics 1); Che & Gale
// 1997 (Public Choice 92); Alcalde & Dahm 2010 (Journal of Public Economics 94). Volume
// numbers from memory. Independent checks use Nelder-Mead (fmin) best responses.
import { describe, expect, test } from "vitest";
import { bestResponse, nashGap, normalize, solve, symmetricRatioEffort } from "../src/index";
import type { RivalSpec } from "../src/types";
import { refBestResponse, refGap } from "./reference";

const contest = (rivals: RivalSpec[], r = 1, prize = 100) =>
  normalize({ title: "test", prize, csf: { kind: "ratio", decisiveness: r }, rivals });
const identical = (n: number, r: number, cost = 1) =>
  contest(
    Array.from({ length: n }, (_, k) => ({ name: `r${k}`, cost })),
    r,
  );

describe("existence bound r <= n/(n-1) (Baye, Kovenock & de Vries 1994)", () => {
  test("solve(n=3, r=1.6): the symmetric profile fails, three two-active equilibria are found", () => {
    const c = identical(3, 1.6);
    const sym = new Array(3).fill(symmetricRatioEffort(3, 100, 1, 1.6));
    expect(nashGap(c, sym)).toBeGreaterThan(1); // spending nothing beats 100/3 - 35.6 < 0
    expect(refGap(c, sym)).toBeGreaterThan(1);
    const res = solve(c);
    const all = [res.equilibrium, ...res.alternatives];
    expect(all).toHaveLength(3);
    for (const eq of all) {
      expect(eq.kind).toBe("pure");
      expect(eq.active.filter(Boolean)).toHaveLength(2);
      // the active pair plays the two-rival symmetric profile r v/(4 m) = 40
      for (const e of eq.efforts!) if (e > 0) expect(e).toBeCloseTo(40, 9);
      expect(eq.nashGap).toBeLessThan(1e-6);
      expect(refGap(c, eq.efforts!)).toBeLessThan(1e-6);
    }
    expect(res.equilibrium.note).toMatch(/n\/\(n-1\)/);
  });

  test("solve(n=3, r=1.4): the symmetric equilibrium coexists with two-active ones", () => {
    const res = solve(identical(3, 1.4));
    expect(res.equilibrium.active).toEqual([true, true, true]);
    expect(res.equilibrium.efforts![0]).toBeCloseTo(symmetricRatioEffort(3, 100, 1, 1.4), 9);
    expect(res.alternatives).toHaveLength(3);
  });

  test("solve(n=3, r=2.5) reports no pure equilibrium, citing the mixed one (Alcalde & Dahm 2010)", () => {
    const c = identical(3, 2.5);
    const eq = solve(c).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.efforts).toBeNull();
    expect(eq.note).toMatch(/Alcalde & Dahm 2010/);
    // independent check of the nearest candidate: two rivals at r v/(4m) lose money
    expect(refGap(c, [62.5, 62.5, 0])).toBeGreaterThan(1);
  });

  test("solve(n=2, r=2) still has the symmetric pure equilibrium r v/(4m) at the bound", () => {
    const eq = solve(identical(2, 2)).equilibrium;
    expect(eq.kind).toBe("pure");
    expect(eq.efforts![0]).toBeCloseTo(50, 9);
    expect(eq.dissipation).toBeCloseTo(1, 9);
  });
});

describe("number of rivals (Tullock 1980, r = 1)", () => {
  test("solve(n identical) total effort rises towards v/m while individual effort falls", () => {
    let prevTotal = 0;
    let prevEach = Infinity;
    for (const n of [2, 3, 5, 10, 20, 50, 200]) {
      const eq = solve(identical(n, 1, 2)).equilibrium;
      expect(eq.totalEffort).toBeCloseTo((100 * (n - 1)) / (2 * n), 9);
      expect(eq.totalEffort).toBeGreaterThan(prevTotal);
      expect(eq.efforts![0]!).toBeLessThan(prevEach);
      prevTotal = eq.totalEffort;
      prevEach = eq.efforts![0]!;
    }
    expect(50 - prevTotal).toBeLessThan(0.3); // v/m = 50
  });
});

describe("cost response d e1/d m2 = v (m1 - m2)/(m1 + m2)^3 (derived from Hillman & Riley 1989)", () => {
  test("solve(m1 = 5, m2 = 1..10): e1 rises for m2 < 5 and falls for m2 > 5", () => {
    const e1 = (m2: number) =>
      solve(
        contest([
          { name: "a", cost: 5 },
          { name: "b", cost: m2 },
        ]),
      ).equilibrium.efforts![0]!;
    for (let m2 = 1; m2 < 10; m2 += 0.5) {
      const d = e1(m2 + 0.5) - e1(m2);
      if (m2 + 0.5 <= 5) expect(d).toBeGreaterThan(0);
      if (m2 >= 5) expect(d).toBeLessThan(0);
    }
    // the derivative formula against a central difference of the solver
    for (const m2 of [2, 5, 8]) {
      const h = 1e-4;
      const fd = (e1(m2 + h) - e1(m2 - h)) / (2 * h);
      expect(fd).toBeCloseTo((100 * (5 - m2)) / Math.pow(5 + m2, 3), 6);
    }
  });
});

describe("budget caps (Che & Gale 1997)", () => {
  test("solve(three rivals, one capped): the capped rival spends its cap and the others best-respond", () => {
    const rivals = [
      { name: "rich", cost: 1 },
      { name: "capped", cost: 1, budget: 5 },
      { name: "third", cost: 1.5 },
    ];
    const c = contest(rivals);
    const eq = solve(c).equilibrium;
    expect(eq.method).toBe("share-function");
    expect(eq.efforts![1]).toBe(5);
    expect(eq.note).toMatch(/Che & Gale 1997/);
    for (const i of [0, 2]) {
      expect(eq.efforts![i]!).toBeCloseTo(bestResponse(c, i, eq.efforts!).effort, 9);
      expect(Math.abs(refBestResponse(c, i, eq.efforts!).effort - eq.efforts![i]!)).toBeLessThan(
        1e-4,
      );
    }
    // without the cap it would spend more
    const free = solve(contest(rivals.map((x) => ({ ...x, budget: null })))).equilibrium;
    expect(free.efforts![1]!).toBeGreaterThan(5);
    expect(refGap(c, eq.efforts!)).toBeLessThan(1e-8);
  });
});
