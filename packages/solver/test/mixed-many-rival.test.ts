// Approximate mixed equilibria of three or more rivals (fictitious play on a grid, certified
// Nash gap). What the literature supports here (from memory, not re-read for this file):
// - Baye, Kovenock & de Vries 1994 (Public Choice 81): with identical rivals and r above
//   n/(n-1) the symmetric pure profile is not an equilibrium, and with r > 2 no pure
//   equilibrium exists, so the answer for three identical rivals at r = 3 must be mixed.
// - Alcalde & Dahm 2010 (Journal of Public Economics 94): for r >= 2 a fully dissipating
//   equilibrium exists. That is existence only, so it is not asserted of the equilibrium found;
//   the full-dissipation uniqueness result of Ewerhart 2015 is for two rivals and is not used.
// - Individual rationality (common practice, no source): spending nothing is always possible,
//   so in any equilibrium each expected payoff is >= 0; in an eps-equilibrium >= -eps, and
//   the expected money spent is at most the prize plus n eps.
// Every mixed answer's gap is re-measured independently: for each rival, payoffs written out
// from the definitions (reference.ts) summed over the product of the others' points, a dense
// uniform and log grid, golden-section refinement of the best cells.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { certifyMixes, normalize, solve } from "../src/index";
import type { Contest, Equilibrium } from "../src/types";
import { refPayoff } from "./reference";

const ratio = (costs: number[], r: number, prize = 100): Contest =>
  normalize({
    title: "t",
    prize,
    csf: { kind: "ratio", decisiveness: r },
    rivals: costs.map((cost, i) => ({ name: `R${i}`, cost })),
  });

type Points = { effort: number; probability: number }[];

/** Every profile of the others (rival i's slot left at 0) with its probability. */
function othersProduct(eq: Equilibrium, i: number): { e: number[]; p: number }[] {
  let out = [{ e: [] as number[], p: 1 }];
  eq.strategies!.forEach((s, j) => {
    const pts: Points = j === i ? [{ effort: 0, probability: 1 }] : s.points!;
    out = out.flatMap((o) => pts.map((q) => ({ e: [...o.e, q.effort], p: o.p * q.probability })));
  });
  return out;
}

function refDeviation(c: Contest, i: number, x: number, prod: { e: number[]; p: number }[]) {
  return prod.reduce((s, o) => s + o.p * refPayoff(c, i, x, o.e), 0);
}

/** Independent Nash gap of the reported mixes (money). */
function independentGap(c: Contest, eq: Equilibrium): number {
  let gap = 0;
  c.rivals.forEach((rv, i) => {
    const prod = othersProduct(eq, i);
    const f = (x: number) => refDeviation(c, i, x, prod);
    const own = eq.strategies![i]!.points!.reduce((s, p) => s + p.probability * f(p.effort), 0);
    const hi = Math.min(rv.maxEffort, rv.value / rv.cost);
    const xs: number[] = [];
    for (let k = 0; k <= 1200; k++) xs.push((hi * k) / 1200);
    for (let k = 1; k <= 120; k++) xs.push(hi * Math.pow(10, -k / 10));
    xs.sort((a, b) => a - b);
    const fs = xs.map(f);
    const order = fs.map((_, k) => k).sort((a, b) => fs[b]! - fs[a]!);
    let best = fs[order[0]!]!;
    for (const k of order.slice(0, 4)) {
      let a = xs[Math.max(0, k - 1)]!;
      let b = xs[Math.min(xs.length - 1, k + 1)]!;
      for (let it = 0; it < 50; it++) {
        const m1 = a + (b - a) * 0.382;
        const m2 = a + (b - a) * 0.618;
        if (f(m1) > f(m2)) b = m2;
        else a = m1;
      }
      best = Math.max(best, f((a + b) / 2));
    }
    gap = Math.max(gap, best - own);
  });
  return gap;
}

function expectWellFormed(c: Contest, eq: Equilibrium): void {
  expect(eq.kind).toBe("mixed");
  expect(eq.approximate).toBe(true);
  expect(eq.efforts).toBeNull();
  c.rivals.forEach((rv, i) => {
    const pts = eq.strategies![i]!.points!;
    expect(pts.reduce((s, p) => s + p.probability, 0)).toBeCloseTo(1, 12);
    const mean = pts.reduce((s, p) => s + p.probability * p.effort, 0);
    expect(eq.expectedEfforts![i]).toBeCloseTo(mean, 9);
    expect(eq.payoffs![i]).toBeCloseTo(rv.value * eq.shares![i]! - rv.cost * mean, 9);
  });
  expect(eq.shares!.reduce((s, p) => s + p, 0)).toBeCloseTo(1, 9);
}

