// Facts of the trade the solver must reproduce. Sources: Tullock 1980; Baye, Kovenock &
// de Vries 1994 (Public Choice 81); Hillman & Riley 1989 (Economics & Politics 1); Che & Gale
// 1997 (Public Choice 92); Alcalde & Dahm 2010 (Journal of Public Economics 94). Volume
// numbers from memory. Independent checks use Nelder-Mead (fmin) best responses.
import { describe, expect, test } from "vitest";
import {
  bestResponse,
  nashGap,
  normalize,
  ratioActiveSetSearch,
  shares,
  solve,
  symmetricRatioEffort,
} from "../src/index";
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
  test("solve(n=3, r=1.6): the symmetric profile fails; one two-active equilibrium stands for all three", () => {
    const c = identical(3, 1.6);
    const sym = new Array(3).fill(symmetricRatioEffort(3, 100, 1, 1.6));
    expect(nashGap(c, sym)).toBeGreaterThan(1); // spending nothing beats 100/3 - 35.6 < 0
    expect(refGap(c, sym)).toBeGreaterThan(1);
    const res = solve(c);
    const eq = res.equilibrium;
    expect(res.alternatives).toHaveLength(0);
    expect(eq.kind).toBe("pure");
    expect(eq.active.filter(Boolean)).toHaveLength(2);
    expect(eq.equivalents).toBe(3);
    // the active pair plays the two-rival symmetric profile r v/(4 m) = 40
    for (const e of eq.efforts!) if (e > 0) expect(e).toBeCloseTo(40, 9);
    expect(eq.nashGap).toBeLessThan(1e-6);
    expect(refGap(c, eq.efforts!)).toBeLessThan(1e-6);
    // the exhaustive subset search (an independent route) finds exactly three such profiles
    expect(ratioActiveSetSearch(c)).toHaveLength(3);
    expect(eq.note).toMatch(/n\/\(n-1\)/);
  });

  test("solve(n=3, r=1.4): the symmetric equilibrium coexists with two-active ones", () => {
    const res = solve(identical(3, 1.4));
    expect(res.equilibrium.active).toEqual([true, true, true]);
    expect(res.equilibrium.efforts![0]).toBeCloseTo(symmetricRatioEffort(3, 100, 1, 1.4), 9);
    expect(res.alternatives).toHaveLength(1);
    expect(res.alternatives[0]!.active.filter(Boolean)).toHaveLength(2);
    expect(res.alternatives[0]!.equivalents).toBe(3);
  });

  test("solve(n=10, r=1.3): one representative each for 4 and 3 active rivals, counted C(10,4) and C(10,3) like the exhaustive search", () => {
    const c = identical(10, 1.3);
    const res = solve(c);
    const all = [res.equilibrium, ...res.alternatives];
    expect(all.map((e) => e.active.filter(Boolean).length)).toEqual([4, 3]);
    expect(all.map((e) => e.equivalents)).toEqual([210, 120]);
    for (const eq of all) {
      const k = eq.active.filter(Boolean).length;
      for (const e of eq.efforts!)
        if (e > 0) expect(e).toBeCloseTo(symmetricRatioEffort(k, 100, 1, 1.3), 9);
      expect(refGap(c, eq.efforts!)).toBeLessThan(1e-6);
      // the record built from symmetry agrees with the per-rival computation
      expect(eq.nashGap).toBeCloseTo(nashGap(c, eq.efforts!), 12);
      const p = shares(c, eq.efforts!);
      eq.shares!.forEach((x, i) => expect(x).toBeCloseTo(p[i]!, 14));
    }
    // every subset of the 2^10, each verified globally: 210 + 120 profiles and no others
    const sizes = ratioActiveSetSearch(c, { exhaustiveUpTo: 10 }).map(
      (f) => f.efforts.filter((e) => e > 0).length,
    );
    expect(sizes.filter((k) => k === 4)).toHaveLength(210);
    expect(sizes.filter((k) => k === 3)).toHaveLength(120);
    expect(sizes).toHaveLength(330);
  });

  test("solve(10,000 identical rivals, r = 2): two active at r v / (4 m), C(10000, 2) equivalents", () => {
    const c = identical(10000, 2);
    const eq = solve(c).equilibrium;
    expect(eq.kind).toBe("pure");
    expect(eq.efforts![0]).toBeCloseTo(50, 9);
    expect(eq.efforts![1]).toBeCloseTo(50, 9);
    expect(eq.active.filter(Boolean)).toHaveLength(2);
    expect(eq.equivalents).toBe((10000 * 9999) / 2);
    // independent best responses (Nelder-Mead) of an active and an idle rival on a
    // three-rival slice: the others are idle, so they change nothing for these two
    const slice = identical(3, 2);
    // payoffs now: 100/2 - 50 = 0 for an active rival, 0 for an idle one
    for (const i of [0, 2])
      expect(refBestResponse(slice, i, [50, 50, 0]).payoff).toBeLessThan(1e-6);
  });

  test("solve(n=3, r=2.5) reports no pure equilibrium, citing the mixed one (Alcalde & Dahm 2010)", () => {
    const c = identical(3, 2.5);
    // mixed: false stops before the approximate mixed search (mixed-many-rival.test.ts)
    const eq = solve(c, { mixed: false }).equilibrium;
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

// Budgets are money: cost x effort <= budget. Che & Gale 1997 (Public Choice 92, "Rent
// dissipation when rent seekers are budget constrained"; volume and title from memory) solve
// the r = 1 contest in which a budget binds: the capped rival spends its whole budget and the
// other plays its best reply e_2 = sqrt(v e_1 / m_2) - e_1 (Tullock 1980 best response).
describe("budgets cap money, cost x effort <= budget (Che & Gale 1997)", () => {
  test("solve(two rivals, cost 2 with budget 20 money): spends 20, i.e. effort 10, the other replies", () => {
    const v = 100;
    const [m1, m2, B] = [2, 1, 20];
    // Unconstrained (Hillman & Riley 1989): e_1 = v m_2 / (m_1 + m_2)^2 = 11.1, a spend of 22.2 > 20.
    expect((m1 * v * m2) / (m1 + m2) ** 2).toBeGreaterThan(B);
    // Read as an effort cap, 20 would not bind at all: only the money reading binds.
    expect((v * m2) / (m1 + m2) ** 2).toBeLessThan(B);
    const c = contest([
      { name: "capped", cost: m1, budget: B },
      { name: "free", cost: m2 },
    ]);
    expect(c.rivals[0]!.maxSpend).toBe(B);
    const eq = solve(c).equilibrium;
    const e1 = B / m1;
    const e2 = Math.sqrt((v * e1) / m2) - e1;
    expect(m1 * eq.efforts![0]!).toBeCloseTo(B, 9);
    expect(eq.efforts![0]!).toBeCloseTo(e1, 9);
    expect(eq.efforts![1]!).toBeCloseTo(e2, 7);
    // the cap binds: rival 1's unconstrained reply to e_2 is above B / m_1
    expect(Math.sqrt((v * e2) / m1) - e2).toBeGreaterThan(e1);
    expect(refGap(c, eq.efforts!)).toBeLessThan(1e-8);
  });

  test("solve(n identical rivals, cost 1.5, budget below the equilibrium spend): all spend the budget", () => {
    const [n, m, B, v] = [4, 1.5, 12, 100];
    // Tullock 1980 symmetric spend m e* = v (n - 1) / n^2 = 18.75 > 12, so every budget binds.
    expect((v * (n - 1)) / n ** 2).toBeGreaterThan(B);
    const c = contest(Array.from({ length: n }, (_, i) => ({ name: `r${i}`, cost: m, budget: B })));
    const eq = solve(c).equilibrium;
    for (const e of eq.efforts!) expect(m * e).toBeCloseTo(B, 9);
    expect(eq.dissipation).toBeCloseTo((n * B) / v, 9);
    expect(refGap(c, eq.efforts!)).toBeLessThan(1e-8);
  });

  test("bestResponse caps money: budget 6 at cost 1.2 buys at most effort 5", () => {
    const c = contest([
      { name: "a", cost: 1.2, budget: 6 },
      { name: "b", cost: 1 },
    ]);
    // Unconstrained reply (Tullock 1980, r = 1): sqrt(v Z / m) - Z = 20.8 effort against Z = 20,
    // a spend of 25 > 6; the money cap leaves effort 6 / 1.2 = 5 (the payoff is concave).
    expect(Math.sqrt((100 * 20) / 1.2) - 20).toBeGreaterThan(6);
    expect(bestResponse(c, 0, [0, 20]).effort).toBeCloseTo(5, 12);
    expect(refBestResponse(c, 0, [0, 20]).effort).toBeCloseTo(5, 6);
  });
});
