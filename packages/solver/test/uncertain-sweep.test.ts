import { describe, expect, it } from "vitest";
import { sweepBands } from "../src/uncertain";
import { A, B, closedFormE1, simpson, twoRivals, V } from "./uncertainFixture";

const N = 4000;

const e1 = closedFormE1;

describe("sweepBands against exact expectations", () => {
  const costs = [0.25, 0.5, 1];
  const r = sweepBands(twoRivals(), "rivals.0.cost", costs, { draws: N, seed: 77 });

  it("sweepBands(rival 0's cost over 0.25, 0.5, 1) gives one point per value, each mean within 4 standard errors of the quadrature", () => {
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.points.map((p) => p.x)).toEqual(costs);
    for (const p of r.value.points) {
      const m1 = simpson((c) => e1(p.x, c), A, B) / (B - A);
      const m2 = simpson((c) => e1(p.x, c) ** 2, A, B) / (B - A);
      const se = Math.sqrt((m2 - m1 * m1) / N);
      expect(p.noPureEquilibrium).toBe(0);
      expect(Math.abs(p.efforts.mean[0]! - m1)).toBeLessThan(4 * se);
      // a check that can fail: a shifted target is far outside
      expect(Math.abs(p.efforts.mean[0]! - 1.03 * m1)).toBeGreaterThan(4 * se);
    }
  });

  it("sweepBands: each point's P10/P50/P90 of rival 0's effort sit within the binomial interval of their order statistics", () => {
    if (!r.ok) return;
    for (const p of r.value.points) {
      const c1 = p.x;
      // e1 falls in c2 for c2 >= c1 (all of [A, B] here): P(e1 <= x) = P(c2 >= c*(x)), c*(x)
      // the larger root of x (c1 + c)^2 = v c.
      const cdf = (x: number) => {
        const b = V - 2 * x * c1;
        const c = (b + Math.sqrt(b * b - 4 * x * x * c1 * c1)) / (2 * x);
        return Math.min(1, Math.max(0, (B - c) / (B - A)));
      };
      for (const [q, got] of [
        [0.1, p.efforts.p10[0]!],
        [0.5, p.efforts.p50[0]!],
        [0.9, p.efforts.p90[0]!],
      ] as const) {
        const sd = Math.sqrt(N * q * (1 - q));
        expect(Math.abs(N * cdf(got) - N * q)).toBeLessThan(4 * sd + 1);
      }
      expect(p.efforts.p10[0]!).toBeLessThan(p.efforts.p50[0]!);
      expect(p.efforts.p50[0]!).toBeLessThan(p.efforts.p90[0]!);
    }
  });

  it("sweepBands over the ranged field itself: the value replaces the range, so the band closes on the closed form", () => {
    const s = sweepBands(twoRivals(), "rivals.1.cost", [1.5, 2.5], { draws: 50, seed: 1 });
    expect(s.ok).toBe(true);
    if (!s.ok) return;
    for (const p of s.value.points) {
      const exact = e1(1, p.x);
      expect(p.efforts.p10[0]).toBeCloseTo(exact, 6);
      expect(p.efforts.p90[0]).toBeCloseTo(exact, 6);
    }
  });

  it("sweepBands is reproducible per seed, reports progress per point, and names a bad parameter", () => {
    const seen: number[] = [];
    const a = sweepBands(twoRivals(), "prize", [50, 100], {
      draws: 200,
      seed: 5,
      onProgress: (done, total) => seen.push(done / total),
    });
    const b = sweepBands(twoRivals(), "prize", [50, 100], { draws: 200, seed: 5 });
    const c = sweepBands(twoRivals(), "prize", [50, 100], { draws: 200, seed: 6 });
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
    expect(JSON.stringify(a)).not.toBe(JSON.stringify(c));
    expect(seen).toEqual([0.5, 1]);
    const bad = sweepBands(twoRivals(), "rivals.7.cost", [1], { draws: 10, seed: 1 });
    expect(bad).toMatchObject({ ok: false, path: "rivals.7.cost" });
  });
});
