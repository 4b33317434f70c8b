import { describe, expect, it } from "vitest";
import {
  comparativeStatics,
  normalize,
  richardson,
  solve,
  type Scenario,
  type StaticsRow,
} from "../src/index";

const twoRivals = (m1: number, m2: number, v = 100): Scenario => ({
  title: "two rivals",
  prize: v,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "One", cost: m1 },
    { name: "Two", cost: m2 },
  ],
});

// Four asymmetric rivals, r = 1: one has its own value, one a weight, and one drops out
// (a_i = m_i / (w_i v_i) = 1, 1.25, 0.8, 4: the last is outside the Hillman-Riley active set).
const fourRivals: Scenario = {
  title: "four rivals",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 100 / 100 },
    { name: "B", cost: 1, value: 80 },
    { name: "C", cost: 1.2, weight: 1.5 },
    { name: "D", cost: 4 },
  ],
};

function row(rows: StaticsRow[], param: string): StaticsRow {
  const r = rows.find((x) => x.param === param);
  if (!r) throw new Error(`no row ${param}`);
  return r;
}

describe("richardson", () => {
  it("richardson(sin, 1) matches cos(1) to 1e-10 (central differences, one extrapolation)", () => {
    const d = richardson((x) => [Math.sin(x), x ** 3], 1, { step: 1e-2 });
    expect(d.d[0]).toBeCloseTo(Math.cos(1), 10);
    expect(d.d[1]).toBeCloseTo(3, 10);
    expect(d.scheme).toBe("central");
  });

  it("richardson(at a lower bound) switches to forward differences", () => {
    const d = richardson((x) => [Math.exp(x)], 0, { step: 1e-3, lowerBound: 0 });
    expect(d.scheme).toBe("forward");
    expect(d.d[0]).toBeCloseTo(1, 6);
  });
});

