import { describe, expect, it } from "vitest";
import {
  drawValues,
  percentile7,
  percentilesInPlace,
  quantile,
  runUncertain,
  solveDraw,
  uncertainParams,
  type UncertainScenario,
} from "../src/uncertain";
import { A, B, closedFormE1, simpson, twoRivals, V } from "./uncertainFixture";

const C1 = 1;

// rival 0's equilibrium effort at C1 (Hillman & Riley 1989; Nti 1999)
const e1 = (c2: number) => closedFormE1(C1, c2);

describe("runUncertain against exact expectations", () => {
  const N = 20_000;
  const res = runUncertain(twoRivals(), { draws: N, seed: 12345 });

  it("runUncertain(two rivals, c2 ~ U[1, 3]) mean effort of rival 0 lies within 4 standard errors of the quadrature", () => {
    // E[e1] and E[e1^2] by Simpson's rule over the uniform density 1 / (B - A).
    const m1 = simpson(e1, A, B) / (B - A);
    const m2 = simpson((c) => e1(c) ** 2, A, B) / (B - A);
    const se = Math.sqrt((m2 - m1 * m1) / N);
    expect(res.noPureEquilibrium).toBe(0);
    expect(Math.abs(res.efforts.mean[0]! - m1)).toBeLessThan(4 * se);
    // a check that can fail: a shifted target is far outside the band
    expect(Math.abs(res.efforts.mean[0]! - 1.02 * m1)).toBeGreaterThan(4 * se);
  });

  it("runUncertain(two rivals) P10/P50/P90 of rival 0's effort lie within the binomial interval of their order statistics", () => {
    // e1 falls in c2 on [c1, inf): P(e1 <= x) = P(c2 >= c*(x)) with c*(x) the larger root of
    // x (c1 + c)^2 = v c.
    const cdf = (x: number) => {
      const b = V - 2 * x * C1;
      const c = (b + Math.sqrt(b * b - 4 * x * x * C1 * C1)) / (2 * x);
      return Math.min(1, Math.max(0, (B - c) / (B - A)));
    };
    for (const [p, got] of [
      [0.1, res.efforts.p10[0]!],
      [0.5, res.efforts.p50[0]!],
      [0.9, res.efforts.p90[0]!],
    ] as const) {
      // The count of draws below the true p-quantile is Binomial(N, p): the reported percentile
      // (between order statistics k and k + 1, k = floor((N - 1) p)) must sit at a true rank
      // N F(x) within 4 binomial standard deviations of N p, plus one rank for interpolation.
      const rank = N * cdf(got);
      const sd = Math.sqrt(N * p * (1 - p));
      expect(Math.abs(rank - N * p)).toBeLessThan(4 * sd + 1);
    }
    // spends are money: rival 1's spend is its drawn cost times its effort, so its mean differs
    // from its mean effort; rival 0's cost is 1, so spend equals effort.
    expect(res.spends.mean[0]).toBeCloseTo(res.efforts.mean[0]!, 12);
    const e2 = (c2: number) => (V * C1) / (C1 + c2) ** 2;
    const spend2 = simpson((c) => c * e2(c), A, B) / (B - A);
    const sd2 = Math.sqrt((simpson((c) => (c * e2(c)) ** 2, A, B) / (B - A) - spend2 ** 2) / N);
    expect(Math.abs(res.spends.mean[1]! - spend2)).toBeLessThan(4 * sd2);
  });

  it("runUncertain(symmetric rivals, prize triangular) mean effort matches the symmetric closed form at the mean prize", () => {
    // Tullock 1980: e* = r v (n - 1) / (m n^2), linear in v, so E[e*] = E[v] (n - 1) / (m n^2),
    // with E[v] = (low + mode + high) / 3 for the triangular distribution.
    const s: UncertainScenario = {
      title: "Three alike",
      prize: { dist: "triangular", low: 50, mode: 60, high: 150 },
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: ["X", "Y", "Z"].map((name) => ({ name, cost: 2 })),
    };
    const n = 3;
    const r = runUncertain(s, { draws: 20_000, seed: 9 });
    const k = (n - 1) / (2 * n * n);
    const mean = (50 + 60 + 150) / 3;
    // variance of the triangular distribution: (a^2 + b^2 + c^2 - ab - ac - bc) / 18
    const variance = (50 ** 2 + 60 ** 2 + 150 ** 2 - 50 * 60 - 50 * 150 - 60 * 150) / 18;
    const se = k * Math.sqrt(variance / 20_000);
    expect(Math.abs(r.efforts.mean[0]! - k * mean)).toBeLessThan(4 * se);
    expect(r.activeProbability).toEqual([1, 1, 1]);
  });
});

