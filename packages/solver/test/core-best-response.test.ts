// Success functions, best responses, regrets and the Nash gap: definitions checked directly,
// closed forms against Nelder-Mead (fmin), and properties over random contests (fast-check).
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  bestResponse,
  dissipation,
  expenditure,
  nashGap,
  normalize,
  payoffs,
  respond,
  shares,
} from "../src/index";
import type { Contest, CsfSpec, RivalSpec } from "../src/types";
import { refBestResponse, refPayoff } from "./reference";

const contest = (
  rivals: RivalSpec[],
  csf: CsfSpec = { kind: "ratio", decisiveness: 1 },
  prize = 100,
) => normalize({ title: "test", prize, csf, rivals });

const rivalArb = fc.record({
  cost: fc.double({ min: 0.2, max: 5, noNaN: true }),
  value: fc.double({ min: 10, max: 300, noNaN: true }),
  weight: fc.double({ min: 0.3, max: 3, noNaN: true }),
});
const csfArb: fc.Arbitrary<CsfSpec> = fc.oneof(
  fc
    .double({ min: 0.2, max: 3, noNaN: true })
    .map((r) => ({ kind: "ratio" as const, decisiveness: r })),
  fc
    .double({ min: 0.005, max: 0.5, noNaN: true })
    .map((k) => ({ kind: "logit" as const, scale: k })),
);
const contestArb = fc
  .tuple(fc.array(rivalArb, { minLength: 2, maxLength: 5 }), csfArb)
  .map(([rs, csf]) =>
    contest(
      rs.map((r, i) => ({ name: `r${i}`, ...r })),
      csf,
    ),
  );
const profileArb = (c: Contest) =>
  fc.tuple(
    ...c.rivals.map((x) =>
      // Money-like efforts: zero or at least 1e-9 of the range. Efforts near 1e-100, where
      // w e^r nears double-precision underflow, are outside what the solver promises.
      fc
        .double({ min: 0, max: x.value / x.cost, noNaN: true })
        .map((e) => (e < (1e-9 * x.value) / x.cost ? 0 : e)),
    ),
  );
const withProfile = contestArb.chain((c) => profileArb(c).map((e) => ({ c, e: e as number[] })));

describe("success functions", () => {
  test("shares(ratio, all zero) splits equally (stated convention)", () => {
    const c = contest([1, 2, 3].map((k) => ({ name: `r${k}`, cost: k })));
    expect(shares(c, [0, 0, 0])).toEqual([1 / 3, 1 / 3, 1 / 3]);
  });
  test("shares(logit, k e = 1000) stays finite (log-space evaluation)", () => {
    const c = contest(
      [
        { name: "a", cost: 1 },
        { name: "b", cost: 1 },
      ],
      { kind: "logit", scale: 10 },
    );
    const p = shares(c, [100, 100 - Math.log(3) / 10]);
    expect(p[0]).toBeCloseTo(0.75, 12);
    expect(p[1]).toBeCloseTo(0.25, 12);
  });
  test("shares(all-pay) gives the prize to the top bid and splits ties", () => {
    const c = contest(
      [1, 2, 3].map((k) => ({ name: `r${k}`, cost: 1 })),
      { kind: "allpay" },
    );
    expect(shares(c, [5, 7, 7])).toEqual([0, 0.5, 0.5]);
  });
  test("payoffs, expenditure and dissipation follow u = v p - m e", () => {
    const c = contest([
      { name: "a", cost: 2 },
      { name: "b", cost: 1, value: 50 },
    ]);
    const e = [10, 30];
    const u = payoffs(c, e);
    expect(u[0]).toBeCloseTo(100 * 0.25 - 20, 12);
    expect(u[1]).toBeCloseTo(50 * 0.75 - 30, 12);
    expect(expenditure(c, e)).toBe(50);
    expect(dissipation(c, e)).toBe(0.5);
  });
  test("shares(random contest, random profile) are in [0, 1] and sum to 1", () => {
    fc.assert(
      fc.property(withProfile, ({ c, e }) => {
        const p = shares(c, e);
        expect(p.every((x) => x >= 0 && x <= 1)).toBe(true);
        expect(Math.abs(p.reduce((a, b) => a + b, 0) - 1)).toBeLessThan(1e-12);
      }),
      { numRuns: 200 },
    );
  });
});

