// Logit (difference-form) contests, Hirshleifer 1989 (Public Choice 63; volume from memory),
// and edge cases of the dispatcher. Derived facts are checked against Nelder-Mead (fmin).
import { describe, expect, test } from "vitest";
import { normalize, shares, solve } from "../src/index";
import type { CsfSpec, RivalSpec } from "../src/types";
import { refGap } from "./reference";

const contest = (rivals: RivalSpec[], csf: CsfSpec, leader: string | null = null) =>
  normalize({ title: "test", prize: 100, csf, rivals, leader });

describe("logit contests", () => {
  test("solve(logit, k v <= 4 m for all) is the all-zero profile: u' = v k p(1-p) - m <= v k/4 - m <= 0 (derived)", () => {
    const c = contest(
      [
        { name: "a", cost: 1, weight: 2 },
        { name: "b", cost: 1.2 },
      ],
      { kind: "logit", scale: 0.04 },
    );
    const res = solve(c);
    expect(res.equilibrium.efforts).toEqual([0, 0]);
    expect(res.equilibrium.shares![0]).toBeCloseTo(2 / 3, 12);
    expect(res.alternatives).toHaveLength(0);
    expect(refGap(c, [0, 0])).toBeLessThan(1e-9);
  });

  test("solve(logit, one strong rival) has it alone active at p = (1 + sqrt(1 - 4m/(vk)))/2 (derived)", () => {
    const c = contest(
      [
        { name: "a", cost: 1 },
        { name: "b", cost: 3 },
      ],
      { kind: "logit", scale: 0.1 },
    );
    const eq = solve(c).equilibrium;
    const p = 0.5 * (1 + Math.sqrt(1 - 0.4));
    expect(eq.kind).toBe("pure");
    expect(eq.efforts![1]).toBe(0);
    expect(eq.efforts![0]).toBeCloseTo(Math.log(p / (1 - p)) / 0.1, 9);
    expect(eq.shares![0]).toBeCloseTo(p, 9);
    expect(refGap(c, eq.efforts!)).toBeLessThan(1e-6);
  });

  test("solve(logit, two strong rivals) finds no pure equilibrium (a check confirms the candidates fail) and answers with a mixed one", () => {
    const c = contest(
      [
        { name: "a", cost: 1 },
        { name: "b", cost: 1.5 },
      ],
      { kind: "logit", scale: 0.1 },
    );
    const eq = solve(c).equilibrium;
    expect(eq.kind).toBe("mixed");
    expect(eq.note).toContain("No pure-strategy equilibrium");
    expect(refGap(c, [0, 0])).toBeGreaterThan(1);
    // a alone at its interior point: b would rather enter
    const pa = 0.5 * (1 + Math.sqrt(1 - 0.4));
    expect(refGap(c, [Math.log(pa / (1 - pa)) / 0.1, 0])).toBeGreaterThan(1);
    expect(shares(c, [0, 0])).toEqual([0.5, 0.5]);
  });
});

describe("dispatcher edge cases", () => {
  test("solve(one rival, ratio) reports that no effort level is optimal", () => {
    const eq = solve(
      contest([{ name: "a", cost: 1 }], { kind: "ratio", decisiveness: 1 }),
    ).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(Number.isNaN(eq.nashGap)).toBe(true);
  });
  test("solve(only one rival with a budget) reports the unattained supremum", () => {
    const eq = solve(
      contest(
        [
          { name: "a", cost: 1 },
          { name: "b", cost: 1, budget: 0 },
        ],
        { kind: "ratio", decisiveness: 0.5 },
      ),
    ).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.note).toMatch(/positive step/);
  });
  test("solve(leader with a three-rival logit contest) is reported as unsupported, not as a wrong answer", () => {
    const eq = solve(
      contest(
        [
          { name: "a", cost: 1 },
          { name: "b", cost: 1 },
          { name: "c", cost: 1 },
        ],
        { kind: "logit", scale: 0.1 },
        "a",
      ),
    ).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.method).toBe("unsupported");
  });
  test("solve(ten identical rivals, r = 1.6) finds a two-active equilibrium beyond the exhaustive range", () => {
    const c = contest(
      Array.from({ length: 10 }, (_, k) => ({ name: `r${k}`, cost: 1 })),
      { kind: "ratio", decisiveness: 1.6 },
    );
    const res = solve(c);
    const all = [res.equilibrium, ...res.alternatives];
    const pair = all.find((e) => e.active.filter(Boolean).length === 2);
    expect(pair).toBeDefined();
    expect(pair!.nashGap).toBeLessThan(1e-6);
    expect(refGap(c, pair!.efforts!)).toBeLessThan(1e-6);
    expect(res.equilibrium.note).toMatch(/identical/);
  });

  test("solve(ten identical rivals, r = 1.3): every equilibrium found has k active with r <= k/(k-1) (derived), none with two", () => {
    const c = contest(
      Array.from({ length: 10 }, (_, k) => ({ name: `r${k}`, cost: 1 })),
      { kind: "ratio", decisiveness: 1.3 },
    );
    const res = solve(c);
    const all = [res.equilibrium, ...res.alternatives];
    expect(all.length).toBeGreaterThan(0);
    for (const eq of all) {
      const k = eq.active.filter(Boolean).length;
      expect(k).toBeGreaterThanOrEqual(3);
      expect(1.3).toBeLessThanOrEqual(k / (k - 1));
      expect(refGap(c, eq.efforts!)).toBeLessThan(1e-6);
    }
    // two rivals at r v/(4 m) = 32.5 each invite entry: an outsider's best reply is positive
    const two = c.rivals.map((_, i) => (i < 2 ? 32.5 : 0));
    expect(refGap(c, two)).toBeGreaterThan(1);
  });
});
