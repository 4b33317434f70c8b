// Several fronts, one budget: published and derived closed forms. Friedman 1958, "Game-theory
// models in the allocation of advertising expenditures", Operations Research 6 (title and
// volume from memory); the single-contest closed forms are cited where the single solver
// implements them (Tullock 1980; Hillman & Riley 1989; Nti 1999; Che & Gale 1997).
import { describe, expect, test } from "vitest";
import { normalize, solve } from "../src/index";
import { normalizeFronts, solveFronts, sweepFronts, validateFrontsScenario } from "../src/fronts";
import type { FrontsScenario } from "../src/fronts/types";
import type { CsfSpec, RivalSpec, Scenario } from "../src/types";
import { maxRelDiff } from "./reference";
import { refFrontsGap } from "./frontsReference";

const parse = (s: unknown) => {
  const v = validateFrontsScenario(s);
  if (!v.ok) throw new Error(`${v.path}: ${v.message}`);
  return normalizeFronts(v.value);
};

/*
 * Friedman's case, re-derived here for n rivals and r <= 1. Sunk budgets B_i, unit costs,
 * every rival values front k at V_k, weights w_i the same on every front, a common r <= 1.
 * Rival i maximises sum_k V_k p_ik subject to sum_k x_ik <= B_i. In the ratio form
 * dp_ik/dx_ik = r p_ik (1 - p_ik) / x_ik, so an interior optimum has, for one multiplier lambda_i,
 *     V_k r p_ik (1 - p_ik) / x_ik = lambda_i   for every k.
 * Try x_jk = B_j a_k with sum_k a_k = 1 for every rival j. Then
 *     p_ik = w_i B_i^r a_k^r / sum_j w_j B_j^r a_k^r = w_i B_i^r / sum_j w_j B_j^r =: pi_i,
 * the same on every front, and the condition reads V_k r pi_i (1 - pi_i) / (B_i a_k) = lambda_i:
 * it holds on every front exactly when a_k is proportional to V_k, a_k = V_k / sum_m V_m, with
 *     lambda_i = r pi_i (1 - pi_i) sum_m V_m / B_i.
 * For r <= 1 each p_ik is concave in x_ik, so these conditions with the budget spent are
 * sufficient: x_ik = B_i V_k / sum_m V_m is an equilibrium (Friedman 1958 for two rivals and
 * r = 1), and lambda_i is what one more unit of budget is worth to rival i.
 */
function friedman(budgets: number[], weights: number[], prizes: number[], r: number) {
  const s: FrontsScenario = {
    title: "Friedman",
    fronts: prizes.map((p, k) => ({
      name: `F${k}`,
      prize: p,
      csf: { kind: "ratio", decisiveness: r },
    })),
    rivals: budgets.map((b, i) => ({
      name: `R${i}`,
      cost: 1,
      weight: weights[i]!,
      budget: b,
      sunkBudget: true,
    })),
  };
  return parse(s);
}

describe("Friedman 1958: sunk budgets split in proportion to the prizes", () => {
  const cases = [
    {
      name: "two rivals, r = 1 (Friedman's own case)",
      B: [30, 70],
      w: [1, 1],
      V: [100, 300, 600],
      r: 1,
    },
    {
      name: "four rivals, r = 0.6, unequal weights",
      B: [10, 25, 40, 5],
      w: [1, 1.5, 0.7, 2],
      V: [50, 80, 20, 150, 10],
      r: 0.6,
    },
  ];
  for (const c of cases) {
    test(`solveFronts(${c.name}) gives x_ik = B_i V_k / sum V and lambda_i = r pi_i (1 - pi_i) sum V / B_i`, () => {
      const fcx = friedman(c.B, c.w, c.V, c.r);
      const eq = solveFronts(fcx).equilibrium;
      expect(eq.kind).toBe("pure");
      const sumV = c.V.reduce((a, b) => a + b, 0);
      const den = c.B.reduce((a, b, j) => a + c.w[j]! * Math.pow(b, c.r), 0);
      c.B.forEach((b, i) => {
        const want = c.V.map((v) => (b * v) / sumV);
        expect(maxRelDiff(eq.allocations![i]!, want)).toBeLessThan(1e-7);
        expect(eq.budgetUsed![i]).toBeLessThanOrEqual(b);
        expect(eq.budgetUsed![i]).toBeCloseTo(b, 8);
        const pi = (c.w[i]! * Math.pow(b, c.r)) / den;
        for (const p of eq.shares![i]!) expect(p).toBeCloseTo(pi, 8);
        const lambda = (c.r * pi * (1 - pi) * sumV) / b;
        expect(eq.shadowPrices![i]).toBeCloseTo(lambda, 6);
      });
      expect(eq.nashGap).toBeLessThanOrEqual(1e-6 * sumV);
    });
  }
});

