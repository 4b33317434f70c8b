import { describe, expect, it } from "vitest";
import {
  normalize,
  plan1d,
  plan2d,
  planAxis,
  prepareSweep1d,
  prepareSweep2d,
  setParam,
  solve,
  sweep1d,
  sweep2d,
  sweepChunk,
  type Scenario,
} from "../src/index";

const twoRivals = (m1: number, m2: number): Scenario => ({
  title: "two rivals",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "One", cost: m1 },
    { name: "Two", cost: m2 },
  ],
});

const fiveRivals: Scenario = {
  title: "five rivals",
  prize: 1000,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [1, 1.2, 1.5, 2, 3].map((cost, i) => ({ name: `R${i}`, cost })),
};

describe("setParam", () => {
  it("setParam(scenario, rivals.1.cost, 3) changes only that field", () => {
    const base = twoRivals(1, 2);
    const r = setParam(base, "rivals.1.cost", 3);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.rivals[1]!.cost).toBe(3);
    expect(r.value.rivals[0]).toBe(base.rivals[0]);
    expect(base.rivals[1]!.cost).toBe(2);
  });

  it("setParam(scenario, prize | csf.decisiveness) sets top-level parameters", () => {
    const p = setParam(twoRivals(1, 2), "prize", 50);
    const d = setParam(twoRivals(1, 2), "csf.decisiveness", 0.5);
    expect(p.ok && p.value.prize).toBe(50);
    expect(d.ok && d.value.csf).toEqual({ kind: "ratio", decisiveness: 0.5 });
  });

  for (const bad of [
    "rivals.2.cost",
    "rivals.x.cost",
    "rivals.0.colour",
    "csf.scale",
    "price",
    "",
  ]) {
    it(`setParam(scenario, "${bad}") is a typed path error`, () => {
      const r = setParam(twoRivals(1, 2), bad, 1);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message.length).toBeGreaterThan(5);
    });
  }
});

