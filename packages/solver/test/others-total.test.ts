// The winning chance against the others' independent mixes from the Laplace transform of their
// total (src/othersTotal.ts) against a computation that shares nothing with it: every profile
// of the others enumerated, y / (y + Z) written out from the definitions (Tullock 1980;
// Hirshleifer 1989). The difference must stay within the error the transform reports
// (trapezoidal-rule bound, Trefethen & Weideman 2014, SIAM Review 56(3), 385-458; from memory).
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { normalize, othersTotal, quadratureError } from "../src/index";
import type { Contest } from "../src/types";

type Mix = { efforts: number[]; probabilities: number[] };

function contestOf(costs: number[], kind: "ratio" | "logit", shape: number): Contest {
  return normalize({
    title: "t",
    prize: 100,
    csf: kind === "ratio" ? { kind, decisiveness: shape } : { kind, scale: shape },
    rivals: costs.map((cost, i) => ({ name: `R${i}`, cost })),
  });
}

/** Rival i's winning chance at x by enumerating every profile of the others. */
function enumeratedWin(c: Contest, mixes: Mix[], i: number, x: number): number {
  const weight = (j: number, e: number) => {
    const rv = c.rivals[j]!;
    return c.csf.kind === "logit" ? rv.weight * Math.exp(c.csf.scale * e) : rv.weight * e ** rv.r;
  };
  let profiles = [{ z: 0, p: 1 }];
  mixes.forEach((m, j) => {
    if (j === i) return;
    profiles = profiles.flatMap((o) =>
      m.efforts.map((e, k) => ({ z: o.z + weight(j, e), p: o.p * m.probabilities[k]! })),
    );
  });
  const y = weight(i, x);
  return profiles.reduce(
    (s, o) => s + o.p * (y === 0 ? (o.z === 0 ? 1 / c.rivals.length : 0) : y / (y + o.z)),
    0,
  );
}

const mixArb = fc
  .array(
    fc.record({
      effort: fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 60, noNaN: true })),
      w: fc.double({ min: 0.01, max: 1, noNaN: true }),
    }),
    { minLength: 1, maxLength: 5 },
  )
  .map((pts) => {
    const total = pts.reduce((s, p) => s + p.w, 0);
    return { efforts: pts.map((p) => p.effort), probabilities: pts.map((p) => p.w / total) };
  });

describe("winning chances against the others' total (Laplace transform)", () => {
  test("the stated error bound is tiny at the default step and shrinks with the step", () => {
    expect(quadratureError(0.25)).toBeLessThan(1e-12);
    expect(quadratureError(0.5)).toBeLessThan(1e-6);
    expect(quadratureError(0.5)).toBeGreaterThan(quadratureError(0.25));
  });

  test("agrees with enumeration of every profile of the others, ratio and logit", () => {
    fc.assert(
      fc.property(
        fc.constantFrom<"ratio" | "logit">("ratio", "logit"),
        fc.double({ min: 0.6, max: 5, noNaN: true }),
        fc.array(fc.double({ min: 1, max: 3, noNaN: true }), { minLength: 3, maxLength: 5 }),
        fc.array(mixArb, { minLength: 5, maxLength: 5 }),
        // positive efforts whose weights stay normal doubles (below that csf.ts counts them as 0)
        fc.array(fc.double({ min: 1e-9, max: 60, noNaN: true }), { minLength: 3, maxLength: 3 }),
        (kind, shape, costs, allMixes, xs) => {
          const c = contestOf(costs, kind, kind === "ratio" ? shape : shape / 10);
          const mixes = allMixes.slice(0, costs.length);
          for (const step of [0.5, 0.25]) {
            const t = othersTotal(c, mixes, step);
            c.rivals.forEach((_, i) => {
              for (const x of [0, ...xs]) {
                const want = enumeratedWin(c, mixes, i, x);
                expect(Math.abs(t.win(i, x) - want)).toBeLessThanOrEqual(t.error + 1e-12);
              }
            });
          }
        },
      ),
      { numRuns: 40 },
    );
  });

  test("identical rivals playing one mix object are one class and get the same chances", () => {
    const c = contestOf([1, 1, 1, 1], "ratio", 3);
    const shared = { efforts: [0, 1, 10, 40], probabilities: [0.4, 0.3, 0.2, 0.1] };
    const grouped = othersTotal(c, [shared, shared, shared, shared]);
    const copies = othersTotal(
      c,
      [0, 1, 2, 3].map(() => structuredClone(shared)),
    );
    for (const x of [0, 0.5, 5, 20]) {
      expect(grouped.win(2, x)).toBeCloseTo(copies.win(2, x), 12);
      expect(grouped.win(0, x)).toBeCloseTo(
        enumeratedWin(c, [shared, shared, shared, shared], 0, x),
        12,
      );
    }
  });
});
