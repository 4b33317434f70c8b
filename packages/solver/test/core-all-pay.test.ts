// All-pay auction mixed equilibria: Hillman & Riley 1989 (Economics & Politics 1); Baye,
// Kovenock & de Vries 1996 (Economic Theory 8); volume numbers from memory. Checked against
// the published formulas, a seeded Monte Carlo simulation, and numerical integration.
import { describe, expect, test } from "vitest";
import {
  allPayMixedGap,
  allPayMixedPayoff,
  allPaySymmetric,
  allPayTwoRival,
  mixedCdf,
  normalize,
  solve,
} from "../src/index";
import type { MixedStrategy, RivalSpec } from "../src/types";
import fmin from "./fminLoader";

const auction = (rivals: RivalSpec[], prize = 100) =>
  normalize({ title: "test", prize, csf: { kind: "allpay" }, rivals });

/** Park-Miller generator: a fixed, documented stream for the simulation. */
function lcg(seed: number) {
  let s = seed;
  return () => {
    s = (s * 16807) % 2147483647;
    return s / 2147483647;
  };
}
function draw(s: MixedStrategy, u: number, u2: number): number {
  if (u < s.atomAtZero) return 0;
  return s.low + (s.high - s.low) * Math.pow(u2, 1 / (s.cdfExponent ?? 1));
}

describe("two rivals (Hillman & Riley 1989; Baye, Kovenock & de Vries 1996)", () => {
  test("allPayTwoRival(v1=100, v2=60, unit costs) gives expected efforts v2/2, v2^2/(2 v1) and payoffs v1-v2, 0", () => {
    const c = auction([
      { name: "a", cost: 1 },
      { name: "b", cost: 1, value: 60 },
    ]);
    const eq = allPayTwoRival(c)!;
    expect(eq.kind).toBe("mixed");
    expect(eq.efforts).toBeNull();
    expect(eq.expectedEfforts![0]).toBeCloseTo(30, 12);
    expect(eq.expectedEfforts![1]).toBeCloseTo(18, 12);
    expect(eq.payoffs).toEqual([40, 0]);
    expect(eq.strategies![1]!.atomAtZero).toBeCloseTo(0.4, 12);
    expect(eq.nashGap).toBeLessThan(1e-6);
  });

  test("allPayTwoRival with costs uses V = v/m: payoffs match numerical integration and shares match simulation", () => {
    const c = auction([
      { name: "a", cost: 2, value: 100 }, // V = 50
      { name: "b", cost: 1, value: 80 }, // V = 80, the stronger
    ]);
    const eq = allPayTwoRival(c)!;
    expect(eq.expectedEfforts![1]).toBeCloseTo(25, 12);
    expect(eq.expectedEfforts![0]).toBeCloseTo((50 * 50) / 160, 12);
    expect(eq.payoffs![1]).toBeCloseTo(80 - 50, 12);
    expect(eq.payoffs![0]).toBe(0);
    for (const i of [0, 1]) {
      expect(allPayMixedPayoff(c, eq.strategies!, i)).toBeCloseTo(eq.payoffs![i]!, 4);
    }
    const rnd = lcg(20240601);
    let winsA = 0;
    let spendA = 0;
    const N = 200000;
    for (let k = 0; k < N; k++) {
      const a = draw(eq.strategies![0]!, rnd(), rnd());
      const b = draw(eq.strategies![1]!, rnd(), rnd());
      if (a > b) winsA++;
      spendA += a;
    }
    // Monte Carlo standard error is about 0.001 for the share
    expect(Math.abs(winsA / N - eq.shares![0]!)).toBeLessThan(0.005);
    expect(Math.abs(spendA / N - eq.expectedEfforts![0]!)).toBeLessThan(0.2);
  });

  test("allPayMixedGap detects a wrong strategy (rival 1 uniform on too short a range)", () => {
    const c = auction([
      { name: "a", cost: 1 },
      { name: "b", cost: 1, value: 60 },
    ]);
    const eq = allPayTwoRival(c)!;
    const wrong = eq.strategies!.map((s, i) =>
      i === 0 ? { ...s, high: 0.8 * s.high, mean: 0.4 * s.high } : s,
    );
    expect(allPayMixedGap(c, wrong)).toBeGreaterThan(1);
  });

  test("solve(three rivals, distinct V) keeps only the two strongest active", () => {
    const c = auction([
      { name: "a", cost: 1, value: 50 },
      { name: "b", cost: 1, value: 90 },
      { name: "c", cost: 1, value: 70 },
    ]);
    const eq = solve(c).equilibrium;
    expect(eq.active).toEqual([false, true, true]);
    expect(eq.nashGap).toBeLessThan(1e-6);
  });
});

