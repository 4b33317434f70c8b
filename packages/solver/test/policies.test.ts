import { describe, expect, it } from "vitest";
import {
  bestResponse,
  clampEffort,
  createPolicy,
  drawPoint,
  drawWinner,
  mulberry32,
  normalize,
  solve,
  validatePolicySpec,
  type Contest,
  type PolicyContext,
  type Scenario,
} from "../src/index";

const kiosk: Scenario = {
  title: "three rivals",
  prize: 120,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 1 },
    { name: "B", cost: 1.25 },
    { name: "C", cost: 1.6, budget: 50 },
  ],
};
const contest: Contest = normalize(kiosk);
const eq = solve(contest).equilibrium.efforts!;

const history = [{ efforts: [30, 10, 5] }, { efforts: [20, 25, 12] }, { efforts: [10, 40, 3] }];
const ctx = (self: number, h = history, step?: number): PolicyContext => ({
  contest,
  self,
  history: h,
  ...(step ? { step } : {}),
});

describe("rng", () => {
  it("mulberry32(seed) is deterministic and uniform-looking (mean 0.5 +- 0.01 over 20,000 draws)", () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const xs = Array.from({ length: 20_000 }, () => a());
    expect(xs.slice(0, 5)).toEqual(Array.from({ length: 5 }, () => b()));
    expect(xs.every((x) => x >= 0 && x < 1)).toBe(true);
    expect(Math.abs(xs.reduce((s, x) => s + x, 0) / xs.length - 0.5)).toBeLessThan(0.01);
  });

  it("drawWinner(shares, rng) picks winners with the given frequencies (within 0.015 over 20,000 draws)", () => {
    const rng = mulberry32(7);
    const shares = [0.5, 0.3, 0.2, 0];
    const counts = [0, 0, 0, 0];
    for (let k = 0; k < 20_000; k++) counts[drawWinner(shares, rng)]!++;
    counts.forEach((c, i) => expect(Math.abs(c / 20_000 - shares[i]!)).toBeLessThan(0.015));
    expect(counts[3]).toBe(0);
  });

  it("drawWinner(all zero) splits equally, the ratio-form convention", () => {
    const rng = mulberry32(3);
    const counts = [0, 0];
    for (let k = 0; k < 4000; k++) counts[drawWinner([0, 0], rng)]!++;
    expect(Math.abs(counts[0]! / 4000 - 0.5)).toBeLessThan(0.03);
  });
});

