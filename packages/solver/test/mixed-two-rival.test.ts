// Mixed equilibria of two-rival ratio-form (r > 1) and logit contests. Published checks:
// Ewerhart 2015 (Economic Theory 60(1), 59-71): identical rivals with 2 < r < infinity have
// symmetric equilibria on countably many mass points accumulating only at zero, and for
// r >= 2 every equilibrium of two rivals gives the all-pay auction's expected efforts, winning
// probabilities and payoffs (as summarised in Sahm 2022, Games 13(2), article 24); full
// dissipation with identical rivals for r >= 2 (Alcalde & Dahm 2010, Journal of Public
// Economics 94; volume from memory); the all-pay auction itself (Baye, Kovenock & de Vries
// 1996, Economic Theory 8; volume from memory); the semi-mixed equilibrium between the pure
// region and r = 2, one rival pure and the other mixing between zero and one positive effort
// (Wang 2010, B.E. Journal of Theoretical Economics 10; volume and the exact shape from memory).
// Every mixed answer's gap is re-measured here by an independent dense-grid search with
// golden-section refinement over payoffs written out from the definitions (reference.ts).
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { mulberry32, normalize, solve, solveMatrixGame } from "../src/index";
import type { Contest, CsfSpec, Equilibrium, RivalSpec } from "../src/types";
import { refPayoff } from "./reference";

const contest = (rivals: RivalSpec[], csf: CsfSpec, prize = 100): Contest =>
  normalize({ title: "t", prize, csf, rivals });

type Points = { effort: number; probability: number }[];
/** A frozen clock: the searches stop on their gap target or round limit, never on time. */
const frozen = { now: () => 0 };

const pointsOf = (eq: Equilibrium, i: number): Points => eq.strategies![i]!.points!;

/** Expected payoff of rival i at pure x against the other's points (reference payoffs). */
function refDeviation(c: Contest, i: number, x: number, other: Points): number {
  let u = 0;
  for (const p of other) {
    const e = i === 0 ? [x, p.effort] : [p.effort, x];
    u += p.probability * refPayoff(c, i, x, e);
  }
  return u;
}

/** Independent gap: dense uniform and log grids, golden-section refinement of the best cells. */
function independentGap(c: Contest, eq: Equilibrium): number {
  let gap = 0;
  for (const i of [0, 1]) {
    const own = pointsOf(eq, i);
    const other = pointsOf(eq, 1 - i);
    const ownPay = own.reduce((s, p) => s + p.probability * refDeviation(c, i, p.effort, other), 0);
    const rv = c.rivals[i]!;
    const hi = Math.min(rv.maxEffort, rv.value / rv.cost);
    const xs: number[] = [];
    for (let k = 0; k <= 6000; k++) xs.push((hi * k) / 6000);
    for (let k = 1; k <= 300; k++) xs.push(hi * Math.pow(10, -k / 20));
    xs.sort((a, b) => a - b);
    const fs = xs.map((x) => refDeviation(c, i, x, other));
    const order = fs.map((_, k) => k).sort((a, b) => fs[b]! - fs[a]!);
    let best = fs[order[0]!]!;
    for (const k of order.slice(0, 6)) {
      let a = xs[Math.max(0, k - 1)]!;
      let b = xs[Math.min(xs.length - 1, k + 1)]!;
      for (let it = 0; it < 80; it++) {
        const m1 = a + (b - a) * 0.382;
        const m2 = a + (b - a) * 0.618;
        if (refDeviation(c, i, m1, other) > refDeviation(c, i, m2, other)) b = m2;
        else a = m1;
      }
      best = Math.max(best, refDeviation(c, i, (a + b) / 2, other));
    }
    gap = Math.max(gap, best - ownPay);
  }
  return gap;
}

function expectMixedAndCertified(c: Contest, eq: Equilibrium): void {
  expect(eq.kind).toBe("mixed");
  expect(eq.efforts).toBeNull();
  for (const i of [0, 1]) {
    const pts = pointsOf(eq, i);
    expect(pts.reduce((s, p) => s + p.probability, 0)).toBeCloseTo(1, 12);
    const mean = pts.reduce((s, p) => s + p.probability * p.effort, 0);
    expect(eq.expectedEfforts![i]).toBeCloseTo(mean, 9);
  }
  expect(eq.shares![0]! + eq.shares![1]!).toBeCloseTo(1, 12);
  const ind = independentGap(c, eq);
  expect(eq.nashGap).toBeLessThan(1e-3 * c.prize);
  // the reported gap agrees with the independent search
  expect(Math.abs(ind - eq.nashGap)).toBeLessThan(1e-6 * c.prize);
  expect(eq.approximate).toBe(eq.nashGap > 1e-6 * c.prize);
}

