// The solver's iterations report when they stop short of their tolerance instead of handing
// back the last iterate, and the ratio-form best response agrees between its O(n) route
// (respond) and the per-rival route (bestResponse), which now share one payoff and one search.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  bestResponse,
  normalize,
  ratioInteriorMaximum,
  respond,
  shareFunctionEquilibrium,
} from "../src/index";
import { newtonRoot } from "../src/newton";
import type { RivalSpec } from "../src/types";

const contest = (rivals: RivalSpec[], decisiveness = 1) =>
  normalize({ title: "test", prize: 100, csf: { kind: "ratio", decisiveness }, rivals });

describe("newtonRoot", () => {
  test("finds sqrt(2) as the root of x^2 - 2 (checked against Math.SQRT2)", () => {
    const r = newtonRoot((x) => [x * x - 2, 2 * x], 1, { relTol: 1e-15, maxIter: 50 });
    expect(r.ok).toBe(true);
    expect(Math.abs(r.x - Math.SQRT2)).toBeLessThanOrEqual(2 * Number.EPSILON);
  });

  test("reports non-convergence on f(x) = cbrt(x), where each Newton step doubles |x| and flips its sign (textbook failure)", () => {
    const r = newtonRoot((x) => [Math.cbrt(x), 1 / (3 * Math.cbrt(x) ** 2)], 1, {
      relTol: 1e-12,
      maxIter: 40,
    });
    expect(r).toMatchObject({ ok: false, reason: "not-converged", iterations: 40 });
    expect(Math.abs(r.x)).toBeCloseTo(2 ** 40, -1);
  });

  test("reports a step count too small to converge rather than returning the iterate as a root", () => {
    const r = newtonRoot((x) => [x * x - 2, 2 * x], 1, { relTol: 1e-15, maxIter: 2 });
    expect(r).toMatchObject({ ok: false, reason: "not-converged" });
  });

  test("reports a zero slope as a non-finite step", () => {
    const r = newtonRoot((x) => [x * x + 1, 0], 1, { relTol: 1e-12, maxIter: 10 });
    expect(r).toMatchObject({ ok: false, reason: "not-finite" });
  });
});

describe("ratioInteriorMaximum (r != 1)", () => {
  // u(e) = v w e^r / (w e^r + Z) - m e; at an interior maximum v r s (1 - s) = m e (first-order
  // condition, Tullock 1980), an identity checked here independently of the psi transform.
  test.each([
    [100, 1, 1, 0.5, 20],
    [100, 2, 1.5, 0.8, 5],
    [100, 1, 1, 2, 30],
    [60, 0.5, 2, 3, 400],
  ])(
    "v=%d m=%d w=%d r=%d Z=%d converges to a point meeting the first-order condition",
    (v, m, w, r, z) => {
      const res = ratioInteriorMaximum(v, m, w, r, z);
      expect(res.ok).toBe(true);
      const e = res.x;
      expect(e).toBeGreaterThan(0);
      const y = w * Math.pow(e, r);
      const s = y / (y + z);
      expect(Math.abs(v * r * s * (1 - s) - m * e) / (m * e)).toBeLessThan(1e-10);
    },
  );

  test("r = 2 against a strong opposition has no interior maximum: ok with effort 0", () => {
    // psi's peak is below zero: u only falls from e = 0 (v=10, m=5, Z=1e6)
    const res = ratioInteriorMaximum(10, 5, 1, 2, 1e6);
    expect(res).toMatchObject({ ok: true, x: 0 });
  });
});

describe("one ratio-form best response", () => {
  const rivalArb = fc.record({
    cost: fc.double({ min: 0.2, max: 5, noNaN: true }),
    value: fc.double({ min: 10, max: 300, noNaN: true }),
    weight: fc.double({ min: 0.3, max: 3, noNaN: true }),
    decisiveness: fc.double({ min: 0.3, max: 2.5, noNaN: true }),
  });
  test("respond (O(n) route) and bestResponse (per-rival route) give the same best replies", () => {
    fc.assert(
      fc.property(
        fc.array(rivalArb, { minLength: 2, maxLength: 5 }),
        fc.array(fc.double({ min: 0, max: 40, noNaN: true }), { minLength: 5, maxLength: 5 }),
        (specs, raw) => {
          const c = contest(specs.map((s, k) => ({ name: `r${k}`, ...s })));
          const efforts = c.rivals.map((_, i) => raw[i]!);
          const all = respond(c, efforts);
          c.rivals.forEach((_, i) => {
            const one = bestResponse(c, i, efforts);
            // respond also keeps the current effort when it is at least as good
            expect(all.payoffs[i]! + all.regrets[i]!).toBeGreaterThanOrEqual(one.payoff - 1e-9);
            // the two routes sum the opposition differently (prefix sums vs logs): last digits
            if (all.regrets[i]! > 1e-9) {
              const d = Math.abs(all.bestResponses[i]! - one.effort);
              expect(d).toBeLessThanOrEqual(1e-9 * Math.max(1e-12, one.effort));
            }
          });
        },
      ),
    );
  });
});

describe("shareFunctionEquilibrium", () => {
  test("a lone participant has no root, said as such", () => {
    const c = contest([
      { name: "a", cost: 1 },
      { name: "b", cost: 1 },
    ]);
    const res = shareFunctionEquilibrium(c, { members: [true, false] });
    expect(res).toMatchObject({ ok: false, reason: "no-root" });
  });
});