describe("sweep1d", () => {
  it("sweep1d(two rivals, m2 = 1..10, m1 = 5) shows e1 rising then falling, peak at m2 = m1 (Hillman & Riley 1989)", () => {
    const r = sweep1d(twoRivals(5, 1), { param: "rivals.1.cost", from: 1, to: 10, steps: 19 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const e1 = r.value.efforts[0] as number[];
    // Reference: e_1 = v m_2 / (m_1 + m_2)^2 (Hillman & Riley 1989, two rivals, common v).
    r.value.values.forEach((m2, k) => expect(e1[k]).toBeCloseTo((100 * m2) / (5 + m2) ** 2, 9));
    const peak = e1.indexOf(Math.max(...e1));
    expect(r.value.values[peak]).toBeCloseTo(5, 12);
    for (let k = 1; k <= peak; k++) expect(e1[k]!).toBeGreaterThan(e1[k - 1]!);
    for (let k = peak + 1; k < e1.length; k++) expect(e1[k]!).toBeLessThan(e1[k - 1]!);
  });

  it("sweep1d(five rivals, prize) has one series entry per point and agrees with solve", () => {
    const r = sweep1d(fiveRivals, { param: "prize", from: 500, to: 1500, steps: 11 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const sw = r.value;
    expect(sw.param).toBe("prize");
    expect(sw.values).toHaveLength(11);
    expect(sw.efforts).toHaveLength(5);
    expect(sw.payoffs).toHaveLength(5);
    for (const s of [...sw.efforts, ...sw.payoffs]) expect(s).toHaveLength(11);
    expect(sw.totalEffort).toHaveLength(11);
    expect(sw.dissipation).toHaveLength(11);
    expect(sw.kinds.every((k) => k === "pure")).toBe(true);
    for (const k of [0, 4, 10]) {
      const eq = solve(normalize({ ...fiveRivals, prize: sw.values[k]! })).equilibrium;
      for (let i = 0; i < 5; i++) expect(sw.efforts[i]![k]).toBeCloseTo(eq.efforts![i]!, 9);
      expect(sw.totalEffort[k]).toBeCloseTo(eq.totalEffort, 9);
      expect(sw.dissipation[k]).toBeCloseTo(eq.dissipation, 12);
    }
  });

  it("sweep1d(r = 1, prize) scales efforts linearly in the prize (homogeneity of the Tullock game)", () => {
    const r = sweep1d(fiveRivals, { param: "prize", from: 1000, to: 2000, steps: 2 });
    if (!r.ok) throw new Error(r.message);
    for (let i = 0; i < 5; i++)
      expect(r.value.efforts[i]![1]).toBeCloseTo(2 * r.value.efforts[i]![0]!, 9);
  });

  it("sweep1d(onProgress) reports progress up to the total", () => {
    const calls: [number, number][] = [];
    sweep1d(fiveRivals, { param: "prize", from: 1, to: 2, steps: 600 }, (d, t) =>
      calls.push([d, t]),
    );
    expect(calls.length).toBeGreaterThan(1);
    expect(calls.at(-1)).toEqual([600, 600]);
  });

  it("sweep1d(invalid range) names the offending end and field", () => {
    const r = sweep1d(fiveRivals, { param: "rivals.0.cost", from: -1, to: 2, steps: 3 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.path).toBe("sweep.from");
      expect(r.message).toContain("rivals.0.cost");
    }
    const s = sweep1d(fiveRivals, { param: "prize", from: 1, to: 2, steps: 0 });
    expect(!s.ok && s.path).toBe("sweep.steps");
    const p = sweep1d(fiveRivals, { param: "rivals.9.cost", from: 1, to: 2, steps: 3 });
    expect(!p.ok && p.path).toBe("sweep.param");
  });

  it("sweepChunk(plan, start, end) pieces concatenate to the whole sweep", () => {
    const axis = planAxis(
      fiveRivals,
      { param: "rivals.2.cost", from: 0.5, to: 4, steps: 25 },
      "sweep",
      100,
    );
    if (!axis.ok) throw new Error(axis.message);
    const plan = plan1d(fiveRivals, axis.value);
    const whole = sweepChunk(plan, 0, plan.count);
    const pieces = [
      ...sweepChunk(plan, 0, 7),
      ...sweepChunk(plan, 7, 20),
      ...sweepChunk(plan, 20, 99),
    ];
    expect(pieces).toEqual(whole);
    expect(whole).toHaveLength(25);
  });
});

describe("prepareSweep1d / prepareSweep2d", () => {
  it("prepareSweep1d(...).chunk pieces finish to the same series as sweep1d", () => {
    const spec = { param: "rivals.0.value", from: 500, to: 2000, steps: 30 };
    const prepared = prepareSweep1d(fiveRivals, spec);
    if (!prepared.ok) throw new Error(prepared.message);
    const { count, chunk, finish } = prepared.value;
    expect(count).toBe(30);
    const points = [];
    for (let k = 0; k < count; k += 8) points.push(...chunk(k, k + 8));
    const direct = sweep1d(fiveRivals, spec);
    expect(direct.ok && finish(points)).toEqual(direct.ok && direct.value);
  });

  it("prepareSweep2d(...).chunk pieces finish to the same grid as sweep2d", () => {
    const spec = {
      x: { param: "rivals.0.cost", from: 1, to: 2, steps: 5 },
      y: { param: "prize", from: 100, to: 200, steps: 4 },
    };
    const prepared = prepareSweep2d(fiveRivals, spec, "dissipation");
    if (!prepared.ok) throw new Error(prepared.message);
    const { count, chunk, finish } = prepared.value;
    const points = [...chunk(0, 7), ...chunk(7, count)];
    const direct = sweep2d(fiveRivals, spec, "dissipation");
    expect(direct.ok && finish(points)).toEqual(direct.ok && direct.value);
  });
});

describe("sweep2d", () => {
  it("sweep2d(x = m0, y = m1) returns a y-by-x grid whose cells agree with solve", () => {
    const r = sweep2d(
      fiveRivals,
      {
        x: { param: "rivals.0.cost", from: 0.5, to: 2, steps: 4 },
        y: { param: "rivals.1.cost", from: 1, to: 3, steps: 3 },
      },
      "effort.0",
    );
    if (!r.ok) throw new Error(r.message);
    expect(r.value.z).toHaveLength(3);
    expect(r.value.z[0]).toHaveLength(4);
    const [ix, iy] = [2, 1];
    const s = structuredClone(fiveRivals);
    s.rivals[0]!.cost = r.value.x.values[ix]!;
    s.rivals[1]!.cost = r.value.y.values[iy]!;
    expect(r.value.z[iy]![ix]).toBeCloseTo(solve(normalize(s)).equilibrium.efforts![0]!, 9);
  });

  it("plan2d(point k) is row-major: x varies fastest", () => {
    const x = planAxis(fiveRivals, { param: "prize", from: 1, to: 3, steps: 3 }, "x", 10);
    const y = planAxis(fiveRivals, { param: "rivals.0.cost", from: 1, to: 2, steps: 2 }, "y", 10);
    if (!x.ok || !y.ok) throw new Error("bad axes");
    const plan = plan2d(fiveRivals, x.value, y.value);
    expect(plan.count).toBe(6);
    expect(sweepChunk(plan, 0, 6).map((p) => p.value)).toEqual([1, 2, 3, 1, 2, 3]);
  });

  it("sweep2d(same parameter twice | bad metric) is a typed error", () => {
    const axis = { param: "prize", from: 1, to: 2, steps: 2 };
    const same = sweep2d(fiveRivals, { x: axis, y: axis });
    expect(!same.ok && same.path).toBe("y.param");
    const metric = sweep2d(
      fiveRivals,
      { x: axis, y: { ...axis, param: "rivals.0.cost" } },
      "effort.9" as const,
    );
    expect(!metric.ok && metric.path).toBe("metric");
  });
});