/** Groups support points lying within 10% of each other (grid refinement splits one atom). */
function clusters(pts: Points): { at: number; mass: number }[] {
  const out: { at: number; mass: number; top: number }[] = [];
  for (const p of pts.filter((q) => q.probability > 1e-6)) {
    const last = out.at(-1);
    if (last && p.effort <= last.top * 1.1) {
      last.at = (last.at * last.mass + p.effort * p.probability) / (last.mass + p.probability);
      last.mass += p.probability;
      last.top = p.effort;
    } else out.push({ at: p.effort, mass: p.probability, top: p.effort });
  }
  return out.map(({ at, mass }) => ({ at, mass }));
}

describe("matrix games by linear programming (von Neumann's minimax theorem)", () => {
  test("solveMatrixGame(2x2) gives the textbook mixed solution p = (d - c) / (a - b - c + d)", () => {
    const [a, b, cc, d] = [3, -1, -2, 4];
    const s = solveMatrixGame([
      [a, b],
      [cc, d],
    ]);
    const p = (d - cc) / (a - b - cc + d);
    expect(s.row[0]).toBeCloseTo(p, 12);
    expect(s.value).toBeCloseTo((a * d - b * cc) / (a - b - cc + d), 12);
  });

  test("solveMatrixGame(seeded random symmetric games, a + a' constant): one strategy serves both sides and guarantees the value k / 2", () => {
    const rng = mulberry32(7);
    for (let run = 0; run < 200; run++) {
      const m = 1 + Math.floor(rng() * 25);
      const k = rng() * 4 - 2;
      const a = Array.from({ length: m }, () => new Array<number>(m).fill(0));
      for (let i = 0; i < m; i++) {
        a[i]![i] = k / 2;
        for (let j = i + 1; j < m; j++) {
          a[i]![j] = rng() * 10 - 5;
          a[j]![i] = k - a[i]![j]!;
        }
      }
      const s = solveMatrixGame(a);
      // the value of a symmetric game: k / 2 (von Neumann; common practice, no source)
      expect(s.value).toBeCloseTo(k / 2, 9);
      for (let j = 0; j < m; j++) {
        const col = a.reduce((acc, row, i) => acc + s.row[i]! * row[j]!, 0);
        expect(col).toBeGreaterThan(k / 2 - 1e-9);
      }
      for (let i = 0; i < m; i++) {
        const row = a[i]!.reduce((acc, x, j) => acc + x * s.col[j]!, 0);
        expect(row).toBeLessThan(k / 2 + 1e-9);
      }
    }
  });

  test("solveMatrixGame(seeded random matrices: uniform, small integers with many ties, contest-like): the row strategy guarantees the value and the column strategy holds it", () => {
    // Entries differing by less than about 1e-8 of the matrix's range are below the simplex's
    // resolution (pivot tolerance); the mixed-equilibrium search certifies its answers anyway.
    const rng = mulberry32(20261204);
    for (let run = 0; run < 600; run++) {
      const m = 1 + Math.floor(rng() * 30);
      const n = 1 + Math.floor(rng() * 30);
      const kind = run % 3;
      const a = Array.from({ length: m }, (_, i) =>
        Array.from({ length: n }, (_, j) =>
          kind === 0
            ? rng() * 10 - 5
            : kind === 1
              ? Math.round(rng() * 4 - 2)
              : 1 / (1 + Math.exp(-(i - j) * 0.7)) - 0.01 * i + 0.012 * j,
        ),
      );
      const s = solveMatrixGame(a);
      expect(s.converged).toBe(true);
      for (let j = 0; j < n; j++) {
        const col = a.reduce((acc, row, i) => acc + s.row[i]! * row[j]!, 0);
        expect(col).toBeGreaterThan(s.value - 1e-10);
      }
      for (let i = 0; i < m; i++) {
        const row = a[i]!.reduce((acc, x, j) => acc + x * s.col[j]!, 0);
        expect(row).toBeLessThan(s.value + 1e-10);
      }
    }
  });
});

describe("identical rivals with r > 2 (Ewerhart 2015; Alcalde & Dahm 2010)", () => {
  test.each([3, 5])(
    "solve(two identical rivals, r = %d) dissipates the whole prize on mass points accumulating at zero",
    (r) => {
      const c = contest(
        [
          { name: "a", cost: 1 },
          { name: "b", cost: 1 },
        ],
        { kind: "ratio", decisiveness: r },
      );
      const eq = solve(c, frozen).equilibrium;
      expectMixedAndCertified(c, eq);
      // whole prize dissipated, expected payoffs 0 (up to the certified gap)
      expect(eq.dissipation).toBeGreaterThan(1 - 2e-3);
      for (const u of eq.payoffs!) expect(Math.abs(u)).toBeLessThan(2e-3 * c.prize);
      for (const i of [0, 1]) {
        const pts = pointsOf(eq, i);
        const cl = clusters(pts);
        // no atom at zero; several separated mass points, the heaviest on top, shrinking to 0
        const atZero = pts.filter((p) => p.effort === 0).reduce((s, p) => s + p.probability, 0);
        expect(atZero).toBeLessThan(1e-4);
        expect(cl.length).toBeGreaterThanOrEqual(4);
        expect(cl.at(-1)!.mass).toBeGreaterThan(0.5);
        expect(cl[0]!.at).toBeLessThan(0.05 * cl.at(-1)!.at);
        for (let k = 1; k < cl.length; k++) expect(cl[k]!.at / cl[k - 1]!.at).toBeGreaterThan(1.1);
      }
    },
  );
});

