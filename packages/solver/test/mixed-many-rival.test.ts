// Approximate mixed equilibria of three or more rivals (fictitious play on a grid, certified
// Nash gap). What the literature supports here (from memory, not re-read for this file):
// - Baye, Kovenock & de Vries 1994 (Public Choice 81): with identical rivals and r above
//   n/(n-1) the symmetric pure profile is not an equilibrium, and with r > 2 no pure
//   equilibrium exists, so the answer for identical rivals at r = 3 must be mixed.
// - Alcalde & Dahm 2010 (Journal of Public Economics 94): for r >= 2 a fully dissipating
//   equilibrium exists. That is existence only, so it is not asserted of the equilibrium found;
//   the full-dissipation uniqueness result of Ewerhart 2015 is for two rivals and is not used.
// - Individual rationality (common practice, no source): spending nothing is always possible,
//   so in any equilibrium each expected payoff is >= 0; in an eps-equilibrium >= -eps, and
//   the expected money spent is at most the prize plus n eps (the full-dissipation bound).
// Every mixed answer's gap is re-measured independently: for each rival, the distribution of
// the others' total weight enumerated over the product of their points (no transform), the
// winning chance y / (y + Z) written out from the definitions (Tullock 1980; Hirshleifer
// 1989), a dense uniform and log grid, golden-section refinement of the best cells.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  fictitiousPlay,
  manyRivalMixedEquilibrium,
  normalize,
  othersTotal,
  solve,
} from "../src/index";
import type { Contest, Equilibrium } from "../src/types";

const ratio = (costs: number[], r: number, prize = 100): Contest =>
  normalize({
    title: "t",
    prize,
    csf: { kind: "ratio", decisiveness: r },
    rivals: costs.map((cost, i) => ({ name: `R${i}`, cost })),
  });

type Points = { effort: number; probability: number }[];

/** ln of rival j's weight at effort e, from the definitions (not the solver's csf.ts). */
function refLogWeight(c: Contest, j: number, e: number): number {
  const rv = c.rivals[j]!;
  if (c.csf.kind === "logit") return Math.log(rv.weight) + c.csf.scale * e;
  return e > 0 ? Math.log(rv.weight) + rv.r * Math.log(e) : -Infinity;
}

/** The others' total weight Z (relative to e^shift) over the product of their points. */
function othersProduct(c: Contest, eq: Equilibrium, i: number) {
  const pts = eq.strategies!.map((s) => s.points! as Points);
  const lws = pts.map((p, j) => p.map((q) => refLogWeight(c, j, q.effort)));
  const shift = Math.max(0, ...lws.flat().filter(Number.isFinite));
  let atoms = new Map<number, number>([[0, 1]]);
  pts.forEach((p, j) => {
    if (j === i) return;
    const next = new Map<number, number>();
    for (const [z, q] of atoms) {
      p.forEach((pt, k) => {
        const key = z + Math.exp(lws[j]![k]! - shift);
        next.set(key, (next.get(key) ?? 0) + q * pt.probability);
      });
    }
    atoms = next;
  });
  return { z: [...atoms.keys()], q: [...atoms.values()], shift };
}

/** Rival i's expected payoff (money) at effort x against the enumerated others. */
function refDeviation(c: Contest, i: number, x: number, o: ReturnType<typeof othersProduct>) {
  const rv = c.rivals[i]!;
  const y = Math.exp(refLogWeight(c, i, x) - o.shift);
  let win = 0;
  o.z.forEach((z, k) => {
    win += o.q[k]! * (y === 0 ? (z === 0 ? 1 / c.rivals.length : 0) : y / (y + z));
  });
  return rv.value * win - rv.cost * x;
}

/** Independent Nash gap of the reported mixes (money). */
function independentGap(c: Contest, eq: Equilibrium): number {
  let gap = 0;
  c.rivals.forEach((rv, i) => {
    const others = othersProduct(c, eq, i);
    const f = (x: number) => refDeviation(c, i, x, others);
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
  // seconds on a loaded two-core machine: 1000 rounds of fictitious play
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

  test("fictitious play's incremental transform gives the grid gap the plain one recomputes", () => {
    for (const c of [ratio([1, 1.2, 1.5, 1.5], 3), ratio([1, 2, 2, 2, 3], 2.5)]) {
      const fp = fictitiousPlay(c, { rounds: 60 });
      const total = othersTotal(c, fp.mixes);
      let gap = 0;
      fp.mixes.forEach((m, i) => {
        const us = m.efforts.map((x) => total.payoff(i, x));
        const own = us.reduce((s, u, k) => s + m.probabilities[k]! * u, 0);
        gap = Math.max(gap, Math.max(...us) - own);
      });
      expect(Math.abs(gap - fp.gridGap)).toBeLessThan(1e-5 * c.prize);
      expect(fp.rounds).toBe(60);
    }
  });

  test("mixed: false stops at none-pure", () => {
    const eq = solve(ratio([1, 1, 1], 3), { mixed: false }).equilibrium;
    expect(eq.kind).toBe("none-pure");
  });

  // seconds under load
  test(
    "four asymmetric rivals at r = 2.5: mixed, individually rational, gap confirmed",
    { timeout: 60_000 },
    () => {
      const c = ratio([1, 1.1, 1.3, 1.6], 2.5);
      const eq = solve(c).equilibrium;
      expectWellFormed(c, eq);
      expect(eq.nashGap).toBeLessThan(2e-2 * c.prize);
      for (const u of eq.payoffs!) expect(u).toBeGreaterThanOrEqual(-eq.nashGap);
      expect(eq.dissipation).toBeLessThanOrEqual(1 + (4 * eq.nashGap) / c.prize);
      expect(Math.abs(independentGap(c, eq) - eq.nashGap)).toBeLessThan(1e-4 * c.prize);
    },
  );

  test(
    "six identical rivals at r = 3 and five at r = 5: identical mixes, full-dissipation bound, gap confirmed",
    { timeout: 60_000 },
    () => {
      for (const [n, r] of [
        [6, 3],
        [5, 5],
      ] as const) {
        const c = ratio(new Array<number>(n).fill(1), r);
        const eq = solve(c).equilibrium;
        expectWellFormed(c, eq);
        expect(eq.nashGap).toBeLessThan(1e-2 * c.prize);
        for (const s of eq.strategies!) expect(s.points).toEqual(eq.strategies![0]!.points);
        for (const u of eq.payoffs!) expect(u).toBeGreaterThanOrEqual(-eq.nashGap);
        // spending at most the prize plus n eps (individual rationality, see the header)
        expect(eq.dissipation).toBeLessThanOrEqual(1 + (n * eq.nashGap) / c.prize);
        expect(Math.abs(independentGap(c, eq) - eq.nashGap)).toBeLessThan(1e-4 * c.prize);
      }
    },
  );

  test("10,000 identical rivals at r = 3: none-pure, the summed possible gains named", () => {
    const eq = solve(ratio(new Array<number>(10_000).fill(1), 3)).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.note).toMatch(
      /with 10000 rivals their possible gains together exceed 10% of the prize/,
    );
  });

  test("an injected clock stops the play at the stated time budget and the note says so", () => {
    const c = ratio([1, 1.2, 1.5, 2], 3);
    let t = 0;
    const eq = manyRivalMixedEquilibrium(c, { now: () => (t += 100), timeBudgetMs: 450 })!;
    expect(eq.kind).toBe("mixed");
    expect(eq.note).toMatch(/stopped by its 450 ms time budget after 5 rounds/);
    expect(eq.nashGap).toBeGreaterThan(0);
  });

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