describe("comparativeStatics", () => {
  it("refuses an approximate mixed equilibrium (three rivals at r = 3) and names why", () => {
    const three: Scenario = {
      title: "t",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 3 },
      rivals: [1, 1.2, 1.5].map((cost, i) => ({ name: `R${i}`, cost })),
    };
    const r = comparativeStatics(three);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/approximate mixed one .* too coarse to differentiate/);
  });

  it("comparativeStatics(two rivals, r = 1) gives d e1/d m2 = v (m1 - m2) / (m1 + m2)^3 (Hillman & Riley 1989)", () => {
    for (const [m1, m2] of [
      [5, 2],
      [2, 5],
      [1, 1.3],
    ] as const) {
      const res = comparativeStatics(twoRivals(m1, m2));
      if (!res.ok) throw new Error(res.message);
      const r = row(res.value.rows, "rivals.1.cost");
      expect(r.method).toBe("analytic");
      expect(r.effort.d[0]).toBeCloseTo((100 * (m1 - m2)) / (m1 + m2) ** 3, 10);
      // Own cost: d e1/d m1 = -2 v m2 / (m1 + m2)^3 < 0 (differentiating the same formula).
      expect(row(res.value.rows, "rivals.0.cost").effort.d[0]).toBeCloseTo(
        (-200 * m2) / (m1 + m2) ** 3,
        10,
      );
    }
  });

  it("comparativeStatics(two rivals) shows d e1/d m2 changing sign at m1 = m2 (Hillman & Riley 1989)", () => {
    const sign = (m1: number) => {
      const res = comparativeStatics(twoRivals(m1, 2), { params: ["rivals.1.cost"] });
      if (!res.ok) throw new Error(res.message);
      return res.value.rows[0]!.effort.d[0]!;
    };
    expect(sign(1.9)).toBeLessThan(0); // favourite relaxes when the underdog weakens
    expect(Math.abs(sign(2))).toBeLessThan(1e-12);
    expect(sign(2.1)).toBeGreaterThan(0); // underdog tries harder when the favourite weakens
  });

  it("comparativeStatics(four rivals, analytic) agrees with the numeric derivative on every row", () => {
    const a = comparativeStatics(fourRivals);
    const n = comparativeStatics(fourRivals, { method: "numeric" });
    if (!a.ok || !n.ok) throw new Error("statics failed");
    expect(a.value.efforts[3]).toBe(0);
    const analyticRows = a.value.rows.filter((r) => r.method === "analytic");
    expect(analyticRows.length).toBe(13); // cost, value, weight for 4 rivals, and the prize
    for (const ra of analyticRows) {
      const rn = row(n.value.rows, ra.param);
      expect(rn.method).toBe("numeric");
      for (let i = 0; i < 4; i++) {
        const scaleE = Math.max(1, Math.abs(ra.effort.d[i]!));
        const scaleU = Math.max(1, Math.abs(ra.payoff.d[i]!));
        expect(Math.abs(ra.effort.d[i]! - rn.effort.d[i]!) / scaleE).toBeLessThan(1e-6);
        expect(Math.abs(ra.payoff.d[i]! - rn.payoff.d[i]!) / scaleU).toBeLessThan(1e-6);
      }
      expect(ra.totalEffort.d).toBeCloseTo(rn.totalEffort.d, 5);
    }
    // The dropout's parameters move nobody (a locally stable active set).
    expect(row(a.value.rows, "rivals.3.cost").effort.d.every((d) => d === 0)).toBe(true);
    // Decisiveness has no closed-form derivative here: numeric.
    expect(row(a.value.rows, "csf.decisiveness").method).toBe("numeric");
  });

  it("comparativeStatics(symmetric, r = 1) has prize elasticity 1 for every effort (efforts are linear in v; Tullock 1980)", () => {
    const s: Scenario = {
      ...twoRivals(1, 1),
      rivals: [1, 2, 3].map((i) => ({ name: `R${i}`, cost: 2 })),
    };
    const res = comparativeStatics(s, { params: ["prize"] });
    if (!res.ok) throw new Error(res.message);
    for (const e of res.value.rows[0]!.effort.elasticity) expect(e).toBeCloseTo(1, 10);
    // Payoffs v/n^2 per rival with r = 1 are linear in v too.
    for (const e of res.value.rows[0]!.payoff.elasticity) expect(e).toBeCloseTo(1, 10);
  });

  it("comparativeStatics(two rivals, r = 0.5, values differ) matches the derivative of Nti's closed form (Nti 1999)", () => {
    // Nti 1999 (Public Choice 98, volume from memory), unit costs:
    // e1 = r v1^(1+r) v2^r / (v1^r + v2^r)^2; with A = v1^r, B = v2^r,
    // d e1 / d v2 = r^2 v1 A B (A - B) / (v2 (A + B)^3), derived by hand.
    const [r, v1, v2] = [0.5, 120, 60];
    const s: Scenario = {
      title: "Nti",
      prize: 100,
      csf: { kind: "ratio", decisiveness: r },
      rivals: [
        { name: "One", cost: 1, value: v1 },
        { name: "Two", cost: 1, value: v2 },
      ],
    };
    const res = comparativeStatics(s, { params: ["rivals.1.value"] });
    if (!res.ok) throw new Error(res.message);
    const A = v1 ** r;
    const B = v2 ** r;
    const expected = (r * r * v1 * A * B * (A - B)) / (v2 * (A + B) ** 3);
    const got = res.value.rows[0]!;
    expect(got.method).toBe("numeric");
    expect(got.effort.d[0]).toBeCloseTo(expected, 7);
    expect(got.errorEstimate).toBeLessThan(1e-6);
  });

  it("comparativeStatics(binding budget) reports the budget row numerically with d e_i/d B_i = 1/m_i", () => {
    // Budgets are money: a capped rival's effort is B / m, so d e_1 / d B = 1 / m_1.
    const m1 = 2;
    const s: Scenario = {
      ...twoRivals(1, 1),
      rivals: [
        { name: "One", cost: m1, budget: 10 },
        { name: "Two", cost: 1 },
      ],
    };
    const res = comparativeStatics(s);
    if (!res.ok) throw new Error(res.message);
    const e1 = 10 / m1;
    expect(res.value.efforts[0]).toBeCloseTo(e1, 9);
    const b = row(res.value.rows, "rivals.0.budget");
    expect(b.method).toBe("numeric");
    expect(b.effort.d[0]).toBeCloseTo(1 / m1, 6);
    // The other's reply to a capped rival is sqrt(v e_1 / m_2) - e_1 (best response, r = 1) with
    // e_1 = B / m_1, so d e_2 / d B = (sqrt(v / (m_2 e_1)) / 2 - 1) / m_1.
    expect(b.effort.d[1]).toBeCloseTo((Math.sqrt(100 / e1) / 2 - 1) / m1, 5);
    // With a cap binding, the closed form no longer applies: every row is numeric.
    expect(res.value.rows.every((r) => r.method === "numeric")).toBe(true);
  });

  it("comparativeStatics(300 rivals, every parameter) is refused; chosen parameters still work", () => {
    const s: Scenario = {
      ...twoRivals(1, 1),
      rivals: Array.from({ length: 300 }, (_, i) => ({ name: `R${i}`, cost: 1 + i / 300 })),
    };
    const all = comparativeStatics(s);
    expect(!all.ok && all.path).toBe("rivals");
    const one = comparativeStatics(s, { params: ["prize"] });
    expect(one.ok && one.value.rows).toHaveLength(1);
  });

  it("comparativeStatics(all-pay, two rivals) matches the derivatives of the expected efforts v2/2 and v2^2/(2 v1)", () => {
    // Hillman & Riley 1989; Baye, Kovenock & de Vries 1996 (Economic Theory 8, volume from
    // memory): unit costs, v1 >= v2, expected efforts v2/2 and v2^2/(2 v1); derived by hand:
    // d/dv2 = (1/2, v2/v1) and d/dv1 = (0, -v2^2/(2 v1^2)).
    const [v1, v2] = [30, 24];
    const s: Scenario = {
      title: "all-pay",
      prize: v1,
      csf: { kind: "allpay" },
      rivals: [
        { name: "Strong", cost: 1 },
        { name: "Weak", cost: 1, value: v2 },
      ],
    };
    const res = comparativeStatics(s);
    if (!res.ok) throw new Error(res.message);
    expect(res.value.kind).toBe("mixed");
    expect(res.value.rows.some((r) => r.param.endsWith(".weight"))).toBe(false);
    const dv2 = row(res.value.rows, "rivals.1.value");
    expect(dv2.effort.d[0]).toBeCloseTo(0.5, 6);
    expect(dv2.effort.d[1]).toBeCloseTo(v2 / v1, 6);
    const dv1 = row(res.value.rows, "rivals.0.value");
    expect(dv1.effort.d[0]).toBeCloseTo(0, 6);
    expect(dv1.effort.d[1]).toBeCloseTo(-(v2 ** 2) / (2 * v1 ** 2), 6);
  });

  it("comparativeStatics(bad param) is a typed error", () => {
    const res = comparativeStatics(twoRivals(1, 2), { params: ["rivals.5.cost"] });
    expect(res.ok).toBe(false);
  });
});

describe("comparativeStatics with the equilibrium given", () => {
  it("gives the same rows as solving it itself (the explorer passes the one it has just solved)", () => {
    for (const scenario of [twoRivals(1, 2), fourRivals]) {
      const equilibrium = solve(normalize(scenario)).equilibrium;
      expect(comparativeStatics(scenario, { equilibrium })).toStrictEqual(
        comparativeStatics(scenario),
      );
    }
  });
});