describe("no profitable pure deviation, searched by Nelder-Mead (fmin)", () => {
  // CDFs written out from the published formulas, independent of the solver's records
  const twoRivalCdfs = (V1: number, V2: number) => [
    (x: number) => Math.min(1, Math.max(0, x / V2)), // strong rival: uniform on [0, V2]
    (x: number) => Math.min(1, 1 - V2 / V1 + Math.max(0, x) / V1), // weak rival: atom + uniform
  ];
  const bestDeviation = (u: (x: number) => number, top: number) => {
    let best = -Infinity;
    for (const f of [0.05, 0.3, 0.6, 0.95, 1.2]) {
      const r = fmin.nelderMead((z) => -u(Math.abs(z[0]!)), [f * top], { minErrorDelta: 1e-12 });
      best = Math.max(best, u(Math.abs(r.x[0]!)));
    }
    return best;
  };

  test("allPayTwoRival(V1=80, V2=50): neither rival gains by any pure bid", () => {
    const c = auction([
      { name: "a", cost: 2, value: 100 },
      { name: "b", cost: 1, value: 80 },
    ]);
    const eq = allPayTwoRival(c)!;
    const [Fstrong, Fweak] = twoRivalCdfs(80, 50);
    const uStrong = (x: number) => 80 * Fweak!(x) - 1 * x; // rival b against a
    const uWeak = (x: number) => 100 * Fstrong!(x) - 2 * x; // rival a against b
    expect(bestDeviation(uStrong, 50)).toBeLessThanOrEqual(eq.payoffs![1]! + 1e-9);
    expect(bestDeviation(uWeak, 50)).toBeLessThanOrEqual(eq.payoffs![0]! + 1e-9);
    // and the support really pays the equilibrium payoff
    expect(uStrong(20)).toBeCloseTo(eq.payoffs![1]!, 12);
    expect(uWeak(20)).toBeCloseTo(eq.payoffs![0]!, 12);
  });

  test("allPaySymmetric(n=3, v=90, m=1.5): no pure bid beats payoff 0", () => {
    const c = auction([1, 2, 3].map((k) => ({ name: `r${k}`, cost: 1.5, value: 90 })));
    const eq = allPaySymmetric(c)!;
    const F = (x: number) => Math.min(1, Math.sqrt(Math.max(0, (1.5 * x) / 90)));
    const u = (x: number) => 90 * F(x) * F(x) - 1.5 * x;
    expect(bestDeviation(u, 60)).toBeLessThanOrEqual(1e-9);
    expect(eq.payoffs).toEqual([0, 0, 0]);
  });
});

describe("n identical rivals: symmetric mixed equilibrium", () => {
  test("allPaySymmetric(n=4, v=100, m=2): F(x) = (m x/v)^(1/3), expected total effort v/m", () => {
    const c = auction([1, 2, 3, 4].map((k) => ({ name: `r${k}`, cost: 2 })));
    const eq = allPaySymmetric(c)!;
    expect(eq.totalEffort).toBeCloseTo(50, 12);
    expect(eq.dissipation).toBeCloseTo(1, 12);
    const s = eq.strategies![0]!;
    expect(mixedCdf(s, 10)).toBeCloseTo(Math.cbrt((2 * 10) / 100), 12);
    // mean from the CDF by the trapezoid rule: E[x] = int_0^top (1 - F)
    const K = 20000;
    let mean = 0;
    for (let k = 0; k < K; k++) {
      const x0 = (50 * k) / K;
      const x1 = (50 * (k + 1)) / K;
      mean += 0.5 * (2 - mixedCdf(s, x0) - mixedCdf(s, x1)) * (x1 - x0);
    }
    expect(mean).toBeCloseTo(s.mean, 3);
    expect(eq.nashGap).toBeLessThan(1e-6);
    expect(eq.shares).toEqual([0.25, 0.25, 0.25, 0.25]);
  });

  test("allPayMixedGap(n=3, uniform instead of the power law) is positive", () => {
    const c = auction([1, 2, 3].map((k) => ({ name: `r${k}`, cost: 1 })));
    const eq = allPaySymmetric(c)!;
    const uniform = eq.strategies!.map((s) => ({ ...s, cdfExponent: 1, mean: s.high / 2 }));
    expect(allPayMixedGap(c, uniform)).toBeGreaterThan(1);
  });

  test("solve(three identical bidders) lists the symmetric equilibrium first and a two-bidder one as alternative", () => {
    const c = auction([1, 2, 3].map((k) => ({ name: `r${k}`, cost: 1 })));
    const res = solve(c);
    expect(res.equilibrium.method).toBe("closed-form:all-pay-symmetric");
    expect(res.alternatives).toHaveLength(1);
    expect(res.alternatives[0]!.nashGap).toBeLessThan(1e-6);
  });

  test("solve(all-pay with a weight) is reported as unsupported", () => {
    const c = auction([
      { name: "a", cost: 1, weight: 2 },
      { name: "b", cost: 1 },
    ]);
    const eq = solve(c).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.method).toBe("unsupported");
  });
});