describe("two asymmetric rivals with r >= 2 give the all-pay auction's outcome (Ewerhart 2015 in Sahm 2022)", () => {
  test.each([2, 3, 5])(
    "solve(V_1 = 100, V_2 = 60, r = %d) gives expected efforts V_2/2 and V_2^2/(2 V_1), payoffs cost_1 (V_1 - V_2) and 0",
    (r) => {
      // costs differ so V_i = value / cost is what matters: V_1 = 200 / 2 = 100, V_2 = 60
      const c = contest(
        [
          { name: "strong", cost: 2, value: 200 },
          { name: "weak", cost: 1, value: 60 },
        ],
        { kind: "ratio", decisiveness: r },
      );
      const eq = solve(c, frozen).equilibrium;
      expectMixedAndCertified(c, eq);
      const [V1, V2] = [100, 60];
      expect(eq.expectedEfforts![0]).toBeCloseTo(V2 / 2, 0);
      expect(eq.expectedEfforts![1]!).toBeCloseTo((V2 * V2) / (2 * V1), 0);
      expect(Math.abs(eq.expectedEfforts![1]! - (V2 * V2) / (2 * V1))).toBeLessThan(0.01 * 18);
      // all-pay winning probability of the weaker rival: V_2 / (2 V_1)
      expect(eq.shares![1]).toBeCloseTo(V2 / (2 * V1), 2);
      expect(Math.abs(eq.payoffs![0]! - 2 * (V1 - V2))).toBeLessThan(0.005 * c.prize);
      expect(Math.abs(eq.payoffs![1]!)).toBeLessThan(2e-3 * c.prize);
    },
  );
});

describe("semi-mixed equilibria between the pure region and r = 2 (Wang 2010; Sahm 2022)", () => {
  test("solve(costs 5 and 2, prize 100, r = 1.5): the strong rival pure, the weak one mixing between 0 and one effort", () => {
    const c = contest(
      [
        { name: "weak", cost: 5 },
        { name: "strong", cost: 2 },
      ],
      { kind: "ratio", decisiveness: 1.5 },
    );
    const eq = solve(c, frozen).equilibrium;
    expectMixedAndCertified(c, eq);
    const strong = clusters(pointsOf(eq, 1));
    expect(strong).toHaveLength(1);
    const weak = pointsOf(eq, 0).filter((p) => p.probability > 1e-6);
    const atZero = weak.find((p) => p.effort === 0)?.probability ?? 0;
    expect(atZero).toBeGreaterThan(0.05);
    expect(clusters(weak.filter((p) => p.effort > 0))).toHaveLength(1);
    // the weak rival mixes, so it is indifferent: its expected payoff is what zero earns, 0
    expect(Math.abs(eq.payoffs![0]!)).toBeLessThan(1e-3 * c.prize);
  });
});

describe("logit contests without a pure equilibrium (Hirshleifer 1989)", () => {
  test("solve(logit, two identical strong rivals) is a symmetric mixed equilibrium with a certified gap", () => {
    const c = contest(
      [
        { name: "a", cost: 1 },
        { name: "b", cost: 1 },
      ],
      { kind: "logit", scale: 0.2 },
    );
    const eq = solve(c, frozen).equilibrium;
    expectMixedAndCertified(c, eq);
    expect(eq.expectedEfforts![0]).toBeCloseTo(eq.expectedEfforts![1]!, 0);
    expect(eq.shares![0]).toBeCloseTo(0.5, 2);
  });
});

describe("random two-rival contests without a pure equilibrium", () => {
  test("solve(two rivals, r in (1, 6)) gives pure answers or mixed ones whose gap an independent search confirms", () => {
    const rival = fc.record({
      cost: fc.double({ min: 0.5, max: 4, noNaN: true }),
      value: fc.double({ min: 40, max: 200, noNaN: true }),
      weight: fc.double({ min: 0.5, max: 2, noNaN: true }),
    });
    let mixed = 0;
    fc.assert(
      fc.property(rival, rival, fc.double({ min: 1.05, max: 6, noNaN: true }), (a, b, r) => {
        const c = contest(
          [
            { name: "a", ...a },
            { name: "b", ...b },
          ],
          { kind: "ratio", decisiveness: r },
        );
        const eq = solve(c, frozen).equilibrium;
        if (eq.kind === "pure") return;
        mixed++;
        expectMixedAndCertified(c, eq);
      }),
      { numRuns: 12 },
    );
    expect(mixed).toBeGreaterThan(0);
  }, 60_000);
});