describe("three or more rivals without a pure equilibrium", () => {
  // several seconds on a loaded two-core machine: three exact product expectations per round
  test(
    "three identical rivals at r = 3: mixed, individually rational, gap confirmed",
    {
      timeout: 60_000,
    },
    () => {
      const c = ratio([1, 1, 1], 3);
      const eq = solve(c).equilibrium;
      expectWellFormed(c, eq);
      expect(eq.method).toBe("numeric:fictitious-play");
      expect(eq.nashGap).toBeLessThan(1e-2 * c.prize);
      for (const u of eq.payoffs!) expect(u).toBeGreaterThanOrEqual(-eq.nashGap);
      expect(eq.dissipation).toBeLessThanOrEqual(1 + (3 * eq.nashGap) / c.prize);
      const ind = independentGap(c, eq);
      expect(Math.abs(ind - eq.nashGap)).toBeLessThan(1e-4 * c.prize);
      // same contest, same answer: no clock or unseeded randomness involved
      expect(solve(c).equilibrium).toEqual(eq);
    },
  );

  // seconds under load, as above
  test(
    "three identical rivals, logit k = 0.2: mixed, gap confirmed independently",
    {
      timeout: 60_000,
    },
    () => {
      const c = normalize({
        title: "t",
        prize: 100,
        csf: { kind: "logit", scale: 0.2 },
        rivals: [0, 1, 2].map((i) => ({ name: `R${i}`, cost: 1 })),
      });
      const eq = solve(c).equilibrium;
      expectWellFormed(c, eq);
      for (const u of eq.payoffs!) expect(u).toBeGreaterThanOrEqual(-eq.nashGap);
      expect(Math.abs(independentGap(c, eq) - eq.nashGap)).toBeLessThan(1e-4 * c.prize);
    },
  );

  test("four rivals: too many grid points for exact expectations, none-pure with the reason", () => {
    const eq = solve(ratio([1, 1, 1, 1], 3)).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.note).toMatch(/35937 points on the effort grid \(the exact limit is 20000\)/);
  });

  test("mixed: false stops at none-pure", () => {
    const eq = solve(ratio([1, 1, 1], 3), { mixed: false }).equilibrium;
    expect(eq.kind).toBe("none-pure");
  });

  test(
    "a sampled certificate is never below the exact one (seeded, error folded in)",
    {
      timeout: 60_000,
    },
    () => {
      const c = ratio([1, 1.2, 1.5], 2.5);
      const eq = solve(c).equilibrium;
      expect(eq.kind).toBe("mixed");
      const mixes = eq.strategies!.map((s) => ({
        efforts: s.points!.map((p) => p.effort),
        probabilities: s.points!.map((p) => p.probability),
      }));
      const exact = certifyMixes(c, mixes);
      const sampled = certifyMixes(c, mixes, { exactAtoms: 10, samples: 4000, seed: 3 });
      expect(exact.sampled).toBe(false);
      expect(sampled.sampled).toBe(true);
      expect(exact.gap).toBeCloseTo(eq.nashGap, 9);
      expect(sampled.gap).toBeGreaterThanOrEqual(exact.gap);
      // the folded-in error, 2 v sqrt(ln(2 n / delta) / (2 N)), is what separates them (DKW)
      expect(sampled.gap - exact.gap).toBeLessThan(4 * 100 * Math.sqrt(Math.log(600) / 8000));
    },
  );

  // a few random scenarios: each solve plus its independent check takes seconds under load
  test(
    "random three-rival scenarios: any mixed answer's independent gap is within the reported one",
    {
      timeout: 180_000,
    },
    () => {
      fc.assert(
        fc.property(
          fc.array(fc.double({ min: 1, max: 2.5, noNaN: true }), { minLength: 3, maxLength: 3 }),
          fc.double({ min: 2.2, max: 4, noNaN: true }),
          (costs, r) => {
            const c = ratio(costs, r);
            const eq = solve(c).equilibrium;
            if (eq.kind !== "mixed") return;
            expectWellFormed(c, eq);
            expect(independentGap(c, eq)).toBeLessThanOrEqual(eq.nashGap + 1e-6 * c.prize);
          },
        ),
        { numRuns: 3 },
      );
    },
  );
});