/** The same contest as one front of a fronts scenario and as a single-contest scenario. */
function bothWays(rivals: RivalSpec[], csf: CsfSpec, prize = 100) {
  const single: Scenario = { title: "one", prize, csf, rivals };
  const fronts: FrontsScenario = {
    title: "one front",
    fronts: [{ name: "only", prize, csf }],
    rivals: rivals.map((r) => ({
      name: r.name,
      cost: r.cost,
      ...(r.value !== null && r.value !== undefined ? { value: r.value } : {}),
      ...(r.weight !== null && r.weight !== undefined ? { weight: r.weight } : {}),
      ...(r.budget !== null && r.budget !== undefined ? { budget: r.budget } : {}),
    })),
  };
  return {
    one: solve(normalize(single)).equilibrium,
    many: solveFronts(parse(fronts)).equilibrium,
  };
}

describe("one front equals today's single-contest answer (budgets cap money in both)", () => {
  const cases: { name: string; method: string; rivals: RivalSpec[]; csf: CsfSpec }[] = [
    {
      name: "symmetric Tullock 1980, n = 4, r = 0.8, cost 2",
      method: "closed-form:symmetric",
      rivals: [1, 2, 3, 4].map((k) => ({ name: `r${k}`, cost: 2 })),
      csf: { kind: "ratio", decisiveness: 0.8 },
    },
    {
      name: "Hillman & Riley 1989 active set, r = 1, five rivals, one drops out",
      method: "closed-form:hillman-riley",
      rivals: [
        { name: "a", cost: 1, value: 120 },
        { name: "b", cost: 1.4, weight: 1.5 },
        { name: "c", cost: 1.2, value: 90 },
        { name: "d", cost: 1.1, weight: 0.8 },
        { name: "e", cost: 9 },
      ],
      csf: { kind: "ratio", decisiveness: 1 },
    },
    {
      name: "Nti 1999 two rivals, r = 0.7, different values and costs",
      method: "closed-form:nti",
      rivals: [
        { name: "a", cost: 1.5, value: 140 },
        { name: "b", cost: 1, value: 60 },
      ],
      csf: { kind: "ratio", decisiveness: 0.7 },
    },
    {
      name: "Che & Gale 1997 binding budget: cost 2, budget 20 money",
      method: "share-function",
      rivals: [
        { name: "capped", cost: 2, budget: 20 },
        { name: "free", cost: 1 },
      ],
      csf: { kind: "ratio", decisiveness: 1 },
    },
    {
      name: "symmetric, every budget binds (cost 1.5, budget 12 money)",
      method: "share-function",
      rivals: [1, 2, 3, 4].map((k) => ({ name: `r${k}`, cost: 1.5, budget: 12 })),
      csf: { kind: "ratio", decisiveness: 1 },
    },
    {
      name: "logit (Hirshleifer 1989), one strong rival alone active",
      method: "numeric:logit-candidates",
      rivals: [
        { name: "a", cost: 1 },
        { name: "b", cost: 3 },
      ],
      csf: { kind: "logit", scale: 0.1 },
    },
  ];
  for (const c of cases) {
    test(`solveFronts(K = 1, ${c.name}) equals solve()`, () => {
      const { one, many } = bothWays(c.rivals, c.csf);
      expect(one.method).toBe(c.method);
      expect(one.kind).toBe("pure");
      expect(many.kind).toBe("pure");
      const col = many.allocations!.map((row) => row[0]!);
      expect(maxRelDiff(col, one.efforts!, 1e-9)).toBeLessThan(1e-7);
      expect(maxRelDiff(many.payoffs!, one.payoffs!, 1e-9)).toBeLessThan(1e-7);
      expect(
        maxRelDiff(
          many.shares!.map((r) => r[0]!),
          one.shares!,
          1e-12,
        ),
      ).toBeLessThan(1e-7);
      expect(many.frontTotals![0]).toBeCloseTo(
        one.efforts!.reduce((s, e, i) => s + e * c.rivals[i]!.cost, 0),
        6,
      );
      expect(many.nashGap).toBeLessThanOrEqual(1e-4);
    });
  }
});

describe("no budget: the fronts decouple into independent contests", () => {
  test("solveFronts(three fronts of different forms, no budgets) equals each front's own solve()", () => {
    const prizes = [100, 40, 250];
    const csfs: CsfSpec[] = [
      { kind: "ratio", decisiveness: 1 },
      { kind: "ratio", decisiveness: 0.5 },
      // k V > 4 m only for A here, so A alone is active (Hirshleifer 1989 form; derived in
      // logitSearch.ts): a logit front with a pure equilibrium
      { kind: "logit", scale: 0.02 },
    ];
    const rivals = [
      { name: "A", cost: [1, 2, 1], value: [90, 40, 300], weight: [1, 1.2, 1] },
      { name: "B", cost: [1.3, 1, 1], value: [110, 50, 200], weight: [1, 1, 1.6] },
      { name: "C", cost: [0.8, 1.5, 2], weight: [0.7, 1, 1] }, // values 100, 40, 250
    ];
    const fcx = parse({
      title: "three",
      fronts: prizes.map((p, k) => ({ name: `F${k}`, prize: p, csf: csfs[k]! })),
      rivals,
    });
    const eq = solveFronts(fcx).equilibrium;
    expect(eq.kind).toBe("pure");
    for (let k = 0; k < 3; k++) {
      const single = normalize({
        title: `front ${k}`,
        prize: prizes[k]!,
        csf: csfs[k]!,
        rivals: rivals.map((r) => ({
          name: r.name,
          cost: r.cost[k]!,
          ...(r.value ? { value: r.value[k]! } : {}),
          weight: r.weight[k]!,
        })),
      });
      const one = solve(single).equilibrium;
      expect(one.kind).toBe("pure");
      expect(
        maxRelDiff(
          eq.allocations!.map((row) => row[k]!),
          one.efforts!,
          1e-9,
        ),
      ).toBeLessThan(1e-7);
    }
    expect(eq.shadowPrices).toEqual([null, null, null]);
    // and an independent optimiser finds nothing better for anyone
    expect(refFrontsGap(fcx, eq.allocations!)).toBeLessThan(1e-6 * 390);
  });
});

