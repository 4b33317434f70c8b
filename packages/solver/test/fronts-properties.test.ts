// Property tests of the fronts solver over random scenarios (fast-check): budgets are never
// exceeded, regrets are never negative, each best allocation is at least as good as what an
// independent Nelder-Mead (fmin) search over the budget set finds (with all-pay fronts too:
// there the search is only a lower bound, see fronts-allpay.test.ts for a two-sided check),
// and every reported equilibrium has a Nash gap below the tolerance by that independent search.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { normalizeFronts, respondFronts, solveFronts, validateFrontsScenario } from "../src/fronts";
import type { FrontsContest } from "../src/fronts/types";
import { refBestPayoff, refFrontsGap } from "./frontsReference";

const perFront = (k: number, min: number, max: number) =>
  fc.oneof(
    fc.double({ min, max, noNaN: true }),
    fc.array(fc.double({ min, max, noNaN: true }), { minLength: k, maxLength: k }),
  );

const rivalArb = (k: number) =>
  fc
    .record({
      cost: perFront(k, 0.5, 2),
      value: fc.option(perFront(k, 20, 200), { nil: null }),
      weight: fc.option(perFront(k, 0.5, 2), { nil: null }),
      budget: fc.option(fc.double({ min: 2, max: 150, noNaN: true }), { nil: null }),
      sunk: fc.boolean(),
    })
    .map(({ sunk, ...r }) => ({ ...r, sunkBudget: sunk && r.budget !== null }));

const concaveCsf = fc
  .double({ min: 0.3, max: 1, noNaN: true })
  .map((r) => ({ kind: "ratio" as const, decisiveness: r }));
const anyCsf = fc.oneof(
  concaveCsf,
  fc
    .double({ min: 1, max: 2.5, noNaN: true })
    .map((r) => ({ kind: "ratio" as const, decisiveness: r })),
  fc
    .double({ min: 0.01, max: 0.2, noNaN: true })
    .map((s) => ({ kind: "logit" as const, scale: s })),
);

const scenarioArb = (
  csf: fc.Arbitrary<{ kind: "ratio"; decisiveness: number } | { kind: "logit"; scale: number }>,
) =>
  fc.integer({ min: 1, max: 3 }).chain((k) =>
    fc.record({
      fronts: fc.array(fc.record({ prize: fc.double({ min: 20, max: 200, noNaN: true }), csf }), {
        minLength: k,
        maxLength: k,
      }),
      rivals: fc.array(rivalArb(k), { minLength: 2, maxLength: 3 }),
    }),
  );

function build(s: { fronts: { prize: number; csf: object }[]; rivals: object[] }): FrontsContest {
  const v = validateFrontsScenario({
    title: "random",
    fronts: s.fronts.map((f, k) => ({ name: `F${k}`, ...f })),
    rivals: s.rivals.map((r, i) => ({ name: `R${i}`, ...r })),
  });
  if (!v.ok) throw new Error(`${v.path}: ${v.message}`);
  return normalizeFronts(v.value);
}

const totalPrize = (c: FrontsContest) => c.fronts.reduce((a, f) => a + f.prize, 0);

function checkProfile(c: FrontsContest, alloc: number[][]) {
  alloc.forEach((row, i) => {
    const rv = c.rivals[i]!;
    for (const x of row) expect(x).toBeGreaterThanOrEqual(0);
    const spend = row.reduce((s, x, k) => s + x * rv.cost[k]!, 0);
    expect(spend).toBeLessThanOrEqual(rv.budget);
  });
}

/** Random allocations within budget: a fraction of each rival's purse split over the fronts. */
const withAllocations = (
  arb: fc.Arbitrary<{ fronts: { prize: number; csf: object }[]; rivals: object[] }>,
) =>
  arb.chain((s) =>
    fc.record({
      s: fc.constant(s),
      fractions: fc.array(
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), {
          minLength: s.fronts.length,
          maxLength: s.fronts.length,
        }),
        { minLength: s.rivals.length, maxLength: s.rivals.length },
      ),
    }),
  );