describe("runUncertain bookkeeping", () => {
  it("runUncertain(draws with and without a pure equilibrium) counts the latter apart and bands only the former", () => {
    // r = 1.5, two rivals: the pure candidate fails when the weaker rival's participation fails
    // (Wang 2010), so some draws of a wide cost range have no pure equilibrium.
    const s: UncertainScenario = {
      title: "Decisive",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 1.5 },
      rivals: [
        { name: "P", cost: 1 },
        { name: "Q", cost: { dist: "uniform", low: 0.8, high: 4 } },
      ],
    };
    const N = 120;
    const r = runUncertain(s, { draws: N, seed: 3 });
    const params = uncertainParams(s);
    const pureEfforts: number[] = [];
    for (let d = 0; d < N; d++) {
      const eq = solveDraw(s, params, 3, d).equilibrium;
      if (eq.kind === "pure") pureEfforts.push(eq.efforts![1]!);
    }
    expect(pureEfforts.length).toBeGreaterThan(0);
    expect(pureEfforts.length).toBeLessThan(N);
    expect(r.pureDraws).toBe(pureEfforts.length);
    expect(r.noPureEquilibrium).toBeCloseTo((N - pureEfforts.length) / N, 15);
    const sorted = pureEfforts.slice().sort((a, b) => a - b);
    expect(r.efforts.p50[1]).toBeCloseTo(percentile7(sorted, 0.5), 12);
  });

  it("runUncertain(all-pay) has no pure draw: the bands are null and the fraction is 1", () => {
    const s: UncertainScenario = {
      title: "All-pay",
      prize: { dist: "uniform", low: 10, high: 20 },
      csf: { kind: "allpay" },
      rivals: [
        { name: "P", cost: 1 },
        { name: "Q", cost: 2 },
      ],
    };
    const r = runUncertain(s, { draws: 50, seed: 1, planRival: 0 });
    expect(r.noPureEquilibrium).toBe(1);
    expect(r.efforts.p50).toEqual([null, null]);
    expect(r.activeProbability).toEqual([null, null]);
    expect(r.plan?.drawsUsed).toBe(0);
  });

  it("percentile7(known sample) follows Hyndman & Fan definition 7", () => {
    // R's default quantile(c(1, 2, 4, 8), 0.1) = 1.3; 0.5 -> 3; 0.9 -> 6.8 (computed by hand:
    // h = 3p, linear interpolation between order statistics).
    const xs = [1, 2, 4, 8];
    expect(percentile7(xs, 0.1)).toBeCloseTo(1.3, 12);
    expect(percentile7(xs, 0.5)).toBeCloseTo(3, 12);
    expect(percentile7(xs, 0.9)).toBeCloseTo(6.8, 12);
  });

  it("percentilesInPlace(random arrays with ties) equals type 7 on the sorted copy", () => {
    let seed = 1;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (const n of [1, 2, 3, 10, 101, 1000]) {
      const xs = Array.from({ length: n }, () => Math.round(rnd() * 20) / 4);
      const sorted = xs.slice().sort((a, b) => a - b);
      const got = percentilesInPlace(Float64Array.from(xs), [0, 0.1, 0.5, 0.9, 1]);
      [0, 0.1, 0.5, 0.9, 1].forEach((p, k) => expect(got[k]).toBe(percentile7(sorted, p)));
    }
  });

  it("drawValues(seed, d) is the same draw whatever the run length, and draws follow the range", () => {
    const params = uncertainParams(twoRivals());
    expect(Array.from(drawValues(params, 5, 17))).toEqual(Array.from(drawValues(params, 5, 17)));
    const xs = Array.from({ length: 4000 }, (_, d) => drawValues(params, 5, d)[0]!);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(A);
    expect(Math.max(...xs)).toBeLessThanOrEqual(B);
    // quantile() inverts the CDF: the triangular median is below the mode when skewed left
    const tri = { dist: "triangular", low: 0, mode: 1, high: 1 } as const;
    // F(x) = x^2 on [0, 1], so the median is sqrt(0.5)
    expect(quantile(tri, 0.5)).toBeCloseTo(Math.SQRT1_2, 12);
  });
});

describe("tornado", () => {
  it("runUncertain(two unknowns) swings equal the closed-form payoffs at P90 minus P10, sorted by size", () => {
    // Two rivals, r = 1, common v: u1 = v c2^2 / (c1 + c2)^2 and u2 = v c1^2 / (c1 + c2)^2
    // (from Hillman & Riley 1989's efforts e1 = v c2 / (c1 + c2)^2).
    const s: UncertainScenario = {
      title: "Two unknown costs",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: [
        { name: "P", cost: { dist: "uniform", low: 0.9, high: 1.1 } },
        { name: "Q", cost: { dist: "uniform", low: 1, high: 3 } },
      ],
    };
    const r = runUncertain(s, { draws: 10, seed: 1 });
    const u = (c1: number, c2: number) => [
      (100 * c2 * c2) / (c1 + c2) ** 2,
      (100 * c1 * c1) / (c1 + c2) ** 2,
    ];
    expect(r.sensitivity.map((t) => t.parameter)).toEqual(["rivals.1.cost", "rivals.0.cost"]);
    const [q, p] = r.sensitivity;
    expect(q!.low).toBeCloseTo(1.2, 12);
    expect(q!.high).toBeCloseTo(2.8, 12);
    const qSwing = u(1, 2.8).map((x, i) => x - u(1, 1.2)[i]!);
    const pSwing = u(1.08, 2).map((x, i) => x - u(0.92, 2)[i]!);
    q!.payoffSwing.forEach((x, i) => expect(x).toBeCloseTo(qSwing[i]!, 9));
    p!.payoffSwing.forEach((x, i) => expect(x).toBeCloseTo(pSwing[i]!, 9));
  });
});