describe("createPolicy", () => {
  it("createPolicy(equilibrium) plays solve's efforts every round", () => {
    const p = createPolicy({ kind: "equilibrium" }, 1);
    for (let i = 0; i < 3; i++) {
      expect(p.decide(ctx(i, []))).toBeCloseTo(eq[i]!, 12);
      expect(p.decide(ctx(i))).toBeCloseTo(eq[i]!, 12);
    }
  });

  it("createPolicy(best-reply) equals bestResponse to last round's efforts, equilibrium in round 1", () => {
    const p = createPolicy({ kind: "best-reply" }, 1);
    expect(p.decide(ctx(1, []))).toBeCloseTo(eq[1]!, 12);
    for (let i = 0; i < 3; i++) {
      expect(p.decide(ctx(i))).toBeCloseTo(
        bestResponse(contest, i, history[2]!.efforts).effort,
        12,
      );
    }
  });

  it("createPolicy(best-reply) matches the r = 1 reply formula sqrt(v Z / m) - Z (Tullock 1980)", () => {
    const p = createPolicy({ kind: "best-reply" }, 1);
    const Z = 40 + 3;
    expect(p.decide(ctx(0))).toBeCloseTo(Math.sqrt((120 * Z) / 1) - Z, 8);
  });

  it("createPolicy(fictitious-play) best-responds to the average of past efforts (Brown 1951)", () => {
    const p = createPolicy({ kind: "fictitious-play" }, 1);
    const avg = [20, 25, 20 / 3];
    for (let i = 0; i < 3; i++) {
      expect(p.decide(ctx(i))).toBeCloseTo(bestResponse(contest, i, avg).effort, 10);
    }
  });

  it("createPolicy(fixed) clamps to the budget and rounds to the step", () => {
    const p = createPolicy({ kind: "fixed", effort: 77.3 }, 1);
    expect(p.decide(ctx(0))).toBe(77.3);
    expect(p.decide(ctx(0, history, 5))).toBe(75);
    expect(p.decide(ctx(2))).toBe(50 / 1.6); // rival C's budget of 50 (money) at cost 1.6
    expect(clampEffort(49, 50, 20)).toBe(40); // rounding up would break the budget
    // money: a fixed spend of 40 at C's cost 1.6 is effort 25 (spend = cost x effort)
    expect(createPolicy({ kind: "fixed", spend: 40 }, 1).decide(ctx(2))).toBe(25);
    expect(clampEffort(-3, 50)).toBe(0);
    expect(clampEffort(0.1 + 0.2, 50, 0.1)).toBe(0.3);
  });

  it("createPolicy(overspender) is deterministic for a seed and differs across seeds", () => {
    const a = createPolicy({ kind: "overspender" }, 11);
    const b = createPolicy({ kind: "overspender" }, 11);
    const c = createPolicy({ kind: "overspender" }, 12);
    const runs = (p: typeof a) => [0, 1, 2].map((i) => p.decide(ctx(i)));
    expect(runs(a)).toEqual(runs(b));
    expect(runs(a)).toEqual(runs(a)); // pure: asking twice gives the same answer
    expect(runs(a)).not.toEqual(runs(c));
  });

  it("createPolicy(overspender) spends about factor x equilibrium on average (Sheremeta 2013: ~70% overbidding, from memory)", () => {
    const p = createPolicy({ kind: "overspender" }, 5);
    let sum = 0;
    const rounds = 400;
    const h: { efforts: number[] }[] = [];
    for (let t = 0; t < rounds; t++) {
      const e = p.decide(ctx(0, h));
      sum += e;
      h.push({ efforts: [e, eq[1]!, eq[2]!] });
    }
    const ratio = sum / rounds / eq[0]!;
    expect(ratio).toBeGreaterThan(1);
    expect(Math.abs(ratio - 1.7)).toBeLessThan(0.05); // uniform noise +-20% averages out
  });

  it("createPolicy(overspender, decay) drifts toward equilibrium with repetition but stays above it", () => {
    const p = createPolicy({ kind: "overspender", factor: 2, noise: 0, decay: 0.9 }, 5);
    const early = p.decide(ctx(0, []));
    const late = p.decide(
      ctx(
        0,
        Array.from({ length: 30 }, () => ({ efforts: eq })),
      ),
    );
    expect(early).toBeCloseTo(2 * eq[0]!, 10);
    expect(late).toBeCloseTo(eq[0]! * (1 + 0.9 ** 30), 10);
    expect(late).toBeGreaterThan(eq[0]!);
  });

  it("createPolicy(equilibrium, all-pay) draws from the mixed strategy with its mean (Hillman & Riley 1989)", () => {
    // Prize 120, costs 1 and 1.25: in value per unit cost 120 and 96, so the weaker rival
    // spends nothing with probability 1 - 96/120 = 0.2 (Hillman & Riley 1989).
    const allpay = normalize({
      ...kiosk,
      csf: { kind: "allpay" },
      rivals: kiosk.rivals.slice(0, 2),
    });
    const res = solve(allpay).equilibrium;
    expect(res.kind).toBe("mixed");
    const m = res.strategies![1]!;
    expect(m.atomAtZero).toBeCloseTo(0.2, 9);
    const p = createPolicy({ kind: "equilibrium" }, 9);
    const draws: number[] = [];
    for (let t = 0; t < 4000; t++) {
      draws.push(
        p.decide({ contest: allpay, self: 1, history: new Array(t).fill({ efforts: [0, 0] }) }),
      );
    }
    const mean = draws.reduce((a, b) => a + b, 0) / draws.length;
    expect(Math.abs(mean - m.mean) / m.mean).toBeLessThan(0.05);
    const zeros = draws.filter((d) => d === 0).length / draws.length;
    expect(Math.abs(zeros - m.atomAtZero)).toBeLessThan(0.03);
    expect(draws.every((d) => d >= 0 && d <= m.high)).toBe(true);
  });

  it("createPolicy(equilibrium, three identical all-pay rivals) draws from F(x) = (x / v)^(1/2) (Baye, Kovenock & de Vries 1996)", () => {
    // symmetric all-pay auction, n rivals, value v, cost 1: F(x) = (x / v)^(1/(n-1)) on [0, v]
    const allpay = normalize({
      ...kiosk,
      csf: { kind: "allpay" },
      rivals: [0, 1, 2].map((k) => ({ name: `Stall ${k}`, cost: 1 })),
    });
    const v = allpay.prize;
    const p = createPolicy({ kind: "equilibrium" }, 5);
    const draws: number[] = [];
    for (let t = 0; t < 4000; t++) {
      draws.push(
        p.decide({ contest: allpay, self: 0, history: new Array(t).fill({ efforts: [0, 0, 0] }) }),
      );
    }
    // the share of draws below v/4 is F(v/4) = 1/2 (a uniform draw would give 1/4); mean v/3
    const below = draws.filter((d) => d < v / 4).length / draws.length;
    expect(Math.abs(below - 0.5)).toBeLessThan(0.03);
    const mean = draws.reduce((a, b) => a + b, 0) / draws.length;
    expect(Math.abs(mean - v / 3) / (v / 3)).toBeLessThan(0.05);
  });

  it("createPolicy(equilibrium, two rivals with r = 3) draws from the finite mixed strategy's points (Ewerhart 2015)", () => {
    const c = normalize({
      ...kiosk,
      csf: { kind: "ratio", decisiveness: 3 },
      rivals: kiosk.rivals.slice(0, 2),
    });
    const res = solve(c).equilibrium;
    expect(res.kind).toBe("mixed");
    const pts = res.strategies![0]!.points!;
    const p = createPolicy({ kind: "equilibrium" }, 11);
    const draws: number[] = [];
    for (let t = 0; t < 4000; t++) {
      draws.push(
        p.decide({ contest: c, self: 0, history: new Array(t).fill({ efforts: [0, 0] }) }),
      );
    }
    // every draw is a support point, and the mean matches the expected effort
    for (const d of draws) expect(pts.some((q) => q.effort === d)).toBe(true);
    const mean = draws.reduce((a, b) => a + b, 0) / draws.length;
    expect(Math.abs(mean - res.expectedEfforts![0]!) / res.expectedEfforts![0]!).toBeLessThan(0.05);
    expect(drawPoint(pts, 0)).toBe(pts[0]!.effort);
  });

  it("every policy has a label and a description", () => {
    for (const kind of ["equilibrium", "best-reply", "fictitious-play", "overspender"] as const) {
      const p = createPolicy({ kind }, 0);
      expect(p.label.length).toBeGreaterThan(3);
      expect(p.description.length).toBeGreaterThan(10);
    }
  });
});

describe("validatePolicySpec", () => {
  it("validatePolicySpec(valid specs) accepts them", () => {
    expect(
      validatePolicySpec({ kind: "overspender", factor: 1.5, noise: 0.1, decay: 0.95 }).ok,
    ).toBe(true);
    expect(validatePolicySpec({ kind: "fixed", effort: 0 }).ok).toBe(true);
    expect(validatePolicySpec({ kind: "fixed", spend: 12 }).ok).toBe(true);
    expect(validatePolicySpec({ kind: "fixed", spend: 1, effort: 1 }).ok).toBe(false);
  });

  it("validatePolicySpec(bad specs) names the field", () => {
    const path = (x: unknown) => {
      const r = validatePolicySpec(x);
      return r.ok ? "ok" : r.path;
    };
    expect(path({ kind: "genius" })).toBe("kind");
    expect(path({ kind: "fixed", effort: -1 })).toBe("effort");
    expect(path({ kind: "overspender", noise: 2 })).toBe("noise");
    expect(path({ kind: "overspender", decay: 0 })).toBe("decay");
    expect(path({ kind: "equilibrium", effort: 3 })).toBe("effort");
  });
});