function checkResponds(
  s: { fronts: { prize: number; csf: object }[]; rivals: object[] },
  fractions: number[][],
) {
  const c = build(s);
  // spend at most the budget (or 60% of the value where uncapped), split by the fractions
  const alloc = fractions.map((fr, i) => {
    const rv = c.rivals[i]!;
    const sum = fr.reduce((a, b) => a + b, 0) || 1;
    const purse = Number.isFinite(rv.budget)
      ? rv.budget
      : 0.6 * rv.value.reduce((a, b) => a + b, 0);
    return fr.map((f, k) => ((purse * f) / sum / rv.cost[k]!) * 0.999);
  });
  const res = respondFronts(c, alloc);
  checkProfile(c, res.bestAllocations);
  const scale = totalPrize(c);
  res.regrets.forEach((g, i) => {
    expect(g).toBeGreaterThanOrEqual(0);
    // where every other rival spends nothing on a front, any positive step wins it and no
    // best reply exists (the solver reports the smallest step): no optimum to compare (efforts
    // below 1e-200 count as nothing: w x^r underflows)
    const uncontested = c.fronts.some((_, k) =>
      alloc.every((row, j) => j === i || row[k]! < 1e-200),
    );
    if (uncontested) return;
    const best = res.payoffs[i]! + g;
    // all-pay fronts: the solver outbids by a step of 1e-9 of the budget, which the search
    // may undercut; 1e-7 of the prizes covers it
    expect(refBestPayoff(c, i, alloc)).toBeLessThanOrEqual(best + 1e-7 * scale);
  });
  expect(res.nashGap).toBe(Math.max(...res.regrets));
}

describe("fronts properties (random scenarios)", () => {
  test("solveFronts(r <= 1 on every front) reports a pure equilibrium within budget whose gap an independent search confirms", () => {
    fc.assert(
      fc.property(scenarioArb(concaveCsf), (s) => {
        const c = build(s);
        const eq = solveFronts(c).equilibrium;
        const tol = 1e-6 * totalPrize(c);
        if (c.rivals.filter((r) => r.budget > 0).length < 2) return; // no optimum exists
        expect(eq.kind).toBe("pure");
        checkProfile(c, eq.allocations!);
        expect(eq.nashGap).toBeLessThanOrEqual(tol);
        expect(refFrontsGap(c, eq.allocations!)).toBeLessThanOrEqual(tol);
      }),
      { numRuns: 30 },
    );
  }, 120_000);

  test("solveFronts(any ratio r or logit fronts): a reported equilibrium passes the independent check, else a reason is given", () => {
    fc.assert(
      fc.property(scenarioArb(anyCsf), (s) => {
        const c = build(s);
        const eq = solveFronts(c).equilibrium;
        const tol = 1e-6 * totalPrize(c);
        if (eq.kind === "none-pure") {
          expect(eq.note).toMatch(/\S/);
          expect(eq.allocations).toBeNull();
          return;
        }
        checkProfile(c, eq.allocations!);
        expect(eq.nashGap).toBeLessThanOrEqual(tol);
        expect(refFrontsGap(c, eq.allocations!)).toBeLessThanOrEqual(tol);
      }),
      { numRuns: 15 },
    );
  }, 120_000);

  test("respondFronts(random allocations within budget): regrets >= 0, best allocations within budget and at least as good as Nelder-Mead's (r <= 1)", () => {
    fc.assert(
      fc.property(withAllocations(scenarioArb(concaveCsf)), ({ s, fractions }) =>
        checkResponds(s, fractions),
      ),
      { numRuns: 30 },
    );
  }, 120_000);

  test("respondFronts(an all-pay front among r <= 1 fronts): regrets >= 0, within budget, at least as good as Nelder-Mead's", () => {
    // one more front, all-pay, prize 150; per-front arrays get an entry for it
    const more = (x: unknown, v: number) => (Array.isArray(x) ? [...(x as number[]), v] : x);
    const withAllPay = scenarioArb(concaveCsf).map((s) => ({
      fronts: [...s.fronts, { prize: 150, csf: { kind: "allpay" } }],
      rivals: s.rivals.map((r) => ({
        ...r,
        cost: more(r.cost, 1),
        value: more(r.value, 150),
        weight: more(r.weight, 1),
      })),
    }));
    fc.assert(
      fc.property(withAllocations(withAllPay), ({ s, fractions }) => checkResponds(s, fractions)),
      { numRuns: 20 },
    );
  }, 120_000);
});