describe("sweepFronts", () => {
  test("sweepFronts(Friedman case, rivals.0.budget 10..50) follows x_0k = B_0 V_k / sum V at every point", () => {
    const s: FrontsScenario = {
      title: "sweep",
      fronts: [100, 300].map((p, k) => ({
        name: `F${k}`,
        prize: p,
        csf: { kind: "ratio", decisiveness: 1 },
      })),
      rivals: [
        { name: "A", cost: 1, budget: 20, sunkBudget: true },
        { name: "B", cost: 1, budget: 40, sunkBudget: true },
      ],
    };
    const progress: string[] = [];
    const res = sweepFronts(
      s,
      { param: "rivals.0.budget", from: 10, to: 50, steps: 5 },
      { onProgress: (done, total) => progress.push(`${done}/${total}`) },
    );
    expect(res.ok).toBe(true);
    if (!res.ok) return;
    expect(progress).toEqual(["1/5", "2/5", "3/5", "4/5", "5/5"]);
    expect(res.value.map((p) => p.value)).toEqual([10, 20, 30, 40, 50]);
    for (const p of res.value) {
      expect(p.equilibrium.allocations![0]![0]).toBeCloseTo((p.value * 100) / 400, 6);
      expect(p.equilibrium.allocations![0]![1]).toBeCloseTo((p.value * 300) / 400, 6);
    }
  });

  test("sweepFronts(a per-front cost path) changes only that front's cost; bad paths and values name the path", () => {
    const base = validateFrontsScenario({
      title: "x",
      fronts: [
        { name: "F0", prize: 100, csf: { kind: "ratio", decisiveness: 1 } },
        { name: "F1", prize: 100, csf: { kind: "ratio", decisiveness: 1 } },
      ],
      rivals: [
        { name: "A", cost: 1 },
        { name: "B", cost: 1 },
      ],
    });
    if (!base.ok) throw new Error(base.message);
    const res = sweepFronts(base.value, { param: "rivals.1.cost.0", from: 1, to: 3, steps: 3 });
    expect(res.ok).toBe(true);
    if (!res.ok) return;
    // front 1 untouched: symmetric Tullock e* = v (n - 1) / (m n^2) = 25 (Tullock 1980)
    for (const p of res.value) expect(p.equilibrium.allocations![1]![1]).toBeCloseTo(25, 8);
    // front 0 with costs 1 and 3: e_1 = v m_2 / (m_1 + m_2)^2 = 300 / 16 (Hillman & Riley 1989)
    expect(res.value[2]!.equilibrium.allocations![0]![0]).toBeCloseTo(300 / 16, 8);
    const bad = sweepFronts(base.value, { param: "rivals.5.cost.0", from: 1, to: 2, steps: 2 });
    expect(bad.ok ? "" : bad.path).toBe("rivals.5.cost.0");
    const neg = sweepFronts(base.value, { param: "fronts.0.prize", from: -1, to: 2, steps: 2 });
    expect(neg.ok ? "" : neg.message).toMatch(/fronts\.0\.prize/);
  });
});

describe("shadow price of a binding budget", () => {
  test("solveFronts(one front, cost 2, budget 20 money, r = 1) reports lambda = V Z / (e + Z)^2 / c - 1", () => {
    // Derived here: with the others' effort Z fixed, one more unit of money buys 1/c effort,
    // which adds V Z / (e + Z)^2 / c to V p and costs 1, so the budget is worth that minus 1.
    // The free rival's reply to e = 10 is sqrt(V e) - e (Tullock 1980 best response, r = 1).
    const fcx = parse({
      title: "one",
      fronts: [{ name: "only", prize: 100, csf: { kind: "ratio", decisiveness: 1 } }],
      rivals: [
        { name: "capped", cost: 2, budget: 20 },
        { name: "free", cost: 1 },
      ],
    });
    const eq = solveFronts(fcx).equilibrium;
    const e = 10;
    const z = Math.sqrt(100 * e) - e;
    expect(eq.allocations![1]![0]).toBeCloseTo(z, 8);
    expect(eq.shadowPrices![0]).toBeCloseTo((100 * z) / (e + z) ** 2 / 2 - 1, 6);
    expect(eq.shadowPrices![1]).toBeNull();
  });
});