describe("best responses", () => {
  test("bestResponse(r = 1) matches w e = sqrt(w v Z/m) - Z (Tullock 1980) and Nelder-Mead", () => {
    const c = contest([
      { name: "a", cost: 1.5, weight: 2 },
      { name: "b", cost: 1 },
      { name: "c", cost: 1 },
    ]);
    const e = [0, 10, 15];
    const br = bestResponse(c, 0, e);
    const Z = 25;
    expect(br.effort).toBeCloseTo((Math.sqrt((2 * 100 * Z) / 1.5) - Z) / 2, 12);
    const ref = refBestResponse(c, 0, e);
    expect(Math.abs(br.effort - ref.effort)).toBeLessThan(1e-5);
    expect(br.payoff).toBeGreaterThanOrEqual(ref.payoff - 1e-12);
  });
  test("bestResponse(r = 1) against a huge opponent is zero", () => {
    const c = contest([
      { name: "a", cost: 1 },
      { name: "b", cost: 1 },
    ]);
    expect(bestResponse(c, 0, [5, 200]).effort).toBe(0);
  });
  test("bestResponse respects a budget cap (concave payoff: the cap is optimal)", () => {
    const c = contest([
      { name: "a", cost: 1, budget: 2 },
      { name: "b", cost: 1 },
    ]);
    const br = bestResponse(c, 0, [0, 20]);
    expect(br.effort).toBe(2);
  });
  test("bestResponse(everyone else at zero) reports the unattained supremum", () => {
    const c = contest([
      { name: "a", cost: 2 },
      { name: "b", cost: 1 },
    ]);
    const br = bestResponse(c, 0, [3, 0]);
    expect(br.supremumOnly).toBe(true);
    expect(br.effort).toBeCloseTo((1e-6 * 100) / 2, 15);
    expect(br.payoff).toBe(100);
    expect(bestResponse(c, 0, [3, 0], { step: 0.01 }).effort).toBe(0.01);
  });
  test("bestResponse(all-pay) bids just above the top other bid, or nothing", () => {
    const c = contest(
      [
        { name: "a", cost: 1 },
        { name: "b", cost: 1 },
      ],
      { kind: "allpay" },
    );
    const br = bestResponse(c, 0, [0, 40], { step: 0.5 });
    expect(br.effort).toBe(40.5);
    expect(br.payoff).toBe(60);
    expect(br.supremumOnly).toBe(true);
    expect(bestResponse(c, 0, [0, 120]).effort).toBe(0);
  });
  test("bestResponse(random contest) is at least as good as every grid point and the Nelder-Mead optimum", () => {
    fc.assert(
      fc.property(withProfile, fc.nat(), ({ c, e }, k) => {
        const i = k % c.rivals.length;
        const br = bestResponse(c, i, e);
        if (br.supremumOnly) return;
        const rv = c.rivals[i]!;
        const top = rv.value / rv.cost;
        // reported payoff is the payoff at the reported effort
        expect(Math.abs(br.payoff - refPayoff(c, i, br.effort, e))).toBeLessThan(1e-9);
        for (let g = 0; g <= 400; g++) {
          expect(br.payoff).toBeGreaterThanOrEqual(refPayoff(c, i, (top * g) / 400, e) - 1e-9);
        }
        expect(br.payoff).toBeGreaterThanOrEqual(refBestResponse(c, i, e).payoff - 1e-9);
      }),
      { numRuns: 30 },
    );
  });
});

describe("shape-based maximiser against the optional grid search", () => {
  test("bestResponse(random contest) equals bestResponse with a 4001-point grid cross-check", () => {
    fc.assert(
      fc.property(withProfile, fc.nat(), ({ c, e }, k) => {
        const i = k % c.rivals.length;
        const a = bestResponse(c, i, e);
        const b = bestResponse(c, i, e, { gridPoints: 4001 });
        expect(Math.abs(a.payoff - b.payoff)).toBeLessThan(1e-9);
      }),
      { numRuns: 60 },
    );
  });
});

describe("regret and Nash gap", () => {
  test("respond(random profile) has regrets >= 0 and nashGap = largest regret", () => {
    fc.assert(
      fc.property(withProfile, ({ c, e }) => {
        const r = respond(c, e);
        expect(r.regrets.every((x) => x >= 0)).toBe(true);
        expect(r.nashGap).toBe(Math.max(...r.regrets));
        expect(nashGap(c, e)).toBe(r.nashGap);
        r.payoffs.forEach((u, i) => expect(u).toBeCloseTo(refPayoff(c, i, e[i]!, e), 9));
      }),
      { numRuns: 100 },
    );
  });
  test("nashGap(profile off equilibrium) is the money left on the table", () => {
    const c = contest([
      { name: "a", cost: 1 },
      { name: "b", cost: 1 },
    ]);
    // against 25 the best reply is 25 (payoff 25); spending 50 earns 100*2/3 - 50 = 16.67
    expect(nashGap(c, [50, 25])).toBeCloseTo(25 - (200 / 3 - 50), 10);
  });
});
